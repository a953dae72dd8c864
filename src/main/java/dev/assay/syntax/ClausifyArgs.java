package dev.assay.syntax;

import java.util.Objects;

/** {@code clausify P [θ]}; {@code theta} is null when not written. */
public record ClausifyArgs(Name premise, RawSubstitution theta) implements RuleArgs {

    public ClausifyArgs {
        Objects.requireNonNull(premise, "premise");
    }

    @Override
    public String ruleName() {
        return "clausify";
    }
}
