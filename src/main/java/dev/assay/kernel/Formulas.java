package dev.assay.kernel;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/** Negation normal form, comparison modulo renaming and AC, and other iterative walks over formulas. */
public final class Formulas {

    private Formulas() {
    }

    // ---------------------------------------------------------------- negation normal form

    private record Visit(Formula formula, boolean negated) {
    }

    private record Build(int kind, int count, Variable variable) {
        static final int AND = 0, OR = 1, FORALL = 2, EXISTS = 3;
    }

    /** The kernel's negation normal form, exactly as FORMAT.md section 6 defines it. */
    public static Formula nnf(Formula root) {
        ArrayDeque<Object> work = new ArrayDeque<>();
        ArrayList<Formula> results = new ArrayList<>();
        work.push(new Visit(root, false));
        while (!work.isEmpty()) {
            Object item = work.pop();
            if (item instanceof Build b) {
                results.add(build(b, results));
                continue;
            }
            Visit v = (Visit) item;
            Formula f = v.formula;
            boolean neg = v.negated;
            if (f instanceof Formula.Atomic a) {
                results.add(neg ? new Formula.Atomic(a.literal().negated()) : a);
            } else if (f instanceof Formula.Constant c) {
                results.add(Formula.Constant.of(c.value() != neg));
            } else if (f instanceof Formula.Not n) {
                work.push(new Visit(n.body(), !neg));
            } else if (f instanceof Formula.Junction j) {
                boolean and = (j instanceof Formula.And) != neg;
                List<Formula> parts = flatParts(j);
                work.push(new Build(and ? Build.AND : Build.OR, parts.size(), null));
                for (int i = parts.size() - 1; i >= 0; i--) work.push(new Visit(parts.get(i), neg));
            } else if (f instanceof Formula.Implies imp) {
                if (!neg) { // nnf(not a) or nnf(b)
                    work.push(new Build(Build.OR, 2, null));
                    work.push(new Visit(imp.right(), false));
                    work.push(new Visit(imp.left(), true));
                } else { // nnf(a) and nnf(not b)
                    work.push(new Build(Build.AND, 2, null));
                    work.push(new Visit(imp.right(), true));
                    work.push(new Visit(imp.left(), false));
                }
            } else if (f instanceof Formula.Iff iff) {
                Formula a = iff.left();
                Formula b = iff.right();
                work.push(new Build(Build.AND, 2, null));
                if (!neg) { // (nnf(not a) or nnf(b)) and (nnf(a) or nnf(not b))
                    work.push(new Build(Build.OR, 2, null));
                    work.push(new Visit(b, true));
                    work.push(new Visit(a, false));
                    work.push(new Build(Build.OR, 2, null));
                    work.push(new Visit(b, false));
                    work.push(new Visit(a, true));
                } else { // (nnf(a) or nnf(b)) and (nnf(not a) or nnf(not b))
                    work.push(new Build(Build.OR, 2, null));
                    work.push(new Visit(b, true));
                    work.push(new Visit(a, true));
                    work.push(new Build(Build.OR, 2, null));
                    work.push(new Visit(b, false));
                    work.push(new Visit(a, false));
                }
            } else if (f instanceof Formula.Quantified q) {
                boolean universal = q.universal() != neg;
                work.push(new Build(universal ? Build.FORALL : Build.EXISTS, 1, q.variable()));
                work.push(new Visit(q.body(), neg));
            }
        }
        return results.get(0);
    }

    /** Largest negation normal form the kernel builds, in nodes; nested {@code iff} doubles its operands. */
    public static final long NNF_LIMIT = 5_000_000;

