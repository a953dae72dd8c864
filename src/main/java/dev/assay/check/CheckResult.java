package dev.assay.check;

import java.util.List;
import java.util.Map;

/**
 * Everything a check established, for the text, JSON and later reports. Lists are in a fixed order (problem order
 * for axioms, certificate order for steps and symbols) so that reports are byte-identical from run to run.
 */
public record CheckResult(
        Verdict verdict,
        String problemFile,
        String problemSha256,
        String certificateFile,
        String certificateSha256,
        String problemName,
        String digest,
        int steps,
        Map<String, Integer> stepsByRule,
        String refutation,
        int refutationSteps,
        List<String> axiomsUsed,
        List<String> axiomsUnused,
        boolean goalUsed,
        List<IntroducedSymbol> introducedSymbols,
        Failure failure,
        long elapsedMillis) {

    public int exitStatus() {
        return verdict.exitStatus();
    }
}
