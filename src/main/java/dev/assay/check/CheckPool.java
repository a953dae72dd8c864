package dev.assay.check;

import dev.assay.kernel.Deferred;
import dev.assay.syntax.BigStack;

import java.util.concurrent.LinkedBlockingQueue;

/**
 * Threads that run the deferred checks of one certificate's steps, a batch at a time, oldest batch first. Running a
 * check twice does nothing, so the checking thread may run any of them itself, and does when it gets too far ahead
 * (see Checker's window). Which thread ran a check changes nothing in the verdict or the report: the checker reads the
 * outcomes in the order of the steps.
 */
final class CheckPool implements AutoCloseable {

    /** Deferred checks handed to the pool at once; a hand-over costs about as much as a small step's check. */
    static final int BATCH = 64;

    private final LinkedBlockingQueue<Deferred[]> queue = new LinkedBlockingQueue<>();
    private final Thread[] workers;

    CheckPool(int threads) {
        workers = new Thread[threads];
        for (int i = 0; i < threads; i++) {
            // The kernel's checks walk terms as deep as the readers accept, so they get the checking thread's stack.
            Thread t = new Thread(null, this::work, "assay-check-" + (i + 1), BigStack.STACK_BYTES);
            t.setDaemon(true);
            workers[i] = t;
            t.start();
        }
    }

    /** Hands over a full or final batch; the array is the pool's from now on. */
    void submit(Deferred[] batch) {
        queue.add(batch);
    }

    /** The oldest batch no thread has taken yet, for the checking thread to run itself; null when there is none. */
    Deferred[] steal() {
        return queue.poll();
    }

    private void work() {
        try {
            while (true) {
                Deferred[] batch = queue.take();
                if (!run(batch)) return;
            }
        } catch (InterruptedException e) {
            // closed
        }
    }

    /** Runs a batch's checks on this thread; false when the thread was interrupted before the end. */
    static boolean run(Deferred[] batch) {
        for (Deferred d : batch) {
            if (d == null) break;
            if (Thread.currentThread().isInterrupted()) return false;
            d.run();
        }
        return true;
    }

    /** Stops the threads: each finishes the check it is running, if any, and takes no other. */
    @Override
    public void close() {
        queue.clear();
        for (Thread t : workers) t.interrupt();
    }
}
