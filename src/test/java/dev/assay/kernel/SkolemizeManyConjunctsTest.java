package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The comparison in {@code skolemize} must not depend on the order of hundreds of conjuncts. Only correctness is
 * asserted; the time limit is a guard against a hang (speed belongs to the benchmarks). The time taken is printed.
 */
class SkolemizeManyConjunctsTest {

    static final int N = 500;

    private final TermFactory f = new TermFactory();
    private final Symbol r = new Symbol("R", Symbol.Kind.PREDICATE, 2);
    private final Symbol q = new Symbol("Q", Symbol.Kind.PREDICATE, 1);
    private final Symbol t = new Symbol("T", Symbol.Kind.PREDICATE, 3);
    private final Variable x = f.variable("x");
    private final Variable y = f.variable("y");
    private final Variable z = f.variable("z");

    private Formula atom(boolean positive, Symbol s, Term... args) {
        return new Formula.Atomic(new Literal(positive, f.application(s, args)));
    }

    private static Formula forall(Variable v, Formula body) {
        return new Formula.Quantified(true, v, body);
    }

    /**
     * Conjunct i: forall x. P_i(x) implies exists y. (R(x, y) and Q(y)); stated skolemized, in reversed order, with the
     * inner conjunction permuted: forall x. (Q(s_i(x)) and R(x, s_i(x))) or not P_i(x).
     */
    @Test
    void fiveHundredConjunctsReversed() {
        Problem.Builder b = new Problem.Builder("many").declare(r).declare(q);
        List<Formula> premise = new ArrayList<>();
        List<Formula> stated = new ArrayList<>();
        List<Symbol> fresh = new ArrayList<>();
        for (int i = 0; i < N; i++) {
            Symbol p = new Symbol("P" + i, Symbol.Kind.PREDICATE, 1);
            b.declare(p);
            premise.add(forall(x, new Formula.Implies(atom(true, p, x),
                    new Formula.Quantified(false, y, new Formula.And(List.of(atom(true, r, x, y), atom(true, q, y)))))));
            Symbol s = new Symbol("s" + i, Symbol.Kind.FUNCTION, 1);
            fresh.add(s);
            Term sx = f.application(s, x);
            stated.add(0, forall(x, new Formula.Or(List.of(new Formula.And(List.of(atom(true, q, sx), atom(true, r, x, sx))),
                    atom(false, p, x)))));
        }
        run(b.axiom("ax", new Formula.And(premise)).build(), fresh, new Formula.And(stated), "distinct conjuncts");
    }

    /**
     * Conjuncts of two shapes that the kernel's shape hash cannot tell apart (they differ only in the order of
     * variables): forall x. forall z. exists y. T(x, z, y) and forall x. forall z. exists y. T(z, x, y), alternating.
     * Stated reversed, so the pairing has to try many equal-shaped candidates.
     */
    @Test
    void fiveHundredEqualShapedConjunctsReversed() {
        Problem.Builder b = new Problem.Builder("many").declare(t);
        List<Formula> premise = new ArrayList<>();
        List<Formula> stated = new ArrayList<>();
        List<Symbol> fresh = new ArrayList<>();
        for (int i = 0; i < N; i++) {
            boolean swapped = i % 2 == 1;
            premise.add(forall(x, forall(z, new Formula.Quantified(false, y,
                    swapped ? atom(true, t, z, x, y) : atom(true, t, x, z, y)))));
            Symbol s = new Symbol("s" + i, Symbol.Kind.FUNCTION, 2);
            fresh.add(s);
            Term sxz = f.application(s, x, z);
            stated.add(0, forall(x, forall(z, swapped ? atom(true, t, z, x, sxz) : atom(true, t, x, z, sxz))));
        }
        run(b.axiom("ax", new Formula.And(premise)).build(), fresh, new Formula.And(stated), "equal-shaped conjuncts");
    }

    private void run(Problem problem, List<Symbol> fresh, Formula stated, String what) {
        Kernel kernel = new Kernel(problem, f);
        long start = System.nanoTime();
        Outcome o = assertTimeoutPreemptively(Duration.ofSeconds(20),
                () -> kernel.skolemize("s", kernel.axiom("ax"), fresh, stated));
        long ms = (System.nanoTime() - start) / 1_000_000;
        System.out.println("SkolemizeManyConjunctsTest: " + N + " " + what + ", skolemize took " + ms + " ms");
        RuleTestSupport.accepted(o);
    }
}
