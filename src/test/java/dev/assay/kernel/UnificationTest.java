package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Check values for {@link Unification#mostGeneralUnifier}.
 *
 * <p>On sources: the examples below were written without access to the papers. Those marked "common practice" are
 * the standard textbook illustrations of syntactic unification (as in every treatment that follows Robinson 1965);
 * those attributed to a paper are recalled from memory and may not match the text exactly. Every expected value was
 * worked out by hand again for this test, so the check values stand on their own whatever their provenance.
 */
class UnificationTest {

    private final KernelFixture k = new KernelFixture();

    private Substitution unify(String left, String right) {
        Unification.Result r = Unification.mostGeneralUnifier(k.f, k.term(left), k.term(right));
        Unification.Unified u = assertInstanceOf(Unification.Unified.class, r, () -> left + " =? " + right + ": " + r);
        return u.unifier();
    }

    private Unification.NotUnifiable fail(String left, String right) {
        Unification.Result r = Unification.mostGeneralUnifier(k.f, k.term(left), k.term(right));
        return assertInstanceOf(Unification.NotUnifiable.class, r, () -> left + " =? " + right + " unified: " + r);
    }

    /** σ unifies, is idempotent, and equals the expected mgu μ up to renaming on every variable of the problem. */
    private void assertMostGeneral(String left, String right, String expected) {
        Term l = k.term(left);
        Term r = k.term(right);
        Substitution sigma = unify(left, right);
        assertSame(sigma.apply(l), sigma.apply(r), "σ does not unify " + left + " and " + right + ": " + sigma);
        for (Variable v : sigma.bindings().keySet()) {
            assertSame(sigma.apply(v), sigma.apply(sigma.apply(v)), "σ is not idempotent at " + v + ": " + sigma);
        }
        Substitution mu = k.substitution(expected);
        assertSame(mu.apply(l), mu.apply(r), "the expected value is no unifier; fix the test");
        List<Variable> vars = KernelFixture.variablesOf(l, r);
        assertTrue(KernelFixture.sameUnifierUpToRenaming(sigma, mu, vars),
                () -> "σ = " + sigma + " is not " + mu + " up to renaming");
    }

    // ------------------------------------------------------------------ Robinson 1965 and common practice

    // Robinson, "A machine-oriented logic based on the resolution principle", J. ACM 12(1), 1965, section 5, defines
    // the disagreement set and the unification algorithm. The pairs below are common practice (textbook illustrations
    // of that algorithm), not quoted from the paper.

    @Test
    void bindsVariablesInsideBothTerms() {
        // Common practice: P(x, f(y)) =? P(a, f(g(z))) has mgu {x := a, y := g(z)}.
        assertMostGeneral("P(x, f(y))", "P(a, f(g(z)))", "{x := a, y := g(z)}");
    }

    @Test
    void variableAgainstVariableIsARenaming() {
        // Common practice: f(x, y) =? f(y, x); {x := y} and {y := x} are both most general.
        assertMostGeneral("f(x, y)", "f(y, x)", "{x := y}");
        assertMostGeneral("f(x, y)", "f(y, x)", "{y := x}");
    }

    @Test
    void bindingIsPropagatedToLaterArguments() {
        // Common practice: g(x, x) =? g(f(y), f(a)) needs x := f(y) first, then f(y) =? f(a) gives y := a.
        assertMostGeneral("g(x, x)", "g(f(y), f(a))", "{x := f(a), y := a}");
    }

    @Test
    void chainOfVariablesIsSolvedToTheEnd() {
        // Common practice: triangular bindings x := y, y := z, z := a must be composed: every variable ends at a.
        assertMostGeneral("h(x, y, z)", "h(y, z, a)", "{x := a, y := a, z := a}");
    }

    @Test
    void identicalTermsHaveTheEmptyUnifier() {
        Substitution s = unify("f(x, g(y))", "f(x, g(y))");
        assertTrue(s.isEmpty(), s::toString);
    }

    @Test
    void aVariableUnifiesWithAnyTermWithoutIt() {
        assertMostGeneral("x", "f(y, g(a))", "{x := f(y, g(a))}");
        assertMostGeneral("f(y, g(a))", "x", "{x := f(y, g(a))}");
    }

    @Test
    void sharedSubtermsAreNotTheSameVariable() {
        // Common practice: f(x, g(x)) =? f(g(y), z): x := g(y), z := g(g(y)).
        assertMostGeneral("f(x, g(x))", "f(g(y), z)", "{x := g(y), z := g(g(y))}");
    }

    // ------------------------------------------------------------------ Martelli & Montanari 1982

    @Test
    void martelliMontanariMultiEquationExample() {
        // Martelli & Montanari, "An efficient unification algorithm", ACM TOPLAS 4(2), 1982, section 3 (the worked
        // example of the multi-equation algorithm). Recalled from memory:
        //   f(x1, g(x2, x3), x2, b) =? f(g(h(a, x5), x2), x1, h(a, x4), x4)
        // Worked again by hand: x4 := b, x5 := x4 = b, x2 := h(a, x5) = h(a, b), x3 := x2, x1 := g(h(a, b), x2).
        assertMostGeneral("f(x1, g(x2, x3), x2, b)", "f(g(h(a, x5), x2), x1, h(a, x4), x4)",
                "{x1 := g(h(a, b), h(a, b)), x2 := h(a, b), x3 := h(a, b), x4 := b, x5 := b}");
    }

    @Test
    void martelliMontanariSystemOfEquations() {
        // Martelli & Montanari 1982, section 2 (the introductory example of solving a set of equations by
        // transformation). Recalled from memory: { g(x2) = x1, f(x1, h(x1), x2) = f(g(x3), x4, x3) }, solved form
        // { x1 := g(x3), x2 := x3, x4 := h(g(x3)) }.
        Term[] e1 = {k.term("g(x2)"), k.term("x1")};
        Term[] e2 = {k.term("f(x1, h(x1), x2)"), k.term("f(g(x3), x4, x3)")};
        List<Term[]> pairs = new ArrayList<>(List.of(e1, e2));
        Unification.Result r = Unification.mostGeneralUnifier(k.f, pairs);
        Substitution sigma = assertInstanceOf(Unification.Unified.class, r, r::toString).unifier();
        for (Term[] p : pairs) assertSame(sigma.apply(p[0]), sigma.apply(p[1]), sigma::toString);
        Substitution mu = k.substitution("{x1 := g(x3), x2 := x3, x4 := h(g(x3))}");
        List<Variable> vars = KernelFixture.variablesOf(e1[0], e1[1], e2[0], e2[1]);
        assertTrue(KernelFixture.sameUnifierUpToRenaming(sigma, mu, vars), sigma::toString);
    }

    @Test
    void martelliMontanariNotUnifiableByCycle() {
        // Martelli & Montanari 1982, section 2: a system is unsolvable when its variables form a cycle through
        // function symbols (the "cycle" failure of their algorithm). Recalled from memory; common practice anyway.
        Term[] e1 = {k.term("x"), k.term("f(y)")};
        Term[] e2 = {k.term("y"), k.term("g(x)")};
        Unification.Result r = Unification.mostGeneralUnifier(k.f, new ArrayList<>(List.of(e1, e2)));
        Unification.NotUnifiable n = assertInstanceOf(Unification.NotUnifiable.class, r, r::toString);
        assertTrue(n.occursCheck());
        assertTrue(n.explanation().matches("[xy] occurs in .*"), n.explanation());
    }

    // ------------------------------------------------------------------ clashes

    @Test
    void clashNamesBothSymbols() {
        Unification.NotUnifiable n = fail("P(a, x)", "P(b, y)");
        assertFalse(n.occursCheck());
        assertEquals("1", n.position());
        assertTrue(n.explanation().startsWith("a and b clash"), n.explanation());
        assertEquals("a and b clash: a against b (position 1)", n.describe());
    }

    @Test
    void clashAtTheTopHasNoPosition() {
        Unification.NotUnifiable n = fail("f(x)", "g(x)");
        assertFalse(n.occursCheck());
        assertEquals("", n.position());
        assertTrue(n.describe().startsWith("f and g clash"), n.describe());
        assertFalse(n.describe().contains("position"), n.describe());
    }

    @Test
    void clashOfArityIsAClash() {
        // f/1 and f/2 are different symbols: one name, two arities, is a clash (the signature forbids it anyway).
        Term left = k.app("f1", k.term("a"));
        Term right = k.f.application(new Symbol("f1", Symbol.Kind.FUNCTION, 2), k.term("a"), k.term("a"));
        Unification.Result r = Unification.mostGeneralUnifier(k.f, left, right);
        assertInstanceOf(Unification.NotUnifiable.class, r);
    }

    @Test
    void deepPositionsAreDotted() {
        Unification.NotUnifiable n = fail("f(a, g(b))", "f(a, g(c))");
        assertEquals("2.1", n.position());
        assertTrue(n.explanation().startsWith("b and c clash"), n.explanation());
        Unification.NotUnifiable deeper = fail("P(f2(a, g2(b, h(c))))", "P(f2(a, g2(b, h(d))))");
        assertEquals("1.2.2.1", deeper.position());
        assertTrue(deeper.describe().contains("c and d clash"), deeper.describe());
        assertTrue(deeper.describe().endsWith("(position 1.2.2.1)"), deeper.describe());
    }

    @Test
    void clashFoundThroughABindingSaysWhereTheTermsMet() {
        // x := g(a) first, then x meets g(b): the clash is a against b, under position 2.1 of the right term.
        Unification.NotUnifiable n = fail("f(x, x)", "f(g(a), g(b))");
        assertFalse(n.occursCheck());
        assertTrue(n.explanation().contains("a and b clash"), n.explanation());
        assertEquals("2.1", n.position());
    }

    @Test
    void clashBetweenConstantAndCompoundTerm() {
        Unification.NotUnifiable n = fail("f(a)", "f(g(x))");
        assertEquals("1", n.position());
        assertTrue(n.explanation().startsWith("a and g clash"), n.explanation());
        assertTrue(n.explanation().contains("g(x)"), n.explanation());
    }

    // ------------------------------------------------------------------ occurs check

    @Test
    void occursCheckNamesTheVariable() {
        // Common practice (Robinson 1965, section 5: the occurs condition of the unification algorithm).
        Unification.NotUnifiable n = fail("x", "f(x)");
        assertTrue(n.occursCheck());
        assertEquals("x occurs in f(x)", n.describe());
    }

    @Test
    void occursCheckGivesThePositionWhereTheVariableWasBound() {
        Unification.NotUnifiable n = fail("P(a, g(x))", "P(a, g(f(x)))");
        assertTrue(n.occursCheck());
        assertEquals("2.1", n.position());
        assertEquals("x occurs in f(x) (position 2.1)", n.describe());
    }

    @Test
    void occursCheckThroughAnotherVariable() {
        // f(x, y) =? f(g(y), g(x)): x := g(y) and y := g(x), an indirect cycle.
        Unification.NotUnifiable n = fail("f(x, y)", "f(g(y), g(x))");
        assertTrue(n.occursCheck());
        assertTrue(n.explanation().matches("[xy] occurs in g\\([xy]\\) once [xy] := g\\([xy]\\)"), n.explanation());
    }

    @Test
    void occursCheckAfterMergingTwoVariables() {
        // Link(x, x) =? Link(y, next(y)), the example of STYLE.md: x and y are merged, then must equal next(y).
        Unification.NotUnifiable n = fail("Link(x, x)", "Link(y, next(y))");
        assertTrue(n.occursCheck());
        assertTrue(n.explanation().matches("[xy] occurs in next\\([xy]\\)"), n.explanation());
        assertEquals("2", n.position());
    }

    /** s(s(...s(zero)...)), {@code n} applications: a ground term of n + 1 nodes. */
    private String numeral(int n) {
        return "s(".repeat(n) + "zero" + ")".repeat(n);
    }

    @Test
    void occursCheckBesideLargeGroundTerms() {
        // Large enough for the union-find solver, whose cycle test does not enter a class whose schema is ground: such
        // a class is on no cycle. The cycle through x and y is still found, and with the message it had.
        String big = numeral(100);
        Unification.NotUnifiable n = fail("Tally(x, " + big + ", y)", "Tally(f(y), z, f(x))");
        assertTrue(n.occursCheck());
        assertTrue(n.explanation().matches("[xy] occurs in f\\([xy]\\) once [xy] := f\\([xy]\\)"), n.explanation());
        // The cycle runs through a variable bound to a large ground term's neighbour.
        n = fail("Tally(x, x, " + big + ")", "Tally(g(y, " + big + "), y, z)");
        assertTrue(n.occursCheck());
        assertTrue(n.explanation().matches("[xy] occurs in g\\([xy], .*"), n.explanation());
        // Without a cycle: a variable bound to the large ground term, another to a term that contains it.
        assertMostGeneral("Tally(x, y, w)", "Tally(" + big + ", f(x), f(y))",
                "{x := " + big + ", y := f(" + big + "), w := f(f(" + big + "))}");
    }

    @Test
    void occursCheckMessageNamesOnlyRealVariables() {
        // x =? f(g(x)): the cycle passes through the class of g(x), which holds no variable. The explanation should
        // still name only variables and terms, never a placeholder.
        Unification.NotUnifiable n = fail("x", "f(g(x))");
        assertTrue(n.occursCheck());
        assertTrue(n.explanation().startsWith("x occurs in f(g(x))"), n.explanation());
        assertFalse(n.explanation().contains("?"), "placeholder in the explanation: " + n.explanation());
    }

    @Test
    void occursCheckIsNotConfusedByRepeatedGroundSubterms() {
        // f(x, h(a, a)) =? f(h(a, a), x) shares ground subterms on both sides; no cycle.
        assertMostGeneral("f(x, h(a, a))", "f(h(a, a), x)", "{x := h(a, a)}");
    }

    @Test
    void unifiesAtomsOfTheSamePredicateOnly() {
        Unification.NotUnifiable n = fail("P(x)", "Q(x)");
        assertTrue(n.explanation().startsWith("P and Q clash"), n.explanation());
    }

    @Test
    void unificationOfEquationsIsAsWritten() {
        // The unifier itself is syntactic: a = x against y = b binds x := b, y := a; the kernel tries the other
        // orientation of equations separately (FORMAT.md section 6, resolve).
        assertMostGeneral("a = x", "y = b", "{x := b, y := a}");
        Unification.NotUnifiable n = fail("a = a", "b = a");
        assertEquals("1", n.position());
    }
}
