package dev.assay.syntax;

import dev.assay.kernel.Application;
import dev.assay.kernel.Clause;
import dev.assay.kernel.Formula;
import dev.assay.kernel.Formulas;
import dev.assay.kernel.Literal;
import dev.assay.kernel.Problem;
import dev.assay.kernel.Signature;
import dev.assay.kernel.Substitution;
import dev.assay.kernel.Symbol;
import dev.assay.kernel.Term;
import dev.assay.kernel.TermFactory;
import dev.assay.kernel.Variable;

import java.util.ArrayList;
import java.util.Collection;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Turns raw syntax into kernel values: decides which identifiers are variables and which are symbols, gives every
 * symbol its kind and arity, and reports a name used with two arities or kinds at both places.
 *
 * <p>In a formula an identifier is a variable exactly where an enclosing quantifier binds it; in a clause exactly
 * when the clause's bracket lists it; in a substitution's range when it is a variable of the step's conclusion or no
 * symbol is known by that name. Every other identifier is a symbol.
 */
public final class Resolver {

    private record Use(Symbol symbol, Location first) {
    }

    private final TermFactory terms;
    /** Every symbol seen so far with where it was first seen: the problem's, then those steps introduced. */
    private final Map<String, Use> uses = new LinkedHashMap<>();

    public Resolver(TermFactory terms) {
        this.terms = terms;
    }

    // ---------------------------------------------------------------- problems

    /** Resolves a whole problem file. */
    public Problem problem(List<ProblemStatement> statements) throws InputError {
        String name = null;
        Map<String, Location> names = new HashMap<>();
        List<Object[]> formulas = new ArrayList<>(); // {Name, Formula, Boolean goal}
        Location goalAt = null;
        for (ProblemStatement s : statements) {
            if (s instanceof ProblemHeader h) {
                if (name != null) throw new InputError(h.at(), "a problem file has one 'problem' header");
                name = h.name().text();
            } else if (name == null) {
                throw new InputError(s.at(), "a problem file starts with 'problem <name>'");
            } else if (s instanceof Declaration d) {
                Symbol.Kind kind = d.kind() == DeclarationKind.FUNCTION ? Symbol.Kind.FUNCTION : Symbol.Kind.PREDICATE;
                for (DeclaredSymbol ds : d.symbols()) note(new Symbol(ds.name().text(), kind, ds.arity()), ds.at());
            } else if (s instanceof Axiom a) {
                unique(names, a.name());
                formulas.add(new Object[] {a.name(), problemFormula(a.formula()), false});
            } else if (s instanceof Goal g) {
                if (goalAt != null) throw new InputError(g.at(), "a problem has at most one goal", goalAt);
                goalAt = g.at();
                unique(names, g.name());
                formulas.add(new Object[] {g.name(), problemFormula(g.formula()), true});
            }
        }
        if (name == null) {
            throw new InputError(new Location(statements.isEmpty() ? "?" : statements.get(0).at().file(), 1, 1),
                    "a problem file starts with 'problem <name>'");
        }
        Problem.Builder b = new Problem.Builder(name);
        for (Use u : uses.values()) b.declare(u.symbol);
        for (Object[] f : formulas) {
            Name n = (Name) f[0];
            if ((Boolean) f[2]) b.goal(n.text(), (Formula) f[1]);
            else b.axiom(n.text(), (Formula) f[1]);
        }
        return b.build();
    }

    private Formula problemFormula(RawFormula f) throws InputError {
        try {
            return formula(f, null);
        } catch (StepProblem p) {
            throw new InputError(p.at(), p.reason());
        }
    }

    private static void unique(Map<String, Location> names, Name n) throws InputError {
        Location before = names.putIfAbsent(n.text(), n.at());
        if (before != null) throw new InputError(n.at(), "the name " + n.text() + " is used twice", before);
    }

