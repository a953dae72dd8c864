package dev.assay.campaign;

import dev.assay.campaign.FiniteModelOracle.Answer;
import dev.assay.campaign.FiniteModelOracle.Judgement;
import dev.assay.kernel.Application;
import dev.assay.kernel.Clause;
import dev.assay.kernel.Formula;
import dev.assay.kernel.Literal;
import dev.assay.kernel.Symbol;
import dev.assay.kernel.Term;
import dev.assay.kernel.TermFactory;
import dev.assay.kernel.Variable;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;

import static dev.assay.campaign.Values.clause;
import static dev.assay.campaign.Values.formula;
import static dev.assay.campaign.Values.formulas;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The oracle itself: hand-made entailments it must confirm, non-entailments it must refute (with the size of the
 * smallest countermodel where that matters), the extension question of Skolemization and definitions, the
 * undecided answer, and agreement with a plain enumeration of every interpretation on random small questions.
 */
class FiniteModelOracleTest {

    private final FiniteModelOracle oracle = new FiniteModelOracle();

    private static List<Formula> all(List<Formula> fs) {
        return fs.subList(0, fs.size() - 1);
    }

    private static Formula last(List<Formula> fs) {
        return fs.get(fs.size() - 1);
    }

    /** The last formula against the others as premises. */
    private Judgement entails(String... texts) {
        List<Formula> fs = formulas(texts);
        return oracle.entails(all(fs), last(fs));
    }

    // ---------------------------------------------------------------- entailments

    @Test
    void confirmsModusPonensOnTheRota() {
        Judgement j = entails("OnShift(ines)", "forall t. OnShift(t) implies Badged(t)", "Badged(ines)");
        assertEquals(Answer.YES, j.answer(), j.detail());
    }

    @Test
    void confirmsEqualityReasoning() {
        assertEquals(Answer.YES, entails("lead(lab2) = ines", "Certified(ines)", "Certified(lead(lab2))").answer());
        assertEquals(Answer.YES, entails("forall x. swap(swap(x)) = x", "swap(swap(swap(bench))) = swap(bench)").answer());
        assertEquals(Answer.YES, entails("forall x. x = x").answer(), "reflexivity holds everywhere");
    }

    @Test
    void confirmsAResolventAndAFactor() {
        List<Formula> fs = formulas("forall t. not Trained(t) or Calibrates(t, scale)", "Trained(ines)",
                "Calibrates(ines, scale)", "forall x y. Uses(x, scale) or Uses(y, scale)", "forall x. Uses(x, scale)");
        Clause c1 = clause(fs.get(0));
        Clause c2 = clause(fs.get(1));
        assertEquals(Answer.YES, oracle.entails(List.of(c1, c2), clause(fs.get(2))).answer());
        assertEquals(Answer.YES, oracle.entails(List.of(clause(fs.get(3))), clause(fs.get(4))).answer());
    }

    @Test
    void theEmptyClauseFollowsOnlyFromContradictions() {
        List<Formula> fs = formulas("Ready(scale)", "not Ready(scale)", "forall x. Ready(x)");
        assertEquals(Answer.YES, oracle.entails(List.of(clause(fs.get(0)), clause(fs.get(1))), Clause.EMPTY).answer());
        Judgement j = oracle.entails(List.of(clause(fs.get(0))), Clause.EMPTY);
        assertEquals(Answer.NO, j.answer());
        assertTrue(j.detail().contains("Ready: (0)=true"), j.detail());
    }

    // ---------------------------------------------------------------- non-entailments

    @Test
    void refutesAFactAboutTheWrongTechnician() {
        Judgement j = entails("Trained(ines)", "Trained(omar)");
        assertEquals(Answer.NO, j.answer());
        assertTrue(j.detail().startsWith("domain {0..1}"), "two technicians need two elements: " + j.detail());
    }

