package dev.assay.kernel;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;

/** Random formulas for property tests, and small semantic helpers. */
final class RandomFormulas {

    final TermFactory f;
    final Random random;
    final Symbol[] props;
    final Symbol p1 = new Symbol("P", Symbol.Kind.PREDICATE, 1);
    final Symbol r2 = new Symbol("R", Symbol.Kind.PREDICATE, 2);
    final Symbol fn = new Symbol("f", Symbol.Kind.FUNCTION, 1);
    final Symbol a = new Symbol("a", Symbol.Kind.FUNCTION, 0);
    final Symbol b = new Symbol("b", Symbol.Kind.FUNCTION, 0);
    private final String[] names = {"x", "y", "z"};

    RandomFormulas(TermFactory f, long seed) {
        this.f = f;
        this.random = new Random(seed);
        props = new Symbol[] {new Symbol("A", Symbol.Kind.PREDICATE, 0), new Symbol("B", Symbol.Kind.PREDICATE, 0),
            new Symbol("C", Symbol.Kind.PREDICATE, 0)};
    }

    /** A propositional formula over A, B, C with every connective. */
    Formula propositional(int depth) {
        int choice = depth <= 0 ? random.nextInt(2) : random.nextInt(8);
        switch (choice) {
            case 0:
                return new Formula.Atomic(new Literal(random.nextInt(4) != 0, f.application(props[random.nextInt(3)])));
            case 1:
                return random.nextInt(5) == 0 ? Formula.Constant.of(random.nextBoolean())
                        : new Formula.Atomic(new Literal(true, f.application(props[random.nextInt(3)])));
            case 2:
            case 3:
                return new Formula.Not(propositional(depth - 1));
            case 4:
                return junction(true, depth, false);
            case 5:
                return junction(false, depth, false);
            case 6:
                return new Formula.Implies(propositional(depth - 1), propositional(depth - 1));
            default:
                return new Formula.Iff(propositional(depth - 1), propositional(depth - 1));
        }
    }

    /** A first-order formula with quantifiers over x, y, z, atoms P/1, R/2 and equations, free variables possible. */
    Formula firstOrder(int depth) {
        int choice = depth <= 0 ? 0 : random.nextInt(9);
        switch (choice) {
            case 0:
                return atom();
            case 1:
                return new Formula.Not(firstOrder(depth - 1));
            case 2:
                return junction(true, depth, true);
            case 3:
                return junction(false, depth, true);
            case 4:
                return new Formula.Implies(firstOrder(depth - 1), firstOrder(depth - 1));
            case 5:
                return new Formula.Iff(firstOrder(depth - 1), firstOrder(depth - 1));
            case 6:
                return random.nextInt(4) == 0 ? Formula.Constant.of(random.nextBoolean()) : atom();
            default:
                return new Formula.Quantified(random.nextBoolean(), f.variable(names[random.nextInt(3)]),
                        firstOrder(depth - 1));
        }
    }

    private Formula junction(boolean and, int depth, boolean firstOrder) {
        int n = 2 + random.nextInt(2);
        List<Formula> parts = new ArrayList<>();
        for (int i = 0; i < n; i++) parts.add(firstOrder ? firstOrder(depth - 1) : propositional(depth - 1));
        return and ? new Formula.And(parts) : new Formula.Or(parts);
    }

    Term term() {
        switch (random.nextInt(5)) {
            case 0:
                return f.application(a);
            case 1:
                return f.application(b);
            case 2:
                return f.application(fn, term());
            default:
                return f.variable(names[random.nextInt(3)]);
        }
    }

    private Formula atom() {
        boolean positive = random.nextInt(3) != 0;
        switch (random.nextInt(4)) {
            case 0:
                return new Formula.Atomic(new Literal(positive, f.application(p1, term())));
            case 1:
                return new Formula.Atomic(new Literal(positive, f.application(r2, term(), term())));
            case 2:
                return new Formula.Atomic(new Literal(positive, f.equation(term(), term())));
            default:
                return new Formula.Atomic(new Literal(positive, f.application(props[random.nextInt(3)])));
        }
    }

    /** Truth value of a quantifier-free formula over 0-ary atoms. */
    static boolean evaluate(Formula fm, Map<Symbol, Boolean> valuation) {
        if (fm instanceof Formula.Atomic at) {
            boolean v = valuation.get(at.literal().atom().symbol());
            return at.literal().positive() == v;
        }
        if (fm instanceof Formula.Constant c) return c.value();
        if (fm instanceof Formula.Not n) return !evaluate(n.body(), valuation);
        if (fm instanceof Formula.And and) {
            for (Formula p : and.parts()) if (!evaluate(p, valuation)) return false;
            return true;
        }
        if (fm instanceof Formula.Or or) {
            for (Formula p : or.parts()) if (evaluate(p, valuation)) return true;
            return false;
        }
        if (fm instanceof Formula.Implies imp) return !evaluate(imp.left(), valuation) || evaluate(imp.right(), valuation);
        if (fm instanceof Formula.Iff iff) return evaluate(iff.left(), valuation) == evaluate(iff.right(), valuation);
        throw new IllegalArgumentException("quantifier in " + fm);
    }

    /**
     * The same tree: same node kinds, variables, parts in the same order. A negative atom other than {@code s != t}
     * counts as {@code not} above the atom, since that is how it is written.
     */
    static boolean sameTree(Formula x, Formula y) {
        x = spelled(x);
        y = spelled(y);
        if (x instanceof Formula.Atomic ax && y instanceof Formula.Atomic ay) {
            return ax.literal().positive() == ay.literal().positive() && ax.literal().atom() == ay.literal().atom();
        }
        if (x instanceof Formula.Constant cx && y instanceof Formula.Constant cy) return cx.value() == cy.value();
        if (x instanceof Formula.Not nx && y instanceof Formula.Not ny) return sameTree(nx.body(), ny.body());
        if (x instanceof Formula.Junction jx && y instanceof Formula.Junction jy) {
            if ((x instanceof Formula.And) != (y instanceof Formula.And)) return false;
            if (jx.parts().size() != jy.parts().size()) return false;
            for (int i = 0; i < jx.parts().size(); i++) if (!sameTree(jx.parts().get(i), jy.parts().get(i))) return false;
            return true;
        }
        if (x instanceof Formula.Implies ix && y instanceof Formula.Implies iy) {
            return sameTree(ix.left(), iy.left()) && sameTree(ix.right(), iy.right());
        }
        if (x instanceof Formula.Iff ix && y instanceof Formula.Iff iy) {
            return sameTree(ix.left(), iy.left()) && sameTree(ix.right(), iy.right());
        }
        if (x instanceof Formula.Quantified qx && y instanceof Formula.Quantified qy) {
            return qx.universal() == qy.universal() && qx.variable() == qy.variable() && sameTree(qx.body(), qy.body());
        }
        return false;
    }

    private static Formula spelled(Formula fm) {
        if (fm instanceof Formula.Atomic at && !at.literal().positive() && !at.literal().isEquation()) {
            return new Formula.Not(new Formula.Atomic(at.literal().negated()));
        }
        return fm;
    }
}
