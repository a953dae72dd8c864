package dev.assay.kernel;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Most general unifiers with the occurs check, on the shared term graph.
 *
 * <p>The algorithm follows Huet's union-find formulation (as presented by Baader &amp; Snyder, "Unification Theory",
 * Handbook of Automated Reasoning, 2001, section 2.3; see also Martelli &amp; Montanari, ACM TOPLAS 4(2), 1982):
 * classes of terms that must be equal are merged, two classes holding applications are merged at most once so each
 * argument pair is pushed at most once, and the occurs check is a single cycle test of the class graph at the end.
 * Work is near-linear in the size of the term graph; nothing recurses on term depth.
 */
public final class Unification {

    private Unification() {
    }

    /** What came of a unification problem. */
    public sealed interface Result permits Unified, NotUnifiable {
    }

    public record Unified(Substitution unifier) implements Result {
    }

    /** Why no unifier exists: a clash of two symbols, or a variable that occurs in the term it must equal. */
    public record NotUnifiable(boolean occursCheck, String position, String explanation) implements Result {
        /** One line, for example {@code y occurs in next(y) (position 2)}. */
        public String describe() {
            return position.isEmpty() ? explanation : explanation + " (position " + position + ")";
        }
    }

    /** A position inside the terms being unified, kept as a parent chain so that pushing a child costs O(1). */
    private record Path(Path parent, int index) {
        String render() {
            ArrayList<Integer> steps = new ArrayList<>();
            for (Path p = this; p != null && p.index > 0; p = p.parent) steps.add(p.index);
            // Deep positions are shortened in the middle so that a message stays readable.
            StringBuilder sb = new StringBuilder();
            int n = steps.size();
            for (int i = n - 1; i >= 0; i--) {
                int depth = n - 1 - i;
                if (n > 40 && depth == 20) {
                    sb.append("….(").append(n - 30).append(" more levels)….");
                    i = 9;
                }
                sb.append(steps.get(i));
                if (i > 0) sb.append('.');
            }
            return sb.toString();
        }
    }

    private record Goal(Term left, Term right, Path path) {
    }

    /** A most general unifier of {@code left} and {@code right}. Positions in failures count from their arguments. */
    public static Result mostGeneralUnifier(TermFactory terms, Term left, Term right) {
        Substitution small = smallUnifier(terms, left, right);
        if (small != null) return new Unified(small);
        List<Term[]> pairs = new ArrayList<>();
        pairs.add(new Term[] {left, right});
        return mostGeneralUnifier(terms, pairs);
    }

    /** A most general simultaneous unifier of every pair. */
    public static Result mostGeneralUnifier(TermFactory terms, List<Term[]> pairs) {
        return new Solver(terms).solve(pairs);
    }

    /**
     * The Solver's unifier of a pair of at most {@link Small#NODES} nodes and {@link Small#VARIABLES} variables, or
     * null when the pair is larger, has no unifier, or is one the small path leaves to the Solver.
     */
    static Substitution smallUnifier(TermFactory terms, Term left, Term right) {
        if (left.treeSize() > Small.NODES || right.treeSize() > Small.NODES - left.treeSize()) return null;
        Substitution s = new Small(terms).unify(left, right);
        // A unifier by construction, and checked all the same, since the kernel builds its conclusions on it: one
        // that did not make the two terms equal would be left to the Solver.
        return s != null && s.apply(left) == s.apply(right) ? s : null;
    }

    /**
     * Robinson's algorithm (Robinson 1965, section 5) on a triangular substitution held in small arrays, for pairs
     * where the Solver's tables cost more than the work. It returns the Solver's
     * own unifier, not one equal up to renaming: it meets the goals in the Solver's order, binds a variable to a
     * variable by the Solver's rank rule, and unifies the arguments of the same two applications as the Solver. That
     * holds while every class of the Solver has at most two applications; where a third would join (an application
     * meeting another after it met its partner) it gives up, as it does on a clash or a cycle, and the Solver decides
     * and words the failure. Its recursion passes through at most {@link #VARIABLES} bindings, each at most
     * {@link #NODES} deep.
     */
    private static final class Small {
        static final int NODES = 64;
        static final int VARIABLES = 16;
        private final TermFactory terms;
        private Variable[] vars;
        private Term[] bound;
        private int[] rank;
        /** Pairs of applications whose arguments were unified; each application is in at most one. */
        private Term[] met;
        private int metCount;

        Small(TermFactory terms) {
            this.terms = terms;
        }

