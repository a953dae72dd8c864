package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.statistics.Statistics;
import org.sat4j.core.VecInt;
import org.sat4j.minisat.SolverFactory;
import org.sat4j.specs.ContradictionException;
import org.sat4j.specs.ISolver;
import org.sat4j.specs.TimeoutException;

/**
 * Soundness on ground problems, checked against a SAT solver: random ground axioms, clausified and then combined by
 * random resolution, factoring and instantiation attempts with conclusions that are sometimes right and sometimes
 * corrupted. Every clause the kernel accepts must follow from the axioms (axioms and the negated clause are
 * unsatisfiable), and whenever it accepts the empty clause the axioms must be unsatisfiable.
 *
 * <p>The atoms P(a), P(b), Q(a), R and the equation a = b are independent propositional variables for the solver (an
 * equation in either orientation is the same variable). That is sound for this purpose: propositional entailment
 * implies first-order entailment with equality, and the rules tested here do no equality reasoning.
 */
class GroundSoundnessPropertyTest {

    /** One check: the problem, the kernel, the pool of accepted clause facts, and the solver's view of the atoms. */
    private static final class Run {
        final KernelFixture k = new KernelFixture();
        final Random random;
        final List<Literal> atoms = new ArrayList<>();
        final Map<Literal, Integer> atomIds = new HashMap<>();
        final List<List<Literal>> axiomClauses = new ArrayList<>();
        final List<Formula> axiomFormulas = new ArrayList<>();
        Kernel kernel;
        final List<Fact> pool = new ArrayList<>();
        int emptyDerived;
        int validResolutions;
        int acceptedResolutions;

        Run(long seed) {
            random = new Random(seed);
            for (String a : new String[] {"P(a)", "P(b)", "Q(a)", "R", "a = b"}) {
                Literal l = k.literal(a);
                atoms.add(l);
                atomIds.put(l, atoms.size());
            }
        }

        int id(Literal l) {
            Integer v = atomIds.get(l.positive() ? l : l.negated());
            if (v == null) throw new IllegalStateException("unknown atom " + l);
            return l.positive() ? v : -v;
        }

        Literal randomLiteral() {
            Literal l = atoms.get(random.nextInt(atoms.size()));
            if (l.isEquation() && random.nextBoolean()) l = new Literal(true, k.f.equation(l.right(), l.left()));
            return random.nextInt(2) == 0 ? l : l.negated();
        }

        List<Literal> randomClause(int maxWidth) {
            int n = 1 + random.nextInt(maxWidth);
            List<Literal> out = new ArrayList<>();
            for (int i = 0; i < n; i++) out.add(randomLiteral());
            return out;
        }

        static Formula disjunction(List<Literal> lits) {
            if (lits.size() == 1) return new Formula.Atomic(lits.get(0));
            List<Formula> parts = new ArrayList<>();
            for (Literal l : lits) parts.add(new Formula.Atomic(l));
            return new Formula.Or(parts);
        }

        void build(List<Formula> extraAxioms) {
            Problem.Builder b = k.problem("ground");
            for (int i = 0; i < axiomClauses.size(); i++) b.axiom("ax" + i, disjunction(axiomClauses.get(i)));
            for (int i = 0; i < extraAxioms.size(); i++) b.axiom("fm" + i, extraAxioms.get(i));
            axiomFormulas.addAll(extraAxioms);
            kernel = new Kernel(b.build(), k.f);
        }

        /** The axioms as CNF for the solver: each disjunction as it is, each other formula by its truth table. */
        List<int[]> axiomCnf() {
            List<int[]> cnf = new ArrayList<>();
            for (List<Literal> c : axiomClauses) cnf.add(ids(c));
            for (Formula fm : axiomFormulas) cnf.addAll(truthTableCnf(fm));
            return cnf;
        }

        int[] ids(List<Literal> c) {
            int[] out = new int[c.size()];
            for (int i = 0; i < out.length; i++) out[i] = id(c.get(i));
            return out;
        }