    @Test
    void refutesAGeneralisedClause() {
        List<Formula> fs = formulas("not Trained(ines) or Calibrates(ines, scale)", "forall t. not Trained(t) or Calibrates(t, scale)");
        assertEquals(Answer.NO, oracle.entails(List.of(clause(fs.get(0))), clause(fs.get(1))).answer());
        assertEquals(Answer.YES, oracle.entails(List.of(clause(fs.get(1))), clause(fs.get(0))).answer());
    }

    @Test
    void refutesTheQuantifierSwap() {
        assertEquals(Answer.NO, entails("forall x. exists y. Relieves(y, x)", "exists y. forall x. Relieves(y, x)").answer());
        assertEquals(Answer.YES, entails("exists y. forall x. Relieves(y, x)", "forall x. exists y. Relieves(y, x)").answer());
    }

    @Test
    void aCountermodelThatNeedsThreeElementsIsFoundAtThree() {
        String premise = "exists x y. x != y";
        String atMostTwo = "forall x y z. x = y or x = z or y = z";
        assertEquals(Answer.NO, entails(premise, atMostTwo).answer());
        List<Formula> fs = formulas(premise, atMostTwo);
        Judgement two = new FiniteModelOracle(2, FiniteModelOracle.DEFAULT_NODES, FiniteModelOracle.DEFAULT_WORK)
                .entails(List.of(fs.get(0)), fs.get(1));
        assertEquals(Answer.YES, two.answer(), "up to two elements the claim holds");
    }

    // ---------------------------------------------------------------- fresh symbols

    private static Set<Symbol> symbolsNamed(Object value, String... names) {
        Set<Symbol> out = new java.util.LinkedHashSet<>();
        Set<String> wanted = Set.of(names);
        for (Symbol s : Mutants.symbols(value)) if (wanted.contains(s.name())) out.add(s);
        assertEquals(wanted.size(), out.size(), "symbols " + wanted + " in " + value);
        return out;
    }

    @Test
    void aSkolemFunctionExtendsEveryModel() {
        List<Formula> fs = formulas("forall t. exists b. Bench(b) and Assigned(t, b)",
                "forall t. Bench(bench_of(t)) and Assigned(t, bench_of(t))");
        Judgement j = oracle.extendsEveryModel(List.of(fs.get(0)), fs.get(1), symbolsNamed(fs.get(1), "bench_of"));
        assertEquals(Answer.YES, j.answer(), j.detail());
    }

    @Test
    void aSkolemConstantWhereAFunctionIsNeededDoesNot() {
        List<Formula> fs = formulas("forall t. exists b. Assigned(t, b) and not Assigned(b, t)",
                "forall t. Assigned(t, one_bench) and not Assigned(one_bench, t)");
        Judgement j = oracle.extendsEveryModel(List.of(fs.get(0)), fs.get(1), symbolsNamed(fs.get(1), "one_bench"));
        assertEquals(Answer.NO, j.answer());
    }

    @Test
    void aReusedSymbolIsNotFresh() {
        // spare is already a constant of the problem: the same conclusion that extends with spare fresh is refuted.
        List<Formula> fs = formulas("Bench(spare) or true", "exists b. Bench(b)", "Bench(spare)");
        assertEquals(Answer.YES, oracle.extendsEveryModel(List.of(fs.get(1)), fs.get(2), symbolsNamed(fs.get(2), "spare")).answer());
        assertEquals(Answer.NO, oracle.extendsEveryModel(List.of(fs.get(1)), fs.get(2), Set.of()).answer());
    }

    @Test
    void aDefinitionExtendsAndACircularOneDoesNot() {
        List<Formula> fs = formulas("forall t. (Qualified(t) iff Trained(t) and exists s. Signs(s, t))",
                "Odd iff not Odd");
        assertEquals(Answer.YES, oracle.extendsEveryModel(List.of(), fs.get(0), symbolsNamed(fs.get(0), "Qualified")).answer());
        assertEquals(Answer.NO, oracle.extendsEveryModel(List.of(), fs.get(1), symbolsNamed(fs.get(1), "Odd")).answer());
    }

