package dev.assay.kernel;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The trusted kernel: every rule of the certificate language, one method each. A rule returns the checked
 * conclusion as a {@link Fact}, or a {@link Outcome.Rejected} that says what was stated, what was derived and why.
 *
 * <p>One kernel checks one certificate against one problem. It owns the term factory, so every term of the check is
 * hash-consed in one place, and the signature, which only accepted {@code skolemize} and {@code define} steps
 * extend. Premises must be facts of this kernel.
 *
 * <pre>
 *   formula rules: negate  nnf  skolemize  clausify  define  abbreviate
 *   clause rules:  resolve  factor  instantiate  paramodulate  eqres  eqfactor  reflexivity
 * </pre>
 */
public final class Kernel {

    private final Problem problem;
    private final TermFactory terms;
    /** The empty substitution, for a side of a step that states none (substitutions are immutable). */
    private final Substitution none;
    private final Signature signature;
    private final Map<String, Fact> axioms = new LinkedHashMap<>();
    /**
     * The last clause {@link #renameApart} renamed, the variables it was kept apart from, and the result: one
     * immutable record, so that deferred checks on several threads read a whole one or none.
     */
    private Apart lastApart;

    private record Apart(Clause from, List<Variable> of, Clause result) {
    }

    /**
     * Deferred checks not yet known to have passed, in the order their steps were given; null when this kernel checks
     * every rule in full at once. Touched only by the thread that calls the rules.
     */
    private final java.util.ArrayDeque<Deferred> outstanding;
    /**
     * Large terms (more than 64 nodes as a tree) all of whose symbols the signature admitted when an earlier step
     * stated them. The signature only grows and never changes a symbol it holds, so such a term stays admitted, and a
     * later conclusion that shares it (hash-consing makes shared structure the same object) is checked only for what
     * is new in it. Filled only from the signature as it stands, never from one a rule extends on trial. Held weakly,
     * like the term table, and compared by identity (terms do not override {@code equals}).
     */
    private final Map<Application, Boolean> admittedLarge = new java.util.WeakHashMap<>();

    public Kernel(Problem problem, TermFactory terms) {
        this(problem, terms, false);
    }

    /**
     * With {@code defer}, the clause rules that compute a unifier or a derived clause (resolve, factor, instantiate,
     * paramodulate, eqres, eqfactor) split their check in two. What depends on the kernel's state as it stands at the
     * step is checked at once: that the premises are clause facts of this kernel, the literal indexes, and that every
     * symbol of the conclusion and the substitutions is in the signature. The rest depends only on immutable inputs,
     * and is returned undone as the {@link Fact#pending} check of a provisional fact, for the caller to run on any
     * thread. Each split is the original check cut in two, in its original order, so a step's outcome is the same
     * either way. {@link #settle} says whether every deferred check passed, and which step's failed first.
     */
    public Kernel(Problem problem, TermFactory terms, boolean defer) {
        this.problem = problem;
        this.terms = terms;
        this.outstanding = defer ? new java.util.ArrayDeque<>() : null;
        this.none = Substitution.empty(terms);
        this.signature = new Signature(problem.signature());
        for (Map.Entry<String, Formula> e : problem.axioms().entrySet()) {
            axioms.put(e.getKey(), new Fact(this, e.getKey(), e.getValue(), null));
        }
    }

    public TermFactory terms() {
        return terms;
    }

    public Problem problem() {
        return problem;
    }

    /** The signature as it stands after the steps accepted so far. */
    public Signature signature() {
        return signature;
    }

    /**
     * Waits for every check deferred so far, running on this thread any that no thread has started: null when all
     * passed, so that every fact this kernel has made is checked; otherwise the rejection of the first failed one in
     * the order of the steps. A check that threw throws here. Null at once for a kernel that does not defer.
     */
    public Outcome.Rejected settle() throws InterruptedException {
        if (outstanding == null) return null;
        while (!outstanding.isEmpty()) {
            Outcome.Rejected r = outstanding.peekFirst().outcome();
            if (r != null) return r;
            outstanding.pollFirst();
        }
        return null;
    }

    /** The step's own remaining check: run now, or, for a deferring kernel, left to a provisional fact. */
    private Outcome later(String label, Clause stated, java.util.function.Supplier<Outcome> rest) {
        if (outstanding == null) return rest.get();
        // Drop the checks at the head that have passed, so that a long run keeps only the ones still in flight.
        while (!outstanding.isEmpty() && outstanding.peekFirst().passed()) outstanding.pollFirst();
        Deferred d = new Deferred(rest);
        outstanding.addLast(d);
        return new Outcome.Accepted(Fact.provisional(this, label, stated, d));
    }

    /** The axiom of this name as a premise, or null. The goal is never a premise. */
    public Fact axiom(String name) {
        return axioms.get(name);
    }

    // ================================================================ formula rules

    /** {@code negate G}: the conclusion is {@code not G} or {@code nnf(not G)}. */
    public Outcome negate(String label, String goalName, Formula stated) {
        final String rule = "negate";
        Formula goal = problem.goal();
        if (goal == null) return reject(rule, "the problem has no goal to negate", stated, null);
        if (!problem.goalName().equals(goalName)) {
            return reject(rule, goalName + " is not the problem's goal (" + problem.goalName() + ")", stated, null);
        }
        Outcome bad = unknownSymbols(rule, stated, null);
        if (bad != null) return bad;
        Formula not = new Formula.Not(goal);
        if (Formulas.equivalent(stated, not)) return accept(label, stated);
        bad = nnfTooLarge(rule, not, "not " + problem.goalName(), stated);
        if (bad != null) return bad;
        Formula normal = Formulas.nnf(not);
        if (Formulas.equivalent(stated, normal)) return accept(label, stated);
        return rejectFormula(rule, "the conclusion is neither not " + problem.goalName() + " nor its negation normal form",
                stated, normal);
    }

