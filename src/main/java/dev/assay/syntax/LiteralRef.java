package dev.assay.syntax;

import java.util.Objects;

/** {@code A.i}: literal {@code index} (counting from 1) of the clause step labelled {@code label}. */
public record LiteralRef(Name label, int index, Location at) {

    public LiteralRef {
        Objects.requireNonNull(label, "label");
        if (index < 1) {
            throw new IllegalArgumentException("literal indices count from 1: " + index);
        }
        Objects.requireNonNull(at, "at");
    }

    @Override
    public String toString() {
        return label.text() + "." + index;
    }
}
