package dev.assay.check;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.BitSet;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The checker's compact tables against plain collections. */
class BookkeepingTest {

    @Test
    void labelTableIsExactAndKeepsPositions() {
        LabelTable t = new LabelTable();
        Map<String, int[]> ref = new HashMap<>();
        Random r = new Random(5);
        for (int i = 0; i < 200_000; i++) {
            String label = "s" + r.nextInt(150_000) + (r.nextBoolean() ? "" : "_b");
            int[] pos = {i + 1, i % 80 + 1, i + 2, i % 7 + 1};
            boolean fresh = !ref.containsKey(label);
            assertEquals(fresh, t.add(label, pos[0], pos[1], pos[2], pos[3]), label);
            if (fresh) ref.put(label, pos);
        }
        assertEquals(ref.size(), t.size());
        for (Map.Entry<String, int[]> e : ref.entrySet()) assertArrayEquals(e.getValue(), t.positions(e.getKey()));
        assertNull(t.positions("s"));
        assertNull(t.positions("s1_c"));
        // Labels that differ only in length or by one byte are different labels.
        LabelTable u = new LabelTable();
        assertTrue(u.add("ab", 1, 1, 1, 1));
        assertTrue(u.add("abc", 2, 2, 2, 2));
        assertTrue(u.add("abd", 3, 3, 3, 3));
        assertFalse(u.add("abc", 9, 9, 9, 9));
        assertEquals(2, u.positions("abc")[0]);
    }

    @Test
    void coneMatchesAGraphSearch() {
        Random r = new Random(11);
        for (int round = 0; round < 200; round++) {
            ProofGraph g = new ProofGraph();
            int n = 1 + r.nextInt(300);
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
