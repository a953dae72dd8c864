package dev.assay.prover;

import dev.assay.check.CheckResult;
import dev.assay.check.Checker;
import dev.assay.check.Failure;
import dev.assay.check.Verdict;
import dev.assay.kernel.Problem;
import dev.assay.kernel.TermFactory;
import dev.assay.syntax.InputError;
import dev.assay.syntax.ProblemReader;
import dev.assay.syntax.ProblemStatement;
import dev.assay.syntax.Resolver;

import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;

/**
 * The untrusted reference prover: clausifies a problem, saturates the clauses, and writes the refutation it finds as
 * a certificate, which it checks with the kernel ({@link Checker}) before it puts it where it was asked to. A
 * certificate the kernel rejects is never written: that is a bug in the prover, reported as such.
 */
public final class Prover {

    /** What came of an attempt, with the command's exit status. */
    public enum Status {
        /** A refutation was found, checked by the kernel and written. */
        PROVED(0),
        /** The time or memory limit was reached first. */
        GAVE_UP(4),
        /** No inference is left to do and no refutation was found. */
        SATURATED(5),
        /** The problem file cannot be read, or the certificate cannot be written. */
        INPUT_ERROR(2),
        /** The kernel rejected the prover's own certificate: a bug in the prover. */
        INTERNAL_ERROR(70);

        private final int exitStatus;

        Status(int exitStatus) {
            this.exitStatus = exitStatus;
        }

        public int exitStatus() {
            return exitStatus;
        }
    }

    /** Called now and then during the search with the given clauses so far, the clauses kept, and the time. */
    public interface Progress {
        void report(int given, int kept, long elapsedMillis);
    }

    /**
     * Search settings. {@code selectNegative}: select a negative literal of greatest weight in each clause that has
     * one; {@code ageEvery}: every n-th given clause is the oldest rather than the lightest.
     */
    public record Options(Duration timeout, boolean selectNegative, int ageEvery, Progress progress) {
        public static Options defaults(Duration timeout) {
            return new Options(timeout, true, 5, null);
        }

        public Options withProgress(Progress p) {
            return new Options(timeout, selectNegative, ageEvery, p);
        }
    }

    /**
     * The outcome: {@code message} is one line for the user; {@code verdict} the kernel's verdict on the written
     * certificate (null unless proved); {@code steps} its number of steps.
     */
    public record Outcome(Status status, String message, Verdict verdict, int steps, int given, int kept,
                          int generated, long elapsedMillis, long searchMillis, String reason) {
    }

    private final Options options;
    /** Applied to the certificate text before it is checked; only tests change it, to see a rejection reported. */
    private final java.util.function.UnaryOperator<String> tamper;

    public Prover(Options options) {
        this(options, text -> text);
    }

    Prover(Options options, java.util.function.UnaryOperator<String> tamper) {
        this.options = options;
        this.tamper = tamper;
    }

    public Outcome prove(Path problemPath, Path output) {
        long start = System.nanoTime();
        long deadline = start + Math.max(1, options.timeout().toNanos());
        if (problemPath.toAbsolutePath().normalize().equals(output.toAbsolutePath().normalize())) {
            return failure(Status.INPUT_ERROR, output + ": the certificate would overwrite the problem file", start);
        }
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(problemPath);
        } catch (IOException e) {
            return failure(Status.INPUT_ERROR, problemPath + ": cannot read the problem file: " + describe(e), start);
        }
        TermFactory terms = new TermFactory();
        Problem problem;
        try {
            List<ProblemStatement> statements = new ArrayList<>();
            try (ProblemReader reader = new ProblemReader(problemPath.toString(),
                    new StringReader(new String(bytes, StandardCharsets.UTF_8)))) {
                for (ProblemStatement s = reader.next(); s != null; s = reader.next()) statements.add(s);
            }
            problem = new Resolver(terms).problem(statements);
        } catch (InputError e) {
            return failure(Status.INPUT_ERROR, e.getMessage(), start);
        } catch (IOException e) {
            return failure(Status.INPUT_ERROR, problemPath + ": cannot read the problem file: " + describe(e), start);
        }

