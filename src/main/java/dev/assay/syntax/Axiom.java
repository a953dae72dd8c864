package dev.assay.syntax;

import java.util.Objects;

/** {@code axiom NAME: FORMULA}. */
public record Axiom(Name name, RawFormula formula, Location at) implements ProblemStatement {

    public Axiom {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(formula, "formula");
        Objects.requireNonNull(at, "at");
    }
}