        /** One clause per falsifying assignment of the five atoms. */
        List<int[]> truthTableCnf(Formula fm) {
            List<int[]> out = new ArrayList<>();
            int n = atoms.size();
            for (int bits = 0; bits < 1 << n; bits++) {
                Map<Literal, Boolean> v = new HashMap<>();
                for (int i = 0; i < n; i++) v.put(atoms.get(i), (bits >> i & 1) == 1);
                if (!evaluate(fm, v)) {
                    int[] block = new int[n];
                    for (int i = 0; i < n; i++) block[i] = (bits >> i & 1) == 1 ? -(i + 1) : i + 1;
                    out.add(block);
                }
            }
            return out;
        }

        boolean evaluate(Formula fm, Map<Literal, Boolean> v) {
            if (fm instanceof Formula.Atomic a) {
                Literal l = a.literal();
                return v.get(l.positive() ? l : l.negated()) == l.positive();
            }
            if (fm instanceof Formula.Constant c) return c.value();
            if (fm instanceof Formula.Not n) return !evaluate(n.body(), v);
            if (fm instanceof Formula.And and) {
                for (Formula p : and.parts()) if (!evaluate(p, v)) return false;
                return true;
            }
            if (fm instanceof Formula.Or or) {
                for (Formula p : or.parts()) if (evaluate(p, v)) return true;
                return false;
            }
            if (fm instanceof Formula.Implies i) return !evaluate(i.left(), v) || evaluate(i.right(), v);
            if (fm instanceof Formula.Iff i) return evaluate(i.left(), v) == evaluate(i.right(), v);
            throw new IllegalArgumentException(fm.toString());
        }

        boolean satisfiable(List<int[]> cnf) {
            ISolver solver = SolverFactory.newDefault();
            solver.newVar(atoms.size());
            try {
                for (int[] c : cnf) solver.addClause(new VecInt(c));
                return solver.isSatisfiable();
            } catch (ContradictionException e) {
                return false;
            } catch (TimeoutException e) {
                throw new IllegalStateException(e);
            }
        }

        boolean axiomsUnsatisfiable() {
            return !satisfiable(axiomCnf());
        }

        /** Axioms ∧ ¬C is unsatisfiable. */
        boolean entails(Clause c) {
            return entails(axiomCnf(), c);
        }

        boolean entails(List<int[]> premises, Clause c) {
            List<int[]> cnf = new ArrayList<>(premises);
            for (Literal l : c.literals()) cnf.add(new int[] {-id(l)});
            return !satisfiable(cnf);
        }

        void checkAccepted(Outcome o, String what) {
            if (!(o instanceof Outcome.Accepted acc)) return;
            Clause c = acc.fact().clause();
            if (!entails(c)) fail(what + ": accepted " + Printer.clause(c) + ", which the axioms do not entail");
            if (c.isEmpty()) {
                assertTrue(axiomsUnsatisfiable(), what + ": accepted the empty clause from satisfiable axioms");
                emptyDerived++;
            }
            pool.add(acc.fact());
        }
    }

    /** The resolvent as FORMAT.md defines it on ground clauses: (A − A.i) ∪ (B − B.j). */
    private static List<Literal> resolvent(Clause a, Literal li, Clause b, Literal lj) {
        List<Literal> out = new ArrayList<>();
        for (Literal l : a.literals()) if (!l.equals(li)) out.add(l);
        for (Literal l : b.literals()) if (!l.equals(lj)) out.add(l);
        return out;
    }

