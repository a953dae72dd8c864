package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * Cases of {@code clausify} found by mutation testing of {@link Clausification} (docs/kernel-testing.md): the θ
 * search's undo on backtracking, constants inside the searched formula, and running out of budget in the goal loop
 * rather than in the literal matching.
 */
class ClausificationMutationTest extends RuleTestSupport {

    @BeforeEach
    void setUp() {
        k.function("a", 0);
        k.function("b", 0);
        k.function("c", 0);
        k.predicate("P", 1);
        k.predicate("Q", 1);
        k.predicate("P2", 2);
        k.predicate("S", 0);
        startFormulas(null, null,
                "pq: forall x. P(x) or Q(x)",
                "diag: forall x y. P2(x, y) or P2(y, y)",
                "orfalse: forall x. P(x) or false",
                "ortrue: forall x. P(x) or true",
                "andtrue: forall x. (P(x) and true) or Q(x)",
                "andfalse: forall x. (true and P(x)) or Q(x)",
                // 2^21 ways to pick a false part of each and, none of which can make the final true false.
                "choices: " + constantChoices(21));
    }

    private static String constantChoices(int n) {
        List<String> parts = new ArrayList<>();
        for (int i = 0; i < n; i++) parts.add("(false and false)");
        parts.add("true");
        return String.join(" or ", parts);
    }

    private Outcome clausify(String axiom, String stated) {
        return kernel.clausify("s", kernel.axiom(axiom), null, k.clause(stated));
    }

    // ------------------------------------------------------------------ backtracking undoes the bindings

    @Test
    void theNextCandidateAfterABacktrackIsTriedWithoutTheOldBindings() {
        // P(x) first matches P(a) (x := a), then Q(a) is not in the clause; the next candidate P(b) must be tried
        // with x unbound, and then Q(b) is there.
        accepted(clausify("pq", "P(a) or P(b) or Q(b)"));
        // The same with two variables, the good candidate right after the one that failed.
        accepted(clausify("diag", "P2(c, a) or P2(b, b)"));
    }

    @Test
    void aSearchThatBacktracksStillRejectsWhatDoesNotFollow() {
        rejected(clausify("pq", "P(a) or P(b) or Q(c)"), "clausify", "no substitution makes pq false");
        rejected(clausify("diag", "P2(c, a) or P2(b, a)"), "clausify", "no substitution makes diag false");
    }

    // ------------------------------------------------------------------ constants in the searched formula

    @Test
    void aFalsePartOfADisjunctionNeedsNothing() {
        // P(a) does not make the premise false under the empty θ (P(x) is not in the clause), so θ is searched.
        accepted(clausify("orfalse", "P(a)"));
        accepted(clausify("andtrue", "[x] P(x) or Q(x)")); // found by the evaluation alone
        accepted(clausify("andtrue", "P(b) or Q(b)"));
    }

    @Test
    void aTruePartOfADisjunctionCanNeverBeFalse() {
        // forall x. P(x) or true entails no clause but the tautologies; P(a) does not follow from it.
        rejected(clausify("ortrue", "P(a)"), "clausify", "no substitution makes ortrue false");
        rejected(clausify("ortrue", "[x] P(x)"), "clausify", "no substitution makes ortrue false");
    }

    @Test
    void aTruePartOfAConjunctionIsNotTheFalsePart() {
        // (true and P(x)) or Q(x): the and is false only through P(x).
        accepted(clausify("andfalse", "P(c) or Q(c)"));
        rejected(clausify("andfalse", "Q(c)"), "clausify", "no substitution makes andfalse false");
    }

    // ------------------------------------------------------------------ budget

    @Test
    void theBudgetAlsoRunsOutBetweenLiteralMatches() {
        // No literal at all: the budget is spent on choosing parts of the ands, not on matching literals.
        Outcome.Rejected r = rejected(clausify("choices", "S"), "clausify",
                "no substitution was found within " + Clausification.SEARCH_BUDGET + " search steps; state one");
        assertEquals("S", r.stated());
        assertNotNull(r.derived());
    }

    @Test
    void findThetaReportsExhaustionWithoutATheta() {
        Formula m = Clausification.stripUniversals(Formulas.nnf(k.formula(constantChoices(21))));
        Clausification.Search s = Clausification.findTheta(k.f, m, List.of());
        assertTrue(s.exhausted());
        assertNull(s.theta());
        // Below the budget the same search ends without a θ and without exhaustion.
        Formula small = Clausification.stripUniversals(Formulas.nnf(k.formula(constantChoices(10))));
        Clausification.Search t = Clausification.findTheta(k.f, small, List.of());
        assertFalse(t.exhausted());
        assertNull(t.theta());
    }

    @Test
    void findThetaReturnsTheBindingsInTheOrderMade() {
        Formula m = Clausification.stripUniversals(Formulas.nnf(k.formula("forall x y. P2(x, y) or P2(y, y)")));
        Clausification.Search s = Clausification.findTheta(k.f, m, k.clause("P2(c, a) or P2(b, b)").literals());
        assertFalse(s.exhausted());
        // The matcher walks the arguments right to left, so y is bound first.
        assertEquals("{y := b, x := b}", Printer.substitution(s.theta()));
    }

    // ------------------------------------------------------------------ the pieces

    @Test
    void stripUniversalsKeepsTheJunctionKinds() {
        Formula m = Clausification.stripUniversals(Formulas.nnf(k.formula("forall x. (P(x) and Q(x)) or S")));
        assertEquals("P(x) and Q(x) or S", Printer.formula(m));
        assertNull(Clausification.stripUniversals(Formulas.nnf(k.formula("forall x. P(x) or exists y. Q(y)"))));
    }

    @Test
    void evaluateSetsTheClauseLiteralsFalseAndTheOthersTrue() {
        Formula m = k.formula("P(a) and (Q(a) or S)");
        Substitution none = Substitution.empty(k.f);
        assertTrue(Clausification.evaluate(m, none, Set.of()));
        assertTrue(Clausification.evaluate(m, none, k.clause("Q(a)").asSet()));
        assertFalse(Clausification.evaluate(m, none, k.clause("Q(a) or S").asSet()));
        assertFalse(Clausification.evaluate(m, none, k.clause("P(a)").asSet()));
        assertFalse(Clausification.evaluate(k.formula("false"), none, Set.of()));
        assertThrows(IllegalStateException.class,
                () -> Clausification.evaluate(k.formula("P(a) implies S"), none, Set.of()));
    }
}