    /**
     * The number of nodes of {@code nnf(root)} (index 0) and of {@code nnf(not root)} (index 1), computed without
     * building either, saturating at Long.MAX_VALUE, so a rule can refuse a premise whose normal form is too large.
     */
    public static long[] nnfSize(Formula root) {
        java.util.IdentityHashMap<Formula, long[]> memo = new java.util.IdentityHashMap<>();
        ArrayDeque<Formula> stack = new ArrayDeque<>();
        stack.push(root);
        while (!stack.isEmpty()) {
            Formula f = stack.peek();
            if (memo.containsKey(f)) {
                stack.pop();
                continue;
            }
            List<Formula> kids = f instanceof Formula.Junction j ? flatParts(j) : children(f);
            boolean ready = true;
            for (Formula k : kids) {
                if (!memo.containsKey(k)) {
                    stack.push(k);
                    ready = false;
                }
            }
            if (!ready) continue;
            stack.pop();
            long pos;
            long neg;
            if (f instanceof Formula.Not n) {
                long[] b = memo.get(n.body());
                pos = b[1];
                neg = b[0];
            } else if (f instanceof Formula.Junction) {
                pos = 1;
                neg = 1;
                for (Formula k : kids) {
                    pos = add(pos, memo.get(k)[0]);
                    neg = add(neg, memo.get(k)[1]);
                }
            } else if (f instanceof Formula.Implies i) {
                long[] a = memo.get(i.left());
                long[] b = memo.get(i.right());
                pos = add(1, add(a[1], b[0]));
                neg = add(1, add(a[0], b[1]));
            } else if (f instanceof Formula.Iff i) {
                long[] a = memo.get(i.left());
                long[] b = memo.get(i.right());
                pos = add(3, add(add(a[0], a[1]), add(b[0], b[1])));
                neg = pos;
            } else if (f instanceof Formula.Quantified q) {
                long[] b = memo.get(q.body());
                pos = add(1, b[0]);
                neg = add(1, b[1]);
            } else {
                pos = 1;
                neg = 1;
            }
            memo.put(f, new long[] {pos, neg});
        }
        return memo.get(root);
    }

    private static long add(long x, long y) {
        long r = x + y;
        return r < 0 ? Long.MAX_VALUE : r;
    }

    private static Formula build(Build b, ArrayList<Formula> results) {
        int from = results.size() - b.count;
        List<Formula> parts = new ArrayList<>(results.subList(from, results.size()));
        results.subList(from, results.size()).clear();
        switch (b.kind) {
            case Build.FORALL:
                return new Formula.Quantified(true, b.variable, parts.get(0));
            case Build.EXISTS:
                return new Formula.Quantified(false, b.variable, parts.get(0));
            default:
                return junction(b.kind == Build.AND, parts);
        }
    }

    /**
     * The parts of the largest tree of junctions of one kind rooted at {@code j}, left to right: a left-nested chain
     * of n binary {@code or}s gives its n+1 operands in linear time.
     */
    static List<Formula> flatParts(Formula.Junction j) {
        boolean and = j instanceof Formula.And;
        List<Formula> out = new ArrayList<>();
        ArrayDeque<Formula> stack = new ArrayDeque<>();
        stack.push(j);
        while (!stack.isEmpty()) {
            Formula f = stack.pop();
            if (f instanceof Formula.Junction k && (k instanceof Formula.And) == and) {
                for (int i = k.parts().size() - 1; i >= 0; i--) stack.push(k.parts().get(i));
            } else {
                out.add(f);
            }
        }
        return out;
    }

    /** An and/or of {@code parts} with nested ones of the same kind spliced in; one part stands alone. */
    public static Formula junction(boolean and, List<Formula> parts) {
        List<Formula> flat = new ArrayList<>(parts.size());
        for (Formula p : parts) {
            if (and && p instanceof Formula.And a) flat.addAll(a.parts());
            else if (!and && p instanceof Formula.Or o) flat.addAll(o.parts());
            else flat.add(p);
        }
        if (flat.size() == 1) return flat.get(0);
        return and ? new Formula.And(flat) : new Formula.Or(flat);
    }

    /**
     * The same formula with nested junctions of one kind flattened and {@code not} of an atom or constant folded into
     * it; everything else is kept.
     */
    static Formula normalizeJunctions(Formula root) {
        ArrayDeque<Object> work = new ArrayDeque<>();
        ArrayList<Formula> results = new ArrayList<>();
        work.push(root);
        while (!work.isEmpty()) {
            Object item = work.pop();
            if (item instanceof Rebuild r) {
                Formula f = r.formula();
                if (f instanceof Formula.Quantified q) {
                    results.add(new Formula.Quantified(q.universal(), q.variable(), results.remove(results.size() - 1)));
                } else if (f instanceof Formula.Not) {
                    Formula body = results.remove(results.size() - 1);
                    if (body instanceof Formula.Atomic a && a.literal().positive()) {
                        results.add(new Formula.Atomic(a.literal().negated()));
                    } else {
                        results.add(new Formula.Not(body));
                    }
                } else if (f instanceof Formula.Junction j) {
                    int n = flatParts(j).size();
                    List<Formula> parts = new ArrayList<>(results.subList(results.size() - n, results.size()));
                    results.subList(results.size() - n, results.size()).clear();
                    results.add(junction(j instanceof Formula.And, parts));
                } else {
                    Formula right = results.remove(results.size() - 1);
                    Formula left = results.remove(results.size() - 1);
                    results.add(f instanceof Formula.Implies ? new Formula.Implies(left, right) : new Formula.Iff(left, right));
                }
                continue;
            }
            Formula f = (Formula) item;
            List<Formula> cs = f instanceof Formula.Junction j ? flatParts(j) : children(f);
            if (cs.isEmpty()) {
                results.add(f);
                continue;
            }
            work.push(new Rebuild(f, null));
            for (int i = cs.size() - 1; i >= 0; i--) work.push(cs.get(i));
        }
        return results.get(0);
    }

