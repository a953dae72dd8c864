package dev.assay.syntax;

import java.util.Objects;

/** {@code left = right}, or {@code left != right} when {@code negated}. */
public record RawEquation(RawTerm left, RawTerm right, boolean negated, Location at) implements RawAtomic {

    public RawEquation {
        Objects.requireNonNull(left, "left");
        Objects.requireNonNull(right, "right");
        Objects.requireNonNull(at, "at");
    }
}
