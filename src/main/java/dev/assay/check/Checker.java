package dev.assay.check;

import dev.assay.kernel.Clause;
import dev.assay.kernel.Fact;
import dev.assay.kernel.Formula;
import dev.assay.kernel.Kernel;
import dev.assay.kernel.Outcome;
import dev.assay.kernel.Problem;
import dev.assay.kernel.Signature;
import dev.assay.kernel.Substitution;
import dev.assay.kernel.Symbol;
import dev.assay.kernel.TermFactory;
import dev.assay.kernel.Variable;
import dev.assay.syntax.AbbreviateArgs;
import dev.assay.syntax.CertificateHeader;
import dev.assay.syntax.CertificateReader;
import dev.assay.syntax.CertificateStatement;
import dev.assay.syntax.ClausifyArgs;
import dev.assay.syntax.DefineArgs;
import dev.assay.syntax.Digest;
import dev.assay.syntax.Direction;
import dev.assay.syntax.EqfactorArgs;
import dev.assay.syntax.EqresArgs;
import dev.assay.syntax.FactorArgs;
import dev.assay.syntax.Forget;
import dev.assay.syntax.InputError;
import dev.assay.syntax.InstantiateArgs;
import dev.assay.syntax.LiteralRef;
import dev.assay.syntax.Location;
import dev.assay.syntax.Name;
import dev.assay.syntax.NegateArgs;
import dev.assay.syntax.NnfArgs;
import dev.assay.syntax.ParamodulateArgs;
import dev.assay.syntax.ProblemReader;
import dev.assay.syntax.RawClause;
import dev.assay.syntax.RawConclusion;
import dev.assay.syntax.RawFormula;
import dev.assay.syntax.RawSubstitution;
import dev.assay.syntax.ReflexivityArgs;
import dev.assay.syntax.Resolver;
import dev.assay.syntax.ResolveArgs;
import dev.assay.syntax.RuleArgs;
import dev.assay.syntax.SkolemizeArgs;
import dev.assay.syntax.Step;
import dev.assay.syntax.StepProblem;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.DigestInputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Runs a certificate through the kernel: reads both files, resolves names, checks labels and premise order,
 * passes every step to its kernel rule, and works out the verdict from the cone of the first empty clause.
 */
public final class Checker {

    /** Rules in the order reports list them. */
    public static final List<String> RULES = List.of("negate", "nnf", "skolemize", "clausify", "define", "abbreviate",
            "resolve", "factor", "instantiate", "paramodulate", "eqres", "eqfactor", "reflexivity");

    /**
     * Limits and threads. Each limit, when reached, ends the check with an input error that names it and the option
     * that raises it. {@code threads} 1 reads and checks on the calling thread; 2 or more read the certificate ahead
     * on a thread of its own. The verdict and the report do not depend on it.
     */
    public record Options(int maxDepth, long maxInputBytes, long maxTermSize, long maxSteps, int threads) {
        public static final long DEFAULT_MAX_INPUT_BYTES = 16L << 30;
        public static final long DEFAULT_MAX_TERM_SIZE = 10_000_000L;
        public static final long DEFAULT_MAX_STEPS = 200_000_000L;

        public Options {
            if (maxDepth < 1 || maxInputBytes < 1 || maxTermSize < 1 || maxSteps < 1 || threads < 1) {
                throw new IllegalArgumentException("limits and threads must be positive");
            }
        }

        public Options(int maxDepth) {
            this(maxDepth, DEFAULT_MAX_INPUT_BYTES, DEFAULT_MAX_TERM_SIZE, DEFAULT_MAX_STEPS, defaultThreads());
        }

        public static Options defaults() {
            return new Options(ProblemReader.DEFAULT_MAX_DEPTH);
        }

        public static int defaultThreads() {
            return defaultThreads(Runtime.getRuntime().availableProcessors(), 1);
        }

        /**
         * The threads each of {@code jobs} checks run at once gets when none were asked for: two (one reads ahead) when
         * there are processors for two per job, else one. Measured on two cores (docs/performance.md): a gate of two
         * jobs with two threads each took 20 % longer than with one thread each, four busy threads sharing two
         * processors.
         */
        public static int defaultThreads(int processors, int jobs) {
            return processors >= 2 * Math.max(1, jobs) ? 2 : 1;
        }

        public Options withThreads(int n) {
            return new Options(maxDepth, maxInputBytes, maxTermSize, maxSteps, n);
        }
    }

    private final Options options;

    public Checker(Options options) {
        this.options = options;
    }

    public Checker() {
        this(Options.defaults());
    }

