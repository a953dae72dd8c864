package dev.assay.prover;

import dev.assay.kernel.Printer;
import dev.assay.kernel.Symbol;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Writes the refutation that ends in an empty clause as a certificate: only the steps in its cone (walking back from
 * the empty clause), in the order they were made, which is a dependency order, with fresh labels.
 */
final class CertificateWriter {

    /** The text, the number of steps, and whether the refutation rests on the negated goal. */
    record Certificate(String text, int steps, boolean restsOnGoal) {
    }

    private CertificateWriter() {
    }

    static Certificate write(String problemName, String sha256, boolean hasGoal, ProverClause empty, Names names) {
        List<ProofStep> cone = cone(empty);
        boolean restsOnGoal = false;
        for (ProofStep s : cone) {
            if (s instanceof FormulaStep f && f.rule == FormulaStep.Rule.NEGATE) restsOnGoal = true;
        }
        String verdict = !hasGoal ? "unsatisfiable (exit 0)" : restsOnGoal ? "theorem (exit 0)" : "vacuous (exit 3)";
        String formulaPrefix = names.labelPrefix("f");
        String clausePrefix = names.labelPrefix("c");
        Map<ProofStep, String> labels = new HashMap<>();
        int formulas = 0;
        int clauses = 0;
        for (ProofStep s : cone) {
            labels.put(s, s instanceof FormulaStep ? formulaPrefix + ++formulas : clausePrefix + ++clauses);
        }
        StringBuilder out = new StringBuilder();
        out.append("certificate for ").append(problemName).append('\n');
        out.append("# expected verdict: ").append(verdict).append('\n');
        out.append("digest \"sha256:").append(sha256).append("\"\n");
        out.append("#\n# Found by assay prove, the untrusted reference prover, and checked by the kernel before it was\n")
                .append("# written. ").append(formulas).append(" formula steps, ").append(clauses).append(" clause steps.\n");
        for (ProofStep s : cone) {
            out.append("step ").append(labels.get(s)).append(": ");
            if (s instanceof FormulaStep f) {
                out.append("formula ").append(Printer.formula(f.formula, Printer.UNLIMITED)).append(" by ")
                        .append(formulaArguments(f, labels));
            } else {
                ProverClause c = (ProverClause) s;
                out.append("clause ").append(Printer.clause(c.asClause(), Printer.UNLIMITED)).append(" by ")
                        .append(clauseArguments(c, labels));
            }
            out.append('\n');
        }
        return new Certificate(out.toString(), cone.size(), restsOnGoal);
    }

    private static List<ProofStep> cone(ProverClause empty) {
        Set<ProofStep> seen = new LinkedHashSet<>();
        ArrayDeque<ProofStep> todo = new ArrayDeque<>();
        todo.push(empty);
        while (!todo.isEmpty()) {
            ProofStep s = todo.pop();
            if (!seen.add(s)) continue;
            if (s instanceof ProverClause c) {
                for (ProverClause p : c.parents()) todo.push(p);
                if (c.inference instanceof Inference.Clausified k && k.premise() != null) todo.push(k.premise());
            } else {
                FormulaStep f = (FormulaStep) s;
                if (f.premise != null) todo.push(f.premise);
                if (f.definition != null) todo.push(f.definition);
            }
        }
        List<ProofStep> out = new ArrayList<>(seen);
        out.sort(Comparator.comparingInt(ProofStep::sequence));
        return out;
    }

    private static String premise(FormulaStep premise, String axiom, Map<ProofStep, String> labels) {
        return premise != null ? labels.get(premise) : axiom;
    }

    private static String formulaArguments(FormulaStep f, Map<ProofStep, String> labels) {
        String p = premise(f.premise, f.problemName, labels);
        switch (f.rule) {
            case NEGATE:
                return "negate " + f.problemName;
            case NNF:
                return "nnf " + p;
            case SKOLEMIZE: {
                StringBuilder sb = new StringBuilder("skolemize ").append(p);
                if (!f.fresh.isEmpty()) {
                    sb.append(" fresh ");
                    List<String> ns = new ArrayList<>();
                    for (Symbol s : f.fresh) ns.add(s.name());
                    sb.append(String.join(", ", ns));
                }
                return sb.toString();
            }
            case DEFINE:
                return "define fresh " + f.fresh.get(0).name();
            case ABBREVIATE:
                return "abbreviate " + p + " using " + labels.get(f.definition);
            default:
                throw new IllegalStateException(f.rule.toString());
        }
    }

    private static String ref(ProverClause c, int index, Map<ProofStep, String> labels) {
        return labels.get(c) + "." + (index + 1);
    }

    private static String clauseArguments(ProverClause c, Map<ProofStep, String> labels) {
        Inference i = c.inference;
        if (i instanceof Inference.Clausified k) return "clausify " + premise(k.premise(), k.axiom(), labels);
        if (i instanceof Inference.Resolution r) {
            return "resolve " + ref(r.left(), r.leftIndex(), labels) + ", " + ref(r.right(), r.rightIndex(), labels);
        }
        if (i instanceof Inference.Factoring f) {
            return "factor " + ref(f.parent(), f.first(), labels) + ", " + ref(f.parent(), f.second(), labels);
        }
        if (i instanceof Inference.Paramodulation p) {
            StringBuilder path = new StringBuilder();
            for (int k = 0; k < p.position().length; k++) {
                if (k > 0) path.append('.');
                path.append(p.position()[k]);
            }
            return "paramodulate " + ref(p.from(), p.equation(), labels) + (p.leftToRight() ? " -> " : " <- ")
                    + ref(p.into(), p.target(), labels) + " @ " + path;
        }
        if (i instanceof Inference.EqualityResolution e) return "eqres " + ref(e.parent(), e.index(), labels);
        if (i instanceof Inference.EqualityFactoring e) {
            return "eqfactor " + ref(e.parent(), e.first(), labels) + ", " + ref(e.parent(), e.second(), labels);
        }
        if (i instanceof Inference.Reorientation r) return "instantiate " + labels.get(r.parent()) + " {}";
        throw new IllegalStateException(i.toString());
    }
}
