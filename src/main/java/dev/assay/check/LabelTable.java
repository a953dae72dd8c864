package dev.assay.check;

/**
 * The labels of forgotten steps as 64-bit fingerprints (11 to 21 bytes per label), so that a certificate of tens of
 * millions of steps that forgets as it goes does not keep a string per step. A fingerprint can only say "perhaps
 * present"; the checker confirms every such answer against the file itself before acting on it, so two labels that
 * share a fingerprint never cause a wrong message or a wrong verdict, only a second reading of the file.
 */
final class LabelTable {

    /** Open addressing; 0 is empty (a fingerprint of 0 is stored as 1). */
    private long[] slots = new long[1 << 10];
    private int count;

    int size() {
        return count;
    }

    /** Adds the label's fingerprint; false when the fingerprint was present already. */
    boolean add(String label) {
        long f = fingerprint(label);
        if ((count + 1) * 4L > slots.length * 3L) rehash(); // at most three quarters full
        // One probe sequence: it ends at the fingerprint (present) or at the empty slot it goes into.
        int mask = slots.length - 1;
        for (int i = spread(f) & mask; ; i = (i + 1) & mask) {
            long s = slots[i];
            if (s == f) return false;
            if (s == 0) {
                slots[i] = f;
                count++;
                return true;
            }
        }
    }

    /** Whether a label with this label's fingerprint was added: true for every added label, rarely for others. */
    boolean mayContain(String label) {
        return find(fingerprint(label)) >= 0;
    }

    private int find(long f) {
        int mask = slots.length - 1;
        for (int i = spread(f) & mask; ; i = (i + 1) & mask) {
            long s = slots[i];
            if (s == 0) return -1;
            if (s == f) return i;
        }
    }

    private void insert(long f) {
        int mask = slots.length - 1;
        int i = spread(f) & mask;
        while (slots[i] != 0) i = (i + 1) & mask;
        slots[i] = f;
    }

    private void rehash() {
        long[] old = slots;
        slots = new long[old.length * 2];
        for (long s : old) if (s != 0) insert(s);
    }

    private static int spread(long f) {
        return (int) (f ^ (f >>> 32));
    }

    /** FNV-1a over the UTF-16 units, 64-bit, then a final mix; never 0. */
    static long fingerprint(String label) {
        long h = 0xcbf29ce484222325L;
        for (int i = 0; i < label.length(); i++) {
            h ^= label.charAt(i);
            h *= 0x100000001b3L;
        }
        h ^= h >>> 33;
        h *= 0xff51afd7ed558ccdL;
        h ^= h >>> 33;
        return h == 0 ? 1 : h;
    }
}