    /** {@code nnf P}: the conclusion is {@code nnf(P)}. */
    public Outcome nnf(String label, Fact premise, Formula stated) {
        final String rule = "nnf";
        Outcome bad = requireFormula(rule, premise, stated);
        if (bad != null) return bad;
        bad = unknownSymbols(rule, stated, null);
        if (bad == null) bad = nnfTooLarge(rule, premise.formula(), premise.label(), stated);
        if (bad != null) return bad;
        Formula normal = Formulas.nnf(premise.formula());
        if (Formulas.equivalent(stated, normal)) return accept(label, stated);
        return rejectFormula(rule, "the conclusion is not the negation normal form of " + premise.label(), stated, normal);
    }

    /**
     * {@code skolemize P fresh s1, …}: the conclusion is {@code nnf(P)} with some existentials replaced by terms of
     * the fresh symbols over the universal variables enclosing them (see {@link Skolemization}). Replacing
     * {@code exists y. φ} under {@code forall x1 … xk} by {@code φ[y := s(x1,…,xk)]} with a fresh s preserves
     * satisfiability: every model of the premise extends to one of the conclusion by interpreting s as a choice
     * function.
     */
    public Outcome skolemize(String label, Fact premise, List<Symbol> fresh, Formula stated) {
        final String rule = "skolemize";
        Outcome bad = requireFormula(rule, premise, stated);
        if (bad != null) return bad;
        Signature extended = new Signature(signature);
        for (Symbol s : fresh) {
            if (s.kind() != Symbol.Kind.FUNCTION) {
                return reject(rule, s.name() + " is used as a predicate; a Skolem symbol is a function", stated, null);
            }
            bad = notFresh(rule, s, stated);
            if (bad != null) return bad;
            if (extended.lookup(s.name()) != null) return reject(rule, s.name() + " is listed twice", stated, null);
            extended.add(s, Signature.Origin.SKOLEM, label);
        }
        bad = symbolsOutside(rule, stated, null, extended);
        if (bad == null) bad = nnfTooLarge(rule, premise.formula(), premise.label(), stated);
        if (bad != null) return bad;
        String why = Skolemization.check(premise.formula(), premise.label(), fresh, stated);
        if (why != null) {
            return rejectFormula(rule, why, stated, Formulas.nnf(premise.formula()));
        }
        for (Symbol s : fresh) signature.add(s, Signature.Origin.SKOLEM, label);
        return accept(label, stated);
    }

    /** {@code clausify P [θ]}: see {@link Clausification}; with θ absent the kernel searches for one. */
    public Outcome clausify(String label, Fact premise, Substitution theta, Clause stated) {
        final String rule = "clausify";
        if (premise.owner() != this) return foreign(rule, premise);
        if (premise.isClause()) {
            return reject(rule, premise.label() + " is a clause step; clausify takes a formula", Printer.clause(stated), null);
        }
        Outcome bad = unknownSymbols(rule, null, stated, theta);
        if (bad == null) bad = nnfTooLarge(rule, premise.formula(), premise.label(), null);
        if (bad != null) return bad;
        Formula normal = Formulas.nnf(premise.formula());
        Formula m = Clausification.stripUniversals(normal);
        if (m == null) {
            return reject(rule, "the negation normal form of " + premise.label()
                    + " still has an existential quantifier: skolemize it first", Printer.clause(stated),
                    Printer.formula(normal));
        }
        Set<Literal> set = stated.asSet();
        if (theta != null) {
            Set<Variable> domainOk = Formulas.freeVariables(m);
            for (Variable v : theta.bindings().keySet()) {
                if (!domainOk.contains(v)) {
                    return reject(rule, "the substitution binds " + v.name() + ", which is not a variable of "
                            + premise.label(), Printer.clause(stated), null);
                }
            }
            if (!Clausification.evaluate(m, theta, set)) return accept(label, stated);
            return reject(rule, "with " + Printer.substitution(theta) + " and the literals of the conclusion false, "
                    + premise.label() + " does not evaluate to false, so it does not entail the clause",
                    Printer.clause(stated), Printer.formula(m));
        }
        if (!Clausification.evaluate(m, none, set)) return accept(label, stated);
        Clausification.Search found = Clausification.findTheta(terms, m, stated.literals());
        if (found.theta() != null && !Clausification.evaluate(m, found.theta(), set)) return accept(label, stated);
        String why = found.exhausted()
                ? "no substitution was found within " + Clausification.SEARCH_BUDGET + " search steps; state one"
                : "no substitution makes " + premise.label() + " false when the literals of the conclusion are false"
                        + ", so the clause does not follow from it";
        return reject(rule, why, Printer.clause(stated), Printer.formula(m));
    }

