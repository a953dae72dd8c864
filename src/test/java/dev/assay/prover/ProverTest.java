package dev.assay.prover;

import dev.assay.check.CheckResult;
import dev.assay.check.Checker;
import dev.assay.check.Verdict;
import dev.assay.cli.Main;
import dev.assay.kernel.Application;
import dev.assay.kernel.Formula;
import dev.assay.kernel.Literal;
import dev.assay.kernel.Symbol;
import dev.assay.kernel.Term;
import dev.assay.kernel.TermFactory;
import dev.assay.kernel.Variable;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The reference prover: its certificates pass the kernel, its helpers behave, and its exit statuses mean what they say. */
class ProverTest {

    @TempDir
    Path dir;

    private Path write(String name, String text) throws IOException {
        Path p = dir.resolve(name + ".problem");
        Files.writeString(p, text, StandardCharsets.UTF_8);
        return p;
    }

    private static Prover.Outcome prove(Path problem, Path out, double seconds) {
        return new Prover(Prover.Options.defaults(Duration.ofMillis((long) (seconds * 1000)))).prove(problem, out);
    }

    record Run(int status, String out, String err) {
    }

    private static Run cli(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Run(status, out.toString(), err.toString());
    }

    // ---------------------------------------------------------------- proofs the kernel accepts

    private void provesAndTheKernelAgrees(String name, String text, Verdict verdict, String mustUse) throws IOException {
        Path problem = write(name, text);
        Path out = dir.resolve(name + ".proof");
        Prover.Outcome o = prove(problem, out, 20);
        assertEquals(Prover.Status.PROVED, o.status(), name + ": " + o.message());
        CheckResult r = new Checker().check(problem, out);
        assertNull(r.failure(), () -> r.failure().render());
        assertEquals(verdict, r.verdict(), name);
        String certificate = Files.readString(out, StandardCharsets.UTF_8);
        assertTrue(certificate.startsWith("certificate for " + name + "\n# expected verdict: " + verdict.word()),
                certificate);
        if (mustUse != null) assertTrue(certificate.contains(mustUse), name + " should use " + mustUse + ":\n" + certificate);
    }

    @Test
    void skolemizesAnExistentialUnderAUniversal() throws IOException {
        provesAndTheKernelAgrees("badge", """
                problem badge
                axiom issued: forall p. Staff(p) implies exists b. Holds(p, b)
                axiom ann_staff: Staff(ann)
                goal ann_badge: exists b. Holds(ann, b)
                """, Verdict.THEOREM, "skolemize issued fresh sk1");
    }

    @Test
    void skolemTermsTakeOnlyTheEnclosingUniversalsThatOccur() throws IOException {
        provesAndTheKernelAgrees("alternation", """
                problem alternation
                axiom a: forall x. exists y. forall z. exists w. R(x, y) and S(z, w) and T(y, w)
                goal g: forall x. exists y. R(x, y) and (exists w. T(y, w))
                """, Verdict.THEOREM, "sk2(x, z)");
    }

    @Test
    void renamesReusedBoundVariablesAndVariablesNamedLikeSymbols() throws IOException {
        // The second axiom binds a, which elsewhere is a constant; the first binds x twice.
        provesAndTheKernelAgrees("names", """
                problem names
                axiom either: (forall x. P(x)) or (forall x. Q(x))
                axiom q_to_p: forall a. Q(a) implies P(a)
                goal g: P(a)
                """, Verdict.THEOREM, "[x, x1]");
    }

    @Test
    void reasonsWithAnEquationThatCannotBeOriented() throws IOException {
        provesAndTheKernelAgrees("commutative", """
                problem commutative
                axiom commutativity: forall x y. f(x, y) = f(y, x)
                axiom value: f(a, b) = c
                goal g: f(b, a) = c
                """, Verdict.THEOREM, "paramodulate");
    }

    @Test
    void namesSubformulasInsteadOfDistributingThem() throws IOException {
        // Distributing the axiom would give 2^5 = 32 clauses.
        provesAndTheKernelAgrees("distribution", """
                problem distribution
                axiom some_pair: (p1 and q1) or (p2 and q2) or (p3 and q3) or (p4 and q4) or (p5 and q5)
                goal g: p1 or q2 or q3 or p4 or q5
                """, Verdict.THEOREM, "define fresh Def1");
    }

    @Test
    void refutesContradictoryAxiomsWithoutAGoal() throws IOException {
        provesAndTheKernelAgrees("clash", """
                problem clash
                axiom a1: forall x. P(x) or Q(x)
                axiom a2: forall x. not P(x)
                axiom a3: not Q(c)
                """, Verdict.UNSATISFIABLE, null);
    }

    @Test
    void findsEqualityFactoringProofs() throws IOException {
        // Two elements at most, so a, b, c cannot be three distinct ones.
        provesAndTheKernelAgrees("two_elements", """
                problem two_elements
                axiom at_most_two: forall x y z. x = y or x = z or y = z
                axiom ab: a != b
                axiom ac: a != c
                goal g: b = c
                """, Verdict.THEOREM, null);
    }