    @Test
    void aFreshSymbolInThePremiseIsACallerError() {
        List<Formula> fs = formulas("Bench(spare)", "Bench(spare)");
        org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
                () -> oracle.extendsEveryModel(List.of(fs.get(0)), fs.get(1), symbolsNamed(fs.get(1), "spare")));
    }

    // ---------------------------------------------------------------- models and budget

    @Test
    void findsAModelOrShowsThereIsNone() {
        Judgement j = oracle.hasModel(formulas("forall x. exists y. Relieves(y, x)", "forall x. not Relieves(x, x)"));
        assertEquals(Answer.YES, j.answer());
        assertTrue(j.detail().startsWith("domain {0..1}"), j.detail());
        assertEquals(Answer.NO, oracle.hasModel(formulas("Ready(scale)", "not Ready(scale)")).answer());
        assertEquals(Answer.NO, oracle.hasModel(formulas("forall x y. x = y", "ines != omar")).answer());
    }

    @Test
    void saysUndecidedWhenTheBudgetRunsOut() {
        // A strict order is asymmetric: true, and over three elements it takes more than a few branches to see.
        List<Formula> fs = formulas("forall x y z. Before(x, y) and Before(y, z) implies Before(x, z)",
                "forall x. not Before(x, x)", "forall x y. Before(x, y) implies not Before(y, x)");
        Judgement tiny = new FiniteModelOracle(3, 20, FiniteModelOracle.DEFAULT_WORK).entails(all(fs), last(fs));
        assertEquals(Answer.UNDECIDED, tiny.answer());
        assertTrue(tiny.detail().contains("budget"), tiny.detail());
        Judgement work = new FiniteModelOracle(3, FiniteModelOracle.DEFAULT_NODES, 50).entails(all(fs), last(fs));
        assertEquals(Answer.UNDECIDED, work.answer());
        Judgement full = oracle.entails(all(fs), last(fs));
        assertEquals(Answer.YES, full.answer(), "the default budget decides it: " + full);
    }

    // ---------------------------------------------------------------- against plain enumeration

    private static final Symbol P = new Symbol("P", Symbol.Kind.PREDICATE, 1);
    private static final Symbol R = new Symbol("R", Symbol.Kind.PREDICATE, 2);
    private static final Symbol Q = new Symbol("Q", Symbol.Kind.PREDICATE, 0);
    private static final Symbol A = new Symbol("a", Symbol.Kind.FUNCTION, 0);
    private static final Symbol B = new Symbol("b", Symbol.Kind.FUNCTION, 0);
    private static final Symbol FN = new Symbol("f", Symbol.Kind.FUNCTION, 1);
    private static final Symbol G = new Symbol("g", Symbol.Kind.FUNCTION, 1);
    private static final Symbol S = new Symbol("S", Symbol.Kind.PREDICATE, 1);
    private static final List<Symbol> BASE = List.of(P, R, Q, A, B, FN);
    private static final List<Symbol> FRESH = List.of(G, S);

    /** Random formulas over BASE (and FRESH when asked), variables x and y, built directly as kernel values. */
    private static final class Gen {
        final TermFactory tf = new TermFactory();
        final Random r;
        final boolean fresh;
        final Variable[] vars = {tf.variable("x"), tf.variable("y")};

        Gen(Random r, boolean fresh) {
            this.r = r;
            this.fresh = fresh;
        }

        Term term(List<Variable> bound, int depth) {
            int k = r.nextInt(depth > 0 ? 5 : 3);
            if (k == 0 && !bound.isEmpty()) return bound.get(r.nextInt(bound.size()));
            if (k <= 2) return tf.application(r.nextBoolean() ? A : B);
            Symbol f = fresh && r.nextInt(2) == 0 ? G : FN;
            return tf.application(f, term(bound, depth - 1));
        }

        Formula atom(List<Variable> bound) {
            return switch (r.nextInt(fresh ? 5 : 4)) {
                case 0 -> new Formula.Atomic(new Literal(true, tf.application(P, term(bound, 1))));
                case 1 -> new Formula.Atomic(new Literal(true, tf.application(R, term(bound, 1), term(bound, 1))));
                case 2 -> new Formula.Atomic(new Literal(true, tf.application(Q)));
                case 3 -> new Formula.Atomic(new Literal(r.nextBoolean(), tf.equation(term(bound, 1), term(bound, 1))));
                default -> new Formula.Atomic(new Literal(true, tf.application(S, term(bound, 1))));
            };
        }

        Formula formula(List<Variable> bound, int depth) {
            if (depth == 0) return atom(bound);
            int k = r.nextInt(7);
            switch (k) {
                case 0:
                    return new Formula.Not(formula(bound, depth - 1));
                case 1:
                    return new Formula.And(List.of(formula(bound, depth - 1), formula(bound, depth - 1)));
                case 2:
                    return new Formula.Or(List.of(formula(bound, depth - 1), formula(bound, depth - 1)));
                case 3:
                    return new Formula.Implies(formula(bound, depth - 1), formula(bound, depth - 1));
                case 4:
                    return new Formula.Iff(formula(bound, depth - 1), formula(bound, depth - 1));
                default: {
                    Variable v = vars[r.nextInt(2)];
                    List<Variable> b = new ArrayList<>(bound);
                    b.remove(v);
                    b.add(v);
                    return new Formula.Quantified(k == 5, v, formula(b, depth - 1));
                }
            }
        }
    }

    /** Two-valued evaluation over total tables, recursive and independent of the oracle's compiled form. */
    private static boolean truth(Formula f, int n, Map<Symbol, int[]> t, Map<String, Integer> env) {
        if (f instanceof Formula.Atomic a) {
            Application at = a.literal().atom();
            boolean v = at.isEquation() ? value(at.argument(0), n, t, env) == value(at.argument(1), n, t, env)
                    : value(at, n, t, env) == 1;
            return v == a.literal().positive();
        }
        if (f instanceof Formula.Constant c) return c.value();
        if (f instanceof Formula.Not x) return !truth(x.body(), n, t, env);
        if (f instanceof Formula.And j) return j.parts().stream().allMatch(p -> truth(p, n, t, env));
        if (f instanceof Formula.Or j) return j.parts().stream().anyMatch(p -> truth(p, n, t, env));
        if (f instanceof Formula.Implies i) return !truth(i.left(), n, t, env) || truth(i.right(), n, t, env);
        if (f instanceof Formula.Iff i) return truth(i.left(), n, t, env) == truth(i.right(), n, t, env);
        Formula.Quantified q = (Formula.Quantified) f;
        String name = q.variable().name();
        Integer saved = env.get(name);
        boolean result = q.universal();
        for (int d = 0; d < n; d++) {
            env.put(name, d);
            boolean v = truth(q.body(), n, t, env);
            if (v != q.universal()) {
                result = v;
                break;
            }
        }
        if (saved == null) env.remove(name);
        else env.put(name, saved);
        return result;
    }

    private static int value(Term term, int n, Map<Symbol, int[]> t, Map<String, Integer> env) {
        if (term instanceof Variable v) return env.get(v.name());
        Application a = (Application) term;
        int idx = 0;
        for (int i = a.arity() - 1; i >= 0; i--) idx = idx * n + value(a.argument(i), n, t, env);
        return t.get(a.symbol())[idx];
    }

    /** Every total interpretation of the symbols over n elements, handed to the visitor until it returns true. */
    private static boolean everyInterpretation(List<Symbol> syms, int n, java.util.function.Predicate<Map<Symbol, int[]>> visit) {
        Map<Symbol, int[]> t = new HashMap<>();
        for (Symbol s : syms) t.put(s, new int[(int) Math.pow(n, s.arity())]);
        while (true) {
            if (visit.test(t)) return true;
            boolean carried = true;
            for (Symbol s : syms) {
                int[] tab = t.get(s);
                int range = s.kind() == Symbol.Kind.PREDICATE ? 2 : n;
                for (int i = 0; i < tab.length && carried; i++) {
                    if (++tab[i] == range) tab[i] = 0;
                    else carried = false;
                }
                if (!carried) break;
            }
            if (carried) return false;
        }
    }

    private static boolean bruteEntails(List<Formula> premises, Formula conclusion, int maxN) {
        for (int n = 1; n <= maxN; n++) {
            int size = n;
            boolean counter = everyInterpretation(BASE, n, t -> premises.stream().allMatch(p -> truth(p, size, t, new HashMap<>()))
                    && !truth(conclusion, size, t, new HashMap<>()));
            if (counter) return false;
        }
        return true;
    }

    private static boolean bruteExtends(Formula premise, Formula conclusion, int maxN) {
        for (int n = 1; n <= maxN; n++) {
            int size = n;
            boolean counter = everyInterpretation(BASE, n, base -> {
                if (!truth(premise, size, base, new HashMap<>())) return false;
                Map<Symbol, int[]> copy = new HashMap<>(base);
                boolean extendable = everyInterpretation(FRESH, size, fr -> {
                    copy.putAll(fr);
                    return truth(conclusion, size, copy, new HashMap<>());
                });
                return !extendable;
            });
            if (counter) return false;
        }
        return true;
    }

    @Test
    void agreesWithPlainEnumerationOnRandomEntailments() {
        FiniteModelOracle upToTwo = new FiniteModelOracle(2, FiniteModelOracle.DEFAULT_NODES, FiniteModelOracle.DEFAULT_WORK);
        Random r = new Random(20261207L);
        int yes = 0;
        int no = 0;
        for (int i = 0; i < 250; i++) {
            Gen g = new Gen(r, false);
            List<Formula> premises = new ArrayList<>();
            int k = r.nextInt(3);
            for (int p = 0; p < k; p++) premises.add(g.formula(List.of(), 1 + r.nextInt(3)));
            Formula c = g.formula(List.of(), 1 + r.nextInt(3));
            boolean expected = bruteEntails(premises, c, 2);
            Judgement j = upToTwo.entails(premises, c);
            assertEquals(expected ? Answer.YES : Answer.NO, j.answer(), premises + " ⊨ " + c + ": " + j.detail());
            if (expected) yes++;
            else no++;
        }
        assertTrue(yes >= 20 && no >= 20, "both answers occur: " + yes + " yes, " + no + " no");
    }

    @Test
    void agreesWithPlainEnumerationOnRandomExtensions() {
        FiniteModelOracle upToTwo = new FiniteModelOracle(2, FiniteModelOracle.DEFAULT_NODES, FiniteModelOracle.DEFAULT_WORK);
        Random r = new Random(7L);
        int yes = 0;
        int no = 0;
        for (int i = 0; i < 120; i++) {
            Formula premise = new Gen(r, false).formula(List.of(), 1 + r.nextInt(2));
            Formula c = new Gen(r, true).formula(List.of(), 1 + r.nextInt(3));
            boolean expected = bruteExtends(premise, c, 2);
            Set<Symbol> fresh = new java.util.HashSet<>(Mutants.symbols(c));
            fresh.retainAll(FRESH);
            Judgement j = upToTwo.extendsEveryModel(List.of(premise), c, fresh);
            assertEquals(expected ? Answer.YES : Answer.NO, j.answer(), premise + " ~> " + c + ": " + j.detail());
            if (expected) yes++;
            else no++;
        }
        assertTrue(yes >= 10 && no >= 10, "both answers occur: " + yes + " yes, " + no + " no");
    }
}