    /**
     * {@code define fresh Q}: the conclusion is {@code forall x1 … xk. (Q(x1,…,xk) iff φ)} with Q fresh, not in φ,
     * and the distinct {@code xi} holding every free variable of φ. A definition of a fresh symbol is a conservative
     * extension, so it is sound to add as a fact.
     */
    public Outcome define(String label, Symbol fresh, Formula stated) {
        final String rule = "define";
        if (fresh.kind() != Symbol.Kind.PREDICATE) {
            return reject(rule, fresh.name() + " must be defined as a predicate", stated, null);
        }
        Outcome bad = notFresh(rule, fresh, stated);
        if (bad != null) return bad;
        List<Variable> params = new ArrayList<>();
        Formula f = stated;
        while (f instanceof Formula.Quantified q && q.universal()) {
            params.add(q.variable());
            f = q.body();
        }
        // forall x. (Q(x) iff forall y. ...) peels too far only if the iff is not directly below the prefix.
        if (!(f instanceof Formula.Iff iff)) {
            return reject(rule, "a definition has the form forall x1 … xk. (" + fresh.name() + "(x1, …, xk) iff φ)",
                    stated, null);
        }
        if (!(iff.left() instanceof Formula.Atomic head) || !head.literal().positive()
                || !head.literal().atom().symbol().equals(fresh)) {
            return reject(rule, "the left side of the definition must be the atom " + fresh.name() + "(…) itself",
                    stated, null);
        }
        Application atom = head.literal().atom();
        if (atom.arity() != params.size()) {
            return reject(rule, fresh.name() + " has " + atom.arity() + " arguments but the definition quantifies "
                    + params.size() + " variables", stated, null);
        }
        for (int k = 0; k < atom.arity(); k++) {
            if (atom.argument(k) != params.get(k)) {
                return reject(rule, "argument " + (k + 1) + " of " + fresh.name() + " must be the quantified variable "
                        + params.get(k).name() + ", not " + Printer.term(atom.argument(k)), stated, null);
            }
            if (params.indexOf(params.get(k)) != k) {
                return reject(rule, "the variable " + params.get(k).name() + " is quantified twice", stated, null);
            }
        }
        Formula body = iff.right();
        if (Formulas.symbols(body).contains(fresh)) {
            return reject(rule, fresh.name() + " occurs in its own definition", stated, null);
        }
        Set<Variable> free = Formulas.freeVariables(body);
        for (Variable v : free) {
            if (!params.contains(v)) {
                return reject(rule, "the variable " + v.name() + " is free in the body but is not an argument of "
                        + fresh.name(), stated, null);
            }
        }
        Signature extended = new Signature(signature);
        extended.add(fresh, Signature.Origin.DEFINITION, label);
        bad = symbolsOutside(rule, stated, null, extended);
        if (bad != null) return bad;
        signature.add(fresh, Signature.Origin.DEFINITION, label);
        return new Outcome.Accepted(new Fact(this, label, stated, null, new Fact.Definition(fresh, params, body)));
    }

    /**
     * {@code abbreviate P using D}: replacing every atom {@code Q(t1,…,tk)} of the conclusion by
     * {@code φ[x1 := t1, …]} (bound variables of φ renamed apart, so nothing is captured) gives the premise.
     */
    public Outcome abbreviate(String label, Fact premise, Fact definition, Formula stated) {
        final String rule = "abbreviate";
        Outcome bad = requireFormula(rule, premise, stated);
        if (bad == null) bad = requireFormula(rule, definition, stated);
        if (bad != null) return bad;
        Fact.Definition d = definition.definition();
        if (d == null) return reject(rule, definition.label() + " is not a define step", stated, null);
        bad = unknownSymbols(rule, stated, null);
        if (bad != null) return bad;
        Formula unfolded = unfold(stated, d);
        if (Formulas.equivalent(unfolded, premise.formula())) return accept(label, stated);
        return rejectFormula(rule, "unfolding " + d.symbol().name() + " in the conclusion does not give " + premise.label(),
                stated, unfolded);
    }

    private Formula unfold(Formula f, Fact.Definition d) {
        return Formulas.substitute(f, terms, Map.of(), l -> {
            if (!l.atom().symbol().equals(d.symbol())) return null;
            Map<Variable, Term> args = new HashMap<>();
            for (int k = 0; k < d.parameters().size(); k++) args.put(d.parameters().get(k), l.atom().argument(k));
            Formula body = Formulas.substitute(d.body(), terms, args, null);
            return l.positive() ? body : new Formula.Not(body);
        });
    }

    /** A premise whose negation normal form would exceed {@link Formulas#NNF_LIMIT} nodes is refused, not built. */
    private static Outcome nnfTooLarge(String rule, Formula f, String name, Formula stated) {
        long size = Formulas.nnfSize(f)[0];
        if (size <= Formulas.NNF_LIMIT) return null;
        return reject(rule, "the negation normal form of " + name + " would have "
                + (size == Long.MAX_VALUE ? "more than 2^63" : String.valueOf(size)) + " nodes, more than the limit of "
                + Formulas.NNF_LIMIT + " (nested iff doubles its operands); name subformulas with define first",
                stated, null);
    }

    private Outcome notFresh(String rule, Symbol s, Formula stated) {
        Signature.Entry e = signature.entry(s.name());
        if (e == null) return null;
        String where = e.origin() == Signature.Origin.PROBLEM ? "it is a symbol of the problem"
                : "step " + e.step() + " already introduced it";
        return reject(rule, s.name() + " is not fresh: " + where, stated, null);
    }

    // ================================================================ clause rules

