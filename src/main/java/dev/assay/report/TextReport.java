package dev.assay.report;

import dev.assay.check.CheckResult;
import dev.assay.check.IntroducedSymbol;
import dev.assay.check.Verdict;

import java.util.Map;

/** The readable summary of a check, as printed on a terminal. */
public final class TextReport {

    private TextReport() {
    }

    public static String render(CheckResult r) {
        StringBuilder sb = new StringBuilder();
        sb.append("verdict: ").append(r.verdict().word());
        switch (r.verdict()) {
            case THEOREM -> sb.append(" (the goal follows from the axioms)");
            case UNSATISFIABLE -> sb.append(" (the axioms are contradictory; the problem has no goal)");
            case VACUOUS -> sb.append(" (the refutation does not use the negated goal: the axioms alone are contradictory)");
            case REJECTED -> sb.append(" (the certificate does not establish the claim)");
            case INPUT_ERROR -> sb.append(" (an input could not be read, parsed or resolved)");
            case TIMEOUT -> sb.append(" (the check did not finish within its time limit)");
        }
        sb.append('\n');
        if (r.failure() != null) {
            sb.append(indent(r.failure().render())).append('\n');
        }
        if (r.problemSha256() != null) {
            sb.append("problem:     ").append(r.problemFile());
            if (r.problemName() != null) sb.append(" (").append(r.problemName()).append(')');
            sb.append("\n  sha256 ").append(r.problemSha256()).append('\n');
        }
        if (r.certificateSha256() != null) {
            sb.append("certificate: ").append(r.certificateFile()).append("\n  sha256 ").append(r.certificateSha256())
                    .append('\n');
        }
        if (r.digest() != null) sb.append("digest:      ").append(r.digest()).append('\n');
        if (r.verdict() != Verdict.INPUT_ERROR || r.steps() > 0) {
            sb.append("steps:       ").append(r.steps()).append(r.failure() == null ? " checked" : " accepted before the failure");
            if (!r.stepsByRule().isEmpty()) {
                sb.append(" (");
                boolean first = true;
                for (Map.Entry<String, Integer> e : r.stepsByRule().entrySet()) {
                    if (!first) sb.append(", ");
                    first = false;
                    sb.append(e.getKey()).append(' ').append(e.getValue());
                }
                sb.append(')');
            }
            sb.append('\n');
        }
        if (r.refutation() != null) {
            sb.append("refutation:  step ").append(r.refutation()).append(" derives false, resting on ")
                    .append(r.refutationSteps()).append(" step").append(r.refutationSteps() == 1 ? "" : "s").append('\n');
            sb.append("rests on:    ").append(r.axiomsUsed().isEmpty() ? "no axiom" : String.join(", ", r.axiomsUsed()));
            sb.append(r.goalUsed() ? " and the negated goal" : "").append('\n');
            if (!r.axiomsUnused().isEmpty()) {
                sb.append("not used:    ").append(String.join(", ", r.axiomsUnused())).append('\n');
            }
        }
        if (!r.introducedSymbols().isEmpty()) {
            sb.append("introduced:  ");
            boolean first = true;
            for (IntroducedSymbol s : r.introducedSymbols()) {
                if (!first) sb.append("\n             ");
                first = false;
                sb.append(s.name()).append('/').append(s.arity()).append(' ').append(s.kind()).append(" by step ")
                        .append(s.step()).append(" (").append(s.rule()).append(')');
            }
            sb.append('\n');
        }
        sb.append("time:        ").append(r.elapsedMillis()).append(" ms\n");
        return sb.toString();
    }

    /** One line: verdict, certificate, and where and why it failed. */
    public static String brief(CheckResult r) {
        StringBuilder sb = new StringBuilder(String.format("%-13s %s", r.verdict().word(), r.certificateFile()));
        if (r.failure() != null) {
            sb.append("\n              ").append(r.failure().location()).append(": ");
            if (r.failure().step() != null) sb.append("step ").append(r.failure().step()).append(": ");
            sb.append(r.failure().reason());
        }
        return sb.append('\n').toString();
    }

    private static String indent(String s) {
        return "  " + s.replace("\n", "\n  ");
    }
}
