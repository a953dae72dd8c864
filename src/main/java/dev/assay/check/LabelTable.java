package dev.assay.check;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/**
 * The labels of forgotten steps, kept compactly so that a certificate of tens of millions of steps that forgets as it
 * goes needs a few tens of bytes per step rather than a string and a map entry each. Each label is stored with two
 * positions: where its step was written and where it was forgotten. Exact (no hashing shortcuts): a label is found
 * only if the same bytes were added.
 */
final class LabelTable {

    /** Per record: length (int), the label's UTF-8 bytes, then four ints (step line, column, forget line, column). */
    private byte[] arena = new byte[1 << 12];
    private int used;
    /** Open addressing on record offsets + 1; 0 is empty. */
    private int[] slots = new int[1 << 10];
    private int count;

    int size() {
        return count;
    }

    /** Adds {@code label} unless present; returns false when it was present. */
    boolean add(String label, int stepLine, int stepColumn, int forgetLine, int forgetColumn) {
        byte[] key = label.getBytes(StandardCharsets.UTF_8);
        if (find(key) >= 0) return false;
        if ((count + 1) * 2 > slots.length) rehash();
        int need = 4 + key.length + 16;
        if (used + need > arena.length) {
            long grown = Math.max((long) arena.length * 2, (long) used + need);
            if (grown > Integer.MAX_VALUE - 8) throw new IllegalStateException("too many forgotten labels to keep");
            arena = Arrays.copyOf(arena, (int) grown);
        }
        int at = used;
        putInt(at, key.length);
        System.arraycopy(key, 0, arena, at + 4, key.length);
        int p = at + 4 + key.length;
        putInt(p, stepLine);
        putInt(p + 4, stepColumn);
        putInt(p + 8, forgetLine);
        putInt(p + 12, forgetColumn);
        used += need;
        insert(at, hash(key, 0, key.length));
        count++;
        return true;
    }

    /** The four positions stored with {@code label} (step line, column, forget line, column), or null. */
    int[] positions(String label) {
        byte[] key = label.getBytes(StandardCharsets.UTF_8);
        int at = find(key);
        if (at < 0) return null;
        int p = at + 4 + key.length;
        return new int[] {getInt(p), getInt(p + 4), getInt(p + 8), getInt(p + 12)};
    }

    private int find(byte[] key) {
        int mask = slots.length - 1;
        for (int i = hash(key, 0, key.length) & mask; ; i = (i + 1) & mask) {
            int s = slots[i];
            if (s == 0) return -1;
            int at = s - 1;
            if (getInt(at) == key.length && Arrays.equals(arena, at + 4, at + 4 + key.length, key, 0, key.length)) {
                return at;
            }
        }
    }

    private void insert(int at, int hash) {
        int mask = slots.length - 1;
        int i = hash & mask;
        while (slots[i] != 0) i = (i + 1) & mask;
        slots[i] = at + 1;
    }

    private void rehash() {
        int[] old = slots;
        slots = new int[old.length * 2];
        for (int s : old) {
            if (s == 0) continue;
            int at = s - 1;
            insert(at, hash(arena, at + 4, getInt(at)));
        }
    }

    private static int hash(byte[] b, int from, int length) {
        int h = 0x811c9dc5;
        for (int i = from; i < from + length; i++) h = (h ^ b[i]) * 0x01000193;
        return h ^ (h >>> 16);
    }

    private void putInt(int at, int v) {
        arena[at] = (byte) (v >>> 24);
        arena[at + 1] = (byte) (v >>> 16);
        arena[at + 2] = (byte) (v >>> 8);
        arena[at + 3] = (byte) v;
    }

    private int getInt(int at) {
        return (arena[at] & 0xff) << 24 | (arena[at + 1] & 0xff) << 16 | (arena[at + 2] & 0xff) << 8 | (arena[at + 3] & 0xff);
    }
}
