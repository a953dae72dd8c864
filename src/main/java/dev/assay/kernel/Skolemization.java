package dev.assay.kernel;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The check of {@code skolemize}: walks {@code N = nnf(premise)} beside the stated conclusion, modulo renaming of
 * bound variables, associativity and commutativity of and/or and orientation of equations, and finds which
 * existentials stand replaced by which Skolem terms.
 *
 * <p>The walk is a backtracking search over goals (pairs of subformulas) with an undo trail and no recursion. Its
 * choices are: whether an existential is kept or replaced (only where the conclusion has an existential in that
 * place), the pairing of the parts of a junction (only among parts of equal shape, so in the common case there is
 * one candidate and the walk is linear), and the orientation of an equation. Under a junction, a replaced existential
 * whose body is a junction of the same kind is spliced into it; the walk tries splicing all such existentials, none,
 * and each kept whole exactly where the conclusion has an existential part of its shape. The worst case
 * is exponential in the number of equal-shaped parts; a search past its budget is a rejection.
 */
final class Skolemization {

    static final long BUDGET = 2_000_000;

    private Skolemization() {
    }

    private enum Kind { UNIVERSAL, KEPT, REPLACED }

    /** How a variable of N is bound at a point of the walk; a persistent list, newest first. */
    private record NEnv(Variable variable, Kind kind, Variable image, int binder, Formula.Quantified node,
                        NEnv outer, NEnv next) {
        NEnv lookup(Variable v) {
            for (NEnv e = this; e != null; e = e.next) if (e.variable == v) return e;
            return null;
        }
    }

    /** Binders of the conclusion in scope, newest first. */
    private record FEnv(Variable variable, int binder, FEnv next) {
        static int lookup(FEnv env, Variable v) {
            for (FEnv e = env; e != null; e = e.next) if (e.variable == v) return e.binder;
            return -1;
        }
    }

    private record Goal(Formula n, Formula f, NEnv ne, FEnv fe) {
    }

    /** Pair the parts {@code n[index…]} with {@code remaining} parts of the conclusion. */
    private record Pairing(List<Formula> n, List<NEnv> envs, int index, List<Formula> remaining, FEnv fe) {
    }

    private record Goals(Object head, Goals tail) {
    }

    private static final class Choice {
        final Goals rest;
        final Object goal;
        final int trailMark;
        final List<Object[]> alternatives;
        int next;

        Choice(Goals rest, Object goal, int trailMark, List<Object[]> alternatives) {
            this.rest = rest;
            this.goal = goal;
            this.trailMark = trailMark;
            this.alternatives = alternatives;
        }
    }

    /** Null when the step checks, else the reason it does not. */
    static String check(Formula premise, String premiseLabel, List<Symbol> fresh, Formula stated) {
        return new Search(Formulas.nnf(premise), premiseLabel, fresh, Formulas.normalizeJunctions(stated)).run();
    }

    private static final class Search {
        final Formula n;
        final String premise;
        final List<Symbol> fresh;
        final Formula f;
        // Formula nodes have identity equality, so these are identity maps with a fixed iteration order.
        final Map<Formula.Quantified, Term> skolem = new LinkedHashMap<>();
        final Map<Formula.Quantified, NEnv> skolemEnv = new LinkedHashMap<>();
        final Map<Formula.Quantified, List<Integer>> skolemBinders = new LinkedHashMap<>();
        final ArrayList<Formula.Quantified> trail = new ArrayList<>();
        final Shapes shapes;
        int binders;
        String reason;

        Search(Formula n, String premise, List<Symbol> fresh, Formula f) {
            this.n = n;
            this.premise = premise;
            this.fresh = fresh;
            this.f = f;
            this.shapes = new Shapes(Set.copyOf(fresh));
        }

