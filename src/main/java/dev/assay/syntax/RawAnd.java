package dev.assay.syntax;

import java.util.List;
import java.util.Objects;

/** A conjunction of two or more operands. */
public record RawAnd(List<RawFormula> operands, Location at) implements RawFormula {

    public RawAnd {
        operands = List.copyOf(operands);
        if (operands.size() < 2) {
            throw new IllegalArgumentException("a conjunction has at least two operands");
        }
        Objects.requireNonNull(at, "at");
    }
}
