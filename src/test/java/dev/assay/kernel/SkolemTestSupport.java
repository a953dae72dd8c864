package dev.assay.kernel;

import java.util.ArrayList;
import java.util.Collection;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;

/**
 * Test-only semantics for the Skolemization and definition tests: finite structures, an evaluator written
 * independently of the kernel, and a search for interpretations of fresh symbols.
 *
 * <p>A structure has the domain {0, …, n-1}; a function symbol of arity k is a table of n^k values, a predicate a
 * table of n^k truth values. Symbols listed as lazy start with every entry unassigned; {@link Eval#sat} then looks for
 * values of those entries that make a formula true, assigning an entry only when the evaluation needs it and undoing
 * it on backtracking. So "every model of the premise extends to a model of the conclusion" is checked by running
 * {@code sat} on the conclusion over each model of the premise, the fresh symbols lazy.
 *
 * <p>Recursive on purpose: the formulas here are a few nodes deep.
 */
final class SkolemTestSupport {

    private SkolemTestSupport() {
    }

    // ================================================================ structures

    static final class Structure {
        final int n;
        final Map<Symbol, int[]> tables;
        final Set<Symbol> lazy = new LinkedHashSet<>();
        int assigned;

        Structure(int n, Map<Symbol, int[]> tables) {
            this.n = n;
            this.tables = tables;
        }

        /** A copy with every symbol of {@code fresh} that has no table yet added as lazy and unassigned. */
        Structure extendedWith(Collection<Symbol> fresh) {
            // The model's own tables are shared: evaluation writes to the lazy tables only.
            Map<Symbol, int[]> copy = new HashMap<>(tables);
            Structure s = new Structure(n, copy);
            for (Symbol f : fresh) {
                if (copy.containsKey(f)) continue; // a symbol the model interprets already keeps its meaning
                int[] t = new int[power(n, f.arity())];
                java.util.Arrays.fill(t, -1);
                copy.put(f, t);
                s.lazy.add(f);
            }
            return s;
        }

        @Override
        public String toString() {
            StringBuilder sb = new StringBuilder("n=" + n);
            for (Map.Entry<Symbol, int[]> e : tables.entrySet()) {
                sb.append(' ').append(e.getKey()).append(java.util.Arrays.toString(e.getValue()));
            }
            return sb.toString();
        }
    }

    static int power(int n, int k) {
        int p = 1;
        for (int i = 0; i < k; i++) p *= n;
        return p;
    }

    /** A binding of a variable to a domain element; a persistent list, innermost first. */
    record Env(Variable variable, int value, Env next) {
        static int lookup(Env e, Variable v) {
            for (Env x = e; x != null; x = x.next) if (x.variable == v) return x.value;
            throw new IllegalStateException("unbound variable " + v);
        }
    }

    interface Cont {
        boolean run();
    }

    interface IntCont {
        boolean run(int value);
    }

    interface Goal {
        boolean run(Cont k);
    }

    /** Evaluation in one structure. */
    static final class Eval {
        final Structure s;
        private final Map<Formula, Boolean> mentionsLazy;

        Eval(Structure s) {
            this(s, new IdentityHashMap<>());
        }

        /** With a cache of which subformulas mention a lazy symbol, shared by structures with the same lazy symbols. */
        Eval(Structure s, Map<Formula, Boolean> mentionsLazy) {
            this.s = s;
            this.mentionsLazy = mentionsLazy;
        }

        // ---------------------------------------------------------------- plain evaluation (no lazy symbol)

        int term(Term t, Env env) {
            if (t instanceof Variable v) return Env.lookup(env, v);
            Application a = (Application) t;
            int[] table = s.tables.get(a.symbol());
            if (table == null) throw new IllegalStateException("no table for " + a.symbol());
            int idx = 0;
            for (int i = a.arity() - 1; i >= 0; i--) idx = idx * s.n + term(a.argument(i), env);
            int v = table[idx];
            if (v < 0) throw new IllegalStateException("unassigned " + a.symbol());
            return v;
        }

        boolean atom(Application a, Env env) {
            if (a.isEquation()) return term(a.argument(0), env) == term(a.argument(1), env);
            return term(a, env) == 1;
        }

