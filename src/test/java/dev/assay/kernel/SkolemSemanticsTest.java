package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.assay.kernel.SkolemTestSupport.Candidate;
import dev.assay.kernel.SkolemTestSupport.Expect;
import dev.assay.kernel.SkolemTestSupport.SkolemWriter;
import dev.assay.kernel.SkolemTestSupport.Structure;
import dev.assay.kernel.SkolemTestSupport.Tally;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Brute-force semantics of {@code skolemize}, {@code define} and {@code abbreviate}: random small closed formulas
 * over P/1, R/2, c/0 and equality; candidate steps written by test code (correct ones, and ones wrong in one chosen
 * way); each run through a kernel of its own. For every accepted step the test checks, over every structure with 1,
 * 2 or 3 elements (one per isomorphism class) in which the premise is true, that the fresh symbols can be interpreted
 * so that the conclusion is true too: the soundness condition of a step that introduces symbols (a conservative
 * extension). For {@code abbreviate} the definition must hold alongside, which fixes the defined predicate.
 *
 * <p>The whole run happens once; the tests below each assert one property of it and print the counts.
 */
class SkolemSemanticsTest {

    static final int FORMULAS = 150;
    static final long SEED = 20240611L;
    static final int MAX_DOMAIN = 3;

    static final List<String> SPLICING = List.of(
            "(exists x. P(x) and R(x, c)) and (exists y. R(y, y) and not P(y))",
            "forall x. (exists y. R(x, y) and P(y)) and (exists z. R(z, x) and not P(z))",
            "forall x. (exists y. R(x, y) or P(y)) or (exists z. R(z, x) or not P(z)) or P(x)",
            "P(c) and (exists y. P(y) and (exists z. R(y, z) and P(z)) and (exists w. R(w, y) and not P(w)))",
            "forall x. exists y. R(x, y) and (exists z. R(y, z) and P(z)) and (exists w. R(w, x) and P(w))",
            "forall x. (exists y. exists z. R(x, y) and R(y, z)) and (exists w. P(w) and R(x, w))");

    static final Tally tally = new Tally();
    static final List<String> unsound = Collections.synchronizedList(new ArrayList<>());
    static final List<String> wrongRejections = Collections.synchronizedList(new ArrayList<>());
    static final List<String> wrongAcceptances = Collections.synchronizedList(new ArrayList<>());
    static final List<String> exceptions = Collections.synchronizedList(new ArrayList<>());
    static final AtomicLong modelsChecked = new AtomicLong();
    static final AtomicLong premiseModels = new AtomicLong();
    static long millis;

    /** One random premise with its candidate steps, drawn in a fixed order so that the run is reproducible. */
    private record Case(Formula premise, List<Candidate> skolem, List<Object[]> define) {
    }

    @BeforeAll
    static void run() {
        long start = System.nanoTime();
        TermFactory tf = new TermFactory();
        SkolemTestSupport.RandomFormula gen = new SkolemTestSupport.RandomFormula(tf, SEED);
        Random rnd = new Random(SEED + 1);
        List<Case> cases = new ArrayList<>();
        List<Formula> premises = new ArrayList<>();
        for (int i = 0; i < FORMULAS; i++) premises.add(gen.next());
        // Hand-written premises where existentials over junctions meet in one junction, so that partial
        // Skolemizations splice some and keep others; each three times, with other random choices.
        KernelFixture fx = new KernelFixture(tf);
        for (Symbol s : gen.signature()) {
            if (s.kind() == Symbol.Kind.PREDICATE) fx.predicate(s.name(), s.arity());
            else fx.function(s.name(), s.arity());
        }
        for (String text : SPLICING) for (int i = 0; i < 3; i++) premises.add(fx.formula(text));
        for (Formula premise : premises) {
            cases.add(new Case(premise, skolemCandidates(tf, Formulas.nnf(premise), rnd, gen.c),
                    defineCandidates(tf, premise, rnd, gen)));
        }
        // The checks are independent of one another: run them on every core.
        cases.parallelStream().forEach(c -> {
            Formula premise = c.premise();
            Problem problem = new Problem.Builder("semantics").declare(gen.p).declare(gen.r).declare(gen.c)
                    .axiom("ax", premise).build();
            Set<Symbol> used = new LinkedHashSet<>(Formulas.symbols(premise));
            used.remove(Symbol.EQUALITY);
            List<Structure> models = SkolemTestSupport.models(List.of(premise), used, MAX_DOMAIN);
            premiseModels.addAndGet(models.size());
            tally.add("formulas");
            for (Candidate k : c.skolem()) checkSkolemize(problem, tf, premise, k, models);
            for (Object[] d : c.define()) checkDefine(problem, tf, premise, (Candidate) d[0], models, (Formula) d[1], (List<?>) d[2]);
        });
        Collections.sort(unsound);
        Collections.sort(wrongRejections);
        Collections.sort(wrongAcceptances);
        Collections.sort(exceptions);
        millis = (System.nanoTime() - start) / 1_000_000;
        System.out.println("SkolemSemanticsTest: " + FORMULAS + " random and " + 3 * SPLICING.size()
                + " hand-written premises, " + premiseModels
                + " premise models (up to isomorphism, domains 1.." + MAX_DOMAIN + "), " + modelsChecked
                + " (step, model) pairs checked, " + millis + " ms\n" + tally);
    }

