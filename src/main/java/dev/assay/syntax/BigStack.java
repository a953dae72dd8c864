package dev.assay.syntax;

import java.util.concurrent.Callable;

/**
 * Runs work on a thread with a big stack. The parsers are recursive descent, so the depth of
 * input they accept is bounded by the stack; the readers' default nesting limit
 * ({@link #SAFE_DEPTH}) is chosen to be safe on a {@link #STACK_BYTES} stack:
 * <pre>
 * List&lt;ProblemStatement&gt; problem = BigStack.run(() -&gt; ProblemReader.readAll(path));
 * </pre>
 */
public final class BigStack {

    /** The stack size of {@link #run}: 1 GiB (reserved address space; pages are touched only when used). */
    public static final long STACK_BYTES = 1L << 30;

    /**
     * The nesting depth the readers accept by default. Measured on a {@link #STACK_BYTES} stack:
     * a million levels of parentheses, of {@code not}, of quantifiers or of function
     * applications parse, a syntax error at the bottom included; this default keeps a margin of
     * ten for the layers that walk the result.
     */
    public static final int SAFE_DEPTH = 100_000;

    private BigStack() {
    }

    /** Runs {@code task} on a new thread named "assay-main" with a {@link #STACK_BYTES} stack, and waits for it. */
    public static <T> T run(Callable<T> task) throws Exception {
        return run(task, STACK_BYTES);
    }

    /** As {@link #run(Callable)} with a stack of {@code stackBytes}; its exception or error is rethrown as is. */
    public static <T> T run(Callable<T> task, long stackBytes) throws Exception {
        Object[] result = new Object[1];
        Throwable[] failure = new Throwable[1];
        Thread thread = new Thread(null, () -> {
            try {
                result[0] = task.call();
            } catch (Throwable t) {
                failure[0] = t;
            }
        }, "assay-main", stackBytes);
        thread.start();
        try {
            thread.join();
        } catch (InterruptedException e) {
            thread.interrupt();
            throw e;
        }
        if (failure[0] instanceof Exception e) {
            throw e;
        }
        if (failure[0] instanceof Error e) {
            throw e;
        }
        if (failure[0] != null) {
            throw new IllegalStateException(failure[0]);
        }
        @SuppressWarnings("unchecked")
        T value = (T) result[0];
        return value;
    }
}
