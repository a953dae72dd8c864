package dev.assay.cli;

import dev.assay.check.Checker;
import picocli.CommandLine.Option;

/** The input limits and the thread count, shared by the commands that check certificates. */
final class LimitOptions {

    @Option(names = "--max-depth", paramLabel = "N", description = "nesting depth allowed in the input (default: ${DEFAULT-VALUE})")
    int maxDepth = Checker.Options.defaults().maxDepth();

    @Option(names = "--max-input-size", paramLabel = "BYTES",
            description = "largest problem or certificate file, in bytes (default: ${DEFAULT-VALUE})")
    long maxInputBytes = Checker.Options.DEFAULT_MAX_INPUT_BYTES;

    @Option(names = "--max-term-size", paramLabel = "N",
            description = "most symbol occurrences in one statement (default: ${DEFAULT-VALUE})")
    long maxTermSize = Checker.Options.DEFAULT_MAX_TERM_SIZE;

    @Option(names = "--max-steps", paramLabel = "N", description = "most steps in one certificate (default: ${DEFAULT-VALUE})")
    long maxSteps = Checker.Options.DEFAULT_MAX_STEPS;

    @Option(names = "--threads", paramLabel = "N",
            description = "threads per check: 1 reads and checks in turn, 2 reads ahead while checking, 3 or more also"
                    + " check steps on N-2 further threads (default: 2, or 1 on one processor; in a gate, 1 when its jobs"
                    + " already take every processor)")
    Integer threads;

    /** The checker options for {@code jobs} checks at once, or null after printing why they are not valid. */
    Checker.Options options(java.io.PrintWriter err, int jobs) {
        if (maxDepth < 1 || maxInputBytes < 1 || maxTermSize < 1 || maxSteps < 1 || (threads != null && threads < 1)) {
            err.println("assay: --max-depth, --max-input-size, --max-term-size, --max-steps and --threads take positive numbers");
            return null;
        }
        int n = threads != null ? threads : Checker.Options.defaultThreads(Runtime.getRuntime().availableProcessors(), jobs);
        return new Checker.Options(maxDepth, maxInputBytes, maxTermSize, maxSteps, n);
    }
}
