package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashMap;
import java.util.Map;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;

/** Properties of negation normal form, equivalence and printing over random formulas. */
class FormulaPropertyTest {

    @Property(tries = 300, seed = "20240601")
    void nnfPreservesTruthAndIsNormal(@ForAll long seed) {
        TermFactory f = new TermFactory();
        RandomFormulas gen = new RandomFormulas(f, seed);
        Formula fm = gen.propositional(5);
        Formula normal = Formulas.nnf(fm);
        FormulasTest.assertNormal(normal);
        for (int bits = 0; bits < 8; bits++) {
            Map<Symbol, Boolean> v = new HashMap<>();
            for (int i = 0; i < 3; i++) v.put(gen.props[i], (bits >> i & 1) == 1);
            assertEquals(RandomFormulas.evaluate(fm, v), RandomFormulas.evaluate(normal, v),
                    () -> Printer.formula(fm) + " has nnf " + Printer.formula(normal));
        }
    }

    @Property(tries = 300, seed = "20240602")
    void nnfIsIdempotentAndEquivalentToItself(@ForAll long seed) {
        TermFactory f = new TermFactory();
        Formula fm = new RandomFormulas(f, seed).firstOrder(5);
        Formula normal = Formulas.nnf(fm);
        FormulasTest.assertNormal(normal);
        assertTrue(Formulas.equivalent(Formulas.nnf(normal), normal), () -> Printer.formula(normal));
        assertTrue(Formulas.equivalent(fm, fm));
        // nnf(not not F) is nnf(F).
        assertTrue(Formulas.equivalent(Formulas.nnf(new Formula.Not(new Formula.Not(fm))), normal));
    }

    @Property(tries = 300, seed = "20240603")
    void printerRoundTrip(@ForAll long seed) {
        KernelFixture k = new KernelFixture();
        Formula fm = new RandomFormulas(k.f, seed).firstOrder(5);
        String printed = Printer.formula(fm, Printer.UNLIMITED);
        Formula again = k.formula(printed);
        assertTrue(RandomFormulas.sameTree(fm, again), () -> "printed " + printed + ", read back as "
                + Printer.formula(again, Printer.UNLIMITED));
        assertEquals(printed, Printer.formula(again, Printer.UNLIMITED));
    }

    @Property(tries = 200, seed = "20240604")
    void equivalenceIgnoresBoundNamesAndOrder(@ForAll long seed) {
        TermFactory f = new TermFactory();
        Formula fm = new RandomFormulas(f, seed).firstOrder(4);
        Formula shuffled = Shuffle.reverseJunctions(f, fm);
        assertTrue(Formulas.equivalent(fm, shuffled), () -> Printer.formula(fm) + " vs " + Printer.formula(shuffled));
        Formula renamed = Shuffle.renameBound(f, fm);
        assertTrue(Formulas.equivalent(fm, renamed), () -> Printer.formula(fm) + " vs " + Printer.formula(renamed));
    }

    /** Transformations that keep a formula the same modulo AC and renaming of bound variables. */
    static final class Shuffle {
        /** Every and/or with its parts reversed, every equation turned round. */
        static Formula reverseJunctions(TermFactory f, Formula fm) {
            if (fm instanceof Formula.Junction j) {
                java.util.List<Formula> parts = new java.util.ArrayList<>();
                for (Formula p : j.parts()) parts.add(0, reverseJunctions(f, p));
                return j instanceof Formula.And ? new Formula.And(parts) : new Formula.Or(parts);
            }
            if (fm instanceof Formula.Not n) return new Formula.Not(reverseJunctions(f, n.body()));
            if (fm instanceof Formula.Implies i) {
                return new Formula.Implies(reverseJunctions(f, i.left()), reverseJunctions(f, i.right()));
            }
            if (fm instanceof Formula.Iff i) return new Formula.Iff(reverseJunctions(f, i.left()), reverseJunctions(f, i.right()));
            if (fm instanceof Formula.Quantified q) {
                return new Formula.Quantified(q.universal(), q.variable(), reverseJunctions(f, q.body()));
            }
            if (fm instanceof Formula.Atomic a && a.literal().isEquation()) {
                Literal l = a.literal();
                return new Formula.Atomic(new Literal(l.positive(), f.equation(l.right(), l.left())));
            }
            return fm;
        }

        /** Every binder gets a fresh name (b1, b2, …), consistently within its scope. */
        static Formula renameBound(TermFactory f, Formula fm) {
            return rename(f, fm, new HashMap<>(), new int[] {0});
        }

        private static Formula rename(TermFactory f, Formula fm, Map<Variable, Variable> scope, int[] counter) {
            if (fm instanceof Formula.Quantified q) {
                Variable fresh = f.variable("bound" + (++counter[0]));
                Map<Variable, Variable> inner = new HashMap<>(scope);
                inner.put(q.variable(), fresh);
                return new Formula.Quantified(q.universal(), fresh, rename(f, q.body(), inner, counter));
            }
            if (fm instanceof Formula.Atomic a) {
                Map<Variable, Term> m = new HashMap<>(scope);
                Substitution s = new Substitution(f, m);
                return new Formula.Atomic(s.apply(a.literal()));
            }
            if (fm instanceof Formula.Junction j) {
                java.util.List<Formula> parts = new java.util.ArrayList<>();
                for (Formula p : j.parts()) parts.add(rename(f, p, scope, counter));
                return j instanceof Formula.And ? new Formula.And(parts) : new Formula.Or(parts);
            }
            if (fm instanceof Formula.Not n) return new Formula.Not(rename(f, n.body(), scope, counter));
            if (fm instanceof Formula.Implies i) {
                return new Formula.Implies(rename(f, i.left(), scope, counter), rename(f, i.right(), scope, counter));
            }
            if (fm instanceof Formula.Iff i) {
                return new Formula.Iff(rename(f, i.left(), scope, counter), rename(f, i.right(), scope, counter));
            }
            return fm;
        }
    }
}
