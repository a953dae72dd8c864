package dev.assay.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class MainTest {

    record Run(int status, String out, String err) {
        String all() {
            return out + err;
        }
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Run(status, out.toString(), err.toString());
    }

    static void noStackTrace(Run r) {
        assertFalse(r.all().contains("\tat "), r.all());
        assertFalse(r.all().contains("Exception"), r.all());
    }

    @Test
    void checksAValidCertificate() {
        Run r = run("check", "certificates/depot/pit_access.problem", "certificates/depot/pit_access.proof");
        assertEquals(0, r.status(), r.all());
        assertTrue(r.out().contains("verdict: theorem"), r.out());
        assertTrue(r.out().contains("sha256 b395c37a196683d370274a358b9c7a7d5d9032cd2198c9751126eb88ea9d1c88"), r.out());
        assertTrue(r.out().contains("rests on:"), r.out());
        assertTrue(r.out().contains("not used:    isolation"), r.out());
        assertTrue(r.out().contains("digest:      matched"), r.out());
    }

    @Test
    void vacuousExitsWithThree() {
        Run r = run("check", "certificates/depot/vacuous_rota_clash.problem", "certificates/depot/vacuous_rota_clash.proof");
        assertEquals(3, r.status(), r.all());
        assertTrue(r.out().contains("verdict: vacuous"));
    }

    @Test
    void rejectionIsLocatedAndHasNoStackTrace() {
        Run r = run("check", "certificates/broken/resolve-occurs-check.problem",
                "certificates/broken/resolve-occurs-check.proof");
        assertEquals(1, r.status(), r.all());
        assertTrue(r.out().contains("resolve-occurs-check.proof:9:"), r.out());
        assertTrue(r.out().contains("step c3 (resolve)"), r.out());
        assertTrue(r.out().contains("occurs in next(x)"), r.out());
        noStackTrace(r);
    }

    @Test
    void missingFileIsAnInputError(@TempDir Path dir) {
        Run r = run("check", dir.resolve("nope.problem").toString(), dir.resolve("nope.proof").toString());
        assertEquals(2, r.status(), r.all());
        assertTrue(r.out().contains("cannot read the problem file: no such file"), r.out());
        noStackTrace(r);
    }

    @Test
    void directoryAndBinaryInputAreInputErrors(@TempDir Path dir) throws Exception {
        Path bin = dir.resolve("junk.proof");
        Files.write(bin, new byte[] {0, 1, 2, (byte) 0xff, (byte) 0xfe, 10, 13});
        Run r = run("check", "certificates/depot/pit_access.problem", bin.toString());
        assertEquals(2, r.status(), r.all());
        noStackTrace(r);
        Run d = run("check", dir.toString(), bin.toString());
        assertEquals(2, d.status(), d.all());
        noStackTrace(d);
    }

    @Test
    void writesJson(@TempDir Path dir) throws Exception {
        Path json = dir.resolve("r.json");
        Run r = run("check", "certificates/depot/exit_signal.problem", "certificates/depot/exit_signal.proof",
                "--json", json.toString());
        assertEquals(0, r.status(), r.all());
        String text = Files.readString(json, StandardCharsets.UTF_8);
        assertTrue(text.contains("\"verdict\" : \"theorem\""), text);
        assertTrue(text.contains("\"axiomsUsed\""), text);
    }

    @Test
    void aBenchRunThatMeasuresNothingSaysWhyAndFails(@TempDir Path dir) {
        Run r = run("bench", "run", "--families", "corpus", "--corpus", dir.resolve("none").toString(), "--repeat", "1");
        assertEquals(1, r.status(), r.all());
        assertTrue(r.out().contains("Not measured: corpus: no folder " + dir.resolve("none")), r.out());
        noStackTrace(r);
    }

    @Test
    void aTimeLimitStopsTheCheckWithExitFour(@TempDir Path dir) throws Exception {
        StringBuilder problem = new StringBuilder("problem chain\naxiom start: P0\n");
        StringBuilder proof = new StringBuilder("certificate for chain\nstep c0: clause P0 by clausify start\n");
        for (int i = 0; i < 20_000; i++) {
            problem.append("axiom r").append(i).append(": P").append(i).append(" implies P").append(i + 1).append('\n');
            proof.append("step d").append(i).append(": clause not P").append(i).append(" or P").append(i + 1)
                    .append(" by clausify r").append(i).append('\n');
        }
        // Then many small resolution steps, so that the check outlasts the limit on a fast machine too (about a
        // second of checking at 300,000 steps a second).
        for (int i = 0; i < 300_000; i++) proof.append("step e").append(i).append(": clause P1 by resolve c0.1, d0.1\n");
        Files.writeString(dir.resolve("c.problem"), problem);
        Files.writeString(dir.resolve("c.proof"), proof);
        Run r = run("check", "--timeout", "0.2", dir.resolve("c.problem").toString(), dir.resolve("c.proof").toString());
        assertEquals(4, r.status(), r.all());
        assertTrue(r.out().contains("verdict: timeout"), r.out());
        noStackTrace(r);
    }

    @Test
    void helpAndVersion() {
        Run h = run("--help");
        assertEquals(0, h.status());
        assertTrue(h.out().contains("check"), h.out());
        Run v = run("--version");
        assertEquals(0, v.status());
        assertTrue(v.out().startsWith("assay "), v.out());
        Run bad = run("check", "only-one-argument");
        assertEquals(2, bad.status());
        noStackTrace(bad);
    }
}
