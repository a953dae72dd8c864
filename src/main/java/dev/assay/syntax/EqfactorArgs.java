package dev.assay.syntax;

import java.util.Objects;

/** {@code eqfactor A.i, A.j [σ]}; {@code subst} is null when not written. */
public record EqfactorArgs(LiteralRef first, LiteralRef second, RawSubstitution subst) implements RuleArgs {

    public EqfactorArgs {
        Objects.requireNonNull(first, "first");
        Objects.requireNonNull(second, "second");
    }

    @Override
    public String ruleName() {
        return "eqfactor";
    }
}
