package dev.assay.kernel;

/** What a rule made of a step: the checked conclusion, or why it was rejected. A rejection is not an exception. */
public sealed interface Outcome permits Outcome.Accepted, Outcome.Rejected {

    record Accepted(Fact fact) implements Outcome {
    }

    /**
     * A rejected step. {@code stated} and {@code derived} are printed clauses or formulas, null where they do not
     * apply; {@code reason} says why in one sentence, e.g. {@code Link(x, x) and Link(y, next(y)) do not unify: y
     * occurs in next(y)}.
     */
    record Rejected(String rule, String reason, String stated, String derived) implements Outcome {
    }

    default boolean accepted() {
        return this instanceof Accepted;
    }
}