    // ------------------------------------------------------------------ the properties

    @Test
    void everyAcceptedStepIsSound() {
        assertTrue(unsound.isEmpty(), () -> unsound.size() + " accepted steps are unsound:\n" + String.join("\n", unsound));
        assertTrue(exceptions.isEmpty(), () -> "the kernel threw:\n" + String.join("\n", exceptions));
        assertTrue(modelsChecked.get() > 10_000, "too few models checked: " + modelsChecked);
    }

    @Test
    void corruptedCandidatesAreRejected() {
        assertTrue(tally.get("skolemize rejected corrupted") > 50, tally::toString);
        assertTrue(tally.get("define rejected corrupted") > 20, tally::toString);
        assertTrue(tally.get("abbreviate rejected corrupted") > 0, tally::toString);
        // Some of the rejected ones are unsound indeed, so the oracle can tell (the test is not vacuous).
        assertTrue(tally.get("skolemize rejected corrupted, oracle: unsound") > 20, tally::toString);
        assertTrue(wrongAcceptances.isEmpty(), () -> wrongAcceptances.size()
                + " steps the specification rejects were accepted:\n" + String.join("\n", wrongAcceptances));
    }

    @Test
    void correctCandidatesAreAccepted() {
        assertTrue(tally.get("skolemize accepted") > 300, tally::toString);
        assertTrue(tally.get("define accepted") > 100, tally::toString);
        assertTrue(tally.get("abbreviate accepted") > 100, tally::toString);
        assertTrue(wrongRejections.isEmpty(), () -> wrongRejections.size()
                + " steps the specification accepts were rejected:\n" + String.join("\n", wrongRejections));
    }

    @Test
    void theOracleSeesAnUnsoundSkolemization() {
        // forall x. exists y. R(x, y) does not give forall x. R(x, c0): in {0, 1} with R = {(0, 0), (1, 1)} no c0 works.
        TermFactory tf = new TermFactory();
        Symbol r = new Symbol("R", Symbol.Kind.PREDICATE, 2);
        Symbol c0 = new Symbol("c0", Symbol.Kind.FUNCTION, 0);
        Symbol s = new Symbol("s", Symbol.Kind.FUNCTION, 1);
        Variable x = tf.variable("x");
        Variable y = tf.variable("y");
        Formula premise = new Formula.Quantified(true, x, new Formula.Quantified(false, y,
                new Formula.Atomic(new Literal(true, tf.application(r, x, y)))));
        Formula wrong = new Formula.Quantified(true, x, new Formula.Atomic(new Literal(true, tf.application(r, x, tf.application(c0)))));
        Formula right = new Formula.Quantified(true, x, new Formula.Atomic(new Literal(true, tf.application(r, x, tf.application(s, x)))));
        List<Structure> models = SkolemTestSupport.models(List.of(premise), List.of(r), 3);
        boolean allRight = true;
        boolean allWrong = true;
        for (Structure m : models) {
            allRight &= SkolemTestSupport.extends_(m, List.of(s), List.of(right));
            allWrong &= SkolemTestSupport.extends_(m, List.of(c0), List.of(wrong));
        }
        assertTrue(allRight);
        assertFalse(allWrong);
    }

