package dev.assay.check;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.BitSet;
import java.util.List;
import java.util.Random;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The checker's compact tables against plain collections. */
class BookkeepingTest {

    @Test
    void labelTableFindsEveryAddedLabelAndFewOthers() {
        LabelTable t = new LabelTable();
        java.util.Set<String> ref = new java.util.HashSet<>();
        Random r = new Random(5);
        for (int i = 0; i < 200_000; i++) {
            String label = "s" + r.nextInt(150_000) + (r.nextBoolean() ? "" : "_b");
            assertEquals(ref.add(label), t.add(label), label);
        }
        assertEquals(ref.size(), t.size());
        for (String l : ref) assertTrue(t.mayContain(l), l);
        int falseHits = 0;
        for (int i = 0; i < 200_000; i++) if (t.mayContain("t" + i)) falseHits++;
        assertEquals(0, falseHits, "64-bit keys of 200,000 labels should not meet by chance");
        assertFalse(t.mayContain("s"));
    }

    @Test
    void numberedLabelsShareWordsButNotBits() {
        LabelTable t = new LabelTable();
        for (int i = 0; i < 100_000; i += 2) assertTrue(t.add("s" + i));
        assertEquals(50_000, t.size());
        for (int i = 0; i < 100_000; i++) assertEquals(i % 2 == 0, t.mayContain("s" + i), "s" + i);
        assertFalse(t.add("s42"), "added twice");
        // The digits are part of the stem's key: leading zeros, and the same number under another stem, differ.
        assertFalse(t.mayContain("s042"));
        assertFalse(t.mayContain("s0042"));
        assertFalse(t.mayContain("c42"));
        assertFalse(t.mayContain("s42_"));
        assertFalse(t.mayContain("s"));
        // Numbers 0–99,999 span 1,563 words of 64; one more for each digit count where a word is split.
        assertTrue(t.words() <= 100_000 / 64 + 5, "50,000 numbered labels in " + t.words() + " words");
    }

    @Test
    void labelsWithoutDigitsOrWithVeryLongOnesAreStemsOfTheirOwn() {
        LabelTable t = new LabelTable();
        String nineteen = "x1234567890123456789";
        assertTrue(t.add(nineteen));
        assertTrue(t.mayContain(nineteen));
        assertFalse(t.mayContain("x1234567890123456788"));
        assertEquals(0, LabelTable.number(nineteen));
        assertEquals(123456789012345678L, LabelTable.number("x123456789012345678"));
        assertTrue(t.add("goal_clause"));
        assertTrue(t.mayContain("goal_clause"));
        assertFalse(t.mayContain("goal_claus"));
        assertTrue(t.add("7"));
        assertTrue(t.mayContain("7"));
        assertFalse(t.mayContain("07"));
        assertEquals(3, t.size());
    }

    @Test
    void aForgottenLabelIsLocatedInTheFileItself() throws java.io.IOException {
        // Reuse after forget, and use after forget, are reported with the positions read back from the file.
        Path problem = Path.of("certificates", "depot", "key_cabinet.problem");
        String text = java.nio.file.Files.readString(Path.of("certificates", "depot", "key_cabinet.proof"));
        String firstLabel = text.substring(text.indexOf("\nstep ") + 6, text.indexOf(':', text.indexOf("\nstep ")));
        Path reuse = java.nio.file.Files.createTempFile("reuse", ".proof");
        java.nio.file.Files.writeString(reuse, text + "\nforget " + firstLabel + "\nstep " + firstLabel
                + ": clause false by reflexivity\n");
        CheckResult r = new Checker().check(problem, reuse);
        assertEquals(Verdict.REJECTED, r.verdict());
        assertTrue(r.failure().reason().contains("is used twice (first at " + reuse + ":"), r.failure().reason());
        Path use = java.nio.file.Files.createTempFile("use", ".proof");
        java.nio.file.Files.writeString(use, text + "\nforget " + firstLabel + "\nstep late: clause false by resolve "
                + firstLabel + ".1, " + firstLabel + ".1\n");
        CheckResult u = new Checker().check(problem, use);
        assertEquals(Verdict.REJECTED, u.verdict());
        int forgetLine = (int) text.lines().count() + 2;
        assertTrue(u.failure().reason().contains("was forgotten at " + use + ":" + forgetLine + ":8"), u.failure().reason());
    }

    @Test
    void coneMatchesAGraphSearch() {
        Random r = new Random(11);
        for (int round = 0; round < 200; round++) {
            // Small graphs stay in memory; with one chunk of memory, larger ones spill to a file.
            ProofGraph g = new ProofGraph(round % 2 == 0 ? 64 : 1);
            int n = 1 + (round % 10 == 1 ? 70_000 + r.nextInt(40_000) : r.nextInt(300));
            int axioms = 1 + r.nextInt(5);
            List<int[]> premises = new ArrayList<>();
            for (int s = 0; s < n; s++) {
                int k = r.nextInt(4);
                int[] p = new int[k];
                for (int i = 0; i < k; i++) {
                    int pick = r.nextInt(s + axioms + 1);
                    p[i] = pick < s ? pick : pick < s + axioms ? ProofGraph.axiom(pick - s) : ProofGraph.GOAL;
                }
                premises.add(p);
                g.add(p, k);
            }
            ProofGraph.Cone c = g.cone();
            g.close();
            // Reference: depth-first search from the last step.
            BitSet seen = new BitSet();
            BitSet ax = new BitSet();
            boolean goal = false;
            ArrayList<Integer> todo = new ArrayList<>(List.of(n - 1));
            seen.set(n - 1);
            while (!todo.isEmpty()) {
                int s = todo.remove(todo.size() - 1);
                for (int p : premises.get(s)) {
                    if (p >= 0 && !seen.get(p)) {
                        seen.set(p);
                        todo.add(p);
                    } else if (p == ProofGraph.GOAL) {
                        goal = true;
                    } else if (p < -1) {
                        ax.set(-2 - p);
                    }
                }
            }
            assertEquals(seen.cardinality(), c.steps());
            assertEquals(ax, c.axioms());
            assertEquals(goal, c.goal());
        }
    }
}
