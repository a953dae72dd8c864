package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * {@code define fresh Q} (FORMAT.md section 6): the conclusion is {@code forall x1 … xk. (Q(x1,…,xk) iff φ)} with Q
 * fresh and not in φ, the xi distinct and holding every free variable of φ. One test per rejection reason of
 * {@link Kernel#define}.
 */
class DefineRuleTest extends RuleTestSupport {

    @BeforeEach
    void setUp() {
        k.function("a", 0);
        k.function("f", 1);
        k.predicate("P", 1);
        k.predicate("Q", 1);
        k.predicate("R", 2);
        startFormulas(null, null, "ax: forall x. P(x) or exists y. R(x, y)");
    }

    /** One define step in a check of its own. */
    private Outcome define(String name, int arity, String stated) {
        Symbol q = k.predicate(name, arity);
        Formula f = k.formula(stated);
        kernel = new Kernel(problem, k.f);
        return kernel.define("d1", q, f);
    }

    // ------------------------------------------------------------------ acceptance

    @Test
    void propositionalDefinition() {
        Fact d = accepted(define("D0", 0, "D0 iff P(a) and exists y. R(a, y)"));
        assertEquals(Signature.Origin.DEFINITION, kernel.signature().entry("D0").origin());
        assertEquals("d1", kernel.signature().entry("D0").step());
        assertEquals("d1", d.label());
    }

    @Test
    void definitionWithArguments() {
        accepted(define("D2", 2, "forall x y. (D2(x, y) iff R(x, y) or exists z. R(y, z))"));
        accepted(define("D1", 1, "forall x. (D1(x) iff P(f(x)))"));
    }

    @Test
    void parameterNotUsedInTheBody() {
        accepted(define("D2", 2, "forall x y. (D2(x, y) iff P(x))"));
        accepted(define("D1", 1, "forall x. (D1(x) iff P(a))"));
    }

    @Test
    void bodyRebindingAParameterName() {
        // The inner x is bound; the body has no free variable.
        accepted(define("D1", 1, "forall x. (D1(x) iff forall x. P(x))"));
    }

    @Test
    void bodyWithEveryConnective() {
        accepted(define("D1", 1, "forall x. (D1(x) iff not (P(x) implies Q(x)) or (P(x) iff x = a))"));
    }

    @Test
    void definitionUsesAnEarlierSkolemSymbol() {
        accepted(kernel.skolemize("s1", kernel.axiom("ax"), java.util.List.of(k.function("sk", 1)),
                k.formula("forall x. P(x) or R(x, sk(x))")));
        Symbol d = k.predicate("D1", 1);
        accepted(kernel.define("d1", d, k.formula("forall x. (D1(x) iff R(x, sk(x)))")));
    }

    // ------------------------------------------------------------------ rejection

    @Test
    void functionSymbolCannotBeDefined() {
        Symbol g = k.function("g", 0);
        rejected(kernel.define("d1", g, Formula.Constant.TRUE), "define", "g must be defined as a predicate");
    }

    @Test
    void symbolOfTheProblemIsNotFresh() {
        rejected(define("P", 1, "forall x. (P(x) iff Q(x))"), "define", "P is not fresh", "it is a symbol of the problem");
    }

    @Test
    void symbolOfAnEarlierDefinitionIsNotFresh() {
        Symbol d = k.predicate("D1", 1);
        accepted(kernel.define("first", d, k.formula("forall x. (D1(x) iff P(x))")));
        rejected(kernel.define("second", d, k.formula("forall x. (D1(x) iff Q(x))")), "define", "D1 is not fresh",
                "step first already introduced it");
    }

    @Test
    void symbolOfAnEarlierSkolemStepIsNotFresh() {
        accepted(kernel.skolemize("s1", kernel.axiom("ax"), java.util.List.of(k.function("sk", 1)),
                k.formula("forall x. P(x) or R(x, sk(x))")));
        Symbol asPredicate = new Symbol("sk", Symbol.Kind.PREDICATE, 1);
        Formula body = k.formula("P(x)");
        Formula stated = new Formula.Quantified(true, k.var("x"), new Formula.Iff(
                new Formula.Atomic(new Literal(true, k.f.application(asPredicate, k.var("x")))), body));
        rejected(kernel.define("d1", asPredicate, stated), "define", "sk is not fresh", "step s1 already introduced it");
    }

    @Test
    void definedSymbolInItsOwnBody() {
        rejected(define("D1", 1, "forall x. (D1(x) iff not D1(x))"), "define", "D1 occurs in its own definition");
        rejected(define("D2", 1, "forall x. (D2(x) iff P(x) or D2(f(x)))"), "define", "D2 occurs in its own definition");
    }

    @Test
    void freeVariableOfTheBodyNotAnArgument() {
        rejected(define("D1", 1, "forall x. (D1(x) iff R(x, y))"), "define",
                "the variable y is free in the body but is not an argument of D1");
    }

    @Test
    void argumentNotTheQuantifiedVariable() {
        rejected(define("D2", 2, "forall x y. (D2(y, x) iff R(x, y))"), "define",
                "argument 1 of D2 must be the quantified variable x, not y");
        rejected(define("D1", 1, "forall x. (D1(a) iff P(x))"), "define",
                "argument 1 of D1 must be the quantified variable x, not a");
        rejected(define("D3", 1, "forall x. (D3(f(x)) iff P(x))"), "define",
                "argument 1 of D3 must be the quantified variable x, not f(x)");
    }

    @Test
    void repeatedVariable() {
        rejected(define("D2", 2, "forall x x. (D2(x, x) iff R(x, x))"), "define", "the variable x is quantified twice");
    }

    @Test
    void arityAndQuantifierCountDiffer() {
        rejected(define("D1", 1, "forall x y. (D1(x) iff R(x, y))"), "define",
                "D1 has 1 arguments but the definition quantifies 2 variables");
        rejected(define("D0", 0, "forall x. (D0 iff P(a))"), "define",
                "D0 has 0 arguments but the definition quantifies 1 variables");
    }

    @Test
    void wrongShapeNoIff() {
        rejected(define("D1", 1, "forall x. (D1(x) implies P(x))"), "define",
                "a definition has the form forall x1 … xk. (D1(x1, …, xk) iff φ)");
        rejected(define("D2", 1, "exists x. (D2(x) iff P(x))"), "define", "a definition has the form");
        rejected(define("D3", 1, "forall x. exists y. (D3(x) iff R(x, y))"), "define", "a definition has the form");
        rejected(define("D4", 0, "D4 and P(a)"), "define", "a definition has the form");
    }

    @Test
    void wrongShapeDefinedAtomNotOnTheLeft() {
        rejected(define("D1", 1, "forall x. (P(x) iff D1(x))"), "define",
                "the left side of the definition must be the atom D1(…) itself");
        rejected(define("D2", 1, "forall x. (not D2(x) iff P(x))"), "define",
                "the left side of the definition must be the atom D2(…) itself");
        rejected(define("D3", 1, "forall x. ((D3(x) and P(x)) iff P(x))"), "define", "the left side");
    }

    @Test
    void unknownSymbolInTheBody() {
        rejected(define("D1", 1, "forall x. (D1(x) iff Zed(x))"), "define", "Zed/1 is not in the signature");
    }

    @Test
    void aRejectedDefinitionDoesNotIntroduceItsSymbol() {
        Symbol d = k.predicate("D1", 1);
        rejected(kernel.define("bad", d, k.formula("forall x. (D1(x) iff R(x, y))")), "define");
        assertNull(kernel.signature().lookup("D1"));
        accepted(kernel.define("good", d, k.formula("forall x. (D1(x) iff P(x))")));
    }
}
