package dev.assay.gate;

import dev.assay.check.CheckResult;
import dev.assay.check.Checker;
import dev.assay.check.Verdict;
import dev.assay.check.Failure;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.ThreadFactory;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.ScheduledFuture;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.IntConsumer;
import java.util.stream.Stream;

/**
 * Checks every pair NAME.problem / NAME.proof below a folder, in parallel. Cases are sorted by name, and results
 * come back in that order whatever the number of threads, so reports are the same for one thread and several.
 */
public final class Gate {

    /** A pair to check. */
    public record Pair(String name, Path problem, Path certificate) {
    }

    private final int jobs;
    private final long timeoutMillis;
    private final Checker.Options options;

    private final long totalMillis;

    public Gate(int jobs, long timeoutMillis, Checker.Options options) {
        this(jobs, timeoutMillis, 0, options);
    }

    /**
     * {@code timeoutMillis} limits each case, {@code totalMillis} the whole run (0: no limit): past the total limit the
     * running cases stop at their next step and the cases not yet started end at once, all with verdict timeout.
     */
    public Gate(int jobs, long timeoutMillis, long totalMillis, Checker.Options options) {
        this.jobs = Math.max(1, jobs);
        this.timeoutMillis = timeoutMillis;
        this.totalMillis = totalMillis;
        this.options = options;
    }

    /** Every .proof below {@code dir} that has a .problem beside it, sorted by name. */
    public static List<Pair> find(Path dir) throws IOException {
        List<Pair> out = new ArrayList<>();
        try (Stream<Path> s = Files.walk(dir)) {
            for (Path proof : s.filter(p -> p.getFileName().toString().endsWith(".proof") && Files.isRegularFile(p))
                    .sorted().toList()) {
                String file = proof.getFileName().toString();
                Path problem = proof.resolveSibling(file.substring(0, file.length() - 6) + ".problem");
                if (!Files.isRegularFile(problem)) continue;
                String rel = dir.relativize(proof).toString().replace('\\', '/');
                out.add(new Pair(rel.substring(0, rel.length() - 6), problem, proof));
            }
        }
        out.sort((a, b) -> a.name().compareTo(b.name()));
        return out;
    }

    /** The cases of shard {@code k} of {@code n} (1 ≤ k ≤ n): every n-th case, starting at the k-th. */
    public static List<Pair> shard(List<Pair> all, int k, int n) {
        List<Pair> out = new ArrayList<>();
        for (int i = 0; i < all.size(); i++) if (i % n == k - 1) out.add(all.get(i));
        return out;
    }

    /** Checks every pair; {@code progress} is told the number done after each. */
    public List<GateCase> run(List<Pair> pairs, IntConsumer progress) {
        long deadline = totalMillis > 0 ? System.nanoTime() + totalMillis * 1_000_000 : Long.MAX_VALUE;
        AtomicInteger serial = new AtomicInteger();
        ThreadFactory big = r -> {
            Thread t = new Thread(null, r, "assay-gate-" + serial.incrementAndGet(), 1L << 29);
            t.setDaemon(true);
            return t;
        };
        ExecutorService pool = Executors.newFixedThreadPool(jobs, big);
        ScheduledExecutorService watchdog = Executors.newSingleThreadScheduledExecutor(r -> {
            Thread t = new Thread(r, "assay-gate-watchdog");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<CheckResult>> futures = new ArrayList<>();
            for (Pair p : pairs) futures.add(pool.submit(() -> checkWithin(p, watchdog, deadline)));
            List<GateCase> out = new ArrayList<>();
            for (int i = 0; i < pairs.size(); i++) {
                out.add(await(pairs.get(i), futures.get(i)));
                progress.accept(i + 1);
            }
            return out;
        } finally {
            pool.shutdownNow();
            watchdog.shutdownNow();
        }
    }

    /** One check; past the time limit the watchdog interrupts it and the checker stops before its next step. */
    private CheckResult checkWithin(Pair p, ScheduledExecutorService watchdog, long deadline) {
        Thread self = Thread.currentThread();
        long limit = timeoutMillis > 0 ? timeoutMillis : Long.MAX_VALUE;
        if (deadline != Long.MAX_VALUE) limit = Math.min(limit, Math.max(0, (deadline - System.nanoTime()) / 1_000_000));
        if (limit == 0) {
            String cert = p.certificate().toString();
            return new CheckResult(Verdict.TIMEOUT, p.problem().toString(), null, cert, null, null, "absent", 0,
                    java.util.Map.of(), null, 0, List.of(), List.of(), false, List.of(),
                    new Failure(cert, 1, 1, null, null, "not checked: the gate's total time limit was reached before"
                            + " this case started", null, null, null), 0);
        }
        ScheduledFuture<?> alarm = null;
        if (limit != Long.MAX_VALUE) alarm = watchdog.schedule(self::interrupt, limit, TimeUnit.MILLISECONDS);
        try {
            return new Checker(options).check(p.problem(), p.certificate());
        } finally {
            if (alarm != null) alarm.cancel(false);
            Thread.interrupted(); // clear a late alarm before the thread takes the next case
        }
    }

    private GateCase await(Pair p, Future<CheckResult> f) {
        try {
            CheckResult r = f.get();
            return new GateCase(p.name(), p.problem().toString(), p.certificate().toString(), r.verdict().word(),
                    r.exitStatus(), r.steps(), r.elapsedMillis(), r.failure());
        } catch (ExecutionException | InterruptedException e) {
            if (e instanceof InterruptedException) Thread.currentThread().interrupt();
            Throwable cause = e.getCause() == null ? e : e.getCause();
            return new GateCase(p.name(), p.problem().toString(), p.certificate().toString(), "internal error", 70, 0, 0,
                    new Failure(p.certificate().toString(), 1, 1, null, null,
                            "internal error (a bug in Assay): " + cause, null, null, null));
        }
    }
}