    /** A failure that ends the check with the given verdict. */
    private static final class Stop extends Exception {
        final Verdict verdict;
        final Failure failure;

        Stop(Verdict verdict, Failure failure) {
            super(failure.reason(), null, false, false);
            this.verdict = verdict;
            this.failure = failure;
        }
    }

    /** A step that may still be used as a premise. */
    private record Live(Fact fact, int id, int line, int column) {
    }

    /** Told of the problem and of each step as the checker understood it, for re-printing. */
    public interface Listener {
        void problem(Problem problem);

        /**
         * {@code conclusion} is the resolved Formula or Clause of an accepted step; {@code premises} are the labels
         * and axiom names it rests on ({@code goal:NAME} for the goal of a negate step).
         */
        void step(Step step, Object conclusion, List<String> premises);

        void forget(Forget forget);

        /**
         * Whether {@link #step} is wanted. A listener that only counts takes {@link #progress} instead and answers
         * false, which leaves the checker free to check steps on several threads (see {@link Options}).
         */
        default boolean wantsSteps() {
            return true;
        }

        /** The number of steps read and passed on to the kernel so far, after each step. */
        default void progress(int steps) {
        }
    }

    private static final Listener SILENT = new Listener() {
        @Override
        public boolean wantsSteps() {
            return false;
        }

        @Override
        public void problem(Problem problem) {
        }

        @Override
        public void step(Step step, Object conclusion, List<String> premises) {
        }

        @Override
        public void forget(Forget forget) {
        }
    };

    /** What reading alone found: the statements of both files, their bytes, the time, or the input error. */
    public record Parsed(long statements, long bytes, long nanos, Failure failure) {
    }

    /**
     * Reads both files as a check does (the same readers and limits, on the calling thread) without resolving names
     * or calling the kernel, so that the cost of parsing can be measured apart from checking.
     */
    public Parsed parse(Path problemPath, Path certificatePath) {
        long start = System.nanoTime();
        String pf = problemPath.toString();
        String cf = certificatePath.toString();
        long statements = 0;
        long bytes = 0;
        try {
            for (Path p : List.of(problemPath, certificatePath)) {
                long size = Files.size(p);
                String tooLarge = tooLarge(p == problemPath ? "problem" : "certificate", size);
                if (tooLarge != null) {
                    return new Parsed(statements, bytes, System.nanoTime() - start, new Failure(p.toString(), 1, 1, null,
                            null, tooLarge, null, null, null));
                }
                bytes += size;
            }
            try (ProblemReader reader = new ProblemReader(pf, Files.newInputStream(problemPath), options.maxDepth(),
                    options.maxTermSize())) {
                while (reader.next() != null) statements++;
            }
            try (CertificateSource source = CertificateSource.open(cf, certificatePath, options.maxDepth(),
                    options.maxTermSize(), false)) {
                while (source.next() != null) statements++;
            }
        } catch (InputError e) {
            Location at = e.at();
            return new Parsed(statements, bytes, System.nanoTime() - start, new Failure(at.file(), at.line(),
                    at.column(), null, null, e.reason(), null, null, null));
        } catch (IOException | InterruptedException e) {
            String file = e instanceof IOException io && io.getMessage() != null && io.getMessage().contains(pf) ? pf : cf;
            return new Parsed(statements, bytes, System.nanoTime() - start, new Failure(file, 1, 1, null, null,
                    "cannot read the file: " + (e instanceof IOException io ? describe(io) : "interrupted"),
                    null, null, null));
        }
        return new Parsed(statements, bytes, System.nanoTime() - start, null);
    }

    /** Why a file of {@code size} bytes is over the input size limit, or null when it is not. */
    private String tooLarge(String what, long size) {
        if (size <= options.maxInputBytes()) return null;
        return "the " + what + " file has " + size + " bytes, more than the input size limit of "
                + options.maxInputBytes() + " (raise it with --max-input-size)";
    }

    public CheckResult check(Path problemPath, Path certificatePath) {
        return check(problemPath, certificatePath, SILENT);
    }

    public CheckResult check(Path problemPath, Path certificatePath, Listener listener) {
        long start = System.nanoTime();
        State st = new State(problemPath.toString(), certificatePath == null ? null : certificatePath.toString());
        st.listener = listener;
        try {
            st.run(problemPath, certificatePath);
        } catch (Stop s) {
            st.verdict = s.verdict;
            st.failure = s.failure;
        } catch (java.io.UncheckedIOException e) {
            st.verdict = Verdict.INPUT_ERROR;
            st.failure = new Failure(st.certificateFile, 1, 1, null, null, e.getMessage() + ": " + describe(e.getCause()),
                    null, null, null);
        } finally {
            st.graph.close();
        }
        long ms = (System.nanoTime() - start) / 1_000_000;
        return st.result(ms);
    }

