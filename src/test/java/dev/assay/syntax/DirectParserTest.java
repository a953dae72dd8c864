package dev.assay.syntax;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.assay.fuzz.CertificateGen;
import dev.assay.fuzz.FuzzScale;
import dev.assay.fuzz.NearValid;
import dev.assay.fuzz.ProblemGen;
import dev.assay.fuzz.SyntaxGen;
import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The direct parser reads exactly what the generated parser reads: the same statements with the
 * same locations, and, where the text is wrong or over a limit, the same error at the same
 * statement (it hands such a statement over, and the generated parser words the message). Each
 * input is read twice, once by the generated parser alone and once by the direct parser with
 * hand-over, and the two transcripts must be equal. {@code -Dassay.fuzz=long} multiplies the random inputs by
 * {@code assay.fuzz.factor} (see {@link FuzzScale}).
 */
class DirectParserTest {

    private static final int DEPTH = ProblemReader.DEFAULT_MAX_DEPTH;

    /** Every statement's record (locations included), then the error or the end, and where the reader stood. */
    /**
     * A statement with every component and every location, the records' own {@code toString} aside: a name, a literal
     * reference and a term position print only their text there, so a wrong column in one would not show.
     */
    static String render(Object o) {
        if (o instanceof Record r) {
            StringBuilder sb = new StringBuilder(r.getClass().getSimpleName()).append('[');
            java.lang.reflect.RecordComponent[] cs = r.getClass().getRecordComponents();
            for (int i = 0; i < cs.length; i++) {
                try {
                    sb.append(i == 0 ? "" : ", ").append(cs[i].getName()).append('=')
                            .append(render(cs[i].getAccessor().invoke(r)));
                } catch (ReflectiveOperationException e) {
                    throw new AssertionError(e);
                }
            }
            return sb.append(']').toString();
        }
        if (o instanceof List<?> l) {
            StringBuilder sb = new StringBuilder("[");
            for (Object e : l) sb.append(sb.length() == 1 ? "" : ", ").append(render(e));
            return sb.append(']').toString();
        }
        return String.valueOf(o);
    }

    static String transcript(String text, boolean problem, boolean direct, int maxDepth, long maxTermSize) {
        StringBuilder out = new StringBuilder();
        int handOvers = 0;
        try {
            if (problem) {
                ProblemReader reader = new ProblemReader("t.problem", new StringReader(text), maxDepth, maxTermSize, direct);
                try {
                    for (ProblemStatement s; (s = reader.next()) != null; ) out.append(render(s)).append('\n');
                } finally {
                    handOvers = reader.readAfterHandOver();
                }
            } else {
                CertificateReader reader =
                        new CertificateReader("t.proof", new StringReader(text), maxDepth, maxTermSize, direct);
                try {
                    for (CertificateStatement s; (s = reader.next()) != null; ) out.append(render(s)).append('\n');
                } finally {
                    handOvers = reader.readAfterHandOver();
                }
            }
            out.append("end");
        } catch (InputError e) {
            out.append("error ").append(e.getMessage());
        } catch (IOException e) {
            throw new AssertionError(e);
        }
        if (handOvers > 0) {
            // The direct parser gave up on a statement the generated one read: not wrong, since the generated parser
            // then read it, but the two must agree on what is well formed, or the fast path is lost without notice.
            out.append("\n").append(handOvers).append(" statements read only by the generated parser");
        }
        return out.toString();
    }

    static void same(String text, boolean problem, int maxDepth, long maxTermSize) {
        String generated = transcript(text, problem, false, maxDepth, maxTermSize);
        String direct = transcript(text, problem, true, maxDepth, maxTermSize);
        assertEquals(generated, direct, () -> "on input:\n" + text);
    }

    interface Body {
        void run() throws Exception;
    }

    /** Runs a test on the big stack that deep nesting needs in the generated parser. */
    static void onBigStack(Body body) throws Exception {
        BigStack.run(() -> {
            body.run();
            return null;
        });
    }

    static void same(String text, boolean problem) {
        same(text, problem, DEPTH, Long.MAX_VALUE);
    }

