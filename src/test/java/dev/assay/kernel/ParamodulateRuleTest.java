package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * {@code paramodulate A.i -> B.j @ p [σA] [σB]} and {@code <-} (FORMAT.md section 6, rules on clauses). When only one
 * substitution is written it is σA; {@code {}} writes an empty one (the grammar's gap decision), so "σB only" is
 * {@code {} σB} here.
 */
class ParamodulateRuleTest extends EqualityTestSupport {

    @BeforeEach
    void setUp() {
        k.function("b", 0);
        k.function("c", 0);
        k.function("m", 2);
        k.predicate("R", 2);
        start("E: a = b",
                "F: [x] f(x) = x",
                "G: [x] g(x) = h(x) or Q(x)",
                "P: [y] P(f(y)) or Q(y)",
                "N: not P(f(a))",
                "NB: not P(b)",
                "R: [y] R(a, g(y))",
                "EQ: [y] f(g(y)) = a",
                "NE: [z] h(z) != a",
                "M: [x] m(x, x) = a",
                "OC: [y] P(m(y, f(y)))",
                "NOT: [x] P(x) or Q(x)",
                "DIS: [x] x != a or Q(x)",
                "SELF: [x] f(x) = c or P(f(x))");
    }

    // ------------------------------------------------------------------ acceptance: directions and targets

    @Test
    void leftToRightIntoANegativePredicateLiteral() {
        Fact r = accepted(paramodulate("E", 1, "->", "N", 1, "1.1", "not P(f(b))"));
        assertEquals("not P(f(b))", Printer.clause(r.clause()));
    }

    @Test
    void rightToLeftRewritesTheRightSide() {
        accepted(paramodulate("E", 1, "<-", "NB", 1, "1", "not P(a)"));
    }

    @Test
    void rightToLeftWithAVariableSide() {
        // <- rewrites x into f(x); x unifies with the constant a at 1.1.
        accepted(paramodulate("F", 1, "<-", "N", 1, "1.1", "not P(f(f(a)))"));
        accepted(paramodulate("F", 1, "->", "N", 1, "1", "not P(a)"));
    }

    @Test
    void intoAPositivePredicateLiteralWithTheMostGeneralUnifier() {
        accepted(paramodulate("F", 1, "->", "P", 1, "1", "[y] P(y) or Q(y)"));
    }

    @Test
    void withoutSubstitutionsTheConclusionIsAVariantInAnyOrder() {
        accepted(paramodulate("F", 1, "->", "P", 1, "1", "[z] Q(z) or P(z)"));
        accepted(paramodulate("F", 1, "->", "P", 1, "1", "[u] P(u) or Q(u) or P(u)"));
    }

    @Test
    void intoTheSecondArgumentOfABinaryPredicateKeepingTheRestOfA() {
        accepted(paramodulate("G", 1, "->", "R", 1, "2", "[y] R(a, h(y)) or Q(y)"));
    }

    @Test
    void intoTheLeftSideOfAnEquation() {
        accepted(paramodulate("F", 1, "->", "EQ", 1, "1", "[y] g(y) = a"));
    }

    @Test
    void conclusionWithTheEquationFlipped() {
        accepted(paramodulate("F", 1, "->", "EQ", 1, "1", "[y] a = g(y)"));
        accepted(paramodulate("E", 1, "->", "NE", 1, "2", "[z] b != h(z)"));
    }

    @Test
    void intoTheRightSideOfAnEquation() {
        accepted(paramodulate("E", 1, "->", "EQ", 1, "2", "[y] f(g(y)) = b"));
    }

    @Test
    void deepInsideOneSideOfAnEquation() {
        accepted(paramodulate("G", 1, "->", "EQ", 1, "1.1", "[y] f(h(y)) = a or Q(y)"));
    }

    @Test
    void intoANegativeEquation() {
        accepted(paramodulate("E", 1, "->", "NE", 1, "2", "[z] h(z) != b"));
    }

    @Test
    void intoAVariablePosition() {
        // P(f(y)) at 1.1 is the variable y, which unifies with f(x): sound, though never needed for completeness.
        accepted(paramodulate("F", 1, "->", "P", 1, "1.1", "[x] P(f(x)) or Q(f(x))"));
    }

    // ------------------------------------------------------------------ acceptance: substitutions

    @Test
    void withSigmaAOnly() {
        accepted(paramodulate("F", 1, "->", "N", 1, "1", "{x := a}", null, "not P(a)"));
    }

    @Test
    void withAnEmptySigmaAOnly() {
        accepted(paramodulate("E", 1, "->", "N", 1, "1.1", "{}", null, "not P(f(b))"));
    }

    @Test
    void withSigmaBOnlyAfterAnEmptySigmaA() {
        accepted(paramodulate("E", 1, "->", "P", 1, "1.1", "{}", "{y := a}", "P(f(b)) or Q(a)"));
    }

    @Test
    void withBothSubstitutions() {
        accepted(paramodulate("F", 1, "->", "P", 1, "1", "{x := g(c)}", "{y := g(c)}", "P(g(c)) or Q(g(c))"));
        accepted(paramodulate("F", 1, "->", "P", 1, "1", "{x := y}", "{}", "[y] P(y) or Q(y)"));
    }

    @Test
    void theTwoSubstitutionsMayShareVariableNames() {
        // The premises' variables are quantified separately, so σB := {y := x} and σA's x are one variable of the
        // conclusion: an instance of each premise, both under the same assignment.
        accepted(paramodulate("F", 1, "->", "P", 1, "1", "{}", "{y := x}", "[x] P(x) or Q(x)"));
    }

    @Test
    void withSubstitutionsTheConclusionIsTheParamodulantItself() {
        // The choice the kernel makes, as for resolve with substitutions: no renaming is allowed.
        Outcome.Rejected r = rejected(paramodulate("F", 1, "->", "P", 1, "1", "{x := y}", "{}", "[z] P(z) or Q(z)"),
                "paramodulate", "the conclusion differs from the derived clause");
        assertTrue(k.clause(r.derived()).sameSet(k.clause("[y] P(y) or Q(y)")), r::toString);
    }

    // ------------------------------------------------------------------ acceptance: A and B the same step

    @Test
    void aClauseIntoItselfWithoutSubstitutions() {
        // SELF is f(x) = c or P(f(x)); B is renamed apart, so the conclusion keeps both copies of the rest.
        accepted(paramodulate("SELF", 1, "->", "SELF", 2, "1", "[x] P(f(x)) or f(x) = c or P(c)"));
    }

    @Test
    void aClauseIntoItselfWithSubstitutions() {
        accepted(paramodulate("SELF", 1, "->", "SELF", 2, "1", "{}", "{}", "[x] P(f(x)) or f(x) = c or P(c)"));
        accepted(paramodulate("SELF", 1, "->", "SELF", 2, "1", "{x := a}", "{x := a}",
                "P(f(a)) or f(a) = c or P(c)"));
    }

    @Test
    void anEquationIntoItself() {
        // f(x) = x into f(x') = x' at 1: x := x', giving x' = x' (a tautology, but a correct paramodulant).
        accepted(paramodulate("F", 1, "->", "F", 1, "1", "[x] x = x"));
    }

    // ------------------------------------------------------------------ rejection: positions

    @Test
    void positionOutOfRange() {
        rejected(paramodulate("E", 1, "->", "N", 1, "2", "not P(f(b))"), "paramodulate",
                "position 2 does not exist in N.1 (not P(f(a)))");
        rejected(paramodulate("E", 1, "->", "EQ", 1, "3", "[y] f(g(y)) = b"), "paramodulate",
                "position 3 does not exist in EQ.1 (f(g(y)) = a)");
        rejected(paramodulate("E", 1, "->", "R", 1, "1.1", "[y] R(b, g(y))"), "paramodulate",
                "position 1.1 does not exist in R.1");
    }

    @Test
    void positionBelowAConstant() {
        rejected(paramodulate("E", 1, "->", "N", 1, "1.1.1", "not P(f(b))"), "paramodulate",
                "position 1.1.1 does not exist in N.1 (not P(f(a)))");
    }

    @Test
    void positionBelowAVariable() {
        rejected(paramodulate("F", 1, "->", "P", 1, "1.1.1", "[y] P(y) or Q(y)"), "paramodulate",
                "position 1.1.1 does not exist in P.1 (P(f(y)))");
    }

    @Test
    void positionZeroOrEmpty() {
        // The parser refuses both; the kernel must not read them as the atom itself.
        rejected(paramodulate("E", 1, "->", "N", 1, "0", "not P(f(b))"), "paramodulate", "position 0 does not exist");
        rejected(paramodulate("E", 1, "->", "EQ", 1, "", "[y] f(g(y)) = b"), "paramodulate", "does not exist in EQ.1");
    }

    @Test
    void positionAtTheWrongSubterm() {
        // a = b is meant for the a at position 1 of R(a, g(y)), but position 2 is g(y).
        accepted(paramodulate("E", 1, "->", "R", 1, "1", "[y] R(b, g(y))"));
        rejected(paramodulate("E", 1, "->", "R", 1, "2", "[y] R(b, g(y))"), "paramodulate",
                "the side rewritten by ->, a, does not unify with g(y) at position 2 of R.1", "a and g clash");
    }

    // ------------------------------------------------------------------ rejection: the from-literal

    @Test
    void fromLiteralNotAnEquation() {
        rejected(paramodulate("NOT", 1, "->", "P", 1, "1", "[y] P(y) or Q(y)"), "paramodulate",
                "NOT.1 is P(x), not an equation s = t");
    }

    @Test
    void fromLiteralANegativeEquation() {
        rejected(paramodulate("DIS", 1, "->", "N", 1, "1.1", "[x] not P(f(x)) or Q(x)"), "paramodulate",
                "DIS.1 is x != a, not an equation s = t");
        rejected(paramodulate("DIS", 1, "<-", "N", 1, "1.1", "{x := a}", null, "not P(f(a)) or Q(a)"),
                "paramodulate", "DIS.1 is x != a, not an equation s = t");
    }

    @Test
    void badLiteralIndex() {
        rejected(paramodulate("E", 2, "->", "N", 1, "1.1", "not P(f(b))"), "paramodulate",
                "E has 1 literal, so there is no literal 2");
        rejected(paramodulate("E", 1, "->", "N", 2, "1.1", "not P(f(b))"), "paramodulate",
                "N has 1 literal, so there is no literal 2");
    }

    @Test
    void premiseIsAFormula() {
        Outcome o = kernel.paramodulate("s", kernel.axiom("E"), 1, true, fact("N"), 1, position("1.1"), null, null,
                k.clause("not P(f(b))"));
        rejected(o, "paramodulate", "E is a formula; paramodulate takes clause steps");
    }

    // ------------------------------------------------------------------ rejection: unification

    @Test
    void rewrittenSideClashes() {
        rejected(paramodulate("F", 1, "->", "R", 1, "2", "[y] R(a, y)"), "paramodulate",
                "the side rewritten by ->, f(x), does not unify with g(y) at position 2 of R.1", "f and g clash");
    }

    @Test
    void rewrittenSideFailsTheOccursCheck() {
        // m(x, x) against m(y', f(y')): x := y', then y' against f(y').
        rejected(paramodulate("M", 1, "->", "OC", 1, "1", "[y] P(a)"), "paramodulate",
                "does not unify with m(y, f(y)) at position 1 of OC.1", "occurs in");
    }

    @Test
    void wrongDirection() {
        // NB is not P(b): only <- (b into a) applies; -> would need a to unify with b.
        accepted(paramodulate("E", 1, "<-", "NB", 1, "1", "not P(a)"));
        rejected(paramodulate("E", 1, "->", "NB", 1, "1", "not P(a)"), "paramodulate",
                "the side rewritten by ->, a, does not unify with b at position 1 of NB.1", "a and b clash");
        rejected(paramodulate("E", 1, "<-", "N", 1, "1.1", "not P(f(b))"), "paramodulate",
                "the side rewritten by <-, b, does not unify with a at position 1.1 of N.1");
    }

    @Test
    void wrongDirectionWithSubstitutions() {
        rejected(paramodulate("E", 1, "->", "NB", 1, "1", "{}", "{}", "not P(a)"), "paramodulate",
                "under the stated substitutions the side rewritten by ->, a, differs from b at position 1 of NB.1");
    }

    @Test
    void wrongDirectionWhereBothSidesUnify() {
        // F.1 <- P.1 @ 1 rewrites x into f(x): it unifies, but gives P(f(f(y))) or Q(y), not P(y) or Q(y).
        Outcome.Rejected r = rejected(paramodulate("F", 1, "<-", "P", 1, "1", "[y] P(y) or Q(y)"), "paramodulate",
                "the conclusion is not a variant of the derived clause");
        assertTrue(r.derived().contains("P(f(f("), r::toString);
    }

    @Test
    void substitutionsThatDoNotMakeTheSidesEqual() {
        rejected(paramodulate("F", 1, "->", "P", 1, "1", "{x := a}", "{y := b}", "P(a) or Q(b)"), "paramodulate",
                "under the stated substitutions the side rewritten by ->, f(a), differs from f(b) at position 1 of P.1");
        rejected(paramodulate("F", 1, "->", "N", 1, "1", "not P(x)"), "paramodulate",
                "the conclusion is not a variant");
    }

    // ------------------------------------------------------------------ rejection: the stated clause

    @Test
    void conclusionNotRewritten() {
        Outcome.Rejected r = rejected(paramodulate("F", 1, "->", "P", 1, "1", "[y] P(f(y)) or Q(y)"), "paramodulate",
                "the conclusion is not a variant of the derived clause");
        assertNotNull(r.derived());
        assertEquals("[y] P(f(y)) or Q(y)", r.stated());
    }

    @Test
    void conclusionDropsALiteral() {
        rejected(paramodulate("F", 1, "->", "P", 1, "1", "[y] P(y)"), "paramodulate",
                "not a variant of the derived clause (1 distinct literal stated, 2 derived)");
        rejected(paramodulate("G", 1, "->", "R", 1, "2", "[y] R(a, h(y))"), "paramodulate",
                "(1 distinct literal stated, 2 derived)");
    }

    @Test
    void conclusionSeparatesVariablesTheUnifierShares() {
        rejected(paramodulate("F", 1, "->", "P", 1, "1", "[y, z] P(y) or Q(z)"), "paramodulate",
                "not a variant of the derived clause");
    }

    @Test
    void conclusionRewritesTheWrongOccurrence() {
        rejected(paramodulate("E", 1, "->", "EQ", 1, "2", "[y] f(g(y)) = a"), "paramodulate", "not a variant");
        rejected(paramodulate("E", 1, "->", "R", 1, "1", "[y] R(a, g(b))"), "paramodulate", "not a variant");
    }

    @Test
    void conclusionDiffersUnderStatedSubstitutions() {
        Outcome.Rejected r = rejected(paramodulate("F", 1, "->", "N", 1, "1", "{x := a}", null, "not P(f(a))"),
                "paramodulate", "the conclusion differs from the derived clause: stated but not derived not P(f(a))"
                        + "; derived but not stated not P(a)");
        assertEquals("not P(a)", r.derived());
    }

    @Test
    void conclusionWithAnUnknownSymbol() {
        k.function("zz", 0);
        rejected(paramodulate("E", 1, "->", "N", 1, "1.1", "not P(f(zz))"), "paramodulate",
                "the symbol zz/0 is not in the signature");
    }

    // ------------------------------------------------------------------ rejection: substitution domains

    @Test
    void sigmaABindsAVariableNotOfA() {
        rejected(paramodulate("F", 1, "->", "N", 1, "1", "{y := a}", null, "not P(a)"), "paramodulate",
                "the substitution binds y, which is not a variable of F");
        rejected(paramodulate("E", 1, "->", "N", 1, "1.1", "{x := a}", null, "not P(f(b))"), "paramodulate",
                "the substitution binds x, which is not a variable of E");
    }

    @Test
    void sigmaBBindsAVariableNotOfB() {
        rejected(paramodulate("E", 1, "->", "P", 1, "1.1", "{}", "{x := a}", "P(f(b)) or Q(a)"), "paramodulate",
                "the substitution binds x, which is not a variable of P");
    }

    @Test
    void oneWrittenSubstitutionIsSigmaA() {
        // {y := a} written alone is σA; y is a variable of P (B) but not of E (A).
        rejected(paramodulate("E", 1, "->", "P", 1, "1.1", "{y := a}", null, "P(f(b)) or Q(a)"), "paramodulate",
                "the substitution binds y, which is not a variable of E");
    }
}
