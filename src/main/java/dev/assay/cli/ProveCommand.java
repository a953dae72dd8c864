package dev.assay.cli;

import dev.assay.prover.Prover;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Locale;
import java.util.concurrent.Callable;

@Command(name = "prove", mixinStandardHelpOptions = true,
        description = {"Searches for a refutation of PROBLEM with the untrusted reference prover and writes it as a"
                + " certificate to CERTIFICATE.",
                "The certificate is checked by the kernel before it is written; one the kernel rejects is never written."},
        footer = {"", "Exit status:",
                "  0   proved: the certificate was checked by the kernel, then written",
                "  4   gave up: the time or memory limit was reached first",
                "  5   saturated without a refutation: the goal does not follow in the prover's calculus",
                "  2   input error: the problem cannot be read, or the certificate cannot be written",
                "  70  internal error: the kernel rejected the prover's own certificate (a bug; nothing is written)",
                "",
                "A progress line (given clauses, kept clauses, time) is shown while searching when the output is a"
                        + " terminal."})
final class ProveCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "PROBLEM", description = "the problem file (.problem)")
    Path problem;

    @Option(names = {"-o", "--output"}, required = true, paramLabel = "CERTIFICATE",
            description = "where to write the certificate (.proof)")
    Path output;

    @Option(names = "--timeout", paramLabel = "SECONDS", description = "give up after this many seconds (default: ${DEFAULT-VALUE})")
    double timeout = 60;

    @Option(names = "--no-selection", description = "do not select negative literals (plain ordered inferences)")
    boolean noSelection;

    @Option(names = {"-q", "--quiet"}, description = "print nothing but errors; the exit status tells the outcome")
    boolean quiet;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        if (!(timeout > 0) || timeout > 1e9) {
            err.println("assay prove: --timeout must be a positive number of seconds");
            return 2;
        }
        Prover.Options options = new Prover.Options(Duration.ofMillis((long) (timeout * 1000)), !noSelection, 5, null);
        boolean terminal = System.console() != null && !quiet;
        int[] width = {0};
        if (terminal) {
            options = options.withProgress((given, kept, ms) -> {
                String line = String.format(Locale.ROOT, "assay prove: %d given, %d kept, %.1f s", given, kept, ms / 1000.0);
                width[0] = Math.max(width[0], line.length());
                err.print("\r" + line + " ".repeat(width[0] - line.length()));
                err.flush();
            });
        }
        Prover.Outcome o = new Prover(options).prove(problem, output);
        if (terminal && width[0] > 0) {
            err.print("\r" + " ".repeat(width[0]) + "\r");
            err.flush();
        }
        switch (o.status()) {
            case PROVED:
            case GAVE_UP:
            case SATURATED:
                if (!quiet) out.println("assay prove: " + o.message());
                break;
            case INPUT_ERROR:
                err.println("assay prove: " + o.message());
                break;
            case INTERNAL_ERROR:
                err.println("assay prove: " + o.message());
                break;
            default:
                break;
        }
        out.flush();
        err.flush();
        return o.status().exitStatus();
    }
}