    static List<Path> bundledFiles() throws IOException {
        List<Path> files = new ArrayList<>();
        for (Path root : List.of(Path.of("certificates"), Path.of("src/test/resources"))) {
            try (Stream<Path> s = Files.walk(root)) {
                s.filter(Files::isRegularFile)
                        .filter(p -> p.toString().endsWith(".problem") || p.toString().endsWith(".proof"))
                        .sorted().forEach(files::add);
            }
        }
        return files;
    }

    /** The file as text, or null when it is not UTF-8 on purpose (the byte decoder's business, not the parsers'). */
    static String text(Path file) throws IOException {
        byte[] bytes = Files.readAllBytes(file);
        String text = new String(bytes, StandardCharsets.UTF_8);
        return Arrays.equals(text.getBytes(StandardCharsets.UTF_8), bytes) ? text : null;
    }

    @Test
    void everyBundledFileReadsTheSame() throws Exception {
        onBigStack(() -> {
            int n = 0;
            for (Path file : bundledFiles()) {
                String text = text(file);
                if (text == null) continue;
                same(text, file.toString().endsWith(".problem"));
                n++;
            }
            assertTrue(n > 150, "only " + n + " files");
        });
    }

    @Test
    void limitsAreMetAtTheSameStatement() throws Exception {
        onBigStack(() -> {
            // Small limits, so that bundled files meet them: the direct parser must hand over exactly the statements
            // the generated parser refuses, and read the others.
            Random random = new Random(20261202);
            for (Path file : bundledFiles()) {
                String text = text(file);
                if (text == null) continue;
                boolean problem = file.toString().endsWith(".problem");
                same(text, problem, 1 + random.nextInt(6), Long.MAX_VALUE);
                same(text, problem, DEPTH, 1 + random.nextInt(40));
            }
        });
    }

