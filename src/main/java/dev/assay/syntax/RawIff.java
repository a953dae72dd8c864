package dev.assay.syntax;

import java.util.Objects;

public record RawIff(RawFormula left, RawFormula right, Location at) implements RawFormula {

    public RawIff {
        Objects.requireNonNull(left, "left");
        Objects.requireNonNull(right, "right");
        Objects.requireNonNull(at, "at");
    }
}
