package dev.assay.prover;

import dev.assay.kernel.Application;
import dev.assay.kernel.Literal;
import dev.assay.kernel.Substitution;
import dev.assay.kernel.Symbol;
import dev.assay.kernel.Term;
import dev.assay.kernel.TermFactory;
import dev.assay.kernel.Unification;
import dev.assay.kernel.Variable;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.PriorityQueue;
import java.util.Set;

/**
 * The given-clause loop (the DISCOUNT loop of Avenhaus, Denzinger &amp; Fuchs 1995, as in E): a clause is taken from the
 * passive set by weight, or by age every {@link Options#ageEvery()}-th time, simplified by the active set, and if it
 * survives it simplifies the active set, joins it, and every inference between it and the active clauses goes to the
 * passive set.
 *
 * <p>The calculus is superposition with selection (Bachmair &amp; Ganzinger, "Rewrite-based equational theorem proving
 * with selection and simplification", J. Logic Comput. 4(3), 1994): binary resolution and factoring on predicate
 * atoms, paramodulation into non-variable subterms (superposition), equality resolution and equality factoring, all
 * restricted to literals that are maximal under {@link TermOrder} or selected (a negative literal of greatest weight,
 * when {@link Options#selectNegative()} is on). Simplification: rewriting by unit equations (demodulation), deletion
 * of tautologies and of trivial disequations {@code t != t}, forward and backward subsumption. Unifiers are the
 * kernel's most general unifiers with the occurs check.
 */
final class Saturation {

    record Options(boolean selectNegative, int ageEvery, long deadlineNanos, long maxPassive) {
    }

    enum Status { PROOF, SATURATED, TIMEOUT, MEMORY }

    record Result(Status status, ProverClause empty, int given, int kept, int generated) {
    }

    /** Called now and then during the search. */
    interface Progress {
        void report(int given, int kept, long elapsedMillis);
    }

    private static final class OutOfTime extends RuntimeException {
        OutOfTime() {
            super(null, null, false, false);
        }
    }

    private static final class ProofFound extends RuntimeException {
        final ProverClause empty;

        ProofFound(ProverClause empty) {
            super(null, null, false, false);
            this.empty = empty;
        }
    }

    private record Key(boolean positive, Symbol symbol) {
    }

    private record LiteralRef(ProverClause clause, int index) {
    }

    private record SubtermRef(ProverClause clause, int index, int[] path, Application term) {
    }

    /** A side of an equation that may be rewritten from: the left side as written when {@code left}. */
    private record SideRef(ProverClause clause, int index, boolean left) {
        Term from() {
            Literal l = clause.literals[index];
            return left ? l.left() : l.right();
        }

        Term to() {
            Literal l = clause.literals[index];
            return left ? l.right() : l.left();
        }
    }

    private final TermFactory terms;
    private final TermOrder order = new TermOrder();
    private final String prefix;
    private final ProofStep.Counter counter;
    private final Options options;
    private final Progress progress;
    private final long start = System.nanoTime();

    private final Set<ProverClause> active = new LinkedHashSet<>();
    private final PriorityQueue<ProverClause> byWeight = new PriorityQueue<>(
            Comparator.comparingInt((ProverClause c) -> c.weight).thenComparingInt(ProverClause::sequence));
    private final ArrayDeque<ProverClause> byAge = new ArrayDeque<>();
    private int passive;
    private int picks;
    private int given;
    private int generated;
    private long lastReport = System.nanoTime();

    private final Map<Key, List<LiteralRef>> resolutionIndex = new HashMap<>();
    private final Map<Symbol, List<SubtermRef>> intoIndex = new HashMap<>();
    private final Map<Symbol, List<SideRef>> fromIndex = new HashMap<>();
    private final List<SideRef> variableSides = new ArrayList<>();
    private final Map<Symbol, List<SideRef>> rewriteIndex = new HashMap<>();
    private final Map<Key, List<ProverClause>> subsumptionIndex = new HashMap<>();
    private final Map<Key, List<ProverClause>> literalIndex = new HashMap<>();
    private int stamp;

    Saturation(TermFactory terms, String variablePrefix, ProofStep.Counter counter, Options options, Progress progress) {
        this.terms = terms;
        this.prefix = variablePrefix;
        this.counter = counter;
        this.options = options;
        this.progress = progress;
    }