        String run() {
            ArrayDeque<Choice> choices = new ArrayDeque<>();
            Goals goals = new Goals(new Goal(n, f, null, null), null);
            long budget = BUDGET;
            while (true) {
                if (--budget < 0) {
                    return "the walk beside nnf(" + premise + ") gave up after " + BUDGET + " steps";
                }
                if (goals == null) {
                    String bad = global();
                    if (bad == null) return null;
                    if (reason == null) reason = bad;
                    goals = backtrack(choices);
                    if (goals == null) return failure();
                    continue;
                }
                Object g = goals.head;
                List<Object[]> alts = expand(g);
                if (alts == null) { // failed
                    goals = backtrack(choices);
                    if (goals == null) return failure();
                    continue;
                }
                if (alts.size() == 1) {
                    goals = push(alts.get(0), goals.tail);
                    continue;
                }
                Choice c = new Choice(goals.tail, g, trail.size(), alts);
                choices.push(c);
                goals = backtrack(choices);
                if (goals == null) return failure();
            }
        }

        private String failure() {
            if (reason != null) return reason;
            return "the conclusion is not nnf(" + premise + ") with existentials replaced by Skolem terms of "
                    + names();
        }

        private String names() {
            List<String> out = new ArrayList<>();
            for (Symbol s : fresh) out.add(s.name());
            return out.isEmpty() ? "no symbol" : String.join(", ", out);
        }

        private Goals push(Object[] subgoals, Goals rest) {
            Goals gs = rest;
            for (int i = subgoals.length - 1; i >= 0; i--) gs = new Goals(subgoals[i], gs);
            return gs;
        }

        /** Resumes the newest choice with an untried alternative; null when none is left. */
        private Goals backtrack(ArrayDeque<Choice> choices) {
            while (!choices.isEmpty()) {
                Choice c = choices.peek();
                undo(c.trailMark);
                if (c.next < c.alternatives.size()) {
                    return push(c.alternatives.get(c.next++), c.rest);
                }
                choices.pop();
            }
            return null;
        }

        private void undo(int mark) {
            while (trail.size() > mark) {
                Formula.Quantified q = trail.remove(trail.size() - 1);
                skolem.remove(q);
                skolemEnv.remove(q);
                skolemBinders.remove(q);
            }
        }

