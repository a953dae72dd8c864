package dev.assay.bench;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.function.Consumer;
import java.util.stream.Stream;

/**
 * {@code assay bench run}: generates each family at each size into a temporary folder and times its check in a child
 * JVM ({@link Probe}), so that the figures include the JVM's start-up and the child's heap can be measured on its own.
 * Prints a markdown table and the scaling ratios.
 */
public final class BenchRun {

    public record Options(List<String> families, List<Long> sizes, int repeat, String xmx, boolean forget,
                          Path corpus, Path keep, double timeoutSeconds, List<String> jvmArgs) {
    }

    /** One measured row. Times are medians over the repeats, in seconds; heap figures the maxima, in bytes. */
    public record Row(String family, long steps, long bytes, double generateSeconds, double wallSeconds,
                      double checkSeconds, long peakLive, long maxCommitted, long collections, Double parseSeconds,
                      String verdict) {
    }

    private final Options options;
    private final Consumer<String> progress;
    private final List<String> skipped = new ArrayList<>();

    public BenchRun(Options options, Consumer<String> progress) {
        this.options = options;
        this.progress = progress;
    }

    /** What {@link #run} was asked for and did not measure, and why, in order. */
    public List<String> skipped() {
        return List.copyOf(skipped);
    }

    private void skip(String why) {
        skipped.add(why);
        progress.accept(why + "; skipped");
    }

    public List<Row> run() throws IOException, InterruptedException {
        Path dir = options.keep() != null ? options.keep() : Files.createTempDirectory("assay-bench");
        List<Row> rows = new ArrayList<>();
        try {
            for (String name : options.families()) {
                if (name.equals(Families.CORPUS)) {
                    if (!Files.isDirectory(options.corpus())) {
                        skip("corpus: no folder " + options.corpus());
                        continue;
                    }
                    List<Families.Member> members = Families.copyCorpus(options.corpus(), dir.resolve("corpus"));
                    long steps = members.stream().mapToLong(Families.Member::steps).sum();
                    long bytes = members.stream().mapToLong(Families.Member::bytes).sum();
                    rows.add(measure(name + " (" + members.size() + " pairs)", steps, bytes, 0, members));
                    continue;
                }
                Family f = Families.family(name);
                if (f == null) throw new IllegalArgumentException("no family " + name + "; the families are " + Families.names());
                for (long n : options.sizes()) {
                    if (n < f.minSteps()) {
                        skip(name + ": " + n + " steps is below its minimum of " + f.minSteps());
                        continue;
                    }
                    progress.accept(name + ": generating " + n + " steps");
                    long t0 = System.nanoTime();
                    Families.Member m = Families.generate(f, n, options.forget(), true, dir);
                    double gen = (System.nanoTime() - t0) / 1e9;
                    rows.add(measure(name, n, m.bytes(), gen, List.of(m)));
                    if (options.keep() == null) {
                        Files.deleteIfExists(m.problem());
                        Files.deleteIfExists(m.proof());
                    }
                }
            }
        } finally {
            if (options.keep() == null) deleteTree(dir);
        }
        return rows;
    }

