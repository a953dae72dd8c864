package dev.assay.bench;

import java.io.IOException;

/**
 * A family of generated certificates of any number of steps. The problem file is small and is written first, so the
 * certificate can carry its digest; the certificate is streamed. Every member is a valid refutation whose verdict is
 * theorem.
 */
public interface Family {

    /** How many rounds of the given costs fit in {@code steps} after {@code fixed} steps; the rest is padding. */
    static long rounds(long steps, long fixed, java.util.function.LongToIntFunction cost) {
        long used = fixed;
        long r = 0;
        while (used + cost.applyAsInt(r) <= steps) used += cost.applyAsInt(r++);
        return r;
    }

    String name();

    /** One line for {@code assay bench generate --help} and the performance notes. */
    String description();

    /** The fewest steps a member can have. */
    long minSteps();

    /** The problem file of the member with {@code steps} steps. */
    String problem(long steps);

    /** Writes the certificate of the member with {@code steps} steps; {@code sha256} is the problem's digest. */
    void proof(long steps, String sha256, ProofWriter out) throws IOException;
}
