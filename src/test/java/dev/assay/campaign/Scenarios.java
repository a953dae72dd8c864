package dev.assay.campaign;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;

/**
 * Small problems of a calibration lab (technicians, instruments, benches, shifts) for the reference prover to write
 * certificates for: some written by hand to reach particular rules (Skolem functions, definitions by iff, equality,
 * a problem without goal), the rest generated from a seed as chains of rules from a fact to a goal, with some noise.
 */
final class Scenarios {

    private Scenarios() {
    }

    /** Problem name to problem text, in a fixed order. */
    static Map<String, String> handWritten() {
        Map<String, String> out = new LinkedHashMap<>();
        out.put("lab_badge", """
                problem lab_badge
                axiom issued: forall t. Technician(t) implies exists b. Badge(b) and Holds(t, b)
                axiom ines:   Technician(ines)
                goal has_badge: exists b. Holds(ines, b)
                """);
        out.put("calibration_chain", """
                problem calibration_chain
                axiom cal:    Calibrated(scale)
                axiom usable: forall i. Calibrated(i) implies Usable(i)
                axiom inuse:  forall i. Usable(i) and Booked(i) implies InUse(i)
                axiom booked: Booked(scale)
                goal scale_in_use: InUse(scale)
                """);
        out.put("night_cover", """
                problem night_cover
                axiom sup:    supervisor(night) = omar
                axiom covers: forall s. Covers(supervisor(s), s)
                goal omar_covers: Covers(omar, night)
                """);
        out.put("partner_swap", """
                problem partner_swap
                axiom involution: forall x. partner(partner(x)) = x
                axiom ines:       partner(ines) = omar
                goal back: partner(omar) = ines
                """);
        out.put("relief_rota", """
                problem relief_rota
                axiom relief: forall t. OnShift(t) implies exists r. Relieves(r, t)
                axiom ines:   OnShift(ines)
                goal relieved: exists r. Relieves(r, ines)
                """);
        out.put("fume_hood", """
                problem fume_hood
                axiom hoods:  forall r. Hood(r) implies Vented(r) or Closed(r)
                axiom lab3:   Hood(lab3)
                axiom open3:  not Closed(lab3)
                goal vented: Vented(lab3)
                """);
        out.put("sample_log", """
                problem sample_log
                axiom signing: forall s. Logged(s) implies Signed(s)
                axiom logged:  Logged(s17)
                axiom unsigned: not Signed(s17)
                """);
        out.put("key_holder", """
                problem key_holder
                axiom keys:   forall t. (Keyholder(t) iff Senior(t) and Trained(t))
                axiom senior: Senior(ana)
                axiom trained: Trained(ana)
                goal ana_keys: Keyholder(ana)
                """);
        out.put("shared_bench", """
                problem shared_bench
                axiom b_ines: bench(ines) = b2
                axiom b_omar: bench(omar) = b2
                axiom share:  forall x y. bench(x) = bench(y) implies Shares(x, y)
                goal shares: Shares(ines, omar)
                """);
        out.put("probe_quarantine", """
                problem probe_quarantine
                axiom probes: forall x. Probe(x) implies Calibrated(x) or Quarantined(x)
                axiom tags:   forall x. Quarantined(x) implies Tagged(x)
                axiom p4:     Probe(p4)
                axiom untagged: not Tagged(p4)
                goal calibrated: Calibrated(p4)
                """);
        out.put("mentor_pairs", """
                problem mentor_pairs
                axiom mentors: forall x. exists y. Mentor(y, x)
                axiom senior:  forall x y. Mentor(y, x) implies Senior(y)
                goal some_senior: exists y. Senior(y)
                """);
        out.put("run_order", """
                problem run_order
                axiom trans: forall x y z. Before(x, y) and Before(y, z) implies Before(x, z)
                axiom a1:    Before(prep, run)
                axiom a2:    Before(run, clean)
                goal order: Before(prep, clean)
                """);
        out.put("report_heads", """
                problem report_heads
                axiom h1: head(lab1) = ana
                axiom h2: head(lab2) = head(lab1)
                axiom signs: Signs(head(lab2), report)
                goal ana_signs: Signs(ana, report)
                """);
        out.put("escort_or_card", """
                problem escort_or_card
                axiom entry:  forall p. Enters(p) implies Card(p) or exists e. Escorts(e, p) and Card(e)
                axiom seen:   exists p. Enters(p) and not Card(p)
                goal escorted: exists e p. Escorts(e, p)
                """);
        return out;
    }

    private static final String[] CHAIN = {"Logged", "Sealed", "Labelled", "Stored", "Checked", "Released", "Archived",
            "Shipped"};
    private static final String[] NOISE = {"Dusty", "Spare", "Borrowed", "Broken"};
    private static final String[] CONSTANTS = {"s1", "fridge", "bay4", "kit7"};

    /** A seeded chain from a fact to the goal: implications, side conditions, a case split, an existential, a function. */
    static String random(long seed) {
        Random r = new Random(seed);
        String name = "rand_lab_" + seed;
        List<String> axioms = new ArrayList<>();
        String start = CONSTANTS[r.nextInt(CONSTANTS.length)];
        boolean alias = r.nextInt(4) == 0;
        axioms.add(CHAIN[0] + "(" + (alias ? "alias" : start) + ")");
        if (alias) axioms.add("alias = " + start);
        int k = 2 + r.nextInt(4);
        boolean ground = true;
        for (int i = 0; i < k; i++) {
            String p = CHAIN[i];
            String q = CHAIN[i + 1];
            switch (r.nextInt(6)) {
                case 0, 1 -> axioms.add("forall x. " + p + "(x) implies " + q + "(x)");
                case 2 -> {
                    axioms.add("forall x. " + p + "(x) and Approved(x) implies " + q + "(x)");
                    axioms.add("forall x. Approved(x)");
                }
                case 3 -> {
                    axioms.add("forall x. " + p + "(x) implies " + q + "(x) or Lost(x)");
                    axioms.add("forall x. not Lost(x)");
                }
                case 4 -> {
                    axioms.add("forall x. " + p + "(x) implies exists y. Moved(x, y) and " + q + "(y)");
                    ground = false;
                }
                default -> {
                    axioms.add("forall x. " + p + "(x) implies " + q + "(owner(x))");
                    ground = false;
                }
            }
        }
        int noise = r.nextInt(3);
        for (int i = 0; i < noise; i++) {
            String a = NOISE[r.nextInt(NOISE.length)];
            String b = NOISE[r.nextInt(NOISE.length)];
            axioms.add(r.nextBoolean() ? "forall x. " + a + "(x) implies " + b + "(x)"
                    : a + "(" + CONSTANTS[r.nextInt(CONSTANTS.length)] + ")");
        }
        java.util.Collections.shuffle(axioms, r);
        StringBuilder sb = new StringBuilder("problem " + name + "\n");
        for (int i = 0; i < axioms.size(); i++) sb.append("axiom a").append(i + 1).append(": ").append(axioms.get(i)).append('\n');
        String last = CHAIN[k];
        sb.append("goal g: ").append(ground && r.nextBoolean() ? last + "(" + start + ")" : "exists x. " + last + "(x)")
                .append('\n');
        return sb.toString();
    }
}