    // ---------------------------------------------------------------- comparison

    /**
     * Canonical numbering of formulas modulo renaming of bound variables (bound variables become de Bruijn indices),
     * associativity and commutativity of and/or (nested junctions are flattened and their parts sorted), and equation
     * orientation; {@code not} applied to a positive atom is the negative literal, which prints the same. Two formulas are equivalent in this sense exactly
     * when they get the same number from one instance. Cost: O(n log n) in the size of the formulas.
     */
    public static final class Canon {
        private static final int ATOM = 1, CONST = 2, NOT = 3, AND = 4, OR = 5, IMPLIES = 6, IFF = 7, QUANT = 8;
        private static final int APP = 9, BOUND = 10, FREE = 11;

        private record Key(int[] data) {
            @Override
            public boolean equals(Object o) {
                return o instanceof Key k && Arrays.equals(k.data, data);
            }

            @Override
            public int hashCode() {
                return Arrays.hashCode(data);
            }
        }

        private final Map<Key, Integer> table = new HashMap<>();
        private final List<int[]> byId = new ArrayList<>();
        private final Map<Symbol, Integer> symbols = new HashMap<>();
        private final Map<Variable, Integer> names = new HashMap<>();

        private int intern(int... data) {
            Key k = new Key(data);
            Integer id = table.get(k);
            if (id != null) return id;
            int fresh = byId.size();
            byId.add(data);
            table.put(k, fresh);
            return fresh;
        }

        private int symbolId(Symbol s) {
            return symbols.computeIfAbsent(s, x -> symbols.size());
        }

        private int nameId(Variable v) {
            return names.computeIfAbsent(v, x -> names.size());
        }

        private record Exit(Formula formula, int count) {
            Exit(Formula formula) {
                this(formula, 0);
            }
        }

        /** The canonical number of {@code root}; free variables are kept by name. */
        public int of(Formula root) {
            Map<Variable, ArrayDeque<Integer>> binders = new HashMap<>();
            int[] depth = {0};
            ArrayDeque<Object> work = new ArrayDeque<>();
            ArrayList<Integer> results = new ArrayList<>();
            work.push(root);
            while (!work.isEmpty()) {
                Object item = work.pop();
                if (item instanceof Exit e) {
                    Formula f = e.formula;
                    if (f instanceof Formula.Quantified q) {
                        int body = results.remove(results.size() - 1);
                        binders.get(q.variable()).pop();
                        depth[0]--;
                        results.add(intern(QUANT, q.universal() ? 1 : 0, body));
                    } else if (f instanceof Formula.Not) {
                        int body = results.remove(results.size() - 1);
                        results.add(negate(body));
                    } else if (f instanceof Formula.Junction j) {
                        int tag = j instanceof Formula.And ? AND : OR;
                        int n = e.count;
                        List<Integer> parts = results.subList(results.size() - n, results.size());
                        ArrayList<Integer> flat = new ArrayList<>();
                        for (int p : parts) {
                            int[] d = byId.get(p);
                            if (d[0] == tag) for (int i = 1; i < d.length; i++) flat.add(d[i]);
                            else flat.add(p);
                        }
                        parts.clear();
                        int[] data = new int[flat.size() + 1];
                        data[0] = tag;
                        int[] sorted = flat.stream().mapToInt(Integer::intValue).sorted().toArray();
                        System.arraycopy(sorted, 0, data, 1, sorted.length);
                        results.add(intern(data));
                    } else if (f instanceof Formula.Implies || f instanceof Formula.Iff) {
                        int r = results.remove(results.size() - 1);
                        int l = results.remove(results.size() - 1);
                        results.add(intern(f instanceof Formula.Implies ? IMPLIES : IFF, l, r));
                    }
                    continue;
                }
                Formula f = (Formula) item;
                if (f instanceof Formula.Atomic a) {
                    results.add(atom(a.literal(), binders, depth[0]));
                } else if (f instanceof Formula.Constant c) {
                    results.add(intern(CONST, c.value() ? 1 : 0));
                } else if (f instanceof Formula.Quantified q) {
                    depth[0]++;
                    binders.computeIfAbsent(q.variable(), x -> new ArrayDeque<>()).push(depth[0]);
                    work.push(new Exit(f));
                    work.push(q.body());
                } else if (f instanceof Formula.Not n) {
                    work.push(new Exit(f));
                    work.push(n.body());
                } else if (f instanceof Formula.Junction j) {
                    List<Formula> parts = flatParts(j);
                    work.push(new Exit(f, parts.size()));
                    for (int i = parts.size() - 1; i >= 0; i--) work.push(parts.get(i));
                } else if (f instanceof Formula.Implies imp) {
                    work.push(new Exit(f));
                    work.push(imp.right());
                    work.push(imp.left());
                } else if (f instanceof Formula.Iff iff) {
                    work.push(new Exit(f));
                    work.push(iff.right());
                    work.push(iff.left());
                }
            }
            return results.get(0);
        }

