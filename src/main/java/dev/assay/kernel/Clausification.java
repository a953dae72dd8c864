package dev.assay.kernel;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The evaluation check of {@code clausify}: with every literal occurrence of {@code Mθ} that is a literal of the
 * clause set false and every other one set true, {@code Mθ} must evaluate to false. Because {@code M} is in
 * negation normal form it is monotone in its literal occurrences, so this shows that {@code Mθ} entails the clause.
 */
final class Clausification {

    /** Search steps allowed when looking for θ; running out is a rejection. */
    static final long SEARCH_BUDGET = 1_000_000;

    private Clausification() {
    }

    /** {@code N} less its universal quantifiers; null when an existential quantifier remains. */
    static Formula stripUniversals(Formula nnf) {
        ArrayDeque<Object> work = new ArrayDeque<>();
        ArrayList<Formula> results = new ArrayList<>();
        work.push(nnf);
        while (!work.isEmpty()) {
            Object item = work.pop();
            if (item instanceof Integer count) {
                boolean and = count > 0;
                int n = Math.abs(count);
                List<Formula> parts = new ArrayList<>(results.subList(results.size() - n, results.size()));
                results.subList(results.size() - n, results.size()).clear();
                results.add(and ? new Formula.And(parts) : new Formula.Or(parts));
                continue;
            }
            Formula f = (Formula) item;
            if (f instanceof Formula.Quantified q) {
                if (!q.universal()) return null;
                work.push(q.body());
            } else if (f instanceof Formula.Junction j) {
                work.push(j instanceof Formula.And ? j.parts().size() : -j.parts().size());
                for (int i = j.parts().size() - 1; i >= 0; i--) work.push(j.parts().get(i));
            } else {
                results.add(f); // literal or constant: nnf leaves nothing else
            }
        }
        return results.get(0);
    }

    /** Evaluates {@code m} under θ as the rule says; true means the check fails. */
    static boolean evaluate(Formula m, Substitution theta, Set<Literal> clause) {
        Map<Term, Term> memo = new HashMap<>();
        // Post-order evaluation with short-circuit over an explicit stack.
        ArrayDeque<Object> work = new ArrayDeque<>();
        ArrayDeque<Boolean> values = new ArrayDeque<>();
        work.push(m);
        while (!work.isEmpty()) {
            Object item = work.pop();
            if (item instanceof Combine c) {
                boolean acc = c.and;
                for (int i = 0; i < c.count; i++) {
                    boolean v = values.pop();
                    acc = c.and ? acc && v : acc || v;
                }
                values.push(acc);
                continue;
            }
            Formula f = (Formula) item;
            if (f instanceof Formula.Constant k) {
                values.push(k.value());
            } else if (f instanceof Formula.Atomic a) {
                Literal l = a.literal();
                Literal inst = new Literal(l.positive(), (Application) theta.apply(l.atom(), memo));
                values.push(!clause.contains(inst));
            } else if (f instanceof Formula.Junction j) {
                work.push(new Combine(j instanceof Formula.And, j.parts().size()));
                for (Formula p : j.parts()) work.push(p);
            } else {
                throw new IllegalStateException("not a quantifier-free negation normal form: " + f);
            }
        }
        return values.pop();
    }

    private record Combine(boolean and, int count) {
    }

    private record Goals(Formula head, Goals tail) {
    }

    private static final class Choice {
        final Goals rest;
        final Formula node;
        final int trailMark;
        int next;

        Choice(Goals rest, Formula node, int trailMark) {
            this.rest = rest;
            this.node = node;
            this.trailMark = trailMark;
        }
    }

    /** The outcome of a search: a θ that falsifies, none, or the budget ran out first. */
    record Search(Substitution theta, boolean exhausted) {
    }

