package dev.assay.prover;

import dev.assay.kernel.Application;
import dev.assay.kernel.Literal;
import dev.assay.kernel.Term;
import dev.assay.kernel.Variable;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * One-way matching (the pattern's variables are bound, the target's are rigid, even where names coincide) and
 * clause subsumption: C subsumes D when some σ maps the literals of C onto distinct literals of D (Cσ ⊆ D as
 * multisets), which keeps a clause from subsuming clauses that only contain one of its factors.
 */
final class Matching {

    private Matching() {
    }

    /** Extends {@code bindings} so that pattern under it is target; on failure bindings may hold partial work. */
    static boolean match(Term pattern, Term target, Map<Variable, Term> bindings, List<Variable> trail) {
        if (pattern instanceof Variable v) {
            Term bound = bindings.get(v);
            if (bound == null) {
                bindings.put(v, target);
                trail.add(v);
                return true;
            }
            return bound == target;
        }
        if (pattern.isGround()) return pattern == target;
        if (!(target instanceof Application t)) return false;
        Application p = (Application) pattern;
        if (!p.symbol().equals(t.symbol())) return false;
        for (int i = 0; i < p.arity(); i++) {
            if (!match(p.argument(i), t.argument(i), bindings, trail)) return false;
        }
        return true;
    }

    /** A matcher of pattern onto target, or null. */
    static Map<Variable, Term> match(Term pattern, Term target) {
        Map<Variable, Term> b = new HashMap<>();
        return match(pattern, target, b, new ArrayList<>()) ? b : null;
    }

    private static void undo(Map<Variable, Term> bindings, List<Variable> trail, int mark) {
        while (trail.size() > mark) bindings.remove(trail.remove(trail.size() - 1));
    }

    /** Matches literal p onto literal t (equations in either orientation), trying orientation {@code flip}. */
    private static boolean matchLiteral(Literal p, Literal t, boolean flip, Map<Variable, Term> b, List<Variable> trail) {
        if (p.positive() != t.positive()) return false;
        if (!p.atom().symbol().equals(t.atom().symbol())) return false;
        if (!flip) return match(p.atom(), t.atom(), b, trail);
        return match(p.left(), t.right(), b, trail) && match(p.right(), t.left(), b, trail);
    }

    static boolean subsumes(Literal[] c, Literal[] d) {
        if (c.length > d.length) return false;
        // Cheap filter: every literal of c needs a literal of d with its sign and predicate.
        for (Literal l : c) {
            boolean found = false;
            for (Literal m : d) {
                if (m.positive() == l.positive() && m.atom().symbol().equals(l.atom().symbol())) {
                    found = true;
                    break;
                }
            }
            if (!found) return false;
        }
        return search(c, 0, d, new boolean[d.length], new HashMap<>(), new ArrayList<>());
    }

    /**
     * Literals of c go to distinct literals of d: subsumption of multisets. Mapping two literals of c onto one would
     * let a clause subsume clauses that contain only its factor, which the search needs to keep.
     */
    private static boolean search(Literal[] c, int k, Literal[] d, boolean[] used, Map<Variable, Term> b,
                                  List<Variable> trail) {
        if (k == c.length) return true;
        Literal l = c[k];
        for (int i = 0; i < d.length; i++) {
            if (used[i]) continue;
            Literal m = d[i];
            for (int o = 0; o < (l.isEquation() ? 2 : 1); o++) {
                int mark = trail.size();
                if (matchLiteral(l, m, o == 1, b, trail)) {
                    used[i] = true;
                    if (search(c, k + 1, d, used, b, trail)) return true;
                    used[i] = false;
                }
                undo(b, trail, mark);
            }
        }
        return false;
    }
}