        /** {@code not A} for a positive atom A is the negative literal; everything else keeps its {@code not}. */
        private int negate(int body) {
            int[] d = byId.get(body);
            if (d[0] == ATOM && d[1] == 1) return intern(ATOM, 0, d[2]);
            return intern(NOT, body);
        }

        private int atom(Literal l, Map<Variable, ArrayDeque<Integer>> binders, int depth) {
            Application a = l.atom();
            int sign = l.positive() ? 1 : 0;
            Map<Term, Integer> memo = new HashMap<>();
            if (a.isEquation()) {
                int x = term(a.argument(0), binders, depth, memo);
                int y = term(a.argument(1), binders, depth, memo);
                return intern(ATOM, sign, intern(APP, symbolId(Symbol.EQUALITY), Math.min(x, y), Math.max(x, y)));
            }
            return intern(ATOM, sign, term(a, binders, depth, memo));
        }

        private int term(Term root, Map<Variable, ArrayDeque<Integer>> binders, int depth, Map<Term, Integer> memo) {
            return Terms.fold(root, memo, t -> {
                if (!(t instanceof Variable v)) return null;
                ArrayDeque<Integer> b = binders.get(v);
                return b == null || b.isEmpty() ? intern(FREE, nameId(v)) : intern(BOUND, depth - b.peek());
            }, (a, args) -> {
                int[] data = new int[args.size() + 2];
                data[0] = APP;
                data[1] = symbolId(a.symbol());
                for (int i = 0; i < args.size(); i++) data[i + 2] = args.get(i);
                return intern(data);
            });
        }
    }

    /** Equal modulo renaming of bound variables, associativity and commutativity of and/or, and orientation. */
    public static boolean equivalent(Formula a, Formula b) {
        Canon c = new Canon();
        return c.of(a) == c.of(b);
    }

    // ---------------------------------------------------------------- walks

    /** Calls {@code visitor} on every subformula, parents first. */
    static void forEach(Formula root, java.util.function.Consumer<Formula> visitor) {
        ArrayDeque<Formula> stack = new ArrayDeque<>();
        stack.push(root);
        while (!stack.isEmpty()) {
            Formula f = stack.pop();
            visitor.accept(f);
            for (Formula c : children(f)) stack.push(c);
        }
    }

    static List<Formula> children(Formula f) {
        if (f instanceof Formula.Not n) return List.of(n.body());
        if (f instanceof Formula.Junction j) return j.parts();
        if (f instanceof Formula.Implies i) return List.of(i.left(), i.right());
        if (f instanceof Formula.Iff i) return List.of(i.left(), i.right());
        if (f instanceof Formula.Quantified q) return List.of(q.body());
        return List.of();
    }

    private record Leave(Variable variable) {
    }

    /** The variables that occur free, in order of first occurrence. */
    public static Set<Variable> freeVariables(Formula root) {
        Set<Variable> free = new LinkedHashSet<>();
        Map<Variable, Integer> bound = new HashMap<>();
        ArrayDeque<Object> work = new ArrayDeque<>();
        work.push(root);
        while (!work.isEmpty()) {
            Object item = work.pop();
            if (item instanceof Leave l) {
                bound.merge(l.variable, -1, Integer::sum);
                continue;
            }
            Formula f = (Formula) item;
            if (f instanceof Formula.Atomic a) {
                Set<Variable> vs = new LinkedHashSet<>();
                Terms.collectVariables(a.literal().atom(), vs);
                for (Variable v : vs) if (bound.getOrDefault(v, 0) == 0) free.add(v);
            } else if (f instanceof Formula.Quantified q) {
                bound.merge(q.variable(), 1, Integer::sum);
                work.push(new Leave(q.variable()));
                work.push(q.body());
            } else {
                List<Formula> cs = children(f);
                for (int i = cs.size() - 1; i >= 0; i--) work.push(cs.get(i));
            }
        }
        return free;
    }

