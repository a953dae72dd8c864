package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import org.junit.jupiter.api.Test;

/**
 * The small path of {@link Unification} against the general Solver on the same pairs. Where the small path answers,
 * its unifier must be the Solver's: the same variables bound to the same terms, in the same order (a report prints
 * the unifier and the clauses it derives). Through the public entry point every result, failures included (occurs
 * check flag, position and explanation), must be the Solver's.
 */
class SmallUnifierTest {

    private static final Symbol F = new Symbol("f", Symbol.Kind.FUNCTION, 2);
    private static final Symbol G = new Symbol("g", Symbol.Kind.FUNCTION, 1);
    private static final Symbol H = new Symbol("h", Symbol.Kind.FUNCTION, 3);
    private static final Symbol A = new Symbol("a", Symbol.Kind.FUNCTION, 0);
    private static final Symbol B = new Symbol("b", Symbol.Kind.FUNCTION, 0);

    /** What happened to one pair: the small path answered, or left it to the Solver, which unified or refused. */
    enum Path { SMALL, SOLVER_UNIFIED, SOLVER_REFUSED }

    private static Term randomTerm(TermFactory f, Random r, int depth, int vars) {
        int c = depth <= 0 ? r.nextInt(4) : r.nextInt(8);
        switch (c) {
            case 0:
            case 1:
            case 2:
                return f.variable("x" + r.nextInt(vars));
            case 3:
                return f.application(r.nextBoolean() ? A : B);
            case 4:
            case 5:
                return f.application(G, randomTerm(f, r, depth - 1, vars));
            case 6:
                return f.application(F, randomTerm(f, r, depth - 1, vars), randomTerm(f, r, depth - 1, vars));
            default:
                return f.application(H, randomTerm(f, r, depth - 1, vars), randomTerm(f, r, depth - 1, vars),
                        randomTerm(f, r, depth - 1, vars));
        }
    }

    /**
     * A random pair: independent terms (clashes and cycles), or one term under two random substitutions that map
     * variables to variables (chains and merges of variables) or to small terms that may contain them (cycles).
     */
    private static Term[] randomPair(TermFactory f, Random r) {
        int vars = 1 + r.nextInt(r.nextInt(8) == 0 ? 24 : 6);
        int depth = 1 + r.nextInt(4);
        if (r.nextInt(4) == 0) return new Term[] {randomTerm(f, r, depth, vars), randomTerm(f, r, depth, vars)};
        Term base = randomTerm(f, r, depth, vars);
        return new Term[] {substitute(f, r, base, vars), substitute(f, r, base, vars)};
    }

    private static Term substitute(TermFactory f, Random r, Term t, int vars) {
        Map<Variable, Term> s = new HashMap<>();
        for (int i = 0; i < vars; i++) {
            int c = r.nextInt(4);
            if (c == 0) s.put(f.variable("x" + i), f.variable("x" + r.nextInt(vars)));
            else if (c == 1) s.put(f.variable("x" + i), randomTerm(f, r, 1, vars));
        }
        return new Substitution(f, s).apply(t);
    }

    private static List<Map.Entry<Variable, Term>> entries(Substitution s) {
        return new ArrayList<>(s.bindings().entrySet());
    }

    /** Demands the Solver's result from both paths and says which one answered. */
    static Path compare(TermFactory f, Term s, Term t) {
        List<Term[]> pair = new ArrayList<>();
        pair.add(new Term[] {s, t});
        Unification.Result general = Unification.mostGeneralUnifier(f, pair); // the Solver alone
        Substitution small = Unification.smallUnifier(f, s, t);
        Unification.Result combined = Unification.mostGeneralUnifier(f, s, t);
        if (small != null) {
            Unification.Unified u = assertInstanceOf(Unification.Unified.class, general,
                    () -> s + " =? " + t + ": the small path unified, the Solver says " + general);
            assertEquals(entries(u.unifier()), entries(small), () -> s + " =? " + t);
        }
        if (general instanceof Unification.Unified u) {
            Unification.Unified c = assertInstanceOf(Unification.Unified.class, combined, () -> s + " =? " + t);
            assertEquals(entries(u.unifier()), entries(c.unifier()), () -> s + " =? " + t);
            return small != null ? Path.SMALL : Path.SOLVER_UNIFIED;
        }
        assertEquals(general, combined, () -> s + " =? " + t);
        return Path.SOLVER_REFUSED;
    }

