package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/** {@code resolve A.i [σA], B.j [σB]} (FORMAT.md section 6, rules on clauses). */
class ResolveRuleTest extends RuleTestSupport {

    @BeforeEach
    void setUp() {
        k.function("b", 0);
        k.function("c", 0);
        k.predicate("Q", 2);
        start("A: [x] not P(x) or R(x)",
                "B: P(a)",
                "D: [y] P(y) or S(y)",
                "E: [x] not P(x) or P(f(x))",
                "F: [x] not P(f(x)) or T(x)",
                "L1: [x] Link(x, x)",
                "L2: [y] not Link(y, next(y))",
                "EQ: a = b",
                "NE: [x] b != x or R(x)",
                "AB: not P(b)",
                "NA: not P(a)",
                "NR: not R(a)");
    }

    private Outcome resolve(String a, int i, String b, int j, String stated) {
        return settled(kernel.resolve("s", fact(a), i, null, fact(b), j, null, k.clause(stated)));
    }

    private Outcome resolve(String a, int i, String sa, String b, int j, String sb, String stated) {
        return settled(kernel.resolve("s", fact(a), i, sa == null ? null : k.substitution(sa), fact(b), j,
                sb == null ? null : k.substitution(sb), k.clause(stated)));
    }

    // ------------------------------------------------------------------ acceptance

    @Test
    void withoutSubstitutions() {
        Fact r = accepted(resolve("A", 1, "B", 1, "R(a)"));
        assertEquals("s", r.label());
        assertTrue(r.isClause());
        assertEquals("R(a)", Printer.clause(r.clause()));
    }

    @Test
    void withoutSubstitutionsTheConclusionIsAVariant() {
        // A.1 and D.1 unify by a variable-for-variable binding; any renaming of the resolvent is accepted.
        accepted(resolve("A", 1, "D", 1, "[z] R(z) or S(z)"));
        accepted(resolve("A", 1, "D", 1, "[x] S(x) or R(x) or S(x)"));
        accepted(resolve("D", 1, "A", 1, "[u] S(u) or R(u)"));
    }

    @Test
    void withTheFirstSubstitutionOnly() {
        accepted(resolve("A", 1, "{x := a}", "B", 1, null, "R(a)"));
    }

    @Test
    void withTheSecondSubstitutionOnly() {
        // F.1 = not P(f(x)), D.1 σB = P(f(x)): conclusion T(x) or S(f(x)), sharing x on purpose.
        accepted(resolve("F", 1, null, "D", 1, "{y := f(x)}", "[x] T(x) or S(f(x))"));
    }

    @Test
    void withBothSubstitutions() {
        accepted(resolve("A", 1, "{x := b}", "D", 1, "{y := b}", "R(b) or S(b)"));
    }

    @Test
    void withEmptySubstitutionsOnGroundClauses() {
        Substitution empty = Substitution.empty(k.f);
        accepted(kernel.resolve("s", fact("AB"), 1, empty, fact("D"), 1, k.substitution("{y := b}"), k.clause("S(b)")));
    }

    @Test
    void aClauseWithItselfWithoutSubstitutions() {
        // E resolved with a renamed copy of itself: P(f(x)) against not P(x'): x' := f(x).
        accepted(resolve("E", 2, "E", 1, "[x] not P(x) or P(f(f(x)))"));
    }

    @Test
    void aClauseWithItselfWithSubstitutions() {
        // Each premise is its own instance: E.2 with σA = {} and E.1 with σB = {x := f(x)}.
        accepted(kernel.resolve("s", fact("E"), 2, Substitution.empty(k.f), fact("E"), 1, k.substitution("{x := f(x)}"),
                k.clause("[x] not P(x) or P(f(f(x)))")));
    }

    @Test
    void equationsUnifyInEitherOrientation() {
        // EQ.1 = (a = b) and NE.1 = (b != x): as written a =? b clashes, swapped x := a.
        accepted(resolve("EQ", 1, "NE", 1, "R(a)"));
        // With substitutions the atoms are compared as unordered equations.
        accepted(resolve("EQ", 1, null, "NE", 1, "{x := a}", "R(a)"));
    }

