package dev.assay.syntax;

import java.util.List;
import java.util.Objects;

/** {@code forall x y. body} when {@code universal}, else {@code exists x y. body}. */
public record RawQuantified(boolean universal, List<Name> variables, RawFormula body, Location at)
        implements RawFormula {

    public RawQuantified {
        variables = List.copyOf(variables);
        if (variables.isEmpty()) {
            throw new IllegalArgumentException("a quantifier binds at least one variable");
        }
        Objects.requireNonNull(body, "body");
        Objects.requireNonNull(at, "at");
    }
}
