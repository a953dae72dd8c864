package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/** {@code eqres A.i [σ]} (FORMAT.md section 6, rules on clauses): literal i is {@code s != t}, σ makes s and t equal. */
class EqresRuleTest extends EqualityTestSupport {

    @BeforeEach
    void setUp() {
        k.function("b", 0);
        k.predicate("R", 2);
        start("D: [x] f(x) != f(a) or P(x)",
                "V: [x, y] x != y or R(x, y)",
                "G: a != a",
                "C: f(a) != g(a) or P(a)",
                "O: [x] x != f(x) or P(x)",
                "POS: [x] x = a or P(x)",
                "NP: not P(a) or a != a",
                "FL: [x] a != x or Q(x)",
                "T: [x, y] f(x) != y or P(y)");
    }

    // ------------------------------------------------------------------ acceptance

    @Test
    void withoutSubstitution() {
        accepted(eqres("D", 1, null, "P(a)"));
        accepted(eqres("T", 1, null, "[x] P(f(x))"));
        accepted(eqres("NP", 2, null, "not P(a)"));
    }

    @Test
    void withoutSubstitutionTheConclusionIsAVariant() {
        accepted(eqres("V", 1, null, "[x] R(x, x)"));
        accepted(eqres("V", 1, null, "[z] R(z, z)"));
        accepted(eqres("T", 1, null, "[u] P(f(u)) or P(f(u))"));
    }

    @Test
    void theEmptyClause() {
        Fact f = accepted(eqres("G", 1, null, "false"));
        assertTrue(f.isEmptyClause());
        accepted(eqres("G", 1, "{}", "false"));
    }

    @Test
    void disequationWithTheVariableOnTheRight() {
        accepted(eqres("FL", 1, null, "Q(a)"));
        accepted(eqres("FL", 1, "{x := a}", "Q(a)"));
    }

    @Test
    void withTheMostGeneralSubstitution() {
        accepted(eqres("D", 1, "{x := a}", "P(a)"));
        accepted(eqres("V", 1, "{x := y}", "[y] R(y, y)"));
        accepted(eqres("V", 1, "{y := x}", "[x] R(x, x)"));
    }

    @Test
    void withAnyUnifyingSubstitution() {
        accepted(eqres("V", 1, "{x := a, y := a}", "R(a, a)"));
        accepted(eqres("T", 1, "{x := a, y := f(a)}", "P(f(a))"));
    }

    // ------------------------------------------------------------------ rejection

    @Test
    void positiveLiteral() {
        rejected(eqres("POS", 1, null, "P(a)"), "eqres", "POS.1 is x = a, not a disequation s != t");
        rejected(eqres("POS", 1, "{x := a}", "P(a)"), "eqres", "POS.1 is x = a, not a disequation s != t");
    }

    @Test
    void notAnEquation() {
        rejected(eqres("NP", 1, null, "a != a"), "eqres", "NP.1 is not P(a), not a disequation s != t");
    }

    @Test
    void sidesClash() {
        rejected(eqres("C", 1, null, "P(a)"), "eqres", "the sides of C.1 do not unify: f and g clash");
    }

    @Test
    void sidesFailTheOccursCheck() {
        rejected(eqres("O", 1, null, "[x] P(x)"), "eqres", "the sides of O.1 do not unify", "x occurs in f(x)");
    }

    @Test
    void substitutionDoesNotMakeTheSidesEqual() {
        rejected(eqres("V", 1, "{x := a}", "[y] R(a, y)"), "eqres", "under {x := a} the sides become a and y: not equal");
        rejected(eqres("D", 1, "{x := b}", "P(b)"), "eqres", "the sides become f(b) and f(a): not equal");
    }

    @Test
    void substitutionBindsAVariableNotOfTheClause() {
        rejected(eqres("D", 1, "{y := a}", "P(a)"), "eqres", "the substitution binds y, which is not a variable of D");
    }

    @Test
    void conclusionNotAVariant() {
        Outcome.Rejected r = rejected(eqres("D", 1, null, "[x] P(x)"), "eqres",
                "the conclusion is not a variant of the derived clause");
        assertEquals("P(a)", r.derived());
        rejected(eqres("V", 1, null, "[x, y] R(x, y)"), "eqres", "not a variant");
    }

    @Test
    void conclusionKeepsTheResolvedLiteral() {
        rejected(eqres("D", 1, null, "f(a) != f(a) or P(a)"), "eqres",
                "not a variant of the derived clause (2 distinct literals stated, 1 derived)");
    }

    @Test
    void conclusionDropsALiteral() {
        rejected(eqres("V", 1, null, "false"), "eqres", "(0 distinct literals stated, 1 derived)");
    }

    @Test
    void conclusionDiffersUnderTheStatedSubstitution() {
        Outcome.Rejected r = rejected(eqres("D", 1, "{x := a}", "P(b)"), "eqres",
                "the conclusion differs from the derived clause: stated but not derived P(b); derived but not stated P(a)");
        assertEquals("P(b)", r.stated());
        // With σ the conclusion is (A − A.i)σ itself, not a variant of it (the kernel's choice, as for resolve).
        rejected(eqres("V", 1, "{x := y}", "[z] R(z, z)"), "eqres", "the conclusion differs from the derived clause");
    }

    @Test
    void badLiteralIndex() {
        rejected(eqres("G", 2, null, "false"), "eqres", "G has 1 literal, so there is no literal 2");
    }
}
