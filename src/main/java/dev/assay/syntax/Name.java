package dev.assay.syntax;

import java.util.Objects;

/** An identifier as written, with its place: a symbol, a variable, a label or a problem name. */
public record Name(String text, Location at) {

    public Name {
        Objects.requireNonNull(text, "text");
        Objects.requireNonNull(at, "at");
    }

    @Override
    public String toString() {
        return text;
    }
}