    /** Right or wrong, with about even odds: reordered and repeated, or with a literal dropped, added or flipped. */
    private static List<Literal> perhapsCorrupt(Run run, List<Literal> right, boolean[] corrupted) {
        List<Literal> out = new ArrayList<>(right);
        int mode = run.random.nextInt(8);
        corrupted[0] = mode >= 4;
        switch (mode) {
            case 0:
                break;
            case 1:
                Collections.shuffle(out, run.random);
                break;
            case 2:
                if (!out.isEmpty()) out.add(out.get(run.random.nextInt(out.size())));
                break;
            case 3:
                // Equations turned round: the same clause.
                for (int i = 0; i < out.size(); i++) {
                    Literal l = out.get(i);
                    if (l.isEquation()) out.set(i, new Literal(l.positive(), run.k.f.equation(l.right(), l.left())));
                }
                break;
            case 4:
                if (!out.isEmpty()) out.remove(run.random.nextInt(out.size()));
                break;
            case 5:
                out.add(run.randomLiteral());
                break;
            case 6:
                if (!out.isEmpty()) {
                    int i = run.random.nextInt(out.size());
                    out.set(i, out.get(i).negated());
                }
                break;
            default:
                out = run.random.nextInt(3) == 0 ? new ArrayList<>() : run.randomClause(3);
                break;
        }
        return out;
    }

    private static Substitution emptyOrNull(Run run) {
        return run.random.nextBoolean() ? null : Substitution.empty(run.k.f);
    }

    @Property(tries = 200, seed = "4242")
    void acceptedClausesFollowFromTheAxioms(@ForAll long seed) {
        Run run = new Run(seed);
        int n = 3 + run.random.nextInt(6);
        for (int i = 0; i < n; i++) run.axiomClauses.add(run.randomClause(run.random.nextInt(4) == 0 ? 1 : 3));
        run.build(List.of());

        // Clausify each axiom into a clause, stated as written or as a corrupted clause.
        for (int i = 0; i < n; i++) {
            List<Literal> right = run.axiomClauses.get(i);
            Outcome exact = run.kernel.clausify("c" + i, run.kernel.axiom("ax" + i), null, new Clause(right));
            assertTrue(exact.accepted(), () -> "clausify of an axiom as written: " + exact);
            run.checkAccepted(exact, "clausify");
            boolean[] corrupted = new boolean[1];
            List<Literal> stated = perhapsCorrupt(run, right, corrupted);
            run.checkAccepted(run.kernel.clausify("d" + i, run.kernel.axiom("ax" + i), null, new Clause(stated)), "clausify");
        }

        for (int step = 0; step < 80; step++) {
            Fact a = run.pool.get(run.random.nextInt(run.pool.size()));
            Fact b = run.pool.get(run.random.nextInt(run.pool.size()));
            int kind = run.random.nextInt(10);
            if (kind < 8) {
                int i = 1 + run.random.nextInt(a.clause().width() + 1) - (run.random.nextInt(20) == 0 ? 1 : 0);
                int j = 1 + run.random.nextInt(b.clause().width() + 1) - (run.random.nextInt(20) == 0 ? 1 : 0);
                Literal li = a.clause().literal(i);
                Literal lj = b.clause().literal(j);
                boolean valid = li != null && lj != null && li.negated().equals(lj);
                List<Literal> right = valid ? resolvent(a.clause(), li, b.clause(), lj) : run.randomClause(3);
                boolean[] corrupted = new boolean[1];
                List<Literal> stated = perhapsCorrupt(run, right, corrupted);
                Clause statedClause = new Clause(stated);
                boolean withSubstitutions = run.random.nextBoolean();
                Outcome o = withSubstitutions
                        ? run.kernel.resolve("r" + step, a, i, emptyOrNull(run), b, j, Substitution.empty(run.k.f), statedClause)
                        : run.kernel.resolve("r" + step, a, i, null, b, j, null, statedClause);
                boolean sameAsRight = statedClause.sameSet(new Clause(right));
                if (valid && sameAsRight) {
                    assertTrue(o.accepted(), () -> "the correct resolvent " + Printer.clause(statedClause) + " of "
                            + a + " and " + b + " was rejected: " + o);
                }
                if (o.accepted()) {
                    assertTrue(valid, () -> "accepted resolve on " + a + "." + i + " and " + b + "." + j);
                    assertTrue(sameAsRight, () -> "accepted " + statedClause + " for the resolvent " + right);
                }
                if (valid) run.validResolutions++;
                if (o.accepted()) run.acceptedResolutions++;
                run.checkAccepted(o, "resolve");
            } else if (kind == 8) {
                int i = 1 + run.random.nextInt(a.clause().width() + 1);
                int j = 1 + run.random.nextInt(a.clause().width() + 1);
                boolean[] corrupted = new boolean[1];
                List<Literal> stated = perhapsCorrupt(run, a.clause().literals(), corrupted);
                Outcome o = run.kernel.factor("f" + step, a, i, j, run.random.nextBoolean() ? null : Substitution.empty(run.k.f),
                        new Clause(stated));
                if (o.accepted()) {
                    assertFalse(i == j, "factor accepted one literal twice");
                    assertTrue(a.clause().literal(i).equals(a.clause().literal(j)), "factor of different ground literals");
                }
                run.checkAccepted(o, "factor");
            } else {
                boolean[] corrupted = new boolean[1];
                List<Literal> stated = perhapsCorrupt(run, a.clause().literals(), corrupted);
                run.checkAccepted(run.kernel.instantiate("i" + step, a, Substitution.empty(run.k.f), new Clause(stated)),
                        "instantiate");
            }
        }
        Statistics.label("empty clause").collect(run.emptyDerived > 0 ? "derived" : "not derived");
        Statistics.label("resolution").collect(run.acceptedResolutions > 0 ? "some accepted" : "none accepted");
    }

