package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;

/**
 * {@link Unification#mostGeneralUnifier} against a reference: the textbook recursive algorithm with the occurs check
 * on explicit substitutions (Robinson 1965, section 5, as restated in every textbook; common practice). On small random
 * terms both must agree on whether a unifier exists, and where one does, the kernel's must unify, be idempotent, equal
 * the reference's up to renaming, and be more general than a random ground unifier.
 */
class UnificationPropertyTest {

    private static final Symbol F = new Symbol("f", Symbol.Kind.FUNCTION, 2);
    private static final Symbol G = new Symbol("g", Symbol.Kind.FUNCTION, 1);
    private static final Symbol A = new Symbol("a", Symbol.Kind.FUNCTION, 0);
    private static final Symbol B = new Symbol("b", Symbol.Kind.FUNCTION, 0);

    private static Term randomTerm(TermFactory f, Random r, int depth, int vars) {
        int c = depth <= 0 ? r.nextInt(3) : r.nextInt(6);
        switch (c) {
            case 0:
            case 1:
                return f.variable("x" + r.nextInt(vars));
            case 2:
                return f.application(r.nextBoolean() ? A : B);
            case 3:
                return f.application(G, randomTerm(f, r, depth - 1, vars));
            default:
                return f.application(F, randomTerm(f, r, depth - 1, vars), randomTerm(f, r, depth - 1, vars));
        }
    }

    /** Applies a triangular substitution fully (the reference's own, deliberately naive). */
    private static Term walk(TermFactory f, Term t, Map<Variable, Term> s) {
        if (t instanceof Variable v) {
            Term b = s.get(v);
            return b == null ? v : walk(f, b, s);
        }
        Application a = (Application) t;
        Term[] args = new Term[a.arity()];
        for (int i = 0; i < args.length; i++) args[i] = walk(f, a.argument(i), s);
        return f.application(a.symbol(), args);
    }

    private static boolean occurs(Variable v, Term t) {
        if (t == v) return true;
        if (t instanceof Application a) for (Term arg : a.arguments()) if (occurs(v, arg)) return true;
        return false;
    }

    /** Textbook unification; null when not unifiable. */
    private static Map<Variable, Term> reference(TermFactory f, Term s, Term t) {
        Map<Variable, Term> sub = new LinkedHashMap<>();
        List<Term[]> todo = new ArrayList<>();
        todo.add(new Term[] {s, t});
        while (!todo.isEmpty()) {
            Term[] p = todo.remove(todo.size() - 1);
            Term x = walk(f, p[0], sub);
            Term y = walk(f, p[1], sub);
            if (x == y) continue;
            if (x instanceof Variable v) {
                if (occurs(v, y)) return null;
                sub.put(v, y);
            } else if (y instanceof Variable w) {
                if (occurs(w, x)) return null;
                sub.put(w, x);
            } else {
                Application ax = (Application) x;
                Application ay = (Application) y;
                if (!ax.symbol().equals(ay.symbol())) return null;
                for (int i = 0; i < ax.arity(); i++) todo.add(new Term[] {ax.argument(i), ay.argument(i)});
            }
        }
        Map<Variable, Term> solved = new LinkedHashMap<>();
        for (Variable v : sub.keySet()) solved.put(v, walk(f, v, sub));
        return solved;
    }

    @Property(tries = 1000, seed = "1965")
    void agreesWithTheTextbookAlgorithm(@ForAll long seed) {
        Random r = new Random(seed);
        TermFactory f = new TermFactory();
        int vars = 1 + r.nextInt(4);
        Term s = randomTerm(f, r, 3, vars);
        Term t = randomTerm(f, r, 3, vars);
        Map<Variable, Term> ref = reference(f, s, t);
        Unification.Result res = Unification.mostGeneralUnifier(f, s, t);
        assertEquals(ref != null, res instanceof Unification.Unified,
                () -> s + " =? " + t + ": reference " + ref + ", kernel " + res);
        if (ref == null) {
            Unification.NotUnifiable n = (Unification.NotUnifiable) res;
            assertTrue(n.explanation().contains("clash") || n.explanation().contains("occurs in"), n.explanation());
            return;
        }
        Substitution sigma = ((Unification.Unified) res).unifier();
        assertSame(sigma.apply(s), sigma.apply(t));
        for (Term v : sigma.bindings().values()) assertSame(v, sigma.apply(v), "not idempotent: " + sigma);
        List<Variable> vs = KernelFixture.variablesOf(s, t);
        assertTrue(KernelFixture.sameUnifierUpToRenaming(sigma, new Substitution(f, ref), vs),
                () -> "kernel " + sigma + ", reference " + ref);
        // Most general: an idempotent mgu σ satisfies θ = σθ for every unifier θ, here the reference's ρ, and
        // the other way round.
        Substitution rho = new Substitution(f, ref);
        for (Variable v : vs) {
            assertSame(rho.apply(v), rho.apply(sigma.apply(v)), () -> "ρ is not an instance of σ at " + v);
            assertSame(sigma.apply(v), sigma.apply(rho.apply(v)), () -> "σ is not an instance of ρ at " + v);
        }
    }

    @Property(tries = 500, seed = "1982")
    void unifiableByConstruction(@ForAll long seed) {
        // s and t are the same term with different variables replaced by random terms: a unifier exists unless the
        // replacement makes a cycle; the kernel must agree with the reference either way.
        Random r = new Random(seed);
        TermFactory f = new TermFactory();
        Term base = randomTerm(f, r, 4, 3);
        Map<Variable, Term> left = new HashMap<>();
        Map<Variable, Term> right = new HashMap<>();
        for (int i = 0; i < 3; i++) {
            if (r.nextBoolean()) left.put(f.variable("x" + i), randomTerm(f, r, 2, 3));
            else right.put(f.variable("x" + i), randomTerm(f, r, 2, 3));
        }
        Term s = new Substitution(f, left).apply(base);
        Term t = new Substitution(f, right).apply(base);
        Map<Variable, Term> ref = reference(f, s, t);
        Unification.Result res = Unification.mostGeneralUnifier(f, s, t);
        assertEquals(ref != null, res instanceof Unification.Unified, () -> s + " =? " + t);
        if (res instanceof Unification.Unified u) {
            assertSame(u.unifier().apply(s), u.unifier().apply(t));
            assertTrue(KernelFixture.sameUnifierUpToRenaming(u.unifier(), new Substitution(f, ref),
                    KernelFixture.variablesOf(s, t)));
        }
    }
}
