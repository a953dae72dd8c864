package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * A kernel that defers the second part of its clause rules' checks ({@link Kernel#Kernel(Problem, TermFactory,
 * boolean)}), and {@link Deferred}, the check it leaves behind. The rule tests run once more on a deferring kernel
 * (the build's {@code rules-deferred} execution); these tests hold what that run cannot see: which steps defer and
 * which do not, that {@link Kernel#settle} finds the first failed step in step order however the checks ran, and
 * that a check runs once whichever thread asks.
 */
class DeferredKernelTest extends RuleTestSupport {

    private Kernel deferring;

    @BeforeEach
    void setUp() {
        k.function("b", 0);
        k.predicate("Q", 2);
        String[] axioms = {"A: [x] not P(x) or R(x)",
                "B: P(a)",
                "C: [x] P(x) or P(x)",
                "E: [x] x = a or P(x)",
                "N: not P(b)",
                "V: [x] x != a or P(x)",
                "W: [x, y] x = a or y = a or Q(x, y)",
                "F: Q(f(a), b)",
                "H: [x] not R(x) or Q(x, x)"};
        start(axioms);
        deferring = new Kernel(problem, k.f, true);
        facts.clear();
        for (String entry : axioms) {
            int colon = entry.indexOf(':');
            String name = entry.substring(0, colon);
            Outcome o = deferring.clausify(name, deferring.axiom(name), null, k.clause(entry.substring(colon + 1)));
            Fact f = ((Outcome.Accepted) o).fact();
            assertNull(f.pending(), "clausify is checked in full at once");
            facts.put(name, f);
        }
    }

    private Fact provisional(Outcome o) {
        Outcome.Accepted a = assertInstanceOf(Outcome.Accepted.class, o, o::toString);
        assertNotNull(a.fact().pending(), "the step's check was deferred");
        assertFalse(a.fact().pending().isDone(), "a deferred check does not run until asked");
        return a.fact();
    }

    private Outcome goodResolve(String label) {
        return deferring.resolve(label, fact("A"), 1, null, fact("B"), 1, null, k.clause("R(a)"));
    }

    /** The resolvent is R(a); {@code wrong}, R(b) or R(f(a)), is not a variant of it. */
    private Outcome badResolve(String label, String wrong) {
        return deferring.resolve(label, fact("A"), 1, null, fact("B"), 1, null, k.clause(wrong));
    }

    private Outcome badResolve(String label) {
        return badResolve(label, "R(b)");
    }

    // ------------------------------------------------------------------ which steps defer

    @Test
    void everyClauseRuleThatComputesDefers() {
        provisional(goodResolve("r"));
        provisional(deferring.factor("f", fact("C"), 1, 2, null, k.clause("[x] P(x)")));
        provisional(deferring.instantiate("i", fact("A"), k.substitution("{x := a}"), k.clause("not P(a) or R(a)")));
        provisional(deferring.paramodulate("p", fact("E"), 1, true, fact("N"), 1, new int[] {1}, null, null,
                k.clause("P(b) or not P(a)")));
        provisional(deferring.eqres("q", fact("V"), 1, null, k.clause("P(a)")));
        provisional(deferring.eqfactor("e", fact("W"), 1, 2, null, k.clause("[x] x = a or a != a or Q(x, x)")));
        assertNull(settledKernel(), "every one of those steps is sound");
    }

    @Test
    void reflexivityAndFormulaRulesAreNeverDeferred() {
        Outcome.Accepted r = assertInstanceOf(Outcome.Accepted.class, deferring.reflexivity("t", k.clause("a = a")));
        assertNull(r.fact().pending());
        Outcome bad = deferring.reflexivity("u", k.clause("a = b"));
        assertInstanceOf(Outcome.Rejected.class, bad, "reflexivity rejects at once");
    }

    @Test
    void aKernelThatDoesNotDeferChecksInFull() throws InterruptedException {
        Kernel plain = new Kernel(problem, k.f, false);
        Fact a = ((Outcome.Accepted) plain.clausify("A", plain.axiom("A"), null, k.clause("[x] not P(x) or R(x)"))).fact();
        Fact b = ((Outcome.Accepted) plain.clausify("B", plain.axiom("B"), null, k.clause("P(a)"))).fact();
        Outcome ok = plain.resolve("r", a, 1, null, b, 1, null, k.clause("R(a)"));
        assertNull(((Outcome.Accepted) ok).fact().pending());
        Outcome no = plain.resolve("s", a, 1, null, b, 1, null, k.clause("R(b)"));
        assertInstanceOf(Outcome.Rejected.class, no);
        assertNull(plain.settle());
    }

    @Test
    void whatNeedsNoComputationIsCheckedAtOnce() {
        // Premise kinds, literal indexes and the signature are checked before anything is deferred.
        Outcome index = deferring.resolve("r", fact("A"), 3, null, fact("B"), 1, null, k.clause("R(a)"));
        Outcome.Rejected r = assertInstanceOf(Outcome.Rejected.class, index);
        assertEquals("resolve", r.rule());
        Outcome unknown = deferring.resolve("r", fact("A"), 1, null, fact("B"), 1, null, k.clause("R(nowhere)"));
        assertInstanceOf(Outcome.Rejected.class, unknown);
        Outcome foreign = deferring.resolve("r", fact("A"), 1, null, accepted(kernel.clausify("B", kernel.axiom("B"),
                null, k.clause("P(a)"))), 1, null, k.clause("R(a)"));
        assertInstanceOf(Outcome.Rejected.class, foreign, "a fact of another kernel is no premise");
    }

    // ------------------------------------------------------------------ settle

    private Outcome.Rejected settledKernel() {
        try {
            return deferring.settle();
        } catch (InterruptedException e) {
            throw new AssertionError(e);
        }
    }

    @Test
    void aBadStepIsAcceptedProvisionallyAndSettleRejectsIt() {
        Fact bad = provisional(badResolve("s"));
        Outcome.Rejected r = settledKernel();
        assertNotNull(r, "settle must not pass a step whose check fails");
        assertEquals("resolve", r.rule());
        assertEquals("R(b)", r.stated());
        assertTrue(bad.pending().isDone());
        assertFalse(bad.pending().passed());
    }

    @Test
    void settleNamesTheFirstFailedStepWhateverOrderTheChecksRanIn() throws InterruptedException {
        provisional(goodResolve("s1"));
        Fact second = provisional(badResolve("s2", "R(b)"));
        provisional(goodResolve("s3"));
        Fact fourth = provisional(badResolve("s4", "R(f(a))"));
        // The later failure is found first, on another thread.
        runOnAnotherThread(fourth.pending());
        runOnAnotherThread(second.pending());
        assertNotNull(fourth.pending().outcome());
        Outcome.Rejected r = settledKernel();
        assertNotNull(r);
        assertEquals("R(b)", r.stated(), "the rejection of s2, not of s4");
    }

    @Test
    void aFailedCheckThatHasRunIsNotDroppedByLaterSteps() throws InterruptedException {
        // A kernel drops passed checks at the head of its queue as steps arrive; a failed one must stay.
        Fact bad = provisional(badResolve("s1"));
        assertNotNull(bad.pending().outcome());
        for (int n = 2; n < 6; n++) provisional(goodResolve("s" + n));
        Outcome.Rejected r = settledKernel();
        assertNotNull(r);
        assertEquals("R(b)", r.stated());
    }

    @Test
    void aCheckNotYetRunIsNotDroppedByLaterSteps() {
        provisional(badResolve("s1"));
        for (int n = 2; n < 6; n++) provisional(goodResolve("s" + n));
        Outcome.Rejected r = settledKernel();
        assertNotNull(r);
        assertEquals("R(b)", r.stated());
    }

    @Test
    void passedChecksAtTheHeadAreDroppedAndTheRestStillSettles() throws InterruptedException {
        for (int n = 1; n < 4; n++) assertNull(provisional(goodResolve("s" + n)).pending().outcome());
        Fact bad = provisional(badResolve("s4"));
        Outcome.Rejected r = settledKernel();
        assertNotNull(r);
        assertEquals("R(b)", r.stated());
        assertTrue(bad.pending().isDone());
        // Settling again gives the same answer: the failed check stays at the head.
        assertSame(r, settledKernel());
    }

    @Test
    void aConclusionBuiltOnAProvisionalFactIsCheckedAgainstItsStatedClause() {
        // s1 wrongly states R(b); s2 resolves that stated clause soundly with H. Only s1 may be blamed, and s2's
        // own check is made against what s1 stated.
        Fact wrong = provisional(badResolve("s1"));
        Fact built = provisional(deferring.resolve("s2", wrong, 1, null, fact("H"), 1, null, k.clause("Q(b, b)")));
        Outcome.Rejected r = settledKernel();
        assertNotNull(r);
        assertEquals("R(b)", r.stated(), "s1's rejection");
        assertNull(assertDoesNotThrow(() -> built.pending().outcome()), "s2 follows from what s1 stated");
    }

    @Test
    void settleIsNullWhenEveryStepPassed() {
        for (int n = 1; n < 100; n++) provisional(goodResolve("s" + n));
        assertNull(settledKernel());
        assertNull(settledKernel(), "and stays so");
    }

    // ------------------------------------------------------------------ Deferred

    private static void runOnAnotherThread(Runnable r) throws InterruptedException {
        Thread t = new Thread(r, "deferred-check");
        t.start();
        t.join();
    }

    @Test
    void aCheckRunsOnceHoweverOftenAndOnWhicheverThreadItIsAsked() throws Exception {
        AtomicInteger runs = new AtomicInteger();
        Deferred d = new Deferred(() -> {
            runs.incrementAndGet();
            return null;
        });
        assertFalse(d.isDone());
        assertFalse(d.passed(), "not done is not passed");
        Thread[] threads = new Thread[4];
        for (int t = 0; t < threads.length; t++) {
            threads[t] = new Thread(d);
            threads[t].start();
        }
        for (Thread t : threads) t.join();
        d.run();
        assertNull(d.outcome());
        assertEquals(1, runs.get());
        assertTrue(d.isDone());
        assertTrue(d.passed());
    }

    @Test
    void outcomeRunsACheckNoThreadHasStartedOnTheAskingThread() throws InterruptedException {
        AtomicReference<Thread> ranOn = new AtomicReference<>();
        Deferred d = new Deferred(() -> {
            ranOn.set(Thread.currentThread());
            return null;
        });
        assertNull(d.outcome());
        assertSame(Thread.currentThread(), ranOn.get());
    }

    @Test
    void outcomeWaitsForACheckAnotherThreadIsRunning() throws Exception {
        CountDownLatch started = new CountDownLatch(1);
        CountDownLatch release = new CountDownLatch(1);
        Outcome.Rejected rejection = new Outcome.Rejected("resolve", "no", "stated", "derived");
        Deferred d = new Deferred(() -> {
            started.countDown();
            try {
                release.await();
            } catch (InterruptedException e) {
                throw new IllegalStateException(e);
            }
            return rejection;
        });
        Thread runner = new Thread(d, "runner");
        runner.start();
        assertTrue(started.await(10, TimeUnit.SECONDS));
        AtomicReference<Outcome.Rejected> seen = new AtomicReference<>();
        Thread asker = new Thread(() -> {
            try {
                seen.set(d.outcome());
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }, "asker");
        asker.start();
        asker.join(200);
        assertTrue(asker.isAlive(), "the asker waits while the check runs");
        assertFalse(d.isDone());
        release.countDown();
        asker.join(10_000);
        runner.join(10_000);
        assertSame(rejection, seen.get());
        assertTrue(d.isDone());
        assertFalse(d.passed(), "a rejected check did not pass");
    }

    @Test
    void whatTheCheckThrewIsThrownToWhoeverAsks() throws InterruptedException {
        Deferred runtime = new Deferred(() -> {
            throw new IllegalArgumentException("inside the check");
        });
        runOnAnotherThread(runtime);
        assertTrue(runtime.isDone());
        assertFalse(runtime.passed(), "a check that threw did not pass");
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, runtime::outcome);
        assertEquals("inside the check", e.getMessage());
        assertThrows(IllegalArgumentException.class, runtime::outcome, "and again on a second ask");

        Deferred error = new Deferred(() -> {
            throw new StackOverflowError("deep");
        });
        runOnAnotherThread(error);
        assertThrows(StackOverflowError.class, error::outcome);

        Deferred checked = new Deferred(() -> DeferredKernelTest.<RuntimeException>sneaky(new java.io.IOException("checked")));
        runOnAnotherThread(checked);
        IllegalStateException wrapped = assertThrows(IllegalStateException.class, checked::outcome);
        assertInstanceOf(java.io.IOException.class, wrapped.getCause());
    }

    /** Throws a checked exception past a {@code Supplier}, as a faulty check could. */
    @SuppressWarnings("unchecked")
    private static <T extends Throwable> Outcome sneaky(Throwable t) throws T {
        throw (T) t;
    }

    @Test
    void aRejectedOutcomeAndAnAcceptedOneAreTold() throws InterruptedException {
        Outcome.Rejected no = new Outcome.Rejected("factor", "no", "stated", null);
        Deferred rejected = new Deferred(() -> no);
        assertSame(no, rejected.outcome());
        assertFalse(rejected.passed());
        Deferred accepted = new Deferred(() -> new Outcome.Accepted(fact("B")));
        assertNull(accepted.outcome(), "an acceptance is no rejection");
        assertTrue(accepted.passed());
    }
}
