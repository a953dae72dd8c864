package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTimeout;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * Deeply nested inputs: the kernel must be iterative (STYLE.md: "no recursion whose depth grows with the input inside
 * the kernel"), so none of these may throw {@link StackOverflowError}. They run on the ordinary test thread (surefire
 * gives it -Xss8m, which a recursive walk 100,000 levels deep would still exhaust), with a generous non-preemptive
 * timeout that only catches quadratic or worse behaviour.
 */
class DeepInputTest {

    private static final int DEPTH = 100_000;
    // Linear work at this depth takes well under a second on an idle machine; 30 s leaves room for a loaded one and
    // still fails a quadratic walk (10^10 steps) by minutes.
    private static final Duration GENEROUS = Duration.ofSeconds(30);

    private final TermFactory f = new TermFactory();
    private final Symbol fn = new Symbol("f", Symbol.Kind.FUNCTION, 1);
    private final Symbol g = new Symbol("g", Symbol.Kind.FUNCTION, 1);
    private final Symbol a = new Symbol("a", Symbol.Kind.FUNCTION, 0);
    private final Symbol b = new Symbol("b", Symbol.Kind.FUNCTION, 0);
    private final Symbol p = new Symbol("P", Symbol.Kind.PREDICATE, 1);
    private final Symbol q = new Symbol("Q", Symbol.Kind.PREDICATE, 1);
    private final Symbol r0 = new Symbol("R", Symbol.Kind.PREDICATE, 0);
    private Variable x;
    private Variable y;

    @BeforeEach
    void setUp() {
        x = f.variable("x");
        y = f.variable("y");
    }

    /** f(f(…f(inner)…)) with {@code n} f's. */
    private Term tower(int n, Term inner) {
        Term t = inner;
        for (int i = 0; i < n; i++) t = f.application(fn, t);
        return t;
    }

    private Formula atomic(boolean positive, Application atom) {
        return new Formula.Atomic(new Literal(positive, atom));
    }

    private Formula nots(int n, Formula inner) {
        Formula fm = inner;
        for (int i = 0; i < n; i++) fm = new Formula.Not(fm);
        return fm;
    }

    private static <T> T within(java.util.concurrent.Callable<T> body) {
        return assertTimeout(GENEROUS, body::call);
    }

    // ------------------------------------------------------------------ terms

    @Test
    void deepTermThroughTheFactory() {
        Term t = tower(DEPTH, f.application(a));
        assertEquals(DEPTH + 1, t.depth());
        assertEquals(DEPTH + 1, t.treeSize());
        assertTrue(t.isGround());
        assertSame(t, tower(DEPTH, f.application(a)), "hash-consing");
        String shortForm = Printer.term(t);
        assertTrue(shortForm.startsWith("f(f(f("));
        assertTrue(shortForm.length() <= Printer.MESSAGE_LIMIT + 2, "capped: " + shortForm.length());
        String full = Printer.term(t, Printer.UNLIMITED);
        assertEquals(3 * DEPTH + 1, full.length());
        assertTrue(full.startsWith("f(f(") && full.endsWith(")))") && full.contains("f(a))"));
    }

    @Test
    void deepUnification() {
        Term left = tower(DEPTH, x);
        Term right = tower(DEPTH, f.application(g, y));
        Unification.Result res = within(() -> Unification.mostGeneralUnifier(f, left, right));
        Substitution s = assertInstanceOf(Unification.Unified.class, res).unifier();
        assertSame(f.application(g, y), s.get(x));
        assertSame(s.apply(left), s.apply(right));
    }

    @Test
    void deepUnificationOfTwoDeepTerms() {
        // Both sides deep and the binding deep too: x := f^n(a) and f^n(x) = f^2n(a).
        Term left = f.application(new Symbol("h", Symbol.Kind.FUNCTION, 2), x, tower(DEPTH, x));
        Term right = f.application(new Symbol("h", Symbol.Kind.FUNCTION, 2), tower(DEPTH, f.application(a)),
                tower(2 * DEPTH, f.application(a)));
        Unification.Result res = within(() -> Unification.mostGeneralUnifier(f, left, right));
        Substitution s = assertInstanceOf(Unification.Unified.class, res).unifier();
        assertSame(s.apply(left), s.apply(right));
        assertEquals(2 * DEPTH + 1, s.apply(left).depth() - 1);
    }