    @Test
    void resolvingToTheEmptyClause() {
        Fact empty = accepted(resolve("B", 1, "NA", 1, "false"));
        assertTrue(empty.isEmptyClause());
    }

    @Test
    void derivedFactsAreUsableAsPremises() {
        Fact ra = accepted(resolve("A", 1, "B", 1, "R(a)"));
        Fact empty = accepted(kernel.resolve("e", ra, 1, null, fact("NR"), 1, null, Clause.EMPTY));
        assertTrue(empty.isEmptyClause());
        assertEquals("e", empty.label());
    }

    // ------------------------------------------------------------------ rejection

    @Test
    void sameSign() {
        Outcome.Rejected r = rejected(resolve("B", 1, "D", 1, "S(a)"), "resolve",
                "B.1 and D.1 have the same sign", "opposite signs");
        assertEquals("S(a)", r.stated());
        assertNull(r.derived());
    }

    @Test
    void badLiteralIndex() {
        rejected(resolve("A", 3, "B", 1, "R(a)"), "resolve", "A has 2 literals, so there is no literal 3");
        rejected(resolve("A", 0, "B", 1, "R(a)"), "resolve", "there is no literal 0");
        rejected(resolve("A", 1, "B", 2, "R(a)"), "resolve", "B has 1 literal, so there is no literal 2");
        rejected(resolve("A", -1, "B", 1, "R(a)"), "resolve", "there is no literal -1");
    }

    @Test
    void clashingAtoms() {
        // F.1 = not P(f(x)) against B.1 = P(a): f and a clash at position 1.
        Outcome.Rejected r = rejected(resolve("F", 1, "B", 1, "T(a)"), "resolve",
                "the atoms of F.1 and B.1", "P(f(x)) and P(a)", "do not unify", "f and a clash", "position 1");
        assertEquals("T(a)", r.stated());
    }

    @Test
    void occursCheck() {
        rejected(resolve("L1", 1, "L2", 1, "false"), "resolve", "Link(x, x) and Link(y, next(y))", "do not unify",
                "occurs in next(", "position 2");
    }

    @Test
    void failureMessagesDoNotShowRenamedVariables() {
        // STYLE.md gives this very example: "Link(x, x) and Link(y, next(y)) do not unify: y occurs in next(y)".
        // Renaming B apart is the kernel's business; its internal names (with a prime) should not reach the user.
        Outcome.Rejected r = rejected(resolve("L1", 1, "L2", 1, "false"), "resolve", "occurs in");
        assertFalse(r.reason().contains("'"), "internal variable name in: " + r.reason());
    }

    @Test
    void notAVariantOfTheResolvent() {
        Outcome.Rejected r = rejected(resolve("A", 1, "D", 1, "[z] R(z) or S(a)"), "resolve",
                "the conclusion is not a variant of the derived clause");
        assertEquals("[z] R(z) or S(a)", r.stated());
        assertNotNull(r.derived());
        rejected(resolve("A", 1, "D", 1, "[z] R(z)"), "resolve", "not a variant", "(1 distinct literal stated, 2 derived)");
        // A non-injective renaming of the resolvent is an instance, not a variant.
        rejected(resolve("A", 1, "D", 1, "[z, w] R(z) or S(w)"), "resolve", "not a variant");
    }

    @Test
    void differsFromTheDerivedClause() {
        Outcome.Rejected r = rejected(resolve("A", 1, "{x := a}", "B", 1, null, "R(b)"), "resolve",
                "the conclusion differs from the derived clause", "stated but not derived R(b)",
                "derived but not stated R(a)");
        assertEquals("R(b)", r.stated());
        assertEquals("R(a)", r.derived());
        // With substitutions the conclusion is the resolvent itself, not a variant of it.
        rejected(resolve("A", 1, "{x := b}", "D", 1, "{y := b}", "R(b)"), "resolve", "derived but not stated S(b)");
        rejected(resolve("F", 1, null, "D", 1, "{y := f(x)}", "[z] T(z) or S(f(z))"), "resolve", "differs");
    }

