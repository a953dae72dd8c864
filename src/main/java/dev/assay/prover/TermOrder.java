package dev.assay.prover;

import dev.assay.kernel.Application;
import dev.assay.kernel.Literal;
import dev.assay.kernel.Symbol;
import dev.assay.kernel.Term;
import dev.assay.kernel.Variable;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The Knuth–Bendix order (Knuth &amp; Bendix 1970) with every symbol and variable of weight 1, so a term's weight is its
 * size; the precedence puts predicates above functions, then orders by arity, then by name. Literals are compared by
 * the multiset extension (Dershowitz &amp; Manna 1979) of the encoding of Bachmair &amp; Ganzinger (1994): {@code s = t}
 * is {s, t}, {@code s != t} is {s, s, t, t}, and a predicate atom A is the equation {@code A = ⊤} with ⊤ below every
 * term.
 *
 * <p>The order restricts the prover's inferences; it is never trusted. An answer of {@code INCOMPARABLE} where the
 * order would say more only allows more inferences.
 */
final class TermOrder {

    enum Comparison { GREATER, LESS, EQUAL, INCOMPARABLE }

    static int precedence(Symbol a, Symbol b) {
        if (a.kind() != b.kind()) return a.kind() == Symbol.Kind.PREDICATE ? 1 : -1;
        if (a.arity() != b.arity()) return Integer.compare(a.arity(), b.arity());
        return a.name().compareTo(b.name());
    }

    /** Compares two terms; null stands for ⊤, the least term. */
    Comparison compare(Term s, Term t) {
        if (s == t) return Comparison.EQUAL;
        if (s == null) return Comparison.LESS;
        if (t == null) return Comparison.GREATER;
        if (s instanceof Variable v) return Subterms.occurs(v, t) ? Comparison.LESS : Comparison.INCOMPARABLE;
        if (t instanceof Variable v) return Subterms.occurs(v, s) ? Comparison.GREATER : Comparison.INCOMPARABLE;
        boolean sCovers;
        boolean tCovers;
        if (s.isGround() && t.isGround()) {
            sCovers = true;
            tCovers = true;
        } else {
            Map<Variable, Integer> vs = new HashMap<>();
            Map<Variable, Integer> vt = new HashMap<>();
            Subterms.countVariables(s, vs);
            Subterms.countVariables(t, vt);
            sCovers = covers(vs, vt);
            tCovers = covers(vt, vs);
            if (!sCovers && !tCovers) return Comparison.INCOMPARABLE;
        }
        long ws = s.treeSize();
        long wt = t.treeSize();
        if (ws > wt) return sCovers ? Comparison.GREATER : Comparison.INCOMPARABLE;
        if (ws < wt) return tCovers ? Comparison.LESS : Comparison.INCOMPARABLE;
        Application a = (Application) s;
        Application b = (Application) t;
        int p = precedence(a.symbol(), b.symbol());
        if (p > 0) return sCovers ? Comparison.GREATER : Comparison.INCOMPARABLE;
        if (p < 0) return tCovers ? Comparison.LESS : Comparison.INCOMPARABLE;
        for (int i = 0; i < a.arity(); i++) {
            Comparison c = compare(a.argument(i), b.argument(i));
            if (c == Comparison.EQUAL) continue;
            if (c == Comparison.GREATER) return sCovers ? Comparison.GREATER : Comparison.INCOMPARABLE;
            if (c == Comparison.LESS) return tCovers ? Comparison.LESS : Comparison.INCOMPARABLE;
            return Comparison.INCOMPARABLE;
        }
        return Comparison.EQUAL;
    }

    boolean greater(Term s, Term t) {
        return compare(s, t) == Comparison.GREATER;
    }

    private static boolean covers(Map<Variable, Integer> big, Map<Variable, Integer> small) {
        for (Map.Entry<Variable, Integer> e : small.entrySet()) {
            if (big.getOrDefault(e.getKey(), 0) < e.getValue()) return false;
        }
        return true;
    }

    private static List<Term> encode(Literal l) {
        List<Term> out = new ArrayList<>(4);
        Term s = l.isEquation() ? l.left() : l.atom();
        Term t = l.isEquation() ? l.right() : null;
        out.add(s);
        out.add(t);
        if (!l.positive()) {
            out.add(s);
            out.add(t);
        }
        return out;
    }

    Comparison compare(Literal a, Literal b) {
        if (a.equals(b)) return Comparison.EQUAL;
        List<Term> m = encode(a);
        List<Term> n = encode(b);
        // Remove common elements one for one.
        for (int i = m.size() - 1; i >= 0; i--) {
            Term x = m.get(i);
            for (int j = 0; j < n.size(); j++) {
                if (n.get(j) == x) {
                    n.remove(j);
                    m.remove(i);
                    break;
                }
            }
        }
        if (m.isEmpty() && n.isEmpty()) return Comparison.EQUAL;
        if (dominates(m, n)) return Comparison.GREATER;
        if (dominates(n, m)) return Comparison.LESS;
        return Comparison.INCOMPARABLE;
    }

    /** Every element of n is below some element of m, and m is not empty. */
    private boolean dominates(List<Term> m, List<Term> n) {
        if (m.isEmpty()) return false;
        for (Term y : n) {
            boolean found = false;
            for (Term x : m) {
                if (compare(x, y) == Comparison.GREATER) {
                    found = true;
                    break;
                }
            }
            if (!found) return false;
        }
        return true;
    }

    /** Whether literal i is maximal in the clause: no other literal is greater. */
    boolean maximal(Literal[] literals, int i) {
        for (int j = 0; j < literals.length; j++) {
            if (j != i && compare(literals[j], literals[i]) == Comparison.GREATER) return false;
        }
        return true;
    }
}