        /**
         * The ways to discharge a goal: each alternative is an array of subgoals; null means the goal fails, and an
         * empty list of alternatives cannot happen.
         */
        private List<Object[]> expand(Object goal) {
            if (goal instanceof TermGoal tg) return matchTerms(tg) ? List.<Object[]>of(new Object[0]) : null;
            if (goal instanceof Pairing p) return pair(p);
            Goal g = (Goal) goal;
            Formula a = g.n;
            Formula b = g.f;
            if (a instanceof Formula.Quantified q && !q.universal()) {
                List<Object[]> alts = new ArrayList<>(2);
                if (b instanceof Formula.Quantified qb && !qb.universal()) {
                    int id = ++binders;
                    alts.add(new Object[] {new Goal(q.body(), qb.body(),
                            new NEnv(q.variable(), Kind.KEPT, qb.variable(), id, q, null, g.ne),
                            new FEnv(qb.variable(), id, g.fe))});
                }
                alts.add(new Object[] {new Goal(q.body(), b, replaced(q, g.ne), g.fe)});
                return alts;
            }
            if (a instanceof Formula.Quantified q) {
                if (!(b instanceof Formula.Quantified qb) || !qb.universal()) return null;
                int id = ++binders;
                return List.<Object[]>of(new Object[] {new Goal(q.body(), qb.body(),
                        new NEnv(q.variable(), Kind.UNIVERSAL, qb.variable(), id, q, null, g.ne),
                        new FEnv(qb.variable(), id, g.fe))});
            }
            if (a instanceof Formula.Constant ca) {
                return b instanceof Formula.Constant cb && ca.value() == cb.value() ? List.<Object[]>of(new Object[0]) : null;
            }
            if (a instanceof Formula.Atomic la) {
                if (!(b instanceof Formula.Atomic lb)) return null;
                Literal x = la.literal();
                Literal y = lb.literal();
                if (x.positive() != y.positive() || !x.atom().symbol().equals(y.atom().symbol())) return null;
                List<Object[]> alts = new ArrayList<>(2);
                alts.add(new Object[] {new TermGoal(x.atom(), y.atom(), g.ne, g.fe)});
                if (x.isEquation()) {
                    alts.add(new Object[] {new TermGoal(x.left(), y.right(), g.ne, g.fe),
                            new TermGoal(x.right(), y.left(), g.ne, g.fe)});
                }
                return alts;
            }
            if (a instanceof Formula.Junction ja) {
                if (!(b instanceof Formula.Junction jb) || (ja instanceof Formula.And) != (jb instanceof Formula.And)) {
                    return null;
                }
                List<Object[]> alts = new ArrayList<>(2);
                List<Formula> parts = new ArrayList<>();
                List<NEnv> envs = new ArrayList<>();
                boolean spliced = expandParts(ja, g.ne, true, parts, envs);
                if (parts.size() == jb.parts().size()) alts.add(new Object[] {new Pairing(parts, envs, 0, jb.parts(), g.fe)});
                if (spliced) {
                    List<Formula> whole = new ArrayList<>();
                    List<NEnv> wholeEnvs = new ArrayList<>();
                    expandParts(ja, g.ne, false, whole, wholeEnvs);
                    if (whole.size() == jb.parts().size()) {
                        alts.add(new Object[] {new Pairing(whole, wholeEnvs, 0, jb.parts(), g.fe)});
                    }
                    // Mixed: keep a spliceable part whole where the conclusion has a kept existential of its shape.
                    List<Formula> mixed = new ArrayList<>();
                    List<NEnv> mixedEnvs = new ArrayList<>();
                    if (expandMixed(ja, g.ne, jb, mixed, mixedEnvs) && mixed.size() == jb.parts().size()) {
                        alts.add(new Object[] {new Pairing(mixed, mixedEnvs, 0, jb.parts(), g.fe)});
                    }
                }
                return alts.isEmpty() ? null : alts;
            }
            return null; // nnf has no other connective
        }

        private NEnv replaced(Formula.Quantified q, NEnv outer) {
            return new NEnv(q.variable(), Kind.REPLACED, null, 0, q, outer, outer);
        }

        /** The parts of a junction, splicing through replaced existentials whose body is a like junction. */
        private boolean expandParts(Formula.Junction j, NEnv env, boolean splice, List<Formula> parts, List<NEnv> envs) {
            boolean and = j instanceof Formula.And;
            boolean any = false;
            ArrayDeque<Object[]> work = new ArrayDeque<>();
            for (int i = j.parts().size() - 1; i >= 0; i--) work.push(new Object[] {j.parts().get(i), env});
            while (!work.isEmpty()) {
                Object[] w = work.pop();
                Formula p = (Formula) w[0];
                NEnv e = (NEnv) w[1];
                if (splice && p instanceof Formula.Quantified q && !q.universal()) {
                    Formula body = q.body();
                    NEnv inner = replaced(q, e);
                    while (body instanceof Formula.Quantified qq && !qq.universal()) {
                        inner = replaced(qq, inner);
                        body = qq.body();
                    }
                    if (body instanceof Formula.Junction bj && (bj instanceof Formula.And) == and) {
                        any = true;
                        for (int i = bj.parts().size() - 1; i >= 0; i--) work.push(new Object[] {bj.parts().get(i), inner});
                        continue;
                    }
                }
                parts.add(p);
                envs.add(e);
            }
            return any;
        }