    /**
     * {@code resolve A.i [σA], B.j [σB]}. With both substitutions null the kernel renames B apart and computes a
     * most general unifier; with either given, a missing one is empty and the conclusion must be the resolvent itself.
     */
    public Outcome resolve(String label, Fact a, int i, Substitution sa, Fact b, int j, Substitution sb,
                           Clause stated) {
        final String rule = "resolve";
        Outcome bad = requireClauses(rule, stated, a, b);
        if (bad == null) bad = literalIndex(rule, a, i, stated);
        if (bad == null) bad = literalIndex(rule, b, j, stated);
        if (bad == null) bad = unknownSymbols(rule, null, stated, sa, sb);
        if (bad != null) return bad;
        return later(label, stated, () -> resolveChecked(label, a, i, sa, b, j, sb, stated));
    }

    private Outcome resolveChecked(String label, Fact a, int i, Substitution sa, Fact b, int j, Substitution sb,
                                   Clause stated) {
        final String rule = "resolve";
        Outcome bad;
        Literal li = a.clause().literal(i);
        Literal lj = b.clause().literal(j);
        if (li.positive() == lj.positive()) {
            return reject(rule, ref(a, i) + " and " + ref(b, j) + " have the same sign; resolution needs opposite signs",
                    Printer.clause(stated), null);
        }
        if (sa != null || sb != null) {
            Substitution ta = sa != null ? sa : none;
            Substitution tb = sb != null ? sb : none;
            bad = domain(rule, ta, a, stated);
            if (bad == null) bad = domain(rule, tb, b, stated);
            if (bad != null) return bad;
            Literal ia = ta.apply(li).negated();
            Literal ib = tb.apply(lj);
            if (!ia.equals(ib)) {
                return reject(rule, "under the stated substitutions " + ref(a, i) + " becomes " + Printer.literal(ta.apply(li))
                        + " and " + ref(b, j) + " becomes " + Printer.literal(ib) + ": not the same atom",
                        Printer.clause(stated), null);
            }
            Clause derived = union(ta.apply(remove(a.clause(), li)), tb.apply(remove(b.clause(), lj)));
            return sameSet(rule, label, stated, derived);
        }
        Clause bApart = renameApart(b.clause(), a.clause());
        Literal ljApart = bApart.literal(j);
        Clause rest = remove(a.clause(), li, bApart, ljApart);
        return unifyThenCompare(rule, label, stated, li, ljApart, rest,
                () -> "the atoms of " + ref(a, i) + " and " + ref(b, j) + ", " + Printer.term(li.atom()) + " and "
                        + Printer.term(lj.atom()) + ", do not unify: ");
    }

    /** {@code factor A.i, A.j [σ]}. */
    public Outcome factor(String label, Fact a, int i, int j, Substitution sigma, Clause stated) {
        final String rule = "factor";
        Outcome bad = requireClauses(rule, stated, a);
        if (bad == null) bad = literalIndex(rule, a, i, stated);
        if (bad == null) bad = literalIndex(rule, a, j, stated);
        if (bad == null) bad = unknownSymbols(rule, null, stated, sigma);
        if (bad != null) return bad;
        return later(label, stated, () -> factorChecked(label, a, i, j, sigma, stated));
    }

    private Outcome factorChecked(String label, Fact a, int i, int j, Substitution sigma, Clause stated) {
        final String rule = "factor";
        Outcome bad;
        if (i == j) return reject(rule, "factoring needs two different literals, not " + ref(a, i) + " twice",
                Printer.clause(stated), null);
        Literal li = a.clause().literal(i);
        Literal lj = a.clause().literal(j);
        if (li.positive() != lj.positive()) {
            return reject(rule, ref(a, i) + " and " + ref(a, j) + " have opposite signs; factoring needs the same sign",
                    Printer.clause(stated), null);
        }
        if (sigma != null) {
            bad = domain(rule, sigma, a, stated);
            if (bad != null) return bad;
            if (!sigma.apply(li).equals(sigma.apply(lj))) {
                return reject(rule, "under " + Printer.substitution(sigma) + " the literals become "
                        + Printer.literal(sigma.apply(li)) + " and " + Printer.literal(sigma.apply(lj))
                        + ": not equal", Printer.clause(stated), null);
            }
            return sameSet(rule, label, stated, sigma.apply(a.clause()));
        }
        return unifyThenCompare(rule, label, stated, li, lj, a.clause(),
                () -> ref(a, i) + " and " + ref(a, j) + " do not unify: ");
    }

    /** {@code instantiate A σ}: the conclusion is {@code Aσ}. */
    public Outcome instantiate(String label, Fact a, Substitution sigma, Clause stated) {
        final String rule = "instantiate";
        if (sigma == null) return reject(rule, "instantiate needs a substitution", Printer.clause(stated), null);
        Outcome bad = requireClauses(rule, stated, a);
        if (bad == null) bad = unknownSymbols(rule, null, stated, sigma);
        if (bad == null) bad = domain(rule, sigma, a, stated);
        if (bad != null) return bad;
        return later(label, stated, () -> instantiateChecked(label, a, sigma, stated));
    }

    private Outcome instantiateChecked(String label, Fact a, Substitution sigma, Clause stated) {
        final String rule = "instantiate";
        return sameSet(rule, label, stated, sigma.apply(a.clause()));
    }