    private Row measure(String family, long steps, long bytes, double gen, List<Families.Member> members)
            throws IOException, InterruptedException {
        List<String> files = new ArrayList<>();
        for (Families.Member m : members) {
            files.add(m.problem().toString());
            files.add(m.proof().toString());
        }
        double[] walls = new double[options.repeat()];
        double[] checks = new double[options.repeat()];
        long live = 0;
        long committed = 0;
        long gcs = 0;
        String verdict = null;
        for (int k = 0; k < options.repeat(); k++) {
            progress.accept(family + ": checking " + steps + " steps (" + (k + 1) + "/" + options.repeat() + ")");
            Probed p = probe(false, files);
            walls[k] = p.wall;
            Map<String, String> v = p.values;
            if (v.containsKey("error") || !v.containsKey("verdict")) {
                verdict = v.getOrDefault("error", "no result (exit " + p.exit + ")");
                checks[k] = Double.NaN;
                continue;
            }
            verdict = v.get("verdict");
            checks[k] = Long.parseLong(v.get("ms")) / 1000.0;
            live = Math.max(live, Long.parseLong(v.get("peak_live")));
            committed = Math.max(committed, Long.parseLong(v.get("max_committed")));
            gcs = Math.max(gcs, Long.parseLong(v.get("gcs")));
        }
        Double parse = null;
        Probed p = probe(true, files);
        if (p.values.containsKey("status") && p.values.containsKey("ms")) {
            double[] parses = new double[options.repeat()];
            parses[0] = Long.parseLong(p.values.get("ms")) / 1000.0;
            for (int k = 1; k < options.repeat(); k++) {
                Probed q = probe(true, files);
                parses[k] = q.values.containsKey("ms") ? Long.parseLong(q.values.get("ms")) / 1000.0 : Double.NaN;
            }
            parse = median(parses);
        }
        return new Row(family, steps, bytes, gen, median(walls), median(checks), live, committed, gcs, parse, verdict);
    }

    private record Probed(double wall, int exit, Map<String, String> values) {
    }

    private Probed probe(boolean parseOnly, List<String> files) throws IOException, InterruptedException {
        List<String> cmd = new ArrayList<>();
        cmd.add(javaCommand());
        cmd.add("-Xmx" + options.xmx());
        cmd.addAll(options.jvmArgs());
        cmd.add("-cp");
        cmd.add(System.getProperty("java.class.path"));
        cmd.add(Probe.class.getName());
        if (parseOnly) cmd.add("--parse-only");
        cmd.addAll(files);
        ProcessBuilder pb = new ProcessBuilder(cmd).redirectError(ProcessBuilder.Redirect.DISCARD);
        long t0 = System.nanoTime();
        Process proc = pb.start();
        byte[] out;
        try (InputStream in = proc.getInputStream()) {
            out = in.readAllBytes();
        }
        boolean done = proc.waitFor((long) (options.timeoutSeconds() * 1000), TimeUnit.MILLISECONDS);
        double wall = (System.nanoTime() - t0) / 1e9;
        if (!done) {
            proc.destroyForcibly().waitFor();
            return new Probed(wall, -1, Map.of("error", "timeout"));
        }
        Map<String, String> values = new HashMap<>();
        String text = new String(out, StandardCharsets.UTF_8).trim();
        String[] lines = text.split("\n");
        for (String kv : lines[lines.length - 1].trim().split(" ")) {
            int eq = kv.indexOf('=');
            if (eq > 0) values.put(kv.substring(0, eq), kv.substring(eq + 1));
        }
        return new Probed(wall, proc.exitValue(), values);
    }

    private static String javaCommand() {
        Path java = Path.of(System.getProperty("java.home"), "bin", "java");
        return Files.isExecutable(java) ? java.toString() : "java";
    }

