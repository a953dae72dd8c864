package dev.assay.syntax;

import java.util.Objects;

/**
 * A step that parses but cannot be turned into kernel values: an unknown symbol, an unlisted or unused clause
 * variable, an identifier used both as a variable and as a function. The certificate is rejected at its location.
 */
public final class StepProblem extends Exception {

    private final Location at;
    private final String reason;

    public StepProblem(Location at, String reason) {
        super(at + ": " + reason);
        this.at = Objects.requireNonNull(at);
        this.reason = Objects.requireNonNull(reason);
    }

    public Location at() {
        return at;
    }

    public String reason() {
        return reason;
    }
}