        /** Whether f is true (pos) or false (not pos) under env; no lazy symbol may occur in f. */
        boolean plain(Formula f, boolean pos, Env env) {
            if (f instanceof Formula.Atomic at) {
                boolean truth = atom(at.literal().atom(), env) == at.literal().positive();
                return truth == pos;
            }
            if (f instanceof Formula.Constant c) return c.value() == pos;
            if (f instanceof Formula.Not n) return plain(n.body(), !pos, env);
            if (f instanceof Formula.Junction j) {
                boolean all = (j instanceof Formula.And) == pos;
                for (Formula p : j.parts()) {
                    boolean v = plain(p, pos, env);
                    if (all && !v) return false;
                    if (!all && v) return true;
                }
                return all;
            }
            if (f instanceof Formula.Implies i) {
                return pos ? plain(i.left(), false, env) || plain(i.right(), true, env)
                        : plain(i.left(), true, env) && plain(i.right(), false, env);
            }
            if (f instanceof Formula.Iff i) {
                boolean same = plain(i.left(), true, env) == plain(i.right(), true, env);
                return same == pos;
            }
            Formula.Quantified q = (Formula.Quantified) f;
            boolean all = q.universal() == pos;
            for (int d = 0; d < s.n; d++) {
                boolean v = plain(q.body(), pos, new Env(q.variable(), d, env));
                if (all && !v) return false;
                if (!all && v) return true;
            }
            return all;
        }

        // ---------------------------------------------------------------- search over the lazy entries

        private boolean lazyIn(Formula f) {
            Boolean known = mentionsLazy.get(f);
            if (known != null) return known;
            boolean r;
            if (f instanceof Formula.Atomic at) {
                Set<Symbol> syms = new LinkedHashSet<>();
                Formulas.collectSymbols(at.literal().atom(), syms);
                if (!at.literal().atom().isEquation()) syms.add(at.literal().atom().symbol());
                r = false;
                for (Symbol x : syms) r |= s.lazy.contains(x);
            } else {
                r = false;
                for (Formula c : Formulas.children(f)) r |= lazyIn(c);
            }
            mentionsLazy.put(f, r);
            return r;
        }

        /**
         * Whether some values of still unassigned lazy entries make f true (pos) or false (not pos) under env and then
         * k succeed. On false every entry assigned on the way is unassigned again; on true the assignment stays.
         */
        boolean sat(Formula f, boolean pos, Env env, Cont k) {
            if (!lazyIn(f)) return plain(f, pos, env) && k.run();
            if (f instanceof Formula.Atomic at) {
                Literal l = at.literal();
                return atomLazy(l.atom(), env, truth -> ((truth == 1) == l.positive()) == pos && k.run());
            }
            if (f instanceof Formula.Not n) return sat(n.body(), !pos, env, k);
            if (f instanceof Formula.Junction j) {
                Goal[] gs = new Goal[j.parts().size()];
                for (int i = 0; i < gs.length; i++) {
                    Formula p = j.parts().get(i);
                    gs[i] = kk -> sat(p, pos, env, kk);
                }
                return (j instanceof Formula.And) == pos ? seq(gs, 0, k) : alt(gs, k);
            }
            if (f instanceof Formula.Implies i) {
                if (pos) return alt(new Goal[] {kk -> sat(i.left(), false, env, kk), kk -> sat(i.right(), true, env, kk)}, k);
                return seq(new Goal[] {kk -> sat(i.left(), true, env, kk), kk -> sat(i.right(), false, env, kk)}, 0, k);
            }
            if (f instanceof Formula.Iff i) {
                Goal both = kk -> seq(new Goal[] {k2 -> sat(i.left(), true, env, k2), k2 -> sat(i.right(), pos, env, k2)}, 0, kk);
                Goal neither = kk -> seq(new Goal[] {k2 -> sat(i.left(), false, env, k2), k2 -> sat(i.right(), !pos, env, k2)}, 0, kk);
                return alt(new Goal[] {both, neither}, k);
            }
            Formula.Quantified q = (Formula.Quantified) f;
            Goal[] gs = new Goal[s.n];
            for (int d = 0; d < s.n; d++) {
                Env e = new Env(q.variable(), d, env);
                gs[d] = kk -> sat(q.body(), pos, e, kk);
            }
            return q.universal() == pos ? seq(gs, 0, k) : alt(gs, k);
        }

        private boolean seq(Goal[] gs, int i, Cont k) {
            if (i == gs.length) return k.run();
            return gs[i].run(() -> seq(gs, i + 1, k));
        }

        /**
         * Tries the alternatives in turn. If the continuation fails while no entry has been assigned since this
         * choice, it fails for every alternative (they can only assign more), so the choice stops there.
         */
        private boolean alt(Goal[] gs, Cont k) {
            int base = s.assigned;
            boolean[] dead = {false};
            Cont guarded = () -> {
                if (dead[0]) return false;
                if (k.run()) return true;
                if (s.assigned == base) dead[0] = true;
                return false;
            };
            for (Goal g : gs) {
                if (g.run(guarded)) return true;
                if (dead[0]) return false;
            }
            return false;
        }

        private boolean termLazy(Term t, Env env, IntCont k) {
            if (t instanceof Variable v) return k.run(Env.lookup(env, v));
            Application a = (Application) t;
            int[] vals = new int[a.arity()];
            return args(a, 0, vals, env, () -> entry(a.symbol(), vals, k, s.n));
        }

