package dev.assay.syntax;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The readers read a file as a stream, a statement at a time, and report read failures as input errors. */
class StreamingTest {

    /** A reader that counts what it has handed out, optionally a few characters per call. */
    private static final class CountingReader extends Reader {
        private final Reader inner;
        private final int chunk;
        long read;

        CountingReader(String text, int chunk) {
            this.inner = new StringReader(text);
            this.chunk = chunk;
        }

        @Override
        public int read(char[] buffer, int offset, int length) throws IOException {
            int n = inner.read(buffer, offset, Math.min(length, chunk));
            if (n > 0) {
                read += n;
            }
            return n;
        }

        @Override
        public void close() {
        }
    }

    private static String bigCertificate(int steps) {
        StringBuilder text = new StringBuilder("certificate for big\n");
        for (int i = 0; i < steps; i++) {
            text.append("step c").append(i).append(": clause [x, y] not Link(x, y) or Link(y, next(x))")
                    .append(" by resolve c1.1 {x := a}, c2.2  # a comment\n");
        }
        return text.toString();
    }

    @Test
    void aStatementIsHandedOutBeforeTheRestOfTheFileIsRead() throws Exception {
        String text = bigCertificate(40_000);
        CountingReader input = new CountingReader(text, Integer.MAX_VALUE);
        CertificateReader reader = new CertificateReader("big.proof", input);
        assertInstanceOf(CertificateHeader.class, reader.next());
        assertInstanceOf(Step.class, reader.next());
        assertTrue(input.read < 200_000, "read " + input.read + " of " + text.length() + " characters");
        int steps = 1;
        while (reader.next() != null) {
            steps++;
        }
        assertEquals(40_000, steps);
        assertEquals(text.length(), input.read);
    }

    @Test
    void aReaderThatGivesOneCharacterAtATimeReadsTheSame() throws Exception {
        String text = "certificate for t # ∀ 😀 in a comment\nstep c: clause [x] P(x) ∨ ¬Q(x) by reflexivity\n";
        List<CertificateStatement> whole = CertificateReader.readAll("t.proof", text);
        List<CertificateStatement> trickled = CertificateReader.readAll("t.proof", new CountingReader(text, 1));
        assertEquals(whole, trickled);
    }

    @Test
    void surrogatePairsSplitAcrossReadsAreOneCharacter() {
        // The emoji is one illegal character in column 12, even when its two UTF-16 halves
        // arrive in different reads.
        String text = "problem t\naxiom a: P 😀";
        for (int chunk = 1; chunk <= 3; chunk++) {
            int size = chunk;
            InputError error = assertThrows(InputError.class,
                    () -> ProblemReader.readAll("t.problem", new CountingReader(text, size)));
            assertEquals("t.problem:2:12: illegal character '😀' (U+1F600)", error.getMessage());
        }
    }

    @Test
    void aByteOrderMarkIsIgnored() throws Exception {
        assertEquals(2, ProblemReader.readAll("t.problem", "\uFEFFproblem t\naxiom a: P").size());
    }

    @Test
    void filesAreReadAsUtf8(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("u.problem");
        Files.writeString(file, "problem u\naxiom a: ∀x. P(x) ∧ ¬Q\n", StandardCharsets.UTF_8);
        List<ProblemStatement> statements = ProblemReader.readAll(file);
        assertEquals("(forall x (and P(x) (not Q)))", Show.formula(((Axiom) statements.get(1)).formula()));
        assertEquals(file.toString(), statements.get(0).at().file());
    }

    @Test
    void bytesThatAreNotUtf8AreAnInputErrorWhereTheyAre(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("bad.proof");
        byte[] head = "certificate for t\nstep c: clause P(".getBytes(StandardCharsets.US_ASCII);
        byte[] bytes = new byte[head.length + 3];
        System.arraycopy(head, 0, bytes, 0, head.length);
        bytes[head.length] = (byte) 0xC3; // a lead byte followed by no continuation byte
        bytes[head.length + 1] = (byte) 'x';
        bytes[head.length + 2] = (byte) ')';
        Files.write(file, bytes);
        InputError error = assertThrows(InputError.class, () -> CertificateReader.readAll(file));
        assertEquals(file + ":2:18: the file is not valid UTF-8 text", error.getMessage());
    }

    @Test
    void aStreamOfBytesIsDecodedStrictly() throws Exception {
        byte[] bytes = "problem t\naxiom a: P(\u00ff)".getBytes(StandardCharsets.ISO_8859_1);
        ProblemReader reader = new ProblemReader("t.problem", new ByteArrayInputStream(bytes), 100);
        assertInstanceOf(ProblemHeader.class, reader.next());
        assertEquals("t.problem:2:12: the file is not valid UTF-8 text",
                assertThrows(InputError.class, reader::next).getMessage());
        byte[] good = "problem t\naxiom a: \u2200x. P(x)".getBytes(StandardCharsets.UTF_8);
        ProblemReader decoded = new ProblemReader("t.problem", new ByteArrayInputStream(good), 100);
        decoded.next();
        assertEquals("(forall x P(x))", Show.formula(((Axiom) decoded.next()).formula()));
    }

    @Test
    void aFailingReadIsAnIOExceptionNotAnInputError() throws Exception {
        Reader broken = new Reader() {
            @Override
            public int read(char[] buffer, int offset, int length) throws IOException {
                throw new IOException("disk on fire");
            }

            @Override
            public void close() {
            }
        };
        ProblemReader reader = new ProblemReader("t.problem", broken);
        assertEquals("disk on fire", assertThrows(IOException.class, reader::next).getMessage());
        assertEquals("disk on fire", assertThrows(IOException.class, reader::next).getMessage());
    }

    @Test
    void openAndCloseAFile(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("p.problem");
        Files.writeString(file, "problem p\naxiom a: P\n");
        try (ProblemReader reader = ProblemReader.open(file)) {
            assertInstanceOf(ProblemHeader.class, reader.next());
            assertInstanceOf(Axiom.class, reader.next());
            assertNull(reader.next());
        }
    }
}
