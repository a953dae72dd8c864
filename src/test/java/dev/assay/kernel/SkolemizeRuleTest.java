package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * {@code skolemize P fresh s1, …} (FORMAT.md section 6): the conclusion is nnf(P) with some existentials replaced by
 * Skolem terms over the universals enclosing them. One test per acceptance case and one per rejection reason of
 * {@link Kernel#skolemize} and {@link Skolemization}.
 */
class SkolemizeRuleTest extends RuleTestSupport {

    @BeforeEach
    void setUp() {
        k.function("a", 0);
        k.function("b", 0);
        k.function("f", 1);
        k.predicate("P", 1);
        k.predicate("Q", 1);
        k.predicate("R", 2);
        k.predicate("T", 3);
        startFormulas(null, null,
                // ∀∃∀∃, the second existential depending on the first
                "nested: forall x. exists y. forall z. exists w. R(x, y) and T(y, z, w)",
                "outer: exists y. forall x. R(y, x)",
                "vacuous: forall x. exists y. P(x)",
                "mixed: forall x. exists y. exists v. R(x, v)",
                "ac: (exists z. Q(z) and P(z)) and forall x. (P(x) implies exists y. (R(x, y) and Q(y)))",
                "eq: forall x. exists y. f(y) = x",
                "neq: forall x. exists y. not (y = f(x))",
                "two: (exists y. P(y)) and (exists z. Q(z))",
                "stray: forall x. exists y. forall z. R(x, y) and R(y, z)",
                "shadow: forall x. exists y. (R(x, y) and forall z. R(y, z))",
                "iffex: P(a) iff exists y. Q(y)",
                "plain: forall x. P(x) or Q(x)",
                "ground: P(a)",
                "negated: not forall x. exists y. R(x, y)",
                "innershadow: forall x. forall x. exists y. R(x, y)",
                "extra: forall x. forall z. exists y. R(z, y)",
                "nested2: forall x. exists y. (R(x, y) and forall z. exists w. T(y, z, w))",
                "twoconj: (exists w. R(a, w) and P(w)) and (exists z. not P(z) and R(z, z))",
                "nestedconj: P(a) and (exists y. Q(y) and (exists z. R(y, z) and P(z)) and (exists w. Q(w) and R(w, y)))");
    }

    /** One skolemize step in a check of its own, so that every test call starts from the problem's signature. */
    private Outcome skolemize(String premise, String stated, Symbol... fresh) {
        Formula f = k.formula(stated);
        kernel = new Kernel(problem, k.f);
        return kernel.skolemize("s1", kernel.axiom(premise), List.of(fresh), f);
    }

    /** A function symbol for a conclusion; a name keeps one arity across a test class instance. */
    private Symbol fn(String name, int arity) {
        return k.function(name, arity);
    }

    // ------------------------------------------------------------------ acceptance

    @Test
    void fullSkolemizationOfNestedForallExists() {
        // y depends on x; w on x (through y's Skolem term) and on z.
        Symbol s1 = fn("sy", 1);
        Symbol s2 = fn("sw", 2);
        Fact fact = accepted(skolemize("nested", "forall x. forall z. R(x, sy(x)) and T(sy(x), z, sw(x, z))", s1, s2));
        assertEquals(Signature.Origin.SKOLEM, kernel.signature().entry("sy").origin());
        assertEquals("s1", kernel.signature().entry("sw").step());
        // The result has no existential left, so it clausifies.
        accepted(kernel.clausify("c1", fact, null, k.clause("[x, z] T(sy(x), z, sw(x, z))")));
    }

    @Test
    void skolemArgumentsInAnyOrderAndExtraEnclosingUniversals() {
        // Any distinct universals enclosing the existential are allowed, in any order, as long as the needed ones are
        // there: sw(z, x) is as good as sw(x, z), and sy may take no argument that is not enclosing.
        accepted(skolemize("nested", "forall x. forall z. R(x, sy(x)) and T(sy(x), z, sw(z, x))", fn("sy", 1), fn("sw", 2)));
        accepted(skolemize("nested2", "forall x. R(x, sy(x)) and forall z. T(sy(x), z, sw(z, x))", fn("sy", 1), fn("sw", 2)));
    }

    @Test
    void skolemTermMayTakeAnEnclosingUniversalThatIsNotFree() {
        // forall x. forall z. exists y. R(z, y): y needs z only; x encloses it too and may be an argument.
        accepted(skolemize("extra", "forall x. forall z. R(z, sk(z))", fn("sk", 1)));
        accepted(skolemize("extra", "forall x. forall z. R(z, sk2(x, z))", fn("sk2", 2)));
    }

    @Test
    void partialSkolemizationKeepsTheInnerExistential() {
        // Replace y, keep w (whose free variables x, z are universal and y is replaced).
        accepted(skolemize("nested", "forall x. forall z. exists w. R(x, sy(x)) and T(sy(x), z, w)", fn("sy", 1)));
    }

    @Test
    void partialSkolemizationKeepingEverything() {
        // No symbol: the conclusion is nnf(premise) itself, stated with other bound names.
        accepted(skolemize("nested", "forall u. exists v. forall t. exists s. R(u, v) and T(v, t, s)"));
    }

    @Test
    void vacuousExistentialIsDropped() {
        accepted(skolemize("vacuous", "forall x. P(x)"));
        // Kept is fine too.
        accepted(skolemize("vacuous", "forall x. exists y. P(x)"));
    }

    @Test
    void vacuousExistentialDroppedBesideAReplacedOne() {
        accepted(skolemize("mixed", "forall x. R(x, sv(x))", fn("sv", 1)));
        accepted(skolemize("mixed", "forall x. exists y. R(x, sv(x))", fn("sv", 1)));
    }

    @Test
    void skolemConstantForTheOutermostExistential() {
        Fact fact = accepted(skolemize("outer", "forall x. R(c0, x)", fn("c0", 0)));
        assertEquals(0, kernel.signature().lookup("c0").arity());
        accepted(kernel.clausify("c1", fact, null, k.clause("[x] R(c0, x)")));
    }

    @Test
    void conjunctsPermutedRegroupedAndBoundVariablesRenamed() {
        // nnf(ac) = (exists z. Q(z) and P(z)) and forall x. (not P(x) or exists y. (R(x, y) and Q(y))).
        // The first existential's conjunction is spliced into the top conjunction; parts are permuted, regrouped
        // and x is renamed u.
        accepted(skolemize("ac", "(forall u. (Q(h(u)) and R(u, h(u))) or not P(u)) and (P(c0) and Q(c0))",
                fn("h", 1), fn("c0", 0)));
        accepted(skolemize("ac", "Q(c0) and (forall u. not P(u) or (Q(h(u)) and R(u, h(u)))) and P(c0)",
                fn("c0", 0), fn("h", 1)));
    }

    @Test
    void bothExistentialsOverConjunctionsReplacedOrBothKept() {
        accepted(skolemize("twoconj", "R(a, c1) and P(c1) and not P(c2) and R(c2, c2)", fn("c1", 0), fn("c2", 0)));
        accepted(skolemize("twoconj", "(exists v. R(a, v) and P(v)) and (exists u. not P(u) and R(u, u))"));
    }

    /**
     * Two existentials over conjunctions inside one conjunction, the first replaced (its conjuncts spliced into the top
     * conjunction) and the second kept. Rejected by the first version of Skolemization, which spliced all such parts
     * or none (found by a "partial" candidate of SkolemSemanticsTest); accepted since the walk also tries keeping a
     * part whole where the conclusion has an existential part of its shape.
     */
    @Test
    void keptAndReplacedSplicedInOneConjunction() {
        accepted(skolemize("twoconj", "(R(a, c1) and P(c1)) and (exists v. not P(v) and R(v, v))", fn("c1", 0)));
        accepted(skolemize("twoconj", "(exists v. R(a, v) and P(v)) and not P(c2) and R(c2, c2)", fn("c2", 0)));
    }

    /**
     * The same one level down: y is replaced and spliced into the top conjunction, and inside its body z is replaced
     * (spliced too) while w is kept. FORMAT.md section 6 accepts this.
     */
    @Test
    void keptAndReplacedSplicedInsideASplicedExistential() {
        accepted(skolemize("nestedconj", "P(a) and Q(c1) and R(c1, c2) and P(c2) and (exists v. Q(v) and R(v, c1))",
                fn("c1", 0), fn("c2", 0)));
    }

    @Test
    void keptExistentialWithConjunctsPermuted() {
        accepted(skolemize("ac", "(exists v. P(v) and Q(v)) and forall u. ((Q(h(u)) and R(u, h(u))) or not P(u))",
                fn("h", 1)));
    }

    @Test
    void equationsFlipped() {
        accepted(skolemize("eq", "forall x. f(sk(x)) = x", fn("sk", 1)));
        accepted(skolemize("eq", "forall x. x = f(sk(x))", fn("sk", 1)));
        accepted(skolemize("neq", "forall x. f(x) != sk(x)", fn("sk", 1)));
    }

    @Test
    void existentialUnderIffInOnePolarity() {
        // nnf(P(a) iff exists y. Q(y)) = (not P(a) or exists y. Q(y)) and (P(a) or forall y. not Q(y)).
        accepted(skolemize("iffex", "(not P(a) or Q(c0)) and (P(a) or forall y. not Q(y))", fn("c0", 0)));
    }

    @Test
    void negatedUniversalBecomesExistential() {
        // nnf(not forall x. exists y. R(x, y)) = exists x. forall y. not R(x, y).
        accepted(skolemize("negated", "forall y. not R(c0, y)", fn("c0", 0)));
    }

    @Test
    void noExistentialAtAll() {
        accepted(skolemize("plain", "forall x. Q(x) or P(x)"));
    }

    @Test
    void innerUniversalShadowsAnOuterOne() {
        // forall x. forall x. exists y. R(x, y): y depends on the inner x only; renaming the inner x to x2 makes both
        // available, and the needed one is the inner.
        accepted(skolemize("innershadow", "forall x. forall x2. R(x2, sk(x2))", fn("sk", 1)));
        accepted(skolemize("innershadow", "forall x. forall x2. R(x2, sk2(x, x2))", fn("sk2", 2)));
        accepted(skolemize("innershadow", "forall x. forall x. R(x, sk(x))", fn("sk", 1)));
    }

    @Test
    void aRejectedStepDoesNotIntroduceItsSymbols() {
        rejected(skolemize("outer", "forall x. R(c0, c0)", fn("c0", 0)), "skolemize");
        assertNull(kernel.signature().lookup("c0"));
        accepted(skolemize("outer", "forall x. R(c0, x)", fn("c0", 0)));
    }

    // ------------------------------------------------------------------ rejection: Kernel.skolemize

    @Test
    void premiseIsAClause() {
        Fact clause = accepted(kernel.clausify("c1", kernel.axiom("plain"), null, k.clause("[x] P(x) or Q(x)")));
        rejected(kernel.skolemize("s1", clause, List.of(), k.formula("forall x. P(x) or Q(x)")), "skolemize",
                "c1 is a clause step", "skolemize takes a formula");
    }

    @Test
    void premiseOfAnotherCheck() {
        Kernel other = otherKernel();
        rejected(other.skolemize("s1", kernel.axiom("outer"), List.of(fn("c0", 0)), k.formula("forall x. R(c0, x)")),
                "skolemize", "belongs to another check");
    }

    @Test
    void predicateUsedAsSkolemSymbol() {
        Symbol sk = new Symbol("Sk", Symbol.Kind.PREDICATE, 0);
        rejected(kernel.skolemize("s1", kernel.axiom("outer"), List.of(sk), k.formula("forall x. R(a, x)")),
                "skolemize", "Sk is used as a predicate", "a Skolem symbol is a function");
    }

    @Test
    void symbolOfTheProblemIsNotFresh() {
        rejected(skolemize("outer", "forall x. R(a, x)", k.symbol("a")), "skolemize",
                "a is not fresh", "it is a symbol of the problem");
        rejected(skolemize("eq", "forall x. f(f(x)) = x", k.symbol("f")), "skolemize", "f is not fresh");
    }

    @Test
    void symbolIntroducedByAnEarlierStepIsNotFresh() {
        accepted(kernel.skolemize("early", kernel.axiom("outer"), List.of(fn("c0", 0)), k.formula("forall x. R(c0, x)")));
        rejected(kernel.skolemize("s1", kernel.axiom("iffex"), List.of(k.symbol("c0")),
                k.formula("(not P(a) or Q(c0)) and (P(a) or forall y. not Q(y))")),
                "skolemize", "c0 is not fresh", "step early already introduced it");
    }

    @Test
    void symbolIntroducedByAnEarlierDefinitionIsNotFresh() {
        Symbol d = k.predicate("Dz", 0);
        accepted(kernel.define("d1", d, k.formula("Dz iff P(a)")));
        rejected(kernel.skolemize("s1", kernel.axiom("outer"), List.of(new Symbol("Dz", Symbol.Kind.FUNCTION, 0)),
                new Formula.Quantified(true, k.var("x"), new Formula.Atomic(new Literal(true, k.f.application(
                        k.symbol("R"), k.f.application(new Symbol("Dz", Symbol.Kind.FUNCTION, 0)), k.var("x")))))),
                "skolemize", "Dz is not fresh", "step d1 already introduced it");
    }

    @Test
    void symbolListedTwice() {
        Symbol c0 = fn("c0", 0);
        rejected(kernel.skolemize("s1", kernel.axiom("outer"), List.of(c0, c0), k.formula("forall x. R(c0, x)")),
                "skolemize", "c0 is listed twice");
    }

    @Test
    void unknownSymbolInTheConclusion() {
        rejected(skolemize("outer", "forall x. R(zz, x)"), "skolemize", "zz/0 is not in the signature");
    }

    // ------------------------------------------------------------------ rejection: Skolemization

    @Test
    void listedSymbolReplacingNoExistential() {
        rejected(skolemize("outer", "forall x. R(c0, x)", fn("c0", 0), fn("c9", 0)), "skolemize",
                "c9 is listed as fresh but replaces no existential");
    }

    @Test
    void listedSymbolForAConclusionWithoutReplacement() {
        rejected(skolemize("plain", "forall x. P(x) or Q(x)", fn("c9", 0)), "skolemize",
                "c9 is listed as fresh but replaces no existential");
    }

    @Test
    void oneSymbolReplacingTwoExistentials() {
        rejected(skolemize("two", "P(c0) and Q(c0)", fn("c0", 0)), "skolemize",
                "c0 replaces two existentials", "exists y. P(y)", "exists z. Q(z)", "each Skolem symbol replaces exactly one");
    }

    @Test
    void skolemTermMissingAUniversalFreeInTheExistential() {
        rejected(skolemize("nested", "forall x. forall z. R(x, sy(x)) and T(sy(x), z, sw(x))", fn("sy", 1), fn("sw", 1)),
                "skolemize", "the Skolem term sw(x)", "lacks the variable z", "which is free in the existential");
    }

    @Test
    void skolemTermMissingTheVariablesOfAnOuterSkolemTerm() {
        // In nested2 the existential of w has y free but not x; y stands for sy(x), so sw must take x as well.
        rejected(skolemize("nested2", "forall x. R(x, sy(x)) and forall z. T(sy(x), z, sw(z))", fn("sy", 1), fn("sw", 1)),
                "skolemize", "the Skolem term sw(z)", "lacks a variable of sy(x)", "which stands for y in it");
    }

    @Test
    void skolemConstantForAnExistentialUnderAUniversal() {
        rejected(skolemize("eq", "forall x. f(c0) = x", fn("c0", 0)), "skolemize",
                "the Skolem term c0", "lacks the variable x");
    }

    @Test
    void strayArgumentNotEnclosingTheExistential() {
        // z is universal, but it is bound inside the existential, not around it.
        rejected(skolemize("stray", "forall x. forall z. R(x, sk(z)) and R(sk(z), z)", fn("sk", 1)), "skolemize",
                "stray argument z in sk(z)", "not a universally bound variable enclosing the existential");
    }

    @Test
    void strayArgumentRepeated() {
        rejected(skolemize("stray", "forall x. forall z. R(x, sk(x, x)) and R(sk(x, x), z)", fn("sk", 2)), "skolemize",
                "stray argument x in sk(x, x)", "repeated");
    }

    @Test
    void strayArgumentThatIsFree() {
        // v is bound nowhere in the conclusion.
        rejected(skolemize("eq", "forall x. f(sk(x, v)) = x", fn("sk", 2)), "skolemize",
                "stray argument v in sk(x, v)", "not a universally bound variable");
    }

    @Test
    void skolemArgumentThatIsNotAVariable() {
        rejected(skolemize("eq", "forall x. f(sk(f(x))) = x", fn("sk", 1)), "skolemize",
                "argument 1 of sk(f(x)) is not a variable");
        rejected(skolemize("eq", "forall x. f(sk(a)) = x", fn("sk", 1)), "skolemize",
                "argument 1 of sk(a) is not a variable");
    }

    @Test
    void captureByAnInnerBinderOfTheSameName() {
        // Correct: forall x. (R(x, sk(x)) and forall z. R(sk(x), z)). Renaming z to x captures sk's argument.
        accepted(skolemize("shadow", "forall x. (R(x, sk(x)) and forall z. R(sk(x), z))", fn("sk", 1)));
        rejected(skolemize("shadow", "forall x. (R(x, sk(x)) and forall x. R(sk(x), x))", fn("sk", 1)), "skolemize",
                "stray argument x in sk(x)", "not a universally bound variable enclosing");
    }

    @Test
    void captureOfTheOuterUniversalByTheInnerOne() {
        // forall x. forall x. exists y. R(x, y): y depends on the inner x; a Skolem term over the outer x only is
        // missing it. With both named x, the outer one cannot be written at all.
        rejected(skolemize("innershadow", "forall x. forall x2. R(x2, sk(x))", fn("sk", 1)), "skolemize",
                "lacks the variable x");
    }

    @Test
    void freeVariableBoundByAKeptExistential() {
        // Keep y, replace w: sw cannot take y as an argument.
        rejected(skolemize("nested", "forall x. exists y. forall z. R(x, y) and T(y, z, sw(x, z))", fn("sw", 2)),
                "skolemize", "the free variable y of the existential", "is bound by a kept existential",
                "sw cannot take it as an argument");
    }

    @Test
    void conclusionUnrelatedToThePremise() {
        rejected(skolemize("nested", "forall x. P(x)", fn("sy", 1)), "skolemize",
                "the conclusion is not nnf(nested) with existentials replaced by Skolem terms of sy");
        rejected(skolemize("plain", "forall x. P(x) and Q(x)"), "skolemize",
                "the conclusion is not nnf(plain) with existentials replaced by Skolem terms of no symbol");
    }

    @Test
    void wrongBodyOneLiteralNegated() {
        Outcome.Rejected r = rejected(skolemize("nested", "forall x. forall z. not R(x, sy(x)) and T(sy(x), z, sw(x, z))",
                fn("sy", 1), fn("sw", 2)), "skolemize", "the conclusion is not nnf(nested)");
        assertEquals("forall x. exists y. forall z. exists w. R(x, y) and T(y, z, w)", r.derived());
    }

    @Test
    void universalReplacedInsteadOfAnExistential() {
        // forall x. exists y. f(y) = x: replacing x (universal) by a constant is not Skolemization.
        rejected(skolemize("eq", "exists y. f(y) = c0", fn("c0", 0)), "skolemize", "the conclusion is not nnf(eq)");
    }

    @Test
    void existentialReplacedByAProblemTermIsNoSkolemTerm() {
        // exists y. P(y) replaced by a: a witness may not be a term of the problem (it would need P(a) to hold).
        rejected(skolemize("two", "P(a) and Q(c0)", fn("c0", 0)), "skolemize", "the conclusion is not nnf(two)");
    }

    @Test
    void sameExistentialReplacedByTwoDifferentTerms() {
        // y occurs twice; both occurrences must be the same Skolem term.
        rejected(skolemize("stray", "forall x. forall z. R(x, s1(x)) and R(s2(x), z)", fn("s1", 1), fn("s2", 1)),
                "skolemize");
    }

    @Test
    void quantifierOrderChanged() {
        rejected(skolemize("outer", "forall x. R(x, c0)", fn("c0", 0)), "skolemize", "the conclusion is not nnf(outer)");
    }

    @Test
    void keptExistentialMadeUniversal() {
        rejected(skolemize("outer", "forall y. forall x. R(y, x)"), "skolemize", "the conclusion is not nnf(outer)");
    }
}