        private boolean args(Application a, int i, int[] vals, Env env, Cont k) {
            if (i == a.arity()) return k.run();
            return termLazy(a.argument(i), env, v -> {
                vals[i] = v;
                return args(a, i + 1, vals, env, k);
            });
        }

        private boolean entry(Symbol symbol, int[] vals, IntCont k, int range) {
            int[] table = s.tables.get(symbol);
            if (table == null) throw new IllegalStateException("no table for " + symbol);
            int idx = 0;
            for (int i = vals.length - 1; i >= 0; i--) idx = idx * s.n + vals[i];
            if (table[idx] >= 0) return k.run(table[idx]);
            for (int d = 0; d < range; d++) {
                table[idx] = d;
                s.assigned++;
                if (k.run(d)) return true;
                table[idx] = -1;
                s.assigned--;
            }
            return false;
        }

        /** The truth value (0 or 1) of an atom, choosing lazy entries as needed. */
        private boolean atomLazy(Application a, Env env, IntCont k) {
            if (a.isEquation()) {
                return termLazy(a.argument(0), env, x -> termLazy(a.argument(1), env, y -> k.run(x == y ? 1 : 0)));
            }
            int[] vals = new int[a.arity()];
            return args(a, 0, vals, env, () -> entry(a.symbol(), vals, k, 2));
        }
    }

    // ================================================================ models

    /** The universal closure of f over its free variables. */
    static Formula closure(Formula f) {
        List<Variable> free = new ArrayList<>(Formulas.freeVariables(f));
        Formula out = f;
        for (int i = free.size() - 1; i >= 0; i--) out = new Formula.Quantified(true, free.get(i), out);
        return out;
    }

    /**
     * One structure per isomorphism class over the domains {0}, {0, 1}, …, {0, …, maxN-1} interpreting
     * {@code symbols} (truth and the existence of extensions are invariant under isomorphism, so this is
     * exhaustive), and of those the ones in which every formula of {@code premises} is true.
     */
    static List<Structure> models(List<Formula> premises, Collection<Symbol> symbols, int maxN) {
        List<Structure> out = new ArrayList<>();
        List<Symbol> syms = new ArrayList<>(symbols);
        for (int n = 1; n <= maxN; n++) {
            int[] sizes = new int[syms.size()];
            int total = 0;
            for (int i = 0; i < syms.size(); i++) {
                sizes[i] = power(n, syms.get(i).arity());
                total += sizes[i];
            }
            int[] radix = new int[total];
            int at = 0;
            for (int i = 0; i < syms.size(); i++) {
                int r = syms.get(i).kind() == Symbol.Kind.PREDICATE ? 2 : n;
                for (int j = 0; j < sizes[i]; j++) radix[at++] = r;
            }
            List<int[]> perms = permutations(n);
            int[] digits = new int[total];
            while (true) {
                if (canonical(digits, syms, sizes, n, perms)) {
                    Map<Symbol, int[]> tables = new LinkedHashMap<>();
                    int off = 0;
                    for (int i = 0; i < syms.size(); i++) {
                        tables.put(syms.get(i), java.util.Arrays.copyOfRange(digits, off, off + sizes[i]));
                        off += sizes[i];
                    }
                    Structure s = new Structure(n, tables);
                    Eval e = new Eval(s);
                    boolean all = true;
                    for (Formula p : premises) all &= e.plain(closure(p), true, null);
                    if (all) out.add(s);
                }
                int i = 0;
                while (i < total && ++digits[i] == radix[i]) digits[i++] = 0;
                if (i == total) break;
            }
        }
        return out;
    }

    private static List<int[]> permutations(int n) {
        List<int[]> out = new ArrayList<>();
        permute(new int[n], new boolean[n], 0, out);
        return out;
    }

    private static void permute(int[] p, boolean[] used, int i, List<int[]> out) {
        if (i == p.length) {
            out.add(p.clone());
            return;
        }
        for (int d = 0; d < p.length; d++) {
            if (used[d]) continue;
            used[d] = true;
            p[i] = d;
            permute(p, used, i + 1, out);
            used[d] = false;
        }
    }

    /** Whether no permutation of the domain maps the structure to a lexicographically smaller one. */
    private static boolean canonical(int[] digits, List<Symbol> syms, int[] sizes, int n, List<int[]> perms) {
        int[] image = new int[digits.length];
        for (int[] perm : perms) {
            int off = 0;
            for (int i = 0; i < syms.size(); i++) {
                Symbol s = syms.get(i);
                boolean function = s.kind() == Symbol.Kind.FUNCTION;
                for (int idx = 0; idx < sizes[i]; idx++) {
                    // the entry at argument tuple idx moves to the permuted tuple
                    int rest = idx;
                    int permuted = 0;
                    int place = 1;
                    for (int a = 0; a < s.arity(); a++) {
                        permuted += perm[rest % n] * place;
                        rest /= n;
                        place *= n;
                    }
                    int v = digits[off + idx];
                    image[off + permuted] = function ? perm[v] : v;
                }
                off += sizes[i];
            }
            for (int i = digits.length - 1; i >= 0; i--) { // compare from the most significant digit
                if (image[i] < digits[i]) return false;
                if (image[i] > digits[i]) break;
            }
        }
        return true;
    }

