package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertFalse;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * {@code eqfactor A.i, A.j [σ]} (FORMAT.md section 6, rules on clauses): both literals are equations {@code s = t} and
 * {@code u = v} as written, σ makes s and u equal, and the conclusion is {@code ((A − A.i) ∪ {t != v})σ}.
 */
class EqfactorRuleTest extends EqualityTestSupport {

    @BeforeEach
    void setUp() {
        k.function("b", 0);
        k.function("c", 0);
        start("A: [x, y] f(x) = a or f(y) = b",
                "AW: [x] f(x) = a or f(c) = b",
                "BW: [x] f(x) = a or b = f(c)",
                "C: [x] P(x) or x = a",
                "D: [x] x != a or x = b",
                "K: f(a) = c or g(a) = c",
                "O: [x] x = a or f(x) = b",
                "V: [x, y] x = a or y = b or P(x)",
                "DUP: a = b or a = b",
                "SYM: [x, y] x = y or y = x",
                "DUPF: [x] f(x) = a or f(x) = a or P(x)");
    }

    // ------------------------------------------------------------------ acceptance

    @Test
    void withoutSubstitution() {
        accepted(eqfactor("A", 1, 2, null, "[y] f(y) = b or a != b"));
        accepted(eqfactor("AW", 1, 2, null, "f(c) = b or a != b"));
        accepted(eqfactor("V", 1, 2, null, "[y] y = b or P(y) or a != b"));
    }

    @Test
    void withoutSubstitutionTheConclusionIsAVariantWithFlippedEquations() {
        accepted(eqfactor("A", 1, 2, null, "[z] a != b or b = f(z)"));
        accepted(eqfactor("A", 2, 1, null, "[x] f(x) = a or b != a"));
        accepted(eqfactor("A", 2, 1, null, "[x] a = f(x) or a != b"));
    }

    @Test
    void withTheMostGeneralSubstitution() {
        accepted(eqfactor("A", 1, 2, "{x := y}", "[y] f(y) = b or a != b"));
        accepted(eqfactor("A", 1, 2, "{y := x}", "[x] f(x) = b or a != b"));
    }

    @Test
    void withAnyUnifyingSubstitution() {
        accepted(eqfactor("A", 1, 2, "{x := c, y := c}", "f(c) = b or a != b"));
        accepted(eqfactor("AW", 1, 2, "{x := c}", "f(c) = b or a != b"));
    }

    // ------------------------------------------------------------------ rejection

    @Test
    void sameLiteralIndexTwice() {
        rejected(eqfactor("A", 1, 1, null, "[x] f(x) = a or a != a"), "eqfactor",
                "equality factoring needs two different literals, not A.1 twice");
    }

    @Test
    void leftSidesAreTakenAsWritten() {
        // AW and BW differ only in the orientation of their second equation: b = f(c) has left side b.
        rejected(eqfactor("BW", 1, 2, null, "f(c) = b or a != b"), "eqfactor",
                "the left sides f(x) and b do not unify", "f and b clash");
    }

    @Test
    void notAnEquation() {
        rejected(eqfactor("C", 1, 2, null, "a = a or P(a)"), "eqfactor", "P(x) is not an equation s = t");
        rejected(eqfactor("C", 2, 1, null, "a = a or P(a)"), "eqfactor", "P(x) is not an equation s = t");
    }

    @Test
    void aNegativeEquationIsNotAnEquation() {
        rejected(eqfactor("D", 1, 2, null, "[x] x = b or a != b"), "eqfactor", "x != a is not an equation s = t");
    }

    @Test
    void leftSidesClash() {
        rejected(eqfactor("K", 1, 2, null, "g(a) = c or c != c"), "eqfactor",
                "the left sides f(a) and g(a) do not unify: f and g clash");
    }

    @Test
    void leftSidesFailTheOccursCheck() {
        rejected(eqfactor("O", 1, 2, null, "[x] f(x) = b or a != b"), "eqfactor",
                "the left sides x and f(x) do not unify", "x occurs in f(x)");
    }

