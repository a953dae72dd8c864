package dev.assay.syntax;

import java.util.Objects;

/** {@code certificate for PROBLEM}. */
public record CertificateHeader(Name problem, Location at) implements CertificateStatement {

    public CertificateHeader {
        Objects.requireNonNull(problem, "problem");
        Objects.requireNonNull(at, "at");
    }
}
