package dev.assay.fuzz;

import dev.assay.check.CheckResult;
import dev.assay.check.Checker;
import dev.assay.check.Failure;
import dev.assay.check.Verdict;
import dev.assay.cli.Main;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.concurrent.atomic.AtomicLong;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * Runs checks for the fuzz tests: in-process on a worker thread with the command line's stack and a time limit, and
 * through the command line entry point {@link Main#run}, capturing what it prints. It asserts the robustness
 * properties and counts outcomes for the summary that {@code docs/fuzzing.md} quotes.
 */
public final class Harness {

    /** A check that takes longer than this is a hang. */
    public static final Duration LIMIT = Duration.ofSeconds(Long.getLong("assay.fuzz.limit", 20));
    /** The command line's worker stack (Main.STACK_BYTES), so that in-process checks meet the same limits. */
    private static final long STACK_BYTES = 1L << 30;
    private static final Set<Integer> EXIT_STATUSES = Set.of(0, 1, 2, 3, 4);
    private static final Pattern LOCATION = Pattern.compile(":[1-9]\\d*:[1-9]\\d*: ");
    private static final Pattern JSON_LOCATION = Pattern.compile(
            "\"failure\" : \\{\\s*\"file\" : \"[^\"]+\",\\s*\"line\" : [1-9]\\d*,\\s*\"column\" : [1-9]\\d*,");

    private static ExecutorService pool = newPool();
    private static final Map<String, Map<String, AtomicLong>> TALLY = new ConcurrentHashMap<>();
    private static final Map<String, AtomicLong> SLOWEST = new ConcurrentHashMap<>();
    private static final java.lang.management.ThreadMXBean THREADS = java.lang.management.ManagementFactory.getThreadMXBean();
    /** CPU time of the checks and command line runs (not of the generators), and how many there were. */
    private static final AtomicLong CPU_NANOS = new AtomicLong();
    private static final AtomicLong RUNS = new AtomicLong();

    private Harness() {
    }

    private static ExecutorService newPool() {
        return Executors.newSingleThreadExecutor(r -> {
            Thread t = new Thread(null, r, "fuzz-check", STACK_BYTES);
            t.setDaemon(true);
            return t;
        });
    }

    /** What the command line printed and returned. */
    public record Run(int status, String out, String err) {
        public String all() {
            return out + err;
        }
    }

    static synchronized <T> T within(java.util.concurrent.Callable<T> task, String what) throws Exception {
        Future<T> f = pool.submit(() -> {
            long cpu = THREADS.getCurrentThreadCpuTime();
            try {
                return task.call();
            } finally {
                CPU_NANOS.addAndGet(THREADS.getCurrentThreadCpuTime() - cpu);
                RUNS.incrementAndGet();
            }
        });
        try {
            return f.get(LIMIT.toMillis(), TimeUnit.MILLISECONDS);
        } catch (TimeoutException e) {
            f.cancel(true);
            pool.shutdownNow();
            pool = newPool();
            fail("no result within " + LIMIT.toSeconds() + " s (a hang): " + what);
            return null;
        } catch (java.util.concurrent.ExecutionException e) {
            Throwable cause = e.getCause();
            StringWriter trace = new StringWriter();
            cause.printStackTrace(new PrintWriter(trace));
            fail("the check threw " + cause + " on " + what + "\n" + trace);
            return null;
        }
    }

    /** Checks in-process; fails the test on an exception or a hang. */
    public static CheckResult check(Path problem, Path proof, String what) throws Exception {
        return within(() -> new Checker().check(problem, proof), what);
    }

    /** Runs {@code assay ARGS} in-process; fails the test on a hang. */
    public static Run cli(String what, String... args) throws Exception {
        return within(() -> {
            StringWriter out = new StringWriter();
            StringWriter err = new StringWriter();
            int status = Main.run(args, new PrintWriter(out), new PrintWriter(err));
            return new Run(status, out.toString(), err.toString());
        }, what);
    }

    /** Every result has a verdict; a refusal has a file, a line and a column from 1, and a reason. */
    public static void located(CheckResult r, String what) {
        assertNotNull(r.verdict(), what);
        Failure f = r.failure();
        boolean accepted = r.verdict() == Verdict.THEOREM || r.verdict() == Verdict.UNSATISFIABLE
                || r.verdict() == Verdict.VACUOUS;
        if (accepted) {
            assertTrue(f == null, () -> what + ": accepted with a failure " + f.render());
            assertNotNull(r.refutation(), what);
            return;
        }
        assertNotNull(f, () -> what + ": " + r.verdict().word() + " without a failure");
        assertNotNull(f.file(), what);
        assertFalse(f.file().isBlank(), what);
        assertTrue(f.line() >= 1 && f.column() >= 1, () -> what + ": " + f.render());
        assertNotNull(f.reason(), what);
        assertFalse(f.reason().isBlank(), () -> what + ": " + f.render());
    }

    /** The line of a failure lies within the file it names (lines counted as the lexer does, and CR as well). */
    public static void lineWithinFile(CheckResult r, Path problem, Path proof, String what) throws Exception {
        Failure f = r.failure();
        if (f == null) return;
        Path file = f.file().equals(problem.toString()) ? problem : f.file().equals(proof.toString()) ? proof : null;
        assertNotNull(file, () -> what + ": the failure names " + f.file() + ", neither input");
        byte[] bytes = Files.readAllBytes(file);
        int lf = 0;
        int cr = 0;
        for (byte b : bytes) {
            if (b == '\n') lf++;
            if (b == '\r') cr++;
        }
        int lines = Math.max(lf, cr) + 1;
        assertTrue(f.line() <= lines, () -> what + ": line " + f.line() + " of a file of " + lines + " lines: "
                + f.render());
    }

    /**
     * The command line never prints a stack trace, exits 0 to 4, agrees with the in-process verdict, and locates an
     * input error as {@code file:line:column}.
     */
    public static void cleanRun(Run run, Verdict expected, String what) {
        String all = run.all();
        String shown = all.length() > 4000 ? all.substring(0, 4000) + "…" : all;
        assertTrue(EXIT_STATUSES.contains(run.status()), () -> what + ": exit " + run.status() + "\n" + shown);
        assertFalse(all.contains("Exception"), () -> what + ": printed an exception\n" + shown);
        assertFalse(all.contains("\tat "), () -> what + ": printed a stack frame\n" + shown);
        assertFalse(all.contains("Caused by"), () -> what + ": printed a cause\n" + shown);
        assertFalse(all.contains("internal error"), () -> what + ": internal error\n" + shown);
        if (expected != null) assertEquals(expected.exitStatus(), run.status(), () -> what + "\n" + shown);
        if (run.status() == 2 || run.status() == 1) {
            // The text report says file:line:column; the JSON report gives "line" and "column" in its failure.
            boolean located = LOCATION.matcher(all).find() || JSON_LOCATION.matcher(all).find();
            assertTrue(located, () -> what + ": exit " + run.status() + " without file:line:column\n" + shown);
        }
    }

    /** Counts one outcome under a property name and an outcome key (a verdict word, maybe with a mutation kind). */
    public static void count(String property, String outcome) {
        TALLY.computeIfAbsent(property, k -> new ConcurrentHashMap<>()).computeIfAbsent(outcome, k -> new AtomicLong())
                .incrementAndGet();
    }

    public static void slowest(String property, long millis) {
        SLOWEST.computeIfAbsent(property, k -> new AtomicLong()).accumulateAndGet(millis, Math::max);
    }

    /** The counts so far, one line per property and outcome, sorted. */
    public static String summary() {
        StringBuilder sb = new StringBuilder();
        sb.append(RUNS.get()).append(" runs of the checker or the command line, ")
                .append(CPU_NANOS.get() / 1_000_000).append(" ms of CPU time in them\n");
        for (var p : new TreeMap<>(TALLY).entrySet()) {
            long total = p.getValue().values().stream().mapToLong(AtomicLong::get).sum();
            sb.append(p.getKey()).append(": ").append(total).append(" checks, slowest ")
                    .append(SLOWEST.getOrDefault(p.getKey(), new AtomicLong()).get()).append(" ms\n");
            for (var o : new TreeMap<>(p.getValue()).entrySet()) {
                sb.append("  ").append(o.getKey()).append('\t').append(o.getValue().get()).append('\n');
            }
        }
        return sb.toString();
    }

    /** Writes the summary to the file named by {@code assay.fuzz.summary}, when set. */
    public static void writeSummary(String heading) throws Exception {
        String file = System.getProperty("assay.fuzz.summary");
        if (file == null || file.isBlank()) return;
        Files.writeString(Path.of(file), "== " + heading + "\n" + summary(), StandardCharsets.UTF_8,
                java.nio.file.StandardOpenOption.CREATE, java.nio.file.StandardOpenOption.APPEND);
    }
}
