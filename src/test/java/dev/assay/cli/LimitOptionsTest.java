package dev.assay.cli;

import dev.assay.check.Checker;
import org.junit.jupiter.api.Test;

import java.io.PrintWriter;
import java.io.StringWriter;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The threads a check gets: asked for, or chosen from the processors and the jobs that share them. */
class LimitOptionsTest {

    @Test
    void twoThreadsPerCheckOnlyWhenEveryJobCanHaveTwoProcessors() {
        assertEquals(2, Checker.Options.defaultThreads(2, 1), "one check on two processors reads ahead");
        assertEquals(1, Checker.Options.defaultThreads(2, 2), "two jobs on two processors: one thread each");
        assertEquals(1, Checker.Options.defaultThreads(1, 1), "one processor");
        assertEquals(2, Checker.Options.defaultThreads(8, 4));
        assertEquals(1, Checker.Options.defaultThreads(8, 5));
        assertEquals(1, Checker.Options.defaultThreads(8, 8));
        assertEquals(2, Checker.Options.defaultThreads(4, 0), "no jobs counts as one");
    }

    @Test
    void anExplicitThreadCountIsKept() {
        LimitOptions o = new LimitOptions();
        o.threads = 2;
        PrintWriter err = new PrintWriter(new StringWriter());
        assertEquals(2, o.options(err, 64).threads(), "asked for, even with many jobs");
        o.threads = 1;
        assertEquals(1, o.options(err, 1).threads());
        o.threads = null;
        int processors = Runtime.getRuntime().availableProcessors();
        Checker.Options chosen = o.options(err, processors);
        assertEquals(Checker.Options.defaultThreads(processors, processors), chosen.threads());
        assertEquals(1, chosen.threads(), "as many jobs as processors leave none for reading ahead");
    }

    @Test
    void aThreadCountBelowOneIsRefused() {
        LimitOptions o = new LimitOptions();
        o.threads = 0;
        StringWriter text = new StringWriter();
        assertNull(o.options(new PrintWriter(text, true), 1));
        assertTrue(text.toString().contains("--threads take positive numbers"), text.toString());
    }
}
