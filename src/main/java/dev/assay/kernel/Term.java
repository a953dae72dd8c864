package dev.assay.kernel;

/**
 * A first-order term, hash-consed by {@link TermFactory}: structurally equal terms made by one factory are the
 * same object, so {@code ==} is structural equality and {@link #hashCode()} is stable and cheap.
 * Atoms are terms too: applications of a predicate symbol (or of {@link Symbol#EQUALITY}).
 */
public sealed interface Term permits Variable, Application {

    /** Number of symbol and variable occurrences when the term is written out as a tree, saturated at Long.MAX_VALUE. */
    long treeSize();

    /** Height of the term: 1 for a variable or constant. */
    int depth();

    boolean isGround();
}