    /**
     * {@code paramodulate A.i -> B.j @ p [σA] [σB]}, or {@code <-}: literal A.i is an equation {@code s = t}; {@code ->}
     * rewrites s into t ({@code <-} t into s) at position p of the atom of B.j, never at the atom itself. With either
     * substitution given (a missing one is empty) the rewritten side under σA and the subterm at p under σB must be
     * the same term and the conclusion is the paramodulant itself; with none, B is renamed apart, their most general
     * unifier is computed, and the conclusion must be a variant of the paramodulant.
     */
    public Outcome paramodulate(String label, Fact a, int i, boolean leftToRight, Fact b, int j, int[] position,
                                Substitution sa, Substitution sb, Clause stated) {
        final String rule = "paramodulate";
        Outcome bad = requireClauses(rule, stated, a, b);
        if (bad == null) bad = literalIndex(rule, a, i, stated);
        if (bad == null) bad = literalIndex(rule, b, j, stated);
        if (bad == null) bad = unknownSymbols(rule, null, stated, sa, sb);
        if (bad != null) return bad;
        return later(label, stated, () -> paramodulateChecked(label, a, i, leftToRight, b, j, position, sa, sb, stated));
    }

    private Outcome paramodulateChecked(String label, Fact a, int i, boolean leftToRight, Fact b, int j, int[] position,
                                        Substitution sa, Substitution sb, Clause stated) {
        final String rule = "paramodulate";
        Outcome bad;
        Literal eq = a.clause().literal(i);
        if (!eq.isEquation() || !eq.positive()) {
            return reject(rule, ref(a, i) + " is " + Printer.literal(eq, 200) + ", not an equation s = t",
                    Printer.clause(stated), null);
        }
        Term from = leftToRight ? eq.left() : eq.right();
        Term to = leftToRight ? eq.right() : eq.left();
        Literal target = b.clause().literal(j);
        String at = Positions.render(position);
        Term u = Positions.subterm(target.atom(), position);
        if (u == null) {
            return reject(rule, "position " + at + " does not exist in " + ref(b, j) + " (" + Printer.literal(target, 200)
                    + ")", Printer.clause(stated), null);
        }
        String direction = leftToRight ? "->" : "<-";
        if (sa != null || sb != null) {
            Substitution ta = sa != null ? sa : none;
            Substitution tb = sb != null ? sb : none;
            bad = domain(rule, ta, a, stated);
            if (bad == null) bad = domain(rule, tb, b, stated);
            if (bad != null) return bad;
            Term fromI = ta.apply(from);
            Term uI = tb.apply(u);
            if (fromI != uI) {
                return reject(rule, "under the stated substitutions the side rewritten by " + direction + ", "
                        + Printer.term(fromI, 200) + ", differs from " + Printer.term(uI, 200) + " at position " + at
                        + " of " + ref(b, j), Printer.clause(stated), null);
            }
            Literal rewritten = tb.apply(target);
            rewritten = new Literal(rewritten.positive(), (Application) Positions.replace(terms, rewritten.atom(),
                    position, ta.apply(to)));
            Clause derived = union(union(ta.apply(remove(a.clause(), eq)), tb.apply(remove(b.clause(), target))),
                    new Clause(List.of(rewritten)));
            return sameSet(rule, label, stated, derived);
        }
        Clause bApart = renameApart(b.clause(), a.clause());
        Literal targetApart = bApart.literal(j);
        Term uApart = Positions.subterm(targetApart.atom(), position);
        Unification.Result r = Unification.mostGeneralUnifier(terms, from, uApart);
        if (r instanceof Unification.NotUnifiable nu) {
            return reject(rule, "the side rewritten by " + direction + ", " + Printer.term(from, 200) + ", does not unify with "
                    + Printer.term(u, 200) + " at position " + at + " of " + ref(b, j) + ": " + nu.describe(),
                    Printer.clause(stated), null);
        }
        Substitution mgu = ((Unification.Unified) r).unifier();
        Literal rewritten = new Literal(targetApart.positive(),
                (Application) Positions.replace(terms, targetApart.atom(), position, to));
        Clause derived = mgu.apply(union(remove(a.clause(), eq, bApart, targetApart), new Clause(List.of(rewritten))));
        if (Variants.areVariants(stated, derived, Variants.DEFAULT_BUDGET)) return accept(label, stated);
        return notVariant(rule, stated, derived);
    }

    /** {@code eqres A.i [σ]}: literal i is {@code s != t}, σ makes s and t equal, the conclusion is {@code (A − A.i)σ}. */
    public Outcome eqres(String label, Fact a, int i, Substitution sigma, Clause stated) {
        final String rule = "eqres";
        Outcome bad = requireClauses(rule, stated, a);
        if (bad == null) bad = literalIndex(rule, a, i, stated);
        if (bad == null) bad = unknownSymbols(rule, null, stated, sigma);
        if (bad != null) return bad;
        return later(label, stated, () -> eqresChecked(label, a, i, sigma, stated));
    }

    private Outcome eqresChecked(String label, Fact a, int i, Substitution sigma, Clause stated) {
        final String rule = "eqres";
        Outcome bad;
        Literal l = a.clause().literal(i);
        if (!l.isEquation() || l.positive()) {
            return reject(rule, ref(a, i) + " is " + Printer.literal(l, 200) + ", not a disequation s != t",
                    Printer.clause(stated), null);
        }
        Clause rest = remove(a.clause(), l);
        if (sigma != null) {
            bad = domain(rule, sigma, a, stated);
            if (bad != null) return bad;
            if (sigma.apply(l.left()) != sigma.apply(l.right())) {
                return reject(rule, "under " + Printer.substitution(sigma) + " the sides become "
                        + Printer.term(sigma.apply(l.left()), 200) + " and " + Printer.term(sigma.apply(l.right()), 200)
                        + ": not equal", Printer.clause(stated), null);
            }
            return sameSet(rule, label, stated, sigma.apply(rest));
        }
        Unification.Result r = Unification.mostGeneralUnifier(terms, l.left(), l.right());
        if (r instanceof Unification.NotUnifiable nu) {
            return reject(rule, "the sides of " + ref(a, i) + " do not unify: " + nu.describe(), Printer.clause(stated), null);
        }
        Clause derived = ((Unification.Unified) r).unifier().apply(rest);
        if (Variants.areVariants(stated, derived, Variants.DEFAULT_BUDGET)) return accept(label, stated);
        return notVariant(rule, stated, derived);
    }

