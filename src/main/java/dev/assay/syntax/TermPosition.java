package dev.assay.syntax;

import java.util.List;
import java.util.Objects;

/** {@code 1.2.3}: argument indices from a literal's atom down to a subterm, each counting from 1. */
public record TermPosition(List<Integer> path, Location at) {

    public TermPosition {
        path = List.copyOf(path);
        if (path.isEmpty()) {
            throw new IllegalArgumentException("a term position has at least one index");
        }
        for (int index : path) {
            if (index < 1) {
                throw new IllegalArgumentException("term positions count from 1: " + path);
            }
        }
        Objects.requireNonNull(at, "at");
    }

    @Override
    public String toString() {
        StringBuilder text = new StringBuilder();
        for (int index : path) {
            if (text.length() > 0) {
                text.append('.');
            }
            text.append(index);
        }
        return text.toString();
    }
}
