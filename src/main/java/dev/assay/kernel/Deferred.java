package dev.assay.kernel;

import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Supplier;

/**
 * The part of a clause rule's check that a deferring kernel leaves for later: computing the unifier, the derived
 * clause and the comparison with the stated one. It depends only on the premises' stated clauses, the stated
 * substitutions and the stated conclusion, which are immutable, so any thread may run it, in any order with the
 * others. It runs once: {@link #run} on a second thread, or again, does nothing.
 *
 * <p>The fact a deferred step made is provisional until this check has passed; {@link Kernel#settle} is the one
 * place that says every fact of a kernel is checked.
 */
public final class Deferred implements Runnable {

    private static final int WAITING = 0;
    private static final int RUNNING = 1;
    private static final int DONE = 2;

    private final AtomicInteger state = new AtomicInteger(WAITING);
    /** The check itself; dropped once it has run, so that a done check keeps nothing of its step alive. */
    private Supplier<Outcome> work;
    /** Written before the state becomes DONE, read only after it has. */
    private Outcome.Rejected rejected;
    private Throwable thrown;

    Deferred(Supplier<Outcome> work) {
        this.work = work;
    }

    /** Runs the check, unless some thread has already started it. */
    @Override
    public void run() {
        if (!state.compareAndSet(WAITING, RUNNING)) return;
        Outcome o = null;
        Throwable t = null;
        try {
            o = work.get();
        } catch (Throwable e) {
            // Carried to the thread that asks for the outcome, which fails as a check on its own thread would.
            t = e;
        }
        work = null;
        rejected = o instanceof Outcome.Rejected r ? r : null;
        thrown = t;
        synchronized (this) {
            state.set(DONE);
            notifyAll();
        }
    }

    /** Whether the check has run to its end (passed, rejected, or thrown). */
    public boolean isDone() {
        return state.get() == DONE;
    }

    /**
     * The rejection, or null when the check passed; runs the check on this thread if no thread has started it, and
     * waits for it if one has. What the check threw is thrown here.
     */
    public Outcome.Rejected outcome() throws InterruptedException {
        run();
        if (state.get() != DONE) {
            synchronized (this) {
                while (state.get() != DONE) wait();
            }
        }
        if (thrown instanceof RuntimeException e) throw e;
        if (thrown instanceof Error e) throw e;
        if (thrown != null) throw new IllegalStateException(thrown);
        return rejected;
    }

    /** For a done check only: whether it passed. */
    boolean passed() {
        return isDone() && rejected == null && thrown == null;
    }
}
