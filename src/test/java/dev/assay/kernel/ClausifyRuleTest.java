package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * {@code clausify P [θ]} (FORMAT.md section 6): with M = nnf(P) less its universal quantifiers, Mθ must evaluate to
 * false when the literals of the conclusion are false and every other literal occurrence is true.
 */
class ClausifyRuleTest extends RuleTestSupport {

    @BeforeEach
    void setUp() {
        k.function("a", 0);
        k.function("b", 0);
        k.function("c", 0);
        k.function("f", 1);
        for (int i = 1; i <= 10; i++) k.function("c" + i, 0);
        k.predicate("P", 1);
        k.predicate("Q", 1);
        k.predicate("R", 2);
        k.predicate("P2", 2);
        k.predicate("S", 0);
        startFormulas(null, null,
                "ax1: forall x. P(x) implies Q(x)",
                "conj: forall x. P(x) and Q(x)",
                "equiv: forall x. P(x) iff Q(x)",
                "ex: exists y. P(y)",
                "nested: forall x. not forall y. R(x, y)",
                "dm: forall x. not (P(x) and not Q(x))",
                "two: forall x y. P2(x, y) or R(y, x)",
                "bt: forall x y. P2(x, y) or P2(y, y)",
                "eq: forall x. f(x) = x",
                "fal: false",
                "tru: true",
                "ground: P(a)",
                "shadow: forall x. P(x) or forall x. Q(x)",
                "big: forall x1 x2 x3 x4 x5 x6 x7. P(x1) or P(x2) or P(x3) or P(x4) or P(x5) or P(x6) or P(x7) or S");
    }

    private Outcome clausify(String axiom, String theta, String stated) {
        return kernel.clausify("s", kernel.axiom(axiom), theta == null ? null : k.substitution(theta), k.clause(stated));
    }

    // ------------------------------------------------------------------ acceptance

    @Test
    void withoutThetaTheIdentityWorks() {
        Fact c = accepted(clausify("ax1", null, "[x] not P(x) or Q(x)"));
        assertEquals("[x] not P(x) or Q(x)", Printer.clause(c.clause()));
        accepted(clausify("ground", null, "P(a)"));
    }

    @Test
    void withTheta() {
        accepted(clausify("ax1", "{x := y}", "[y] not P(y) or Q(y)"));
        accepted(clausify("ax1", "{x := a}", "not P(a) or Q(a)"));
        accepted(clausify("ax1", "{x := x}", "[x] Q(x) or not P(x)"));
    }

    @Test
    void withoutThetaTheSearchFindsOne() {
        accepted(clausify("ax1", null, "[y] not P(y) or Q(y)"));
        accepted(clausify("ax1", null, "not P(f(a)) or Q(f(a))"));
        // A weaker clause (more literals) follows too.
        accepted(clausify("ax1", null, "[y] not P(y) or Q(y) or Q(a)"));
        accepted(clausify("two", null, "[u] P2(u, a) or R(a, u)"));
    }

    @Test
    void searchBacktracks() {
        // P2(x, y) first matches P2(c, a), then P2(y, y) = P2(a, a) is not in the clause; the search must undo it.
        accepted(clausify("bt", null, "P2(c, a) or P2(b, b) or P2(a, b)"));
    }

    @Test
    void conjunctionNeedsOnePartFalse() {
        accepted(clausify("conj", null, "[y] P(y)"));
        accepted(clausify("conj", null, "Q(a)"));
    }

    @Test
    void equivalenceGivesTwoClauses() {
        accepted(clausify("equiv", null, "[x] not P(x) or Q(x)"));
        accepted(clausify("equiv", null, "[z] P(z) or not Q(z)"));
    }

    @Test
    void theNegationNormalFormIsTakenFirst() {
        accepted(clausify("dm", null, "[x] not P(x) or Q(x)"));
        accepted(clausify("dm", "{x := b}", "Q(b) or not P(b)"));
    }

    @Test
    void equationsMatchInEitherOrientation() {
        accepted(clausify("eq", null, "[y] y = f(y)"));
        accepted(clausify("eq", "{x := a}", "a = f(a)"));
    }

    @Test
    void falseGivesAnyClause() {
        accepted(clausify("fal", null, "false"));
        accepted(clausify("fal", null, "P(a)"));
    }