    private final class State {
        final String problemFile;
        final String certificateFile;
        String problemSha;
        String certificateSha;
        String problemName;
        String digest;
        Verdict verdict;
        Failure failure;
        Kernel kernel;
        Problem problem;
        Resolver resolver;
        /** Steps not forgotten, by label. */
        final Map<String, Live> live = new HashMap<>();
        /** Forgotten steps: where each was written and where it was forgotten. */
        final LabelTable forgotten = new LabelTable();
        /** Premises of every step up to the first empty clause. */
        final ProofGraph graph = new ProofGraph();
        final Map<String, Integer> axiomIndex = new HashMap<>();
        /** Accepted steps by rule name (a one-element array each, counted in place). */
        final Map<String, int[]> byRule = new HashMap<>();
        /** The premises of the step being checked: graph numbers, and names when a listener wants them. */
        int[] premiseIds = new int[4];
        int premiseCount;
        List<String> premiseNames;
        /** Steps accepted in full so far; with deferred checks, counted when a step's check is known to have passed. */
        int steps;
        /** Graph numbers handed out, one per step that passed its first part. */
        int nextId;
        /**
         * With deferred checks: the steps given since the last one known to have passed, oldest first, every rule's
         * step among them (one checked in full has no check), so that counting stays in the order of the steps.
         */
        java.util.ArrayDeque<Pending> window;
        /** The batch being filled for the pool, and how many it holds. */
        dev.assay.kernel.Deferred[] batch;
        int batched;
        CheckPool pool;
        String refutation;
        List<String> used = List.of();
        List<String> unused = List.of();
        boolean goalUsed;
        int coneSize;
        ProofGraph.Cone cone;
        /** The statement being checked, and the certificate file (read again only to locate a forgotten label). */
        Location current;
        Path certificatePath;
        Listener listener = SILENT;

        State(String problemFile, String certificateFile) {
            this.problemFile = problemFile;
            this.certificateFile = certificateFile;
        }

        void run(Path problemPath, Path certificatePath) throws Stop {
            byte[] problemBytes;
            try {
                sizeLimit(problemFile, problemPath, "problem");
                problemBytes = Files.readAllBytes(problemPath);
            } catch (IOException e) {
                if (interrupted(e)) throw stopped(new Location(problemFile, 1, 1), "while reading the problem");
                throw inputError(problemFile, "cannot read the problem file: " + describe(e));
            }
            problemSha = sha256(problemBytes);
            TermFactory terms = new TermFactory();
            resolver = new Resolver(terms);
            try {
                List<dev.assay.syntax.ProblemStatement> statements = new ArrayList<>();
                try (ProblemReader reader = new ProblemReader(problemFile,
                        new java.io.ByteArrayInputStream(problemBytes), options.maxDepth(), options.maxTermSize())) {
                    for (var st = reader.next(); st != null; st = reader.next()) {
                        // A large problem takes a while to read; the time limit is looked at once per statement.
                        if (Thread.currentThread().isInterrupted()) {
                            throw stopped(st.at(), "while reading the problem, at this statement");
                        }
                        statements.add(st);
                    }
                }
                problem = resolver.problem(statements);
                if (Thread.currentThread().isInterrupted()) {
                    throw stopped(new Location(problemFile, 1, 1), "after reading the problem, before the certificate");
                }
            } catch (InputError e) {
                throw inputError(e);
            } catch (IOException e) {
                throw inputError(problemFile, "cannot read the problem file: " + describe(e));
            }
            problemName = problem.name();
            int k = 0;
            for (String a : problem.axioms().keySet()) axiomIndex.put(a, k++);
            listener.problem(problem);
            if (listener.wantsSteps()) premiseNames = new ArrayList<>();
            if (certificatePath == null) return;
            this.certificatePath = certificatePath;
            int workers = checkWorkers();
            kernel = new Kernel(problem, terms, workers > 0);
            if (workers > 0) {
                window = new java.util.ArrayDeque<>();
                batch = new dev.assay.kernel.Deferred[CheckPool.BATCH];
                pool = new CheckPool(workers);
            }
            CertificateSource source;
            try {
                sizeLimit(certificateFile, certificatePath, "certificate");
                source = CertificateSource.open(certificateFile, certificatePath, options.maxDepth(),
                        options.maxTermSize(), options.threads() > 1);
            } catch (IOException e) {
                if (interrupted(e)) throw stopped(new Location(certificateFile, 1, 1), "while opening the certificate");
                throw inputError(certificateFile, "cannot read the certificate file: " + describe(e));
            }
            try (source; CheckPool p = pool) {
                // The reader enforces the order of the file (the header first and once, the digest right after it).
                last = new Location(certificateFile, 1, 1);
                while (someStatements(source)) {
                    // Batches keep the compiled form of this loop small (see someStatements).
                }
                certificateSha = source.sha256();
                settleWindow();
                finish(last);
            } catch (Stop s) {
                throw earlier(s);
            } catch (InterruptedException e) {
                throw earlier(stoppedInCertificate());
            } catch (IOException e) {
                if (interrupted(e)) throw earlier(stoppedInCertificate());
                throw earlier(inputError(certificateFile, "cannot read the certificate file: " + describe(e)));
            }
        }

