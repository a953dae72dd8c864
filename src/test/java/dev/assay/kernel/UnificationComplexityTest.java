package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The exponential families of Baader &amp; Snyder, "Unification Theory", Handbook of Automated Reasoning, 2001,
 * chapter 8, section 2 (recalled from memory): problems whose most general unifier, written out as trees, is
 * exponential in the size of the problem, so that an algorithm that copies terms, or an occurs check that walks trees,
 * takes exponential time. On the shared term graph the work must stay near-linear.
 *
 * <p>The timeouts are generous on purpose: they catch exponential behaviour (which at n = 60 would take years), they
 * are not speed targets.
 */
class UnificationComplexityTest {

    private static final Duration GENEROUS = Duration.ofSeconds(10);

    /** x0 … xn. */
    private static List<Variable> vars(TermFactory f, String base, int n) {
        List<Variable> out = new ArrayList<>();
        for (int i = 0; i <= n; i++) out.add(f.variable(base + i));
        return out;
    }

    /** f(x1, …, xn) =? f(g(x0, x0), …, g(x_{n-1}, x_{n-1})): xn := a tree of 2^(n+1) - 1 symbols. */
    @ParameterizedTest
    @ValueSource(ints = {1, 2, 10, 60, 1000})
    void doublingFamily(int n) {
        assertTimeoutPreemptively(GENEROUS, () -> {
            TermFactory f = new TermFactory();
            Symbol fn = new Symbol("f", Symbol.Kind.FUNCTION, n);
            Symbol g = new Symbol("g", Symbol.Kind.FUNCTION, 2);
            List<Variable> x = vars(f, "x", n);
            Term[] left = new Term[n];
            Term[] right = new Term[n];
            for (int i = 0; i < n; i++) {
                left[i] = x.get(i + 1);
                right[i] = f.application(g, x.get(i), x.get(i));
            }
            Term l = f.application(fn, left);
            Term r = f.application(fn, right);
            int before = f.size();
            Unification.Result res = Unification.mostGeneralUnifier(f, l, r);
            Substitution sigma = assertInstanceOf(Unification.Unified.class, res).unifier();
            Term sl = sigma.apply(l);
            assertSame(sl, sigma.apply(r), "the unifier does not unify");
            // Most general: x0 stays free and every xi is the complete binary g-tree over x0 of height i.
            assertEquals(null, sigma.get(x.get(0)));
            Term expected = x.get(0);
            for (int i = 1; i <= n; i++) {
                expected = f.application(g, expected, expected);
                assertSame(expected, sigma.apply(x.get(i)), "binding of x" + i);
            }
            Term xn = sigma.apply(x.get(n));
            long tree = xn.treeSize();
            if (n < 62) assertEquals((1L << (n + 1)) - 1, tree, "tree size of x" + n);
            else assertEquals(Long.MAX_VALUE, tree, "tree size saturates");
            assertEquals(n + 1, xn.depth());
            // The work is not exponential: the graph of the result has a handful of nodes per variable.
            int made = f.size() - before;
            assertTrue(made <= 4 * n + 4, "made " + made + " applications for n = " + n);
        });
    }