        Names names = new Names(problem);
        ProofStep.Counter counter = new ProofStep.Counter();
        List<ProverClause> input = new Clausifier(problem, terms, names, counter).run();
        Saturation.Progress p = options.progress() == null ? null : options.progress()::report;
        Saturation search = new Saturation(terms, names.variablePrefix(), counter,
                new Saturation.Options(options.selectNegative(), options.ageEvery(), deadline, 5_000_000), p);
        Saturation.Result r = search.run(input);
        long ms = (System.nanoTime() - start) / 1_000_000;
        long searchMs = ms;
        switch (r.status()) {
            case TIMEOUT:
                return new Outcome(Status.GAVE_UP, "gave up at the time limit of " + seconds(options.timeout().toMillis())
                        + " after " + r.given() + " given clauses (" + r.kept() + " kept)", null, 0, r.given(), r.kept(),
                        r.generated(), ms, searchMs, "time");
            case MEMORY:
                return new Outcome(Status.GAVE_UP, "gave up for lack of memory after " + r.given() + " given clauses ("
                        + r.kept() + " kept)", null, 0, r.given(), r.kept(), r.generated(), ms, searchMs, "memory");
            case SATURATED:
                return new Outcome(Status.SATURATED, "saturated after " + r.given() + " given clauses without a refutation:"
                        + (problem.goal() == null ? " the axioms" : " the negated goal and the axioms")
                        + " are consistent as far as the prover's calculus can tell, so "
                        + (problem.goal() == null ? "they are not refuted" : "the goal does not follow in that calculus")
                        + "; no certificate written", null, 0, r.given(), r.kept(), r.generated(), ms, searchMs, null);
            default:
                break;
        }
        CertificateWriter.Certificate cert = CertificateWriter.write(problem.name(), sha256(bytes),
                problem.goal() != null, r.empty(), names);
        return checkAndWrite(problemPath, output, cert, problem.goal() != null, r, start, searchMs);
    }

    private Outcome checkAndWrite(Path problemPath, Path output, CertificateWriter.Certificate cert, boolean hasGoal,
                                  Saturation.Result r, long start, long searchMs) {
        Path candidate;
        try {
            candidate = Files.createTempFile("assay-prove-", ".proof");
            Files.writeString(candidate, tamper.apply(cert.text()), StandardCharsets.UTF_8);
        } catch (IOException e) {
            return failure(Status.INPUT_ERROR, "cannot write a temporary file: " + describe(e), start);
        }
        CheckResult check = new Checker().check(problemPath, candidate);
        Verdict expected = !hasGoal ? Verdict.UNSATISFIABLE : cert.restsOnGoal() ? Verdict.THEOREM : Verdict.VACUOUS;
        long ms = (System.nanoTime() - start) / 1_000_000;
        if (check.verdict() != expected) {
            Failure f = check.failure();
            String message = f != null
                    ? "internal error: the kernel rejected the prover's own certificate at " + f.location() + ": "
                    + (f.step() != null ? "step " + f.step() + (f.rule() != null ? " (" + f.rule() + ")" : "") + ": " : "")
                    + f.reason()
                    + (f.stated() != null ? "\n  stated:  " + f.stated() : "")
                    + (f.derived() != null ? "\n  derived: " + f.derived() : "")
                    : "internal error: the kernel's verdict on the prover's own certificate " + candidate + " is "
                    + check.verdict().word() + ", but the prover expected " + expected.word();
            message += "\n  the rejected certificate is kept at " + candidate
                    + "; this is a bug in the prover (please report it with the problem file)";
            return new Outcome(Status.INTERNAL_ERROR, message, check.verdict(), cert.steps(), r.given(), r.kept(),
                    r.generated(), ms, searchMs, null);
        }
        try {
            Path target = output.toAbsolutePath();
            Path dir = target.getParent();
            Path staged = Files.createTempFile(dir, "." + target.getFileName() + ".", ".tmp");
            try {
                Files.copy(candidate, staged, StandardCopyOption.REPLACE_EXISTING);
                try {
                    Files.move(staged, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
                } catch (AtomicMoveNotSupportedException e) {
                    Files.move(staged, target, StandardCopyOption.REPLACE_EXISTING);
                }
            } finally {
                Files.deleteIfExists(staged);
            }
            Files.deleteIfExists(candidate);
        } catch (IOException e) {
            return failure(Status.INPUT_ERROR, output + ": cannot write the certificate: " + describe(e), start);
        }
        String how = check.verdict() == Verdict.VACUOUS
                ? " (vacuous: the axioms alone are contradictory; the refutation does not use the goal)" : "";
        return new Outcome(Status.PROVED, "proved in " + seconds(ms) + " (search " + seconds(searchMs) + ", "
                + r.given() + " given clauses): wrote " + output + ", " + cert.steps() + " steps, checked by the kernel: "
                + check.verdict().word() + how, check.verdict(), cert.steps(), r.given(), r.kept(), r.generated(), ms,
                searchMs, null);
    }

    private static Outcome failure(Status s, String message, long start) {
        long ms = (System.nanoTime() - start) / 1_000_000;
        return new Outcome(s, message, null, 0, 0, 0, 0, ms, ms, null);
    }

    private static String seconds(long ms) {
        return String.format(java.util.Locale.ROOT, "%.1f s", ms / 1000.0);
    }

    private static String describe(IOException e) {
        if (e instanceof java.nio.file.NoSuchFileException) return "no such file";
        if (e instanceof java.nio.file.AccessDeniedException) return "permission denied";
        return e.getClass().getSimpleName() + (e.getMessage() == null ? "" : ": " + e.getMessage());
    }

    private static String sha256(byte[] bytes) {
        return dev.assay.check.Checker.sha256(bytes);
    }
}
