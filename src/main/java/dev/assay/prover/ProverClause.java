package dev.assay.prover;

import dev.assay.kernel.Clause;
import dev.assay.kernel.Literal;
import dev.assay.kernel.Printer;

import java.util.Arrays;
import java.util.List;

/**
 * A clause of the search with the inference that made it. Its literals are a set (no two equal, equations
 * unordered) and are written in this order, so an index here is the certificate's literal index less one.
 */
final class ProverClause implements ProofStep {

    private final int sequence;
    final Literal[] literals;
    final Inference inference;
    /** Symbol and variable occurrences: the measure the given-clause loop picks light clauses by. */
    final int weight;

    /** Index of the selected literal, or -1: set when the clause becomes active. */
    int selected = -1;
    /** Literals that may take part in inferences before any unifier is applied: set when the clause becomes active. */
    boolean[] eligible;
    /** Deleted from the active set (subsumed or rewritten); its index entries are skipped. */
    boolean removed;
    /** Taken from the passive set (or discarded there). */
    boolean taken;
    /** Scratch mark for one pass over candidates. */
    int mark;

    ProverClause(int sequence, Literal[] literals, Inference inference) {
        this.sequence = sequence;
        this.literals = literals;
        this.inference = inference;
        long w = 0;
        for (Literal l : literals) w += l.atom().treeSize();
        this.weight = (int) Math.min(w, Integer.MAX_VALUE / 4);
    }

    @Override
    public int sequence() {
        return sequence;
    }

    boolean isEmpty() {
        return literals.length == 0;
    }

    boolean isUnitEquation() {
        return literals.length == 1 && literals[0].positive() && literals[0].isEquation();
    }

    Clause asClause() {
        return new Clause(Arrays.asList(literals));
    }

    /** The premises of the clause's inference that are clauses. */
    List<ProverClause> parents() {
        Inference i = inference;
        if (i instanceof Inference.Resolution r) return List.of(r.left(), r.right());
        if (i instanceof Inference.Factoring f) return List.of(f.parent());
        if (i instanceof Inference.Paramodulation p) return List.of(p.from(), p.into());
        if (i instanceof Inference.EqualityResolution e) return List.of(e.parent());
        if (i instanceof Inference.EqualityFactoring e) return List.of(e.parent());
        if (i instanceof Inference.Reorientation r) return List.of(r.parent());
        return List.of();
    }

    @Override
    public String toString() {
        return Printer.clause(asClause());
    }
}
