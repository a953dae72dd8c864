package dev.assay.kernel;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.LinkedHashSet;
import java.util.Map;
import java.util.Set;

/**
 * Whether two clauses are variants: equal as sets of literals under a one-to-one renaming of variables, with
 * equations unordered. Literals are first grouped by a skeleton hash that ignores variable names, so in the common
 * case every literal has one candidate and the check is linear; ties are resolved by a bounded backtracking search
 * (variant checking is as hard as graph isomorphism in the worst case), and a search that runs out of budget is a
 * rejection, never an acceptance.
 */
final class Variants {

    static final long DEFAULT_BUDGET = 1_000_000;

    private Variants() {
    }

    /** Skeleton hash of a term: its structure with every variable alike; equations hash their sides unordered. */
    static final class Skeletons {
        private final Map<Term, Integer> memo = new IdentityHashMap<>();

        int of(Term root) {
            return Terms.fold(root, memo, t -> t instanceof Variable ? 0x5bd1e995 : null, (a, args) -> {
                int h = a.symbol().hashCode();
                if (a.isEquation()) {
                    int x = args.get(0);
                    int y = args.get(1);
                    return h * 31 + (x + y) * 17 + (x ^ y);
                }
                for (int v : args) h = h * 31 + v;
                return h;
            });
        }

        int of(Literal l) {
            int h = of(l.atom());
            return l.positive() ? h : ~h;
        }
    }

    /** Clauses of at most this many distinct literals skip the grouping by skeleton. */
    private static final int SMALL = 4;

    /** True when {@code a} and {@code b} are variants of each other; false also when the budget ran out. */
    static boolean areVariants(Clause a, Clause b, long budget) {
        // Equal as written, literal by literal: the identity renaming does it (the common case for ground clauses).
        if (a.width() == b.width()) {
            boolean same = true;
            for (int i = 1; same && i <= a.width(); i++) same = a.literal(i).equals(b.literal(i));
            if (same) return true;
        }
        // Equal as sets: the identity renaming does it too (the common case when the certificate's variables are
        // those the unifier kept, in another order of literals). Linear, like what follows, and cheaper.
        if (a.sameSet(b)) return true;
        List<Literal> la = distinct(a);
        List<Literal> lb = distinct(b);
        if (la.size() != lb.size()) return false;
        if (la.isEmpty()) return true;
        // Fast path: certificates usually state a derived clause in the order it was derived. Pairing the literals
        // in order is one candidate each; when it works the clauses are variants, when not the full search decides.
        List<List<Literal>> inOrder = new ArrayList<>(lb.size());
        for (Literal l : lb) inOrder.add(List.of(l));
        if (new Search(la, inOrder, budget).run()) return true;
        if (la.size() <= SMALL) {
            // A few literals: every literal of b is a candidate for each of a, the same search without the grouping,
            // which costs more than it saves at this size.
            List<List<Literal>> all = new ArrayList<>(la.size());
            for (int i = 0; i < la.size(); i++) all.add(lb);
            return new Search(la, all, budget).run();
        }
        Skeletons sk = new Skeletons();
        Map<Variable, Integer> occA = occurrences(la);
        Map<Variable, Integer> occB = occurrences(lb);
        Map<Long, List<Literal>> byShape = new HashMap<>();
        for (Literal l : lb) byShape.computeIfAbsent(key(sk, l, occB), k -> new ArrayList<>()).add(l);
        // Every literal of a needs a candidate of the same key, and the group sizes must agree.
        Map<Long, Integer> countA = new HashMap<>();
        Map<Literal, Long> keyA = new HashMap<>();
        for (Literal l : la) {
            long k = key(sk, l, occA);
            keyA.put(l, k);
            countA.merge(k, 1, Integer::sum);
        }
        for (Map.Entry<Long, Integer> e : countA.entrySet()) {
            List<Literal> g = byShape.get(e.getKey());
            if (g == null || g.size() != e.getValue()) return false;
        }
        // Most constrained literals first.
        la.sort((x, y) -> Integer.compare(byShape.get(keyA.get(x)).size(), byShape.get(keyA.get(y)).size()));
        List<List<Literal>> candidates = new ArrayList<>();
        for (Literal l : la) candidates.add(byShape.get(keyA.get(l)));
        return new Search(la, candidates, budget).run();
    }

