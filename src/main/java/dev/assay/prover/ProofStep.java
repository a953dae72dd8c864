package dev.assay.prover;

/**
 * A step the prover may write into its certificate: a formula step of the clausifier or a clause. {@link #sequence()}
 * numbers steps in the order they were made; premises are always made first, so that order is a dependency order.
 */
sealed interface ProofStep permits FormulaStep, ProverClause {

    int sequence();

    /** Numbers steps in order of creation, for one proof attempt. */
    final class Counter {
        private int next;

        int next() {
            return ++next;
        }
    }
}
