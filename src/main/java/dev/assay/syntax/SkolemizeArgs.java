package dev.assay.syntax;

import java.util.List;
import java.util.Objects;

/** {@code skolemize P fresh s1, s2}; {@code fresh} is empty when the step writes no {@code fresh}. */
public record SkolemizeArgs(Name premise, List<Name> fresh) implements RuleArgs {

    public SkolemizeArgs {
        Objects.requireNonNull(premise, "premise");
        fresh = List.copyOf(fresh);
    }

    @Override
    public String ruleName() {
        return "skolemize";
    }
}
