package dev.assay.check;

import dev.assay.report.JsonReport;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The bundled certificates: every valid pair gets its stated verdict, every broken one its recorded failure. */
class CertificatesTest {

    static final Path ROOT = Path.of("certificates");
    private static final Pattern EXPECTED = Pattern.compile("^# expected verdict: ([a-z ]+?) \\(exit (\\d)\\)", Pattern.MULTILINE);

    static List<Path> validProofs() throws IOException {
        List<Path> out = new ArrayList<>();
        try (Stream<Path> s = Files.walk(ROOT)) {
            s.filter(p -> p.toString().endsWith(".proof"))
                    .filter(p -> !p.startsWith(ROOT.resolve("broken")))
                    .sorted()
                    .forEach(out::add);
        }
        return out;
    }

    static Path problemOf(Path proof) {
        String name = proof.getFileName().toString();
        return proof.resolveSibling(name.substring(0, name.length() - ".proof".length()) + ".problem");
    }

    @TestFactory
    List<DynamicTest> validCertificatesGetTheirVerdict() throws IOException {
        List<DynamicTest> tests = new ArrayList<>();
        for (Path proof : validProofs()) {
            tests.add(DynamicTest.dynamicTest(ROOT.relativize(proof).toString(), () -> {
                String text = Files.readString(proof, StandardCharsets.UTF_8);
                Matcher m = EXPECTED.matcher(text);
                assertTrue(m.find(), proof + " must say '# expected verdict: … (exit N)'");
                CheckResult r = new Checker().check(problemOf(proof), proof);
                assertNull(r.failure(), () -> r.failure().render());
                assertEquals(m.group(1), r.verdict().word());
                assertEquals(Integer.parseInt(m.group(2)), r.exitStatus());
                assertNotNull(r.refutation());
            }));
        }
        assertTrue(tests.size() >= 6, "at least six valid examples");
        return tests;
    }

    record Expectation(String name, int exit, String step, String reason) {
    }

    static List<Expectation> expectations() throws IOException {
        List<Expectation> out = new ArrayList<>();
        try (Stream<Path> s = Files.list(ROOT.resolve("broken"))) {
            for (Path tsv : s.filter(p -> p.getFileName().toString().matches("expected.*\\.tsv")).sorted().toList()) {
                for (String line : Files.readAllLines(tsv, StandardCharsets.UTF_8)) {
                    if (line.isBlank() || line.startsWith("#")) continue;
                    String[] f = line.split("\t");
                    assertEquals(4, f.length, tsv + ": " + line);
                    out.add(new Expectation(f[0], Integer.parseInt(f[1]), f[2], f[3]));
                }
            }
        }
        return out;
    }

    @TestFactory
    List<DynamicTest> brokenCertificatesAreRefusedWithTheRecordedMessage() throws IOException {
        List<DynamicTest> tests = new ArrayList<>();
        for (Expectation e : expectations()) {
            tests.add(DynamicTest.dynamicTest(e.name(), () -> {
                Path dir = ROOT.resolve("broken");
                CheckResult r = new Checker().check(dir.resolve(e.name() + ".problem"), dir.resolve(e.name() + ".proof"));
                assertEquals(e.exit(), r.exitStatus(), () -> r.failure() == null ? "accepted" : r.failure().render());
                assertNotNull(r.failure());
                assertTrue(r.failure().reason().contains(e.reason()),
                        () -> "expected reason containing: " + e.reason() + "\nbut got: " + r.failure().render());
                if (!e.step().equals("-")) assertEquals(e.step(), r.failure().step());
                assertTrue(r.failure().line() >= 1 && r.failure().column() >= 1);
            }));
        }
        assertTrue(tests.size() >= 14);
        return tests;
    }

    @Test
    void everyBrokenPairHasAnExpectation() throws IOException {
        List<String> named = expectations().stream().map(Expectation::name).toList();
        try (Stream<Path> s = Files.list(ROOT.resolve("broken"))) {
            for (Path p : s.filter(x -> x.toString().endsWith(".proof")).sorted().toList()) {
                String name = p.getFileName().toString().replace(".proof", "");
                assertTrue(named.contains(name), name + " has no line in an expected*.tsv");
            }
        }
    }

    @Test
    void reportsAreByteIdenticalFromRunToRun() throws IOException {
        for (Path proof : validProofs()) {
            String a = JsonReport.render(new Checker().check(problemOf(proof), proof), false);
            String b = JsonReport.render(new Checker().check(problemOf(proof), proof), false);
            assertEquals(a, b, proof.toString());
            assertFalse(a.toLowerCase(Locale.ROOT).contains("elapsed"));
        }
    }
}