    /** Whether {@code m} has an interpretation of the symbols of {@code fresh} it lacks that makes every formula true. */
    static boolean extends_(Structure m, Collection<Symbol> fresh, List<Formula> conclusions) {
        return new Extension(fresh, conclusions).holdsIn(m);
    }

    /**
     * The question "can the fresh symbols be interpreted so that the conclusions hold?", asked of many models of one
     * premise (which all interpret the same symbols).
     */
    static final class Extension {
        final Collection<Symbol> fresh;
        final Formula goal;
        private final Map<Formula, Boolean> cache = new IdentityHashMap<>();

        Extension(Collection<Symbol> fresh, List<Formula> conclusions) {
            this.fresh = fresh;
            List<Formula> parts = new ArrayList<>();
            for (Formula c : conclusions) parts.add(closure(c));
            this.goal = parts.size() == 1 ? parts.get(0) : new Formula.And(parts);
        }

        boolean holdsIn(Structure m) {
            Eval ev = new Eval(m.extendedWith(fresh), cache);
            return ev.sat(goal, true, null, () -> true);
        }
    }

    // ================================================================ random formulas

    /** Random closed formulas over P/1, R/2, c/0 and equality, with variable names x, y, z reused (shadowing). */
    static final class RandomFormula {
        final TermFactory f;
        final Random random;
        final Symbol p = new Symbol("P", Symbol.Kind.PREDICATE, 1);
        final Symbol r = new Symbol("R", Symbol.Kind.PREDICATE, 2);
        final Symbol c = new Symbol("c", Symbol.Kind.FUNCTION, 0);
        private static final String[] ALL_NAMES = {"x", "y", "z", "w"};
        private static final String[] FEW_NAMES = {"x", "y"};
        private String[] names = ALL_NAMES;
        private int count;
        private int quantifiers;
        private int atoms;

        RandomFormula(TermFactory f, long seed) {
            this.f = f;
            this.random = new Random(seed);
        }

        List<Symbol> signature() {
            return List.of(p, r, c);
        }

        /**
         * At most four quantifiers and five atoms. Most formulas start with a prefix of alternating quantifiers
         * (∀∃∀…), so that existentials depend on universals and on one another; names are mostly new, sometimes
         * reused (shadowing).
         */
        Formula next() {
            quantifiers = 0;
            atoms = 0;
            // Every third formula uses two names only, so that binders shadow one another often.
            names = count++ % 3 == 2 ? FEW_NAMES : ALL_NAMES;
            List<String> scope = new ArrayList<>();
            if (random.nextInt(10) < 3) return gen(3, scope);
            int prefix = 1 + random.nextInt(3);
            boolean universal = random.nextInt(10) < 7;
            return prefix(prefix, universal, scope);
        }

        private Formula prefix(int left, boolean universal, List<String> scope) {
            if (left == 0) return gen(2 + random.nextInt(2), scope);
            quantifiers++;
            String name = name(scope);
            scope.add(name);
            Formula body = prefix(left - 1, !universal, scope);
            scope.remove(scope.size() - 1);
            return new Formula.Quantified(universal, f.variable(name), body);
        }

        private String name(List<String> scope) {
            List<String> unused = new ArrayList<>();
            for (String n : names) if (!scope.contains(n)) unused.add(n);
            if (!unused.isEmpty() && (scope.isEmpty() || random.nextInt(4) != 0)) return unused.get(random.nextInt(unused.size()));
            return names[random.nextInt(names.length)];
        }

        private Formula gen(int depth, List<String> scope) {
            if (depth <= 0 || atoms >= 4) return atom(scope);
            int choice = random.nextInt(100);
            if (choice < 35 && quantifiers < 4) return quantified(depth, scope);
            if (choice < 65) {
                List<Formula> parts = List.of(gen(depth - 1, scope), gen(depth - 1, scope));
                return random.nextBoolean() ? new Formula.And(parts) : new Formula.Or(parts);
            }
            if (choice < 73) return new Formula.Not(gen(depth - 1, scope));
            if (choice < 83) return new Formula.Implies(gen(depth - 1, scope), gen(depth - 1, scope));
            if (choice < 88) return new Formula.Iff(gen(depth - 1, scope), gen(depth - 1, scope));
            return atom(scope);
        }

        private Formula quantified(int depth, List<String> scope) {
            quantifiers++;
            String name = name(scope);
            boolean universal = random.nextInt(100) < 50;
            scope.add(name);
            Formula body = gen(depth - 1, scope);
            scope.remove(scope.size() - 1);
            return new Formula.Quantified(universal, f.variable(name), body);
        }

