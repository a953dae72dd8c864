package dev.assay.syntax;

import java.util.Objects;

public record RawNot(RawFormula body, Location at) implements RawFormula {

    public RawNot {
        Objects.requireNonNull(body, "body");
        Objects.requireNonNull(at, "at");
    }
}