    /**
     * h(x1, …, xn, f(y0, y0), …, f(y_{n-1}, y_{n-1}), yn) =? h(f(x0, x0), …, f(x_{n-1}, x_{n-1}), y1, …, yn, xn):
     * both halves build the same exponential tree and the last pair compares them, which is exponential for any
     * algorithm that compares or checks occurrence on trees (Baader &amp; Snyder 2001, section 2, recalled from memory).
     */
    @ParameterizedTest
    @ValueSource(ints = {1, 3, 60, 1000})
    void twoTowersFamily(int n) {
        assertTimeoutPreemptively(GENEROUS, () -> {
            TermFactory f = new TermFactory();
            Symbol h = new Symbol("h", Symbol.Kind.FUNCTION, 2 * n + 1);
            Symbol fn = new Symbol("f", Symbol.Kind.FUNCTION, 2);
            List<Variable> x = vars(f, "x", n);
            List<Variable> y = vars(f, "y", n);
            Term[] left = new Term[2 * n + 1];
            Term[] right = new Term[2 * n + 1];
            for (int i = 0; i < n; i++) {
                left[i] = x.get(i + 1);
                right[i] = f.application(fn, x.get(i), x.get(i));
                left[n + i] = f.application(fn, y.get(i), y.get(i));
                right[n + i] = y.get(i + 1);
            }
            left[2 * n] = y.get(n);
            right[2 * n] = x.get(n);
            Term l = f.application(h, left);
            Term r = f.application(h, right);
            Unification.Result res = Unification.mostGeneralUnifier(f, l, r);
            Substitution sigma = assertInstanceOf(Unification.Unified.class, res).unifier();
            assertSame(sigma.apply(l), sigma.apply(r), "the unifier does not unify");
            // x0 and y0 are merged (one is bound to the other); xn and yn are the same tower over it.
            Term base = sigma.apply(x.get(0));
            assertSame(base, sigma.apply(y.get(0)));
            assertInstanceOf(Variable.class, base);
            Term expected = base;
            for (int i = 1; i <= n; i++) {
                expected = f.application(fn, expected, expected);
                assertSame(expected, sigma.apply(x.get(i)), "binding of x" + i);
                assertSame(expected, sigma.apply(y.get(i)), "binding of y" + i);
            }
            if (n < 62) assertEquals((1L << (n + 1)) - 1, sigma.apply(x.get(n)).treeSize());
        });
    }

    /**
     * The doubling family with one more equation x0 =? k(xn) at the end: the cycle x0 → xn → … → x0 appears only
     * once the whole exponential structure is built. It must be reported as an occurs-check failure, quickly.
     */
    @ParameterizedTest
    @ValueSource(ints = {1, 5, 60, 1000})
    void doublingFamilyWithCycleAtTheDeepestLevel(int n) {
        assertTimeoutPreemptively(GENEROUS, () -> {
            TermFactory f = new TermFactory();
            Symbol fn = new Symbol("f", Symbol.Kind.FUNCTION, n + 1);
            Symbol g = new Symbol("g", Symbol.Kind.FUNCTION, 2);
            Symbol kk = new Symbol("k", Symbol.Kind.FUNCTION, 1);
            List<Variable> x = vars(f, "x", n);
            Term[] left = new Term[n + 1];
            Term[] right = new Term[n + 1];
            for (int i = 0; i < n; i++) {
                left[i] = x.get(i + 1);
                right[i] = f.application(g, x.get(i), x.get(i));
            }
            left[n] = x.get(0);
            right[n] = f.application(kk, x.get(n));
            Unification.Result res = Unification.mostGeneralUnifier(f, f.application(fn, left), f.application(fn, right));
            Unification.NotUnifiable fail = assertInstanceOf(Unification.NotUnifiable.class, res);
            assertTrue(fail.occursCheck(), fail::describe);
            assertTrue(fail.explanation().matches("x[0-9]+ occurs in .*"),
                    () -> fail.explanation().substring(0, Math.min(200, fail.explanation().length())));
        });
    }

    /** The same cycle as separate equations of one problem, in an order that binds the deepest variable last. */
    @ParameterizedTest
    @ValueSource(ints = {60, 1000})
    void equationSystemWithCycleAtTheDeepestLevel(int n) {
        assertTimeoutPreemptively(GENEROUS, () -> {
            TermFactory f = new TermFactory();
            Symbol g = new Symbol("g", Symbol.Kind.FUNCTION, 2);
            List<Variable> x = vars(f, "x", n);
            List<Term[]> pairs = new ArrayList<>();
            for (int i = n; i >= 1; i--) pairs.add(new Term[] {x.get(i), f.application(g, x.get(i - 1), x.get(i - 1))});
            pairs.add(new Term[] {x.get(0), f.application(g, x.get(n), x.get(n))});
            Unification.Result res = Unification.mostGeneralUnifier(f, pairs);
            Unification.NotUnifiable fail = assertInstanceOf(Unification.NotUnifiable.class, res);
            assertTrue(fail.occursCheck(), fail::describe);
        });
    }
}
