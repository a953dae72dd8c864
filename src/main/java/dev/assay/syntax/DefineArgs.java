package dev.assay.syntax;

import java.util.Objects;

/** {@code define fresh Q}. */
public record DefineArgs(Name fresh) implements RuleArgs {

    public DefineArgs {
        Objects.requireNonNull(fresh, "fresh");
    }

    @Override
    public String ruleName() {
        return "define";
    }
}