    // ------------------------------------------------------------------ skolemize

    static List<Candidate> skolemCandidates(TermFactory tf, Formula n, Random rnd, Symbol constant) {
        List<Candidate> out = new ArrayList<>();
        SkolemWriter w = new SkolemWriter(tf, n);
        Formula minimal = w.write();
        List<Symbol> fresh = new ArrayList<>(w.fresh);
        List<SkolemWriter.Existential> info = new ArrayList<>(w.existentials);
        out.add(new Candidate("renamed, minimal arguments", Expect.ACCEPT, fresh, minimal));

        w.full = true;
        out.add(emit("renamed, every enclosing universal", Expect.ACCEPT, w));
        w.full = false;
        w.reverse = true;
        out.add(emit("arguments reversed", Expect.ACCEPT, w));
        w.reverse = false;

        // Partial: keep a random subset (an existential that depends on a kept one is kept too).
        long mask = rnd.nextLong();
        w.keep = i -> ((mask >>> (i % 64)) & 1) == 1;
        Candidate partial = emit("partial", Expect.ACCEPT, w);
        if (w.mixedSplice()) partial = new Candidate("partial, mixed splice", Expect.ACCEPT, partial.fresh(), partial.stated());
        out.add(partial);
        w.keep = i -> true;
        out.add(emit("everything kept", Expect.ACCEPT, w));
        w.keep = i -> false;

        // Without renaming bound variables apart: right unless an argument is captured.
        w.renamed = false;
        Formula naive = w.write();
        out.add(new Candidate(w.captured ? "naive, captured" : "naive, no capture", w.captured ? Expect.REJECT : Expect.ACCEPT,
                new ArrayList<>(w.fresh), naive));
        w.renamed = true;

        List<SkolemWriter.Existential> occurring = new ArrayList<>();
        for (SkolemWriter.Existential e : info) if (e.replaced() && e.occurs()) occurring.add(e);
        Collections.shuffle(occurring, rnd);

        for (SkolemWriter.Existential e : occurring) {
            if (e.needed() == 0) continue;
            w.dropNeededOf = e.index();
            out.add(emit("corrupt: needed argument dropped", Expect.REJECT, w));
            w.dropNeededOf = -1;
            break;
        }
        outer:
        for (SkolemWriter.Existential a : occurring) {
            for (SkolemWriter.Existential b : occurring) {
                if (a.index() < b.index() && a.args() == b.args()) {
                    w.reuse = java.util.Map.of(b.index(), a.index());
                    out.add(emit("corrupt: one symbol for two existentials", Expect.REJECT, w));
                    w.reuse = java.util.Map.of();
                    break outer;
                }
            }
        }
        for (SkolemWriter.Existential e : occurring) {
            if (e.args() != 0) continue;
            w.nonFreshOf = e.index();
            w.problemConstant = constant;
            out.add(emit("corrupt: problem constant as Skolem symbol", Expect.REJECT, w));
            w.nonFreshOf = -1;
            break;
        }
        int universals = 0;
        for (Formula g : SkolemTestSupport.subformulas(n)) if (g instanceof Formula.Quantified q && q.universal()) universals++;
        if (universals > 0) {
            w.universalToReplace = rnd.nextInt(universals);
            out.add(emit("corrupt: a universal replaced", Expect.REJECT, w));
            w.universalToReplace = -1;
        }
        Formula flipped = SkolemTestSupport.flipLiteral(minimal, rnd.nextInt(SkolemTestSupport.literalCount(minimal)));
        out.add(new Candidate("corrupt: a literal negated", Expect.REJECT, fresh, flipped));
        for (SkolemWriter.Existential e : occurring) {
            if (!e.hasInnerUniversal()) continue;
            w.innerArgOf = e.index();
            out.add(emit("corrupt: argument bound inside the existential", Expect.REJECT, w));
            w.innerArgOf = -1;
            break;
        }
        for (SkolemWriter.Existential e : occurring) {
            if (!e.dependsOnExistential()) continue;
            int target = e.index();
            w.keep = i -> i != target;
            w.forceReplace = target;
            w.forcedTakesKept = rnd.nextBoolean();
            // Either: the kernel may find another reading, e.g. in a symmetric body keep y and replace the outer one.
            out.add(emit("corrupt: depends on a kept existential" + (w.forcedTakesKept ? ", takes it" : ""),
                    Expect.EITHER, w));
            w.keep = i -> false;
            w.forceReplace = -1;
            w.forcedTakesKept = false;
            break;
        }
        for (SkolemWriter.Existential e : occurring) {
            if (!e.hasInnerUniversal() || e.args() == 0) continue;
            // An inner universal renamed to the name of a Skolem argument: captures it where the existential's
            // variable occurs below that universal (and the argument's own occurrences there); else a mere renaming.
            w.captureOf = e.index();
            Formula stated = w.write();
            out.add(new Candidate(w.captured ? "corrupt: inner binder renamed, captures" : "inner binder renamed, no capture",
                    w.captured ? Expect.REJECT : Expect.ACCEPT, new ArrayList<>(w.fresh), stated));
            w.captureOf = -1;
            break;
        }
        if (!occurring.isEmpty()) {
            w.strayOf = occurring.get(0).index();
            out.add(emit("corrupt: unbound variable as argument", Expect.REJECT, w));
            w.strayOf = -1;
        }
        List<Symbol> extra = new ArrayList<>(fresh);
        extra.add(new Symbol("skx", Symbol.Kind.FUNCTION, 0));
        out.add(new Candidate("corrupt: a listed symbol unused", Expect.REJECT, extra, minimal));
        if (!fresh.isEmpty()) {
            out.add(new Candidate("corrupt: a used symbol not listed", Expect.REJECT, fresh.subList(1, fresh.size()), minimal));
        }
        return out;
    }

