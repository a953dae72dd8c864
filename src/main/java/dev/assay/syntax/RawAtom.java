package dev.assay.syntax;

import java.util.Objects;

public record RawAtom(RawAtomic atom, Location at) implements RawFormula {

    public RawAtom {
        Objects.requireNonNull(atom, "atom");
        Objects.requireNonNull(at, "at");
    }
}
