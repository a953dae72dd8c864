package dev.assay.cli;

import dev.assay.check.CheckResult;
import dev.assay.check.Checker;
import dev.assay.report.Canonical;
import dev.assay.kernel.Problem;
import dev.assay.syntax.Forget;
import dev.assay.syntax.Name;
import dev.assay.syntax.Step;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;

@Command(name = "show", mixinStandardHelpOptions = true,
        description = {"Prints the problem (and the certificate) as the checker understood them, in canonical form:",
                "every symbol declared with its kind and arity, every formula and clause fully resolved.",
                "The output parses back to the same problem and certificate."},
        footer = {"", "Exit status: as for check when a certificate is given; 0, or 2 for an input error, otherwise."})
final class ShowCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "PROBLEM")
    Path problem;

    @Parameters(index = "1", paramLabel = "CERTIFICATE", arity = "0..1")
    Path certificate;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        StringBuilder cert = new StringBuilder();
        Checker.Listener listener = new Checker.Listener() {
            @Override
            public void problem(Problem p) {
                out.print(Canonical.problem(p));
                if (certificate != null) cert.append("certificate for ").append(p.name()).append('\n');
            }

            @Override
            public void step(Step s, Object conclusion, List<String> premises) {
                cert.append(Canonical.step(s, conclusion)).append('\n');
            }

            @Override
            public void forget(Forget f) {
                cert.append("forget ").append(f.labels().stream().map(Name::text).collect(Collectors.joining(", ")))
                        .append('\n');
            }
        };
        CheckResult r = new Checker().check(problem, certificate, listener);
        if (certificate != null) {
            out.println();
            out.print(cert);
        }
        if (r.failure() != null) {
            spec.commandLine().getErr().println("assay show: stopped at " + r.failure().render());
        }
        if (certificate == null) return r.failure() == null ? 0 : 2;
        return r.exitStatus();
    }

}