    @Test
    void edgesOfTheGrammar() throws Exception {
        onBigStack(() -> {
            String[] problems = {
                "", "# nothing\n", "problem", "problem p", "problem p q", "problem p\naxiom a: P", "problem p\naxiom a: P Q",
                "problem p\naxiom a: (P", "problem p\naxiom a: P)", "problem p\naxiom a: ()", "problem p\naxiom a: not",
                "problem p\naxiom a: forall. P", "problem p\naxiom a: forall x P(x)", "problem p\naxiom a: ∀x y. ¬P(x) ∧ Q(y)",
                "problem p\naxiom a: a iff b iff c", "problem p\naxiom a: (a iff b) iff c", "problem p\naxiom a: a iff forall x. b iff c",
                "problem p\naxiom a: a implies b implies c", "problem p\naxiom a: a and forall x. P(x) or Q(x)",
                "problem p\naxiom a: not forall x. P(x) or Q", "problem p\naxiom a: f() = c", "problem p\naxiom a: f(x,) = c",
                "problem p\naxiom a: f(x) = ", "problem p\naxiom a: x = y = z", "problem p\naxiom a: x != y", "problem p\naxiom a: x ≠ y",
                "problem p\naxiom a: true and false or ⊤ and ⊥", "problem p\naxiom a: P(f(g(h(c))), d)",
                "problem p\ndeclare function f/2, g/0\ndeclare predicate P/1", "problem p\ndeclare function f/", "problem p\ndeclare f/1",
                "problem p\ndeclare function f/99999999999", "problem p\ndeclare function f/2147483647", "problem p\ngoal g: P\naxiom a: Q",
                "problem p\naxiom step: P", "problem p\naxiom a: P\r\ngoal g: Q\r\n", "\uFEFFproblem p", "problem p\naxiom a: P # c\n# d",
                "problem p\naxiom a: \"s\"", "problem p\naxiom a: P ! Q", "problem p\naxiom a: P(x) -> Q", "problem p problem q",
                "problem p\naxiom a: ((((P))))", "problem p\naxiom a: not not not P", "problem p\naxiom a: P(x😀)",
            };
            for (String p : problems) same(p, true);
            String head = "certificate for p\n";
            String[] certificates = {
                "", "certificate", "certificate for", "certificate for p", head + head, head + "digest \"sha256:"
                    + "ab".repeat(32) + "\"", head + "digest \"sha256:" + "AB".repeat(32) + "\"", head + "digest \"sha256:abc\"",
                head + "digest \"sha256:" + "g".repeat(64) + "\"", head + "digest \"sha512:" + "a".repeat(64) + "\"",
                head + "digest \"unterminated", head + "digest x", head + "step s: clause P by negate g",
                head + "step s: formula not P by negate g", head + "step s: clause false by resolve a.1, b.2",
                head + "step s: clause [x] false by resolve a.1, b.2", head + "step s: clause false or P by resolve a.1, b.2",
                head + "step s: clause [x, y] P(x) or not Q(y) by resolve a.1 {x := f(y)}, b.2 {}",
                head + "step s: clause [] P by clausify a", head + "step s: clause [x,] P by clausify a",
                head + "step s: clause P by resolve a.0, b.1", head + "step s: clause P by resolve a.1 b.1",
                head + "step s: clause P by resolve a.99999999999, b.1", head + "step s: clause P by resolve a.1.2, b.1",
                head + "step s: clause P by factor a.1, a.2 {x := y, z := g(c)}", head + "step s: clause P by factor a.1",
                head + "step s: clause P by instantiate a {x := c}", head + "step s: clause P by instantiate a",
                head + "step s: clause P by instantiate a {}", head + "step s: clause P by instantiate a {x ↦ c}",
                head + "step s: clause P by instantiate a {x = c}",
                head + "step s: clause x = y by paramodulate a.1 -> b.2 @ 1.2.3", head + "step s: clause P by paramodulate a.1 <- b.2 @ 1 {} {y := c}",
                head + "step s: clause P by paramodulate a.1 <- b.2 @ 1 {x := c}", head + "step s: clause P by paramodulate a.1 => b.2 @ 1",
                head + "step s: clause P by paramodulate a.1 -> b.2 @ 0", head + "step s: clause P by paramodulate a.1 -> b.2 @ 1.",
                head + "step s: clause P by paramodulate a.1 -> b.2 @ 1 {} {} {}", head + "step s: clause P by eqres a.1",
                head + "step s: clause P by eqres a.1 {x := c}", head + "step s: clause P by eqfactor a.1, a.2",
                head + "step s: clause x = x by reflexivity", head + "step s: clause x = x by reflexivity a",
                head + "step s: formula exists x. P(x) by skolemize a fresh f, g", head + "step s: formula P by skolemize a",
                head + "step s: formula P by skolemize a fresh", head + "step s: formula P by define fresh d",
                head + "step s: formula P by define d", head + "step s: formula P by abbreviate a using d",
                head + "step s: formula P by abbreviate a d", head + "step s: formula P by nnf a", head + "step s: formula P by nnf",
                head + "step s: formula P by frobnicate a", head + "step s: clause P by", head + "step s: clause P",
                head + "step s clause P by negate g", head + "step: clause P by negate g", head + "forget a, b, c", head + "forget",
                head + "forget a,", head + "forget a b", head + "step s: clause P by negate g\nforget s\nstep t: clause Q by negate g",
                head + "step s: clause P by negate g junk", head + "step s: clause P by negate g\n\n  \n# end", "step s: clause P by negate g",
                head + "digest \"sha256:" + "a".repeat(64) + "\"\n" + "digest \"sha256:" + "a".repeat(64) + "\"",
                head + "step s: clause not not P by negate g", head + "step s: clause (P) by negate g",
                head + "step s: clause P(f(x), g(h(y, z))) = c by negate g", head + "step s: formula (a and b) or (c iff d) by nnf a",
            };
            for (String c : certificates) same(c, false);
        });
    }

    @Test
    void randomProblemsAndCertificatesReadTheSame() throws Exception {
        onBigStack(() -> {
            Random seeds = new Random(20261203);
            for (int i = 0; i < 400 * FuzzScale.factor(); i++) {
                Random random = new Random(seeds.nextLong());
                SyntaxGen g = new SyntaxGen(random, i % 3 == 0 ? 0 : 40);
                ProblemGen.Generated p = ProblemGen.generate(g, 1 + random.nextInt(5), random.nextInt(6));
                byte[] problem = p.text().getBytes(StandardCharsets.UTF_8);
                CertificateGen cg = new CertificateGen(g, p.axioms(), p.goal(), p.goalText());
                String proof = cg.certificate(p.name(), problem, 1 + random.nextInt(12), random.nextInt(5));
                same(p.text(), true);
                same(proof, false);
                same(proof, false, 1 + random.nextInt(8), 1 + random.nextInt(60));
            }
        });
    }