    /** Records a symbol use; a second kind or arity for one name is an input error pointing at both places. */
    private Symbol note(Symbol s, Location at) throws InputError {
        Use u = uses.get(s.name());
        if (u == null) {
            uses.put(s.name(), new Use(s, at));
            return s;
        }
        if (!u.symbol.equals(s)) {
            throw new InputError(at, s.name() + " is used as " + describe(s) + " here but as " + describe(u.symbol)
                    + " before", u.first);
        }
        return u.symbol;
    }

    private static String describe(Symbol s) {
        return (s.kind() == Symbol.Kind.FUNCTION ? (s.arity() == 0 ? "a constant" : "a function")
                : (s.arity() == 0 ? "a propositional atom" : "a predicate")) + " (" + s.name() + "/" + s.arity() + ")";
    }

    /** Marks that a step introduced {@code s} (for locating later clashes). */
    public void introduced(Symbol s, Location at) {
        uses.putIfAbsent(s.name(), new Use(s, at));
    }

    // ---------------------------------------------------------------- certificate steps

    /**
     * Scope for one step: the signature as it stands, and the names the step itself introduces ({@code fresh}),
     * whose kind and arity come from their use in the conclusion.
     */
    private final class Scope {
        final Signature signature;
        final Set<String> fresh;
        final Map<String, Use> freshUses;

        Scope(Signature signature, Set<String> fresh) {
            this.signature = signature;
            this.fresh = fresh;
            this.freshUses = fresh.isEmpty() ? Map.of() : new LinkedHashMap<>();
        }

        Symbol symbol(String name, Symbol.Kind kind, int arity, Location at) throws InputError, StepProblem {
            if (signature != null && fresh.isEmpty()) {
                // The common case, a symbol of the signature as it stands, without making a Symbol to compare.
                Symbol known = signature.lookup(name);
                if (known != null && known.kind() == kind && known.arity() == arity) return known;
            }
            Symbol wanted = new Symbol(name, kind, arity);
            if (signature == null) return note(wanted, at);
            if (fresh.contains(name)) {
                Use u = freshUses.get(name);
                if (u == null) {
                    freshUses.put(name, new Use(wanted, at));
                    return wanted;
                }
                if (!u.symbol.equals(wanted)) {
                    throw new InputError(at, name + " is used as " + describe(wanted) + " here but as "
                            + describe(u.symbol) + " before", u.first);
                }
                return u.symbol;
            }
            Symbol known = signature.lookup(name);
            if (known == null) {
                throw new StepProblem(at, "unknown symbol " + name + ": it is neither a symbol of the problem nor"
                        + " introduced by an earlier step");
            }
            if (!known.equals(wanted)) {
                Use u = uses.get(name);
                throw new InputError(at, name + " is used as " + describe(wanted) + " here but is "
                        + describe(known), u == null ? null : u.first);
            }
            return known;
        }
    }

    /** The symbols a step's {@code fresh} list names, with the kind and arity their use in the conclusion gives. */
    public List<Symbol> freshSymbols(RawConclusion conclusion, List<Name> fresh, Signature signature)
            throws InputError, StepProblem {
        Set<String> names = new LinkedHashSet<>();
        for (Name n : fresh) {
            if (!names.add(n.text())) throw new StepProblem(n.at(), n.text() + " is listed twice");
        }
        Scope scope = new Scope(signature, names);
        if (conclusion instanceof RawFormula f) formula(f, scope);
        else clause((RawClause) conclusion, scope);
        List<Symbol> out = new ArrayList<>();
        for (Name n : fresh) {
            Use u = scope.freshUses.get(n.text());
            if (u == null) throw new StepProblem(n.at(), n.text() + " does not occur in the conclusion");
            out.add(u.symbol);
        }
        return out;
    }

    /** A formula conclusion of a step. */
    public Formula stepFormula(RawFormula f, Signature signature, List<Name> fresh) throws InputError, StepProblem {
        Set<String> names = new LinkedHashSet<>();
        for (Name n : fresh) names.add(n.text());
        return formula(f, new Scope(signature, names));
    }