    static double median(double[] xs) {
        double[] s = Arrays.stream(xs).filter(x -> !Double.isNaN(x)).sorted().toArray();
        if (s.length == 0) return Double.NaN;
        return s.length % 2 == 1 ? s[s.length / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
    }

    private static void deleteTree(Path dir) throws IOException {
        if (!Files.exists(dir)) return;
        try (Stream<Path> walk = Files.walk(dir)) {
            for (Path p : walk.sorted(Comparator.reverseOrder()).toList()) Files.deleteIfExists(p);
        }
    }

    // ---------------------------------------------------------------- the report

    private static String mb(long bytes) {
        return String.format(Locale.ROOT, bytes < 1e6 ? "%.2f" : "%.1f", bytes / 1e6);
    }

    private static String secs(double s) {
        if (Double.isNaN(s)) return "—";
        return String.format(Locale.ROOT, s < 10 ? "%.2f" : "%.1f", s);
    }

    private static String rate(double amount, double seconds) {
        if (Double.isNaN(seconds) || seconds <= 0) return "—";
        double r = amount / seconds;
        return r >= 100 ? String.format(Locale.ROOT, "%,.0f", r) : String.format(Locale.ROOT, "%.2f", r);
    }

    /** The measurements as markdown: the header, the table and the scaling ratios. */
    public static String markdown(Options options, List<Row> rows, String command) {
        StringBuilder sb = new StringBuilder();
        sb.append("Measured ").append(OffsetDateTime.now(ZoneOffset.UTC).withNano(0)).append(" with `").append(command)
                .append("`\n\n");
        sb.append("JVM: ").append(System.getProperty("java.vm.name")).append(' ').append(System.getProperty("java.vm.version"))
                .append(", child heap -Xmx").append(options.xmx());
        if (!options.jvmArgs().isEmpty()) sb.append(' ').append(String.join(" ", options.jvmArgs()));
        sb.append("; ").append(Runtime.getRuntime().availableProcessors()).append(" processors; ")
                .append(System.getProperty("os.name")).append(' ').append(System.getProperty("os.arch"))
                .append("; median of ").append(options.repeat()).append(options.repeat() == 1 ? " run" : " runs")
                .append(options.forget() ? "; certificates with forget lines" : "").append(".\n\n");
        sb.append("| family | steps | MB | wall s | check s | steps/s | MB/s | peak live MB | max committed MB | GCs"
                + " | parse s | check/parse | verdict |\n");
        sb.append("|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---|\n");
        for (Row r : rows) {
            String parse = r.parseSeconds() == null ? "" : secs(r.parseSeconds());
            String ratio = r.parseSeconds() == null || r.parseSeconds() <= 0 ? ""
                    : String.format(Locale.ROOT, "%.2f", r.checkSeconds() / r.parseSeconds());
            sb.append("| ").append(r.family()).append(" | ").append(String.format(Locale.ROOT, "%,d", r.steps()))
                    .append(" | ").append(mb(r.bytes())).append(" | ").append(secs(r.wallSeconds()))
                    .append(" | ").append(secs(r.checkSeconds())).append(" | ").append(rate(r.steps(), r.wallSeconds()))
                    .append(" | ").append(rate(r.bytes() / 1e6, r.wallSeconds())).append(" | ")
                    .append(r.collections() == 0 ? "≤ " : "").append(mb(r.peakLive())).append(" | ")
                    .append(mb(r.maxCommitted())).append(" | ").append(r.collections()).append(" | ").append(parse)
                    .append(" | ").append(ratio).append(" | ").append(r.verdict()).append(" |\n");
        }
        sb.append("\nwall: the child JVM from start to exit, start-up included; check: inside the child, from the"
                + " first byte read to the verdict. steps/s and MB/s are on wall time. Peak live: the most heap in use"
                + " right after a collection (≤: no collection ran; heap in use at the end, garbage included).\n");
        List<String> scaling = new ArrayList<>();
        Map<String, List<Row>> byFamily = new LinkedHashMap<>();
        for (Row r : rows) byFamily.computeIfAbsent(r.family(), k -> new ArrayList<>()).add(r);
        for (List<Row> fam : byFamily.values()) {
            for (int i = 0; i + 1 < fam.size(); i++) {
                for (int j = i + 1; j < fam.size(); j++) {
                    Row a = fam.get(i);
                    Row b = fam.get(j);
                    if (b.steps() != 10 * a.steps()) continue;
                    scaling.add(String.format(Locale.ROOT, "| %s | %,d → %,d | %.1f | %.1f | %.1f |", a.family(),
                            a.steps(), b.steps(), b.wallSeconds() / a.wallSeconds(), b.checkSeconds() / a.checkSeconds(),
                            (double) Math.max(1, b.peakLive()) / Math.max(1, a.peakLive())));
                }
            }
        }
        if (!scaling.isEmpty()) {
            sb.append("\nScaling (10x the steps; 10 is linear):\n\n| family | steps | wall ratio | check ratio | peak live ratio |\n"
                    + "|---|---|---:|---:|---:|\n");
            for (String s : scaling) sb.append(s).append('\n');
        }
        return sb.toString();
    }
}
