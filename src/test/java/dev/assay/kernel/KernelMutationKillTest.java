package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * Cases of {@link Kernel} found by mutation testing (docs/kernel-testing.md): how a symbol of the wrong kind or arity
 * is described, the printed conclusion of such a rejection, the size message for a huge normal form, rules that need
 * a substitution, and renaming apart.
 */
class KernelMutationKillTest extends RuleTestSupport {

    private Symbol a;
    private Symbol f;
    private Symbol s0;
    private Symbol p;

    @BeforeEach
    void setUp() {
        a = k.function("a", 0);
        f = k.function("f", 1);
        s0 = k.predicate("S", 0);
        p = k.predicate("P", 1);
        k.predicate("Q", 1);
        startWithGoal("goal", "exists x. P(x)", "A: [x] P(x) or Q(x)", "B: P(a)");
    }

    private Literal lit(Symbol predicate, Term... args) {
        return new Literal(true, k.f.application(predicate, args));
    }

    // ------------------------------------------------------------------ symbols of the wrong kind or arity

    @Test
    void eachKindOfSymbolIsNamedInTheRejection() {
        Term ca = k.f.application(a);
        Term x = k.var("x");
        Symbol aAsFunction = new Symbol("a", Symbol.Kind.FUNCTION, 1);
        Symbol fAsConstant = new Symbol("f", Symbol.Kind.FUNCTION, 0);
        Symbol pAsAtom = new Symbol("P", Symbol.Kind.PREDICATE, 0);
        Symbol sAsPredicate = new Symbol("S", Symbol.Kind.PREDICATE, 1);
        Symbol aAsAtom = new Symbol("a", Symbol.Kind.PREDICATE, 0);
        Map<Clause, String> cases = Map.of(
                new Clause(List.of(lit(p, k.f.application(aAsFunction, x)))),
                "the symbol a is used as a function a/1 but is a constant a/0",
                new Clause(List.of(lit(p, k.f.application(fAsConstant)))),
                "the symbol f is used as a constant f/0 but is a function f/1",
                new Clause(List.of(lit(pAsAtom))),
                "the symbol P is used as a propositional atom P/0 but is a predicate P/1",
                new Clause(List.of(lit(sAsPredicate, ca))),
                "the symbol S is used as a predicate S/1 but is a propositional atom S/0",
                new Clause(List.of(lit(aAsAtom))),
                "the symbol a is used as a propositional atom a/0 but is a constant a/0");
        for (Map.Entry<Clause, String> e : cases.entrySet()) {
            Outcome.Rejected r = rejected(kernel.reflexivity("r", e.getKey()), "reflexivity", e.getValue());
            assertEquals(e.getValue(), r.reason());
            assertEquals(Printer.clause(e.getKey()), r.stated(), "the rejection quotes the stated clause");
            assertNull(r.derived());
        }
    }

    @Test
    void anUnknownSymbolDeepInALargeTermIsFound() {
        // Above 64 nodes the symbols are collected on the term graph instead of walked; the first one in pre-order
        // that the signature does not admit is named.
        Symbol g = new Symbol("g", Symbol.Kind.FUNCTION, 2);
        Symbol h = new Symbol("h", Symbol.Kind.FUNCTION, 1);
        Term t = k.f.application(a);
        for (int i = 0; i < 40; i++) t = k.f.application(f, t);
        Term big = k.f.application(f, k.f.application(h, t));
        Clause c = new Clause(List.of(lit(p, big)));
        Outcome.Rejected r = rejected(kernel.reflexivity("r", c), "reflexivity", "the symbol h/1 is not in the signature");
        assertEquals(Printer.clause(c), r.stated());
        Term two = k.f.application(g, t, k.f.application(h, t));
        rejected(kernel.reflexivity("r", new Clause(List.of(lit(p, two)))), "reflexivity",
                "the symbol g/2 is not in the signature");
        Symbol fAsBinary = new Symbol("f", Symbol.Kind.FUNCTION, 2);
        rejected(kernel.reflexivity("r", new Clause(List.of(lit(p, k.f.application(fAsBinary, t, t))))), "reflexivity",
                "the symbol f is used as a function f/2 but is a function f/1");
        // A large term whose symbols are all known passes the check and reaches the rule itself.
        rejected(kernel.reflexivity("r", new Clause(List.of(lit(p, t)))), "reflexivity",
                "reflexivity concludes a single equation t = t");
        accepted(kernel.reflexivity("r", new Clause(List.of(new Literal(true, k.f.equation(t, t))))));
    }

    @Test
    void anUnknownSymbolInASubstitutionIsFound() {
        Substitution s = new Substitution(k.f, Map.of(k.var("x"), k.f.application(new Symbol("zz", Symbol.Kind.FUNCTION, 0))));
        Outcome.Rejected r = rejected(kernel.instantiate("i", fact("A"), s, k.clause("P(a) or Q(a)")), "instantiate",
                "the symbol zz/0 is not in the signature");
        assertEquals("P(a) or Q(a)", r.stated());
    }

    @Test
    void negateChecksTheSymbolsOfItsConclusion() {
        Formula stated = new Formula.Not(new Formula.Quantified(false, k.var("x"),
                new Formula.Atomic(lit(new Symbol("P", Symbol.Kind.PREDICATE, 2), k.var("x"), k.var("x")))));
        Outcome.Rejected r = rejected(kernel.negate("n", "goal", stated), "negate",
                "the symbol P is used as a predicate P/2 but is a predicate P/1");
        assertEquals(Printer.formula(stated), r.stated());
        accepted(kernel.negate("n", "goal", k.formula("not exists x. P(x)")));
    }

    // ------------------------------------------------------------------ rules that need their arguments

