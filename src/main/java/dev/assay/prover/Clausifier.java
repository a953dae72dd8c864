package dev.assay.prover;

import dev.assay.kernel.Application;
import dev.assay.kernel.Formula;
import dev.assay.kernel.Formulas;
import dev.assay.kernel.Literal;
import dev.assay.kernel.Problem;
import dev.assay.kernel.Substitution;
import dev.assay.kernel.Symbol;
import dev.assay.kernel.Term;
import dev.assay.kernel.TermFactory;
import dev.assay.kernel.Variable;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Turns the problem into clauses, recording every step as the certificate rules state it: {@code negate} the goal
 * (stated as nnf(not G)), {@code skolemize} (or {@code nnf} when only bound variables need new names), {@code define}
 * and {@code abbreviate} for subformulas whose distribution would multiply clauses, and one {@code clausify} step per
 * clause.
 *
 * <p>Skolem terms take as arguments the universally bound variables enclosing the existential that occur free in it,
 * in the order they are bound (Skolem 1920; the rule of FORMAT.md section 6). Naming follows the structure-preserving
 * translations of Tseitin (1968) and Plaisted &amp; Greenbaum (1986): an occurrence ψ of positive polarity, with free
 * variables x̄, is replaced by a fresh atom Q(x̄), and only the clauses of {@code not Q(x̄) or ψ} are kept, since the
 * other direction of the definition is not needed for unsatisfiability.
 */
final class Clausifier {

    /** A disjunction whose distribution would give more clauses than this has its largest parts named. */
    static final long DISTRIBUTION_LIMIT = 16;
    private static final long CAP = Long.MAX_VALUE / 4;

    private final Problem problem;
    private final TermFactory terms;
    private final Names names;
    private final ProofStep.Counter counter;
    final List<ProverClause> clauses = new ArrayList<>();

    Clausifier(Problem problem, TermFactory terms, Names names, ProofStep.Counter counter) {
        this.problem = problem;
        this.terms = terms;
        this.names = names;
        this.counter = counter;
    }

    /** Clausifies every axiom and the negated goal. */
    List<ProverClause> run() {
        for (Map.Entry<String, Formula> e : problem.axioms().entrySet()) {
            clausify(e.getValue(), null, e.getKey());
        }
        if (problem.goal() != null) {
            Formula negated = Formulas.nnf(new Formula.Not(problem.goal()));
            FormulaStep negate = step(FormulaStep.Rule.NEGATE, negated, problem.goalName(), null, null, List.of());
            clausify(negated, negate, null);
        }
        return clauses;
    }

    private FormulaStep step(FormulaStep.Rule rule, Formula f, String problemName, FormulaStep premise,
                             FormulaStep definition, List<Symbol> fresh) {
        return new FormulaStep(counter.next(), rule, f, problemName, premise, definition, fresh);
    }

    /** Clausifies the formula of {@code premise} (or of the axiom {@code axiom} when premise is null). */
    private void clausify(Formula formula, FormulaStep premise, String axiom) {
        Formula normal = Formulas.nnf(formula);
        Skolemizer sk = new Skolemizer();
        Formula s = sk.walk(normal, new HashMap<>(), new ArrayList<>());
        FormulaStep current = premise;
        String currentAxiom = axiom;
        // The negate step states nnf(not G) itself; an axiom is taken as written.
        boolean statedInNnf = premise != null && premise.rule == FormulaStep.Rule.NEGATE;
        if (!sk.fresh.isEmpty() || sk.dropped) {
            current = step(FormulaStep.Rule.SKOLEMIZE, s, axiom, premise, null, sk.fresh);
            currentAxiom = null;
            statedInNnf = true;
        } else if (sk.renamed) {
            current = step(FormulaStep.Rule.NNF, s, axiom, premise, null, List.of());
            currentAxiom = null;
            statedInNnf = true;
        }
        List<Definition> definitions = new ArrayList<>();
        Formula named = name(s, definitions).formula;
        if (!definitions.isEmpty()) {
            if (!statedInNnf) {
                current = step(FormulaStep.Rule.NNF, s, currentAxiom, current, null, List.of());
                currentAxiom = null;
            }
            List<FormulaStep> defines = new ArrayList<>();
            for (Definition d : definitions) {
                FormulaStep define = step(FormulaStep.Rule.DEFINE, d.formula(), null, null, null, List.of(d.symbol));
                defines.add(define);
                definitionClauses(d, define);
            }
            // Abbreviations one definition at a time, innermost first: T_m is the fully named formula and
            // T_{i-1} is T_i with Q_i unfolded.
            Formula[] stages = new Formula[definitions.size() + 1];
            stages[definitions.size()] = named;
            for (int i = definitions.size(); i >= 1; i--) stages[i - 1] = unfold(stages[i], definitions.get(i - 1));
            for (int i = 1; i <= definitions.size(); i++) {
                current = step(FormulaStep.Rule.ABBREVIATE, stages[i], null, current, defines.get(i - 1), List.of());
            }
        }
        for (Set<Literal> c : cnf(named)) addClause(c, current, currentAxiom);
    }