    /** A clause conclusion of a step. */
    public Clause stepClause(RawClause c, Signature signature) throws InputError, StepProblem {
        return clause(c, new Scope(signature, Set.of()));
    }

    /** A substitution of a step whose conclusion has {@code conclusionVariables}. */
    public Substitution substitution(RawSubstitution s, Signature signature, Collection<Variable> conclusionVariables)
            throws InputError, StepProblem {
        Scope scope = new Scope(signature, Set.of());
        Map<Variable, Term> bindings = new LinkedHashMap<>();
        Set<String> names = new HashSet<>();
        for (RawBinding b : s.bindings()) {
            if (!names.add(b.variable().text())) {
                throw new StepProblem(b.variable().at(), "the substitution binds " + b.variable().text() + " twice");
            }
            Variables vars = new Variables();
            collectRangeVariables(b.term(), scope, conclusionVariables, vars);
            bindings.put(terms.variable(b.variable().text()), term(b.term(), vars, scope));
        }
        return new Substitution(terms, bindings);
    }

    private void collectRangeVariables(RawTerm t, Scope scope, Collection<Variable> conclusionVariables,
                                       Variables out) {
        if (t.args().isEmpty()) {
            boolean conclusionVar = conclusionVariables.contains(terms.variable(t.name()));
            if (conclusionVar || scope.signature.lookup(t.name()) == null) out.add(t.name());
            return;
        }
        for (RawTerm a : t.args()) collectRangeVariables(a, scope, conclusionVariables, out);
    }

    // ---------------------------------------------------------------- formulas, clauses, terms

    /**
     * The names that are variables where a term is read, each with its variable and whether it was met: a clause's
     * bracket, the variables bound around an atom, the variables of a substitution's range. Usually a few, so kept in
     * arrays and searched in order; past {@link #FEW} they are also indexed by name.
     */
    private final class Variables {
        private static final int FEW = 16;
        private String[] names = new String[4];
        private Variable[] variables = new Variable[4];
        boolean[] used = new boolean[4];
        int size;
        private Map<String, Integer> index;

        /** Adds a name; false when it is there already. */
        boolean add(String name) {
            if (indexOf(name) >= 0) return false;
            if (size == names.length) {
                names = java.util.Arrays.copyOf(names, 2 * size);
                variables = java.util.Arrays.copyOf(variables, 2 * size);
                used = java.util.Arrays.copyOf(used, 2 * size);
            }
            names[size] = name;
            variables[size] = terms.variable(name);
            if (index != null) index.put(name, size);
            else if (size == FEW) {
                index = new HashMap<>();
                for (int i = 0; i <= size; i++) index.put(names[i], i);
            }
            size++;
            return true;
        }

        /** The variable of this name, marked as met; null when the name is not one of these. */
        Variable find(String name) {
            int i = indexOf(name);
            if (i < 0) return null;
            used[i] = true;
            return variables[i];
        }

        private int indexOf(String name) {
            if (index != null) {
                Integer i = index.get(name);
                return i == null ? -1 : i;
            }
            for (int i = 0; i < size; i++) if (names[i].equals(name)) return i;
            return -1;
        }
    }

    private Formula formula(RawFormula f, Scope scope) throws InputError, StepProblem {
        return formula(f, new ArrayList<>(), scope);
    }

