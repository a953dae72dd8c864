package dev.assay.check;

/**
 * The first failure of a check, located: {@code file:line:column}, the step and rule where known, what the
 * certificate stated, what the kernel derived, and why they do not agree. Fields that do not apply are null.
 */
public record Failure(String file, int line, int column, String step, String rule, String reason,
                      String stated, String derived, String otherLocation) {

    /** {@code file:line:column}. */
    public String location() {
        return file + ":" + line + ":" + column;
    }

    /** The failure as one or more lines for a terminal. */
    public String render() {
        StringBuilder sb = new StringBuilder(location()).append(": ");
        if (step != null) sb.append("step ").append(step);
        if (rule != null) sb.append(step != null ? " (" : "(").append(rule).append(")");
        if (step != null || rule != null) sb.append(": ");
        sb.append(reason);
        if (otherLocation != null) sb.append("\n  see also ").append(otherLocation);
        if (stated != null) sb.append("\n  stated:  ").append(stated);
        if (derived != null) sb.append("\n  derived: ").append(derived);
        return sb.toString();
    }
}
