package dev.assay.check;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.BitSet;
import java.util.List;

/**
 * The premises of every step up to the first empty clause, as ints (no object per step), so that the cone of the
 * refutation is one backward pass. Step premises are step numbers (0, 1, …, in certificate order); an axiom is
 * {@code -2 - its index}; the goal is {@code -1}. Each step is written as its premises followed by their count, which
 * is what lets the pass read the log from the end.
 *
 * <p>The log is kept in memory up to {@link #MEMORY_CHUNKS} chunks; beyond that, full chunks go to a temporary file
 * (deleted when the graph is closed), so a certificate of tens of millions of steps does not hold its graph in heap.
 */
final class ProofGraph implements AutoCloseable {

    static final int GOAL = -1;

    static int axiom(int index) {
        return -2 - index;
    }

    static final int CHUNK = 1 << 16;
    static final int MEMORY_CHUNKS = 64;

    /** Chunks in memory; once spilling, only the chunk being filled. */
    private final List<int[]> chunks = new ArrayList<>();
    private final int memoryChunks;
    private long size;
    private int steps;
    private FileChannel spill;
    private Path spillFile;
    private long spilledChunks;

    ProofGraph() {
        this(MEMORY_CHUNKS);
    }

    /** A graph that keeps at most {@code memoryChunks} chunks in memory before it spills. */
    ProofGraph(int memoryChunks) {
        this.memoryChunks = Math.max(1, memoryChunks);
    }

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
        if (offset == 0) {
            if (spill != null || chunks.size() == memoryChunks) spillAll();
            chunks.add(new int[CHUNK]);
        }
        chunks.get(chunks.size() - 1)[offset] = v;
        size++;
    }

    /** Writes every chunk held in memory (all full) to the spill file. */
    private void spillAll() {
        try {
            if (spill == null) {
                spillFile = Files.createTempFile("assay-graph", ".ints");
                spillFile.toFile().deleteOnExit();
                spill = FileChannel.open(spillFile, StandardOpenOption.READ, StandardOpenOption.WRITE);
            }
            ByteBuffer buf = io();
            for (int[] c : chunks) {
                buf.clear();
                buf.asIntBuffer().put(c);
                long at = spilledChunks * CHUNK * 4L;
                while (buf.hasRemaining()) at += spill.write(buf, at);
                spilledChunks++;
            }
            chunks.clear();
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write the proof graph to a temporary file", e);
        }
    }

    /** The one buffer of a chunk's bytes for writing and reading the spill file. */
    private ByteBuffer io;

    private ByteBuffer io() {
        if (io == null) io = ByteBuffer.allocate(CHUNK * 4);
        return io;
    }

    /** Reads the log backwards a chunk at a time. */
    private final class Reader {
        private long loaded = -1;
        /** Made on the first read from the spill file, then reused. */
        private int[] chunk;

        int get(long i) {
            long c = i / CHUNK;
            if (c >= spilledChunks) return chunks.get((int) (c - spilledChunks))[(int) (i % CHUNK)];
            if (c != loaded) {
                try {
                    if (chunk == null) chunk = new int[CHUNK];
                    ByteBuffer buf = io();
                    buf.clear();
                    long at = c * CHUNK * 4L;
                    while (buf.hasRemaining()) {
                        int n = spill.read(buf, at + buf.position());
                        if (n < 0) throw new IOException("the proof graph file ended early");
                    }
                    buf.flip();
                    buf.asIntBuffer().get(chunk);
                    loaded = c;
                } catch (IOException e) {
                    throw new UncheckedIOException("cannot read the proof graph back from its temporary file", e);
                }
            }
            return chunk[(int) (i % CHUNK)];
        }
    }

    /** What the cone of the last step added rests on. */
    record Cone(int steps, BitSet axioms, boolean goal) {
    }

    Cone cone() {
        BitSet in = new BitSet(steps);
        BitSet axioms = new BitSet();
        boolean goal = false;
        int n = 0;
        in.set(steps - 1);
        Reader r = new Reader();
        int[] premises = new int[16];
        long i = size - 1;
        for (int step = steps - 1; step >= 0; step--) {
            int count = r.get(i);
            // Read the count before the premises, so the reader moves backwards (a step may span two chunks).
            if (count > premises.length) premises = new int[Math.max(count, premises.length * 2)];
            for (int k = count - 1; k >= 0; k--) premises[k] = r.get(i - count + k);
            if (in.get(step)) {
                n++;
                for (int k = 0; k < count; k++) {
                    int p = premises[k];
                    if (p >= 0) in.set(p);
                    else if (p == GOAL) goal = true;
                    else axioms.set(-2 - p);
                }
            }
            i -= count + 1;
        }
        return new Cone(n, axioms, goal);
    }

    @Override
    public void close() {
        if (spill == null) return;
        try {
            spill.close();
            Files.deleteIfExists(spillFile);
        } catch (IOException ignored) {
            // A temporary file left behind is deleted on exit.
        }
    }
}