        private Term term(List<String> scope, Term avoid) {
            if (scope.isEmpty() || random.nextInt(10) == 0) return f.application(c);
            for (int tries = 0; tries < 3; tries++) {
                // prefer the innermost names, so that bodies use their variables
                int i = scope.size() - 1 - Math.min(random.nextInt(3), scope.size() - 1);
                if (random.nextInt(3) == 0) i = random.nextInt(scope.size());
                Term t = f.variable(scope.get(i));
                if (t != avoid) return t;
            }
            return f.variable(scope.get(random.nextInt(scope.size())));
        }

        private Formula atom(List<String> scope) {
            atoms++;
            int choice = random.nextInt(10);
            Application a;
            if (choice < 4) {
                a = f.application(p, term(scope, null));
            } else {
                Term first = term(scope, null);
                Term second = term(scope, first);
                a = choice < 9 ? f.application(r, first, second) : f.equation(first, second);
            }
            return new Formula.Atomic(new Literal(random.nextInt(4) != 0, a));
        }
    }

    // ================================================================ candidates

    enum Expect { ACCEPT, REJECT, EITHER }

    /** A candidate step: its kind, what the specification says of it, the fresh symbols and the conclusion. */
    record Candidate(String kind, Expect expect, List<Symbol> fresh, Formula stated) {
        @Override
        public String toString() {
            List<String> names = new ArrayList<>();
            for (Symbol s : fresh) names.add(s.toString());
            return kind + " (" + expect + ") fresh " + names + ": " + Printer.formula(stated);
        }
    }

    /**
     * Writes nnf(premise) with existentials replaced by Skolem terms, independently of {@link Skolemization}, with
     * options that make it correct or wrong in one chosen way.
     */
    static final class SkolemWriter {
        enum Binding { UNIVERSAL, KEPT, REPLACED }

        static final class Binder {
            final String name;
            final Binding kind;
            final Variable out;
            final int id;
            List<Binder> args = List.of();
            Term extraArg;
            Symbol symbol;
            Term skolem;

            Binder(String name, Binding kind, Variable out, int id) {
                this.name = name;
                this.kind = kind;
                this.out = out;
                this.id = id;
            }
        }

        /** What one run found about the existential of a given pre-order index. */
        record Existential(int index, boolean replaced, int args, int needed, boolean occurs, boolean dependsOnExistential,
                           boolean hasInnerUniversal) {
        }

        final TermFactory f;
        final Formula n;
        // options
        boolean renamed = true;
        boolean full;
        boolean reverse;
        java.util.function.IntPredicate keep = i -> false;
        int dropNeededOf = -1;
        Map<Integer, Integer> reuse = Map.of();
        int nonFreshOf = -1;
        Symbol problemConstant;
        int universalToReplace = -1;
        int innerArgOf = -1;
        int forceReplace = -1;
        boolean forcedTakesKept;
        int strayOf = -1;
        /** Gives the first universal inside this existential the name of the Skolem term's first argument. */
        int captureOf = -1;
        private Formula.Quantified renameNode;
        private Variable renameTo;
        // results
        final LinkedHashSet<Symbol> fresh = new LinkedHashSet<>();
        final List<Existential> existentials = new ArrayList<>();
        boolean captured;
        /** Nodes of N that this run replaced (existentials, or the universal to replace). */
        final Set<Formula.Quantified> replacedNodes = java.util.Collections.newSetFromMap(new IdentityHashMap<>());
        private int exCounter;
        private int uniCounter;
        private int ids;
        private final Map<Formula.Quantified, Integer> preorder = new IdentityHashMap<>();

        SkolemWriter(TermFactory f, Formula n) {
            this.f = f;
            this.n = n;
            int[] i = {0};
            Formulas.forEach(n, x -> {
                if (x instanceof Formula.Quantified q) preorder.put(q, i[0]++);
            });
        }

        Formula write() {
            fresh.clear();
            existentials.clear();
            replacedNodes.clear();
            captured = false;
            renameNode = null;
            renameTo = null;
            exCounter = 0;
            uniCounter = 0;
            ids = 0;
            return walk(n, new ArrayList<>());
        }

        private Variable outName(Formula.Quantified q) {
            if (q == renameNode) return renameTo;
            return renamed ? f.variable("v" + preorder.get(q)) : q.variable();
        }

        private static Binder lookup(List<Binder> scope, String name) {
            for (int i = scope.size() - 1; i >= 0; i--) if (scope.get(i).name.equals(name)) return scope.get(i);
            return null;
        }