    /** The literals of {@code c} as a set, in order of first occurrence, as {@link Clause#asSet()} has them. */
    private static List<Literal> distinct(Clause c) {
        if (c.width() > 8) return new ArrayList<>(c.asSet());
        // A few literals: comparing each with those kept costs less than a hash set.
        List<Literal> out = new ArrayList<>(c.width());
        for (Literal l : c.literals()) if (!out.contains(l)) out.add(l);
        return out;
    }

    /** In how many literals each variable occurs: a renaming keeps these counts. */
    private static Map<Variable, Integer> occurrences(List<Literal> literals) {
        Map<Variable, Integer> out = new HashMap<>();
        for (Literal l : literals) {
            Set<Variable> vs = new LinkedHashSet<>();
            Terms.collectVariables(l.atom(), vs);
            for (Variable v : vs) out.merge(v, 1, Integer::sum);
        }
        return out;
    }

    /**
     * The skeleton hash refined by those counts at each variable (each side of an equation on its own, combined
     * without order). Renaming-invariant, and it tells apart the two ends of a chain P(x0, x1), P(x1, x2), … from
     * its middle, so such a chain is matched without search. Computed on the term graph, once per shared subterm.
     */
    private static long key(Skeletons sk, Literal l, Map<Variable, Integer> occ) {
        long base = sk.of(l);
        Application atom = l.atom();
        Map<Term, Long> memo = new HashMap<>();
        if (atom.isEquation()) {
            long x = counts(atom.argument(0), occ, memo);
            long y = counts(atom.argument(1), occ, memo);
            return base * 1_000_003L + (x + y) * 31 + (x ^ y);
        }
        return base * 1_000_003L + counts(atom, occ, memo);
    }

    private static long counts(Term root, Map<Variable, Integer> occ, Map<Term, Long> memo) {
        return Terms.fold(root, memo,
                t -> t instanceof Variable v ? (Long) ((long) occ.get(v) * 0x9E3779B97F4A7C15L) : t.isGround() ? (Long) 3L : null,
                (a, args) -> {
                    long h = 7;
                    for (long v : args) h = h * 131 + v;
                    return h;
                });
    }

    /** Backtracking over literal pairings and equation orientations, with an undo trail; no recursion. */
    private static final class Search {
        private final List<Literal> literals;
        private final List<List<Literal>> candidates;
        private long budget;
        private final Map<Variable, Variable> forward = new HashMap<>();
        private final Map<Variable, Variable> backward = new HashMap<>();
        private final ArrayList<Variable> trail = new ArrayList<>();
        private final IdentityHashMap<Literal, Boolean> used = new IdentityHashMap<>();
        /** The distinct variables of each literal, made when {@link #next} first scores it. */
        private final Variable[][] variablesOf;
        /** The memo and the work stack of {@link #matchTerms}, cleared on each call (a large memo is replaced). */
        private Map<Term, Term> mapped = new HashMap<>();
        private final ArrayDeque<Term> stack = new ArrayDeque<>();

        Search(List<Literal> literals, List<List<Literal>> candidates, long budget) {
            this.literals = literals;
            this.candidates = candidates;
            this.budget = budget;
            this.variablesOf = new Variable[literals.size()][];
        }