    @Test
    void filesWithMistakesReadTheSame() throws Exception {
        onBigStack(() -> {
            // The fuzzer's near-valid changes (dropped, doubled and swapped tokens, misspelt keywords, huge numbers, deep
            // nesting, stray characters) on every bundled file: nearly all end in an error, which must be the same one.
            Random random = new Random(20261204);
            NearValid mutator = new NearValid(random, FuzzScale.isLong() ? 3_000 : 300);
            int n = 0;
            for (Path file : bundledFiles()) {
                String text = text(file);
                if (text == null) continue;
                boolean problem = file.toString().endsWith(".problem");
                for (int i = 0; i < 4 * FuzzScale.factor(); i++) {
                    NearValid.Mutant m = mutator.mutate(text);
                    String changed = new String(m.bytes(), StandardCharsets.UTF_8);
                    if (!Arrays.equals(changed.getBytes(StandardCharsets.UTF_8), m.bytes())) continue;
                    same(changed, problem);
                    n++;
                }
            }
            assertTrue(n > 450, "only " + n + " mutants");
        });
    }

    @Test
    void randomTokenSoupReadsTheSame() throws Exception {
        onBigStack(() -> {
            // Statements of random tokens after a statement keyword: almost every one is a syntax error somewhere.
            String[] vocabulary = {"step", "forget", "digest", "certificate", "for", "problem", "declare", "axiom", "goal",
                "function", "predicate", "formula", "clause", "by", "fresh", "using", "forall", "exists", "not", "and", "or",
                "implies", "iff", "true", "false", "negate", "nnf", "skolemize", "clausify", "define", "abbreviate",
                "resolve", "factor", "instantiate", "paramodulate", "eqres", "eqfactor", "reflexivity", "x", "P", "f", "a1",
                "0", "1", "12", "\"s\"", "(", ")", ",", ".", ":", "=", "!=", ":=", "[", "]", "{", "}", "->", "<-", "@", "/",
                "¬", "∀", "↦", "!", "#c\n", "\n", "\"open"};
            Random random = new Random(20261205);
            for (int i = 0; i < 3_000 * FuzzScale.factor(); i++) {
                boolean problem = random.nextBoolean();
                StringBuilder text = new StringBuilder(problem ? "problem p\n" : "certificate for p\n");
                int statements = 1 + random.nextInt(3);
                for (int s = 0; s < statements; s++) {
                    String[] starts = problem ? new String[] {"axiom a: ", "goal g: ", "declare function "}
                            : new String[] {"step s: clause ", "step s: formula ", "forget "};
                    text.append(starts[random.nextInt(starts.length)]);
                    int length = random.nextInt(12);
                    for (int t = 0; t < length; t++) {
                        text.append(vocabulary[random.nextInt(vocabulary.length)]).append(random.nextInt(4) == 0 ? "" : " ");
                    }
                    text.append('\n');
                }
                same(text.toString(), problem);
            }
        });
    }

    @Test
    void theDirectParserAcceptsTheUsualSteps() throws Exception {
        onBigStack(() -> {
            // Not a comparison: the fast path must really be taken for ordinary text, or the speed it is for is lost.
            String text = "certificate for p\nstep s: clause [x] P(x) or not Q(f(x), c) by resolve a.1 {x := c}, b.2\n"
                    + "forget s\nstep t: formula forall x. P(x) implies Q by skolemize a fresh k\n";
            ReaderCharStream chars = new ReaderCharStream("t.proof", new StringReader(text));
            DirectParser parser = new DirectParser("t.proof", chars, DEPTH, Long.MAX_VALUE);
            int statements = 0;
            try {
                while (parser.certificateStatement() != null) statements++;
            } catch (DirectParser.Bail bail) {
                throw new AssertionError("the direct parser gave up after " + statements + " statements");
            }
            assertEquals(4, statements);
            same(text, false);
        });
    }
}