        /**
         * Splices each spliceable part unless the conclusion has an unused existential part of the same shape, which
         * it then takes as kept. True when this differs from both "splice all" and "splice none".
         */
        private boolean expandMixed(Formula.Junction j, NEnv env, Formula.Junction conclusion, List<Formula> parts,
                                    List<NEnv> envs) {
            List<Long> keptShapes = new ArrayList<>();
            for (Formula c : conclusion.parts()) {
                if (c instanceof Formula.Quantified q && !q.universal()) keptShapes.add(shapes.ofConclusion(c));
            }
            boolean and = j instanceof Formula.And;
            int kept = 0;
            int spliced = 0;
            // The same walk as expandParts, at every depth of splicing, with the choice made per part.
            ArrayDeque<Object[]> work = new ArrayDeque<>();
            for (int i = j.parts().size() - 1; i >= 0; i--) work.push(new Object[] {j.parts().get(i), env});
            while (!work.isEmpty()) {
                Object[] w = work.pop();
                Formula p = (Formula) w[0];
                NEnv e = (NEnv) w[1];
                Formula body = p;
                NEnv inner = e;
                while (body instanceof Formula.Quantified q && !q.universal()) {
                    inner = replaced(q, inner);
                    body = q.body();
                }
                boolean spliceable = body != p && body instanceof Formula.Junction bj && (bj instanceof Formula.And) == and;
                if (spliceable && !keptShapes.remove(shapes.ofPremise(p))) {
                    spliced++;
                    List<Formula> sub = ((Formula.Junction) body).parts();
                    for (int i = sub.size() - 1; i >= 0; i--) work.push(new Object[] {sub.get(i), inner});
                } else {
                    if (spliceable) kept++;
                    parts.add(p);
                    envs.add(e);
                }
            }
            return kept > 0 && spliced > 0;
        }

        private List<Object[]> pair(Pairing p) {
            if (p.index == p.n.size()) return p.remaining.isEmpty() ? List.<Object[]>of(new Object[0]) : null;
            Formula part = p.n.get(p.index);
            long key = shapes.ofPremise(part);
            List<Object[]> alts = new ArrayList<>();
            for (int k = 0; k < p.remaining.size(); k++) {
                Formula cand = p.remaining.get(k);
                if (shapes.ofConclusion(cand) != key) continue;
                List<Formula> rest = new ArrayList<>(p.remaining);
                rest.remove(k);
                alts.add(new Object[] {new Goal(part, cand, p.envs.get(p.index), p.fe),
                        new Pairing(p.n, p.envs, p.index + 1, rest, p.fe)});
            }
            return alts.isEmpty() ? null : alts;
        }

        private record TermGoal(Term n, Term f, NEnv ne, FEnv fe) {
        }

        private boolean matchTerms(TermGoal g) {
            ArrayDeque<Term> stack = new ArrayDeque<>();
            stack.push(g.n);
            stack.push(g.f);
            while (!stack.isEmpty()) {
                Term y = stack.pop();
                Term x = stack.pop();
                if (x instanceof Variable v) {
                    NEnv b = g.ne == null ? null : g.ne.lookup(v);
                    if (b == null) {
                        if (x != y) return false;
                        continue;
                    }
                    if (b.kind != Kind.REPLACED) {
                        if (y != b.image || FEnv.lookup(g.fe, (Variable) y) != b.binder) return false;
                        continue;
                    }
                    if (!skolemTerm(b, y, g.fe)) return false;
                    continue;
                }
                Application ax = (Application) x;
                if (!(y instanceof Application ay) || !ax.symbol().equals(ay.symbol())) return false;
                for (int i = 0; i < ax.arity(); i++) {
                    stack.push(ax.argument(i));
                    stack.push(ay.argument(i));
                }
            }
            return true;
        }