    /**
     * {@code eqfactor A.i, A.j [σ]}: both literals are equations {@code s = t} and {@code u = v} as written, σ makes s
     * and u equal, and the conclusion is {@code ((A − A.i) ∪ {t != v})σ}.
     */
    public Outcome eqfactor(String label, Fact a, int i, int j, Substitution sigma, Clause stated) {
        final String rule = "eqfactor";
        Outcome bad = requireClauses(rule, stated, a);
        if (bad == null) bad = literalIndex(rule, a, i, stated);
        if (bad == null) bad = literalIndex(rule, a, j, stated);
        if (bad == null) bad = unknownSymbols(rule, null, stated, sigma);
        if (bad != null) return bad;
        return later(label, stated, () -> eqfactorChecked(label, a, i, j, sigma, stated));
    }

    private Outcome eqfactorChecked(String label, Fact a, int i, int j, Substitution sigma, Clause stated) {
        final String rule = "eqfactor";
        Outcome bad;
        if (i == j) {
            return reject(rule, "equality factoring needs two different literals, not " + ref(a, i) + " twice",
                    Printer.clause(stated), null);
        }
        Literal first = a.clause().literal(i);
        Literal second = a.clause().literal(j);
        for (Literal l : List.of(first, second)) {
            if (!l.isEquation() || !l.positive()) {
                return reject(rule, Printer.literal(l, 200) + " is not an equation s = t", Printer.clause(stated), null);
            }
        }
        // A clause is a set: a repeated equation, in either orientation, is one literal, and factoring it with
        // itself would wrongly derive t != v from s = t alone.
        if (first.equals(second)) {
            return reject(rule, ref(a, i) + " and " + ref(a, j) + " are the same literal " + Printer.literal(first, 200)
                    + " (a clause is a set); equality factoring needs two different equations", Printer.clause(stated), null);
        }
        List<Literal> lits = new ArrayList<>(remove(a.clause(), first).literals());
        lits.add(new Literal(false, terms.equation(first.right(), second.right())));
        Clause base = new Clause(lits);
        if (sigma != null) {
            bad = domain(rule, sigma, a, stated);
            if (bad != null) return bad;
            if (sigma.apply(first.left()) != sigma.apply(second.left())) {
                return reject(rule, "under " + Printer.substitution(sigma) + " the left sides become "
                        + Printer.term(sigma.apply(first.left()), 200) + " and "
                        + Printer.term(sigma.apply(second.left()), 200) + ": not equal", Printer.clause(stated), null);
            }
            return sameSet(rule, label, stated, sigma.apply(base));
        }
        Unification.Result r = Unification.mostGeneralUnifier(terms, first.left(), second.left());
        if (r instanceof Unification.NotUnifiable nu) {
            return reject(rule, "the left sides " + Printer.term(first.left(), 200) + " and "
                    + Printer.term(second.left(), 200) + " do not unify: " + nu.describe(), Printer.clause(stated), null);
        }
        Clause derived = ((Unification.Unified) r).unifier().apply(base);
        if (Variants.areVariants(stated, derived, Variants.DEFAULT_BUDGET)) return accept(label, stated);
        return notVariant(rule, stated, derived);
    }

    /** {@code reflexivity}: the conclusion is {@code t = t} for some term t. */
    public Outcome reflexivity(String label, Clause stated) {
        final String rule = "reflexivity";
        Outcome bad = unknownSymbols(rule, null, stated);
        if (bad != null) return bad;
        Set<Literal> set = stated.asSet();
        if (set.size() == 1) {
            Literal l = set.iterator().next();
            if (l.isEquation() && l.positive() && l.left() == l.right()) return accept(label, stated);
        }
        return reject(rule, "reflexivity concludes a single equation t = t", Printer.clause(stated), null);
    }

    // ================================================================ helpers

    private Outcome accept(String label, Formula f) {
        return new Outcome.Accepted(new Fact(this, label, f, null));
    }

    private Outcome accept(String label, Clause c) {
        return new Outcome.Accepted(new Fact(this, label, null, c));
    }

    private static Outcome reject(String rule, String reason, String stated, String derived) {
        return new Outcome.Rejected(rule, reason, stated, derived);
    }

    private static Outcome reject(String rule, String reason, Formula stated, String derived) {
        return new Outcome.Rejected(rule, reason, stated == null ? null : Printer.formula(stated), derived);
    }

    private static Outcome rejectFormula(String rule, String reason, Formula stated, Formula derived) {
        return new Outcome.Rejected(rule, reason, Printer.formula(stated), Printer.formula(derived));
    }

    private static Outcome foreign(String rule, Fact f) {
        return new Outcome.Rejected(rule, "premise " + f.label() + " belongs to another check", null, null);
    }

