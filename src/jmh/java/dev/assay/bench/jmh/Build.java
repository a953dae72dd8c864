package dev.assay.bench.jmh;

import dev.assay.kernel.Application;
import dev.assay.kernel.Clause;
import dev.assay.kernel.Fact;
import dev.assay.kernel.Formula;
import dev.assay.kernel.Kernel;
import dev.assay.kernel.Literal;
import dev.assay.kernel.Outcome;
import dev.assay.kernel.Problem;
import dev.assay.kernel.Symbol;
import dev.assay.kernel.Term;
import dev.assay.kernel.TermFactory;
import dev.assay.kernel.Variable;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/** Kernel values for the benchmarks, built through the kernel's public interface only. */
final class Build {

    private Build() {
    }

    static Symbol function(String name, int arity) {
        return new Symbol(name, Symbol.Kind.FUNCTION, arity);
    }

    static Symbol predicate(String name, int arity) {
        return new Symbol(name, Symbol.Kind.PREDICATE, arity);
    }

    /**
     * The two sides of the Baader &amp; Snyder families (Handbook of Automated Reasoning, 2001, chapter 8, section 2,
     * recalled from memory): {@code row} is f(x1..xn) =? f(g(x0,x0)..g(x_{n-1},x_{n-1})); {@code grid} is
     * h(x1..xn, g(y0,y0)..g(y_{n-1},y_{n-1}), yn) =? h(g(x0,x0)..g(x_{n-1},x_{n-1}), y1..yn, xn).
     */
    static Term[] baaderSnyder(TermFactory f, String family, int n) {
        Symbol g = function("split", 2);
        Variable[] x = new Variable[n + 1];
        Variable[] y = new Variable[n + 1];
        for (int i = 0; i <= n; i++) {
            x[i] = f.variable("x" + i);
            y[i] = f.variable("y" + i);
        }
        if (family.equals("row")) {
            Symbol row = function("row" + n, n);
            Term[] l = new Term[n];
            Term[] r = new Term[n];
            for (int i = 0; i < n; i++) {
                l[i] = x[i + 1];
                r[i] = f.application(g, x[i], x[i]);
            }
            return new Term[] {f.application(row, l), f.application(row, r)};
        }
        Symbol grid = function("grid" + n, 2 * n + 1);
        Term[] l = new Term[2 * n + 1];
        Term[] r = new Term[2 * n + 1];
        for (int i = 0; i < n; i++) {
            l[i] = x[i + 1];
            l[n + i] = f.application(g, y[i], y[i]);
            r[i] = f.application(g, x[i], x[i]);
            r[n + i] = y[i + 1];
        }
        l[2 * n] = y[n];
        r[2 * n] = x[n];
        return new Term[] {f.application(grid, l), f.application(grid, r)};
    }

    /** {@code w(w(…w(leaf)…))}, {@code depth} applications of {@code w}. */
    static Term tower(TermFactory f, Symbol w, Term leaf, int depth) {
        Term t = leaf;
        for (int i = 0; i < depth; i++) t = f.application(w, t);
        return t;
    }

    /** The universal closure of the clause, as a formula. */
    static Formula closure(Clause c) {
        List<Formula> parts = new ArrayList<>();
        for (Literal l : c.literals()) parts.add(new Formula.Atomic(l));
        Formula body = parts.size() == 1 ? parts.get(0) : new Formula.Or(parts);
        Set<Variable> vars = new LinkedHashSet<>(c.variables());
        List<Variable> list = new ArrayList<>(vars);
        for (int i = list.size() - 1; i >= 0; i--) body = new Formula.Quantified(true, list.get(i), body);
        return body;
    }

    /** A kernel whose problem has one axiom per clause, and each clause as a fact (clausified from its axiom). */
    static final class Facts {
        final Kernel kernel;
        final List<Fact> facts = new ArrayList<>();

        Facts(TermFactory f, List<Symbol> symbols, List<Clause> clauses) {
            Problem.Builder b = new Problem.Builder("bench");
            for (Symbol s : symbols) b.declare(s);
            for (int i = 0; i < clauses.size(); i++) b.axiom("a" + i, closure(clauses.get(i)));
            kernel = new Kernel(b.build(), f);
            for (int i = 0; i < clauses.size(); i++) {
                Outcome o = kernel.clausify("c" + i, kernel.axiom("a" + i), null, clauses.get(i));
                if (!(o instanceof Outcome.Accepted a)) throw new IllegalStateException("clausify refused: " + o);
                facts.add(a.fact());
            }
        }
    }

    static Literal literal(boolean positive, Application atom) {
        return new Literal(positive, atom);
    }

    static Fact accepted(Outcome o) {
        if (o instanceof Outcome.Accepted a) return a.fact();
        throw new IllegalStateException("the kernel refused a benchmark step: " + o);
    }
}
