package dev.assay.campaign;

import dev.assay.kernel.Clause;
import dev.assay.kernel.Formula;
import dev.assay.kernel.Literal;
import dev.assay.kernel.Problem;
import dev.assay.kernel.TermFactory;
import dev.assay.syntax.ProblemReader;
import dev.assay.syntax.Resolver;

import java.util.ArrayList;
import java.util.List;

/**
 * Kernel values written as text for the oracle's tests: formulas are read as the axioms of one problem (so the
 * symbols of one call agree in kind and arity), and a clause is written as a closed formula
 * {@code forall x y. L1 or L2} whose quantifier prefix becomes the clause's variables.
 */
final class Values {

    private Values() {
    }

    /** The formulas, in order, read as axioms of one problem. */
    static List<Formula> formulas(String... texts) {
        StringBuilder sb = new StringBuilder("problem values\n");
        for (int i = 0; i < texts.length; i++) sb.append("axiom f").append(i).append(": ").append(texts[i]).append('\n');
        try {
            Problem p = new Resolver(new TermFactory()).problem(ProblemReader.readAll("values", sb.toString()));
            return new ArrayList<>(p.axioms().values());
        } catch (Exception e) {
            throw new IllegalArgumentException(sb + ": " + e, e);
        }
    }

    static Formula formula(String text) {
        return formulas(text).get(0);
    }

    /** {@code forall x. not P(x) or Q(x)} as the clause {@code [x] not P(x) or Q(x)}; {@code false} as the empty clause. */
    static Clause clause(Formula f) {
        while (f instanceof Formula.Quantified q && q.universal()) f = q.body();
        List<Literal> lits = new ArrayList<>();
        if (f instanceof Formula.Constant k && !k.value()) return Clause.EMPTY;
        if (f instanceof Formula.Or or) {
            for (Formula p : or.parts()) lits.add(literal(p));
        } else {
            lits.add(literal(f));
        }
        return new Clause(lits);
    }

    private static Literal literal(Formula f) {
        if (f instanceof Formula.Atomic a) return a.literal();
        if (f instanceof Formula.Not n && n.body() instanceof Formula.Atomic a) return a.literal().negated();
        throw new IllegalArgumentException("not a literal: " + f);
    }
}
