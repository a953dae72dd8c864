package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/** {@code factor A.i, A.j [σ]} (FORMAT.md section 6, rules on clauses). */
class FactorRuleTest extends RuleTestSupport {

    @BeforeEach
    void setUp() {
        k.function("b", 0);
        start("A: [x, y] P(x) or P(f(y)) or Q(x)",
                "B: [x] P(x) or not P(a)",
                "C: [x] P(a) or P(f(x))",
                "D: [x] P(x) or P(f(x))",
                "E: [x, y] x = a or a = y or Q(y)",
                "G: P(a) or Q(a)");
    }

    private Outcome factor(String a, int i, int j, String sigma, String stated) {
        return settled(kernel.factor("s", fact(a), i, j, sigma == null ? null : k.substitution(sigma), k.clause(stated)));
    }

    // ------------------------------------------------------------------ acceptance

    @Test
    void withoutSubstitution() {
        accepted(factor("A", 1, 2, null, "[y] P(f(y)) or Q(f(y))"));
        accepted(factor("A", 2, 1, null, "[z] Q(f(z)) or P(f(z)) or P(f(z))"));
    }

    @Test
    void withTheMostGeneralSubstitution() {
        accepted(factor("A", 1, 2, "{x := f(y)}", "[y] P(f(y)) or Q(f(y))"));
    }

    @Test
    void withAnyUnifyingSubstitution() {
        // σ need not be most general: the conclusion is Aσ.
        accepted(factor("A", 1, 2, "{x := f(a), y := a}", "P(f(a)) or Q(f(a))"));
    }

    @Test
    void equationsInEitherOrientation() {
        // E.1 = (x = a) and E.2 = (a = y): as written x := a, y := a; swapped x := y.
        accepted(factor("E", 1, 2, null, "[y] y = a or Q(y)"));
        accepted(factor("E", 1, 2, "{x := y}", "[y] y = a or a = y or Q(y)"));
    }

    // ------------------------------------------------------------------ rejection

    @Test
    void sameLiteralTwice() {
        Outcome.Rejected r = rejected(factor("A", 1, 1, null, "[x, y] P(x) or P(f(y)) or Q(x)"), "factor",
                "factoring needs two different literals, not A.1 twice");
        assertEquals("[x, y] P(x) or P(f(y)) or Q(x)", r.stated());
    }

    @Test
    void oppositeSigns() {
        rejected(factor("B", 1, 2, null, "P(a)"), "factor", "B.1 and B.2 have opposite signs",
                "factoring needs the same sign");
    }

    @Test
    void badLiteralIndex() {
        rejected(factor("A", 1, 4, null, "P(a)"), "factor", "A has 3 literals, so there is no literal 4");
        rejected(factor("A", 0, 1, null, "P(a)"), "factor", "there is no literal 0");
    }

    @Test
    void clashingLiterals() {
        rejected(factor("C", 1, 2, null, "P(a)"), "factor", "C.1 and C.2 do not unify", "a and f clash");
    }

    @Test
    void occursCheck() {
        rejected(factor("D", 1, 2, null, "P(a)"), "factor", "D.1 and D.2 do not unify", "x occurs in f(x)");
    }

    @Test
    void substitutionThatDoesNotMakeTheLiteralsEqual() {
        rejected(factor("A", 1, 2, "{x := a}", "P(a) or P(f(y)) or Q(a)"), "factor",
                "under {x := a} the literals become P(a) and P(f(y)): not equal");
    }

    @Test
    void substitutionBindingAVariableNotInTheClause() {
        rejected(factor("A", 1, 2, "{z := a}", "P(a)"), "factor", "the substitution binds z, which is not a variable of A");
    }

    @Test
    void differsFromTheDerivedClause() {
        Outcome.Rejected r = rejected(factor("A", 1, 2, "{x := f(y)}", "[y] P(f(y))"), "factor",
                "the conclusion differs from the derived clause", "derived but not stated Q(f(y))");
        assertEquals("[y] P(f(y)) or P(f(y)) or Q(f(y))", r.derived());
        // With σ the conclusion is Aσ itself, not a renaming of it.
        rejected(factor("A", 1, 2, "{x := f(y)}", "[z] P(f(z)) or Q(f(z))"), "factor", "differs");
    }

    @Test
    void notAVariant() {
        Outcome.Rejected r = rejected(factor("A", 1, 2, null, "[y] P(f(y)) or Q(y)"), "factor",
                "the conclusion is not a variant of the derived clause");
        assertNotNull(r.derived());
        // Factoring a ground clause with two different literals: they do not unify.
        rejected(factor("G", 1, 2, null, "P(a)"), "factor", "do not unify", "P and Q clash");
    }

    @Test
    void premiseThatIsAFormula() {
        rejected(kernel.factor("s", kernel.axiom("A"), 1, 2, null, k.clause("[y] P(f(y)) or Q(f(y))")), "factor",
                "A is a formula; factor takes clause steps");
    }

    @Test
    void unknownSymbols() {
        rejected(factor("A", 1, 2, null, "[y] P(g7(y)) or Q(g7(y))"), "factor", "the symbol g7/1 is not in the signature");
        rejected(factor("A", 1, 2, "{x := f(zz1), y := zz1}", "P(f(zz1)) or Q(f(zz1))"), "factor",
                "zz1/0 is not in the signature");
    }

    @Test
    void factOfAnotherKernel() {
        Kernel other = otherKernel();
        Fact foreign = accepted(other.clausify("A", other.axiom("A"), null, k.clause("[x, y] P(x) or P(f(y)) or Q(x)")));
        rejected(kernel.factor("s", foreign, 1, 2, null, k.clause("[y] P(f(y)) or Q(f(y))")), "factor",
                "premise A belongs to another check");
    }
}