    Result run(List<ProverClause> input) {
        try {
            for (ProverClause c : input) {
                if (c.isEmpty()) return result(Status.PROOF, c);
                addPassive(c);
            }
            return loop();
        } catch (ProofFound p) {
            return result(Status.PROOF, p.empty);
        } catch (OutOfTime t) {
            return result(Status.TIMEOUT, null);
        } catch (OutOfMemoryError e) {
            return result(Status.MEMORY, null);
        }
    }

    private Result result(Status s, ProverClause empty) {
        return new Result(s, empty, given, active.size() + passive, generated);
    }

    private Result loop() {
        Runtime rt = Runtime.getRuntime();
        for (long round = 1; ; round++) {
            checkTime();
            if (round % 256 == 0 && rt.totalMemory() - rt.freeMemory() > 0.85 * rt.maxMemory()) {
                System.gc();
                if (rt.totalMemory() - rt.freeMemory() > 0.8 * rt.maxMemory()) return result(Status.MEMORY, null);
            }
            if (passive > options.maxPassive()) return result(Status.MEMORY, null);
            ProverClause g = nextGiven();
            if (g == null) return result(Status.SATURATED, null);
            g = simplify(g);
            if (g.isEmpty()) return result(Status.PROOF, g);
            if (isTautology(g) || subsumed(g)) continue;
            given++;
            activate(g);
            generate(g);
            report();
        }
    }

    private void report() {
        if (progress == null) return;
        long now = System.nanoTime();
        if (now - lastReport > 200_000_000L) {
            lastReport = now;
            progress.report(given, active.size() + passive, (now - start) / 1_000_000);
        }
    }

    private void checkTime() {
        if (System.nanoTime() - options.deadlineNanos() > 0) throw new OutOfTime();
    }

    // ---------------------------------------------------------------- passive set

    private void addPassive(ProverClause c) {
        byWeight.add(c);
        byAge.add(c);
        passive++;
    }

    private ProverClause nextGiven() {
        while (passive > 0) {
            boolean byAgeNow = options.ageEvery() > 0 && ++picks % options.ageEvery() == 0;
            ProverClause c = byAgeNow ? byAge.poll() : byWeight.poll();
            if (c == null) return null;
            if (c.taken) continue;
            c.taken = true;
            passive--;
            return c;
        }
        return null;
    }

    // ---------------------------------------------------------------- making clauses

    /** A clause of these literals (duplicates removed, variables renamed to the prover's names) and inference. */
    private ProverClause make(List<Literal> literals, Inference inference) {
        Set<Literal> set = new LinkedHashSet<>(literals);
        Set<Variable> vars = new LinkedHashSet<>();
        for (Literal l : set) Subterms.collectVariables(l.atom(), vars);
        Map<Variable, Term> renaming = new LinkedHashMap<>();
        int k = 1;
        boolean identity = true;
        for (Variable v : vars) {
            Variable target = terms.variable(prefix + k++);
            renaming.put(v, target);
            identity &= target == v;
        }
        Literal[] out = new Literal[set.size()];
        Substitution s = new Substitution(terms, renaming);
        int i = 0;
        for (Literal l : set) out[i++] = identity ? l : s.apply(l);
        generated++;
        if ((generated & 1023) == 0) checkTime();
        return new ProverClause(counter.next(), out, inference);
    }

    /** The clause with its variables renamed to names no clause of the search uses. */
    private Literal[] renamedApart(ProverClause c) {
        Set<Variable> vars = Subterms.variables(c.literals);
        if (vars.isEmpty()) return c.literals;
        Substitution s = new Substitution(terms, Subterms.renaming(terms, vars, "'"));
        Literal[] out = new Literal[c.literals.length];
        for (int i = 0; i < out.length; i++) out[i] = s.apply(c.literals[i]);
        return out;
    }

    private static Literal[] apply(Substitution s, Literal[] ls) {
        Literal[] out = new Literal[ls.length];
        for (int i = 0; i < ls.length; i++) out[i] = s.apply(ls[i]);
        return out;
    }