        boolean run() {
            int n = literals.size();
            // order[k] is the literal matched at depth k; choice[k] encodes candidate index * 2 + orientation.
            int[] order = new int[n];
            int[] choice = new int[n];
            int[] trailMark = new int[n];
            boolean[] placed = new boolean[n];
            Literal[] taken = new Literal[n];
            int k = 0;
            if (n > 0) {
                order[0] = next(placed);
                placed[order[0]] = true;
            }
            while (k >= 0) {
                if (--budget < 0) return false;
                if (k == n) return true;
                int lit = order[k];
                List<Literal> cands = candidates.get(lit);
                boolean advanced = false;
                while (choice[k] < cands.size() * 2) {
                    int c = choice[k]++;
                    Literal target = cands.get(c / 2);
                    boolean flip = (c & 1) == 1;
                    if (flip && !literals.get(lit).isEquation()) continue;
                    if (used.containsKey(target)) continue;
                    if (--budget < 0) return false;
                    trailMark[k] = trail.size();
                    if (matchLiteral(literals.get(lit), target, flip)) {
                        used.put(target, Boolean.TRUE);
                        taken[k] = target;
                        advanced = true;
                        break;
                    }
                    undo(trailMark[k]);
                }
                if (advanced) {
                    k++;
                    if (k < n) {
                        order[k] = next(placed);
                        placed[order[k]] = true;
                        choice[k] = 0;
                    }
                } else {
                    placed[lit] = false;
                    k--;
                    if (k >= 0) {
                        used.remove(taken[k]);
                        undo(trailMark[k]);
                    }
                }
            }
            return false;
        }

        /**
         * The literal to match next: one with a single candidate if any is left (literals are sorted so those come
         * first), else the one with most variables already renamed, which prunes a chain of like literals at once.
         */
        private int next(boolean[] placed) {
            int best = -1;
            int bestScore = -1;
            for (int i = 0; i < literals.size(); i++) {
                if (placed[i]) continue;
                if (candidates.get(i).size() == 1) return i;
                int score = 0;
                Variable[] vs = variablesOf[i];
                if (vs == null) {
                    vs = Terms.variablesOf(List.of(literals.get(i).atom())).toArray(new Variable[0]);
                    variablesOf[i] = vs;
                }
                for (Variable v : vs) if (forward.containsKey(v)) score++;
                if (score > bestScore) {
                    best = i;
                    bestScore = score;
                }
            }
            return best;
        }

        private void undo(int mark) {
            while (trail.size() > mark) {
                Variable v = trail.remove(trail.size() - 1);
                backward.remove(forward.remove(v));
            }
        }

        private boolean matchLiteral(Literal x, Literal y, boolean flip) {
            if (x.positive() != y.positive()) return false;
            Application ax = x.atom();
            Application ay = y.atom();
            if (!ax.symbol().equals(ay.symbol())) return false;
            if (flip) {
                return matchTerms(ax.argument(0), ay.argument(1)) && matchTerms(ax.argument(1), ay.argument(0));
            }
            return matchTerms(ax, ay);
        }

        /** Extends the renaming so that it maps {@code s} onto {@code t}, or fails (leaving entries for undo). */
        private boolean matchTerms(Term s, Term t) {
            // A renaming maps each term to one term, so a subterm already mapped onto y needs no second walk, and one
            // mapped onto something else fails: shared subterms are visited once, not once per path.
            if (mapped.size() > 64) mapped = new HashMap<>();
            else mapped.clear();
            stack.clear();
            stack.push(s);
            stack.push(t);
            while (!stack.isEmpty()) {
                Term y = stack.pop();
                Term x = stack.pop();
                if (x.isGround() || y.isGround()) {
                    if (x != y) return false;
                    continue;
                }
                Term before = mapped.putIfAbsent(x, y);
                if (before != null) {
                    if (before != y) return false;
                    continue;
                }
                if (x instanceof Variable vx) {
                    if (!(y instanceof Variable vy)) return false;
                    Variable fx = forward.get(vx);
                    if (fx != null) {
                        if (fx != vy) return false;
                        continue;
                    }
                    if (backward.containsKey(vy)) return false;
                    forward.put(vx, vy);
                    backward.put(vy, vx);
                    trail.add(vx);
                    continue;
                }
                if (!(y instanceof Application ay)) return false;
                Application ax = (Application) x;
                if (!ax.symbol().equals(ay.symbol())) return false;
                for (int i = 0; i < ax.arity(); i++) {
                    stack.push(ax.argument(i));
                    stack.push(ay.argument(i));
                }
            }
            return true;
        }
    }
}