    /**
     * Looks for θ making {@code m} false: an {@code or} needs every part false, an {@code and} one part, a literal
     * must match a literal of the clause (the clause's terms are rigid). Backtracking with an undo trail.
     */
    static Search findTheta(TermFactory terms, Formula m, List<Literal> clause) {
        Map<Variable, Term> theta = new HashMap<>();
        ArrayList<Variable> trail = new ArrayList<>();
        ArrayDeque<Choice> choices = new ArrayDeque<>();
        Goals goals = new Goals(m, null);
        long budget = SEARCH_BUDGET;
        boolean backtrack = false;
        while (true) {
            if (--budget < 0) return new Search(null, true);
            if (backtrack) {
                backtrack = false;
                // The rest of the goals may be empty (null) after a success, so success has its own flag.
                boolean resumed = false;
                Goals next = null;
                while (!choices.isEmpty() && !resumed) {
                    Choice c = choices.peek();
                    undo(theta, trail, c.trailMark);
                    if (c.node instanceof Formula.And and) {
                        if (c.next < and.parts().size()) {
                            next = new Goals(and.parts().get(c.next++), c.rest);
                            resumed = true;
                        } else {
                            choices.pop();
                        }
                    } else {
                        Literal pattern = ((Formula.Atomic) c.node).literal();
                        while (c.next < clause.size() * 2 && !resumed) {
                            int k = c.next++;
                            boolean flip = (k & 1) == 1;
                            Literal target = clause.get(k / 2);
                            if (flip && !pattern.isEquation()) continue;
                            if (match(pattern, target, flip, theta, trail)) {
                                next = c.rest;
                                resumed = true;
                            } else {
                                undo(theta, trail, c.trailMark);
                            }
                            if (--budget < 0) return new Search(null, true);
                        }
                        if (!resumed) choices.pop();
                    }
                }
                if (!resumed) return new Search(null, false);
                goals = next;
                continue;
            }
            if (goals == null) {
                Map<Variable, Term> ordered = new LinkedHashMap<>();
                for (Variable v : trail) ordered.put(v, theta.get(v));
                return new Search(new Substitution(terms, ordered), false);
            }
            Formula g = goals.head;
            Goals rest = goals.tail;
            if (g instanceof Formula.Constant k) {
                if (k.value()) backtrack = true;
                else goals = rest;
            } else if (g instanceof Formula.Or or) {
                Goals gs = rest;
                for (int i = or.parts().size() - 1; i >= 0; i--) gs = new Goals(or.parts().get(i), gs);
                goals = gs;
            } else {
                choices.push(new Choice(rest, g, trail.size()));
                backtrack = true; // take the first alternative through the common path
            }
        }
    }

    private static void undo(Map<Variable, Term> theta, ArrayList<Variable> trail, int mark) {
        while (trail.size() > mark) theta.remove(trail.remove(trail.size() - 1));
    }

    /** One-way matching of a pattern literal onto a rigid clause literal, extending θ. */
    private static boolean match(Literal pattern, Literal target, boolean flip, Map<Variable, Term> theta,
                                 ArrayList<Variable> trail) {
        if (pattern.positive() != target.positive()) return false;
        Application p = pattern.atom();
        Application t = target.atom();
        if (!p.symbol().equals(t.symbol())) return false;
        ArrayDeque<Term> stack = new ArrayDeque<>();
        if (flip) {
            stack.push(p.argument(0));
            stack.push(t.argument(1));
            stack.push(p.argument(1));
            stack.push(t.argument(0));
        } else {
            stack.push(p);
            stack.push(t);
        }
        while (!stack.isEmpty()) {
            Term y = stack.pop();
            Term x = stack.pop();
            if (x.isGround()) {
                if (x != y) return false;
                continue;
            }
            if (x instanceof Variable v) {
                Term bound = theta.get(v);
                if (bound == null) {
                    theta.put(v, y);
                    trail.add(v);
                } else if (bound != y) {
                    return false;
                }
                continue;
            }
            if (!(y instanceof Application ya)) return false;
            Application xa = (Application) x;
            if (!xa.symbol().equals(ya.symbol())) return false;
            for (int i = 0; i < xa.arity(); i++) {
                stack.push(xa.argument(i));
                stack.push(ya.argument(i));
            }
        }
        return true;
    }
}
