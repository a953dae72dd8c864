package dev.assay.syntax;

import java.util.List;
import java.util.Objects;

/**
 * A clause as written. {@code variables} is the bracket {@code [x, y]}, or null when the clause
 * has none; {@code literals} is empty for {@code false}. Literal {@code i} of a step is
 * {@code literals.get(i - 1)}.
 */
public record RawClause(List<Name> variables, List<RawLiteral> literals, Location at) implements RawConclusion {

    public RawClause {
        variables = variables == null ? null : List.copyOf(variables);
        literals = List.copyOf(literals);
        Objects.requireNonNull(at, "at");
    }

    public boolean hasVariableBracket() {
        return variables != null;
    }

    public boolean isEmptyClause() {
        return literals.isEmpty();
    }
}
