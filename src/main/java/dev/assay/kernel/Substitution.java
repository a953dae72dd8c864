package dev.assay.kernel;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A finite map from variables to terms, applied simultaneously. Application memoises on the shared term graph,
 * so applying a most general unifier in triangular or solved form costs the size of the graph, not of the tree.
 */
public final class Substitution {

    private final TermFactory terms;
    private final LinkedHashMap<Variable, Term> bindings;

    public Substitution(TermFactory terms, Map<Variable, Term> bindings) {
        this(terms, new LinkedHashMap<>(bindings));
    }

    /** Takes {@code bindings} as it is: for kernel code that made the map itself and does not keep it. */
    private Substitution(TermFactory terms, LinkedHashMap<Variable, Term> bindings) {
        this.terms = terms;
        this.bindings = bindings;
    }

    /** A substitution of {@code bindings}, a map the caller made for it and no longer touches. */
    static Substitution owning(TermFactory terms, LinkedHashMap<Variable, Term> bindings) {
        return new Substitution(terms, bindings);
    }

    public static Substitution empty(TermFactory terms) {
        return new Substitution(terms, Map.of());
    }

    public Map<Variable, Term> bindings() {
        return Collections.unmodifiableMap(bindings);
    }

    public boolean isEmpty() {
        return bindings.isEmpty();
    }

    public Term get(Variable v) {
        return bindings.get(v);
    }

    public Term apply(Term root) {
        if (bindings.isEmpty() || root.isGround()) return root;
        if (root.treeSize() <= SMALL) return applySmall(root);
        return apply(root, new HashMap<>());
    }

    /** Terms of at most this many nodes as a tree are rewritten directly, without a memo. */
    private static final int SMALL = 64;

    /**
     * {@link #apply(Term, Map)} on a small tree: the same result (terms are hash-consed, so rebuilding a shared
     * subterm twice gives the same object), without the memo. The recursion is at most {@link #SMALL} deep.
     */
    private Term applySmall(Term t) {
        if (t.isGround()) return t;
        if (t instanceof Variable v) {
            Term b = bindings.get(v);
            return b == null ? v : b;
        }
        Application a = (Application) t;
        Term[] args = a.argumentArray();
        Term[] mapped = null;
        for (int i = 0; i < args.length; i++) {
            Term m = applySmall(args[i]);
            if (m != args[i]) {
                if (mapped == null) mapped = args.clone();
                mapped[i] = m;
            }
        }
        return mapped == null ? a : terms.application(a.symbol(), mapped);
    }

    /** Applies to {@code root}, sharing {@code memo} across calls on the same substitution. */
    Term apply(Term root, Map<Term, Term> memo) {
        if (bindings.isEmpty() || root.isGround()) return root;
        if (root.treeSize() <= SMALL) return applySmall(root);
        Term done = memo.get(root);
        if (done != null) return done;
        return Terms.fold(root, memo, t -> {
            if (t.isGround()) return t;
            if (t instanceof Variable v) {
                Term b = bindings.get(v);
                return b == null ? v : b;
            }
            return null;
        }, (a, args) -> {
            Term[] mapped = args.toArray(new Term[0]);
            for (int i = 0; i < mapped.length; i++) if (mapped[i] != a.argument(i)) return terms.application(a.symbol(), mapped);
            return a;
        });
    }

    public Literal apply(Literal l) {
        if (bindings.isEmpty()) return l;
        return new Literal(l.positive(), (Application) apply(l.atom()));
    }

    public Clause apply(Clause c) {
        if (bindings.isEmpty()) return c;
        Map<Term, Term> memo = null;
        List<Literal> in = c.literals();
        List<Literal> out = new ArrayList<>(in.size());
        for (int i = 0; i < in.size(); i++) {
            Literal l = in.get(i);
            Application atom = l.atom();
            Term image;
            if (atom.isGround()) {
                image = atom;
            } else if (atom.treeSize() <= SMALL) {
                image = applySmall(atom);
            } else {
                if (memo == null) memo = new HashMap<>();
                image = apply(atom, memo);
            }
            out.add(image == atom ? l : new Literal(l.positive(), (Application) image));
        }
        return new Clause(out);
    }

    @Override
    public String toString() {
        return Printer.substitution(this);
    }
}
