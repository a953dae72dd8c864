package dev.assay.prover;

/**
 * How a clause was obtained, in the terms of the certificate rule that restates it. Literal indices count from 0
 * over the premise's literals as the prover stores (and writes) them; positions are paths of argument indices from
 * the atom, counting from 1, as the certificate language writes them.
 */
sealed interface Inference {

    /** {@code clausify premise}: the premise is a formula step, or the axiom {@code axiom} when that is null. */
    record Clausified(FormulaStep premise, String axiom) implements Inference {
    }

    /** {@code resolve left.i, right.j}. */
    record Resolution(ProverClause left, int leftIndex, ProverClause right, int rightIndex) implements Inference {
    }

    /** {@code factor parent.i, parent.j}. */
    record Factoring(ProverClause parent, int first, int second) implements Inference {
    }

    /** {@code paramodulate from.i -> into.j @ p}, or {@code <-} when the right side of the equation is rewritten. */
    record Paramodulation(ProverClause from, int equation, boolean leftToRight, ProverClause into, int target,
                          int[] position) implements Inference {
    }

    /** {@code eqres parent.i}. */
    record EqualityResolution(ProverClause parent, int index) implements Inference {
    }

    /** {@code eqfactor parent.i, parent.j}: the left sides of both equations as written are unified. */
    record EqualityFactoring(ProverClause parent, int first, int second) implements Inference {
    }

    /** {@code instantiate parent {}}: the same clause with some equations written the other way round. */
    record Reorientation(ProverClause parent) implements Inference {
    }
}