    @Test
    void instantiateNeedsASubstitution() {
        Outcome.Rejected r = rejected(kernel.instantiate("i", fact("A"), null, k.clause("P(a) or Q(a)")), "instantiate",
                "instantiate needs a substitution");
        assertEquals("P(a) or Q(a)", r.stated());
        accepted(kernel.instantiate("i", fact("A"), k.substitution("{x := a}"), k.clause("P(a) or Q(a)")));
    }

    // ------------------------------------------------------------------ the size of a normal form

    /** P iff (P iff (P iff …)) with {@code n} iffs. */
    private Formula iffTower(int n) {
        Formula atom = new Formula.Atomic(new Literal(true, k.f.application(s0)));
        Formula x = atom;
        for (int i = 0; i < n; i++) x = new Formula.Iff(atom, x);
        return x;
    }

    @Test
    void theSizeOfAHugeNormalFormIsStatedOrSaidToSaturate() {
        Problem towers = k.problem("towers").axiom("t60", iffTower(60)).axiom("t200", iffTower(200)).build();
        Kernel kk = new Kernel(towers, k.f);
        Formula s = new Formula.Atomic(new Literal(true, k.f.application(s0)));
        long size = Formulas.nnfSize(iffTower(60))[0];
        Outcome.Rejected r60 = rejected(kk.nnf("n", kk.axiom("t60"), s), "nnf",
                "the negation normal form of t60 would have " + size + " nodes, more than the limit of "
                        + Formulas.NNF_LIMIT);
        assertEquals("S", r60.stated());
        rejected(kk.nnf("n", kk.axiom("t200"), s), "nnf",
                "the negation normal form of t200 would have more than 2^63 nodes, more than the limit of "
                        + Formulas.NNF_LIMIT, "name subformulas with define first");
        rejected(kk.skolemize("k", kk.axiom("t60"), List.of(), s), "skolemize", "would have " + size + " nodes");
    }

    @Test
    void theNegatedGoalIsAlsoMeasured() {
        Problem towers = k.problem("towers").goal("g", iffTower(70)).build();
        Kernel kk = new Kernel(towers, k.f);
        Formula s = new Formula.Atomic(new Literal(true, k.f.application(s0)));
        rejected(kk.negate("n", "g", s), "negate", "the negation normal form of not g would have");
        // The literal negation needs no normal form.
        accepted(kk.negate("n", "g", new Formula.Not(iffTower(70))));
    }

    // ------------------------------------------------------------------ accessors and renaming apart

    @Test
    void theKernelKeepsItsProblemAndFactory() {
        assertSame(problem, kernel.problem());
        assertSame(k.f, kernel.terms());
        assertSame(problem.axioms().get("A"), kernel.axiom("A").formula());
        assertNull(kernel.axiom("goal"), "the goal is not a premise");
    }

    @Test
    void renamingApartPicksTheNextFreeNumberedName() {
        Clause b = k.clause("[x, x1] P(x) or Q(x1)");
        Clause a = k.clause("[x] Q(x)");
        assertEquals("[x2, x1] P(x2) or Q(x1)", Printer.clause(kernel.renameApart(b, a)));
        // Trailing digits are the counter: y12 becomes y1, the first free y-name.
        assertEquals("[y1] P(y1)", Printer.clause(kernel.renameApart(k.clause("[y12] P(y12)"), k.clause("[y12] Q(y12)"))));
        // Only ASCII digits count: a name ending in another script's digit keeps it and gets a counter after it.
        Variable arabic = k.var("x\u0663");
        Clause ba = new Clause(List.of(lit(p, arabic)));
        assertEquals("[x\u06631] P(x\u06631)", Printer.clause(kernel.renameApart(ba, ba)));
        // Nothing shared, nothing renamed.
        Clause c = k.clause("[z] P(z)");
        assertSame(c, kernel.renameApart(c, a));
        assertSame(c, kernel.renameApart(c, k.clause("P(a)")));
    }

    @Test
    void renamingApartTheSameClauseAgainstOthersInTurn() {
        // The kernel keeps the last renaming; it may serve only a clause with the same variables.
        Clause b = k.clause("[x, y] P(x) or Q(y)");
        Clause first = kernel.renameApart(b, k.clause("[x] Q(x)"));
        assertEquals("[x1, y] P(x1) or Q(y)", Printer.clause(first));
        assertSame(first, kernel.renameApart(b, k.clause("[x] P(f(x))")));
        assertEquals("[x, y1] P(x) or Q(y1)", Printer.clause(kernel.renameApart(b, k.clause("[y] Q(y)"))));
        assertEquals("[x1, y1] P(x1) or Q(y1)", Printer.clause(kernel.renameApart(b, k.clause("[y, x] Q(y) or P(x)"))));
        assertEquals("[x1, y1] P(x1) or Q(y1)", Printer.clause(kernel.renameApart(b, k.clause("[x, y] Q(y) or P(x)"))));
        assertEquals("[x1] Q(x1)", Printer.clause(kernel.renameApart(k.clause("[x] Q(x)"), k.clause("[x] Q(x)"))));
        assertEquals("[x1, y] P(x1) or Q(y)", Printer.clause(kernel.renameApart(b, k.clause("[x] Q(x)"))));
    }

    @Test
    void renamingApartAgainstAWideClause() {
        // More than eight variables in A: membership is looked up in a set.
        List<Literal> wide = new ArrayList<>();
        for (int i = 1; i <= 10; i++) wide.add(lit(p, k.var("v" + i)));
        Clause a = new Clause(wide);
        Clause b = k.clause("[v3, w] Q(v3) or P(w)");
        assertEquals("[v11, w] Q(v11) or P(w)", Printer.clause(kernel.renameApart(b, a)));
        Clause c = k.clause("[w] Q(w)");
        assertSame(c, kernel.renameApart(c, a));
    }
}
