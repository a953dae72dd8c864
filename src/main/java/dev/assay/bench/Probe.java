package dev.assay.bench;

import com.sun.management.GarbageCollectionNotificationInfo;
import dev.assay.check.CheckResult;
import dev.assay.check.Checker;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.lang.management.GarbageCollectorMXBean;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.lang.management.MemoryUsage;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.atomic.AtomicLong;
import javax.management.NotificationEmitter;
import javax.management.openmbean.CompositeData;

/**
 * The child JVM of {@code assay bench run}: checks pairs of files and prints one line of measurements,
 * {@code key=value} separated by spaces. Peak live heap is the largest heap in use right after a collection, from the
 * collectors' notifications ({@code GcInfo.getMemoryUsageAfterGc}); when no collection ran, it is the heap in use at
 * the end (an upper bound, garbage included) and {@code gcs=0} says so.
 *
 * <pre>java -Xmx2g -cp assay.jar dev.assay.bench.Probe [--parse-only] PROBLEM PROOF [PROBLEM PROOF …]</pre>
 *
 * With {@code --parse-only} the pairs go through {@code assay check --parse-only -q} in this JVM; when the command
 * line has no such option the line says {@code unsupported=parse-only}.
 */
public final class Probe {

    private static final long STACK_BYTES = 1L << 30;

    private Probe() {
    }

    public static void main(String[] args) throws Exception {
        boolean parseOnly = args.length > 0 && args[0].equals("--parse-only");
        int first = parseOnly ? 1 : 0;
        if ((args.length - first) % 2 != 0 || args.length == first) {
            System.err.println("usage: Probe [--parse-only] PROBLEM PROOF [PROBLEM PROOF ...]");
            System.exit(2);
        }
        Set<String> heapPools = new HashSet<>();
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            if (pool.getType() == MemoryType.HEAP) heapPools.add(pool.getName());
        }
        AtomicLong peakLive = new AtomicLong();
        AtomicLong maxCommitted = new AtomicLong();
        AtomicLong collections = new AtomicLong();
        for (GarbageCollectorMXBean gc : ManagementFactory.getGarbageCollectorMXBeans()) {
            if (!(gc instanceof NotificationEmitter emitter)) continue;
            emitter.addNotificationListener((n, handback) -> {
                if (!n.getType().equals(GarbageCollectionNotificationInfo.GARBAGE_COLLECTION_NOTIFICATION)) return;
                GarbageCollectionNotificationInfo info = GarbageCollectionNotificationInfo.from((CompositeData) n.getUserData());
                long used = 0;
                long committed = 0;
                for (Map.Entry<String, MemoryUsage> e : info.getGcInfo().getMemoryUsageAfterGc().entrySet()) {
                    if (!heapPools.contains(e.getKey())) continue;
                    used += e.getValue().getUsed();
                    committed += e.getValue().getCommitted();
                }
                collections.incrementAndGet();
                peakLive.accumulateAndGet(used, Math::max);
                maxCommitted.accumulateAndGet(committed, Math::max);
            }, null, null);
        }

        String[] result = new String[1];
        Throwable[] failure = new Throwable[1];
        long start = System.nanoTime();
        Thread worker = new Thread(null, () -> {
            try {
                result[0] = parseOnly ? parseOnly(args, first) : check(args, first);
            } catch (Throwable t) {
                failure[0] = t;
            }
        }, "probe", STACK_BYTES);
        worker.start();
        worker.join();
        long nanos = System.nanoTime() - start;
        if (failure[0] != null) {
            System.out.println("error=" + failure[0].toString().replace(' ', '_'));
            System.exit(70);
        }
        // Notifications arrive on another thread shortly after each collection.
        Thread.sleep(100);
        MemoryUsage heap = ManagementFactory.getMemoryMXBean().getHeapMemoryUsage();
        long live = collections.get() == 0 ? heap.getUsed() : peakLive.get();
        long committed = Math.max(maxCommitted.get(), heap.getCommitted());
        System.out.println(result[0] + " ms=" + nanos / 1_000_000 + " gcs=" + collections.get() + " peak_live=" + live
                + " max_committed=" + committed);
    }

    private static String check(String[] args, int first) {
        Checker checker = new Checker();
        long steps = 0;
        Set<String> verdicts = new java.util.LinkedHashSet<>();
        for (int i = first; i < args.length; i += 2) {
            CheckResult r = checker.check(Path.of(args[i]), Path.of(args[i + 1]));
            steps += r.steps();
            verdicts.add(r.verdict().name().toLowerCase());
        }
        return "verdict=" + String.join("+", verdicts) + " steps=" + steps;
    }

    /** Through the command line, by reflection: the bench package does not depend on the command line package. */
    private static String parseOnly(String[] args, int first) throws Exception {
        var run = Class.forName("dev.assay.cli.Main").getMethod("run", String[].class, PrintWriter.class, PrintWriter.class);
        int worst = 0;
        for (int i = first; i < args.length; i += 2) {
            StringWriter err = new StringWriter();
            int status = (Integer) run.invoke(null, new String[] {"check", "--parse-only", "-q", args[i], args[i + 1]},
                    new PrintWriter(new StringWriter()), new PrintWriter(err));
            if (status == 2 && err.toString().contains("--parse-only")) return "unsupported=parse-only";
            worst = Math.max(worst, status);
        }
        return "status=" + worst;
    }
}
