package dev.assay.gate;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** What changed between a baseline gate report and this run. */
public final class Baseline {

    public enum Change { NEWLY_REJECTED, NEWLY_VERIFIED, MISSING, NEW_CASE, VERDICT_CHANGED, STEPS_CHANGED }

    public record Difference(String name, Change change, String before, String now) {
        /** A regression fails the gate: a case that got worse or went away. */
        public boolean regression() {
            return change == Change.NEWLY_REJECTED || change == Change.MISSING || change == Change.VERDICT_CHANGED;
        }

        public String describe() {
            return switch (change) {
                case NEWLY_REJECTED -> name + ": newly " + now + " (was " + before + ")";
                case NEWLY_VERIFIED -> name + ": newly verified as " + now + " (was " + before + ")";
                case MISSING -> name + ": missing (was " + before + ")";
                case NEW_CASE -> name + ": new case, " + now;
                case VERDICT_CHANGED -> name + ": verdict changed from " + before + " to " + now;
                case STEPS_CHANGED -> name + ": steps changed from " + before + " to " + now;
            };
        }
    }

    private Baseline() {
    }

    public static List<Difference> compare(List<GateCase> baseline, List<GateCase> now) {
        Map<String, GateCase> before = new LinkedHashMap<>();
        for (GateCase c : baseline) before.put(c.name(), c);
        Map<String, GateCase> after = new LinkedHashMap<>();
        for (GateCase c : now) after.put(c.name(), c);
        List<Difference> out = new ArrayList<>();
        for (GateCase b : baseline) {
            GateCase a = after.get(b.name());
            if (a == null) {
                out.add(new Difference(b.name(), Change.MISSING, b.verdict(), null));
            } else if (b.verified() && !a.verified()) {
                out.add(new Difference(b.name(), Change.NEWLY_REJECTED, b.verdict(), a.verdict()));
            } else if (!b.verified() && a.verified()) {
                out.add(new Difference(b.name(), Change.NEWLY_VERIFIED, b.verdict(), a.verdict()));
            } else if (!b.verdict().equals(a.verdict())) {
                out.add(new Difference(b.name(), Change.VERDICT_CHANGED, b.verdict(), a.verdict()));
            } else if (b.steps() != a.steps()) {
                out.add(new Difference(b.name(), Change.STEPS_CHANGED, Integer.toString(b.steps()), Integer.toString(a.steps())));
            }
        }
        for (GateCase a : now) {
            if (!before.containsKey(a.name())) out.add(new Difference(a.name(), Change.NEW_CASE, null, a.verdict()));
        }
        return out;
    }
}