    /** Every symbol occurring in the formula. */
    static Set<Symbol> symbols(Formula root) {
        Set<Symbol> out = new LinkedHashSet<>();
        forEach(root, f -> {
            if (f instanceof Formula.Atomic a) collectSymbols(a.literal().atom(), out);
        });
        return out;
    }

    /** Adds every symbol of {@code t} except equality. */
    static void collectSymbols(Term t, Set<Symbol> into) {
        Terms.forEachSubterm(t, s -> {
            if (s instanceof Application a && !a.isEquation()) into.add(a.symbol());
        });
    }

    private record Rebuild(Formula formula, Variable unbind) {
    }

    /**
     * Rebuilds {@code root} with {@code substitution} applied to its free variables and every bound variable renamed
     * to a fresh one, so that no term of the substitution can be captured. {@code atoms}, when not null, may replace
     * a literal (after substitution) by a formula; returning null keeps the literal.
     */
    static Formula substitute(Formula root, TermFactory terms, Map<Variable, Term> substitution,
                              java.util.function.Function<Literal, Formula> atoms) {
        Map<Variable, ArrayDeque<Term>> env = new HashMap<>();
        for (Map.Entry<Variable, Term> e : substitution.entrySet()) {
            env.computeIfAbsent(e.getKey(), k -> new ArrayDeque<>()).push(e.getValue());
        }
        ArrayDeque<Object> work = new ArrayDeque<>();
        ArrayList<Formula> results = new ArrayList<>();
        work.push(root);
        while (!work.isEmpty()) {
            Object item = work.pop();
            if (item instanceof Rebuild r) {
                Formula f = r.formula;
                if (f instanceof Formula.Quantified q) {
                    Formula body = results.remove(results.size() - 1);
                    Variable fresh = (Variable) env.get(q.variable()).pop();
                    results.add(new Formula.Quantified(q.universal(), fresh, body));
                } else if (f instanceof Formula.Not) {
                    results.add(new Formula.Not(results.remove(results.size() - 1)));
                } else if (f instanceof Formula.Junction j) {
                    int n = j.parts().size();
                    List<Formula> parts = new ArrayList<>(results.subList(results.size() - n, results.size()));
                    results.subList(results.size() - n, results.size()).clear();
                    results.add(j instanceof Formula.And ? new Formula.And(parts) : new Formula.Or(parts));
                } else {
                    Formula right = results.remove(results.size() - 1);
                    Formula left = results.remove(results.size() - 1);
                    results.add(f instanceof Formula.Implies ? new Formula.Implies(left, right) : new Formula.Iff(left, right));
                }
                continue;
            }
            Formula f = (Formula) item;
            if (f instanceof Formula.Atomic a) {
                Map<Variable, Term> current = new HashMap<>();
                Set<Variable> vs = new LinkedHashSet<>();
                Terms.collectVariables(a.literal().atom(), vs);
                for (Variable v : vs) {
                    ArrayDeque<Term> d = env.get(v);
                    if (d != null && !d.isEmpty()) current.put(v, d.peek());
                }
                Literal l = new Substitution(terms, current).apply(a.literal());
                Formula replaced = atoms == null ? null : atoms.apply(l);
                results.add(replaced != null ? replaced : l == a.literal() ? a : new Formula.Atomic(l));
            } else if (f instanceof Formula.Constant) {
                results.add(f);
            } else if (f instanceof Formula.Quantified q) {
                env.computeIfAbsent(q.variable(), k -> new ArrayDeque<>()).push(terms.freshVariable(q.variable().name()));
                work.push(new Rebuild(f, q.variable()));
                work.push(q.body());
            } else {
                work.push(new Rebuild(f, null));
                List<Formula> cs = children(f);
                for (int i = cs.size() - 1; i >= 0; i--) work.push(cs.get(i));
            }
        }
        return results.get(0);
    }

    /** The number of nodes, for limits and reports. */
    public static long size(Formula root) {
        long[] n = {0};
        forEach(root, f -> n[0]++);
        return n[0];
    }
}
