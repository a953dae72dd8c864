package dev.assay.syntax;

import java.util.Objects;

/** {@code goal NAME: FORMULA}. */
public record Goal(Name name, RawFormula formula, Location at) implements ProblemStatement {

    public Goal {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(formula, "formula");
        Objects.requireNonNull(at, "at");
    }
}
