package dev.assay.syntax;

import java.util.List;
import java.util.Objects;

/**
 * A term as written: a name applied to arguments, or a bare name when {@code args} is empty.
 * Whether a bare name is a variable or a constant is decided when names are resolved.
 */
public record RawTerm(String name, List<RawTerm> args, Location at) {

    public RawTerm {
        Objects.requireNonNull(name, "name");
        args = List.copyOf(args);
        Objects.requireNonNull(at, "at");
    }

    public boolean isBareName() {
        return args.isEmpty();
    }
}
