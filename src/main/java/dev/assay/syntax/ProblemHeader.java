package dev.assay.syntax;

import java.util.Objects;

/** {@code problem NAME}. */
public record ProblemHeader(Name name, Location at) implements ProblemStatement {

    public ProblemHeader {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(at, "at");
    }
}