    private static String describe(Symbol s) {
        String kind = s.kind() == Symbol.Kind.FUNCTION ? (s.arity() == 0 ? "a constant" : "a function")
                : (s.arity() == 0 ? "a propositional atom" : "a predicate");
        return kind + " " + s;
    }

    private static String ref(Fact f, int i) {
        return f.label() + "." + i;
    }

    private Outcome requireFormula(String rule, Fact premise, Formula stated) {
        if (premise.owner() != this) return foreign(rule, premise);
        if (premise.isClause()) {
            return reject(rule, premise.label() + " is a clause step; " + rule + " takes a formula", stated, null);
        }
        return null;
    }

    private Outcome requireClauses(String rule, Clause stated, Fact... premises) {
        for (Fact p : premises) {
            if (p.owner() != this) return foreign(rule, p);
            if (!p.isClause()) {
                return reject(rule, p.label() + " is a formula; " + rule + " takes clause steps (clausify it first)",
                        Printer.clause(stated), null);
            }
        }
        return null;
    }

    private static Outcome literalIndex(String rule, Fact f, int i, Clause stated) {
        if (f.clause().literal(i) != null) return null;
        return reject(rule, f.label() + " has " + f.clause().width() + " literal" + (f.clause().width() == 1 ? "" : "s")
                + ", so there is no literal " + i, Printer.clause(stated), null);
    }

    private static Outcome domain(String rule, Substitution s, Fact f, Clause stated) {
        if (s.isEmpty()) return null;
        List<Variable> vars = f.clause().variables();
        for (Variable v : s.bindings().keySet()) {
            if (!vars.contains(v)) {
                return reject(rule, "the substitution binds " + v.name() + ", which is not a variable of " + f.label(),
                        Printer.clause(stated), null);
            }
        }
        return null;
    }

    /**
     * Every symbol of a stated conclusion or substitution must be in the signature as it stands; this is what makes
     * the freshness of a later Skolem or definition symbol meaningful.
     */
    private Outcome unknownSymbols(String rule, Formula f, Clause c, Substitution... subs) {
        return symbolsOutside(rule, f, c, signature, subs);
    }

    private Outcome symbolsOutside(String rule, Formula f, Clause c, Signature signature, Substitution... subs) {
        // The first symbol, in order of first occurrence, that the signature does not admit.
        Symbol bad = null;
        if (f != null) {
            for (Symbol s : Formulas.symbols(f)) {
                if (!signature.admits(s)) {
                    bad = s;
                    break;
                }
            }
        }
        if (bad == null && c != null) {
            List<Literal> ls = c.literals();
            for (int i = 0; i < ls.size(); i++) if ((bad = firstOutside(ls.get(i).atom(), signature)) != null) break;
        }
        for (Substitution s : subs == null ? new Substitution[0] : subs) {
            if (bad != null) break;
            if (s != null) for (Term t : s.bindings().values()) if ((bad = firstOutside(t, signature)) != null) break;
        }
        if (bad == null) return null;
        Symbol known = signature.lookup(bad.name());
        String why = known == null ? "the symbol " + bad + " is not in the signature"
                : "the symbol " + bad.name() + " is used as " + describe(bad) + " but is " + describe(known);
        return new Outcome.Rejected(rule, why, f != null ? Printer.formula(f) : c != null ? Printer.clause(c) : null, null);
    }

    /** The first symbol of {@code t} (pre-order, equality aside) that {@code signature} does not admit, or null. */
    private Symbol firstOutside(Term t, Signature signature) {
        // Two methods, so that this one stays small enough for the compiler to inline on the common path.
        return t.treeSize() <= 64 ? firstOutsideSmall(t, signature) : firstOutsideLarge(t, signature);
    }

    private Symbol firstOutsideLarge(Term t, Signature signature) {
        // Each distinct subterm once, in the pre-order of Terms.forEachSubterm, without entering a large subterm
        // admitted before: it holds no symbol outside the signature, so the first one outside is the same.
        Set<Term> seen = java.util.Collections.newSetFromMap(new java.util.IdentityHashMap<>());
        List<Application> large = new ArrayList<>();
        java.util.ArrayDeque<Term> stack = new java.util.ArrayDeque<>();
        stack.push(t);
        while (!stack.isEmpty()) {
            if (!(stack.pop() instanceof Application a) || !seen.add(a)) continue;
            if (a.treeSize() > 64) {
                if (admittedLarge.containsKey(a)) continue;
                large.add(a);
            }
            if (!a.isEquation() && !signature.admits(a.symbol())) return a.symbol();
            Term[] args = a.argumentArray();
            for (int i = args.length - 1; i >= 0; i--) stack.push(args[i]);
        }
        if (signature == this.signature) for (Application a : large) admittedLarge.put(a, Boolean.TRUE);
        return null;
    }

    private static Symbol firstOutsideSmall(Term t, Signature signature) {
        if (!(t instanceof Application a)) return null;
        if (!a.isEquation() && !signature.admits(a.symbol())) return a.symbol();
        for (Term arg : a.argumentArray()) {
            Symbol s = firstOutsideSmall(arg, signature);
            if (s != null) return s;
        }
        return null;
    }

    private Outcome sameSet(String rule, String label, Clause stated, Clause derived) {
        if (stated.sameSet(derived)) return accept(label, stated);
        return reject(rule, difference(stated, derived), Printer.clause(stated), Printer.clause(derived));
    }

