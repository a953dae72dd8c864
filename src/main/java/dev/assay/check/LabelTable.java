package dev.assay.check;

/**
 * The labels of forgotten steps, kept compact so that a certificate of tens of millions of steps that forgets as it
 * goes does not keep a string per step. The table can only say "perhaps present"; the checker confirms every such
 * answer against the file itself before acting on it, so two labels the table cannot tell apart never cause a wrong
 * message or a wrong verdict, only a second reading of the file.
 *
 * <p>Provers number their steps, so a label is split into a stem and the number its trailing digits spell: {@code s1042}
 * is stem {@code s} (with four digits) and number 1042. Labels of one stem whose numbers share all bits but the
 * lowest six share a word of 64 bits, one bit each, filed under a 64-bit fingerprint of the stem, the digit count and
 * the number's high bits. A run of numbered labels thus costs about two bits each, and the word a new label is looked
 * up in is the one its predecessors were just filed in, which is in the processor's cache. A label without trailing
 * digits (or with more than 18) is a stem of its own, with number 0.
 */
final class LabelTable {

    /** Open addressing on {@code keys}; key 0 is an empty slot (a fingerprint of 0 is stored as 1). */
    private long[] keys = new long[1 << 8];
    private long[] words = new long[1 << 8];
    private int used;
    private int count;

    /** The number of distinct labels added. */
    int size() {
        return count;
    }

    /** The number of 64-bit words in use. */
    int words() {
        return used;
    }

    /** Adds the label; false when the table already said "perhaps" for it. */
    boolean add(String label) {
        int stem = stemLength(label);
        long number = number(label, stem);
        long key = key(label, stem, number);
        long bit = 1L << (number & 63);
        int i = slot(key);
        if (keys[i] == 0) {
            if ((used + 1) * 4L > keys.length * 3L) { // at most three quarters full
                grow();
                i = slot(key);
            }
            keys[i] = key;
            used++;
        }
        if ((words[i] & bit) != 0) return false;
        words[i] |= bit;
        count++;
        return true;
    }

    /** Whether this label may have been added: true for every added label, rarely for others. */
    boolean mayContain(String label) {
        int stem = stemLength(label);
        long number = number(label, stem);
        int i = slot(key(label, stem, number));
        return keys[i] != 0 && (words[i] & (1L << (number & 63))) != 0;
    }

    /** The slot that holds {@code key}, or the empty slot where it would go. */
    private int slot(long key) {
        int mask = keys.length - 1;
        for (int i = spread(key) & mask; ; i = (i + 1) & mask) {
            long k = keys[i];
            if (k == key || k == 0) return i;
        }
    }

    private void grow() {
        long[] oldKeys = keys;
        long[] oldWords = words;
        keys = new long[oldKeys.length * 2];
        words = new long[oldKeys.length * 2];
        for (int j = 0; j < oldKeys.length; j++) {
            if (oldKeys[j] == 0) continue;
            int i = slot(oldKeys[j]);
            keys[i] = oldKeys[j];
            words[i] = oldWords[j];
        }
    }

    private static int spread(long f) {
        return (int) (f ^ (f >>> 32));
    }

    /** Where the trailing digits begin: the label's length when there are none or more than 18. */
    private static int stemLength(String label) {
        int i = label.length();
        while (i > 0 && label.charAt(i - 1) >= '0' && label.charAt(i - 1) <= '9') i--;
        return label.length() - i > 18 ? label.length() : i;
    }

    /** The number the trailing digits spell (0 when there are none). */
    static long number(String label) {
        return number(label, stemLength(label));
    }

    private static long number(String label, int stem) {
        long n = 0;
        for (int i = stem; i < label.length(); i++) n = n * 10 + (label.charAt(i) - '0');
        return n;
    }

    /**
     * The word's key: FNV-1a over the stem's UTF-16 units and the digit count, plus the number's high bits times an
     * odd constant, then a final mix (a bijection, so one stem's words never share a key); never 0.
     */
    private static long key(String label, int stem, long number) {
        long h = 0xcbf29ce484222325L;
        for (int i = 0; i < stem; i++) {
            h ^= label.charAt(i);
            h *= 0x100000001b3L;
        }
        h ^= label.length() - stem;
        h *= 0x100000001b3L;
        h += (number >>> 6) * 0x9e3779b97f4a7c15L;
        h ^= h >>> 33;
        h *= 0xff51afd7ed558ccdL;
        h ^= h >>> 33;
        return h == 0 ? 1 : h;
    }
}