        private Formula walk(Formula g, List<Binder> scope) {
            if (g instanceof Formula.Atomic a) {
                Literal l = a.literal();
                return new Formula.Atomic(new Literal(l.positive(), (Application) term(l.atom(), scope)));
            }
            if (g instanceof Formula.Constant) return g;
            if (g instanceof Formula.Junction j) {
                List<Formula> parts = new ArrayList<>();
                for (Formula p : j.parts()) parts.add(walk(p, scope));
                return j instanceof Formula.And ? new Formula.And(parts) : new Formula.Or(parts);
            }
            if (!(g instanceof Formula.Quantified q)) throw new IllegalArgumentException("not in nnf: " + g);
            if (q.universal()) {
                int index = uniCounter++;
                if (index == universalToReplace) return replace(q, scope, -1);
                Binder b = new Binder(q.variable().name(), Binding.UNIVERSAL, outName(q), ids++);
                scope.add(b);
                Formula body = walk(q.body(), scope);
                scope.remove(scope.size() - 1);
                return new Formula.Quantified(true, b.out, body);
            }
            int index = exCounter++;
            // Which binders the existential depends on: universals free in it, the arguments of replaced ones.
            boolean dependsOnKept = false;
            boolean dependsOnExistential = false;
            for (Variable v : Formulas.freeVariables(q)) {
                Binder b = lookup(scope, v.name());
                if (b == null) continue;
                if (b.kind == Binding.KEPT) dependsOnKept = true;
                if (b.kind != Binding.UNIVERSAL) dependsOnExistential = true;
            }
            boolean keepIt = (dependsOnKept && index != forceReplace) || keep.test(index);
            if (keepIt) {
                Binder b = new Binder(q.variable().name(), Binding.KEPT, outName(q), ids++);
                existentials.add(new Existential(index, false, 0, 0, occurs(q), dependsOnExistential, innerUniversal(q) != null));
                scope.add(b);
                Formula body = walk(q.body(), scope);
                scope.remove(scope.size() - 1);
                return new Formula.Quantified(false, b.out, body);
            }
            return replace(q, scope, index);
        }

        /**
         * Whether some junction of N has, among the parts it would splice (existentials over a junction of its kind,
         * followed through fully replaced ones), both a fully replaced chain and one with a kept existential: the
         * "mixed splice" shape, which FORMAT.md accepts and the kernel's walk has to try specially (counted apart).
         */
        boolean mixedSplice() {
            for (Formula g : subformulas(n)) {
                if (!(g instanceof Formula.Junction j)) continue;
                boolean and = j instanceof Formula.And;
                boolean full = false;
                boolean partial = false;
                java.util.ArrayDeque<Formula> work = new java.util.ArrayDeque<>(j.parts());
                while (!work.isEmpty()) {
                    Formula p = work.pop();
                    if (!(p instanceof Formula.Quantified q) || q.universal()) continue;
                    boolean all = true;
                    Formula body = p;
                    while (body instanceof Formula.Quantified e && !e.universal()) {
                        all &= replacedNodes.contains(e);
                        body = e.body();
                    }
                    if (!(body instanceof Formula.Junction bj) || (bj instanceof Formula.And) != and) continue;
                    if (all) {
                        full = true;
                        work.addAll(bj.parts());
                    } else {
                        partial = true;
                    }
                }
                if (full && partial) return true;
            }
            return false;
        }

        private boolean occurs(Formula.Quantified q) {
            return Formulas.freeVariables(q.body()).contains(q.variable());
        }

        private Formula.Quantified innerUniversal(Formula.Quantified q) {
            Formula.Quantified[] found = {null};
            Formulas.forEach(q.body(), x -> {
                if (found[0] == null && x instanceof Formula.Quantified u && u.universal()) found[0] = u;
            });
            return found[0];
        }

        /** Replaces q (an existential of the given index, or the universal to replace when index is -1). */
        private Formula replace(Formula.Quantified q, List<Binder> scope, int index) {
            List<Binder> needed = new ArrayList<>();
            boolean dependsOnExistential = false;
            for (Binder b : scope) {
                boolean need = false;
                for (Variable v : Formulas.freeVariables(q)) {
                    Binder w = lookup(scope, v.name());
                    if (w == null) continue;
                    if (w == b && b.kind != Binding.REPLACED) need = true;
                    if (w.kind == Binding.REPLACED && w.args.contains(b)) need = true;
                    if (w.kind != Binding.UNIVERSAL) dependsOnExistential = true;
                }
                if (need && (b.kind == Binding.UNIVERSAL || (forcedTakesKept && index == forceReplace))) needed.add(b);
            }
            List<Binder> args = new ArrayList<>();
            if (full) {
                for (Binder b : scope) if (b.kind == Binding.UNIVERSAL) args.add(b);
            } else {
                args.addAll(needed);
            }
            if (index >= 0 && index == dropNeededOf && !needed.isEmpty()) args.remove(needed.get(0));
            if (reverse) java.util.Collections.reverse(args);
            Binder b = new Binder(q.variable().name(), Binding.REPLACED, null, ids++);
            replacedNodes.add(q);
            b.args = args;
            Formula.Quantified inner = innerUniversal(q);
            if (index >= 0 && index == innerArgOf && inner != null) b.extraArg = outName(inner);
            if (index >= 0 && index == strayOf) b.extraArg = f.variable("u9");
            if (index >= 0 && index == captureOf && inner != null && !args.isEmpty()) {
                renameNode = inner;
                renameTo = args.get(0).out;
            }
            if (index >= 0) {
                existentials.add(new Existential(index, true, args.size(), needed.size(), occurs(q), dependsOnExistential,
                        inner != null));
                int symbolIndex = reuse.getOrDefault(index, index);
                if (index == nonFreshOf) b.symbol = problemConstant;
                else b.symbol = new Symbol("sk" + symbolIndex, Symbol.Kind.FUNCTION, args.size() + (b.extraArg != null ? 1 : 0));
            } else {
                b.symbol = new Symbol("su", Symbol.Kind.FUNCTION, args.size());
            }
            scope.add(b);
            Formula body = walk(q.body(), scope);
            scope.remove(scope.size() - 1);
            return body;
        }

