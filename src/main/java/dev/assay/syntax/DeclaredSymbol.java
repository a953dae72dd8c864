package dev.assay.syntax;

import java.util.Objects;

/** {@code NAME/ARITY} in a declaration; the arity may be 0. */
public record DeclaredSymbol(Name name, int arity) {

    public DeclaredSymbol {
        Objects.requireNonNull(name, "name");
        if (arity < 0) {
            throw new IllegalArgumentException("negative arity: " + arity);
        }
    }

    public Location at() {
        return name.at();
    }
}