    /** Random ground formulas with every connective, clausified into random clauses. */
    @Property(tries = 200, seed = "4343")
    void clausifiedClausesFollowFromTheirFormula(@ForAll long seed) {
        Run run = new Run(seed);
        List<Formula> formulas = new ArrayList<>();
        int n = 1 + run.random.nextInt(3);
        for (int i = 0; i < n; i++) formulas.add(randomGroundFormula(run, 4));
        run.build(formulas);
        int accepted = 0;
        for (int step = 0; step < 40; step++) {
            int i = run.random.nextInt(n);
            List<Literal> stated = run.random.nextInt(6) == 0 ? new ArrayList<>() : run.randomClause(5);
            Outcome o = run.kernel.clausify("c" + step, run.kernel.axiom("fm" + i), null, new Clause(stated));
            if (o.accepted()) {
                accepted++;
                // The clause follows from that one formula already.
                Clause c = ((Outcome.Accepted) o).fact().clause();
                assertTrue(run.entails(run.truthTableCnf(formulas.get(i)), c), () -> "clausify accepted " + Printer.clause(c) + " from "
                        + Printer.formula(formulas.get(i)));
            }
            run.checkAccepted(o, "clausify");
        }
        Statistics.label("clausify").collect(accepted > 0 ? "some accepted" : "none accepted");
    }

    private static Formula randomGroundFormula(Run run, int depth) {
        int choice = depth <= 0 ? 0 : run.random.nextInt(8);
        switch (choice) {
            case 0:
            case 1:
                return new Formula.Atomic(run.randomLiteral());
            case 2:
                return new Formula.Not(randomGroundFormula(run, depth - 1));
            case 3:
            case 4: {
                List<Formula> parts = new ArrayList<>();
                int m = 2 + run.random.nextInt(2);
                for (int i = 0; i < m; i++) parts.add(randomGroundFormula(run, depth - 1));
                return choice == 3 ? new Formula.And(parts) : new Formula.Or(parts);
            }
            case 5:
                return new Formula.Implies(randomGroundFormula(run, depth - 1), randomGroundFormula(run, depth - 1));
            case 6:
                return new Formula.Iff(randomGroundFormula(run, depth - 1), randomGroundFormula(run, depth - 1));
            default:
                return run.random.nextInt(3) == 0 ? Formula.Constant.of(run.random.nextBoolean())
                        : new Formula.Atomic(run.randomLiteral());
        }
    }
}
