package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * Cases of {@code skolemize} found by mutation testing of {@link Skolemization} (docs/kernel-testing.md). Most are
 * unsound acceptances a weaker walk would make: a replaced existential standing as a variable, as two different terms,
 * or as a term with a stray argument that the walk must not simply skip; terms that differ below the predicate; and
 * the budget of the walk.
 */
class SkolemizationMutationTest extends RuleTestSupport {

    @BeforeEach
    void setUp() {
        k.function("a", 0);
        k.function("f", 1);
        k.function("g", 1);
        k.predicate("P", 1);
        k.predicate("Q", 1);
        k.predicate("R", 2);
        startFormulas(null, null,
                "dep: forall x. exists y. R(x, y)",
                "stray: forall x. exists y. forall z. R(x, y) and R(y, z)",
                "eq: forall x. exists y. f(y) = x",
                "fx: forall x. P(f(x))",
                "two: forall x. (exists y. forall w. R(y, w)) and (exists z. R(x, z))",
                "deep: P(a) and (exists y. exists z. (Q(y) and R(y, z)))",
                "fal: false",
                "tru: true",
                "ground: P(a)",
                "cst: (exists y. P(y)) or false",
                "mixor: (exists w. P(w) and Q(w)) and (exists y. (P(y) or Q(y)))",
                "twoconj: (exists w. R(a, w) and P(w)) and (exists z. not P(z) and R(z, z))",
                "many: " + manyExistentials(9));
    }

    /** forall x. exists y1 … yn. R(x, y1) and … and R(x, yn) and R(x, x). */
    private static String manyExistentials(int n) {
        StringBuilder sb = new StringBuilder("forall x. exists");
        List<String> parts = new ArrayList<>();
        for (int i = 1; i <= n; i++) {
            sb.append(" y").append(i);
            parts.add("R(x, y" + i + ")");
        }
        parts.add("R(x, x)");
        return sb.append(". ").append(String.join(" and ", parts)).toString();
    }

    /** One skolemize step in a check of its own. */
    private Outcome skolemize(String premise, String stated, Symbol... fresh) {
        Formula f = k.formula(stated);
        kernel = new Kernel(problem, k.f);
        return kernel.skolemize("s1", kernel.axiom(premise), List.of(fresh), f);
    }

    private Symbol fn(String name, int arity) {
        return k.function(name, arity);
    }

    // ------------------------------------------------------------------ what a replaced existential may stand as

    @Test
    void aReplacedExistentialCannotStandAsAVariable() {
        // forall x. exists y. R(x, y) does not give forall x. R(x, x): y is not x.
        rejected(skolemize("dep", "forall x. R(x, x)"), "skolemize",
                "the conclusion is not nnf(dep) with existentials replaced by Skolem terms of no symbol");
        rejected(skolemize("dep", "forall x. R(x, sk(x)) and R(x, x)", fn("sk", 1)), "skolemize",
                "the conclusion is not nnf(dep)");
    }

    @Test
    void oneExistentialStandsAsOneTermEverywhere() {
        // y occurs twice in stray; sk(x) and sk(z) are two different terms for it.
        rejected(skolemize("stray", "forall x. forall z. R(x, sk(x)) and R(sk(z), z)", fn("sk", 1)), "skolemize",
                "the conclusion is not nnf(stray) with existentials replaced by Skolem terms of sk");
        accepted(skolemize("stray", "forall x. forall z. R(x, sk(x)) and R(sk(x), z)", fn("sk", 1)));
    }

    @Test
    void aStrayArgumentFailsTheOccurrenceEvenWhenAnotherExistentialUsesTheSymbol() {
        // sk(w) for y has the stray argument w; sk(x) for z is fine. The step must not pass by skipping the first.
        rejected(skolemize("two", "forall x. (forall w. R(sk(w), w)) and R(x, sk(x))", fn("sk", 1)), "skolemize",
                "stray argument w in sk(w)", "not a universally bound variable enclosing the existential");
        accepted(skolemize("two", "forall x. (forall w. R(c0, w)) and R(x, sk(x))", fn("c0", 0), fn("sk", 1)));
    }

    // ------------------------------------------------------------------ terms below the predicate

    @Test
    void aFunctionSymbolBelowThePredicateMustAgree() {
        rejected(skolemize("eq", "forall x. g(sk(x)) = x", fn("sk", 1)), "skolemize", "the conclusion is not nnf(eq)");
        accepted(skolemize("eq", "forall x. f(sk(x)) = x", fn("sk", 1)));
    }

    @Test
    void anApplicationCannotBecomeAVariable() {
        rejected(skolemize("fx", "forall x. P(x)"), "skolemize", "the conclusion is not nnf(fx)");
        rejected(skolemize("fx", "forall x. P(g(x))"), "skolemize", "the conclusion is not nnf(fx)");
        accepted(skolemize("fx", "forall u. P(f(u))"));
    }

    // ------------------------------------------------------------------ the top of the walk

    @Test
    void constantsMustAgree() {
        accepted(skolemize("fal", "false"));
        accepted(skolemize("tru", "true"));
        rejected(skolemize("fal", "true"), "skolemize", "the conclusion is not nnf(fal)");
        rejected(skolemize("tru", "false"), "skolemize", "the conclusion is not nnf(tru)");
        rejected(skolemize("fal", "P(a)"), "skolemize", "the conclusion is not nnf(fal)");
    }

