package dev.assay.syntax;

import java.util.Objects;

/** {@code variable := term}. */
public record RawBinding(Name variable, RawTerm term) {

    public RawBinding {
        Objects.requireNonNull(variable, "variable");
        Objects.requireNonNull(term, "term");
    }
}
