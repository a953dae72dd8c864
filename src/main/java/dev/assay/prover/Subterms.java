package dev.assay.prover;

import dev.assay.kernel.Application;
import dev.assay.kernel.Literal;
import dev.assay.kernel.Term;
import dev.assay.kernel.TermFactory;
import dev.assay.kernel.Variable;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Small walks over kernel terms for the prover: variables, positions (paths of argument indices from an atom,
 * counting from 1, as the certificate language writes them) and replacement. The prover is untrusted and its terms
 * are small, so plain recursion is used here.
 */
final class Subterms {

    private Subterms() {
    }

    /** A non-variable proper subterm of an atom with its position. */
    record Occurrence(Application term, int[] path) {
    }

    static void collectVariables(Term t, Set<Variable> into) {
        if (t.isGround()) return;
        if (t instanceof Variable v) {
            into.add(v);
            return;
        }
        Application a = (Application) t;
        for (int i = 0; i < a.arity(); i++) collectVariables(a.argument(i), into);
    }

    static Set<Variable> variables(Literal[] literals) {
        Set<Variable> out = new LinkedHashSet<>();
        for (Literal l : literals) collectVariables(l.atom(), out);
        return out;
    }

    static boolean occurs(Variable v, Term t) {
        if (t == v) return true;
        if (t.isGround() || !(t instanceof Application a)) return false;
        for (int i = 0; i < a.arity(); i++) if (occurs(v, a.argument(i))) return true;
        return false;
    }

    /** Occurrences of each variable, for the variable condition of the Knuth–Bendix order. */
    static void countVariables(Term t, Map<Variable, Integer> into) {
        if (t.isGround()) return;
        if (t instanceof Variable v) {
            into.merge(v, 1, Integer::sum);
            return;
        }
        Application a = (Application) t;
        for (int i = 0; i < a.arity(); i++) countVariables(a.argument(i), into);
    }

    /** Every non-variable proper subterm of {@code atom}, outermost first. */
    static List<Occurrence> occurrences(Application atom) {
        List<Occurrence> out = new ArrayList<>();
        walk(atom, new int[0], out);
        return out;
    }

    private static void walk(Application t, int[] path, List<Occurrence> out) {
        for (int i = 0; i < t.arity(); i++) {
            if (t.argument(i) instanceof Application child) {
                int[] p = java.util.Arrays.copyOf(path, path.length + 1);
                p[path.length] = i + 1;
                out.add(new Occurrence(child, p));
                walk(child, p, out);
            }
        }
    }

    static Term at(Application atom, int[] path) {
        Term t = atom;
        for (int index : path) t = ((Application) t).argument(index - 1);
        return t;
    }

    /** {@code atom} with the subterm at {@code path} replaced by {@code replacement}. */
    static Application replace(TermFactory terms, Application atom, int[] path, Term replacement) {
        return (Application) replace(terms, atom, path, 0, replacement);
    }

    private static Term replace(TermFactory terms, Term t, int[] path, int depth, Term replacement) {
        if (depth == path.length) return replacement;
        Application a = (Application) t;
        Term[] args = new Term[a.arity()];
        for (int i = 0; i < args.length; i++) args[i] = a.argument(i);
        args[path[depth] - 1] = replace(terms, args[path[depth] - 1], path, depth + 1, replacement);
        return terms.application(a.symbol(), args);
    }

    /** A renaming of {@code vars} onto {@code prefix}1, {@code prefix}2, … in order. */
    static Map<Variable, Term> renaming(TermFactory terms, Set<Variable> vars, String prefix) {
        Map<Variable, Term> out = new LinkedHashMap<>();
        int k = 1;
        for (Variable v : vars) out.put(v, terms.variable(prefix + k++));
        return out;
    }
}