    @Test
    void literalsMustAgreeInSignAndPredicate() {
        accepted(skolemize("ground", "P(a)"));
        rejected(skolemize("ground", "not P(a)"), "skolemize", "the conclusion is not nnf(ground)");
        rejected(skolemize("ground", "Q(a)"), "skolemize", "the conclusion is not nnf(ground)");
        rejected(skolemize("ground", "false"), "skolemize", "the conclusion is not nnf(ground)");
        rejected(skolemize("fal", "forall x. P(x)"), "skolemize", "the conclusion is not nnf(fal)");
    }

    @Test
    void nestedExistentialsOverAConjunctionAreSplicedTogether() {
        // exists y. exists z. (Q(y) and R(y, z)) inside a conjunction: both replaced, the conjuncts spliced.
        accepted(skolemize("deep", "P(a) and Q(c1) and R(c1, c2)", fn("c1", 0), fn("c2", 0)));
        accepted(skolemize("deep", "R(c1, c2) and P(a) and Q(c1)", fn("c1", 0), fn("c2", 0)));
        rejected(skolemize("deep", "P(a) and Q(c2) and R(c1, c2)", fn("c1", 0), fn("c2", 0)), "skolemize",
                "the conclusion is not nnf(deep)");
    }

    // ------------------------------------------------------------------ budget

    @Test
    void theWalkGivesUpAfterItsBudget() {
        // Ten conjuncts of one shape: the walk pairs them in every order, and each order fails only at the last
        // premise conjunct R(x, x), which no R(x, ci(x)) matches; that is about e·10! steps, past the budget.
        List<Symbol> fresh = new ArrayList<>();
        List<String> parts = new ArrayList<>();
        for (int i = 1; i <= 10; i++) {
            fresh.add(fn("c" + i, 1));
            parts.add("R(x, c" + i + "(x))");
        }
        String stated = "forall x. " + String.join(" and ", parts);
        Outcome.Rejected r = rejected(skolemize("many", stated, fresh.toArray(new Symbol[0])), "skolemize",
                "the walk beside nnf(many) gave up after " + Skolemization.BUDGET + " steps");
        assertEquals(Printer.formula(Formulas.nnf(problem.axioms().get("many"))), r.derived());
        assertNull(kernel.signature().lookup("c1"), "a rejected step introduces no symbol");
    }

    @Test
    void anExistentialCannotBeReplacedByATermOfTheProblem() {
        // Without any conjunction to pair, the walk itself must refuse a as the witness of y.
        rejected(skolemize("dep", "forall x. R(x, a)"), "skolemize", "the conclusion is not nnf(dep)");
        rejected(skolemize("dep", "forall x. R(x, f(x))"), "skolemize", "the conclusion is not nnf(dep)");
    }

    @Test
    void constantsInsideAJunctionPairByValue() {
        accepted(skolemize("cst", "P(c0) or false", fn("c0", 0)));
        accepted(skolemize("cst", "false or P(c0)", fn("c0", 0)));
        rejected(skolemize("cst", "P(c0) or true", fn("c0", 0)), "skolemize", "the conclusion is not nnf(cst)");
    }

    @Test
    void anExistentialOverTheOtherJunctionIsNotSpliced() {
        // exists y. (P(y) or Q(y)) inside an and stays one part; the other existential is spliced.
        accepted(skolemize("mixor", "P(c1) and Q(c1) and (P(c2) or Q(c2))", fn("c1", 0), fn("c2", 0)));
        accepted(skolemize("mixor", "(exists v. P(v) and Q(v)) and (P(c2) or Q(c2))", fn("c2", 0)));
        rejected(skolemize("mixor", "P(c1) and Q(c1) and P(c2) and Q(c2)", fn("c1", 0), fn("c2", 0)), "skolemize",
                "the conclusion is not nnf(mixor)");
    }

    @Test
    void keepingOnePartWholeMustStillGiveThePartsOfTheConclusion() {
        // Keeping z's part and splicing w's gives three parts; the conclusion has four.
        rejected(skolemize("twoconj", "R(a, c1) and P(c1) and (exists v. not P(v) and R(v, v)) and P(a)", fn("c1", 0)),
                "skolemize", "the conclusion is not nnf(twoconj)");
    }

    // ------------------------------------------------------------------ the class itself

    @Test
    void aFreeVariableOfThePremiseMustStayItself() {
        // The kernel only passes closed formulas; the walk still compares free variables by identity.
        Formula open = k.formula("P(x) and Q(x)");
        assertNull(Skolemization.check(open, "open", List.of(), k.formula("Q(x) and P(x)")));
        String why = Skolemization.check(open, "open", List.of(), k.formula("P(x) and Q(z)"));
        assertTrue(why != null && why.startsWith("the conclusion is not nnf(open)"), why);
        // An existential with a free variable of the premise around it: the Skolem term need not take it, since no
        // quantifier of the premise binds it (the kernel never gets here with an open premise).
        Symbol c0 = fn("c0", 0);
        assertNull(Skolemization.check(k.formula("exists y. R(x, y)"), "open", List.of(c0), k.formula("R(x, c0)")));
    }

    @Test
    void aSharedSubformulaOfThePremiseIsMeasuredOnce() {
        // The same atom object twice under one or: the shape walk meets it a second time already computed.
        Formula shared = k.formula("P(a)");
        Formula premise = new Formula.And(List.of(k.formula("Q(a)"), new Formula.Or(List.of(shared, shared))));
        assertNull(Skolemization.check(premise, "p", List.of(), k.formula("(P(a) or P(a)) and Q(a)")));
        String why = Skolemization.check(premise, "p", List.of(), k.formula("(P(a) or Q(a)) and Q(a)"));
        assertTrue(why != null && why.startsWith("the conclusion is not nnf(p)"), why);
    }
}
