package dev.assay.report;

import dev.assay.check.CheckResult;
import dev.assay.check.Checker;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class HtmlReportTest {

    static String render(Path problem, Path proof) {
        HtmlReport page = new HtmlReport();
        CheckResult r = new Checker().check(problem, proof, page);
        return page.render(r, "test", "0000", "2026-01-01T00:00:00Z");
    }

    static final Path DEPOT = Path.of("certificates", "depot");

    @Test
    void aVerifiedReportHasEverythingAReviewerNeedsAndNothingFromElsewhere() {
        String html = render(DEPOT.resolve("key_cabinet.problem"), DEPOT.resolve("key_cabinet.proof"));
        for (String part : List.of("theorem", "cdf4bfd9f39809f31470879c1d2fd013fb3a2a555f0ebdbc16e469340e30358e",
                "only that the stated axioms entail the stated goal", "Skolem function", "keys, early_bird",
                "<svg", "forall d. SignedOn(d) implies", "skolemize keys fresh key, cab")) {
            assertTrue(html.contains(part), part);
        }
        assertFalse(html.contains("http"), "no address of anything to load");
        assertFalse(html.contains("<script"), "no script");
        assertFalse(html.contains("<link"), "no external style");
    }

    /** Without Graphviz the built-in layered drawing is used, with the cone highlighted. */
    @Test
    void theBuiltInLayoutIsTheFallback() {
        String before = System.getProperty("assay.graphviz");
        System.setProperty("assay.graphviz", "off");
        try {
            String html = render(DEPOT.resolve("key_cabinet.problem"), DEPOT.resolve("key_cabinet.proof"));
            assertTrue(html.contains("<svg") && html.contains("class=\"node cone\"") && html.contains("class=\"edge cone\""));
            assertFalse(html.contains("Laid out by Graphviz"));
        } finally {
            if (before == null) System.clearProperty("assay.graphviz");
            else System.setProperty("assay.graphviz", before);
        }
    }

    @Test
    void graphvizLaysOutTheGraphWhenInstalled() {
        Assumptions.assumeTrue(Files.isExecutable(Path.of("/usr/bin/dot")), "Graphviz is not installed");
        String html = render(DEPOT.resolve("key_cabinet.problem"), DEPOT.resolve("key_cabinet.proof"));
        assertTrue(html.contains("Laid out by Graphviz") && html.contains("<svg"), html);
        assertFalse(html.contains("http"), "namespace and doctype lines are stripped");
    }

    @Test
    void aRejectionShowsTheLocatedFailure() {
        Path broken = Path.of("certificates", "broken");
        String html = render(broken.resolve("resolve-occurs-check.problem"), broken.resolve("resolve-occurs-check.proof"));
        assertTrue(html.contains("rejected"));
        assertTrue(html.contains("resolve-occurs-check.proof:9:"), "location");
        assertTrue(html.contains("occurs in next(x)"), "reason");
    }

    @Test
    void everyTextFromTheInputIsEscaped(@TempDir Path dir) throws Exception {
        Path problem = dir.resolve("a<b>&\"c'.problem");
        Path proof = dir.resolve("a<b>&\"c'.proof");
        Files.copy(DEPOT.resolve("cab_key.problem"), problem);
        Files.copy(DEPOT.resolve("cab_key.proof"), proof);
        String html = render(problem, proof);
        assertFalse(html.contains("a<b>"), "a raw file name");
        assertTrue(html.contains("a&lt;b&gt;&amp;"), "the escaped file name");
    }

    /** The page renders in a real browser: headless Chromium loads it, lays it out and takes a screenshot. */
    @Test
    void rendersInHeadlessChromium(@TempDir Path dir) throws Exception {
        Path chromium = Path.of("/usr/bin/chromium");
        Assumptions.assumeTrue(Files.isExecutable(chromium), "Debian's chromium is not installed");
        Path page = dir.resolve("report.html");
        Files.writeString(page, render(DEPOT.resolve("key_cabinet.problem"), DEPOT.resolve("key_cabinet.proof")),
                StandardCharsets.UTF_8);
        Path png = dir.resolve("report.png");
        List<String> flags = List.of("--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
                "--disable-background-networking", "--disable-component-update", "--disable-sync",
                "--user-data-dir=" + dir.resolve("profile"));
        Process shot = new ProcessBuilder(concat(chromium.toString(), flags, "--window-size=1200,1400",
                "--screenshot=" + png, page.toUri().toString())).redirectErrorStream(true)
                .redirectOutput(dir.resolve("shot.log").toFile()).start();
        assertTrue(shot.waitFor(90, TimeUnit.SECONDS), "chromium finished");
        assertEquals(0, shot.exitValue(), Files.readString(dir.resolve("shot.log")));
        assertTrue(Files.size(png) > 10_000, "a real screenshot");
        Process dom = new ProcessBuilder(concat(chromium.toString(), flags, "--dump-dom", page.toUri().toString()))
                .redirectOutput(dir.resolve("dom.html").toFile()).redirectError(dir.resolve("dom.log").toFile()).start();
        assertTrue(dom.waitFor(90, TimeUnit.SECONDS));
        String rendered = Files.readString(dir.resolve("dom.html"));
        assertTrue(rendered.contains("Assay check report") && rendered.contains("<svg"), rendered);
    }

    private static List<String> concat(String first, List<String> middle, String... last) {
        List<String> out = new java.util.ArrayList<>();
        out.add(first);
        out.addAll(middle);
        out.addAll(List.of(last));
        return out;
    }
}
