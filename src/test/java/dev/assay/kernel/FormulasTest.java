package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;

/** {@link Formulas#nnf} against the definition of FORMAT.md section 6, and {@link Formulas#equivalent}. */
class FormulasTest {

    private final KernelFixture k = new KernelFixture();

    private Formula fm(String text) {
        return k.formula(text);
    }

    /** nnf(input) is the expected formula, compared as FORMAT.md says (modulo renaming, AC, orientation). */
    private void assertNnf(String input, String expected) {
        Formula normal = Formulas.nnf(fm(input));
        assertTrue(Formulas.equivalent(normal, fm(expected)),
                () -> "nnf(" + input + ") = " + Printer.formula(normal) + ", expected " + expected);
        assertNormal(normal);
    }

    /** No not above an atom, no implies, no iff. */
    static void assertNormal(Formula normal) {
        Formulas.forEach(normal, sub -> {
            assertFalse(sub instanceof Formula.Not, () -> "not left in " + Printer.formula(normal));
            assertFalse(sub instanceof Formula.Implies, () -> "implies left in " + Printer.formula(normal));
            assertFalse(sub instanceof Formula.Iff, () -> "iff left in " + Printer.formula(normal));
        });
    }

    @Nested
    class NegationNormalForm {

        @Test
        void implication() {
            // a implies b ⇒ nnf(not a) or nnf(b)
            assertNnf("A implies B", "not A or B");
            assertNnf("(A and B) implies C", "not A or not B or C");
        }

        @Test
        void equivalence() {
            // a iff b ⇒ (nnf(not a) or nnf(b)) and (nnf(a) or nnf(not b))
            assertNnf("A iff B", "(not A or B) and (A or not B)");
            assertEquals("(not A or B) and (A or not B)", Printer.formula(Formulas.nnf(fm("A iff B"))));
        }

        @Test
        void negatedEquivalence() {
            // not (a iff b) ⇒ (nnf(a) or nnf(b)) and (nnf(not a) or nnf(not b))
            assertNnf("not (A iff B)", "(A or B) and (not A or not B)");
            assertEquals("(A or B) and (not A or not B)", Printer.formula(Formulas.nnf(fm("not (A iff B)"))));
        }

        @Test
        void negatedImplication() {
            // not (a implies b) ⇒ nnf(a) and nnf(not b)
            assertNnf("not (A implies B)", "A and not B");
        }

        @Test
        void deMorgan() {
            assertNnf("not (A and B)", "not A or not B");
            assertNnf("not (A or B)", "not A and not B");
            assertNnf("not (A and (B or not C))", "not A or (not B and C)");
        }

        @Test
        void doubleNegation() {
            // not not a ⇒ nnf(a)
            Formula n = Formulas.nnf(fm("not not A"));
            Formula.Atomic atom = assertInstanceOf(Formula.Atomic.class, n);
            assertTrue(atom.literal().positive());
            assertNnf("not not (A implies B)", "not A or B");
        }

        @Test
        void quantifiers() {
            // not forall x. a ⇒ exists x. nnf(not a), and dually
            assertNnf("not forall x. P(x)", "exists x. not P(x)");
            assertNnf("not exists x. P(x)", "forall x. not P(x)");
            assertNnf("not forall x. exists y. R(x, y)", "exists x. forall y. not R(x, y)");
            Formula.Quantified q = assertInstanceOf(Formula.Quantified.class, Formulas.nnf(fm("not forall x. P(x)")));
            assertFalse(q.universal());
            assertSame(k.var("x"), q.variable(), "the bound variable keeps its name");
        }

        @Test
        void constants() {
            // not true ⇒ false, and dually
            assertSame(Formula.Constant.FALSE, Formulas.nnf(fm("not true")));
            assertSame(Formula.Constant.TRUE, Formulas.nnf(fm("not false")));
            assertSame(Formula.Constant.TRUE, Formulas.nnf(fm("true")));
        }

        @Test
        void equations() {
            // not (s = t) ⇒ s != t, and dually
            Formula.Atomic ne = assertInstanceOf(Formula.Atomic.class, Formulas.nnf(fm("not (a = b)")));
            assertFalse(ne.literal().positive());
            assertTrue(ne.literal().isEquation());
            assertEquals("a != b", Printer.formula(ne));
            Formula.Atomic eq = assertInstanceOf(Formula.Atomic.class, Formulas.nnf(fm("not a != b")));
            assertTrue(eq.literal().positive());
            assertEquals("a = b", Printer.formula(eq), "orientation as written");
        }

        @Test
        void atomsAndNormalFormsStayAsTheyAre() {
            assertNnf("P(a)", "P(a)");
            assertNnf("not P(a)", "not P(a)");
            assertNnf("forall x. not P(x) or exists y. R(x, y) and Q(y)",
                    "forall x. not P(x) or exists y. R(x, y) and Q(y)");
        }

        @Test
        void nestedDefinitionsApplyInside() {
            // Inside a negated equivalence the parts are themselves put into normal form.
            assertNnf("not ((A implies B) iff not C)", "((not A or B) or not C) and ((A and not B) or C)");
            assertNnf("forall x. (P(x) iff Q(x)) implies exists y. not not R(x, y)",
                    "forall x. ((P(x) or Q(x)) and (not P(x) or not Q(x))) or exists y. R(x, y)");
        }

        @Test
        void negationPassesThroughTheWholeFormula() {
            assertNnf("not (forall x. P(x) implies exists y. not (R(x, y) iff Q(y)))",
                    "exists x. P(x) and forall y. (not R(x, y) or Q(y)) and (R(x, y) or not Q(y))");
        }