        private Term term(Term t, List<Binder> scope) {
            if (t instanceof Variable v) {
                Binder b = lookup(scope, v.name());
                if (b == null) return v;
                if (b.kind != Binding.REPLACED) {
                    if (innermostWritten(scope, b.out.name()) != b) captured = true;
                    return b.out;
                }
                return skolemTerm(b, scope);
            }
            Application a = (Application) t;
            Term[] args = new Term[a.arity()];
            for (int i = 0; i < args.length; i++) args[i] = term(a.argument(i), scope);
            return f.application(a.symbol(), args);
        }

        /** The innermost binder of the written conclusion (universal or kept) that binds this name here. */
        private static Binder innermostWritten(List<Binder> scope, String name) {
            for (int i = scope.size() - 1; i >= 0; i--) {
                Binder x = scope.get(i);
                if (x.kind != Binding.REPLACED && x.out.name().equals(name)) return x;
            }
            return null;
        }

        private Term skolemTerm(Binder b, List<Binder> scope) {
            // At this occurrence, an argument written by name must still denote the binder meant.
            for (Binder a : b.args) if (innermostWritten(scope, a.out.name()) != a) captured = true;
            if (b.skolem == null) {
                List<Term> args = new ArrayList<>();
                for (Binder a : b.args) args.add(a.out);
                if (b.extraArg != null) args.add(b.extraArg);
                b.skolem = f.application(b.symbol, args);
                fresh.add(b.symbol);
            }
            return b.skolem;
        }
    }

    /** The literal occurrence of the given pre-order index with its sign flipped. */
    static Formula flipLiteral(Formula g, int target) {
        int[] counter = {0};
        return flip(g, target, counter);
    }

    private static Formula flip(Formula g, int target, int[] counter) {
        if (g instanceof Formula.Atomic a) {
            return counter[0]++ == target ? new Formula.Atomic(a.literal().negated()) : a;
        }
        if (g instanceof Formula.Junction j) {
            List<Formula> parts = new ArrayList<>();
            for (Formula p : j.parts()) parts.add(flip(p, target, counter));
            return j instanceof Formula.And ? new Formula.And(parts) : new Formula.Or(parts);
        }
        if (g instanceof Formula.Quantified q) return new Formula.Quantified(q.universal(), q.variable(), flip(q.body(), target, counter));
        if (g instanceof Formula.Not n) return new Formula.Not(flip(n.body(), target, counter));
        if (g instanceof Formula.Implies i) return new Formula.Implies(flip(i.left(), target, counter), flip(i.right(), target, counter));
        if (g instanceof Formula.Iff i) return new Formula.Iff(flip(i.left(), target, counter), flip(i.right(), target, counter));
        return g;
    }

    static int literalCount(Formula g) {
        int[] n = {0};
        Formulas.forEach(g, x -> {
            if (x instanceof Formula.Atomic) n[0]++;
        });
        return n[0];
    }

    /** Every subformula, in pre-order. */
    static List<Formula> subformulas(Formula g) {
        List<Formula> out = new ArrayList<>();
        java.util.ArrayDeque<Formula> stack = new java.util.ArrayDeque<>();
        stack.push(g);
        while (!stack.isEmpty()) {
            Formula x = stack.pop();
            out.add(x);
            List<Formula> cs = Formulas.children(x);
            for (int i = cs.size() - 1; i >= 0; i--) stack.push(cs.get(i));
        }
        return out;
    }