    @Property(tries = 3000, seed = "2001")
    void smallPathGivesTheSolversResult(@ForAll long seed) {
        Random r = new Random(seed);
        TermFactory f = new TermFactory();
        Term[] p = randomPair(f, r);
        compare(f, p[0], p[1]);
        compare(f, p[1], p[0]);
    }

    @Test
    void theRandomPairsReachEveryPath() {
        // Otherwise the property above could pass with the small path answering nothing, or everything.
        Random r = new Random(1965);
        Map<Path, Integer> seen = new HashMap<>();
        for (int k = 0; k < 20_000; k++) {
            TermFactory f = new TermFactory();
            Term[] p = randomPair(f, r);
            seen.merge(compare(f, p[0], p[1]), 1, Integer::sum);
        }
        for (Path path : Path.values()) assertTrue(seen.getOrDefault(path, 0) > 20, () -> "paths taken: " + seen);
    }

    @Test
    void givesUpWhereASolverClassWouldHoldThreeApplications() {
        KernelFixture k = new KernelFixture();
        // x := g(y) meets g(a): the two applications are one class, whose arguments are unified once.
        assertNotNull(Unification.smallUnifier(k.f, k.term("f(x, x)"), k.term("f(g(y), g(a))")));
        assertNotNull(Unification.smallUnifier(k.f, k.term("f(g(x), g(x))"), k.term("f(g(a), g(a))")));
        // Then g(b) too: left to the Solver, which keeps one of three applications as the class's schema.
        assertNull(Unification.smallUnifier(k.f, k.term("h(x, x, x)"), k.term("h(g(y), g(a), g(b))")));
        assertNull(Unification.smallUnifier(k.f, k.term("f(g(y), g(y))"), k.term("f(g(z), g(a))")));
        for (String[] p : new String[][] {{"f(x, x)", "f(g(y), g(a))"}, {"h(x, x, x)", "h(g(y), g(a), g(b))"},
                {"f(g(y), g(y))", "f(g(z), g(a))"}, {"f(x, g(x))", "f(y, y)"}, {"f(x, a)", "f(b, x)"}}) {
            compare(k.f, k.term(p[0]), k.term(p[1]));
        }
    }

    /** g(g(...g(x)...)) with {@code n} nodes. */
    private static Term tower(TermFactory f, int n, Term inner) {
        Term t = inner;
        for (int i = 1; i < n; i++) t = f.application(G, t);
        return t;
    }

    @Test
    void bothSidesOfTheNodeLimit() {
        TermFactory f = new TermFactory();
        Variable x = f.variable("x");
        Variable y = f.variable("y");
        for (int n = 60; n <= 66; n++) {
            // n nodes in all: g^(n-2)(x) against y.
            Term left = tower(f, n - 1, x);
            assertEquals(n <= 64, Unification.smallUnifier(f, left, y) != null, n + " nodes");
            assertEquals(n <= 64 ? Path.SMALL : Path.SOLVER_UNIFIED, compare(f, left, y), n + " nodes");
            // And a cycle at the same sizes: refused by the Solver on both sides.
            assertEquals(Path.SOLVER_REFUSED, compare(f, tower(f, n - 1, y), y), n + " nodes");
        }
        Term huge = tower(f, 40, x);
        for (int i = 0; i < 70; i++) huge = f.application(F, huge, huge); // a tree size that saturates
        assertNull(Unification.smallUnifier(f, huge, y));
        assertNull(Unification.smallUnifier(f, y, huge));
        assertEquals(Path.SOLVER_UNIFIED, compare(f, y, huge));
    }

    @Test
    void bothSidesOfTheVariableLimit() {
        TermFactory f = new TermFactory();
        for (int n = 14; n <= 18; n++) {
            // h(x1, h(x2, ...)) against h(y1, h(y2, ...)) over n variables in all.
            Term left = f.application(A);
            Term right = f.application(A);
            for (int i = 0; i < n / 2; i++) left = f.application(H, f.variable("x" + i), left, f.application(B));
            for (int i = 0; i < n / 2; i++) right = f.application(H, f.variable("y" + i), right, f.application(B));
            if (n % 2 == 1) left = f.application(F, left, f.variable("z"));
            if (n % 2 == 1) right = f.application(F, right, f.application(B));
            assertTrue(left.treeSize() + right.treeSize() <= 64, n + " variables");
            assertEquals(n <= 16, Unification.smallUnifier(f, left, right) != null, n + " variables");
            assertEquals(n <= 16 ? Path.SMALL : Path.SOLVER_UNIFIED, compare(f, left, right), n + " variables");
        }
    }
}
