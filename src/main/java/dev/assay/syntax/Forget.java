package dev.assay.syntax;

import java.util.List;
import java.util.Objects;

/** {@code forget a, b}: a promise that these steps are not used again. */
public record Forget(List<Name> labels, Location at) implements CertificateStatement {

    public Forget {
        labels = List.copyOf(labels);
        if (labels.isEmpty()) {
            throw new IllegalArgumentException("forget names at least one label");
        }
        Objects.requireNonNull(at, "at");
    }
}
