package dev.assay.syntax;

import java.util.Objects;

/** {@code true} or {@code false}. */
public record RawConstant(boolean value, Location at) implements RawFormula {

    public RawConstant {
        Objects.requireNonNull(at, "at");
    }
}