        /** Threads for deferred checks: none unless the options ask for more threads than reading ahead takes. */
        private int checkWorkers() {
            if (listener.wantsSteps()) return 0;
            return Math.max(0, options.threads() - 2);
        }

        /** A step given since the last one known to have passed: its check (null when checked in full) and where. */
        private record Pending(dev.assay.kernel.Deferred check, String label, String rule, Location ruleAt,
                               Location stepAt) {
        }

        /** How many steps the checking thread may be ahead of the checks before it runs the oldest itself. */
        private static final int WINDOW = 16 * CheckPool.BATCH;

        /** Takes a step that passed its first part into the window; its check, if any, goes to the pool. */
        private void pending(Step s, String rule, dev.assay.kernel.Deferred check) throws Stop {
            window.addLast(new Pending(check, s.label().text(), rule, s.rule().at(), s.at()));
            if (check != null) {
                batch[batched++] = check;
                if (batched == batch.length) handOver();
            }
            reap();
            while (window.size() > WINDOW) {
                // Too far ahead: run a batch no thread has started (not the oldest check, which a pool thread is
                // most likely running), or, when there is none, wait for the oldest.
                handOver();
                dev.assay.kernel.Deferred[] stolen = pool.steal();
                if (stolen != null) {
                    if (!CheckPool.run(stolen)) return;
                } else {
                    Pending head = window.peekFirst();
                    try {
                        Outcome.Rejected r = head.check() == null ? null : head.check().outcome();
                        if (r != null) throw rejected(head, r);
                    } catch (InterruptedException e) {
                        // The time limit: the next step sees the flag and stops.
                        Thread.currentThread().interrupt();
                        return;
                    }
                }
                reap();
            }
        }

        private void handOver() {
            if (batched == 0) return;
            pool.submit(batch);
            batch = new dev.assay.kernel.Deferred[CheckPool.BATCH];
            batched = 0;
        }

        /** Counts the steps at the head of the window whose checks have passed; the first that failed ends the check. */
        private void reap() throws Stop {
            Stop failed;
            try {
                failed = drain(false);
            } catch (InterruptedException e) {
                // Without waiting, only done checks are asked, and a done check does not wait.
                Thread.currentThread().interrupt();
                throw new IllegalStateException("a done check waited", e);
            }
            if (failed != null) throw failed;
        }

        /**
         * Counts the steps of the window, oldest first, while their checks pass: waiting for each with {@code wait},
         * else stopping at the first not done. The rejection of the first that failed, or null.
         */
        private Stop drain(boolean wait) throws InterruptedException {
            for (Pending p; (p = window.peekFirst()) != null; window.pollFirst(), confirmed(p.rule())) {
                if (p.check() == null) continue;
                if (!wait && !p.check().isDone()) return null;
                Outcome.Rejected r = p.check().outcome();
                if (r != null) return rejected(p, r);
            }
            return null;
        }

        /** Waits for every step in the window; the first that failed ends the check. Then the kernel must agree. */
        private void settleWindow() throws Stop, InterruptedException {
            if (window == null) return;
            handOver();
            Stop failed = drain(true);
            if (failed != null) throw failed;
            if (kernel.settle() != null) throw new IllegalStateException("the kernel holds a failed check the window missed");
        }

        /**
         * What ends the check when {@code stop} was met with steps still in the window: a step before it whose check
         * failed, as checking in order would have found first; at the time limit, the first step not yet checked,
         * without waiting for it; otherwise {@code stop} itself. Each step before that passed is counted, as checking
         * in order would have counted it.
         */
        private Stop earlier(Stop stop) {
            if (window == null || window.isEmpty()) return stop;
            handOver();
            boolean timeUp = stop.verdict == Verdict.TIMEOUT || Thread.currentThread().isInterrupted();
            try {
                Stop failed = drain(!timeUp);
                if (failed != null) return failed;
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                return earlier(stop);
            }
            Pending p = window.peekFirst();
            if (p == null) return stop;
            return new Stop(Verdict.TIMEOUT, new Failure(p.stepAt().file(), p.stepAt().line(), p.stepAt().column(),
                    p.label(), null, "the check was stopped at its time limit before this step", null, null, null));
        }

