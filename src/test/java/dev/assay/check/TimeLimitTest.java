package dev.assay.check;

import dev.assay.kernel.Problem;
import dev.assay.syntax.Forget;
import dev.assay.syntax.Step;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Where a check stopped by its time limit says it stopped. The limit interrupts the checking thread (the command's
 * timer does so at the limit); here the interrupt is set at a chosen point, so the place is known.
 */
class TimeLimitTest {

    @AfterEach
    void clearInterrupt() {
        Thread.interrupted();
    }

    private static Path write(Path dir, String name, String text) throws Exception {
        Path p = dir.resolve(name);
        Files.writeString(p, text);
        return p;
    }

    @Test
    void stoppedWhileReadingTheProblemIsPlacedInTheProblem(@TempDir Path dir) throws Exception {
        // The first statement is on line 3, after a comment and a blank line.
        Path problem = write(dir, "rota.problem", "# the night rota\n\nproblem rota\naxiom a: Duty(ines)\n");
        Path proof = write(dir, "rota.proof", "certificate for rota\nstep s: clause Duty(ines) by clausify a\n");
        for (int threads : new int[] {1, 2}) {
            Thread.currentThread().interrupt();
            CheckResult r = new Checker(Checker.Options.defaults().withThreads(threads)).check(problem, proof);
            Thread.interrupted();
            assertEquals(Verdict.TIMEOUT, r.verdict());
            Failure f = r.failure();
            assertEquals(problem.toString(), f.file(), f.toString());
            assertEquals(3, f.line(), f.toString());
            assertEquals(1, f.column(), f.toString());
            assertTrue(f.reason().contains("while reading the problem"), f.reason());
        }
    }

    @Test
    void stoppedDuringTheCertificateIsPlacedAfterTheLastStatementChecked(@TempDir Path dir) throws Exception {
        Path problem = write(dir, "rota.problem", "problem rota\naxiom a: Duty(ines)\naxiom b: Duty(ines) implies Rest(ines)\n");
        StringBuilder proof = new StringBuilder("certificate for rota\nstep a1: clause Duty(ines) by clausify a\n"
                + "step b1: clause not Duty(ines) or Rest(ines) by clausify b\n");
        for (int i = 0; i < 200; i++) proof.append("step r").append(i).append(": clause Rest(ines) by resolve a1.1, b1.1\n");
        Path cert = write(dir, "rota.proof", proof.toString());
        for (int threads : new int[] {1, 2}) {
            // Interrupted right after step r9 (line 13) is accepted.
            CheckResult r = new Checker(Checker.Options.defaults().withThreads(threads)).check(problem, cert,
                    new Checker.Listener() {
                        @Override
                        public void problem(Problem p) {
                        }

                        @Override
                        public void step(Step s, Object conclusion, List<String> premises) {
                            if (s.label().text().equals("r9")) Thread.currentThread().interrupt();
                        }

                        @Override
                        public void forget(Forget f) {
                        }
                    });
            Thread.interrupted();
            assertEquals(Verdict.TIMEOUT, r.verdict());
            Failure f = r.failure();
            assertEquals(cert.toString(), f.file(), f.toString());
            // Either before the next step (line 14) or, when the interrupt met the hand-over from the reading
            // thread, after the step just checked (line 13); never the top of the file.
            assertTrue(f.line() == 14 && f.reason().contains("before this step")
                    || f.line() == 13 && f.reason().contains("after the statement here"), f.toString());
        }
    }
}
