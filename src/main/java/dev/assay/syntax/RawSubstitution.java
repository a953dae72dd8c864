package dev.assay.syntax;

import java.util.List;
import java.util.Objects;

/** {@code {x := t, y := g(z)}} as written, in order; {@code {}} has no bindings. */
public record RawSubstitution(List<RawBinding> bindings, Location at) {

    public RawSubstitution {
        bindings = List.copyOf(bindings);
        Objects.requireNonNull(at, "at");
    }
}
