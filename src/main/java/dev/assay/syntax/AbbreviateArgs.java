package dev.assay.syntax;

import java.util.Objects;

/** {@code abbreviate P using D}. */
public record AbbreviateArgs(Name premise, Name definition) implements RuleArgs {

    public AbbreviateArgs {
        Objects.requireNonNull(premise, "premise");
        Objects.requireNonNull(definition, "definition");
    }

    @Override
    public String ruleName() {
        return "abbreviate";
    }
}