    @Test
    void deepClashHasADeepPosition() {
        Term left = tower(DEPTH, f.application(a));
        Term right = tower(DEPTH, f.application(b));
        Unification.Result res = within(() -> Unification.mostGeneralUnifier(f, left, right));
        Unification.NotUnifiable n = assertInstanceOf(Unification.NotUnifiable.class, res);
        assertFalse(n.occursCheck());
        // Deep positions are shortened in the middle: the first 20 and last 10 steps, and how many were left out.
        assertTrue(n.position().startsWith("1.1.1.1.1.1.1.1.1.1.1.1.1.1.1.1.1.1.1.1.…"), n.position());
        assertTrue(n.position().contains("(" + (DEPTH - 30) + " more levels)"), n.position());
        assertTrue(n.position().length() < 120, n.position());
        assertTrue(n.explanation().startsWith("a and b clash"), n.explanation());
    }

    @Test
    void deepOccursCheck() {
        Term left = tower(DEPTH, x);
        Term right = tower(DEPTH + 1, x);
        Unification.Result res = within(() -> Unification.mostGeneralUnifier(f, left, right));
        Unification.NotUnifiable n = assertInstanceOf(Unification.NotUnifiable.class, res);
        assertTrue(n.occursCheck());
        assertTrue(n.explanation().startsWith("x occurs in f("), n.explanation().substring(0, 40));
    }

    @Test
    void deepSubstitution() {
        Substitution s = new Substitution(f, java.util.Map.of(x, tower(DEPTH, f.application(a))));
        Term t = within(() -> s.apply(tower(DEPTH, x)));
        assertSame(tower(2 * DEPTH, f.application(a)), t);
    }

    @Test
    void deepLiteralsAsVariants() {
        Clause c1 = KernelFixture.clauseOf(new Literal(true, f.application(p, tower(DEPTH, x))),
                new Literal(false, f.application(q, tower(DEPTH, y))));
        Clause c2 = KernelFixture.clauseOf(new Literal(false, f.application(q, tower(DEPTH, x))),
                new Literal(true, f.application(p, tower(DEPTH, y))));
        Clause c3 = KernelFixture.clauseOf(new Literal(true, f.application(p, tower(DEPTH, x))),
                new Literal(false, f.application(q, tower(DEPTH, x))));
        assertTrue(within(() -> Variants.areVariants(c1, c2, Variants.DEFAULT_BUDGET)));
        assertFalse(within(() -> Variants.areVariants(c1, c3, Variants.DEFAULT_BUDGET)));
        String printed = Printer.clause(c1);
        assertTrue(printed.startsWith("[x, y] P(f(f("), printed.substring(0, 20));
    }

    // ------------------------------------------------------------------ formulas

    @Test
    void nnfOfDeepNegations() {
        Formula atom = atomic(true, f.application(r0));
        Formula even = nots(DEPTH, atom);
        Formula odd = nots(DEPTH + 1, atom);
        Formula ne = within(() -> Formulas.nnf(even));
        Formula no = within(() -> Formulas.nnf(odd));
        assertTrue(assertInstanceOf(Formula.Atomic.class, ne).literal().positive());
        assertFalse(assertInstanceOf(Formula.Atomic.class, no).literal().positive());
    }

    @Test
    void equivalenceOfDeepNegations() {
        Formula atom = atomic(true, f.application(p, tower(10, f.application(a))));
        Formula one = nots(DEPTH, atom);
        Formula same = nots(DEPTH, atomic(true, f.application(p, tower(10, f.application(a)))));
        Formula other = nots(DEPTH + 1, atom);
        assertTrue(within(() -> Formulas.equivalent(one, same)));
        assertFalse(within(() -> Formulas.equivalent(one, other)));
    }

    @Test
    void printingDeepNegations() {
        Formula deep = nots(DEPTH, atomic(true, f.application(r0)));
        String capped = within(() -> Printer.formula(deep));
        assertTrue(capped.startsWith("not not "));
        String full = within(() -> Printer.formula(deep, Printer.UNLIMITED));
        assertEquals(4 * DEPTH + 1, full.length());
    }

