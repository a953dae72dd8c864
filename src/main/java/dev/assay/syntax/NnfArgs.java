package dev.assay.syntax;

import java.util.Objects;

/** {@code nnf P}. */
public record NnfArgs(Name premise) implements RuleArgs {

    public NnfArgs {
        Objects.requireNonNull(premise, "premise");
    }

    @Override
    public String ruleName() {
        return "nnf";
    }
}