    private Formula formula(RawFormula f, List<String> bound, Scope scope) throws InputError, StepProblem {
        if (f instanceof RawConstant c) return Formula.Constant.of(c.value());
        if (f instanceof RawAtom a) {
            Variables vars = new Variables();
            for (String v : bound) vars.add(v);
            return new Formula.Atomic(literal(false, a.atom(), vars, scope));
        }
        if (f instanceof RawNot n) return new Formula.Not(formula(n.body(), bound, scope));
        if (f instanceof RawAnd a) return new Formula.And(parts(a.operands(), bound, scope));
        if (f instanceof RawOr o) return new Formula.Or(parts(o.operands(), bound, scope));
        if (f instanceof RawImplies i) {
            return new Formula.Implies(formula(i.left(), bound, scope), formula(i.right(), bound, scope));
        }
        if (f instanceof RawIff i) {
            return new Formula.Iff(formula(i.left(), bound, scope), formula(i.right(), bound, scope));
        }
        RawQuantified q = (RawQuantified) f;
        int mark = bound.size();
        for (Name v : q.variables()) bound.add(v.text());
        Formula body = formula(q.body(), bound, scope);
        while (bound.size() > mark) bound.remove(bound.size() - 1);
        for (int i = q.variables().size() - 1; i >= 0; i--) {
            body = new Formula.Quantified(q.universal(), terms.variable(q.variables().get(i).text()), body);
        }
        return body;
    }

    private List<Formula> parts(List<RawFormula> raw, List<String> bound, Scope scope) throws InputError, StepProblem {
        List<Formula> out = new ArrayList<>(raw.size());
        for (RawFormula r : raw) out.add(formula(r, bound, scope));
        return out;
    }

    private Clause clause(RawClause c, Scope scope) throws InputError, StepProblem {
        Variables vars = new Variables();
        if (c.variables() != null) {
            for (Name n : c.variables()) {
                if (!vars.add(n.text())) throw new StepProblem(n.at(), "the variable " + n.text() + " is listed twice");
            }
        }
        List<Literal> lits = new ArrayList<>(c.literals().size());
        for (RawLiteral l : c.literals()) lits.add(literal(l.negated(), l.atom(), vars, scope));
        if (c.variables() != null) {
            for (int i = 0; i < vars.size; i++) {
                if (!vars.used[i]) {
                    Name n = c.variables().get(i);
                    throw new StepProblem(n.at(), "the variable " + n.text() + " is listed but does not occur in the clause");
                }
            }
        }
        return new Clause(lits);
    }

    private Literal literal(boolean negated, RawAtomic atom, Variables vars, Scope scope)
            throws InputError, StepProblem {
        if (atom instanceof RawEquation e) {
            Application eq = terms.equation(term(e.left(), vars, scope), term(e.right(), vars, scope));
            return new Literal(!(negated ^ e.negated()), eq);
        }
        RawTerm t = ((RawPredicateAtom) atom).term();
        if (vars.find(t.name()) != null) {
            throw new StepProblem(t.at(), t.name() + " is a variable here and cannot stand as an atom");
        }
        Symbol p = symbol(t.name(), Symbol.Kind.PREDICATE, t.args().size(), t.at(), scope);
        Term[] args = new Term[t.args().size()];
        for (int i = 0; i < args.length; i++) args[i] = term(t.args().get(i), vars, scope);
        return new Literal(!negated, terms.application(p, args));
    }

    private Term term(RawTerm t, Variables vars, Scope scope) throws InputError, StepProblem {
        Variable v = vars.find(t.name());
        if (v != null) {
            if (!t.args().isEmpty()) {
                throw new StepProblem(t.at(), t.name() + " is a variable here and cannot be applied to arguments");
            }
            return v;
        }
        Symbol f = symbol(t.name(), Symbol.Kind.FUNCTION, t.args().size(), t.at(), scope);
        Term[] args = new Term[t.args().size()];
        for (int i = 0; i < args.length; i++) args[i] = term(t.args().get(i), vars, scope);
        return terms.application(f, args);
    }

    private Symbol symbol(String name, Symbol.Kind kind, int arity, Location at, Scope scope)
            throws InputError, StepProblem {
        if (scope == null) return note(new Symbol(name, kind, arity), at);
        return scope.symbol(name, kind, arity, at);
    }

    /** Free variables of a formula (for the report and the closedness of step formulas). */
    public static Set<Variable> freeVariables(Formula f) {
        return Formulas.freeVariables(f);
    }
}