    private Outcome notVariant(String rule, Clause stated, Clause derived) {
        return reject(rule, "the conclusion is not a variant of the derived clause" + hint(stated, derived),
                Printer.clause(stated), Printer.clause(derived));
    }

    private static String hint(Clause stated, Clause derived) {
        int s = stated.asSet().size();
        int d = derived.asSet().size();
        if (s != d) return " (" + s + " distinct literal" + (s == 1 ? "" : "s") + " stated, " + d + " derived)";
        return "";
    }

    private static String difference(Clause stated, Clause derived) {
        List<String> extra = new ArrayList<>();
        List<String> missing = new ArrayList<>();
        for (Literal l : stated.asSet()) if (!derived.asSet().contains(l)) extra.add(Printer.literal(l, 200));
        for (Literal l : derived.asSet()) if (!stated.asSet().contains(l)) missing.add(Printer.literal(l, 200));
        StringBuilder sb = new StringBuilder("the conclusion differs from the derived clause");
        if (!extra.isEmpty()) sb.append(": stated but not derived ").append(String.join(", ", extra));
        if (!missing.isEmpty()) sb.append(extra.isEmpty() ? ": " : "; ").append("derived but not stated ")
                .append(String.join(", ", missing));
        return sb.toString();
    }

    /** The clause without every occurrence of {@code l} (a clause is a set). */
    private static Clause remove(Clause c, Literal l) {
        List<Literal> in = c.literals();
        List<Literal> out = new ArrayList<>(in.size());
        for (int i = 0; i < in.size(); i++) if (!in.get(i).equals(l)) out.add(in.get(i));
        return new Clause(out);
    }

    /** {@code x} without {@code lx}, then {@code y} without {@code ly}, as one clause. */
    private static Clause remove(Clause x, Literal lx, Clause y, Literal ly) {
        List<Literal> xs = x.literals();
        List<Literal> ys = y.literals();
        List<Literal> out = new ArrayList<>(xs.size() + ys.size());
        for (int i = 0; i < xs.size(); i++) if (!xs.get(i).equals(lx)) out.add(xs.get(i));
        for (int i = 0; i < ys.size(); i++) if (!ys.get(i).equals(ly)) out.add(ys.get(i));
        return new Clause(out);
    }

    private static Clause union(Clause x, Clause y) {
        List<Literal> out = new ArrayList<>(x.literals());
        out.addAll(y.literals());
        return new Clause(out);
    }

    /**
     * Tries each way of setting the atoms of {@code x} and {@code y} equal, as written and, for two equations, also
     * with one side of {@code y} swapped: the first most general unifier under which {@code base} has the conclusion
     * as a variant accepts; otherwise the rejection shows the first derived clause, or why none unified.
     */
    private Outcome unifyThenCompare(String rule, String label, Clause stated, Literal x, Literal y, Clause base,
                                     java.util.function.Supplier<String> notUnifiable) {
        Term swapped = x.isEquation() && y.isEquation() ? terms.equation(y.right(), y.left()) : null;
        String failure = null;
        Clause firstDerived = null;
        for (int k = 0; k < (swapped == null ? 1 : 2); k++) {
            Unification.Result r = Unification.mostGeneralUnifier(terms, x.atom(), k == 0 ? y.atom() : swapped);
            if (r instanceof Unification.Unified u) {
                Clause derived = u.unifier().apply(base);
                if (Variants.areVariants(stated, derived, Variants.DEFAULT_BUDGET)) return accept(label, stated);
                if (firstDerived == null) firstDerived = derived;
            } else if (failure == null) {
                failure = ((Unification.NotUnifiable) r).describe();
            }
        }
        if (firstDerived != null) return notVariant(rule, stated, firstDerived);
        return reject(rule, notUnifiable.get() + failure, Printer.clause(stated), null);
    }

    /**
     * B with each variable that also occurs in A renamed to a readable name occurring in neither (x becomes x1, x2, …),
     * so the two share no variable and messages still show the certificate's own names.
     */
    Clause renameApart(Clause b, Clause a) {
        List<Variable> own = b.variables();
        List<Variable> theirs = a.variables();
        if (own.isEmpty() || theirs.isEmpty()) return b;
        // Long certificates resolve with one clause again and again, against clauses with the same variables.
        Apart last = lastApart;
        if (last != null && b == last.from() && theirs.equals(last.of())) return last.result();
        Set<Variable> inA = theirs.size() > 8 ? new HashSet<>(theirs) : null;
        Set<Variable> taken = null;
        LinkedHashMap<Variable, Term> renaming = null;
        for (Variable v : own) {
            if (!(inA != null ? inA.contains(v) : theirs.contains(v))) continue;
            if (taken == null) {
                taken = new HashSet<>(theirs);
                taken.addAll(own);
                renaming = new LinkedHashMap<>();
            }
            String base = withoutTrailingDigits(v.name());
            for (int k = 1; ; k++) {
                Variable candidate = terms.variable(base + k);
                if (taken.add(candidate)) {
                    renaming.put(v, candidate);
                    break;
                }
            }
        }
        Clause apart = renaming == null ? b : Substitution.owning(terms, renaming).apply(b);
        lastApart = new Apart(b, theirs, apart);
        return apart;
    }

    private static String withoutTrailingDigits(String name) {
        int end = name.length();
        while (end > 0 && Character.isDigit(name.charAt(end - 1)) && name.charAt(end - 1) < 128) end--;
        return name.substring(0, end);
    }
}