    // ---------------------------------------------------------------- exit statuses through the command line

    @Test
    void satisfiableProblemWithAFiniteSearchSpaceSaturates() throws IOException {
        // R(x, f(x)) and not R(y, y) do not unify (occurs check): nothing follows, and the search ends.
        Path problem = write("loop_free", """
                problem loop_free
                axiom successor: forall x. R(x, f(x))
                goal g: exists y. R(y, y)
                """);
        Path out = dir.resolve("loop_free.proof");
        Run r = cli("prove", problem.toString(), "-o", out.toString(), "--timeout", "20");
        assertEquals(5, r.status(), r.out() + r.err());
        assertTrue(r.out().contains("saturated"), r.out());
        assertTrue(r.out().contains("the goal does not follow in that calculus"), r.out());
        assertFalse(Files.exists(out));
    }

    @Test
    void timeLimitGivesUpWithExitFour() throws IOException {
        // P(a), P(f(a)), P(f(f(a))), ...: the search never ends.
        Path problem = write("endless", """
                problem endless
                axiom start: P(a)
                axiom successor: forall x. P(x) implies P(f(x))
                goal g: Q(a)
                """);
        Path out = dir.resolve("endless.proof");
        long start = System.nanoTime();
        Run r = cli("prove", problem.toString(), "-o", out.toString(), "--timeout", "0.5");
        assertEquals(4, r.status(), r.out() + r.err());
        assertTrue(r.out().contains("gave up"), r.out());
        assertTrue((System.nanoTime() - start) / 1_000_000_000.0 < 10, "the limit is kept");
        assertFalse(Files.exists(out));
    }

    @Test
    void provedGivesExitZeroAndNoProgressLineWhenNotATerminal() throws IOException {
        Path problem = write("syllogism", """
                problem syllogism
                axiom men_are_mortal: forall x. Man(x) implies Mortal(x)
                axiom socrates: Man(socrates)
                goal g: Mortal(socrates)
                """);
        Path out = dir.resolve("syllogism.proof");
        Run r = cli("prove", problem.toString(), "-o", out.toString());
        assertEquals(0, r.status(), r.out() + r.err());
        assertEquals("", r.err());
        assertFalse(r.out().contains("\r"));
        assertTrue(r.out().contains("checked by the kernel: theorem"), r.out());
        assertEquals(0, cli("check", problem.toString(), out.toString()).status());
    }

    @Test
    void unreadableProblemIsAnInputError() throws IOException {
        Path problem = write("broken", "problem broken\naxiom a: forall x. P(x\n");
        Run r = cli("prove", problem.toString(), "-o", dir.resolve("broken.proof").toString());
        assertEquals(2, r.status());
        assertTrue(r.err().contains("broken.problem:"), r.err());
        assertEquals(2, cli("prove", dir.resolve("missing.problem").toString(), "-o", "x.proof").status());
        Path good = write("good", "problem good\naxiom a: P(c)\ngoal g: P(c)\n");
        Run same = cli("prove", good.toString(), "-o", good.toString());
        assertEquals(2, same.status(), same.err());
        assertTrue(Files.readString(good).startsWith("problem good"), "the problem file is left alone");
    }

    @Test
    void aCertificateTheKernelRejectsIsReportedAndNeverWritten() throws IOException {
        Path problem = write("tampered", """
                problem tampered
                axiom men_are_mortal: forall x. Man(x) implies Mortal(x)
                axiom socrates: Man(socrates)
                goal g: Mortal(socrates)
                """);
        Path out = dir.resolve("tampered.proof");
        // Make the last resolution name the same literal twice: same sign, so the kernel must reject it.
        Prover prover = new Prover(Prover.Options.defaults(Duration.ofSeconds(20)),
                text -> text.replaceAll("by resolve (\\w+\\.\\d+), \\w+\\.\\d+\\n$", "by resolve $1, $1\n"));
        Prover.Outcome o = prover.prove(problem, out);
        assertEquals(Prover.Status.INTERNAL_ERROR, o.status(), o.message());
        assertEquals(70, o.status().exitStatus());
        assertTrue(o.message().startsWith("internal error: the kernel rejected the prover's own certificate at "),
                o.message());
        assertTrue(o.message().contains("(resolve)"), o.message());
        assertFalse(Files.exists(out));
        // The rejected certificate is kept for the bug report; remove it here.
        java.util.regex.Matcher kept = java.util.regex.Pattern.compile("kept at (\\S+);").matcher(o.message());
        assertTrue(kept.find(), o.message());
        assertTrue(Files.deleteIfExists(Path.of(kept.group(1))));
    }

    // ---------------------------------------------------------------- helpers

