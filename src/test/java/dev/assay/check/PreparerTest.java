package dev.assay.check;

import dev.assay.kernel.Clause;
import dev.assay.kernel.Kernel;
import dev.assay.kernel.Printer;
import dev.assay.kernel.Problem;
import dev.assay.kernel.TermFactory;
import dev.assay.report.JsonReport;
import dev.assay.syntax.CertificateStatement;
import dev.assay.syntax.DefineArgs;
import dev.assay.syntax.ProblemReader;
import dev.assay.syntax.ProblemStatement;
import dev.assay.syntax.RawClause;
import dev.assay.syntax.Resolver;
import dev.assay.syntax.SkolemizeArgs;
import dev.assay.syntax.Step;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Names resolved on the reading thread: what is prepared must be what the checker would resolve itself, and what
 * cannot be prepared is left to the checker (whose reports with one thread and two are compared in
 * {@link CheckOptionsTest}).
 */
class PreparerTest {

    private static final String HEADER = "problem yard\n"
            + "axiom parked: forall t. exists b. Bay(t, b)\n"
            + "axiom shunt: forall t b. Bay(t, b) implies Moved(t)\n"
            + "goal moved: Moved(loco)\n";

    /** What reading ahead with a preparer gave for each statement: the statement, and its preparation or null. */
    private record Read(CertificateStatement statement, Preparer.Prepared prepared) {
    }

    private static List<Read> readAhead(Path problemPath, Path proofPath) throws Exception {
        TermFactory terms = new TermFactory();
        List<ProblemStatement> statements = new ArrayList<>();
        try (ProblemReader r = new ProblemReader(problemPath.toString(), Files.newInputStream(problemPath), 100)) {
            for (ProblemStatement s = r.next(); s != null; s = r.next()) statements.add(s);
        }
        Problem problem = new Resolver(terms).problem(statements);
        Kernel kernel = new Kernel(problem, terms);
        List<Read> out = new ArrayList<>();
        try (CertificateSource src = CertificateSource.open(proofPath.toString(), proofPath, 100, 1_000_000, true,
                new Preparer(terms, kernel.signature()))) {
            for (CertificateStatement s = src.next(); s != null; s = src.next()) out.add(new Read(s, src.prepared()));
        }
        return out;
    }

    /** The conclusions of the accepted steps, printed, as the checker on one thread resolved them. */
    private static Map<String, String> checkedOnOneThread(Path problem, Path proof) {
        Map<String, String> out = new HashMap<>();
        new Checker(Checker.Options.defaults().withThreads(1)).check(problem, proof, new Checker.Listener() {
            @Override
            public void problem(Problem p) {
            }

            @Override
            public void step(Step step, Object conclusion, List<String> premises) {
                if (conclusion instanceof Clause c) out.put(step.label().text(), Printer.clause(c));
            }

            @Override
            public void forget(dev.assay.syntax.Forget forget) {
            }
        });
        return out;
    }

    @Test
    void everyClauseStepOfTheBundledCertificatesIsPreparedAsTheCheckerResolvesIt() throws Exception {
        int prepared = 0;
        for (String dir : List.of("depot", "pelletier")) {
            List<Path> proofs;
            try (Stream<Path> s = Files.list(Path.of("certificates", dir))) {
                proofs = s.filter(p -> p.toString().endsWith(".proof")).sorted().toList();
            }
            for (Path proof : proofs) {
                Path problem = Path.of(proof.toString().replace(".proof", ".problem"));
                Map<String, String> reference = checkedOnOneThread(problem, proof);
                int introduced = 0;
                for (Read r : readAhead(problem, proof)) {
                    if (!(r.statement() instanceof Step st)) continue;
                    if (st.args() instanceof SkolemizeArgs a) introduced += a.fresh().size();
                    if (st.args() instanceof DefineArgs) introduced++;
                    if (!(st.conclusion() instanceof RawClause)) {
                        assertNull(r.prepared(), st.label().text());
                        continue;
                    }
                    String where = proof + " " + st.label().text();
                    assertNotNull(r.prepared(), where);
                    assertSame(st, r.prepared().step(), where);
                    assertEquals(reference.get(st.label().text()), Printer.clause(r.prepared().clause()), where);
                    assertEquals(problemSymbols(problem) + introduced, r.prepared().signatureSize(), where);
                    prepared++;
                }
            }
        }
        assertTrue(prepared > 500, "only " + prepared + " clause steps prepared");
    }

    /** The symbols of a problem as the kernel's signature counts them at the start. */
    private static int problemSymbols(Path problem) throws Exception {
        TermFactory terms = new TermFactory();
        List<ProblemStatement> statements = new ArrayList<>();
        try (ProblemReader r = new ProblemReader(problem.toString(), Files.newInputStream(problem), 100)) {
            for (ProblemStatement s = r.next(); s != null; s = r.next()) statements.add(s);
        }
        return new Kernel(new Resolver(terms).problem(statements), terms).signature().size();
    }

