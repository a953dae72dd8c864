package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Exact output of {@link Printer} and exact values of the {@link Formulas} walks, where the round-trip tests of
 * {@link PrinterTest} and the bounds of {@link LimitsTest} let a changed result through (found by mutation testing,
 * docs/kernel-testing.md).
 */
class PrinterFormulasMutationTest {

    private final KernelFixture k = new KernelFixture();

    // ------------------------------------------------------------------ Printer

    @Test
    void anEquationAtomPrintsAsAnEquationWhereverItIsATerm() {
        Term a = k.term("a");
        Term fb = k.term("f(b)");
        assertEquals("a = f(b)", Printer.term(k.f.equation(a, fb)));
        assertEquals("f(b) = a", Printer.term(k.f.equation(fb, a)));
        assertEquals("a = f(b)", Printer.term(k.f.equation(a, fb), Printer.UNLIMITED));
    }

    @Test
    void implicationNestsToTheRightWithoutParentheses() {
        assertEquals("A implies B implies C", Printer.formula(k.formula("A implies (B implies C)")));
        assertEquals("(A implies B) implies C", Printer.formula(k.formula("(A implies B) implies C")));
        assertEquals("A implies B or C", Printer.formula(k.formula("A implies (B or C)")));
        assertEquals("(A iff B) implies C", Printer.formula(k.formula("(A iff B) implies C")));
        assertEquals("A implies (B iff C)", Printer.formula(k.formula("A implies (B iff C)")));
    }

    @Test
    void operandsGetTheFewestParentheses() {
        assertEquals("not not A", Printer.formula(k.formula("not not A")));
        assertEquals("not (A and B)", Printer.formula(k.formula("not (A and B)")));
        assertEquals("not (forall x. P(x))", Printer.formula(k.formula("not forall x. P(x)")));
        assertEquals("A and not B or C", Printer.formula(k.formula("(A and not B) or C")));
        assertEquals("(A or B) and C", Printer.formula(k.formula("(A or B) and C")));
        assertEquals("A iff (B iff C)", Printer.formula(k.formula("A iff (B iff C)")));
        assertEquals("A iff B implies C", Printer.formula(k.formula("A iff (B implies C)")));
        assertEquals("(forall x. P(x)) and Q(a)", Printer.formula(k.formula("(forall x. P(x)) and Q(a)")));
    }

    // ------------------------------------------------------------------ Formulas

    @Test
    void sizeCountsEveryNode() {
        assertEquals(1, Formulas.size(k.formula("P(a)")));
        // and, P(a), or, Q(a), not, R
        assertEquals(6, Formulas.size(k.formula("P(a) and (Q(a) or not R)")));
        // forall, exists, implies, P(x), iff, Q(y), true
        assertEquals(7, Formulas.size(k.formula("forall x. exists y. P(x) implies (Q(y) iff true)")));
    }

    @Test
    void nnfSizeIsExactWithoutNestedJunctionsOfOneKind() {
        for (String text : List.of("P(a)", "not (P(a) and Q(a))", "P(a) implies Q(a)", "not (P(a) implies Q(a))",
                "P(a) iff Q(a)", "not (P(a) iff Q(a))", "forall x. exists y. not R(x, y)", "not true")) {
            Formula f = k.formula(text);
            long[] sizes = Formulas.nnfSize(f);
            assertEquals(Formulas.size(Formulas.nnf(f)), sizes[0], text);
            assertEquals(Formulas.size(Formulas.nnf(new Formula.Not(f))), sizes[1], "not " + text);
        }
        assertArrayEquals(new long[] {7, 7}, Formulas.nnfSize(k.formula("P(a) iff Q(a)")));
    }

    @Test
    void equivalenceSortsThePartsOfAJunctionNotTheirInsides() {
        // The parts are sorted as wholes: the signs stay with their atoms.
        assertTrue(Formulas.equivalent(k.formula("P(a) and not Q(a)"), k.formula("not Q(a) and P(a)")));
        assertTrue(!Formulas.equivalent(k.formula("P(a) and not Q(a)"), k.formula("not P(a) and Q(a)")));
        assertTrue(!Formulas.equivalent(k.formula("P(a) or Q(b)"), k.formula("P(b) or Q(a)")));
        assertTrue(Formulas.equivalent(k.formula("(P(a) or Q(b)) or R"), k.formula("R or (Q(b) or P(a))")));
    }

    @Test
    void variantsPairReorderedLiteralsWithFlippedEquations() {
        // Not in the stated order and with each equation turned round: the grouping by shape must not depend on
        // the orientation of an equation.
        Clause a = k.clause("[x, y] f(x) = y or P(y) or g(y) != x");
        Clause b = k.clause("[u, v] P(v) or u != g(v) or v = f(u)");
        assertTrue(Variants.areVariants(a, b, Variants.DEFAULT_BUDGET));
        assertTrue(Variants.areVariants(b, a, Variants.DEFAULT_BUDGET));
        Clause c = k.clause("[u, v] P(v) or u != g(v) or u = f(v)");
        assertTrue(!Variants.areVariants(a, c, Variants.DEFAULT_BUDGET));
        Clause d = k.clause("[u, v] not P(v) or u != g(v) or v = f(u)");
        assertTrue(!Variants.areVariants(a, d, Variants.DEFAULT_BUDGET), "signs count");
    }

    @Test
    void normalizeJunctionsKeepsImplicationsAndEquivalences() {
        Formula f = Formulas.normalizeJunctions(k.formula("(P(a) and (Q(a) and R)) implies (S iff not T)"));
        Formula.Implies imp = assertInstanceOf(Formula.Implies.class, f);
        assertEquals(3, assertInstanceOf(Formula.And.class, imp.left()).parts().size());
        Formula.Iff iff = assertInstanceOf(Formula.Iff.class, imp.right());
        assertEquals("S", Printer.formula(iff.left()));
        Formula.Atomic t = assertInstanceOf(Formula.Atomic.class, iff.right(), "not of an atom is folded into it");
        assertTrue(!t.literal().positive());
        assertEquals("P(a) and Q(a) and R implies (S iff not T)", Printer.formula(f));
        Formula g = Formulas.normalizeJunctions(k.formula("(A or B) iff ((C or D) or E)"));
        assertEquals(3, assertInstanceOf(Formula.Or.class, ((Formula.Iff) g).right()).parts().size());
        Formula atom = k.formula("P(a)");
        assertSame(atom, Formulas.normalizeJunctions(atom));
    }
}