    @Test
    void statedSubstitutionsThatDoNotMakeTheAtomsEqual() {
        rejected(resolve("A", 1, "{x := b}", "B", 1, null, "R(b)"), "resolve",
                "under the stated substitutions A.1 becomes not P(b) and B.1 becomes P(a): not the same atom");
        // Only one substitution given: the other is empty, not "compute the rest".
        rejected(resolve("A", 1, null, "B", 1, "{}", "R(a)"), "resolve", "not the same atom");
    }

    @Test
    void substitutionBindingAVariableNotInThePremise() {
        rejected(resolve("A", 1, "{y := a}", "B", 1, null, "R(a)"), "resolve",
                "the substitution binds y, which is not a variable of A");
        rejected(resolve("A", 1, "{x := a}", "B", 1, "{x := a}", "R(a)"), "resolve",
                "the substitution binds x, which is not a variable of B");
    }

    @Test
    void premiseThatIsAFormula() {
        Outcome o = kernel.resolve("s", kernel.axiom("A"), 1, null, fact("B"), 1, null, k.clause("R(a)"));
        rejected(o, "resolve", "A is a formula; resolve takes clause steps");
        Outcome o2 = kernel.resolve("s", fact("A"), 1, null, kernel.axiom("B"), 1, null, k.clause("R(a)"));
        rejected(o2, "resolve", "B is a formula");
    }

    @Test
    void unknownSymbolInTheConclusion() {
        rejected(resolve("A", 1, "B", 1, "R(zz9)"), "resolve", "the symbol zz9/0 is not in the signature");
    }

    @Test
    void wrongArityInTheConclusion() {
        Symbol r2 = new Symbol("R", Symbol.Kind.PREDICATE, 2);
        Clause stated = KernelFixture.clauseOf(new Literal(true, k.f.application(r2, k.term("a"), k.term("a"))));
        Outcome o = kernel.resolve("s", fact("A"), 1, null, fact("B"), 1, null, stated);
        rejected(o, "resolve", "the symbol R is used as", "R/2", "but is", "R/1");
    }

    @Test
    void wrongKindInTheConclusion() {
        // a is a constant; a predicate a/0 is another symbol of the same name.
        Symbol aPred = new Symbol("a", Symbol.Kind.PREDICATE, 0);
        Clause stated = KernelFixture.clauseOf(new Literal(true, k.f.application(aPred)));
        Outcome.Rejected r = rejected(kernel.resolve("s", fact("A"), 1, null, fact("B"), 1, null, stated), "resolve",
                "the symbol a is used as");
        // The reason must tell the two symbols apart: "used as a/0 but is a/0" says nothing.
        String used = r.reason().substring(r.reason().indexOf("used as") + 7, r.reason().indexOf(" but is"));
        String is = r.reason().substring(r.reason().indexOf(" but is") + 7);
        assertFalse(used.trim().equals(is.trim()), "the reason does not say which kind is which: " + r.reason());
    }

    @Test
    void unknownSymbolInASubstitution() {
        rejected(resolve("A", 1, "{x := zz8}", "B", 1, null, "R(a)"), "resolve", "zz8/0 is not in the signature");
    }

    @Test
    void factsOfAnotherKernel() {
        Kernel other = otherKernel();
        Fact foreignA = accepted(other.clausify("A", other.axiom("A"), null, k.clause("[x] not P(x) or R(x)")));
        rejected(kernel.resolve("s", foreignA, 1, null, fact("B"), 1, null, k.clause("R(a)")), "resolve",
                "premise A belongs to another check");
        rejected(kernel.resolve("s", fact("B"), 1, null, foreignA, 1, null, k.clause("R(a)")), "resolve",
                "belongs to another check");
        // The same clause is accepted from this kernel's own fact.
        assertSame(Outcome.Accepted.class, resolve("A", 1, "B", 1, "R(a)").getClass());
    }
}