    private Substitution unify(Term a, Term b) {
        Unification.Result r = Unification.mostGeneralUnifier(terms, a, b);
        return r instanceof Unification.Unified u ? u.unifier() : null;
    }

    static boolean isTautology(ProverClause c) {
        Set<Literal> set = new LinkedHashSet<>(List.of(c.literals));
        return Clausifier.isTautology(set);
    }

    // ---------------------------------------------------------------- eligibility

    private boolean eligibleAfter(ProverClause c, Literal[] instantiated, int i) {
        if (c.selected >= 0) return i == c.selected;
        return order.maximal(instantiated, i);
    }

    private void select(ProverClause c) {
        c.selected = -1;
        if (options.selectNegative()) {
            long best = -1;
            for (int i = 0; i < c.literals.length; i++) {
                Literal l = c.literals[i];
                if (!l.positive() && l.atom().treeSize() > best) {
                    best = l.atom().treeSize();
                    c.selected = i;
                }
            }
        }
        c.eligible = new boolean[c.literals.length];
        for (int i = 0; i < c.literals.length; i++) {
            c.eligible[i] = c.selected >= 0 ? i == c.selected : order.maximal(c.literals, i);
        }
    }

    /** Whether the side {@code from} of an equation may be rewritten from, given the other side (before or after σ). */
    private boolean sideUsable(Term from, Term to) {
        TermOrder.Comparison c = order.compare(to, from);
        return c != TermOrder.Comparison.GREATER && c != TermOrder.Comparison.EQUAL;
    }

    // ---------------------------------------------------------------- active set and indexes

    private static <K, V> void put(Map<K, List<V>> m, K k, V v) {
        m.computeIfAbsent(k, x -> new ArrayList<>()).add(v);
    }

    private static Key key(Literal l) {
        return new Key(l.positive(), l.atom().symbol());
    }

    private void activate(ProverClause g) {
        select(g);
        backwardSubsumption(g);
        if (g.isUnitEquation()) {
            indexRewriteRule(g);
            backwardRewriting(g);
        }
        active.add(g);
        for (int i = 0; i < g.literals.length; i++) {
            Literal l = g.literals[i];
            put(literalIndex, key(l), g);
            if (!g.eligible[i]) continue;
            if (!l.isEquation()) put(resolutionIndex, key(l), new LiteralRef(g, i));
            for (Subterms.Occurrence o : Subterms.occurrences(l.atom())) {
                put(intoIndex, o.term().symbol(), new SubtermRef(g, i, o.path(), o.term()));
            }
            if (l.isEquation() && l.positive() && g.selected < 0) {
                for (boolean left : new boolean[] {true, false}) {
                    SideRef side = new SideRef(g, i, left);
                    if (!sideUsable(side.from(), side.to())) continue;
                    if (side.from() instanceof Application a) put(fromIndex, a.symbol(), side);
                    else variableSides.add(side);
                }
            }
        }
        Literal heaviest = g.literals[0];
        for (Literal l : g.literals) if (l.atom().treeSize() > heaviest.atom().treeSize()) heaviest = l;
        put(subsumptionIndex, key(heaviest), g);
    }

    /** A unit equation rewrites from a side that is not a variable and holds every variable of the other side. */
    private void indexRewriteRule(ProverClause g) {
        for (boolean left : new boolean[] {true, false}) {
            SideRef side = new SideRef(g, 0, left);
            Set<Variable> fromVars = new LinkedHashSet<>();
            Set<Variable> toVars = new LinkedHashSet<>();
            Subterms.collectVariables(side.from(), fromVars);
            Subterms.collectVariables(side.to(), toVars);
            if (side.from() instanceof Application a && fromVars.containsAll(toVars)
                    && order.compare(side.to(), side.from()) != TermOrder.Comparison.GREATER) {
                put(rewriteIndex, a.symbol(), side);
            }
        }
    }

    private void remove(ProverClause c) {
        c.removed = true;
        active.remove(c);
    }

    // ---------------------------------------------------------------- subsumption

    private boolean subsumed(ProverClause d) {
        stamp++;
        for (Literal l : d.literals) {
            List<ProverClause> candidates = subsumptionIndex.get(key(l));
            if (candidates == null) continue;
            for (ProverClause c : candidates) {
                if (c.removed || c.mark == stamp) continue;
                c.mark = stamp;
                if (Matching.subsumes(c.literals, d.literals)) return true;
            }
        }
        return false;
    }

