package dev.assay.check;

import java.util.ArrayList;
import java.util.BitSet;
import java.util.List;

/**
 * The premises of every step up to the first empty clause, as ints in chunks (no object per step), so that the cone
 * of the refutation is one backward pass. Step premises are step numbers (0, 1, …, in certificate order); an axiom
 * is {@code -2 - its index}; the goal is {@code -1}. Each step is written as its premises followed by their count,
 * which is what lets the pass read the log from the end.
 */
final class ProofGraph {

    static final int GOAL = -1;

    static int axiom(int index) {
        return -2 - index;
    }

    private static final int CHUNK = 1 << 16;
    private final List<int[]> chunks = new ArrayList<>();
    private long size;
    private int steps;

    int steps() {
        return steps;
    }

    /** Records the next step (number {@link #steps()} before the call) with these premises. */
    void add(int[] premises, int count) {
        for (int i = 0; i < count; i++) push(premises[i]);
        push(count);
        steps++;
    }

    private void push(int v) {
        int offset = (int) (size % CHUNK);
        if (offset == 0) chunks.add(new int[CHUNK]);
        chunks.get(chunks.size() - 1)[offset] = v;
        size++;
    }

    private int get(long i) {
        return chunks.get((int) (i / CHUNK))[(int) (i % CHUNK)];
    }

    /** What the cone of step {@code last} (the last one added) rests on. */
    record Cone(int steps, BitSet axioms, boolean goal) {
    }

    Cone cone() {
        BitSet in = new BitSet(steps);
        BitSet axioms = new BitSet();
        boolean goal = false;
        int n = 0;
        in.set(steps - 1);
        long i = size - 1;
        for (int step = steps - 1; step >= 0; step--) {
            int count = get(i);
            long first = i - count;
            if (in.get(step)) {
                n++;
                for (long k = first; k < i; k++) {
                    int p = get(k);
                    if (p >= 0) in.set(p);
                    else if (p == GOAL) goal = true;
                    else axioms.set(-2 - p);
                }
            }
            i = first - 1;
        }
        return new Cone(n, axioms, goal);
    }
}
