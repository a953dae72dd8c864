package dev.assay.check;

/** The outcomes of a check and their exit statuses (FORMAT.md section 7). */
public enum Verdict {
    THEOREM(0, "theorem"),
    UNSATISFIABLE(0, "unsatisfiable"),
    VACUOUS(3, "vacuous"),
    REJECTED(1, "rejected"),
    INPUT_ERROR(2, "input error"),
    /** Not a verdict on the certificate: the check was stopped at its time limit before it finished. */
    TIMEOUT(4, "timeout");

    private final int exitStatus;
    private final String word;

    Verdict(int exitStatus, String word) {
        this.exitStatus = exitStatus;
        this.word = word;
    }

    public int exitStatus() {
        return exitStatus;
    }

    /** The verdict as reports spell it. */
    public String word() {
        return word;
    }
}
