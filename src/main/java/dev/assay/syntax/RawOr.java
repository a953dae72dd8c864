package dev.assay.syntax;

import java.util.List;
import java.util.Objects;

/** A disjunction of two or more operands. */
public record RawOr(List<RawFormula> operands, Location at) implements RawFormula {

    public RawOr {
        operands = List.copyOf(operands);
        if (operands.size() < 2) {
            throw new IllegalArgumentException("a disjunction has at least two operands");
        }
        Objects.requireNonNull(at, "at");
    }
}
