package dev.assay.syntax;

import java.util.Objects;

/** An atom, or {@code not} and an atom when {@code negated}. */
public record RawLiteral(boolean negated, RawAtomic atom, Location at) {

    public RawLiteral {
        Objects.requireNonNull(atom, "atom");
        Objects.requireNonNull(at, "at");
    }
}