        /** A deferred check's rejection: checking in order would have stopped there, before the file was read whole. */
        private Stop rejected(Pending p, Outcome.Rejected r) {
            certificateSha = null;
            return rejected(p.ruleAt(), p.label(), r);
        }

        private Stop rejected(Location ruleAt, String label, Outcome.Rejected r) {
            return new Stop(Verdict.REJECTED, new Failure(ruleAt.file(), ruleAt.line(), ruleAt.column(), label, r.rule(),
                    r.reason(), r.stated(), r.derived(), null));
        }

        /** Counts a step whose check has passed. */
        private void confirmed(String rule) {
            steps++;
            byRule.computeIfAbsent(rule, r -> new int[1])[0]++;
        }

        /** Where the last statement read begins. */
        private Location last;

        /**
         * Checks the next {@value #BATCH} statements, or fewer at the end; false once the certificate has ended. A
         * method of its own so that the just-in-time compiler compiles it whole once, rather than compiling the loop
         * of {@link #run} in place with everything it calls, twice over.
         */
        private boolean someStatements(CertificateSource source) throws Stop, IOException, InterruptedException {
            for (int i = 0; i < BATCH; i++) {
                CertificateStatement s;
                try {
                    s = source.next();
                } catch (InputError e) {
                    certificateSha = source.sha256();
                    throw inputError(e);
                }
                if (s == null) return false;
                last = s.at();
                statement(s);
            }
            return true;
        }

        private static final int BATCH = 16;

        /** Stopped at the time limit while the certificate was read: at the last statement read, if any. */
        private Stop stoppedInCertificate() {
            return stopped(last, last.line() == 1 && last.column() == 1 ? "while reading the certificate"
                    : "while reading the certificate, after the statement here");
        }

        private Stop stopped(Location at, String when) {
            return new Stop(Verdict.TIMEOUT, new Failure(at.file(), at.line(), at.column(), null, null,
                    "the check was stopped at its time limit " + when, null, null, null));
        }

        /** Whether a failed read was the time limit's interrupt rather than the file. */
        private static boolean interrupted(IOException e) {
            return e instanceof java.nio.channels.ClosedByInterruptException || Thread.currentThread().isInterrupted();
        }

        private void sizeLimit(String file, Path path, String what) throws IOException, Stop {
            String why = tooLarge(what, Files.size(path));
            if (why != null) throw inputError(file, why);
        }

        void statement(CertificateStatement s) throws Stop {
            current = s.at();
            if (s instanceof CertificateHeader h) {
                if (!h.problem().text().equals(problem.name())) {
                    throw inputError(h.problem().at(), "this certificate is for problem " + h.problem().text()
                            + " but the problem file is " + problem.name());
                }
            } else if (s instanceof Digest d) {
                if (!d.sha256().equalsIgnoreCase(problemSha)) {
                    digest = "mismatch";
                    throw inputError(d.at(), "the problem file does not match the certificate's digest: the file's"
                            + " SHA-256 is " + problemSha + ", the digest says " + d.sha256().toLowerCase());
                }
                digest = "matched";
            } else if (s instanceof Forget f) {
                for (Name n : f.labels()) {
                    Live l = live.remove(n.text());
                    if (l != null) {
                        forgotten.add(n.text());
                    } else if (locate(n.text()) == null) {
                        throw reject(n.at(), null, "forget", "forget names " + n.text() + ", which is not an earlier step");
                    }
                }
                listener.forget(f);
            } else {
                step((Step) s);
            }
        }

        /** Where a step of this label was written, or null when there is none yet. */
        private Location written(String label) throws Stop {
            Live l = live.get(label);
            if (l != null) return new Location(certificateFile, l.line(), l.column());
            Location[] p = locate(label);
            return p == null ? null : p[0];
        }

        /**
         * For a forgotten label: where its step was written and where it was first forgotten, found by reading the
         * file again up to the statement being checked; null when the label was never forgotten. The fingerprint
         * table only says when this reading is needed.
         */
        private Location[] locate(String label) throws Stop {
            if (!forgotten.mayContain(label)) return null;
            Location step = null;
            try (CertificateSource again = CertificateSource.open(certificateFile, certificatePath, options.maxDepth(),
                    options.maxTermSize(), false)) {
                for (CertificateStatement s = again.next(); s != null; s = again.next()) {
                    if (s.at().equals(current)) break;
                    if (s instanceof Step st && step == null && st.label().text().equals(label)) step = st.label().at();
                    if (s instanceof Forget f && step != null) {
                        for (Name n : f.labels()) if (n.text().equals(label)) return new Location[] {step, n.at()};
                    }
                }
            } catch (IOException | InputError | InterruptedException e) {
                throw inputError(certificateFile, "cannot read the certificate file again to locate " + label + ": "
                        + (e instanceof IOException io ? describe(io) : e.getMessage()));
            }
            return null;
        }