    @Test
    void boundVariablesOfOneNameBecomeOneVariable() {
        // FORMAT.md: "a bound variable becomes a free variable of its own name", so both x of shadow are one x.
        accepted(clausify("shadow", null, "[x] P(x) or Q(x)"));
        rejected(clausify("shadow", null, "[x, y] P(x) or Q(y)"), "clausify", "no substitution");
    }

    @Test
    void derivedFormulaFactsCanBeClausified() {
        Fact n = accepted(kernel.nnf("n", kernel.axiom("ax1"), k.formula("forall x. not P(x) or Q(x)")));
        accepted(kernel.clausify("c", n, null, k.clause("[x] not P(x) or Q(x)")));
    }

    // ------------------------------------------------------------------ rejection

    @Test
    void noThetaExists() {
        Outcome.Rejected r = rejected(clausify("ax1", null, "[y] not P(y) or Q(a)"), "clausify",
                "no substitution makes ax1 false when the literals of the conclusion are false",
                "the clause does not follow from it");
        assertEquals("[y] not P(y) or Q(a)", r.stated());
        assertNotNull(r.derived());
        rejected(clausify("tru", null, "P(a)"), "clausify", "no substitution");
        rejected(clausify("conj", null, "R(a, a)"), "clausify", "no substitution");
        rejected(clausify("ground", null, "false"), "clausify", "no substitution");
    }

    @Test
    void existentialLeft() {
        Outcome.Rejected r = rejected(clausify("ex", null, "P(a)"), "clausify",
                "the negation normal form of ex still has an existential quantifier: skolemize it first");
        assertEquals("exists y. P(y)", r.derived());
        rejected(clausify("nested", null, "[x] not R(x, a)"), "clausify", "existential quantifier");
    }

    @Test
    void thetaBindingAVariableNotInTheFormula() {
        rejected(clausify("ax1", "{z := a}", "not P(a) or Q(a)"), "clausify",
                "the substitution binds z, which is not a variable of ax1");
    }

    @Test
    void thetaThatDoesNotFalsify() {
        rejected(clausify("ax1", "{x := b}", "not P(a) or Q(a)"), "clausify",
                "with {x := b} and the literals of the conclusion false, ax1 does not evaluate to false",
                "it does not entail the clause");
        // A stated θ is used as it is: an empty one is not completed by search.
        rejected(clausify("ax1", "{}", "[y] not P(y) or Q(y)"), "clausify", "does not evaluate to false");
    }

    @Test
    void searchBudgetRunsOut() {
        // Seven independent choices among ten literals before S, which no literal matches: 10^7 combinations.
        List<String> lits = new ArrayList<>();
        for (int i = 1; i <= 10; i++) lits.add("P(c" + i + ")");
        String clause = String.join(" or ", lits);
        assertTimeoutPreemptively(Duration.ofSeconds(20), () -> {
            rejected(clausify("big", null, clause), "clausify",
                    "no substitution was found within " + Clausification.SEARCH_BUDGET + " search steps; state one");
        });
    }

    @Test
    void premiseThatIsAClause() {
        Fact c = accepted(clausify("ground", null, "P(a)"));
        rejected(kernel.clausify("s", c, null, k.clause("P(a)")), "clausify",
                "s is a clause step; clausify takes a formula");
    }

    @Test
    void unknownSymbolsOrArity() {
        rejected(clausify("ax1", null, "[x] not P(x) or Q(x) or Zz(x)"), "clausify",
                "the symbol Zz/1 is not in the signature");
        rejected(clausify("ax1", "{x := zz5}", "not P(zz5) or Q(zz5)"), "clausify", "zz5/0 is not in the signature");
        Symbol q2 = new Symbol("Q", Symbol.Kind.PREDICATE, 2);
        Clause stated = KernelFixture.clauseOf(new Literal(true, k.f.application(q2, k.term("a"), k.term("a"))));
        rejected(kernel.clausify("s", kernel.axiom("fal"), null, stated), "clausify", "the symbol Q is used as", "Q/2", "but is", "Q/1");
    }

    @Test
    void factOfAnotherKernel() {
        Kernel other = otherKernel();
        rejected(kernel.clausify("s", other.axiom("ground"), null, k.clause("P(a)")), "clausify",
                "premise ground belongs to another check");
    }
}