    /** g with the node {@code target} (by identity) replaced by {@code replacement}. */
    static Formula replaceNode(Formula g, Formula target, Formula replacement) {
        if (g == target) return replacement;
        if (g instanceof Formula.Junction j) {
            List<Formula> parts = new ArrayList<>();
            for (Formula p : j.parts()) parts.add(replaceNode(p, target, replacement));
            return j instanceof Formula.And ? new Formula.And(parts) : new Formula.Or(parts);
        }
        if (g instanceof Formula.Quantified q) {
            return new Formula.Quantified(q.universal(), q.variable(), replaceNode(q.body(), target, replacement));
        }
        if (g instanceof Formula.Not n) return new Formula.Not(replaceNode(n.body(), target, replacement));
        if (g instanceof Formula.Implies i) {
            return new Formula.Implies(replaceNode(i.left(), target, replacement), replaceNode(i.right(), target, replacement));
        }
        if (g instanceof Formula.Iff i) {
            return new Formula.Iff(replaceNode(i.left(), target, replacement), replaceNode(i.right(), target, replacement));
        }
        return g;
    }

    /** The names of the binders (quantified variables) enclosing {@code target} in g, outermost first; null if absent. */
    static List<String> bindersAbove(Formula g, Formula target) {
        if (g == target) return new ArrayList<>();
        for (Formula c : Formulas.children(g)) {
            List<String> below = bindersAbove(c, target);
            if (below != null) {
                if (g instanceof Formula.Quantified q) below.add(0, q.variable().name());
                return below;
            }
        }
        return null;
    }

    /**
     * The body of q with the first occurrence of q's variable that q binds replaced by {@code with}; null when q's
     * variable does not occur in its body.
     */
    static Formula replaceFirstBoundOccurrence(TermFactory f, Formula.Quantified q, Variable with) {
        boolean[] done = {false};
        Formula body = replaceOccurrence(f, q.body(), q.variable(), with, done);
        return done[0] ? body : null;
    }

    private static Formula replaceOccurrence(TermFactory f, Formula g, Variable v, Variable with, boolean[] done) {
        if (done[0]) return g;
        if (g instanceof Formula.Atomic a) {
            Application atom = a.literal().atom();
            Term t = replaceInTerm(f, atom, v, with, done);
            return t == atom ? a : new Formula.Atomic(new Literal(a.literal().positive(), (Application) t));
        }
        if (g instanceof Formula.Quantified q) {
            if (q.variable() == v) return g; // rebound: occurrences below are not ours
            return new Formula.Quantified(q.universal(), q.variable(), replaceOccurrence(f, q.body(), v, with, done));
        }
        if (g instanceof Formula.Junction j) {
            List<Formula> parts = new ArrayList<>();
            for (Formula p : j.parts()) parts.add(replaceOccurrence(f, p, v, with, done));
            return j instanceof Formula.And ? new Formula.And(parts) : new Formula.Or(parts);
        }
        if (g instanceof Formula.Not n) return new Formula.Not(replaceOccurrence(f, n.body(), v, with, done));
        if (g instanceof Formula.Implies i) {
            Formula l = replaceOccurrence(f, i.left(), v, with, done);
            return new Formula.Implies(l, replaceOccurrence(f, i.right(), v, with, done));
        }
        if (g instanceof Formula.Iff i) {
            Formula l = replaceOccurrence(f, i.left(), v, with, done);
            return new Formula.Iff(l, replaceOccurrence(f, i.right(), v, with, done));
        }
        return g;
    }

    private static Term replaceInTerm(TermFactory f, Term t, Variable v, Variable with, boolean[] done) {
        if (done[0]) return t;
        if (t == v) {
            done[0] = true;
            return with;
        }
        if (t instanceof Application a && a.arity() > 0) {
            Term[] args = new Term[a.arity()];
            boolean changed = false;
            for (int i = 0; i < args.length; i++) {
                args[i] = replaceInTerm(f, a.argument(i), v, with, done);
                changed |= args[i] != a.argument(i);
            }
            return changed ? f.application(a.symbol(), args) : a;
        }
        return t;
    }

    /** {@code forall params. (Q(atomArgs) iff body)}. */
    static Formula definition(TermFactory f, Symbol q, List<Variable> params, List<? extends Term> atomArgs, Formula body,
                              boolean reversed) {
        Formula head = new Formula.Atomic(new Literal(true, f.application(q, atomArgs)));
        Formula out = reversed ? new Formula.Iff(body, head) : new Formula.Iff(head, body);
        for (int i = params.size() - 1; i >= 0; i--) out = new Formula.Quantified(true, params.get(i), out);
        return out;
    }

    /** Counts by key, printed in a fixed order. */
    static final class Tally {
        final Map<String, int[]> counts = new java.util.TreeMap<>();

        synchronized void add(String key) {
            counts.computeIfAbsent(key, x -> new int[1])[0]++;
        }

        synchronized int get(String key) {
            int[] c = counts.get(key);
            return c == null ? 0 : c[0];
        }

        @Override
        public synchronized String toString() {
            StringBuilder sb = new StringBuilder();
            for (Map.Entry<String, int[]> e : counts.entrySet()) sb.append("  ").append(e.getKey()).append(": ")
                    .append(e.getValue()[0]).append('\n');
            return sb.toString();
        }
    }
}