        void step(Step s) throws Stop {
            if (Thread.currentThread().isInterrupted()) {
                throw new Stop(Verdict.TIMEOUT, new Failure(s.at().file(), s.at().line(), s.at().column(),
                        s.label().text(), null, "the check was stopped at its time limit before this step", null, null, null));
            }
            String label = s.label().text();
            String rule = s.args().ruleName();
            if (nextId >= options.maxSteps()) {
                throw inputError(s.at(), "the certificate has more than " + options.maxSteps()
                        + " steps, the step count limit (raise it with --max-steps)");
            }
            Location before = written(label);
            if (before != null) {
                throw reject(s.label().at(), label, rule, "the label " + label + " is used twice (first at " + before + ")");
            }
            if (axiomIndex.containsKey(label) || label.equals(problem.goalName())) {
                throw reject(s.label().at(), label, rule, "the label " + label + " is the name of a problem "
                        + (label.equals(problem.goalName()) ? "goal" : "axiom"));
            }
            if (window != null && (rule.equals("skolemize") || rule.equals("define"))) {
                // These extend the signature, which a report lists: the steps before must have passed first.
                try {
                    settleWindow();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    throw earlier(new Stop(Verdict.TIMEOUT, new Failure(s.at().file(), s.at().line(), s.at().column(),
                            label, null, "the check was stopped at its time limit before this step", null, null, null)));
                }
            }
            premiseCount = 0;
            if (premiseNames != null) premiseNames.clear();
            Outcome o;
            try {
                o = apply(s, label, premiseNames);
            } catch (InputError e) {
                throw inputError(e);
            } catch (StepProblem p) {
                throw reject(p.at(), label, rule, p.reason());
            }
            if (o instanceof Outcome.Rejected r) throw rejected(s.rule().at(), label, r);
            Fact fact = ((Outcome.Accepted) o).fact();
            int id = nextId++;
            if (window == null || (window.isEmpty() && fact.pending() == null)) confirmed(rule);
            else pending(s, rule, fact.pending());
            live.put(label, new Live(fact, id, s.label().at().line(), s.label().at().column()));
            if (refutation == null) {
                graph.add(premiseIds, premiseCount);
                if (fact.isEmptyClause()) {
                    refutation = label;
                    cone = graph.cone();
                    graph.close();
                }
            }
            if (premiseNames != null) {
                listener.step(s, fact.isClause() ? fact.clause() : fact.formula(), List.copyOf(premiseNames));
            }
            listener.progress(nextId);
        }

        private void premiseId(int id) {
            if (premiseCount == premiseIds.length) premiseIds = java.util.Arrays.copyOf(premiseIds, premiseCount * 2);
            premiseIds[premiseCount++] = id;
        }