    private void backwardSubsumption(ProverClause g) {
        Literal heaviest = g.literals[0];
        for (Literal l : g.literals) if (l.atom().treeSize() > heaviest.atom().treeSize()) heaviest = l;
        List<ProverClause> candidates = literalIndex.get(key(heaviest));
        if (candidates == null) return;
        Set<ProverClause> dead = new LinkedHashSet<>();
        for (ProverClause c : candidates) {
            if (c.removed || c == g || dead.contains(c)) continue;
            if (Matching.subsumes(g.literals, c.literals)) dead.add(c);
        }
        for (ProverClause c : dead) remove(c);
    }

    // ---------------------------------------------------------------- rewriting

    private record Rewrite(SideRef rule, int index, int[] path, Term replacement) {
    }

    /** Rewrites with the active unit equations until none applies, then drops trivial disequations. */
    private ProverClause simplify(ProverClause c) {
        while (true) {
            Rewrite r = findRewrite(c, null);
            if (r == null) break;
            List<Literal> lits = new ArrayList<>(List.of(c.literals));
            Literal target = c.literals[r.index];
            lits.set(r.index, new Literal(target.positive(), Subterms.replace(terms, target.atom(), r.path, r.replacement)));
            Inference inf = new Inference.Paramodulation(r.rule.clause(), 0, r.rule.left(), c, r.index, r.path);
            c = make(lits, inf);
        }
        while (true) {
            int trivial = -1;
            for (int i = 0; i < c.literals.length; i++) {
                Literal l = c.literals[i];
                if (!l.positive() && l.isEquation() && l.left() == l.right()) trivial = i;
            }
            if (trivial < 0) return c;
            List<Literal> lits = new ArrayList<>(List.of(c.literals));
            lits.remove(trivial);
            c = make(lits, new Inference.EqualityResolution(c, trivial));
        }
    }

    /** A rewrite of {@code c} by an active unit equation (by {@code only} when it is not null). */
    private Rewrite findRewrite(ProverClause c, ProverClause only) {
        for (int j = 0; j < c.literals.length; j++) {
            Literal l = c.literals[j];
            for (Subterms.Occurrence o : Subterms.occurrences(l.atom())) {
                List<SideRef> rules = rewriteIndex.get(o.term().symbol());
                if (rules == null) continue;
                for (SideRef rule : rules) {
                    ProverClause unit = rule.clause();
                    if (unit.removed || unit == c || only != null && unit != only) continue;
                    Map<Variable, Term> m = Matching.match(rule.from(), o.term());
                    if (m == null) continue;
                    Term replacement = new Substitution(terms, m).apply(rule.to());
                    if (!order.greater(o.term(), replacement)) continue;
                    if (!rewriteKeepsCompleteness(c, j, o.path(), o.term(), replacement)) continue;
                    return new Rewrite(rule, j, o.path(), replacement);
                }
            }
        }
        return null;
    }

    /**
     * Rewriting the whole side of a positive equation is a simplification only when the clause is greater than the
     * instance of the unit used (Bachmair &amp; Ganzinger 1994); otherwise the rewrite is skipped.
     */
    private boolean rewriteKeepsCompleteness(ProverClause c, int j, int[] path, Term from, Term to) {
        Literal l = c.literals[j];
        if (!l.positive() || !l.isEquation() || path.length != 1) return true;
        Literal instance = new Literal(true, terms.equation(from, to));
        for (int k = 0; k < c.literals.length; k++) {
            TermOrder.Comparison cmp = order.compare(c.literals[k], instance);
            if (cmp == TermOrder.Comparison.GREATER) return true;
            if (cmp == TermOrder.Comparison.EQUAL && c.literals.length > 1) return true;
        }
        return false;
    }

