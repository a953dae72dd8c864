package dev.assay.gate;

import dev.assay.check.Failure;

/** One checked pair of a gate run: its name (the path of the certificate below the gate's folder, less .proof). */
public record GateCase(String name, String problem, String certificate, String verdict, int exitStatus, int steps,
                       long elapsedMillis, Failure failure) {

    /** Verified: a theorem, or refuted axioms of a problem without goal. */
    public boolean verified() {
        return verdict.equals("theorem") || verdict.equals("unsatisfiable");
    }
}
