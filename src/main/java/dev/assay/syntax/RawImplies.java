package dev.assay.syntax;

import java.util.Objects;

/** {@code left implies right}; a chain {@code a implies b implies c} nests to the right. */
public record RawImplies(RawFormula left, RawFormula right, Location at) implements RawFormula {

    public RawImplies {
        Objects.requireNonNull(left, "left");
        Objects.requireNonNull(right, "right");
        Objects.requireNonNull(at, "at");
    }
}