    /** Active clauses the new unit rewrites leave the active set; their rewritten forms go to the passive set. */
    private void backwardRewriting(ProverClause unit) {
        List<ProverClause> rewritten = new ArrayList<>();
        for (ProverClause c : active) {
            if (!c.removed && c != unit && findRewrite(c, unit) != null) rewritten.add(c);
        }
        for (ProverClause c : rewritten) {
            remove(c);
            ProverClause n = simplify(c);
            if (n.isEmpty()) throw new ProofFound(n);
            if (!isTautology(n)) addPassive(n);
        }
    }

    // ---------------------------------------------------------------- inferences

    private void emit(ProverClause n) {
        n = simplify(n);
        if (n.isEmpty()) throw new ProofFound(n);
        if (isTautology(n) || subsumed(n)) return;
        addPassive(n);
    }

    private void generate(ProverClause g) {
        Literal[] gr = renamedApart(g);
        for (int i = 0; i < g.literals.length; i++) {
            if (!g.eligible[i]) continue;
            Literal l = gr[i];
            if (!l.isEquation()) resolve(g, gr, i);
            if (l.isEquation() && !l.positive()) equalityResolution(g, i);
            if (l.isEquation() && l.positive() && g.selected < 0) {
                superposeFrom(g, gr, i);
                equalityFactoring(g, i);
            }
            if (!l.isEquation() && l.positive() && g.selected < 0) factor(g, i);
            superposeInto(g, gr, i);
        }
    }

    private void resolve(ProverClause g, Literal[] gr, int i) {
        Literal l = gr[i];
        List<LiteralRef> partners = resolutionIndex.get(new Key(!l.positive(), l.atom().symbol()));
        if (partners == null) return;
        for (LiteralRef p : partners) {
            ProverClause c = p.clause();
            if (c.removed) continue;
            Substitution s = unify(l.atom(), c.literals[p.index()].atom());
            if (s == null) continue;
            Literal[] gs = apply(s, gr);
            Literal[] cs = apply(s, c.literals);
            if (!eligibleAfter(g, gs, i) || !eligibleAfter(c, cs, p.index())) continue;
            List<Literal> out = new ArrayList<>();
            for (int k = 0; k < gr.length; k++) if (!gr[k].equals(gr[i])) out.add(gs[k]);
            for (int k = 0; k < cs.length; k++) if (!c.literals[k].equals(c.literals[p.index()])) out.add(cs[k]);
            emit(make(out, new Inference.Resolution(g, i, c, p.index())));
        }
    }

    private void factor(ProverClause g, int i) {
        Literal l = g.literals[i];
        for (int j = 0; j < g.literals.length; j++) {
            Literal m = g.literals[j];
            if (j == i || !m.positive() || m.isEquation() || !m.atom().symbol().equals(l.atom().symbol())) continue;
            if (j < i && g.eligible[j]) continue; // the pair was tried from j
            Substitution s = unify(l.atom(), m.atom());
            if (s == null) continue;
            Literal[] gs = apply(s, g.literals);
            if (!order.maximal(gs, i)) continue;
            emit(make(List.of(gs), new Inference.Factoring(g, i, j)));
        }
    }

    private void equalityResolution(ProverClause g, int i) {
        Literal l = g.literals[i];
        Substitution s = unify(l.left(), l.right());
        if (s == null) return;
        Literal[] gs = apply(s, g.literals);
        if (!eligibleAfter(g, gs, i)) return;
        List<Literal> out = new ArrayList<>();
        for (int k = 0; k < gs.length; k++) if (k != i) out.add(gs[k]);
        emit(make(out, new Inference.EqualityResolution(g, i)));
    }

