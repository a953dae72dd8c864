package dev.assay.check;

import dev.assay.fuzz.CertificateGen;
import dev.assay.fuzz.FuzzScale;
import dev.assay.fuzz.Harness;
import dev.assay.fuzz.NearValid;
import dev.assay.fuzz.ProblemGen;
import dev.assay.fuzz.SyntaxGen;
import dev.assay.kernel.Problem;
import dev.assay.kernel.Signature;
import dev.assay.kernel.Symbol;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.ShrinkingMode;
import net.jqwik.api.lifecycle.AddLifecycleHook;
import net.jqwik.api.lifecycle.AfterContainer;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.concurrent.ConcurrentHashMap;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Grammar-aware fuzzing (docs/fuzzing.md): random problems and certificates built from the productions of
 * {@code grammar/*.g4}, random steps after a valid prefix, and near-valid files with one grammar-level change. The
 * checker never throws, never hangs, and locates every refusal; changes that keep the meaning keep the verdict;
 * a stray character or a byte that is not UTF-8 is an input error at its line and column; the command line never
 * prints a stack trace and exits 0 to 4. Seeds are fixed: a failure names its seed and reproduces.
 * {@code -Dassay.fuzz=long} multiplies the tries (see {@link FuzzScale}).
 */
@AddLifecycleHook(FuzzScale.class)
class GrammarFuzzTest {

    private static final Path DIR = tempDir();
    private static final Map<Path, Verdict> ORIGINAL = new ConcurrentHashMap<>();

    private static Path tempDir() {
        try {
            Path d = Files.createTempDirectory("assay-grammar-fuzz");
            d.toFile().deleteOnExit();
            return d;
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
    }

    @Provide
    Arbitrary<Long> seeds() {
        return Arbitraries.longs();
    }

    /** A problem file and a certificate file for one try, and how to say what they are. */
    record Case(Path problem, Path proof, String what) {
    }

    static Case write(String tag, byte[] problem, byte[] proof, String what) throws IOException {
        Path p = DIR.resolve(tag + ".problem");
        Path c = DIR.resolve(tag + ".proof");
        Files.write(p, problem);
        Files.write(c, proof);
        return new Case(p, c, what);
    }

    static CheckResult checked(String property, Case c) throws Exception {
        CheckResult r = Harness.check(c.problem(), c.proof(), c.what());
        Harness.located(r, c.what());
        Harness.lineWithinFile(r, c.problem(), c.proof(), c.what());
        Harness.slowest(property, r.elapsedMillis());
        return r;
    }

    // ---- random problems and certificates from the grammar

    static Case randomCase(long seed, String tag) throws IOException {
        Random random = new Random(seed);
        // Half of the files are clean (every choice as the grammar and the signature want), the others have a
        // slip now and then, at a rate drawn per file.
        int off = switch (random.nextInt(4)) {
            case 0, 1 -> 0;
            case 2 -> 2 + random.nextInt(15);
            default -> 15 + random.nextInt(60);
        };
        SyntaxGen g = new SyntaxGen(random, off);
        ProblemGen.Generated p = ProblemGen.generate(g, 1 + random.nextInt(5), random.nextInt(5));
        byte[] problem = p.text().getBytes(StandardCharsets.UTF_8);
        CertificateGen cg = new CertificateGen(g, p.axioms(), p.goal(), p.goalText());
        String proof = cg.certificate(p.name(), problem, 1 + random.nextInt(12), random.nextInt(4));
        return write(tag, problem, proof.getBytes(StandardCharsets.UTF_8), (off == 0 ? "clean " : "")
                + "random problem and certificate, seed " + seed);
    }

    @Property(tries = 100, seed = "20261201", shrinking = ShrinkingMode.OFF)
    void randomProblemsAndCertificatesAreCheckedWithoutCrash(@ForAll("seeds") long seed) throws Exception {
        Case c = randomCase(seed, "random");
        CheckResult r = checked("random", c);
        if (c.what().startsWith("clean")) {
            // Files made only of what the grammar and a consistent signature allow are read: nothing in them is an
            // input error, whatever the kernel thinks of the steps.
            assertTrue(r.verdict() != Verdict.INPUT_ERROR, () -> c.what() + ": " + r.failure().render());
        }
        Harness.count("random", r.verdict().word() + (r.failure() == null || r.failure().rule() == null ? ""
                : " at " + r.failure().rule()));
    }

    // ---- random steps after a valid prefix: the kernel sees real premises

    static Case prefixCase(long seed, String tag) throws Exception {
        Random random = new Random(seed);
        List<Path> proofs = CertificatesTest.validProofs();
        Path proof = proofs.get(random.nextInt(proofs.size()));
        Path problemPath = CertificatesTest.problemOf(proof);
        String text = Files.readString(proof, StandardCharsets.UTF_8);
        List<Integer> cuts = new ArrayList<>();
        for (int i = text.indexOf("\nstep "); i >= 0; i = text.indexOf("\nstep ", i + 1)) cuts.add(i + 1);
        cuts.add(text.length());
        String prefix = text.substring(0, cuts.get(1 + random.nextInt(cuts.size() - 1)));
        if (!prefix.endsWith("\n")) prefix += "\n";
        Problem problem = problemOf(problemPath);
        List<SyntaxGen.Sym> symbols = new ArrayList<>();
        for (Signature.Entry e : problem.signature().entries()) {
            Symbol s = e.symbol();
            if (!s.isEquality()) symbols.add(new SyntaxGen.Sym(s.name(), s.kind() == Symbol.Kind.FUNCTION ? 'f' : 'p', s.arity()));
        }
        SyntaxGen g = new SyntaxGen(random, 30, symbols);
        List<CertificateGen.Known> axioms = new ArrayList<>();
        for (String a : problem.axioms().keySet()) axioms.add(new CertificateGen.Known(a, false, null));
        CertificateGen cg = new CertificateGen(g, axioms, problem.goalName(), null);
        cg.know(CertificateGen.stepsOf(prefix));
        String steps = cg.steps(1 + random.nextInt(6), 1 + random.nextInt(3));
        return write(tag, Files.readAllBytes(problemPath), (prefix + steps).getBytes(StandardCharsets.UTF_8),
                "random steps after a prefix of " + proof + ", seed " + seed);
    }

    private static final Map<Path, Problem> PROBLEMS = new ConcurrentHashMap<>();

    static Problem problemOf(Path problemPath) {
        return PROBLEMS.computeIfAbsent(problemPath, p -> {
            Problem[] out = new Problem[1];
            new Checker().check(p, null, new Checker.Listener() {
                @Override
                public void problem(Problem problem) {
                    out[0] = problem;
                }

                @Override
                public void step(dev.assay.syntax.Step step, Object conclusion, List<String> premises) {
                }

                @Override
                public void forget(dev.assay.syntax.Forget forget) {
                }
            });
            return out[0];
        });
    }

    @Property(tries = 80, seed = "1912", shrinking = ShrinkingMode.OFF)
    void randomStepsAfterAValidPrefixAreCheckedWithoutCrash(@ForAll("seeds") long seed) throws Exception {
        CheckResult r = checked("prefix", prefixCase(seed, "prefix"));
        Harness.count("prefix", r.verdict().word() + (r.failure() == null || r.failure().rule() == null ? ""
                : " at " + r.failure().rule()));
    }

    // ---- near-valid files: one grammar-level change to a valid problem or certificate

    record Mutated(Case c, NearValid.Mutant mutant, boolean problemChanged, Verdict original) {
    }

    static Mutated nearValidCase(long seed, String tag) throws Exception {
        Random random = new Random(seed);
        List<Path> proofs = CertificatesTest.validProofs();
        Path proof = proofs.get(random.nextInt(proofs.size()));
        Path problem = CertificatesTest.problemOf(proof);
        Verdict original = ORIGINAL.computeIfAbsent(proof, p -> new Checker().check(problem, p).verdict());
        String proofText = Files.readString(proof, StandardCharsets.UTF_8);
        boolean changeProblem = random.nextInt(3) == 0;
        NearValid mutator = new NearValid(random, FuzzScale.maxNesting());
        NearValid.Mutant m;
        byte[] problemBytes = Files.readAllBytes(problem);
        byte[] proofBytes;
        if (changeProblem) {
            m = mutator.mutate(new String(problemBytes, StandardCharsets.UTF_8));
            problemBytes = m.bytes();
            // A changed problem no longer matches a digest; leave the digest out so that the promise still holds.
            proofBytes = proofText.replaceAll("(?m)^digest .*$", "# digest left out").getBytes(StandardCharsets.UTF_8);
        } else {
            m = mutator.mutate(proofText);
            proofBytes = m.bytes();
        }
        Case c = write(tag, problemBytes, proofBytes, "near-valid " + (changeProblem ? "problem " + problem : proof)
                + ": " + m + ", seed " + seed);
        return new Mutated(c, m, changeProblem, original);
    }

    static void keepsItsPromise(Mutated m, CheckResult r) {
        String what = m.c().what();
        switch (m.mutant().promise()) {
            case SAME_VERDICT -> assertEquals(m.original(), r.verdict(),
                    () -> what + ": " + (r.failure() == null ? "" : r.failure().render()));
            case INPUT_ERROR_AT -> {
                assertEquals(Verdict.INPUT_ERROR, r.verdict(), () -> what + ": " + (r.failure() == null ? "" : r.failure().render()));
                Path changed = m.problemChanged() ? m.c().problem() : m.c().proof();
                assertEquals(changed.toString(), r.failure().file(), () -> what + ": " + r.failure().render());
                assertEquals(m.mutant().line() + ":" + m.mutant().column(), r.failure().line() + ":" + r.failure().column(),
                        () -> what + ": " + r.failure().render());
            }
            case NONE -> {
            }
        }
    }

    @Property(tries = 160, seed = "314159", shrinking = ShrinkingMode.OFF)
    void nearValidFilesAreRefusedWhereTheyAreWrong(@ForAll("seeds") long seed) throws Exception {
        Mutated m = nearValidCase(seed, "near");
        CheckResult r = checked("near-valid", m.c());
        keepsItsPromise(m, r);
        Harness.count("near-valid", String.format("%-20s %s", m.mutant().kind(), r.verdict().word()));
    }

    // ---- the command line: no stack trace, exit 0 to 4, input errors located

    @Property(tries = 20, seed = "2718", shrinking = ShrinkingMode.OFF)
    void theCommandLineNeverPrintsAStackTrace(@ForAll("seeds") long seed) throws Exception {
        Random random = new Random(seed);
        Case c = switch (random.nextInt(3)) {
            case 0 -> randomCase(seed, "cli");
            case 1 -> prefixCase(seed, "cli");
            default -> nearValidCase(seed, "cli").c();
        };
        CheckResult r = Harness.check(c.problem(), c.proof(), c.what());
        String[] args = switch (random.nextInt(5)) {
            case 0 -> new String[] {"check", "--brief", c.problem().toString(), c.proof().toString()};
            case 1 -> new String[] {"check", "--json", "-", c.problem().toString(), c.proof().toString()};
            case 2 -> new String[] {"show", c.problem().toString(), c.proof().toString()};
            default -> new String[] {"check", c.problem().toString(), c.proof().toString()};
        };
        Harness.Run run = Harness.cli(c.what(), args);
        Harness.cleanRun(run, r.verdict(), c.what() + " via " + String.join(" ", args));
        Harness.count("command line", args[0] + (args[1].startsWith("--") ? " " + args[1] : "") + " exit " + run.status());
    }

    @Property(tries = 10, seed = "1618", shrinking = ShrinkingMode.OFF)
    void randomProblemsAloneAreShownOrRefusedCleanly(@ForAll("seeds") long seed) throws Exception {
        Case c = randomCase(seed, "alone");
        Harness.Run run = Harness.cli(c.what(), "show", c.problem().toString());
        Harness.cleanRun(run, null, c.what() + " via show");
        assertTrue(run.status() == 0 || run.status() == 2, c.what() + ": show of a problem exits " + run.status());
        Harness.count("show problem", "exit " + run.status());
    }

    // ---- reproducers kept as regression cases

    @Example
    void savedReproducersStayFixed() throws Exception {
        Path root = Path.of("src", "test", "resources", "fuzz");
        List<String> lines = Files.readAllLines(root.resolve("expected.tsv"), StandardCharsets.UTF_8);
        int cases = 0;
        for (String line : lines) {
            if (line.isBlank() || line.startsWith("#")) continue;
            String[] f = line.split("\t");
            assertEquals(5, f.length, "expected.tsv: name, exit status, when, where, what the case is: " + line);
            assertTrue(f[2].equals("default") || f[2].equals("long"), "expected.tsv: when is default or long: " + line);
            if (f[2].equals("long") && !FuzzScale.isLong()) continue;
            Path problem = root.resolve(f[0] + ".problem");
            Path proof = root.resolve(f[0] + ".proof");
            String what = "fuzz reproducer " + f[0] + " (" + f[4] + ")";
            CheckResult r = Harness.check(problem, proof, what);
            Harness.located(r, what);
            assertEquals(Integer.parseInt(f[1]), r.exitStatus(), () -> what + ": " + r.verdict().word()
                    + (r.failure() == null ? "" : " " + r.failure().render()));
            if (f[3].equals("-")) {
                assertTrue(r.failure() == null, () -> what + ": " + r.failure().render());
            } else {
                String[] at = f[3].split(":");
                Path file = at[0].equals("problem") ? problem : proof;
                assertEquals(file + ":" + at[1] + ":" + at[2], r.failure().location(), () -> what + ": " + r.failure().render());
            }
            Harness.cleanRun(Harness.cli(what, "check", problem.toString(), proof.toString()), r.verdict(), what);
            cases++;
        }
        assertTrue(cases >= 1, "at least one reproducer");
    }

    @AfterContainer
    static void summary() throws Exception {
        System.out.println("grammar fuzz (" + (FuzzScale.isLong() ? "long run, tries x" + FuzzScale.factor() : "default run")
                + "):\n" + Harness.summary());
        Harness.writeSummary("GrammarFuzzTest " + (FuzzScale.isLong() ? "long x" + FuzzScale.factor() : "default"));
    }
}
