package dev.assay.check;

import dev.assay.fuzz.FuzzScale;
import dev.assay.fuzz.Harness;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.ShrinkingMode;
import net.jqwik.api.constraints.Size;
import net.jqwik.api.lifecycle.AddLifecycleHook;
import net.jqwik.api.lifecycle.AfterContainer;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Random bytes and token-level mutants of the bundled certificates never crash the checker, never hang, and every
 * refusal is located. (Whether an accepted mutant is sound is the kernel tests' business; here only robustness.)
 * The grammar-aware generators are in {@link GrammarFuzzTest}; both scale with {@code -Dassay.fuzz=long}.
 */
@AddLifecycleHook(FuzzScale.class)
class FuzzTest {

    private static final Path PROBLEM = Path.of("certificates", "depot", "key_cabinet.problem");
    private static final Path DIR = tempDir();

    private static Path tempDir() {
        try {
            Path d = Files.createTempDirectory("assay-fuzz");
            d.toFile().deleteOnExit();
            return d;
        } catch (java.io.IOException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Runs one check on a thread with the command line's stack, within a time limit ({@link Harness#LIMIT}). */
    static CheckResult checkWithin(Path problem, Path proof) throws Exception {
        return Harness.check(problem, proof, proof.toString());
    }

    static void located(CheckResult r) {
        Harness.located(r, "fuzz input");
    }

    @Property(tries = 50, seed = "42")
    void randomBytesAreRefusedWithALocatedMessage(@ForAll @Size(max = 400) byte[] bytes) throws Exception {
        Path proof = DIR.resolve("random.proof");
        Files.write(proof, bytes);
        CheckResult r = checkWithin(PROBLEM, proof);
        located(r);
        assertTrue(r.verdict() == Verdict.INPUT_ERROR || r.verdict() == Verdict.REJECTED, r.verdict().word());
        Harness.count("random bytes", r.verdict().word());
        Harness.slowest("random bytes", r.elapsedMillis());
    }

    @Property(tries = 100, seed = "7", shrinking = ShrinkingMode.OFF)
    void tokenMutantsOfValidCertificatesNeverCrash(@ForAll("seeds") long seed) throws Exception {
        List<Path> proofs = CertificatesTest.validProofs();
        Random random = new Random(seed);
        Path proof = proofs.get(random.nextInt(proofs.size()));
        List<String> tokens = tokens(Files.readString(proof, StandardCharsets.UTF_8));
        int edits = 1 + random.nextInt(3);
        for (int e = 0; e < edits && !tokens.isEmpty(); e++) {
            int i = random.nextInt(tokens.size());
            switch (random.nextInt(5)) {
                case 0 -> tokens.remove(i);
                case 1 -> tokens.add(i, tokens.get(random.nextInt(tokens.size())));
                case 2 -> tokens.set(i, tokens.get(random.nextInt(tokens.size())));
                case 3 -> tokens.set(i, Integer.toString(random.nextInt(4)));
                default -> {
                    int j = random.nextInt(tokens.size());
                    String t = tokens.get(i);
                    tokens.set(i, tokens.get(j));
                    tokens.set(j, t);
                }
            }
        }
        Path mutant = DIR.resolve("mutant.proof");
        Files.writeString(mutant, String.join("", tokens), StandardCharsets.UTF_8);
        CheckResult r = checkWithin(CertificatesTest.problemOf(proof), mutant);
        located(r);
        Harness.count("token mutants", r.verdict().word());
        Harness.slowest("token mutants", r.elapsedMillis());
    }

    @net.jqwik.api.Provide
    net.jqwik.api.Arbitrary<Long> seeds() {
        return net.jqwik.api.Arbitraries.longs();
    }

    /** Splits text into identifier, number, punctuation and white-space tokens, keeping every character. */
    static List<String> tokens(String text) {
        List<String> out = new ArrayList<>();
        int i = 0;
        while (i < text.length()) {
            int j = i + 1;
            char c = text.charAt(i);
            if (Character.isLetterOrDigit(c) || c == '_') {
                while (j < text.length() && (Character.isLetterOrDigit(text.charAt(j)) || text.charAt(j) == '_')) j++;
            } else if (Character.isWhitespace(c)) {
                while (j < text.length() && Character.isWhitespace(text.charAt(j))) j++;
            }
            out.add(text.substring(i, j));
            i = j;
        }
        return out;
    }

    @AfterContainer
    static void summary() throws Exception {
        System.out.println("fuzz (" + (FuzzScale.isLong() ? "long run, tries x" + FuzzScale.factor() : "default run")
                + "):\n" + Harness.summary());
        Harness.writeSummary("FuzzTest " + (FuzzScale.isLong() ? "long x" + FuzzScale.factor() : "default"));
    }
}
