package dev.assay.check;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.Size;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Random bytes and token-level mutants of the bundled certificates never crash the checker, never hang, and every
 * refusal is located. (Whether an accepted mutant is sound is the kernel tests' business; here only robustness.)
 */
class FuzzTest {

    private static final Path PROBLEM = Path.of("certificates", "depot", "key_cabinet.problem");
    private static final Duration LIMIT = Duration.ofSeconds(20);

    /** Runs one check on a thread with a large stack, as the command line does, within a time limit. */
    static CheckResult checkWithin(Path problem, Path proof) throws Exception {
        ExecutorService pool = Executors.newSingleThreadExecutor(r -> new Thread(null, r, "fuzz", 1L << 28));
        try {
            Future<CheckResult> f = pool.submit(() -> new Checker().check(problem, proof));
            return f.get(LIMIT.toSeconds(), TimeUnit.SECONDS);
        } finally {
            pool.shutdownNow();
        }
    }

    static void located(CheckResult r) {
        assertNotNull(r.verdict());
        if (r.failure() != null) {
            assertTrue(r.failure().line() >= 1 && r.failure().column() >= 1, r.failure().render());
            assertTrue(!r.failure().reason().isBlank());
        }
    }

    @Property(tries = 150, seed = "42")
    void randomBytesAreRefusedWithALocatedMessage(@ForAll @Size(max = 400) byte[] bytes) throws Exception {
        Path dir = Files.createTempDirectory("fuzz");
        Path proof = dir.resolve("random.proof");
        Files.write(proof, bytes);
        CheckResult r = checkWithin(PROBLEM, proof);
        located(r);
        assertTrue(r.verdict() == Verdict.INPUT_ERROR || r.verdict() == Verdict.REJECTED, r.verdict().word());
    }

    @Property(tries = 600, seed = "7")
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
        Path dir = Files.createTempDirectory("fuzz");
        Path mutant = dir.resolve("mutant.proof");
        Files.writeString(mutant, String.join("", tokens), StandardCharsets.UTF_8);
        located(checkWithin(CertificatesTest.problemOf(proof), mutant));
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

}
