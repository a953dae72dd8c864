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
        this.terms = terms;
        this.bindings = new LinkedHashMap<>(bindings);
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
        return apply(root, new HashMap<>());
    }

    /** Applies to {@code root}, sharing {@code memo} across calls on the same substitution. */
    Term apply(Term root, Map<Term, Term> memo) {
        if (bindings.isEmpty() || root.isGround()) return root;
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
        Map<Term, Term> memo = new HashMap<>();
        List<Literal> out = new ArrayList<>(c.width());
        for (Literal l : c.literals()) out.add(new Literal(l.positive(), (Application) apply(l.atom(), memo)));
        return new Clause(out);
    }

    @Override
    public String toString() {
        return Printer.substitution(this);
    }
}
