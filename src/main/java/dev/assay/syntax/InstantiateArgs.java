package dev.assay.syntax;

import java.util.Objects;

/** {@code instantiate A σ}; the substitution is required. */
public record InstantiateArgs(Name premise, RawSubstitution subst) implements RuleArgs {

    public InstantiateArgs {
        Objects.requireNonNull(premise, "premise");
        Objects.requireNonNull(subst, "subst");
    }

    @Override
    public String ruleName() {
        return "instantiate";
    }
}
