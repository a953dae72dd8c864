package dev.assay.syntax;

import java.util.Objects;

/**
 * {@code digest "sha256:..."}. {@code sha256} is the 64 hexadecimal digits, in lower case
 * whatever case they were written in, so it compares directly with a computed digest.
 */
public record Digest(String sha256, Location at) implements CertificateStatement {

    public Digest {
        Objects.requireNonNull(sha256, "sha256");
        if (!sha256.matches("[0-9a-f]{64}")) {
            throw new IllegalArgumentException("not 64 lower-case hexadecimal digits: " + sha256);
        }
        Objects.requireNonNull(at, "at");
    }
}