    private void equalityFactoring(ProverClause g, int i) {
        for (int j = 0; j < g.literals.length; j++) {
            Literal m = g.literals[j];
            if (j == i || !m.positive() || !m.isEquation()) continue;
            for (boolean iLeft : new boolean[] {true, false}) {
                for (boolean jLeft : new boolean[] {true, false}) {
                    Literal li = g.literals[i];
                    Term s = iLeft ? li.left() : li.right();
                    Term t = iLeft ? li.right() : li.left();
                    Term s2 = jLeft ? m.left() : m.right();
                    Term t2 = jLeft ? m.right() : m.left();
                    Substitution sigma = unify(s, s2);
                    if (sigma == null) continue;
                    Literal[] gs = apply(sigma, g.literals);
                    if (!order.maximal(gs, i) || !sideUsable(sigma.apply(s), sigma.apply(t))) continue;
                    ProverClause premise = g;
                    if (!iLeft || !jLeft) {
                        List<Literal> flipped = new ArrayList<>(List.of(g.literals));
                        if (!iLeft) flipped.set(i, new Literal(true, terms.equation(s, t)));
                        if (!jLeft) flipped.set(j, new Literal(true, terms.equation(s2, t2)));
                        premise = new ProverClause(counter.next(), flipped.toArray(new Literal[0]),
                                new Inference.Reorientation(g));
                    }
                    List<Literal> out = new ArrayList<>();
                    for (int k = 0; k < gs.length; k++) if (k != i) out.add(gs[k]);
                    out.add(new Literal(false, terms.equation(sigma.apply(t), sigma.apply(t2))));
                    emit(make(out, new Inference.EqualityFactoring(premise, i, j)));
                }
            }
        }
    }

    /** Superposition from equation i of the given clause into the active clauses. */
    private void superposeFrom(ProverClause g, Literal[] gr, int i) {
        for (boolean left : new boolean[] {true, false}) {
            Term from = left ? gr[i].left() : gr[i].right();
            Term to = left ? gr[i].right() : gr[i].left();
            if (!sideUsable(from, to)) continue;
            List<SubtermRef> targets;
            if (from instanceof Application a) {
                targets = intoIndex.get(a.symbol());
                if (targets == null) continue;
            } else {
                targets = new ArrayList<>();
                for (List<SubtermRef> l : intoIndex.values()) targets.addAll(l);
            }
            for (SubtermRef t : targets) {
                if (t.clause().removed) continue;
                superpose(g, gr, i, left, t.clause(), t.clause().literals, t.index(), t.path(), t.term(), false);
            }
        }
    }

    /** Superposition from the active equations into literal i of the given clause. */
    private void superposeInto(ProverClause g, Literal[] gr, int i) {
        for (Subterms.Occurrence o : Subterms.occurrences(gr[i].atom())) {
            List<SideRef> sides = new ArrayList<>(variableSides);
            List<SideRef> bySymbol = fromIndex.get(o.term().symbol());
            if (bySymbol != null) sides.addAll(bySymbol);
            for (SideRef side : sides) {
                if (side.clause().removed) continue;
                superpose(side.clause(), side.clause().literals, side.index(), side.left(), g, gr, i, o.path(), o.term(),
                        true);
            }
        }
    }

    /**
     * One superposition: the equation {@code fromLits[i]} (its left side when {@code left}) rewrites the subterm u at
     * {@code path} of {@code intoLits[j]}. The literal arrays are the clauses as they take part (one of them renamed
     * apart); the inference names the clauses themselves.
     */
    private void superpose(ProverClause fromClause, Literal[] fromLits, int i, boolean left, ProverClause intoClause,
                           Literal[] intoLits, int j, int[] path, Application u, boolean intoIsGiven) {
        Literal eq = fromLits[i];
        Term from = left ? eq.left() : eq.right();
        Term to = left ? eq.right() : eq.left();
        Substitution s = unify(from, u);
        if (s == null) return;
        Literal[] fs = apply(s, fromLits);
        Literal[] is = apply(s, intoLits);
        if (!eligibleAfter(fromClause, fs, i) || !eligibleAfter(intoClause, is, j)) return;
        if (!sideUsable(s.apply(from), s.apply(to))) return;
        Literal target = intoLits[j];
        if (target.positive() && target.isEquation()) {
            Term side = path[0] == 1 ? target.left() : target.right();
            Term other = path[0] == 1 ? target.right() : target.left();
            if (!sideUsable(s.apply(side), s.apply(other))) return;
        }
        List<Literal> out = new ArrayList<>();
        for (int k = 0; k < fromLits.length; k++) if (k != i) out.add(fs[k]);
        for (int k = 0; k < intoLits.length; k++) if (k != j) out.add(is[k]);
        Literal rewritten = new Literal(target.positive(), Subterms.replace(terms, target.atom(), path, to));
        out.add(s.apply(rewritten));
        Inference inf = new Inference.Paramodulation(fromClause, i, left, intoClause, j, path);
        emit(make(out, inf));
    }
}
