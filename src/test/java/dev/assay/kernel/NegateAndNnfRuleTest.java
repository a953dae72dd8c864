package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/** The formula rules {@code negate} and {@code nnf} (FORMAT.md section 6). */
class NegateAndNnfRuleTest extends RuleTestSupport {

    @BeforeEach
    void setUp() {
        k.function("ann", 0);
        k.function("badge", 1);
        k.predicate("Staff", 1);
        k.predicate("Holds", 2);
        // The example of FORMAT.md section 8.
        startFormulas("ann_badge", "exists b. Holds(ann, b)",
                "issued: forall p. Staff(p) implies exists b. Holds(p, b)",
                "ann_staff: Staff(ann)");
    }

    private Outcome negate(String goal, String stated) {
        return kernel.negate("g1", goal, k.formula(stated));
    }

    // ------------------------------------------------------------------ negate

    @Test
    void negateAcceptsNotG() {
        Fact g = accepted(negate("ann_badge", "not exists b. Holds(ann, b)"));
        assertFalse(g.isClause());
        assertEquals("g1", g.label());
    }

    @Test
    void negateAcceptsTheNegationNormalForm() {
        accepted(negate("ann_badge", "forall b. not Holds(ann, b)"));
        accepted(negate("ann_badge", "forall z. not Holds(ann, z)"));
    }

    @Test
    void negatedGoalLeadsToAClause() {
        Fact g = accepted(negate("ann_badge", "forall b. not Holds(ann, b)"));
        accepted(kernel.clausify("c3", g, null, k.clause("[b] not Holds(ann, b)")));
    }

    @Test
    void theGoalIsNoPremise() {
        assertNull(kernel.axiom("ann_badge"));
        assertNotNull(kernel.axiom("issued"));
    }

    @Test
    void negateWithTheWrongGoalName() {
        rejected(negate("ann_staff", "not Staff(ann)"), "negate", "ann_staff is not the problem's goal (ann_badge)");
        rejected(negate("nothing", "not exists b. Holds(ann, b)"), "negate", "nothing is not the problem's goal");
    }

    @Test
    void negateWithoutAGoal() {
        startFormulas(null, null, "ann_staff: Staff(ann)");
        rejected(negate("ann_badge", "not Staff(ann)"), "negate", "the problem has no goal to negate");
    }

    @Test
    void negateWithAWrongConclusion() {
        Outcome.Rejected r = rejected(negate("ann_badge", "forall b. Holds(ann, b)"), "negate",
                "the conclusion is neither not ann_badge nor its negation normal form");
        assertEquals("forall b. Holds(ann, b)", r.stated());
        assertEquals("forall b. not Holds(ann, b)", r.derived());
        // The goal itself is not its negation.
        rejected(negate("ann_badge", "exists b. Holds(ann, b)"), "negate", "neither");
        // Quantifier scope matters: the body must be negated, not just the quantifier turned.
        rejected(negate("ann_badge", "forall b. Holds(ann, b)"), "negate", "neither");
    }

    @Test
    void negateWithAnUnknownSymbol() {
        rejected(negate("ann_badge", "not exists b. Holds(bob, b)"), "negate", "the symbol bob/0 is not in the signature");
    }

    // ------------------------------------------------------------------ nnf

    @Test
    void nnfAccepted() {
        Fact n = accepted(kernel.nnf("a0", kernel.axiom("issued"), k.formula("forall p. not Staff(p) or exists b. Holds(p, b)")));
        assertFalse(n.isClause());
        // Modulo renaming of bound variables and commutativity of or.
        accepted(kernel.nnf("a1", kernel.axiom("issued"), k.formula("forall q. (exists c. Holds(q, c)) or not Staff(q)")));
        accepted(kernel.nnf("a2", kernel.axiom("ann_staff"), k.formula("Staff(ann)")));
    }

    @Test
    void nnfOfAFormulaFact() {
        Fact g = accepted(negate("ann_badge", "not exists b. Holds(ann, b)"));
        accepted(kernel.nnf("g2", g, k.formula("forall b. not Holds(ann, b)")));
    }

    @Test
    void nnfWrong() {
        Outcome.Rejected r = rejected(kernel.nnf("a0", kernel.axiom("issued"),
                k.formula("forall p. Staff(p) implies exists b. Holds(p, b)")), "nnf",
                "the conclusion is not the negation normal form of issued");
        assertEquals("forall p. not Staff(p) or (exists b. Holds(p, b))", r.derived());
        rejected(kernel.nnf("a0", kernel.axiom("issued"), k.formula("forall p. Staff(p) or exists b. Holds(p, b)")),
                "nnf", "not the negation normal form");
        // Swapping the quantifiers' scope is not a renaming.
        rejected(kernel.nnf("a0", kernel.axiom("issued"), k.formula("exists b. forall p. not Staff(p) or Holds(p, b)")),
                "nnf", "not the negation normal form");
    }

    @Test
    void nnfOfAClause() {
        Fact c = accepted(kernel.clausify("c2", kernel.axiom("ann_staff"), null, k.clause("Staff(ann)")));
        rejected(kernel.nnf("n", c, k.formula("Staff(ann)")), "nnf", "c2 is a clause step; nnf takes a formula");
    }

    @Test
    void nnfWithAnUnknownSymbol() {
        rejected(kernel.nnf("a", kernel.axiom("ann_staff"), k.formula("Staff(bob)")), "nnf",
                "the symbol bob/0 is not in the signature");
    }

    @Test
    void nnfOfAnotherKernelsFact() {
        Kernel other = otherKernel();
        rejected(kernel.nnf("a", other.axiom("ann_staff"), k.formula("Staff(ann)")), "nnf",
                "premise ann_staff belongs to another check");
        assertTrue(other.nnf("a", other.axiom("ann_staff"), k.formula("Staff(ann)")).accepted());
    }
}