        Substitution unify(Term left, Term right) {
            vars = Terms.variablesOf(List.of(left, right)).toArray(new Variable[0]);
            if (vars.length > VARIABLES) return null;
            bound = new Term[vars.length];
            rank = new int[vars.length];
            // Each application is taken apart at most once, with one partner: one goal is pushed for every two
            // argument nodes, so a pair of n nodes never has more than n / 2 goals.
            int n = (int) (left.treeSize() + right.treeSize());
            met = new Term[n];
            Term[] goals = new Term[n + 2];
            int top = 0;
            goals[top++] = left;
            goals[top++] = right;
            while (top > 0) {
                Term r = goals[--top];
                Term l = goals[--top];
                if (l == r) continue;
                Term wl = walk(l);
                Term wr = walk(r);
                if (wl == wr) continue;
                if (wl instanceof Application al && wr instanceof Application ar) {
                    if (!al.symbol().equals(ar.symbol())) return null;
                    int seen = metBefore(al, ar);
                    if (seen > 0) continue;
                    if (seen < 0) return null;
                    met[metCount++] = al;
                    met[metCount++] = ar;
                    for (int i = al.arity() - 1; i >= 0; i--) {
                        goals[top++] = al.argument(i);
                        goals[top++] = ar.argument(i);
                    }
                } else if (wl instanceof Variable vl && wr instanceof Variable vr) {
                    int i = index(vl);
                    int j = index(vr);
                    // The Solver's union by rank: the left root stays on top unless the right one ranks higher.
                    if (rank[i] >= rank[j]) {
                        bound[j] = vl;
                        if (rank[i] == rank[j]) rank[i]++;
                    } else {
                        bound[i] = vr;
                    }
                } else if (wl instanceof Variable vl) {
                    bound[index(vl)] = wr;
                } else {
                    bound[index((Variable) wr)] = wl;
                }
            }
            return build();
        }

        /** 1 when {@code a} and {@code b} were unified with each other, -1 when either with another, else 0. */
        private int metBefore(Term a, Term b) {
            for (int k = 0; k < metCount; k++) {
                if (met[k] == a || met[k] == b) return met[k ^ 1] == (met[k] == a ? b : a) ? 1 : -1;
            }
            return 0;
        }

        private int index(Variable v) {
            int i = 0;
            while (vars[i] != v) i++;
            return i;
        }

        /** The unbound variable or the application that {@code t} stands for under the bindings so far. */
        private Term walk(Term t) {
            while (t instanceof Variable v) {
                Term b = bound[index(v)];
                if (b == null) return v;
                t = b;
            }
            return t;
        }

        /** The Solver's solved form: each variable that changes, in order, to its fully resolved term. */
        private Substitution build() {
            Term[] solved = new Term[vars.length];
            boolean[] open = new boolean[vars.length];
            LinkedHashMap<Variable, Term> out = new LinkedHashMap<>();
            for (int i = 0; i < vars.length; i++) {
                Term value = resolve(vars[i], solved, open);
                if (value == null) return null;
                if (value != vars[i]) out.put(vars[i], value);
            }
            return Substitution.owning(terms, out);
        }

        /** {@code t} with every bound variable resolved, or null when a variable would contain itself. */
        private Term resolve(Term t, Term[] solved, boolean[] open) {
            if (t.isGround()) return t;
            if (t instanceof Variable v) {
                int i = index(v);
                if (solved[i] != null || bound[i] == null) return solved[i] != null ? solved[i] : v;
                if (open[i]) return null;
                open[i] = true;
                return solved[i] = resolve(bound[i], solved, open);
            }
            Application a = (Application) t;
            Term[] args = a.argumentArray();
            Term[] mapped = null;
            for (int k = 0; k < args.length; k++) {
                Term m = resolve(args[k], solved, open);
                if (m == null) return null;
                if (m != args[k]) {
                    if (mapped == null) mapped = args.clone();
                    mapped[k] = m;
                }
            }
            return mapped == null ? a : terms.application(a.symbol(), mapped);
        }
    }

    private static final class Solver {
        private final TermFactory terms;
        /** The union-find record of a term that has been merged; terms never merged have none. */
        private static final class Node {
            Term parent;
            int rank;
            Application schema;
            Variable variable;
        }

        /** Keyed by identity: terms are hash-consed, so equal terms are the same object. */
        private final Map<Term, Node> nodes = new IdentityHashMap<>(8); // grows for larger problems
        private final Map<Variable, Path> boundAt = new HashMap<>();

        Solver(TermFactory terms) {
            this.terms = terms;
        }

        Term find(Term t) {
            Term root = t;
            for (Node n = nodes.get(root); n != null && n.parent != null; n = nodes.get(root)) root = n.parent;
            // Path compression.
            Term cur = t;
            while (cur != root) {
                Node n = nodes.get(cur);
                Term next = n.parent;
                n.parent = root;
                cur = next;
            }
            return root;
        }

        Application schemaOf(Term root) {
            return schemaOf(root, nodes.get(root));
        }

