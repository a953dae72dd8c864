package dev.assay.cli;

import dev.assay.check.Checker;
import dev.assay.gate.Baseline;
import dev.assay.gate.Gate;
import dev.assay.gate.GateCase;
import dev.assay.gate.GateReport;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;

@Command(name = "gate", mixinStandardHelpOptions = true,
        description = {"Checks every pair NAME.problem / NAME.proof below DIR, in parallel, as a regression gate.",
                "Prints a table and a summary; writes JUnit XML and JSON; compares with a baseline report."},
        footer = {"", "Exit status: 0 when every case is verified (without --baseline) or nothing regressed (with it);",
                "1 otherwise; 2 for a usage or file error."})
final class GateCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "DIR", description = "folder searched recursively for NAME.proof beside NAME.problem")
    Path dir;

    @Option(names = "--jobs", paramLabel = "N", description = "checks run at once (default: the number of processors)")
    int jobs = Runtime.getRuntime().availableProcessors();

    @Option(names = "--junit", paramLabel = "FILE", description = "write JUnit XML, one testcase per pair")
    Path junit;

    @Option(names = "--json", paramLabel = "FILE", description = "write the gate report as JSON (usable as a baseline)")
    Path json;

    @Option(names = "--baseline", paramLabel = "FILE", description = "the JSON report of an earlier run: report what changed, fail on regressions")
    Path baseline;

    @Option(names = "--timeout", paramLabel = "SECONDS", description = "time limit per case (default: none)")
    double timeout;

    @Option(names = "--total-timeout", paramLabel = "SECONDS",
            description = "time limit for the whole run; cases still running or not started end as timeout (default: none)")
    double totalTimeout;

    @Option(names = "--shard", paramLabel = "K/N", description = "check only shard K of N (every N-th case, from the K-th)")
    String shard;

    @picocli.CommandLine.Mixin
    LimitOptions limits = new LimitOptions();

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        if (!Files.isDirectory(dir)) {
            err.println("assay gate: " + dir + " is not a folder");
            return 2;
        }
        List<Gate.Pair> pairs;
        try {
            pairs = Gate.find(dir);
        } catch (IOException e) {
            err.println("assay gate: cannot list " + dir + ": " + e.getMessage());
            return 2;
        }
        if (shard != null) {
            String[] kn = shard.split("/");
            int k;
            int n;
            try {
                k = Integer.parseInt(kn[0].trim());
                n = Integer.parseInt(kn[1].trim());
            } catch (RuntimeException e) {
                err.println("assay gate: --shard takes K/N, for example 2/4");
                return 2;
            }
            if (kn.length != 2 || n < 1 || k < 1 || k > n) {
                err.println("assay gate: --shard takes K/N with 1 <= K <= N");
                return 2;
            }
            pairs = Gate.shard(pairs, k, n);
        }
        List<GateCase> baseCases = null;
        if (baseline != null) {
            try {
                baseCases = GateReport.read(baseline);
            } catch (IOException e) {
                err.println("assay gate: cannot read the baseline: " + e.getMessage());
                return 2;
            }
        }
        // Jobs beyond the number of cases never run, so they leave their processors to the threads of the others.
        Checker.Options options = limits.options(err, Math.min(jobs, Math.max(1, pairs.size())));
        if (options == null) return 2;
        Progress progress = new Progress(err, pairs.size(), "cases");
        List<GateCase> cases = new Gate(jobs, (long) (timeout * 1000), (long) (totalTimeout * 1000), options)
                .run(pairs, progress::update);
        progress.finish();
        out.print(GateReport.table(cases, true));
        try {
            if (json != null) Files.writeString(json, GateReport.json(cases, true), StandardCharsets.UTF_8);
            if (junit != null) Files.writeString(junit, GateReport.junit(cases, "assay gate " + dir), StandardCharsets.UTF_8);
        } catch (IOException e) {
            err.println("assay gate: cannot write a report: " + e.getMessage());
            return 2;
        }
        if (baseCases != null) {
            List<Baseline.Difference> diffs = Baseline.compare(baseCases, cases);
            long regressions = diffs.stream().filter(Baseline.Difference::regression).count();
            out.println(diffs.isEmpty() ? "no change against the baseline" : "changes against the baseline:");
            for (Baseline.Difference d : diffs) out.println((d.regression() ? "  REGRESSION " : "  ") + d.describe());
            if (regressions > 0) {
                out.println(regressions + " regression" + (regressions == 1 ? "" : "s"));
                return 1;
            }
            return 0;
        }
        return cases.stream().allMatch(GateCase::verified) ? 0 : 1;
    }
}