    @Test
    void deepQuantifierNest() {
        // forall x0. forall x1. … forall x(n-1). P(x0): closed, and clausifies to [x0] P(x0).
        Formula body = atomic(true, f.application(p, f.variable("x0")));
        Formula fm = body;
        for (int i = DEPTH - 1; i >= 0; i--) fm = new Formula.Quantified(true, f.variable("x" + i), fm);
        Formula closed = fm;
        Formula renamed = atomic(true, f.application(p, f.variable("y0")));
        for (int i = DEPTH - 1; i >= 0; i--) renamed = new Formula.Quantified(true, f.variable("y" + i), renamed);
        Formula renamedF = renamed;
        assertTrue(within(() -> Formulas.freeVariables(closed)).isEmpty());
        assertTrue(within(() -> Formulas.equivalent(closed, renamedF)));
        assertTrue(within(() -> Formulas.equivalent(Formulas.nnf(closed), closed)));
        Problem problem = new Problem.Builder("deep").declare(p).axiom("ax", closed).build();
        Kernel kernel = new Kernel(problem, f);
        Clause stated = KernelFixture.clauseOf(new Literal(true, f.application(p, f.variable("x0"))));
        assertTrue(within(() -> kernel.clausify("c", kernel.axiom("ax"), null, stated)).accepted());
        assertTrue(Printer.formula(closed).startsWith("forall x0 x1 x2 "));
    }

    @Test
    void deepTermsThroughTheKernel() {
        Term deepA = tower(DEPTH, f.application(a));
        Formula ax1 = atomic(true, f.application(p, deepA));
        Formula ax2 = new Formula.Quantified(true, x,
                new Formula.Or(List.of(atomic(false, f.application(p, x)), atomic(true, f.application(q, x)))));
        Formula ax3 = atomic(false, f.application(p, tower(DEPTH, f.application(b))));
        Problem problem = new Problem.Builder("deep").declare(fn).declare(a).declare(b).declare(p).declare(q)
                .axiom("ax1", ax1).axiom("ax2", ax2).axiom("ax3", ax3).build();
        Kernel kernel = new Kernel(problem, f);
        Fact c1 = RuleTestSupport.accepted(within(() -> kernel.clausify("c1", kernel.axiom("ax1"), null,
                KernelFixture.clauseOf(new Literal(true, f.application(p, deepA))))));
        Fact c2 = RuleTestSupport.accepted(kernel.clausify("c2", kernel.axiom("ax2"), null,
                KernelFixture.clauseOf(new Literal(false, f.application(p, x)), new Literal(true, f.application(q, x)))));
        Fact c3 = RuleTestSupport.accepted(kernel.clausify("c3", kernel.axiom("ax3"), null,
                KernelFixture.clauseOf(new Literal(false, f.application(p, tower(DEPTH, f.application(b)))))));
        Clause qDeep = KernelFixture.clauseOf(new Literal(true, f.application(q, deepA)));
        RuleTestSupport.accepted(within(() -> kernel.resolve("c4", c2, 1, null, c1, 1, null, qDeep)));
        Outcome clash = within(() -> kernel.resolve("c5", c1, 1, null, c3, 1, null, Clause.EMPTY));
        RuleTestSupport.rejected(clash, "resolve", "do not unify", "a and b clash");
    }

    // ------------------------------------------------------------------ long junctions

    /**
     * A disjunction of 25,000 atoms nested as binary nodes, as a parser of a left-associative {@code or} builds it.
     * Flattening it must not copy the parts at every level (quadratic), nor intern a canonical key per level.
     */
    @Test
    void longBinaryDisjunction() {
        int n = 25_000;
        Formula acc = atomic(true, f.application(p, f.application(new Symbol("c0", Symbol.Kind.FUNCTION, 0))));
        for (int i = 1; i < n; i++) {
            Formula atom = atomic(true, f.application(p, f.application(new Symbol("c" + i, Symbol.Kind.FUNCTION, 0))));
            acc = new Formula.Or(List.of(acc, atom));
        }
        Formula nested = acc;
        List<Formula> flatParts = new ArrayList<>();
        for (int i = n - 1; i >= 0; i--) {
            flatParts.add(atomic(true, f.application(p, f.application(new Symbol("c" + i, Symbol.Kind.FUNCTION, 0)))));
        }
        Formula flat = new Formula.Or(flatParts);
        Formula normal = within(() -> Formulas.nnf(nested));
        assertEquals(n, assertInstanceOf(Formula.Or.class, normal).parts().size());
        assertTrue(within(() -> Formulas.equivalent(nested, flat)));
    }
}