        Variable variableOf(Term root) {
            return variableOf(root, nodes.get(root));
        }

        /** The schema of the class of {@code root}, given the root's record {@code n} (null when it has none). */
        private static Application schemaOf(Term root, Node n) {
            if (n != null && n.schema != null) return n.schema;
            return root instanceof Application app ? app : null;
        }

        private static Variable variableOf(Term root, Node n) {
            if (n != null && n.variable != null) return n.variable;
            return root instanceof Variable var ? var : null;
        }

        /** Merges the classes of the roots {@code a} and {@code b}, given their records (null when they have none). */
        void union(Term a, Node na, Term b, Node nb) {
            if (na == null) {
                na = new Node();
                nodes.put(a, na);
            }
            if (nb == null) {
                nb = new Node();
                nodes.put(b, nb);
            }
            boolean aOnTop = na.rank >= nb.rank;
            Node top = aOnTop ? na : nb;
            Node low = aOnTop ? nb : na;
            Term topTerm = aOnTop ? a : b;
            Term lowTerm = aOnTop ? b : a;
            Application sch = schemaOf(topTerm, top);
            if (sch == null) sch = schemaOf(lowTerm, low);
            Variable var = variableOf(topTerm, top);
            if (var == null) var = variableOf(lowTerm, low);
            low.parent = topTerm;
            if (na.rank == nb.rank) top.rank++;
            if (sch != null) top.schema = sch;
            if (var != null) top.variable = var;
        }

        Result solve(List<Term[]> pairs) {
            ArrayDeque<Goal> stack = new ArrayDeque<>();
            for (int i = pairs.size() - 1; i >= 0; i--) stack.push(new Goal(pairs.get(i)[0], pairs.get(i)[1], null));
            while (!stack.isEmpty()) {
                Goal g = stack.pop();
                if (g.left == g.right) continue;
                Term rl = find(g.left);
                Term rr = find(g.right);
                if (rl == rr) continue;
                Node nl = nodes.get(rl);
                Node nr = nodes.get(rr);
                Application sl = schemaOf(rl, nl);
                Application sr = schemaOf(rr, nr);
                if (sl != null && sr != null) {
                    if (!sl.symbol().equals(sr.symbol())) return clash(g, sl, sr);
                    union(rl, nl, rr, nr);
                    for (int i = sl.arity() - 1; i >= 0; i--) {
                        stack.push(new Goal(sl.argument(i), sr.argument(i), new Path(g.path, i + 1)));
                    }
                } else {
                    Variable vl = variableOf(rl, nl);
                    Variable vr = variableOf(rr, nr);
                    if (vl != null && (sl != null || sr != null) && !boundAt.containsKey(vl)) boundAt.put(vl, g.path);
                    if (vr != null && (sl != null || sr != null) && !boundAt.containsKey(vr)) boundAt.put(vr, g.path);
                    union(rl, nl, rr, nr);
                }
            }
            // A cycle needs a class holding both a variable and an application, and every merge that makes one
            // records the variable in boundAt; with none, the graph is acyclic.
            if (!boundAt.isEmpty()) {
                NotUnifiable cycle = occursCheck(pairs);
                if (cycle != null) return cycle;
            }
            return new Unified(build(pairs));
        }

        private NotUnifiable clash(Goal g, Application sl, Application sr) {
            String at = g.path == null ? "" : g.path.render();
            StringBuilder sb = new StringBuilder();
            sb.append(sl.symbol().name()).append(" and ").append(sr.symbol().name()).append(" clash: ")
                    .append(Printer.term(sl, 200)).append(" against ").append(Printer.term(sr, 200));
            if (g.left != sl || g.right != sr) {
                sb.append(" (where ").append(Printer.term(g.left, 200)).append(" meets ")
                        .append(Printer.term(g.right, 200)).append(')');
            }
            return new NotUnifiable(false, at, sb.toString());
        }

        /** Finds a cycle in the graph of classes: a variable that would have to contain itself. */
        private NotUnifiable occursCheck(List<Term[]> pairs) {
            Map<Term, Integer> colour = new HashMap<>(); // 1 on the current path, 2 finished
            ArrayDeque<Term> path = new ArrayDeque<>();
            ArrayDeque<int[]> next = new ArrayDeque<>();
            for (Term[] pair : pairs) {
                for (Term start : pair) {
                    Term r0 = find(start);
                    if (colour.containsKey(r0)) continue;
                    colour.put(r0, 1);
                    path.push(r0);
                    next.push(new int[] {0});
                    while (!path.isEmpty()) {
                        Term r = path.peek();
                        Application s = schemaOf(r);
                        int[] i = next.peek();
                        // A class whose schema is ground is on no cycle: each application of a class has its
                        // arguments in the classes of the schema's (their arguments were unified when they met), a
                        // class holds at most one ground term (two would have clashed), so every path from here
                        // passes through classes of ever smaller ground terms and cannot come back. Nor can it reach
                        // a class on a cycle, so leaving it out does not change which cycle is found first.
                        if (s == null || s.isGround() || i[0] >= s.arity()) {
                            colour.put(r, 2);
                            path.pop();
                            next.pop();
                            continue;
                        }
                        Term child = find(s.argument(i[0]++));
                        Integer c = colour.get(child);
                        if (c == null) {
                            colour.put(child, 1);
                            path.push(child);
                            next.push(new int[] {0});
                        } else if (c == 1) {
                            return describeCycle(child, path);
                        }
                    }
                }
            }
            return null;
        }