    private final TermFactory terms = new TermFactory();
    private final Symbol p = new Symbol("P", Symbol.Kind.PREDICATE, 1);
    private final Symbol f = new Symbol("f", Symbol.Kind.FUNCTION, 1);
    private final Symbol a = new Symbol("a", Symbol.Kind.FUNCTION, 0);
    private final Symbol b = new Symbol("b", Symbol.Kind.FUNCTION, 0);
    private final Variable x = terms.variable("x");
    private final Variable y = terms.variable("y");

    private Literal lit(boolean positive, Symbol s, Term... args) {
        return new Literal(positive, terms.application(s, args));
    }

    private Application app(Symbol s, Term... args) {
        return terms.application(s, args);
    }

    @Test
    void subsumptionTakesLiteralsToDistinctLiterals() {
        Literal px = lit(true, p, x);
        Literal py = lit(true, p, y);
        Literal pa = lit(true, p, app(a));
        Literal pb = lit(true, p, app(b));
        assertTrue(Matching.subsumes(new Literal[] {px}, new Literal[] {pa, pb}));
        assertTrue(Matching.subsumes(new Literal[] {px, py}, new Literal[] {pa, pb}));
        // P(x) or P(y) does not subsume its factor P(a) alone, nor P(a) or Q: that needs one literal twice.
        assertFalse(Matching.subsumes(new Literal[] {px, py}, new Literal[] {pa}));
        Literal q = lit(true, new Symbol("Q", Symbol.Kind.PREDICATE, 0));
        assertFalse(Matching.subsumes(new Literal[] {px, py, q}, new Literal[] {pa, q, lit(false, p, app(b))}));
        assertFalse(Matching.subsumes(new Literal[] {lit(true, p, app(f, x))}, new Literal[] {pa}));
        assertFalse(Matching.subsumes(new Literal[] {lit(false, p, x)}, new Literal[] {pa}));
    }

    @Test
    void matchingKeepsTheTargetsVariablesRigid() {
        // P(x) matches P(f(x)) (x := f(x)), but P(f(x)) does not match P(x), even though the names coincide.
        assertTrue(Matching.subsumes(new Literal[] {lit(true, p, x)}, new Literal[] {lit(true, p, app(f, x))}));
        assertFalse(Matching.subsumes(new Literal[] {lit(true, p, app(f, x))}, new Literal[] {lit(true, p, x)}));
        assertNull(Matching.match(app(f, x), x));
        assertEquals(app(a), Matching.match(app(f, x), app(f, app(a))).get(x));
    }

    @Test
    void subsumptionMatchesEquationsInEitherOrientation() {
        Literal xa = new Literal(true, terms.equation(x, app(a)));
        Literal ba = new Literal(true, terms.equation(app(a), app(b)));
        assertTrue(Matching.subsumes(new Literal[] {xa}, new Literal[] {ba}));
        assertFalse(Matching.subsumes(new Literal[] {xa}, new Literal[] {ba.negated()}));
    }

    @Test
    void knuthBendixOrderIsASimplificationOrder() {
        TermOrder order = new TermOrder();
        assertEquals(TermOrder.Comparison.GREATER, order.compare(app(f, x), x));
        assertEquals(TermOrder.Comparison.INCOMPARABLE, order.compare(app(f, x), y));
        assertEquals(TermOrder.Comparison.GREATER, order.compare(app(f, app(a)), app(b)));
        assertEquals(TermOrder.Comparison.GREATER, order.compare(app(b), app(a)), "same weight: by precedence");
        // A negative literal is above the positive one of the same atom; every atom is above true.
        Literal pa = lit(true, p, app(a));
        assertEquals(TermOrder.Comparison.GREATER, order.compare(pa.negated(), pa));
        assertTrue(order.maximal(new Literal[] {pa, lit(true, p, app(f, app(a)))}, 1));
        assertFalse(order.maximal(new Literal[] {pa, lit(true, p, app(f, app(a)))}, 0));
    }

    @Test
    void distributionGivesTheClausesOfANegationNormalForm() {
        Formula pa = new Formula.Atomic(lit(true, p, app(a)));
        Formula pb = new Formula.Atomic(lit(true, p, app(b)));
        Formula notPa = new Formula.Atomic(lit(false, p, app(a)));
        Formula f1 = new Formula.Or(List.of(new Formula.And(List.of(pa, pb)), notPa));
        List<Set<Literal>> cnf = Clausifier.cnf(f1);
        // (P(a) and P(b)) or not P(a): the tautology P(a) or not P(a) is dropped.
        assertEquals(1, cnf.size());
        assertEquals(Set.of(lit(true, p, app(b)), lit(false, p, app(a))), cnf.get(0));
        assertEquals(List.of(), Clausifier.cnf(Formula.Constant.TRUE));
        assertEquals(List.of(Set.of()), Clausifier.cnf(Formula.Constant.FALSE));
    }
}
