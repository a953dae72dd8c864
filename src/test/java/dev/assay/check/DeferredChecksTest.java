package dev.assay.check;

import dev.assay.bench.Families;
import dev.assay.report.JsonReport;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Checking the steps of one certificate on several threads (three or more threads per check: one reads ahead, the
 * rest run the kernel's deferred checks) must give the report checking in order gives, byte for byte, whichever step
 * fails and whatever follows it in the file. Long certificates are generated, so that the checking thread runs many
 * batches ahead of the checks, and broken at chosen steps.
 */
class DeferredChecksTest {

    /** One thread; reading ahead; reading ahead and one checking thread; and two checking threads. */
    private static final int[] THREADS = {1, 2, 3, 4};
    private static final int STEPS = 6_000;

    @TempDir
    static Path dir;
    static Path problem;
    static List<String> lines;

    @BeforeAll
    static void generate() throws IOException {
        Families.Member m = Families.generate(Families.family("chain"), STEPS, false, true, dir.resolve("chain"));
        problem = m.problem();
        lines = Files.readAllLines(m.proof(), StandardCharsets.UTF_8);
    }

    private static String report(Path problemFile, Path proof, int threads) {
        return JsonReport.render(new Checker(Checker.Options.defaults().withThreads(threads)).check(problemFile, proof),
                false);
    }

    /** Checks {@code text} with every thread count; all reports must be equal; returns the one-thread result. */
    private static CheckResult sameEverywhere(String name, String text) throws IOException {
        Path proof = dir.resolve(name + ".proof");
        Files.writeString(proof, text, StandardCharsets.UTF_8);
        String first = report(problem, proof, 1);
        for (int t : THREADS) assertEquals(first, report(problem, proof, t), name + ", threads " + t);
        // Twice more with the most threads: the race between the checking threads must not show either.
        for (int i = 0; i < 2; i++) assertEquals(first, report(problem, proof, 4), name + ", again");
        return new Checker(Checker.Options.defaults().withThreads(1)).check(problem, proof);
    }

    private static final Pattern GATE = Pattern.compile("gate(\\d)");

    /** The index of the line of step {@code s<k>}. */
    private static int lineOf(int k) {
        for (int i = 0; i < lines.size(); i++) if (lines.get(i).startsWith("step s" + k + ":")) return i;
        throw new IllegalArgumentException("no step s" + k);
    }

    /** Step s<k>'s line with the first gate of its conclusion moved on by one: a conclusion that does not follow. */
    private static String broken(int k) {
        String line = lines.get(lineOf(k));
        int by = line.indexOf(" by ");
        Matcher m = GATE.matcher(line.substring(0, by));
        assertTrue(m.find(), line);
        int g = (Integer.parseInt(m.group(1)) + 1) % 5;
        return line.substring(0, m.start()) + "gate" + g + line.substring(m.end());
    }

    private static String with(int k, String replacement, String tail) {
        List<String> out = new ArrayList<>(lines);
        out.set(lineOf(k), replacement);
        if (tail != null) out.add(lineOf(k) + 1 + (lines.size() - lineOf(k) - 1) / 2, tail);
        return String.join("\n", out) + "\n";
    }

    @Test
    void theWholeChainIsAcceptedAlike() throws IOException {
        CheckResult r = sameEverywhere("whole", String.join("\n", lines) + "\n");
        assertEquals(Verdict.THEOREM, r.verdict());
        assertEquals(STEPS, r.steps());
    }

    @Test
    void aFailedStepIsReportedWhereverItIs() throws IOException {
        // Early (before the first batch is full), inside a batch, on a batch's edge, far on, and near the end.
        for (int k : new int[] {3, 40, 64, 65, 1_000, 2_500, STEPS - 20}) {
            String text = with(k, broken(k), null);
            CheckResult r = sameEverywhere("s" + k, text);
            assertEquals(Verdict.REJECTED, r.verdict(), "s" + k);
            assertEquals("s" + k, r.failure().step());
            assertEquals(lineOf(k) + 1, r.failure().line());
            assertNotNull(r.failure().derived(), "s" + k);
        }
    }

    @Test
    void aFailedStepComesBeforeWhateverFollowsIt() throws IOException {
        int k = 1_500;
        String bad = broken(k);
        // A syntax error, an unknown premise, a label used twice, and a forget of an unknown label, each well after s<k>.
        String[] tails = {
            "step (((",
            "step late1: clause Badge(mira, gate1) by resolve nowhere.1, ring0_c.1",
            "step s7: clause Badge(mira, gate3) by instantiate s6 {p := mira}",
            "forget nothing_here",
        };
        for (int i = 0; i < tails.length; i++) {
            CheckResult r = sameEverywhere("tail" + i, with(k, bad, tails[i]));
            assertEquals(Verdict.REJECTED, r.verdict(), tails[i]);
            assertEquals("s" + k, r.failure().step(), tails[i]);
        }
        // Without the broken step, the later fault itself is what every thread count reports.
        for (int i = 0; i < tails.length; i++) {
            CheckResult r = sameEverywhere("tailonly" + i, with(k, lines.get(lineOf(k)), tails[i]));
            assertTrue(r.verdict() == Verdict.REJECTED || r.verdict() == Verdict.INPUT_ERROR, tails[i]);
            assertTrue(r.failure().line() > lineOf(k) + 1, tails[i]);
        }
    }

    @Test
    void aCertificateThatStopsShortIsRejectedAlike() throws IOException {
        // No empty clause: the whole certificate is checked, then refused; with a broken step, that step is reported.
        List<String> cut = lines.subList(0, lines.size() - 1);
        CheckResult r = sameEverywhere("short", String.join("\n", cut) + "\n");
        assertEquals(Verdict.REJECTED, r.verdict());
        assertTrue(r.failure().reason().contains("no step derives the empty clause"), r.failure().reason());
        List<String> both = new ArrayList<>(cut);
        both.set(lineOf(4_000), broken(4_000));
        CheckResult r2 = sameEverywhere("shortbroken", String.join("\n", both) + "\n");
        assertEquals("s4000", r2.failure().step());
    }

    @Test
    void everyBundledPairGivesTheSameReportOnEveryThreadCount() throws IOException {
        int n = 0;
        for (String sub : List.of("depot", "broken", "pelletier")) {
            try (var s = Files.list(Path.of("certificates", sub))) {
                for (Path proof : s.filter(p -> p.toString().endsWith(".proof")).sorted().toList()) {
                    Path pr = Path.of(proof.toString().replace(".proof", ".problem"));
                    if (!Files.exists(pr)) continue;
                    String one = report(pr, proof, 1);
                    for (int t : THREADS) assertEquals(one, report(pr, proof, t), proof + ", threads " + t);
                    n++;
                }
            }
        }
        assertTrue(n > 100, "only " + n + " pairs");
    }
}