        private NotUnifiable describeCycle(Term entry, ArrayDeque<Term> path) {
            // The cycle is the part of the DFS path from entry to the top of the stack: the schema of each class has
            // an argument in the next class, and the last one's has an argument back in the first.
            List<Term> cycle = new ArrayList<>();
            for (var it = path.descendingIterator(); it.hasNext(); ) {
                Term r = it.next();
                if (r == entry || !cycle.isEmpty()) cycle.add(r);
            }
            int k = cycle.size();
            // Name each class by the variable through which the previous class reaches it, where there is one.
            Variable[] names = new Variable[k];
            for (int i = 0; i < k; i++) {
                Term next = cycle.get((i + 1) % k);
                for (Term arg : schemaOf(cycle.get(i)).argumentArray()) {
                    if (find(arg) == next && arg instanceof Variable v) names[(i + 1) % k] = v;
                }
                if (names[(i + 1) % k] == null) names[(i + 1) % k] = variableOf(next);
            }
            int start = 0;
            while (start < k && names[start] == null) start++;
            if (start == k) start = 0;
            Variable v = names[start];
            StringBuilder sb = new StringBuilder();
            sb.append(v == null ? "a variable" : v.name()).append(" occurs in ")
                    .append(Printer.term(schemaOf(cycle.get(start)), 200));
            // Classes of the cycle that hold a variable explain the chain; the others are subterms on the way.
            List<String> chain = new ArrayList<>();
            for (int i = 1; i < k; i++) {
                int at = (start + i) % k;
                if (names[at] != null) chain.add(names[at].name() + " := " + Printer.term(schemaOf(cycle.get(at)), 200));
            }
            if (!chain.isEmpty()) sb.append(" once ").append(String.join(", ", chain));
            Path where = v == null ? null : boundAt.get(variableOf(cycle.get(start)));
            if (where == null && v != null) where = boundAt.get(v);
            return new NotUnifiable(true, where == null ? "" : where.render(), sb.toString());
        }

        private Substitution build(List<Term[]> pairs) {
            List<Term> roots = new ArrayList<>(2 * pairs.size());
            for (Term[] pair : pairs) roots.addAll(Arrays.asList(pair));
            List<Variable> vars = Terms.variablesOf(roots);
            Map<Term, Term> solved = null;
            LinkedHashMap<Variable, Term> out = new LinkedHashMap<>();
            for (Variable v : vars) {
                Term root = find(v);
                Application schema = schemaOf(root);
                Term value;
                if (schema == null || schema.isGround()) {
                    // What resolve would return at once: the root of a class without an application, or the
                    // class's ground application.
                    value = schema == null ? root : schema;
                } else {
                    if (solved == null) solved = new HashMap<>();
                    value = resolve(root, solved);
                }
                if (value != v) out.put(v, value);
            }
            return Substitution.owning(terms, out);
        }

        /** The term a class stands for, with every argument class resolved; the graph is acyclic here. */
        private Term resolve(Term root, Map<Term, Term> solved) {
            ArrayDeque<Term> stack = new ArrayDeque<>();
            stack.push(root);
            while (!stack.isEmpty()) {
                Term r = stack.peek();
                if (solved.containsKey(r)) {
                    stack.pop();
                    continue;
                }
                Application s = schemaOf(r);
                if (s == null || s.isGround()) {
                    // A ground application stands for itself: its argument classes need not be resolved.
                    solved.put(r, s == null ? r : s);
                    stack.pop();
                    continue;
                }
                boolean ready = true;
                Term[] args = new Term[s.arity()];
                for (int i = 0; i < args.length; i++) {
                    Term c = find(s.argument(i));
                    Term done = solved.get(c);
                    if (done == null) {
                        ready = false;
                        stack.push(c);
                    } else {
                        args[i] = done;
                    }
                }
                if (!ready) continue;
                stack.pop();
                solved.put(r, s.isGround() ? s : terms.application(s.symbol(), args));
            }
            return solved.get(root);
        }
    }
}
