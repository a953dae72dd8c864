package dev.assay.campaign;

import dev.assay.kernel.Application;
import dev.assay.kernel.Clause;
import dev.assay.kernel.Formula;
import dev.assay.kernel.Literal;
import dev.assay.kernel.Symbol;
import dev.assay.kernel.Term;
import dev.assay.kernel.Variable;

import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * A finite-model oracle for the mutation campaign, written without the kernel's logic: it uses the kernel's value
 * types (formulas, clauses, terms, symbols) and nothing else of it.
 *
 * <p>It answers three questions over the domains {0}, {0, 1} and {0, 1, 2} (equality is identity; a clause is the
 * universal closure of its literals, and so is a formula with free variables):
 * <ul>
 *   <li>{@link #entails}: is the conclusion true in every interpretation that makes every premise true?</li>
 *   <li>{@link #extendsEveryModel}: can every interpretation that makes the premises true be extended, by some
 *       interpretation of the fresh symbols, to one that makes the conclusion true (what {@code skolemize} and
 *       {@code define} must guarantee)?</li>
 *   <li>{@link #hasModel}: is there an interpretation that makes every formula true?</li>
 * </ul>
 *
 * <p>Every interpretation of the symbols involved is covered, but not one at a time: the search assigns the entries
 * of the symbols' tables (a function of arity k over n elements has n^k entries, a predicate as many truth values)
 * one by one, in the order a three-valued (Kleene) evaluation asks for them, and closes a branch as soon as that
 * evaluation decides the question. A closed branch with m entries still unassigned settles all interpretations that
 * agree with it at once, which is sound because a Kleene value that is true or false stays so in every completion.
 * The search is exhaustive: it branches on an unassigned entry until the question is decided, so every
 * interpretation lies under exactly one closed branch.
 *
 * <p>The budget counts branches (partial interpretations evaluated) and atom evaluations over one question, summed over
 * the three domain sizes. When either runs out the answer is {@link Answer#UNDECIDED}: the oracle never guesses.
 */
public final class FiniteModelOracle {

    public enum Answer { YES, NO, UNDECIDED }

    /**
     * {@code detail} describes the interpretation that decided a NO for entails / extendsEveryModel, or the model
     * found for hasModel YES; {@code nodes} is the number of partial interpretations evaluated.
     */
    public record Judgement(Answer answer, String detail, long nodes) {
        public boolean yes() {
            return answer == Answer.YES;
        }

        public boolean no() {
            return answer == Answer.NO;
        }

        public boolean undecided() {
            return answer == Answer.UNDECIDED;
        }
    }

    public static final int MAX_DOMAIN = 3;
    /** Partial interpretations per question (the brief's "2 million interpretations per step"). */
    public static final long DEFAULT_NODES = 2_000_000;
    /** Atom evaluations per question, so that a question with large formulas also ends in bounded time. */
    public static final long DEFAULT_WORK = 400_000_000;
    /** A table larger than this (n^arity entries) is not searched; the question is undecided. */
    private static final int MAX_TABLE = 100_000;

    private final int maxDomain;
    private final long nodeBudget;
    private final long workBudget;

    public FiniteModelOracle() {
        this(MAX_DOMAIN, DEFAULT_NODES, DEFAULT_WORK);
    }

    public FiniteModelOracle(int maxDomain, long nodeBudget, long workBudget) {
        if (maxDomain < 1) throw new IllegalArgumentException("domain size");
        this.maxDomain = maxDomain;
        this.nodeBudget = nodeBudget;
        this.workBudget = workBudget;
    }

    // ================================================================ questions

    /** Premises and conclusion are {@link Formula} or {@link Clause} values. */
    public Judgement entails(List<?> premises, Object conclusion) {
        Query q = new Query(premises, conclusion, Set.of());
        Search s = new Search(q);
        // The conclusion is false when some values of its outer universal variables make its body false. Trying
        // those values one tuple at a time closes every branch that makes the instance true at once, instead of
        // searching all ways to make the whole conclusion true. Domain elements are interchangeable before any
        // entry is assigned, so only tuples in first-occurrence order (restricted growth strings) are tried.
        List<Integer> outer = new ArrayList<>();
        Fm body = q.conclusion;
        while (body instanceof Quant u && u.universal) {
            outer.add(u.slot);
            body = u.body;
        }
        for (int n = 1; n <= maxDomain; n++) {
            try {
                if (!s.start(n)) return new Judgement(Answer.UNDECIDED, "a table is too large at size " + n, s.nodes);
                int[] tuple = new int[outer.size()];
                boolean more = true;
                while (more) {
                    for (int k = 0; k < tuple.length; k++) s.c.env[outer.get(k)] = tuple[k];
                    if (s.countermodel(body)) {
                        StringBuilder at = new StringBuilder();
                        for (int k = 0; k < tuple.length; k++) at.append(k == 0 ? " at (" : ",").append(tuple[k]);
                        if (tuple.length > 0) at.append(')');
                        return new Judgement(Answer.NO, s.describe() + at, s.nodes);
                    }
                    more = nextGrowthString(tuple, n);
                }
            } catch (OutOfBudget e) {
                return new Judgement(Answer.UNDECIDED, "budget exhausted at domain size " + n
                        + (n > 1 ? " (holds up to size " + (n - 1) + ")" : ""), s.nodes);
            }
        }
        return new Judgement(Answer.YES, "holds in every interpretation up to size " + maxDomain, s.nodes);
    }

    /** The next restricted growth string over n values (each value at most one more than the largest before it). */
    private static boolean nextGrowthString(int[] t, int n) {
        for (int k = t.length - 1; k > 0; k--) {
            int max = 0;
            for (int i = 0; i < k; i++) max = Math.max(max, t[i]);
            if (t[k] < Math.min(n - 1, max + 1)) {
                t[k]++;
                for (int i = k + 1; i < t.length; i++) t[i] = 0;
                return true;
            }
        }
        return false;
    }

    /**
     * Whether every interpretation of the non-fresh symbols that makes every premise true extends, by some
     * interpretation of the symbols in {@code fresh}, to one that makes the conclusion true. The fresh symbols must not
     * occur in the premises (a caller that finds one there must not call them fresh).
     */
    public Judgement extendsEveryModel(List<?> premises, Object conclusion, Collection<Symbol> fresh) {
        Query q = new Query(premises, conclusion, Set.copyOf(fresh));
        for (int i = 0; i < q.symbols.size(); i++) {
            if (q.fresh[i] && q.inPremises[i]) {
                throw new IllegalArgumentException(q.symbols.get(i) + " occurs in a premise, so it is not fresh");
            }
        }
        Search s = new Search(q);
        for (int n = 1; n <= maxDomain; n++) {
            try {
                if (!s.start(n)) return new Judgement(Answer.UNDECIDED, "a table is too large at size " + n, s.nodes);
                if (s.outer()) return new Judgement(Answer.NO, s.describe(), s.nodes);
            } catch (OutOfBudget e) {
                return new Judgement(Answer.UNDECIDED, "budget exhausted at domain size " + n
                        + (n > 1 ? " (extends up to size " + (n - 1) + ")" : ""), s.nodes);
            }
        }
        return new Judgement(Answer.YES, "every model up to size " + maxDomain + " extends", s.nodes);
    }

    /** YES with the model in the detail when some interpretation up to the largest size makes every formula true. */
    public Judgement hasModel(List<?> formulas) {
        Judgement j = entails(formulas, Formula.Constant.FALSE);
        return switch (j.answer()) {
            case NO -> new Judgement(Answer.YES, j.detail(), j.nodes());
            case YES -> new Judgement(Answer.NO, "no model up to size " + maxDomain, j.nodes());
            case UNDECIDED -> j;
        };
    }

    // ================================================================ compiled formulas

    private static final int F = 0;
    private static final int T = 1;
    private static final int U = 2;

    private static final class OutOfBudget extends RuntimeException {
        OutOfBudget() {
            super(null, null, false, false);
        }
    }

    /** The state of one search: tables, environment, and the witness of the last unknown value. */
    private static final class Ctx {
        int n;
        int[][] tables;
        int[] env;
        int wSym;
        int wIdx;
        long work;
        long workLimit;
    }

    private abstract static class Tm {
        /** The value, or -1 when it depends on an unassigned entry (then the witness names one). */
        abstract int value(Ctx c);
    }

    private static final class Var extends Tm {
        final int slot;

        Var(int slot) {
            this.slot = slot;
        }

        @Override
        int value(Ctx c) {
            return c.env[slot];
        }
    }

    private static final class App extends Tm {
        final int sym;
        final Tm[] args;

        App(int sym, Tm[] args) {
            this.sym = sym;
            this.args = args;
        }

        /** The index of the table entry, or -1 when an argument is unknown. */
        int index(Ctx c) {
            int idx = 0;
            for (int i = args.length - 1; i >= 0; i--) {
                int v = args[i].value(c);
                if (v < 0) return -1;
                idx = idx * c.n + v;
            }
            return idx;
        }

        @Override
        int value(Ctx c) {
            int idx = index(c);
            if (idx < 0) return -1;
            int v = c.tables[sym][idx];
            if (v < 0) {
                c.wSym = sym;
                c.wIdx = idx;
            }
            return v;
        }
    }

    private abstract static class Fm {
        /** F, T or U; on U the witness names an unassigned entry this value depends on. */
        abstract int eval(Ctx c);
    }

    private static final class Lit extends Fm {
        final boolean positive;
        final Tm left;   // equation sides; null for a predicate atom
        final Tm right;
        final App atom;  // predicate atom; null for an equation

        Lit(boolean positive, Tm left, Tm right, App atom) {
            this.positive = positive;
            this.left = left;
            this.right = right;
            this.atom = atom;
        }

        @Override
        int eval(Ctx c) {
            if (++c.work > c.workLimit) throw new OutOfBudget();
            int truth;
            if (atom == null) {
                int l = left.value(c);
                if (l < 0) return U;
                int r = right.value(c);
                if (r < 0) return U;
                truth = l == r ? 1 : 0;
            } else {
                truth = atom.value(c);
                if (truth < 0) return U;
            }
            return (truth == 1) == positive ? T : F;
        }
    }

    private static final class Const extends Fm {
        final int value;

        Const(boolean value) {
            this.value = value ? T : F;
        }

        @Override
        int eval(Ctx c) {
            return value;
        }
    }

    private static final class Neg extends Fm {
        final Fm body;

        Neg(Fm body) {
            this.body = body;
        }

        @Override
        int eval(Ctx c) {
            int v = body.eval(c);
            return v == U ? U : 1 - v;
        }
    }

    /** A conjunction (and) or disjunction (or) of parts; an implication a → b is the disjunction of ¬a and b. */
    private static final class Junc extends Fm {
        final boolean and;
        final Fm[] parts;

        Junc(boolean and, Fm[] parts) {
            this.and = and;
            this.parts = parts;
        }

        @Override
        int eval(Ctx c) {
            int stop = and ? F : T;
            boolean unknown = false;
            int ws = 0;
            int wi = 0;
            for (Fm p : parts) {
                int v = p.eval(c);
                if (v == stop) return stop;
                if (v == U && !unknown) {
                    unknown = true;
                    ws = c.wSym;
                    wi = c.wIdx;
                }
            }
            if (!unknown) return 1 - stop;
            c.wSym = ws;
            c.wIdx = wi;
            return U;
        }
    }

    private static final class Equiv extends Fm {
        final Fm left;
        final Fm right;

        Equiv(Fm left, Fm right) {
            this.left = left;
            this.right = right;
        }

        @Override
        int eval(Ctx c) {
            int l = left.eval(c);
            if (l == U) return U;
            int r = right.eval(c);
            if (r == U) return U;
            return l == r ? T : F;
        }
    }

    private static final class Quant extends Fm {
        final boolean universal;
        final int slot;
        final Fm body;

        Quant(boolean universal, int slot, Fm body) {
            this.universal = universal;
            this.slot = slot;
            this.body = body;
        }

        @Override
        int eval(Ctx c) {
            int stop = universal ? F : T;
            boolean unknown = false;
            int ws = 0;
            int wi = 0;
            for (int d = 0; d < c.n; d++) {
                c.env[slot] = d;
                int v = body.eval(c);
                if (v == stop) return stop;
                if (v == U && !unknown) {
                    unknown = true;
                    ws = c.wSym;
                    wi = c.wIdx;
                }
            }
            if (!unknown) return 1 - stop;
            c.wSym = ws;
            c.wIdx = wi;
            return U;
        }
    }

    // ================================================================ compilation

    /** The symbols of a question and its compiled formulas, each the universal closure of its value. */
    private static final class Query {
        final List<Symbol> symbols = new ArrayList<>();
        final Map<Symbol, Integer> index = new LinkedHashMap<>();
        final boolean[] fresh;
        final boolean[] inPremises;
        final Fm[] premises;
        final Fm conclusion;
        int slots;

        Query(List<?> premiseValues, Object conclusionValue, Set<Symbol> freshSymbols) {
            premises = new Fm[premiseValues.size()];
            for (int i = 0; i < premises.length; i++) premises[i] = compile(premiseValues.get(i));
            int premiseSymbols = symbols.size();
            conclusion = compile(conclusionValue);
            fresh = new boolean[symbols.size()];
            inPremises = new boolean[symbols.size()];
            for (int i = 0; i < symbols.size(); i++) {
                fresh[i] = freshSymbols.contains(symbols.get(i));
                inPremises[i] = i < premiseSymbols;
            }
        }

        private Fm compile(Object value) {
            List<String> scope = new ArrayList<>();
            List<Integer> scopeSlots = new ArrayList<>();
            Map<String, Integer> free = new LinkedHashMap<>();
            Fm body;
            if (value instanceof Clause c) {
                Fm[] lits = new Fm[c.width()];
                for (int i = 0; i < lits.length; i++) lits[i] = literal(c.literals().get(i), scope, scopeSlots, free);
                body = lits.length == 0 ? new Const(false) : lits.length == 1 ? lits[0] : new Junc(false, lits);
            } else if (value instanceof Formula f) {
                body = formula(f, scope, scopeSlots, free);
            } else {
                throw new IllegalArgumentException("not a formula or clause: " + value);
            }
            List<Integer> freeSlots = new ArrayList<>(free.values());
            for (int i = freeSlots.size() - 1; i >= 0; i--) body = new Quant(true, freeSlots.get(i), body);
            return body;
        }

        private Fm formula(Formula f, List<String> scope, List<Integer> slotsOf, Map<String, Integer> free) {
            if (f instanceof Formula.Atomic a) return literal(a.literal(), scope, slotsOf, free);
            if (f instanceof Formula.Constant k) return new Const(k.value());
            if (f instanceof Formula.Not x) return new Neg(formula(x.body(), scope, slotsOf, free));
            if (f instanceof Formula.Junction j) {
                Fm[] parts = new Fm[j.parts().size()];
                for (int i = 0; i < parts.length; i++) parts[i] = formula(j.parts().get(i), scope, slotsOf, free);
                return new Junc(j instanceof Formula.And, parts);
            }
            if (f instanceof Formula.Implies i) {
                return new Junc(false, new Fm[] {new Neg(formula(i.left(), scope, slotsOf, free)),
                        formula(i.right(), scope, slotsOf, free)});
            }
            if (f instanceof Formula.Iff i) {
                return new Equiv(formula(i.left(), scope, slotsOf, free), formula(i.right(), scope, slotsOf, free));
            }
            Formula.Quantified q = (Formula.Quantified) f;
            int slot = slots++;
            scope.add(q.variable().name());
            slotsOf.add(slot);
            Fm body = formula(q.body(), scope, slotsOf, free);
            scope.remove(scope.size() - 1);
            slotsOf.remove(slotsOf.size() - 1);
            return new Quant(q.universal(), slot, body);
        }

        private Fm literal(Literal l, List<String> scope, List<Integer> slotsOf, Map<String, Integer> free) {
            Application a = l.atom();
            if (a.isEquation()) {
                return new Lit(l.positive(), term(a.argument(0), scope, slotsOf, free),
                        term(a.argument(1), scope, slotsOf, free), null);
            }
            return new Lit(l.positive(), null, null, (App) term(a, scope, slotsOf, free));
        }

        private Tm term(Term t, List<String> scope, List<Integer> slotsOf, Map<String, Integer> free) {
            if (t instanceof Variable v) {
                // Bound variables are compared by name, innermost binder first, as the language scopes them.
                for (int i = scope.size() - 1; i >= 0; i--) if (scope.get(i).equals(v.name())) return new Var(slotsOf.get(i));
                return new Var(free.computeIfAbsent(v.name(), x -> slots++));
            }
            Application a = (Application) t;
            Tm[] args = new Tm[a.arity()];
            for (int i = 0; i < args.length; i++) args[i] = term(a.argument(i), scope, slotsOf, free);
            return new App(symbol(a.symbol()), args);
        }

        private int symbol(Symbol s) {
            Integer i = index.get(s);
            if (i != null) return i;
            index.put(s, symbols.size());
            symbols.add(s);
            return symbols.size() - 1;
        }
    }

    // ================================================================ search

    private final class Search {
        final Query q;
        final Ctx c = new Ctx();
        long nodes;

        Search(Query q) {
            this.q = q;
            c.workLimit = workBudget;
        }

        /** Sets up empty tables over n elements; false when a table would be too large. */
        boolean start(int n) {
            c.n = n;
            c.env = new int[Math.max(1, q.slots)];
            c.tables = new int[q.symbols.size()][];
            for (int i = 0; i < q.symbols.size(); i++) {
                long size = 1;
                for (int k = 0; k < q.symbols.get(i).arity(); k++) {
                    size *= n;
                    if (size > MAX_TABLE) return false;
                }
                c.tables[i] = new int[(int) size];
                java.util.Arrays.fill(c.tables[i], -1);
            }
            return true;
        }

        private int range(int sym) {
            return q.symbols.get(sym).kind() == Symbol.Kind.PREDICATE ? 2 : c.n;
        }

        private void node() {
            if (++nodes > nodeBudget) throw new OutOfBudget();
        }

        /** Whether some completion of the current tables makes every premise true and the conclusion false. */
        boolean countermodel(Fm conclusion) {
            node();
            int bs = -1;
            int bi = -1;
            int cv = conclusion.eval(c);
            if (cv == T) return false;
            if (cv == U) {
                bs = c.wSym;
                bi = c.wIdx;
            }
            boolean all = true;
            for (Fm p : q.premises) {
                int v = p.eval(c);
                if (v == F) return false;
                if (v == U) {
                    all = false;
                    if (bs < 0) {
                        bs = c.wSym;
                        bi = c.wIdx;
                    }
                }
            }
            if (all && cv == F) return true;
            int[] table = c.tables[bs];
            for (int v = 0; v < range(bs); v++) {
                table[bi] = v;
                if (countermodel(conclusion)) return true;
            }
            table[bi] = -1;
            return false;
        }

        private int premisesValue() {
            boolean unknown = false;
            int ws = 0;
            int wi = 0;
            for (Fm p : q.premises) {
                int v = p.eval(c);
                if (v == F) return F;
                if (v == U && !unknown) {
                    unknown = true;
                    ws = c.wSym;
                    wi = c.wIdx;
                }
            }
            if (!unknown) return T;
            c.wSym = ws;
            c.wIdx = wi;
            return U;
        }

        private int needSym;
        private int needIdx;

        /** Whether some completion of the base symbols makes the premises true and admits no fresh extension. */
        boolean outer() {
            node();
            int pv = premisesValue();
            if (pv == F) return false;
            int ps = c.wSym;
            int pi = c.wIdx;
            needSym = -1;
            if (inner()) return false;
            int bs;
            int bi;
            if (pv == U) {
                bs = ps;
                bi = pi;
            } else if (needSym >= 0) {
                bs = needSym;
                bi = needIdx;
            } else {
                return true; // premises true whatever the rest, and every choice of the fresh entries falsifies
            }
            int[] table = c.tables[bs];
            for (int v = 0; v < range(bs); v++) {
                table[bi] = v;
                if (outer()) return true;
            }
            table[bi] = -1;
            return false;
        }

        /**
         * Whether some values of the unassigned fresh entries make the conclusion true whatever the unassigned base
         * entries are. Leaves the fresh entries unassigned again; records a base entry it met in needSym/needIdx.
         */
        private boolean inner() {
            node();
            int v = q.conclusion.eval(c);
            if (v == T) return true;
            if (v == F) return false;
            int ws = c.wSym;
            int wi = c.wIdx;
            if (!q.fresh[ws]) {
                if (needSym < 0) {
                    needSym = ws;
                    needIdx = wi;
                }
                return false;
            }
            int[] table = c.tables[ws];
            boolean ok = false;
            for (int x = 0; x < range(ws) && !ok; x++) {
                table[wi] = x;
                ok = inner();
            }
            table[wi] = -1;
            return ok;
        }

        /** The assigned entries of the current tables; unlisted entries may take any value. */
        String describe() {
            StringBuilder sb = new StringBuilder("domain {0.." + (c.n - 1) + "}");
            for (int s = 0; s < q.symbols.size(); s++) {
                Symbol sym = q.symbols.get(s);
                if (q.fresh[s]) continue;
                List<String> entries = new ArrayList<>();
                int[] t = c.tables[s];
                for (int i = 0; i < t.length; i++) {
                    if (t[i] < 0) continue;
                    String val = sym.kind() == Symbol.Kind.PREDICATE ? (t[i] == 1 ? "true" : "false") : String.valueOf(t[i]);
                    entries.add(sym.arity() == 0 ? val : tuple(i, sym.arity()) + "=" + val);
                }
                if (!entries.isEmpty()) sb.append("; ").append(sym.name()).append(sym.arity() == 0 ? " = " : ": ")
                        .append(String.join(" ", entries));
            }
            return sb.toString();
        }

        private String tuple(int idx, int arity) {
            StringBuilder sb = new StringBuilder("(");
            for (int k = 0; k < arity; k++) {
                if (k > 0) sb.append(',');
                sb.append(idx % c.n);
                idx /= c.n;
            }
            return sb.append(')').toString();
        }
    }
}
