package dev.assay.cli;

import picocli.CommandLine;
import picocli.CommandLine.Command;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.util.Properties;
import java.util.concurrent.atomic.AtomicInteger;

/** The {@code assay} command line. Commands are thin: they call the checker and a report. */
@Command(name = "assay", mixinStandardHelpOptions = true, versionProvider = Main.Version.class,
        description = "Checks refutation certificates of first-order provers against their problems.",
        subcommands = {CheckCommand.class, GateCommand.class, MergeCommand.class, UnifyCommand.class, ShowCommand.class, ProveCommand.class, BenchCommand.class, CommandLine.HelpCommand.class},
        footer = {"", "Exit status of check: 0 theorem or unsatisfiable, 3 vacuous, 1 rejected, 2 input error,",
                "4 time limit, 70 internal error. Each command's help gives its own."})
public final class Main implements Runnable {

    /** Exit status for a bug in Assay itself: never the answer to bad input. */
    public static final int INTERNAL_ERROR = 70;
    /** Stack for the worker thread: the parser recurses on nesting depth; the kernel does not. */
    private static final long STACK_BYTES = 1L << 30;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    public static void main(String[] args) {
        System.exit(run(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
    }

    /** Runs the command line on a thread with a large stack and returns the exit status. */
    public static int run(String[] args, PrintWriter out, PrintWriter err) {
        AtomicInteger status = new AtomicInteger(INTERNAL_ERROR);
        Thread worker = new Thread(null, () -> status.set(execute(args, out, err)), "assay-main", STACK_BYTES);
        worker.start();
        try {
            worker.join();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        out.flush();
        err.flush();
        return status.get();
    }

    static int execute(String[] args, PrintWriter out, PrintWriter err) {
        CommandLine cl = new CommandLine(new Main());
        cl.setOut(out);
        cl.setErr(err);
        cl.setExecutionExceptionHandler((ex, line, parsed) -> {
            err.println("assay: internal error: " + ex + " (this is a bug in Assay; please report it with the inputs)");
            if (System.getenv("ASSAY_DEBUG") != null) ex.printStackTrace(err);
            return INTERNAL_ERROR;
        });
        cl.setParameterExceptionHandler((ex, a) -> {
            err.println("assay: " + ex.getMessage());
            ex.getCommandLine().usage(err);
            return 2;
        });
        try {
            return cl.execute(args);
        } catch (StackOverflowError | OutOfMemoryError e) {
            err.println("assay: " + (e instanceof OutOfMemoryError ? "out of memory" : "input nested too deeply")
                    + "; raise the limits (java -Xmx…, --max-depth) or split the input");
            return 2;
        }
    }

    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"assay " + version()};
        }
    }

    /** SHA-256 of the jar this class was loaded from, or a note when it was not loaded from a jar. */
    public static String jarSha256() {
        try {
            java.nio.file.Path jar = java.nio.file.Path.of(Main.class.getProtectionDomain().getCodeSource().getLocation().toURI());
            if (!java.nio.file.Files.isRegularFile(jar)) return "(not run from a jar: " + jar + ")";
            java.security.MessageDigest md = java.security.MessageDigest.getInstance("SHA-256");
            try (InputStream in = java.nio.file.Files.newInputStream(jar)) {
                byte[] buf = new byte[1 << 16];
                for (int n; (n = in.read(buf)) > 0; ) md.update(buf, 0, n);
            }
            StringBuilder sb = new StringBuilder();
            for (byte b : md.digest()) sb.append(String.format("%02x", b));
            return sb.toString();
        } catch (Exception e) {
            return "(unknown: " + e.getMessage() + ")";
        }
    }

    public static String version() {
        Properties p = new Properties();
        try (InputStream in = Main.class.getResourceAsStream("/dev/assay/version.properties")) {
            if (in != null) p.load(in);
        } catch (IOException ignored) {
            // fall through to "unknown"
        }
        return p.getProperty("version", "unknown");
    }
}
