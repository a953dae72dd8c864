package dev.assay.check;

import dev.assay.report.JsonReport;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Limits, reading ahead on a second thread, and parse-only reading. */
class CheckOptionsTest {

    private static final Path ROOT = Path.of("certificates");
    private static final Path PROBLEM = ROOT.resolve("depot/key_cabinet.problem");
    private static final Path PROOF = ROOT.resolve("depot/key_cabinet.proof");

    private static List<Path> allProofs() throws IOException {
        List<Path> out = new ArrayList<>();
        for (String dir : List.of("depot", "broken", "pelletier")) {
            try (Stream<Path> s = Files.list(ROOT.resolve(dir))) {
                s.filter(p -> p.toString().endsWith(".proof")).sorted().forEach(out::add);
            }
        }
        return out;
    }

    private static Options1 opts(int threads) {
        return new Options1(Checker.Options.defaults().withThreads(threads));
    }

    private record Options1(Checker.Options options) {
    }

    @Test
    void oneThreadAndTwoGiveByteIdenticalReports() throws IOException {
        int n = 0;
        for (Path proof : allProofs()) {
            Path problem = Path.of(proof.toString().replace(".proof", ".problem"));
            if (!Files.exists(problem)) continue;
            String one = JsonReport.render(new Checker(opts(1).options()).check(problem, proof), false);
            String two = JsonReport.render(new Checker(opts(2).options()).check(problem, proof), false);
            assertEquals(one, two, proof.toString());
            n++;
        }
        assertTrue(n > 100, "only " + n + " pairs");
    }

    @Test
    void stepCountLimitNamesTheOption() {
        Checker.Options o = new Checker.Options(100, 1L << 30, 1000, 3, 2);
        CheckResult r = new Checker(o).check(PROBLEM, PROOF);
        assertEquals(Verdict.INPUT_ERROR, r.verdict());
        assertEquals(3, r.steps());
        assertTrue(r.failure().reason().contains("more than 3 steps") && r.failure().reason().contains("--max-steps"),
                r.failure().reason());
        assertTrue(r.failure().line() > 1);
    }

    @Test
    void termSizeLimitNamesTheOptionAndTheStatement() {
        Checker.Options o = new Checker.Options(100, 1L << 30, 2, 1000, 1);
        CheckResult r = new Checker(o).check(PROBLEM, PROOF);
        assertEquals(Verdict.INPUT_ERROR, r.verdict());
        assertTrue(r.failure().reason().contains("more than 2 symbol occurrences")
                && r.failure().reason().contains("--max-term-size"), r.failure().reason());
    }

    @Test
    void inputSizeLimitNamesTheFileAndTheOption() throws IOException {
        long size = Files.size(PROOF);
        Checker.Options o = new Checker.Options(100, size - 1, 1000, 1000, 2);
        CheckResult r = new Checker(o).check(PROBLEM, PROOF);
        assertEquals(Verdict.INPUT_ERROR, r.verdict());
        assertEquals(PROOF.toString(), r.failure().file());
        assertTrue(r.failure().reason().contains(size + " bytes") && r.failure().reason().contains("--max-input-size"),
                r.failure().reason());
        Checker.Options enough = new Checker.Options(100, size, 1000, 1000, 2);
        assertEquals(Verdict.THEOREM, new Checker(enough).check(PROBLEM, PROOF).verdict());
    }

    @Test
    void parseOnlyCountsStatementsAndReportsSyntaxErrors() throws IOException {
        Checker.Parsed p = new Checker().parse(PROBLEM, PROOF);
        assertNull(p.failure());
        long expected = 0;
        for (Path f : List.of(PROBLEM, PROOF)) {
            for (String line : Files.readAllLines(f)) {
                String t = line.strip();
                if (t.startsWith("problem ") || t.startsWith("axiom ") || t.startsWith("goal ") || t.startsWith("declare ")
                        || t.startsWith("certificate ") || t.startsWith("digest ") || t.startsWith("step ")
                        || t.startsWith("forget ")) {
                    expected++;
                }
            }
        }
        assertEquals(expected, p.statements());
        assertEquals(Files.size(PROBLEM) + Files.size(PROOF), p.bytes());
        Path bad = Files.createTempFile("bad", ".proof");
        Files.writeString(bad, "certificate for key_cabinet\nstep a: clause P( by clausify x\n");
        Checker.Parsed q = new Checker().parse(PROBLEM, bad);
        assertNotNull(q.failure());
        assertEquals(2, q.failure().line());
    }

    @Test
    void aLaterSyntaxErrorDoesNotHideAnEarlierRejection() throws IOException {
        // Reading ahead must not change which failure is reported: the first in the file wins.
        String text = Files.readString(PROOF);
        int cut = text.indexOf("\nstep ", text.indexOf("\nstep ") + 1);
        String broken = text.substring(0, cut) + "\nstep zz: clause false by resolve nowhere.1, nowhere.1\n"
                + "step (((\n";
        Path p = Files.createTempFile("order", ".proof");
        Files.writeString(p, broken);
        for (int t : new int[] {1, 2}) {
            CheckResult r = new Checker(opts(t).options()).check(PROBLEM, p);
            assertEquals(Verdict.REJECTED, r.verdict(), "threads " + t);
            assertTrue(r.failure().reason().contains("nowhere"), r.failure().reason());
        }
    }
}
