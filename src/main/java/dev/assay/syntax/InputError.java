package dev.assay.syntax;

import java.util.Objects;

/**
 * An input that cannot be read: a syntax error, a malformed digest, an out-of-range number, a
 * statement out of order. It is a checked exception because every reader of input must decide
 * what to do with one; it is not a bug.
 *
 * <p>{@link #getMessage()} is the line a user sees, {@code depot.proof:12:7: expected ')', found
 * 'or'}, with {@code (first declared at FILE:LINE:COLUMN)} appended when a second place is known.
 */
public final class InputError extends Exception {

    private final Location at;
    private final String reason;
    private final Location firstDeclared;

    public InputError(Location at, String reason) {
        this(at, reason, null);
    }

    /** {@code firstDeclared} is the earlier place that the error conflicts with, or null. */
    public InputError(Location at, String reason, Location firstDeclared) {
        super(format(at, reason, firstDeclared));
        this.at = Objects.requireNonNull(at, "at");
        this.reason = Objects.requireNonNull(reason, "reason");
        this.firstDeclared = firstDeclared;
    }

    public Location at() {
        return at;
    }

    /** The message without its location. */
    public String reason() {
        return reason;
    }

    /** The earlier place this error conflicts with, or null. */
    public Location firstDeclared() {
        return firstDeclared;
    }

    private static String format(Location at, String reason, Location firstDeclared) {
        String message = at + ": " + reason;
        return firstDeclared == null ? message : message + " (first declared at " + firstDeclared + ")";
    }
}