        /** An occurrence of a replaced existential's variable: it must stand as the same Skolem term everywhere. */
        private boolean skolemTerm(NEnv b, Term y, FEnv fe) {
            Formula.Quantified q = b.node;
            Term known = skolem.get(q);
            if (known != null && known != y) return false;
            if (!(y instanceof Application app) || !fresh.contains(app.symbol())) return false;
            // Arguments: distinct variables, each the image of a universal enclosing the existential, not shadowed.
            List<Integer> allowed = new ArrayList<>();
            for (NEnv e = b.outer; e != null; e = e.next) if (e.kind == Kind.UNIVERSAL) allowed.add(e.binder);
            List<Integer> seen = new ArrayList<>();
            for (int i = 0; i < app.arity(); i++) {
                if (!(app.argument(i) instanceof Variable w)) {
                    note("argument " + (i + 1) + " of " + Printer.term(app, 200) + " is not a variable");
                    return false;
                }
                int binder = FEnv.lookup(fe, w);
                if (!allowed.contains(binder) || seen.contains(binder)) {
                    note("stray argument " + w.name() + " in " + Printer.term(app, 200) + ": it is "
                            + (seen.contains(binder) ? "repeated" : "not a universally bound variable enclosing "
                            + describe(q)));
                    return false;
                }
                seen.add(binder);
            }
            if (known == null) {
                skolem.put(q, y);
                skolemEnv.put(q, b.outer);
                skolemBinders.put(q, seen);
                trail.add(q);
            }
            return true;
        }

        private void note(String why) {
            if (reason == null) reason = why;
        }

        /** The conditions on the whole replacement: one existential per symbol, every symbol used, no variable missing. */
        private String global() {
            Map<Symbol, Formula.Quantified> bySymbol = new LinkedHashMap<>();
            for (Map.Entry<Formula.Quantified, Term> e : skolem.entrySet()) {
                Application app = (Application) e.getValue();
                Formula.Quantified other = bySymbol.put(app.symbol(), e.getKey());
                if (other != null) {
                    return app.symbol().name() + " replaces two existentials, " + describe(other) + " and "
                            + describe(e.getKey()) + "; each Skolem symbol replaces exactly one";
                }
                String missing = missingVariable(e.getKey(), app);
                if (missing != null) return missing;
            }
            for (Symbol s : fresh) {
                if (!bySymbol.containsKey(s)) return s.name() + " is listed as fresh but replaces no existential";
            }
            return null;
        }

        /**
         * Every free variable of {@code exists y. φ} must be an argument of its Skolem term. A free variable that an
         * enclosing replaced existential binds stands for that existential's Skolem term, so its arguments count.
         */
        private String missingVariable(Formula.Quantified q, Application app) {
            NEnv outer = skolemEnv.get(q);
            List<Integer> args = skolemBinders.get(q);
            for (Variable u : Formulas.freeVariables(q)) {
                NEnv b = outer == null ? null : outer.lookup(u);
                if (b == null) continue;
                if (b.kind == Kind.KEPT) {
                    return "the free variable " + u.name() + " of " + describe(q) + " is bound by a kept existential, so "
                            + app.symbol().name() + " cannot take it as an argument; replace that existential too";
                }
                if (b.kind == Kind.REPLACED) {
                    List<Integer> inner = skolemBinders.get(b.node);
                    Term outerTerm = skolem.get(b.node);
                    if (inner == null) continue; // vacuous: nothing stands for it
                    if (!args.containsAll(inner)) {
                        return "the Skolem term " + Printer.term(app, 200) + " for " + describe(q) + " lacks a variable of "
                                + Printer.term(outerTerm, 200) + ", which stands for " + u.name() + " in it";
                    }
                    continue;
                }
                if (!args.contains(b.binder)) {
                    return "the Skolem term " + Printer.term(app, 200) + " for " + describe(q) + " lacks the variable "
                            + u.name() + ", which is free in the existential";
                }
            }
            return null;
        }
    }

    private static String describe(Formula.Quantified q) {
        return "the existential '" + Printer.formula(q, 80) + "'";
    }

