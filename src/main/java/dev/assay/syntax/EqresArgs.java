package dev.assay.syntax;

import java.util.Objects;

/** {@code eqres A.i [σ]}; {@code subst} is null when not written. */
public record EqresArgs(LiteralRef literal, RawSubstitution subst) implements RuleArgs {

    public EqresArgs {
        Objects.requireNonNull(literal, "literal");
    }

    @Override
    public String ruleName() {
        return "eqres";
    }
}
