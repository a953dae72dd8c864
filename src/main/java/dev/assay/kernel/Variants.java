package dev.assay.kernel;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;

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
            Integer known = memo.get(root);
            if (known != null) return known;
            ArrayDeque<Term> stack = new ArrayDeque<>();
            stack.push(root);
            while (!stack.isEmpty()) {
                Term t = stack.peek();
                if (memo.containsKey(t)) {
                    stack.pop();
                    continue;
                }
                if (t instanceof Variable) {
                    memo.put(t, 0x5bd1e995);
                    stack.pop();
                    continue;
                }
                Application a = (Application) t;
                boolean ready = true;
                for (Term arg : a.argumentArray()) {
                    if (!memo.containsKey(arg)) {
                        stack.push(arg);
                        ready = false;
                    }
                }
                if (!ready) continue;
                stack.pop();
                int h = a.symbol().hashCode();
                if (a.isEquation()) {
                    int x = memo.get(a.argument(0));
                    int y = memo.get(a.argument(1));
                    h = h * 31 + (x + y) * 17 + (x ^ y);
                } else {
                    for (Term arg : a.argumentArray()) h = h * 31 + memo.get(arg);
                }
                memo.put(a, h);
            }
            return memo.get(root);
        }

        int of(Literal l) {
            int h = of(l.atom());
            return l.positive() ? h : ~h;
        }
    }

    /** True when {@code a} and {@code b} are variants of each other; false also when the budget ran out. */
    static boolean areVariants(Clause a, Clause b, long budget) {
        List<Literal> la = new ArrayList<>(a.asSet());
        List<Literal> lb = new ArrayList<>(b.asSet());
        if (la.size() != lb.size()) return false;
        if (la.isEmpty()) return true;
        Skeletons sk = new Skeletons();
        Map<Integer, List<Literal>> byShape = new HashMap<>();
        for (Literal l : lb) byShape.computeIfAbsent(sk.of(l), k -> new ArrayList<>()).add(l);
        // Every literal of a needs a candidate of the same skeleton, and the group sizes must agree.
        Map<Integer, Integer> countA = new HashMap<>();
        for (Literal l : la) countA.merge(sk.of(l), 1, Integer::sum);
        for (Map.Entry<Integer, Integer> e : countA.entrySet()) {
            List<Literal> g = byShape.get(e.getKey());
            if (g == null || g.size() != e.getValue()) return false;
        }
        // Most constrained literals first.
        la.sort((x, y) -> Integer.compare(byShape.get(sk.of(x)).size(), byShape.get(sk.of(y)).size()));
        List<List<Literal>> candidates = new ArrayList<>();
        for (Literal l : la) candidates.add(byShape.get(sk.of(l)));
        return new Search(la, candidates, budget).run();
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

        Search(List<Literal> literals, List<List<Literal>> candidates, long budget) {
            this.literals = literals;
            this.candidates = candidates;
            this.budget = budget;
        }

        boolean run() {
            int n = literals.size();
            // choice[k] encodes candidate index * 2 + orientation for literal k.
            int[] choice = new int[n];
            int[] trailMark = new int[n];
            Literal[] taken = new Literal[n];
            int k = 0;
            choice[0] = 0;
            while (k >= 0) {
                if (--budget < 0) return false;
                if (k == n) return true;
                List<Literal> cands = candidates.get(k);
                boolean advanced = false;
                while (choice[k] < cands.size() * 2) {
                    int c = choice[k]++;
                    Literal target = cands.get(c / 2);
                    boolean flip = (c & 1) == 1;
                    if (flip && !literals.get(k).isEquation()) continue;
                    if (used.containsKey(target)) continue;
                    trailMark[k] = trail.size();
                    if (matchLiteral(literals.get(k), target, flip)) {
                        used.put(target, Boolean.TRUE);
                        taken[k] = target;
                        advanced = true;
                        break;
                    }
                    undo(trailMark[k]);
                }
                if (advanced) {
                    k++;
                    if (k < n) choice[k] = 0;
                } else {
                    k--;
                    if (k >= 0) {
                        used.remove(taken[k]);
                        undo(trailMark[k]);
                    }
                }
            }
            return false;
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
            Map<Term, Term> mapped = new HashMap<>();
            ArrayDeque<Term> stack = new ArrayDeque<>();
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