        private Outcome apply(Step s, String label, List<String> premises) throws Stop, InputError, StepProblem {
            RuleArgs args = s.args();
            Signature sig = kernel.signature();
            String rule = args.ruleName();
            if (args instanceof NegateArgs a) {
                Name g = a.goal();
                if (problem.goal() == null || !g.text().equals(problem.goalName())) {
                    throw reject(g.at(), label, rule, g.text() + " is not the problem's goal"
                            + (problem.goal() == null ? " (the problem has none)" : " (" + problem.goalName() + ")"));
                }
                premiseId(ProofGraph.GOAL);
                if (premises != null) premises.add("goal:" + g.text());
                return kernel.negate(label, g.text(), formula(s, sig, List.of()));
            }
            if (args instanceof NnfArgs a) {
                Fact p = premise(a.premise(), label, rule, premises);
                return kernel.nnf(label, p, formula(s, sig, List.of()));
            }
            if (args instanceof SkolemizeArgs a) {
                Fact p = premise(a.premise(), label, rule, premises);
                RawFormula raw = rawFormula(s);
                List<Symbol> fresh = resolver.freshSymbols(raw, a.fresh(), sig);
                Outcome o = kernel.skolemize(label, p, fresh, resolver.stepFormula(raw, sig, a.fresh()));
                if (o.accepted()) for (int i = 0; i < fresh.size(); i++) resolver.introduced(fresh.get(i), a.fresh().get(i).at());
                return o;
            }
            if (args instanceof ClausifyArgs a) {
                Fact p = premise(a.premise(), label, rule, premises);
                Clause c = clause(s, sig);
                return kernel.clausify(label, p, subst(a.theta(), sig, c), c);
            }
            if (args instanceof DefineArgs a) {
                RawFormula raw = rawFormula(s);
                List<Symbol> fresh = resolver.freshSymbols(raw, List.of(a.fresh()), sig);
                Outcome o = kernel.define(label, fresh.get(0), resolver.stepFormula(raw, sig, List.of(a.fresh())));
                if (o.accepted()) resolver.introduced(fresh.get(0), a.fresh().at());
                return o;
            }
            if (args instanceof AbbreviateArgs a) {
                Fact p = premise(a.premise(), label, rule, premises);
                Fact d = premise(a.definition(), label, rule, premises);
                return kernel.abbreviate(label, p, d, formula(s, sig, List.of()));
            }
            if (args instanceof ResolveArgs a) {
                Fact x = premise(a.left().label(), label, rule, premises);
                Fact y = premise(a.right().label(), label, rule, premises);
                Clause c = clause(s, sig);
                return kernel.resolve(label, x, a.left().index(), subst(a.leftSubst(), sig, c), y, a.right().index(),
                        subst(a.rightSubst(), sig, c), c);
            }
            if (args instanceof FactorArgs a) {
                Fact x = sameStep(a.first(), a.second(), label, rule, premises);
                Clause c = clause(s, sig);
                return kernel.factor(label, x, a.first().index(), a.second().index(), subst(a.subst(), sig, c), c);
            }
            if (args instanceof InstantiateArgs a) {
                Fact x = premise(a.premise(), label, rule, premises);
                Clause c = clause(s, sig);
                return kernel.instantiate(label, x, subst(a.subst(), sig, c), c);
            }
            if (args instanceof ParamodulateArgs a) {
                Fact x = premise(a.from().label(), label, rule, premises);
                Fact y = premise(a.into().label(), label, rule, premises);
                Clause c = clause(s, sig);
                int[] path = a.position().path().stream().mapToInt(Integer::intValue).toArray();
                return kernel.paramodulate(label, x, a.from().index(), a.direction() == Direction.LEFT_TO_RIGHT, y,
                        a.into().index(), path, subst(a.fromSubst(), sig, c), subst(a.intoSubst(), sig, c), c);
            }
            if (args instanceof EqresArgs a) {
                Fact x = premise(a.literal().label(), label, rule, premises);
                Clause c = clause(s, sig);
                return kernel.eqres(label, x, a.literal().index(), subst(a.subst(), sig, c), c);
            }
            if (args instanceof EqfactorArgs a) {
                Fact x = sameStep(a.first(), a.second(), label, rule, premises);
                Clause c = clause(s, sig);
                return kernel.eqfactor(label, x, a.first().index(), a.second().index(), subst(a.subst(), sig, c), c);
            }
            if (args instanceof ReflexivityArgs) {
                return kernel.reflexivity(label, clause(s, sig));
            }
            throw new IllegalStateException("unhandled rule " + rule);
        }

        private Fact sameStep(LiteralRef x, LiteralRef y, String label, String rule, List<String> premises)
                throws Stop {
            if (!x.label().text().equals(y.label().text())) {
                throw reject(y.at(), label, rule, rule + " works on two literals of one clause, not " + x + " and " + y);
            }
            return premise(x.label(), label, rule, premises);
        }

        private RawFormula rawFormula(Step s) throws Stop {
            if (s.conclusion() instanceof RawFormula f) return f;
            throw reject(s.conclusion().at(), s.label().text(), s.args().ruleName(),
                    s.args().ruleName() + " concludes a formula; write 'formula', not 'clause'");
        }

        private Formula formula(Step s, Signature sig, List<Name> fresh) throws Stop, InputError, StepProblem {
            return resolver.stepFormula(rawFormula(s), sig, fresh);
        }

        private Clause clause(Step s, Signature sig) throws Stop, InputError, StepProblem {
            RawConclusion c = s.conclusion();
            if (c instanceof RawClause rc) return resolver.stepClause(rc, sig);
            throw reject(c.at(), s.label().text(), s.args().ruleName(),
                    s.args().ruleName() + " concludes a clause; write 'clause', not 'formula'");
        }

        private Substitution subst(RawSubstitution raw, Signature sig, Clause conclusion)
                throws InputError, StepProblem {
            if (raw == null) return null;
            // Only asked whether it holds a variable: the list itself for a few, a set for many.
            List<Variable> vars = conclusion.variables();
            return resolver.substitution(raw, sig, vars.size() <= 16 ? vars : new HashSet<>(vars));
        }

