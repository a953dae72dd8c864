package dev.assay.syntax;

import java.util.Objects;

/**
 * {@code resolve A.i [σA], B.j [σB]}. Each substitution is null when not written; FORMAT.md §6:
 * when only one is written the other is empty, when neither is the kernel computes a unifier.
 */
public record ResolveArgs(LiteralRef left, RawSubstitution leftSubst, LiteralRef right, RawSubstitution rightSubst)
        implements RuleArgs {

    public ResolveArgs {
        Objects.requireNonNull(left, "left");
        Objects.requireNonNull(right, "right");
    }

    @Override
    public String ruleName() {
        return "resolve";
    }
}