    @Test
    void aSkolemSymbolIsKnownToTheStepsAfterItsSkolemizeStep(@TempDir Path dir) throws Exception {
        List<Read> reads = write(dir, "step p1: formula forall t. Bay(t, bay_of(t)) by skolemize parked fresh bay_of\n"
                + "step c1: clause [t] Bay(t, bay_of(t)) by clausify p1\n");
        Preparer.Prepared c1 = reads.get(reads.size() - 1).prepared();
        assertNotNull(c1);
        assertEquals("[t] Bay(t, bay_of(t))", Printer.clause(c1.clause()));
        Preparer.Prepared before = reads.get(reads.size() - 2).prepared();
        assertNull(before, "a skolemize step concludes a formula");
    }

    @Test
    void aStepWithAnUnknownSymbolIsLeftToTheChecker(@TempDir Path dir) throws Exception {
        List<Read> reads = write(dir, "step c1: clause [t, b] not Bay(t, b) or Moved(t) by clausify shunt\n"
                + "step c2: clause Bay(loco, nowhere) by clausify parked\n"
                + "step c3: clause Moved(loco) or Moved(loco, b) by clausify shunt\n"
                + "step c4: clause [t] Moved(t) or Moved(t) by factor c1.2, c1.2\n");
        assertNotNull(prepared(reads, "c1"));
        assertNull(prepared(reads, "c2"), "nowhere is not a symbol");
        assertNull(prepared(reads, "c3"), "Moved used with two arities");
        assertNotNull(prepared(reads, "c4"), "a later step is prepared again");
    }

    @Test
    void afterASkolemizeStepItCannotFollowNothingMoreIsPrepared(@TempDir Path dir) throws Exception {
        List<Read> reads = write(dir, "step c1: clause [t, b] not Bay(t, b) or Moved(t) by clausify shunt\n"
                + "step p1: formula forall t. Bay(t, f(t)) by skolemize parked fresh f, f\n"
                + "step c2: clause [t, b] not Bay(t, b) or Moved(t) by clausify shunt\n");
        assertNotNull(prepared(reads, "c1"));
        assertNull(prepared(reads, "c2"));
    }

    @Test
    void substitutionsArePreparedInTheOrderTheCheckerAsksForThem(@TempDir Path dir) throws Exception {
        List<Read> again = write(dir, "step c1: clause [t, b] not Bay(t, b) or Moved(t) by clausify shunt\n"
                + "step c2: clause [b] Bay(loco, b) by clausify parked\n"
                + "step c3: clause [b] Moved(loco) or Bay(loco, b) by resolve c1.1 {t := loco}, c2.1\n");
        Preparer.Prepared p = prepared(again, "c3");
        assertNotNull(p);
        assertEquals(2, p.substitutions().length);
        assertEquals("{t := loco}", Printer.substitution(p.substitutions()[0]));
        assertNull(p.substitutions()[1]);
    }

    @Test
    void oneThreadAndTwoAgreeOnTheseCertificates(@TempDir Path dir) throws Exception {
        for (String body : List.of(
                "step c1: clause [t, b] not Bay(t, b) or Moved(t) by clausify shunt\n"
                        + "step c2: clause Bay(loco, nowhere) by clausify parked\n",
                "step p1: formula forall t. Bay(t, f(t)) by skolemize parked fresh f, f\n"
                        + "step c2: clause [t] Bay(t, f(t)) by clausify p1\n",
                "step p1: formula forall t. Bay(t, bay_of(t)) by skolemize parked fresh bay_of\n"
                        + "step c1: clause [t] Bay(t, bay_of(t)) by clausify p1\n"
                        + "step c2: clause [t] Bay(t, bay_of(t, t)) by clausify p1\n")) {
            write(dir, body);
            Path problem = dir.resolve("yard.problem");
            Path proof = dir.resolve("yard.proof");
            String one = JsonReport.render(new Checker(Checker.Options.defaults().withThreads(1)).check(problem, proof), false);
            String two = JsonReport.render(new Checker(Checker.Options.defaults().withThreads(2)).check(problem, proof), false);
            assertEquals(one, two, body);
        }
    }

    private static Preparer.Prepared prepared(List<Read> reads, String label) {
        for (Read r : reads) {
            if (r.statement() instanceof Step s && s.label().text().equals(label)) return r.prepared();
        }
        throw new AssertionError("no step " + label);
    }

    private static List<Read> write(Path dir, String steps) throws Exception {
        Path problem = dir.resolve("yard.problem");
        Path proof = dir.resolve("yard.proof");
        Files.writeString(problem, HEADER);
        Files.writeString(proof, "certificate for yard\n" + steps);
        return readAhead(problem, proof);
    }
}