        private Fact premise(Name n, String label, String rule, List<String> premises) throws Stop {
            String name = n.text();
            Live l = live.get(name);
            if (l != null) {
                premiseId(l.id());
                if (premises != null) premises.add(name);
                return l.fact();
            }
            Location[] gone = locate(name);
            if (gone != null) {
                throw reject(n.at(), label, rule, name + " was forgotten at " + gone[1] + " and cannot be used again");
            }
            Fact ax = kernel.axiom(name);
            if (ax != null) {
                premiseId(ProofGraph.axiom(axiomIndex.get(name)));
                if (premises != null) premises.add(name);
                return ax;
            }
            if (name.equals(problem.goalName())) {
                throw reject(n.at(), label, rule, "the goal " + name + " is never a premise: only negate may name it");
            }
            if (name.equals(label)) throw reject(n.at(), label, rule, "step " + label + " cannot use itself");
            throw reject(n.at(), label, rule, "unknown premise " + name + ": neither an earlier step nor an axiom"
                    + " (premises must come before the step that uses them)");
        }

        void finish(Location last) throws Stop {
            if (refutation == null) {
                throw reject(last, null, null, "no step derives the empty clause false, so nothing is refuted");
            }
            // The cone: every step the first empty clause rests on (computed when that step was accepted).
            goalUsed = cone.goal();
            coneSize = cone.steps();
            List<String> u = new ArrayList<>();
            List<String> nu = new ArrayList<>();
            for (String a : problem.axioms().keySet()) (cone.axioms().get(axiomIndex.get(a)) ? u : nu).add(a);
            used = u;
            unused = nu;
            if (problem.goal() == null) verdict = Verdict.UNSATISFIABLE;
            else verdict = goalUsed ? Verdict.THEOREM : Verdict.VACUOUS;
        }

        CheckResult result(long ms) {
            Map<String, Integer> ordered = new LinkedHashMap<>();
            for (String r : RULES) if (byRule.containsKey(r)) ordered.put(r, byRule.get(r)[0]);
            List<IntroducedSymbol> introduced = new ArrayList<>();
            if (kernel != null) {
                for (Signature.Entry e : kernel.signature().introduced()) {
                    boolean skolem = e.origin() == Signature.Origin.SKOLEM;
                    introduced.add(new IntroducedSymbol(e.symbol().name(), skolem ? "Skolem function" : "defined predicate",
                            e.symbol().arity(), e.step(), skolem ? "skolemize" : "define"));
                }
            }
            boolean ok = verdict == Verdict.THEOREM || verdict == Verdict.UNSATISFIABLE || verdict == Verdict.VACUOUS;
            return new CheckResult(verdict, problemFile, problemSha, certificateFile, certificateSha, problemName,
                    digest == null ? "absent" : digest, steps, ordered, ok ? refutation : null, ok ? coneSize : 0,
                    ok ? used : List.of(), ok ? unused : List.of(), ok && goalUsed, introduced, failure, ms);
        }

        private Stop reject(Location at, String step, String rule, String reason) {
            return new Stop(Verdict.REJECTED, new Failure(at.file(), at.line(), at.column(), step, rule, reason,
                    null, null, null));
        }
    }

    private static Stop inputError(InputError e) {
        Location at = e.at();
        Location other = e.firstDeclared();
        return new Stop(Verdict.INPUT_ERROR, new Failure(at.file(), at.line(), at.column(), null, null, e.reason(),
                null, null, other == null ? null : other.toString()));
    }

    private static Stop inputError(Location at, String reason) {
        return new Stop(Verdict.INPUT_ERROR, new Failure(at.file(), at.line(), at.column(), null, null, reason,
                null, null, null));
    }

    private static Stop inputError(String file, String reason) {
        return new Stop(Verdict.INPUT_ERROR, new Failure(file, 1, 1, null, null, reason, null, null, null));
    }

    private static String describe(IOException e) {
        if (e instanceof java.nio.file.NoSuchFileException) return "no such file";
        if (e instanceof java.nio.file.AccessDeniedException) return "permission denied";
        if (e.getMessage() != null && e.getMessage().contains("Is a directory")) return "it is a directory";
        return e.getClass().getSimpleName() + (e.getMessage() == null ? "" : ": " + e.getMessage());
    }

    /** The SHA-256 of {@code bytes} in lower-case hex, as reports and {@code digest} lines write it. */
    public static String sha256(byte[] bytes) {
        return CertificateSource.hex(CertificateSource.newDigest().digest(bytes));
    }

}