    /**
     * Shape hashes that both sides agree on whatever the replacement: variables alike, existential quantifiers
     * transparent, Skolem terms of the listed symbols alike to variables, junctions commutative and flattened through
     * existentials over like junctions.
     */
    private static final class Shapes {
        private static final long VAR = 0x9E3779B97F4A7C15L;
        private final Set<Symbol> fresh;
        private final Map<Formula, Long> premiseMemo = new IdentityHashMap<>();
        private final Map<Formula, Long> conclusionMemo = new IdentityHashMap<>();

        Shapes(Set<Symbol> fresh) {
            this.fresh = fresh;
        }

        long ofPremise(Formula f) {
            return of(f, premiseMemo, false);
        }

        long ofConclusion(Formula f) {
            return of(f, conclusionMemo, true);
        }

        private long of(Formula root, Map<Formula, Long> memo, boolean conclusion) {
            Long known = memo.get(root);
            if (known != null) return known;
            ArrayDeque<Formula> stack = new ArrayDeque<>();
            stack.push(root);
            while (!stack.isEmpty()) {
                Formula f = stack.peek();
                if (memo.containsKey(f)) {
                    stack.pop();
                    continue;
                }
                List<Formula> kids = Formulas.children(f);
                boolean ready = true;
                for (Formula k : kids) {
                    if (!memo.containsKey(k)) {
                        stack.push(k);
                        ready = false;
                    }
                }
                if (!ready) continue;
                stack.pop();
                memo.put(f, node(f, memo, conclusion));
            }
            return memo.get(root);
        }

        private long node(Formula f, Map<Formula, Long> memo, boolean conclusion) {
            if (f instanceof Formula.Atomic a) return atom(a.literal(), conclusion);
            if (f instanceof Formula.Constant c) return c.value() ? 11 : 13;
            if (f instanceof Formula.Quantified q) {
                long body = memo.get(q.body());
                return q.universal() ? body * 31 + 17 : body; // existentials are transparent
            }
            if (f instanceof Formula.Junction j) {
                boolean and = j instanceof Formula.And;
                long sum = 0;
                ArrayDeque<Formula> parts = new ArrayDeque<>(j.parts());
                while (!parts.isEmpty()) {
                    Formula p = parts.pop();
                    Formula body = p;
                    while (body instanceof Formula.Quantified q && !q.universal()) body = q.body();
                    if (body != p && body instanceof Formula.Junction bj && (bj instanceof Formula.And) == and) {
                        for (Formula x : bj.parts()) parts.push(x);
                        continue;
                    }
                    long h = memo.containsKey(p) ? memo.get(p) : of(p, memo, conclusion);
                    sum += h * 0x2545F4914F6CDD1DL + (h >>> 29);
                }
                return sum * (and ? 7 : 5) + (and ? 1 : 2);
            }
            long h = 0;
            for (Formula k : Formulas.children(f)) h = h * 131 + memo.get(k);
            return h * 19 + f.getClass().getSimpleName().hashCode();
        }

        private long atom(Literal l, boolean conclusion) {
            Application a = l.atom();
            long h;
            if (a.isEquation()) {
                long x = term(a.argument(0), conclusion);
                long y = term(a.argument(1), conclusion);
                h = (x + y) * 41 + (x ^ y);
            } else {
                h = term(a, conclusion);
            }
            return l.positive() ? h : ~h;
        }

        private final Map<Term, Long> termMemoPremise = new HashMap<>();
        private final Map<Term, Long> termMemoConclusion = new HashMap<>();

        private long term(Term root, boolean conclusion) {
            Map<Term, Long> memo = conclusion ? termMemoConclusion : termMemoPremise;
            return Terms.fold(root, memo,
                    t -> t instanceof Variable || (conclusion && fresh.contains(((Application) t).symbol())) ? (Long) VAR : null,
                    (a, args) -> {
                        long h = a.symbol().hashCode();
                        for (long v : args) h = h * 1_000_003 + v;
                        return h;
                    });
        }
    }
}