    private void addClause(Set<Literal> literals, FormulaStep premise, String axiom) {
        if (isTautology(literals)) return;
        clauses.add(new ProverClause(counter.next(), literals.toArray(new Literal[0]),
                new Inference.Clausified(premise, axiom)));
    }

    static boolean isTautology(Set<Literal> literals) {
        for (Literal l : literals) {
            if (l.positive() && l.isEquation() && l.left() == l.right()) return true;
            if (l.positive() && literals.contains(l.negated())) return true;
        }
        return false;
    }

    /** The clauses of {@code not Q(x̄) or ψ}, from the definition or from its Skolemized form. */
    private void definitionClauses(Definition d, FormulaStep define) {
        Formula normal = Formulas.nnf(d.formula());
        Skolemizer sk = new Skolemizer();
        Formula s = sk.walk(normal, new HashMap<>(), new ArrayList<>());
        FormulaStep premise = define;
        if (!sk.fresh.isEmpty() || sk.dropped) {
            premise = step(FormulaStep.Rule.SKOLEMIZE, s, null, define, null, sk.fresh);
        }
        if (sk.renamed) throw new IllegalStateException("a definition's variables were renamed: " + s);
        Literal head = new Literal(false, d.atom);
        for (Set<Literal> c : cnf(d.body)) {
            Set<Literal> withHead = new LinkedHashSet<>();
            withHead.add(head);
            withHead.addAll(c);
            addClause(withHead, premise, null);
        }
    }

    // ---------------------------------------------------------------- Skolemization and renaming

    /**
     * Walks a negation normal form: gives every universal variable a name that is unique in the formula and no
     * symbol's, replaces each existential by a Skolem term over the enclosing universal variables that occur free in
     * it, and drops existentials whose variable does not occur.
     */
    private final class Skolemizer {
        final Set<String> bound = new HashSet<>();
        final List<Symbol> fresh = new ArrayList<>();
        boolean renamed;
        boolean dropped;

        Formula walk(Formula f, Map<Variable, Term> env, List<Variable> universals) {
            if (f instanceof Formula.Atomic a) {
                if (env.isEmpty() || a.literal().atom().isGround()) return a;
                Literal l = new Substitution(terms, env).apply(a.literal());
                return l.atom() == a.literal().atom() ? a : new Formula.Atomic(l);
            }
            if (f instanceof Formula.Constant) return f;
            if (f instanceof Formula.Junction j) {
                List<Formula> parts = new ArrayList<>(j.parts().size());
                for (Formula p : j.parts()) parts.add(walk(p, env, universals));
                return Formulas.junction(j instanceof Formula.And, parts);
            }
            if (f instanceof Formula.Quantified q) {
                Variable v = q.variable();
                if (q.universal()) {
                    String name = names.variable(v.name(), bound);
                    bound.add(name);
                    if (!name.equals(v.name())) renamed = true;
                    Variable nv = terms.variable(name);
                    Map<Variable, Term> inner = new HashMap<>(env);
                    inner.put(v, nv);
                    List<Variable> scope = new ArrayList<>(universals);
                    scope.add(nv);
                    return new Formula.Quantified(true, nv, walk(q.body(), inner, scope));
                }
                if (!Formulas.freeVariables(q.body()).contains(v)) {
                    dropped = true;
                    return walk(q.body(), env, universals);
                }
                Set<Variable> image = new HashSet<>();
                for (Variable free : Formulas.freeVariables(q)) {
                    Term t = env.get(free);
                    Subterms.collectVariables(t == null ? free : t, image);
                }
                List<Term> args = new ArrayList<>();
                for (Variable u : universals) if (image.contains(u)) args.add(u);
                Symbol s = new Symbol(names.freshSymbol("sk"), Symbol.Kind.FUNCTION, args.size());
                fresh.add(s);
                Map<Variable, Term> inner = new HashMap<>(env);
                inner.put(v, terms.application(s, args));
                return walk(q.body(), inner, universals);
            }
            throw new IllegalStateException("not a negation normal form: " + f);
        }
    }

    // ---------------------------------------------------------------- definitions

