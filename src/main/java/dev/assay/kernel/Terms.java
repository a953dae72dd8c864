package dev.assay.kernel;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.function.BiFunction;
import java.util.function.Function;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.LinkedHashSet;
import java.util.Set;
import java.util.function.Consumer;

/** Iterative traversals of term graphs: each shared subterm is visited once, and no recursion grows with depth. */
final class Terms {

    private Terms() {
    }

    /**
     * Computes a value for {@code root} bottom-up over the term graph, once per distinct subterm, without recursion.
     * {@code leaf} gives the value of a term that is not taken apart (it returns null for an application whose
     * arguments are to be folded first); {@code node} combines an application with its arguments' values, in order.
     * {@code memo} holds the values computed so far and may be shared between calls with the same functions.
     */
    static <V> V fold(Term root, Map<Term, V> memo, Function<Term, V> leaf, BiFunction<Application, List<V>, V> node) {
        V known = memo.get(root);
        if (known != null) return known;
        ArrayDeque<Term> stack = new ArrayDeque<>();
        stack.push(root);
        while (!stack.isEmpty()) {
            Term t = stack.peek();
            if (memo.containsKey(t)) {
                stack.pop();
                continue;
            }
            V value = leaf.apply(t);
            if (value != null) {
                memo.put(t, value);
                stack.pop();
                continue;
            }
            Term[] args = ((Application) t).argumentArray();
            boolean ready = true;
            for (int i = args.length - 1; i >= 0; i--) {
                if (!memo.containsKey(args[i])) {
                    stack.push(args[i]);
                    ready = false;
                }
            }
            if (!ready) continue;
            stack.pop();
            List<V> values = new ArrayList<>(args.length);
            for (Term arg : args) values.add(memo.get(arg));
            memo.put(t, node.apply((Application) t, values));
        }
        return memo.get(root);
    }

    /** Visits every distinct subterm of {@code root} once, parents before children. */
    static void forEachSubterm(Term root, Consumer<Term> visitor) {
        Set<Term> seen = Collections.newSetFromMap(new IdentityHashMap<>());
        ArrayDeque<Term> stack = new ArrayDeque<>();
        stack.push(root);
        while (!stack.isEmpty()) {
            Term t = stack.pop();
            if (!seen.add(t)) continue;
            visitor.accept(t);
            if (t instanceof Application a) {
                Term[] args = a.argumentArray();
                for (int i = args.length - 1; i >= 0; i--) stack.push(args[i]);
            }
        }
    }

    /** Adds the variables of {@code root} to {@code into}, in left-to-right order of first occurrence. */
    static void collectVariables(Term root, Set<Variable> into) {
        if (root.isGround()) return;
        if (root.treeSize() <= 64) {
            collectSmall(root, into);
            return;
        }
        Set<Term> seen = Collections.newSetFromMap(new IdentityHashMap<>());
        ArrayDeque<Term> stack = new ArrayDeque<>();
        stack.push(root);
        while (!stack.isEmpty()) {
            Term t = stack.pop();
            if (t.isGround() || !seen.add(t)) continue;
            if (t instanceof Variable v) {
                into.add(v);
            } else {
                Term[] args = ((Application) t).argumentArray();
                for (int i = args.length - 1; i >= 0; i--) stack.push(args[i]);
            }
        }
    }

    /**
     * The variables of {@code roots}, in left-to-right order of first occurrence, as {@link #collectVariables} adds them
     * root after root. When the trees together have at most 64 nodes the variables are gathered in a list without
     * hashing (for a few variables, looking through the list costs less); beyond, in a linked hash set.
     */
    static List<Variable> variablesOf(List<? extends Term> roots) {
        // Indexed loops: a hot path, and an iterator the compiler cannot always remove costs an object per call.
        int n = roots.size();
        long size = 0;
        for (int i = 0; i < n; i++) size += Math.min(roots.get(i).treeSize(), 65); // tree sizes can be huge
        if (size <= 64) {
            List<Variable> few = new ArrayList<>(4);
            for (int i = 0; i < n; i++) collectSmall(roots.get(i), few);
            return few;
        }
        Set<Variable> many = new LinkedHashSet<>();
        for (int i = 0; i < n; i++) collectVariables(roots.get(i), many);
        return new ArrayList<>(many);
    }

    /** {@link #collectVariables} on a small tree into a list that holds each variable once. */
    private static void collectSmall(Term t, List<Variable> into) {
        if (t.isGround()) return;
        if (t instanceof Variable v) {
            if (!into.contains(v)) into.add(v);
            return;
        }
        for (Term arg : ((Application) t).argumentArray()) collectSmall(arg, into);
    }

    /** {@link #collectVariables} on a small tree: pre-order, left to right, without a visited set. */
    private static void collectSmall(Term t, Set<Variable> into) {
        if (t.isGround()) return;
        if (t instanceof Variable v) {
            into.add(v);
            return;
        }
        for (Term arg : ((Application) t).argumentArray()) collectSmall(arg, into);
    }
}
