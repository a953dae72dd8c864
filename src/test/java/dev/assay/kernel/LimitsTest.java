package dev.assay.kernel;

import org.junit.jupiter.api.Test;

import java.time.Duration;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Inputs whose honest processing would take exponential time or space are refused at a stated limit. */
class LimitsTest {

    private final TermFactory f = new TermFactory();
    private final Symbol p = new Symbol("P", Symbol.Kind.PREDICATE, 0);
    private final Formula atom = new Formula.Atomic(new Literal(true, f.application(p)));

    /** P iff (P iff (P iff …)): the negation normal form doubles at every level. */
    private Formula iffTower(int n) {
        Formula x = atom;
        for (int i = 0; i < n; i++) x = new Formula.Iff(atom, x);
        return x;
    }

    @Test
    void nnfSizeIsComputedWithoutBuilding() {
        assertEquals(1, Formulas.nnfSize(atom)[0]);
        // Sizes agree with the normal form actually built, for small towers.
        for (int n = 0; n < 8; n++) {
            long built = Formulas.size(Formulas.nnf(iffTower(n)));
            long predicted = Formulas.nnfSize(iffTower(n))[0];
            assertTrue(predicted >= built, "never an underestimate: n=" + n);
        }
        assertTrue(Formulas.nnfSize(iffTower(200))[0] == Long.MAX_VALUE, "saturates");
    }

    @Test
    void aPremiseWithAHugeNormalFormIsRefusedNotBuilt() {
        Problem problem = new Problem.Builder("towers").declare(p).axiom("tower", iffTower(60)).build();
        Kernel kernel = new Kernel(problem, f);
        assertTimeoutPreemptively(Duration.ofSeconds(20), () -> {
            Outcome o = kernel.nnf("n1", kernel.axiom("tower"), atom);
            Outcome.Rejected r = assertInstanceOf(Outcome.Rejected.class, o);
            assertTrue(r.reason().contains("more than the limit of " + Formulas.NNF_LIMIT), r.reason());
            Outcome c = kernel.clausify("c1", kernel.axiom("tower"), null, new Clause(List.of(new Literal(true, f.application(p)))));
            assertTrue(assertInstanceOf(Outcome.Rejected.class, c).reason().contains("limit"));
        });
    }

    @Test
    void deepClashPositionsAreShortened() {
        Symbol g = new Symbol("g", Symbol.Kind.FUNCTION, 1);
        Term a = f.application(new Symbol("a", Symbol.Kind.FUNCTION, 0));
        Term b = f.application(new Symbol("b", Symbol.Kind.FUNCTION, 0));
        Term x = a;
        Term y = b;
        for (int i = 0; i < 10_000; i++) {
            x = f.application(g, x);
            y = f.application(g, y);
        }
        Unification.NotUnifiable nu = assertInstanceOf(Unification.NotUnifiable.class,
                Unification.mostGeneralUnifier(f, x, y));
        assertTrue(nu.position().contains("more levels"), nu.position());
        assertTrue(nu.describe().length() < 400, nu.describe());
    }
}