    /** {@code forall x̄. (symbol(x̄) iff body)}, where atom is {@code symbol(x̄)}. */
    private record Definition(Symbol symbol, List<Variable> parameters, Application atom, Formula body) {
        Formula formula() {
            Formula f = new Formula.Iff(new Formula.Atomic(new Literal(true, atom)), body);
            for (int i = parameters.size() - 1; i >= 0; i--) f = new Formula.Quantified(true, parameters.get(i), f);
            return f;
        }
    }

    private record Named(Formula formula, long count) {
    }

    /** The formula with large disjuncts named, and the number of clauses it distributes into. */
    private Named name(Formula f, List<Definition> out) {
        if (f instanceof Formula.Atomic) return new Named(f, 1);
        if (f instanceof Formula.Constant c) return new Named(f, c.value() ? 0 : 1);
        if (f instanceof Formula.Quantified q) {
            Named body = name(q.body(), out);
            return new Named(new Formula.Quantified(true, q.variable(), body.formula), body.count);
        }
        Formula.Junction j = (Formula.Junction) f;
        List<Named> parts = new ArrayList<>();
        for (Formula p : j.parts()) parts.add(name(p, out));
        if (j instanceof Formula.And) {
            long sum = 0;
            List<Formula> fs = new ArrayList<>();
            for (Named n : parts) {
                sum = Math.min(CAP, sum + n.count);
                fs.add(n.formula);
            }
            return new Named(Formulas.junction(true, fs), sum);
        }
        while (product(parts) > DISTRIBUTION_LIMIT) {
            int largest = -1;
            for (int i = 0; i < parts.size(); i++) {
                if (parts.get(i).count > 1 && (largest < 0 || parts.get(i).count > parts.get(largest).count)) largest = i;
            }
            if (largest < 0) break;
            parts.set(largest, new Named(define(parts.get(largest).formula, out), 1));
        }
        List<Formula> fs = new ArrayList<>();
        for (Named n : parts) fs.add(n.formula);
        return new Named(Formulas.junction(false, fs), product(parts));
    }

    private static long product(List<Named> parts) {
        long p = 1;
        for (Named n : parts) {
            if (n.count == 0) return 0;
            p = p > CAP / n.count ? CAP : p * n.count;
        }
        return p;
    }

    private Formula define(Formula body, List<Definition> out) {
        List<Variable> params = new ArrayList<>(Formulas.freeVariables(body));
        Symbol q = new Symbol(names.freshSymbol("Def"), Symbol.Kind.PREDICATE, params.size());
        Application atom = terms.application(q, params);
        out.add(new Definition(q, params, atom, body));
        return new Formula.Atomic(new Literal(true, atom));
    }

    /** {@code f} with the atom of the definition replaced by its body (the names are the same, so nothing is captured). */
    private static Formula unfold(Formula f, Definition d) {
        if (f instanceof Formula.Atomic a) {
            return a.literal().positive() && a.literal().atom() == d.atom ? d.body : f;
        }
        if (f instanceof Formula.Quantified q) return new Formula.Quantified(q.universal(), q.variable(), unfold(q.body(), d));
        if (f instanceof Formula.Junction j) {
            List<Formula> parts = new ArrayList<>();
            for (Formula p : j.parts()) parts.add(unfold(p, d));
            return Formulas.junction(j instanceof Formula.And, parts);
        }
        return f;
    }

    // ---------------------------------------------------------------- distribution

    /** The clauses of a quantifier-free (universals ignored) negation normal form, by distribution. */
    static List<Set<Literal>> cnf(Formula f) {
        if (f instanceof Formula.Atomic a) {
            Set<Literal> c = new LinkedHashSet<>();
            c.add(a.literal());
            return List.of(c);
        }
        if (f instanceof Formula.Constant k) return k.value() ? List.of() : List.of(new LinkedHashSet<>());
        if (f instanceof Formula.Quantified q) return cnf(q.body());
        Formula.Junction j = (Formula.Junction) f;
        if (j instanceof Formula.And) {
            List<Set<Literal>> out = new ArrayList<>();
            for (Formula p : j.parts()) out.addAll(cnf(p));
            return dedupe(out);
        }
        List<Set<Literal>> acc = new ArrayList<>();
        acc.add(new LinkedHashSet<>());
        for (Formula p : j.parts()) {
            List<Set<Literal>> next = new ArrayList<>();
            for (Set<Literal> left : acc) {
                for (Set<Literal> right : cnf(p)) {
                    Set<Literal> c = new LinkedHashSet<>(left);
                    c.addAll(right);
                    if (!isTautology(c)) next.add(c);
                }
            }
            acc = next;
        }
        return dedupe(acc);
    }

    private static List<Set<Literal>> dedupe(List<Set<Literal>> clauses) {
        return new ArrayList<>(new LinkedHashSet<>(clauses));
    }
}
