package dev.assay.check;

import dev.assay.syntax.BigStack;
import dev.assay.syntax.CertificateReader;
import dev.assay.syntax.CertificateStatement;
import dev.assay.syntax.InputError;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.DigestInputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;

/**
 * The statements of a certificate file in order, with the SHA-256 of its bytes. Read either on the caller's thread,
 * or ahead on a thread of its own so that parsing overlaps checking: the statements, the error that ends them and
 * the digest are the same either way, only the time differs. After an input error the rest of the file is still read
 * for its digest.
 */
abstract class CertificateSource implements AutoCloseable {

    /** The next statement, or null after the last. */
    abstract CertificateStatement next() throws InputError, IOException, InterruptedException;

    /** The SHA-256 of the whole file, in hex; known once {@link #next} has returned null or thrown an InputError. */
    abstract String sha256();

    @Override
    public abstract void close();

    static CertificateSource open(String file, Path path, int maxDepth, long maxTermSize, boolean readAhead)
            throws IOException {
        Direct direct = new Direct(file, path, maxDepth, maxTermSize);
        return readAhead ? new Ahead(direct) : direct;
    }

    /** Reads on the caller's thread. */
    static final class Direct extends CertificateSource {
        private final MessageDigest md = newDigest();
        private final InputStream in;
        /** Bytes read from the file so far (ahead of the parser by at most a buffer). */
        private long consumed;
        private final CertificateReader reader;
        private String sha;

        Direct(String file, Path path, int maxDepth, long maxTermSize) throws IOException {
            this.in = new DigestInputStream(new java.io.FilterInputStream(Files.newInputStream(path)) {
                @Override
                public int read() throws IOException {
                    int b = super.read();
                    if (b >= 0) consumed++;
                    return b;
                }

                @Override
                public int read(byte[] b, int off, int len) throws IOException {
                    int n = super.read(b, off, len);
                    if (n > 0) consumed += n;
                    return n;
                }
            }, md);
            this.reader = new CertificateReader(file, in, maxDepth, maxTermSize);
        }

        @Override
        CertificateStatement next() throws InputError, IOException {
            CertificateStatement s;
            try {
                s = reader.next();
            } catch (InputError e) {
                drain();
                throw e;
            }
            if (s == null) sha = hex(md.digest());
            return s;
        }

        private void drain() {
            try {
                in.transferTo(OutputStream.nullOutputStream());
            } catch (IOException ignored) {
                // The digest of a file that stops being readable is not reported.
            }
            sha = hex(md.digest());
        }

        @Override
        String sha256() {
            return sha;
        }

        @Override
        public void close() {
            try {
                in.close();
            } catch (IOException ignored) {
                // Nothing was written.
            }
        }
    }

    /**
     * Parses on a thread of its own, handing statements over in batches through a bounded queue, so memory holds at
     * most {@link #QUEUED} batches ahead of the checker. A batch ends at {@link #BATCH} statements or after about
     * {@link #BATCH_BYTES} of the file, so that long statements (deep terms, wide clauses) are not held by the
     * thousand: the text read ahead stays within about QUEUED × BATCH_BYTES.
     */
    static final class Ahead extends CertificateSource {
        static final int BATCH = 64;
        static final int QUEUED = 3;
        static final long BATCH_BYTES = 16 * 1024;

        /** The end of the statements: null when all were read, else the error that ended them. */
        private record End(Throwable error, String sha) {
        }

        private final BlockingQueue<Object[]> queue = new ArrayBlockingQueue<>(QUEUED);
        private final Thread thread;
        private Object[] batch = new Object[0];
        private int next;
        private End end;
        private volatile boolean closed;

        Ahead(Direct direct) {
            thread = new Thread(null, () -> produce(direct), "assay-reader", BigStack.STACK_BYTES);
            thread.setDaemon(true);
            thread.start();
        }

        private void produce(Direct direct) {
            try {
                produceAll(direct);
            } finally {
                direct.close();
            }
        }

        private void produceAll(Direct direct) {
            Object[] out = new Object[BATCH];
            int n = 0;
            try {
                while (!closed) {
                    n = fill(direct, out);
                    if (ended || failure != null) break;
                    queue.put(n == BATCH ? out : java.util.Arrays.copyOf(out, n));
                    out = new Object[BATCH];
                    n = 0;
                }
            } catch (InterruptedException e) {
                return;
            }
            if (closed) return;
            Object[] last = new Object[n + 1];
            System.arraycopy(out, 0, last, 0, n);
            last[n] = new End(failure, direct.sha256());
            try {
                queue.put(last);
            } catch (InterruptedException ignored) {
                // Closed while handing over the end.
            }
        }

        /** Set on the reading thread when the statements have ended, or by what ended them. */
        private boolean ended;
        private Throwable failure;

        /**
         * Fills {@code out} with the next statements until it holds {@link #BATCH} of them or about
         * {@link #BATCH_BYTES} of the file was read, and returns how many; at the end of the statements it sets
         * {@link #ended}, or {@link #failure} to the error that ended them. A method of its own, like the checker's
         * batches, so that the compiler compiles it whole rather than in place.
         */
        private int fill(Direct direct, Object[] out) {
            long mark = direct.consumed;
            int n = 0;
            try {
                do {
                    CertificateStatement s = direct.next();
                    if (s == null) {
                        ended = true;
                        return n;
                    }
                    out[n++] = s;
                } while (n < BATCH && direct.consumed - mark < BATCH_BYTES);
            } catch (Throwable t) {
                failure = t;
            }
            return n;
        }

        @Override
        CertificateStatement next() throws InputError, IOException, InterruptedException {
            while (true) {
                if (end != null) return rethrow();
                if (next < batch.length) {
                    Object o = batch[next++];
                    if (o instanceof End e) {
                        end = e;
                        return rethrow();
                    }
                    return (CertificateStatement) o;
                }
                batch = queue.take();
                next = 0;
            }
        }

        private CertificateStatement rethrow() throws InputError, IOException {
            Throwable t = end.error();
            if (t == null) return null;
            if (t instanceof InputError e) throw e;
            if (t instanceof IOException e) throw e;
            if (t instanceof RuntimeException e) throw e;
            if (t instanceof Error e) throw e;
            throw new IllegalStateException(t);
        }

        @Override
        String sha256() {
            return end == null ? null : end.sha();
        }

        @Override
        public void close() {
            closed = true;
            thread.interrupt();
        }
    }

    static MessageDigest newDigest() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is not available", e);
        }
    }

    static String hex(byte[] digest) {
        StringBuilder sb = new StringBuilder(64);
        for (byte b : digest) sb.append(String.format("%02x", b));
        return sb.toString();
    }
}