    /** Runs the writer with its current options; the fresh symbols are those the conclusion uses. */
    private static Candidate emit(String kind, Expect expect, SkolemWriter w) {
        Formula stated = w.write();
        return new Candidate(kind, expect, new ArrayList<>(w.fresh), stated);
    }

    private static void checkSkolemize(Problem problem, TermFactory tf, Formula premise, Candidate c, List<Structure> models) {
        Kernel kernel = new Kernel(problem, tf);
        Outcome o;
        try {
            o = kernel.skolemize("s", kernel.axiom("ax"), c.fresh(), c.stated());
        } catch (RuntimeException e) {
            exceptions.add("skolemize " + c + ": " + e);
            return;
        }
        judge("skolemize", premise, c, o, models, List.of(c.stated()), c.fresh());
    }

    // ------------------------------------------------------------------ define and abbreviate

    /** Each entry: the define candidate, and for the correct one the subformula defined and its parameters. */
    static List<Object[]> defineCandidates(TermFactory tf, Formula premise, Random rnd, SkolemTestSupport.RandomFormula gen) {
        List<Object[]> out = new ArrayList<>();
        List<Formula> nodes = SkolemTestSupport.subformulas(premise);
        List<Formula> quantified = new ArrayList<>();
        for (Formula g : nodes) if (g instanceof Formula.Quantified && g != premise) quantified.add(g);
        // Half the time a quantified subformula below the top, where bound names can clash.
        Formula psi = !quantified.isEmpty() && rnd.nextBoolean() ? quantified.get(rnd.nextInt(quantified.size()))
                : nodes.get(rnd.nextInt(nodes.size()));
        List<Variable> fv = new ArrayList<>(Formulas.freeVariables(psi));
        Collections.shuffle(fv, rnd);
        int k = fv.size();
        Symbol q = new Symbol("Dq", Symbol.Kind.PREDICATE, k);
        Symbol q1 = new Symbol("Dq", Symbol.Kind.PREDICATE, k + 1);
        Variable u1 = tf.variable("u1");
        List<Variable> withExtra = new ArrayList<>(fv);
        withExtra.add(u1);
        out.add(new Object[] {new Candidate("define", Expect.ACCEPT, List.of(q),
                SkolemTestSupport.definition(tf, q, fv, fv, psi, false)), psi, fv});
        out.add(new Object[] {new Candidate("define, unused parameter", Expect.ACCEPT, List.of(q1),
                SkolemTestSupport.definition(tf, q1, withExtra, withExtra, psi, false)), null, null});
        if (k >= 1) {
            List<Variable> fewer = fv.subList(1, k);
            Symbol qm = new Symbol("Dq", Symbol.Kind.PREDICATE, k - 1);
            out.add(new Object[] {new Candidate("corrupt define: free variable not a parameter", Expect.REJECT, List.of(qm),
                    SkolemTestSupport.definition(tf, qm, fewer, fewer, psi, false)), null, null});
            List<Variable> repeated = new ArrayList<>(fv);
            repeated.add(fv.get(0));
            out.add(new Object[] {new Candidate("corrupt define: repeated parameter", Expect.REJECT, List.of(q1),
                    SkolemTestSupport.definition(tf, q1, repeated, repeated, psi, false)), null, null});
        }
        Formula self = new Formula.And(List.of(psi, new Formula.Not(new Formula.Atomic(new Literal(true, tf.application(q, fv))))));
        out.add(new Object[] {new Candidate("corrupt define: defined symbol in its body", Expect.REJECT, List.of(q),
                SkolemTestSupport.definition(tf, q, fv, fv, self, false)), null, null});
        Symbol taken = k == 1 ? gen.p : k == 2 ? gen.r : null;
        if (taken != null) {
            out.add(new Object[] {new Candidate("corrupt define: symbol of the problem", Expect.REJECT, List.of(taken),
                    SkolemTestSupport.definition(tf, taken, fv, fv, psi, false)), null, null});
        }
        if (k >= 2) {
            List<Variable> reversed = new ArrayList<>(fv);
            Collections.reverse(reversed);
            out.add(new Object[] {new Candidate("corrupt define: arguments not in quantifier order", Expect.REJECT, List.of(q),
                    SkolemTestSupport.definition(tf, q, fv, reversed, psi, false)), null, null});
        }
        out.add(new Object[] {new Candidate("corrupt define: iff reversed", Expect.REJECT, List.of(q),
                SkolemTestSupport.definition(tf, q, fv, fv, psi, true)), null, null});
        out.add(new Object[] {new Candidate("corrupt define: extra quantified variable", Expect.REJECT, List.of(q),
                SkolemTestSupport.definition(tf, q, withExtra, fv, psi, false)), null, null});
        return out;
    }

