package dev.assay.cli;

import dev.assay.bench.BenchRun;
import dev.assay.bench.Families;
import dev.assay.bench.Family;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

@Command(name = "bench", mixinStandardHelpOptions = true,
        description = {"Generates benchmark certificates and times whole checks (see docs/performance.md)."},
        subcommands = {BenchCommand.Generate.class, BenchCommand.Run.class})
final class BenchCommand implements Runnable {

    @Spec
    CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    @Command(name = "generate", mixinStandardHelpOptions = true,
            description = {"Writes DIR/FAMILY-N.problem and DIR/FAMILY-N.proof, a valid certificate of N steps"
                    + " (verdict theorem). The certificate is streamed, so any N fits in memory.",
                    "Families: chain, wide, deep, equality, unify; corpus copies the reference prover's certificates."},
            footer = {"", "Exit status: 0 written, 2 bad arguments or the files cannot be written."})
    static final class Generate implements Callable<Integer> {
        @Spec
        CommandSpec spec;

        @Parameters(index = "0", paramLabel = "FAMILY", description = "chain, wide, deep, equality, unify or corpus")
        String family;

        @Option(names = "--steps", paramLabel = "N", description = "number of steps (default: ${DEFAULT-VALUE})")
        long steps = 10_000;

        @Option(names = "--forget", description = "emit forget lines so that the checker can release earlier steps")
        boolean forget;

        @Option(names = "--no-digest", description = "leave out the digest line")
        boolean noDigest;

        @Option(names = "--corpus", paramLabel = "DIR", description = "where corpus reads from (default: ${DEFAULT-VALUE})")
        Path corpus = Path.of("certificates", "pelletier");

        @Option(names = {"-o", "--output"}, required = true, paramLabel = "DIR", description = "the folder to write to")
        Path output;

        @Override
        public Integer call() {
            PrintWriter out = spec.commandLine().getOut();
            PrintWriter err = spec.commandLine().getErr();
            try {
                if (family.equals(Families.CORPUS)) {
                    if (!Files.isDirectory(corpus)) {
                        err.println("assay bench generate: no folder " + corpus);
                        return 2;
                    }
                    List<Families.Member> members = Families.copyCorpus(corpus, output);
                    out.println("copied " + members.size() + " pairs to " + output);
                    return 0;
                }
                Family f = Families.family(family);
                if (f == null) {
                    err.println("assay bench generate: no family " + family + "; the families are " + Families.names());
                    return 2;
                }
                if (steps < f.minSteps()) {
                    err.println("assay bench generate: " + family + " needs at least " + f.minSteps() + " steps");
                    return 2;
                }
                Families.Member m = Families.generate(f, steps, forget, !noDigest, output);
                out.printf("%s: %d steps, %.1f MB%n", m.proof(), m.steps(), m.bytes() / 1e6);
                return 0;
            } catch (IOException e) {
                err.println("assay bench generate: cannot write to " + output + ": " + e.getMessage());
                return 2;
            }
        }
    }

    @Command(name = "run", mixinStandardHelpOptions = true,
            description = {"Generates each family at each size into a temporary folder and times its check in a"
                    + " child JVM (start-up included), with the child's peak live heap. Prints a markdown table."},
            footer = {"", "Exit status: 0 measured (every check a theorem), 1 a check did not verify, 2 bad arguments."})
    static final class Run implements Callable<Integer> {
        @Spec
        CommandSpec spec;

        @Option(names = "--families", split = ",", paramLabel = "F,...",
                description = "families to time (default: chain,wide,deep,equality,unify,corpus)")
        List<String> families = new ArrayList<>(Families.names());

        @Option(names = "--sizes", split = ",", paramLabel = "N,...", description = "steps per certificate (default: 1000,10000)")
        List<Long> sizes = new ArrayList<>(List.of(1_000L, 10_000L));

        @Option(names = "--repeat", paramLabel = "K", description = "checks per certificate; the median is reported (default: ${DEFAULT-VALUE})")
        int repeat = 3;

        @Option(names = "--xmx", paramLabel = "SIZE", description = "heap of the child JVM (default: ${DEFAULT-VALUE})")
        String xmx = "2g";

        @Option(names = "--jvm-arg", paramLabel = "ARG", description = "another option for the child JVM (repeatable)")
        List<String> jvmArgs = new ArrayList<>();

        @Option(names = "--forget", description = "generate the certificates with forget lines")
        boolean forget;

        @Option(names = "--corpus", paramLabel = "DIR", description = "the corpus folder (default: ${DEFAULT-VALUE})")
        Path corpus = Path.of("certificates", "pelletier");

        @Option(names = "--keep", paramLabel = "DIR", description = "generate into DIR and keep the files")
        Path keep;

        @Option(names = "--timeout", paramLabel = "SECONDS", description = "limit for one child JVM (default: ${DEFAULT-VALUE})")
        double timeout = 600;

        @Option(names = "--out", paramLabel = "FILE.md", description = "also write the table to FILE.md")
        Path outFile;

        @Override
        public Integer call() throws Exception {
            PrintWriter out = spec.commandLine().getOut();
            PrintWriter err = spec.commandLine().getErr();
            if (repeat < 1 || !(timeout > 0)) {
                err.println("assay bench run: --repeat must be at least 1 and --timeout positive");
                return 2;
            }
            for (String f : families) {
                if (!Families.names().contains(f)) {
                    err.println("assay bench run: no family " + f + "; the families are " + Families.names());
                    return 2;
                }
            }
            BenchRun.Options options = new BenchRun.Options(families, sizes, repeat, xmx, forget, corpus, keep, timeout,
                    jvmArgs);
            BenchRun run = new BenchRun(options, line -> {
                err.println("assay bench: " + line);
                err.flush();
            });
            List<BenchRun.Row> rows = run.run();
            StringBuilder cmd = new StringBuilder("assay bench run");
            cmd.append(" --families ").append(String.join(",", families));
            cmd.append(" --sizes ").append(String.join(",", sizes.stream().map(String::valueOf).toList()));
            cmd.append(" --repeat ").append(repeat).append(" --xmx ").append(xmx);
            for (String a : jvmArgs) cmd.append(" --jvm-arg ").append(a);
            if (forget) cmd.append(" --forget");
            String md = BenchRun.markdown(options, rows, cmd.toString());
            // What was asked for and not measured is said in the table's file too, not only on standard error.
            if (!run.skipped().isEmpty()) md += "\nNot measured: " + String.join("; ", run.skipped()) + ".\n";
            out.print(md);
            if (outFile != null) Files.writeString(outFile, md, StandardCharsets.UTF_8);
            boolean ok = rows.stream().allMatch(r -> r.verdict() != null && !r.verdict().contains("rejected")
                    && !r.verdict().contains("error") && !r.verdict().contains("timeout") && !r.verdict().startsWith("no result"));
            return ok && !rows.isEmpty() ? 0 : 1;
        }
    }
}
