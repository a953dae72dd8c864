package dev.assay.syntax;

import java.util.Objects;

/** A place in an input file; line and column count from 1, a column in Unicode code points. */
public record Location(String file, int line, int column) {

    public Location {
        Objects.requireNonNull(file, "file");
        if (line < 1 || column < 1) {
            throw new IllegalArgumentException("line and column count from 1: " + line + ":" + column);
        }
    }

    @Override
    public String toString() {
        return file + ":" + line + ":" + column;
    }
}