    @SuppressWarnings("unchecked")
    private static void checkDefine(Problem problem, TermFactory tf, Formula premise, Candidate c, List<Structure> models,
                                    Formula psi, List<?> params) {
        Kernel kernel = new Kernel(problem, tf);
        Outcome o;
        try {
            o = kernel.define("d", c.fresh().get(0), c.stated());
        } catch (RuntimeException e) {
            exceptions.add("define " + c + ": " + e);
            return;
        }
        judge("define", premise, c, o, models, List.of(c.stated()), c.fresh());
        if (psi == null || !o.accepted()) return;
        for (Abbreviation a : abbreviateCandidates(tf, premise, c.fresh().get(0), c.stated(), psi, (List<Variable>) params)) {
            Kernel k2 = new Kernel(problem, tf);
            try {
                Outcome d = k2.define("d", a.defined(), a.definition());
                if (!d.accepted()) {
                    exceptions.add("the definition of an abbreviation was rejected: " + ((Outcome.Rejected) d).reason()
                            + " for " + a.step());
                    continue;
                }
                Outcome ab = k2.abbreviate("ab", k2.axiom("ax"), ((Outcome.Accepted) d).fact(), a.step().stated());
                judge("abbreviate", premise, a.step(), ab, models, List.of(a.definition(), a.step().stated()),
                        List.of(a.defined()));
            } catch (RuntimeException e) {
                exceptions.add("abbreviate " + a.step() + ": " + e);
            }
        }
    }

    /** An abbreviate candidate with the definition it uses. */
    record Abbreviation(Candidate step, Symbol defined, Formula definition) {
    }

