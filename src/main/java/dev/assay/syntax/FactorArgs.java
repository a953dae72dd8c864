package dev.assay.syntax;

import java.util.Objects;

/** {@code factor A.i, A.j [σ]}; {@code subst} is null when not written. */
public record FactorArgs(LiteralRef first, LiteralRef second, RawSubstitution subst) implements RuleArgs {

    public FactorArgs {
        Objects.requireNonNull(first, "first");
        Objects.requireNonNull(second, "second");
    }

    @Override
    public String ruleName() {
        return "factor";
    }
}