        @Test
        void theTermsAreUntouched() {
            Formula in = fm("not forall x. f(x) = g(x, a)");
            Formula out = Formulas.nnf(in);
            Formula.Quantified q = assertInstanceOf(Formula.Quantified.class, out);
            Formula.Atomic at = assertInstanceOf(Formula.Atomic.class, q.body());
            assertSame(k.term("f(x) = g(x, a)"), at.literal().atom());
        }
    }

    @Nested
    class Equivalence {

        private boolean eq(String a, String b) {
            boolean forward = Formulas.equivalent(fm(a), fm(b));
            assertEquals(forward, Formulas.equivalent(fm(b), fm(a)), "not symmetric");
            return forward;
        }

        @Test
        void renamingOfBoundVariables() {
            assertTrue(eq("forall x. P(x)", "forall y. P(y)"));
            assertTrue(eq("forall x. exists y. R(x, y)", "forall u. exists v. R(u, v)"));
            assertTrue(eq("forall x. exists y. R(x, y)", "forall y. exists x. R(y, x)"));
            // Shadowing: the inner x is another variable.
            assertTrue(eq("forall x. (P(x) and forall x. Q(x))", "forall y. (P(y) and forall z. Q(z))"));
            assertTrue(eq("forall x. exists x. P(x)", "forall y. exists z. P(z)"));
        }

        @Test
        void associativityAndCommutativity() {
            assertTrue(eq("A and (B and C)", "(C and A) and B"));
            assertTrue(eq("A or B or C", "C or (B or A)"));
            assertTrue(eq("(A or B) and (C or D)", "(D or C) and (B or A)"));
            assertTrue(eq("forall x. P(x) or Q(x)", "forall y. Q(y) or P(y)"));
        }

        @Test
        void orientationOfEquations() {
            assertTrue(eq("a = b", "b = a"));
            assertTrue(eq("a != b", "b != a"));
            assertTrue(eq("forall x. f(x) = x", "forall y. y = f(y)"));
        }

        @Test
        void negationOfAnAtomInEitherRepresentation() {
            Formula notNode = new Formula.Not(new Formula.Atomic(k.literal("P(a)")));
            Formula negativeAtom = new Formula.Atomic(k.literal("not P(a)"));
            assertTrue(Formulas.equivalent(notNode, negativeAtom));
        }

        @Test
        void differentConnectives() {
            assertFalse(eq("A and B", "A or B"));
            assertFalse(eq("A implies B", "B implies A"));
            assertFalse(eq("A implies B", "not A or B"));
            assertFalse(eq("(A or B) and C", "A or (B and C)"));
            assertFalse(eq("A iff B", "(A implies B) and (B implies A)"));
        }

        @Test
        void differentQuantifiers() {
            assertFalse(eq("forall x. P(x)", "exists x. P(x)"));
            assertFalse(eq("forall x. exists y. R(x, y)", "exists y. forall x. R(x, y)"));
        }

        @Test
        void differentBindingStructure() {
            assertFalse(eq("forall x. forall y. R(x, y)", "forall x. forall y. R(y, x)"));
            assertFalse(eq("forall x. exists y. R(x, y)", "forall x. exists y. R(y, x)"));
            assertFalse(eq("forall x. (P(x) and forall y. Q(x))", "forall x. (P(x) and forall x. Q(x))"));
        }

        @Test
        void freeVariablesAreNotCaptured() {
            // y free on the left; on the right the quantifier binds it.
            assertFalse(eq("forall x. R(x, y)", "forall y. R(y, y)"));
            assertFalse(eq("forall x. P(y)", "forall x. P(x)"));
            // Free variables keep their names.
            assertFalse(eq("P(y)", "P(z)"));
            assertTrue(eq("forall x. R(x, y)", "forall z. R(z, y)"));
        }

        @Test
        void noIdempotence() {
            // AC, not ACI: a repeated part is another formula.
            assertFalse(eq("A and A", "A"));
            assertFalse(eq("A or A or B", "A or B"));
        }

        @Test
        void differentTermsAndSigns() {
            assertFalse(eq("P(a)", "P(b)"));
            assertFalse(eq("P(a)", "not P(a)"));
            assertFalse(eq("a = b", "a != b"));
            assertFalse(eq("f(a) = b", "f(b) = a"));
            assertFalse(eq("true", "false"));
        }

        @Test
        void doubleNegationIsNotARenaming() {
            // FORMAT.md section 6 compares formulas modulo renaming of bound variables, AC of and/or and the
            // orientation of equations: nothing else. not not A and A are equivalent logically but are not the same
            // formula in that sense (nnf(not not A) is A; a stated "not not A" is not in negation normal form).
            assertFalse(eq("not not A", "A"));
        }

        @Test
        void negatedConstantIsNotTheOtherConstant() {
            // Likewise, "not true" is not the formula "false" (nnf makes one of the other).
            assertFalse(eq("not true", "false"));
        }
    }

    @Test
    void freeVariables() {
        assertEquals(Set.of(), Formulas.freeVariables(fm("forall x. exists y. R(x, y)")));
        assertEquals(Set.of(k.var("y")), Formulas.freeVariables(fm("forall x. R(x, y)")));
        assertEquals(List.of(k.var("z"), k.var("x")),
                List.copyOf(Formulas.freeVariables(fm("P(z) and (forall x. P(x)) and P(x)"))));
    }

    @Test
    void junctionFlattens() {
        Formula a = fm("A");
        Formula b = fm("B");
        Formula c = fm("C");
        Formula j = Formulas.junction(true, List.of(new Formula.And(List.of(a, b)), c));
        assertEquals(3, assertInstanceOf(Formula.And.class, j).parts().size());
        assertSame(a, Formulas.junction(false, List.of(a)));
    }
}
