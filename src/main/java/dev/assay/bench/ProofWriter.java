package dev.assay.bench;

import java.io.BufferedWriter;
import java.io.Closeable;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;

/**
 * Writes a certificate one statement at a time to a buffered stream, so that a family of ten million steps is written
 * in constant memory. Counts the steps it wrote and the bytes, and numbers the labels it hands out.
 */
public final class ProofWriter implements Closeable {

    private final Writer out;
    private final boolean forget;
    private long steps;
    private long next;

    ProofWriter(OutputStream stream, boolean forget) {
        this.out = new BufferedWriter(new OutputStreamWriter(stream, StandardCharsets.UTF_8), 1 << 20);
        this.forget = forget;
    }

    /** The certificate header and, when {@code sha256} is not null, the digest of the problem file. */
    void header(String problemName, String sha256) throws IOException {
        out.write("certificate for " + problemName + "\n");
        if (sha256 != null) out.write("digest \"sha256:" + sha256 + "\"\n");
    }

    void comment(String text) throws IOException {
        for (String line : text.split("\n", -1)) {
            out.write("# ");
            out.write(line);
            out.write('\n');
        }
    }

    /** A fresh label {@code s1}, {@code s2}, … */
    String label() {
        return "s" + (++next);
    }

    /** {@code step LABEL: clause CLAUSE by RULE}. */
    void clause(String label, String clause, String rule) throws IOException {
        statement(label, "clause ", clause, rule);
    }

    /** {@code step LABEL: formula FORMULA by RULE}. */
    void formula(String label, String formula, String rule) throws IOException {
        statement(label, "formula ", formula, rule);
    }

    private void statement(String label, String kind, String conclusion, String rule) throws IOException {
        out.write("step ");
        out.write(label);
        out.write(": ");
        out.write(kind);
        out.write(conclusion);
        out.write(" by ");
        out.write(rule);
        out.write('\n');
        steps++;
    }

    /** A {@code forget} line for the labels, when the certificate is written with forget lines at all. */
    void forget(String... labels) throws IOException {
        if (!forget || labels.length == 0) return;
        out.write("forget ");
        for (int i = 0; i < labels.length; i++) {
            if (i > 0) out.write(", ");
            out.write(labels[i]);
        }
        out.write('\n');
    }

    boolean forgetting() {
        return forget;
    }

    long steps() {
        return steps;
    }

    @Override
    public void close() throws IOException {
        out.close();
    }
}