    @Test
    void substitutionDoesNotMakeTheLeftSidesEqual() {
        rejected(eqfactor("A", 1, 2, "{x := a}", "[y] f(y) = b or a != b"), "eqfactor",
                "under {x := a} the left sides become f(a) and f(y): not equal");
    }

    @Test
    void substitutionBindsAVariableNotOfTheClause() {
        rejected(eqfactor("AW", 1, 2, "{y := c}", "f(c) = b or a != b"), "eqfactor",
                "the substitution binds y, which is not a variable of AW");
    }

    @Test
    void conclusionWithAnEquationInsteadOfTheDisequation() {
        rejected(eqfactor("A", 1, 2, null, "[y] f(y) = b or a = b"), "eqfactor",
                "the conclusion is not a variant of the derived clause");
    }

    @Test
    void conclusionKeepsTheFactoredLiteral() {
        rejected(eqfactor("A", 1, 2, null, "[y] f(y) = a or f(y) = b or a != b"), "eqfactor",
                "(3 distinct literals stated, 2 derived)");
    }

    @Test
    void conclusionDropsALiteral() {
        rejected(eqfactor("A", 1, 2, null, "a != b"), "eqfactor", "(1 distinct literal stated, 2 derived)");
        rejected(eqfactor("A", 1, 2, null, "[y] f(y) = b"), "eqfactor", "(1 distinct literal stated, 2 derived)");
    }

    @Test
    void conclusionDiffersUnderTheStatedSubstitution() {
        rejected(eqfactor("A", 1, 2, "{x := y}", "[y] f(y) = a or a != b"), "eqfactor",
                "the conclusion differs from the derived clause: stated but not derived f(y) = a; "
                        + "derived but not stated f(y) = b");
    }

    @Test
    void badLiteralIndex() {
        rejected(eqfactor("A", 1, 3, null, "a != b"), "eqfactor", "A has 2 literals, so there is no literal 3");
    }

    // ------------------------------------------------------------------ soundness: one literal written twice

    /*
     * Regression tests for a kernel bug (unsound accept) found in commit 725f16a. A clause is a set (FORMAT.md
     * section 5), so "a = b or a = b" and "x = y or y = x" each hold ONE literal, written at two indices.
     * Kernel.eqfactor refused only i == j as indices, then computed A − A.i by removing every literal equal to A.i,
     * which removed A.j as well: the conclusion lost the equation u = v that equality factoring must keep. From the
     * satisfiable a = b it derived b != b, and eqres then derived false. The kernel now refuses two indices that name
     * one literal; a sound alternative would keep u = v (a = b or b != b). Either way, these conclusions must never
     * be accepted.
     */

    @Test
    void aRepeatedGroundEquationIsNotTwoLiterals() {
        assertFalse(eqfactor("DUP", 1, 2, null, "b != b").accepted(),
                "eqfactor accepted b != b from a = b or a = b: a = b is satisfiable, b != b is not");
        assertFalse(eqfactor("DUP", 1, 2, "{}", "b != b").accepted(),
                "eqfactor with {} accepted b != b from a = b or a = b");
    }

    @Test
    void anEquationAndItsFlipAreNotTwoLiterals() {
        assertFalse(eqfactor("SYM", 1, 2, null, "[y] y != y").accepted(),
                "eqfactor accepted y != y from x = y or y = x, which holds in a one-element domain");
    }

    @Test
    void aRepeatedEquationBesideOtherLiteralsIsNotTwoLiterals() {
        // From f(x) = a or P(x) the kernel would derive a != a or P(x), that is P(x).
        assertFalse(eqfactor("DUPF", 1, 2, null, "[x] a != a or P(x)").accepted(),
                "eqfactor accepted a != a or P(x) from f(x) = a or f(x) = a or P(x)");
    }
}
