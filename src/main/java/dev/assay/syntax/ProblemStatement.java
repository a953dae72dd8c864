package dev.assay.syntax;

/** One statement of a problem file, in the order of the file. */
public sealed interface ProblemStatement permits ProblemHeader, Declaration, Axiom, Goal {

    /** Where the statement's keyword is. */
    Location at();
}