    static List<Abbreviation> abbreviateCandidates(TermFactory tf, Formula premise, Symbol q, Formula definition, Formula psi,
                                                  List<Variable> fv) {
        List<Abbreviation> out = new ArrayList<>();
        Formula atom = new Formula.Atomic(new Literal(true, tf.application(q, fv)));
        out.add(new Abbreviation(new Candidate("abbreviate", Expect.ACCEPT, List.of(q),
                SkolemTestSupport.replaceNode(premise, psi, atom)), q, definition));
        if (fv.size() >= 2) {
            List<Variable> reversed = new ArrayList<>(fv);
            Collections.reverse(reversed);
            Formula swapped = new Formula.Atomic(new Literal(true, tf.application(q, reversed)));
            out.add(new Abbreviation(new Candidate("corrupt abbreviate: arguments swapped", Expect.EITHER, List.of(q),
                    SkolemTestSupport.replaceNode(premise, psi, swapped)), q, definition));
        }
        out.add(new Abbreviation(new Candidate("corrupt abbreviate: negated", Expect.EITHER, List.of(q),
                SkolemTestSupport.replaceNode(premise, psi, new Formula.Not(atom))), q, definition));
        // The defined body binds v, and the abbreviation passes an outer v as an argument where the body had its own:
        // a naive substitution would give the premise back (capture), the real unfolding does not.
        if (psi instanceof Formula.Quantified pq) {
            List<String> above = SkolemTestSupport.bindersAbove(premise, psi);
            Variable u2 = tf.variable("u2");
            Formula body = SkolemTestSupport.replaceFirstBoundOccurrence(tf, pq, u2);
            if (above != null && above.contains(pq.variable().name()) && body != null) {
                List<Variable> params = new ArrayList<>();
                params.add(u2);
                params.addAll(fv);
                List<Variable> args = new ArrayList<>();
                args.add(pq.variable());
                args.addAll(fv);
                Symbol q2 = new Symbol("Dc", Symbol.Kind.PREDICATE, params.size());
                Formula def = SkolemTestSupport.definition(tf, q2, params, params,
                        new Formula.Quantified(pq.universal(), pq.variable(), body), false);
                Formula stated = SkolemTestSupport.replaceNode(premise, psi,
                        new Formula.Atomic(new Literal(true, tf.application(q2, args))));
                out.add(new Abbreviation(new Candidate("corrupt abbreviate: capture", Expect.REJECT, List.of(q2), stated),
                        q2, def));
            }
        }
        return out;
    }

    // ------------------------------------------------------------------ judging one step

    private static void judge(String rule, Formula premise, Candidate c, Outcome o, List<Structure> models,
                              List<Formula> conclusions, List<Symbol> listed) {
        // The oracle interprets every symbol of the conclusion that the premise does not mention, listed or not.
        Set<Symbol> fresh = new LinkedHashSet<>(listed);
        for (Formula g : conclusions) fresh.addAll(Formulas.symbols(g));
        fresh.remove(Symbol.EQUALITY);
        boolean corrupt = c.kind().startsWith("corrupt");
        tally.add("by kind: " + rule + " | " + c.kind() + " | " + (o.accepted() ? "accepted" : "rejected"));
        if (o.accepted()) {
            tally.add(rule + " accepted");
            if (corrupt) tally.add(rule + " accepted corrupted");
            if (c.expect() == Expect.REJECT) {
                wrongAcceptances.add(rule + ": " + c + "\n    premise " + Printer.formula(premise));
            }
            SkolemTestSupport.Extension question = new SkolemTestSupport.Extension(fresh, conclusions);
            for (Structure m : models) {
                modelsChecked.incrementAndGet();
                if (!question.holdsIn(m)) {
                    unsound.add(rule + ": " + c + "\n    premise " + Printer.formula(premise) + "\n    model " + m);
                    return;
                }
            }
            return;
        }
        String reason = ((Outcome.Rejected) o).reason();
        tally.add(rule + " rejected");
        if (!corrupt) tally.add(rule + " rejected correct");
        if (c.expect() == Expect.ACCEPT) {
            wrongRejections.add(rule + ": " + c + "\n    premise " + Printer.formula(premise) + "\n    reason " + reason);
            return;
        }
        if (!corrupt) return;
        tally.add(rule + " rejected corrupted");
        if (!rule.equals("skolemize")) return;
        // Was the rejected step unsound indeed? Asked of the models with one or two elements only, to save time:
        // this only counts, so that the test shows the oracle can tell.
        SkolemTestSupport.Extension question = new SkolemTestSupport.Extension(fresh, conclusions);
        for (Structure m : models) {
            if (m.n > 2) break;
            modelsChecked.incrementAndGet();
            if (!question.holdsIn(m)) {
                tally.add(rule + " rejected corrupted, oracle: unsound");
                return;
            }
        }
        tally.add(rule + " rejected corrupted, oracle: sound on the models up to 2 elements");
    }
}
