package dev.assay.cli;

import dev.assay.check.CheckResult;
import dev.assay.check.Checker;
import dev.assay.report.HtmlReport;
import dev.assay.report.JsonReport;
import dev.assay.report.TextReport;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;

@Command(name = "check", mixinStandardHelpOptions = true,
        description = {"Checks CERTIFICATE against PROBLEM and prints the verdict.",
                "Every step is re-derived by the kernel; the first failure is reported with its location."},
        footer = {"", "Exit status: 0 theorem or unsatisfiable, 3 vacuous, 1 rejected, 2 input error or a limit reached, 4 time limit."})
final class CheckCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "PROBLEM", description = "the problem file (.problem)")
    Path problem;

    @Parameters(index = "1", paramLabel = "CERTIFICATE", description = "the certificate file (.proof)")
    Path certificate;

    @Option(names = "--json", paramLabel = "FILE", description = "also write the report as JSON to FILE ('-' for standard output)")
    Path json;

    @Option(names = {"-q", "--quiet"}, description = "print nothing; the exit status tells the verdict")
    boolean quiet;

    @Option(names = "--html", paramLabel = "FILE", description = "also write a self-contained HTML report (for a review file)")
    Path html;

    @Option(names = "--timeout", paramLabel = "SECONDS", description = "stop the check after this long (exit 4); default: none")
    double timeout;

    @Option(names = "--brief", description = "print one line: the verdict, the certificate, and the failure if any")
    boolean brief;

    @Option(names = "--parse-only", description = "only read both files (no kernel work) and print how long that took")
    boolean parseOnly;

    @picocli.CommandLine.Mixin
    LimitOptions limits = new LimitOptions();

    @Override
    public Integer call() {
        Checker.Options options = limits.options(spec.commandLine().getErr(), 1);
        if (options == null) return 2;
        if (parseOnly) return parseOnly(new Checker(options));
        HtmlReport page = html == null ? null : new HtmlReport();
        Checker checker = new Checker(options);
        Progress progress = new Progress(spec.commandLine().getErr(), 0, "steps checked");
        Checker.Listener listener = new Checker.Listener() {
            @Override
            public void problem(dev.assay.kernel.Problem p) {
                if (page != null) page.problem(p);
            }

            @Override
            public boolean wantsSteps() {
                return page != null;
            }

            @Override
            public void step(dev.assay.syntax.Step s, Object conclusion, java.util.List<String> premises) {
                page.step(s, conclusion, premises);
            }

            @Override
            public void progress(int steps) {
                if (!quiet) progress.update(steps);
            }

            @Override
            public void forget(dev.assay.syntax.Forget f) {
                if (page != null) page.forget(f);
            }
        };
        // The checker looks at its thread's interrupt flag between steps; a timer sets it at the limit.
        Thread self = Thread.currentThread();
        java.util.Timer alarm = null;
        if (timeout > 0) {
            alarm = new java.util.Timer("assay-timeout", true);
            alarm.schedule(new java.util.TimerTask() {
                @Override
                public void run() {
                    self.interrupt();
                }
            }, (long) (timeout * 1000));
        }
        CheckResult r;
        try {
            r = checker.check(problem, certificate, listener);
        } finally {
            if (alarm != null) alarm.cancel();
            Thread.interrupted();
        }
        progress.finish();
        if (page != null) {
            String date = java.time.OffsetDateTime.now(java.time.ZoneOffset.UTC).withNano(0).toString();
            try {
                Files.writeString(html, page.render(r, Main.version(), Main.jarSha256(), date), StandardCharsets.UTF_8);
            } catch (IOException e) {
                spec.commandLine().getErr().println("assay: cannot write " + html + ": " + e.getMessage());
                return 2;
            }
        }
        boolean jsonToStdout = json != null && json.toString().equals("-");
        if (!quiet && !jsonToStdout) {
            spec.commandLine().getOut().print(brief ? TextReport.brief(r) : TextReport.render(r));
        }
        if (json != null) {
            String text = JsonReport.render(r, true);
            if (jsonToStdout) {
                spec.commandLine().getOut().print(text);
            } else {
                try {
                    Files.writeString(json, text, StandardCharsets.UTF_8);
                } catch (IOException e) {
                    spec.commandLine().getErr().println("assay: cannot write " + json + ": " + e.getMessage());
                    return 2;
                }
            }
        }
        spec.commandLine().getOut().flush();
        return r.exitStatus();
    }

    private int parseOnly(Checker checker) {
        Checker.Parsed p = checker.parse(problem, certificate);
        var out = spec.commandLine().getOut();
        if (p.failure() != null) {
            if (!quiet) out.println("input error " + p.failure().render());
            out.flush();
            return 2;
        }
        double s = p.nanos() / 1e9;
        if (!quiet) {
            out.printf(java.util.Locale.ROOT, "parsed %d statements, %d bytes in %.3f s (%.0f statements/s, %.1f MB/s)%n",
                    p.statements(), p.bytes(), s, p.statements() / Math.max(s, 1e-9), p.bytes() / 1e6 / Math.max(s, 1e-9));
        }
        out.flush();
        return 0;
    }
}
