package dev.assay.syntax;

import java.util.Objects;

/** {@code negate G}: {@code goal} names the problem's goal. */
public record NegateArgs(Name goal) implements RuleArgs {

    public NegateArgs {
        Objects.requireNonNull(goal, "goal");
    }

    @Override
    public String ruleName() {
        return "negate";
    }
}
