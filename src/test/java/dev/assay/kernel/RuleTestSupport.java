package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Shared set-up for the tests of single kernel rules: a problem whose axioms are the universal closures of the given
 * clauses, a kernel over it, and each axiom clausified into a clause fact of the same name.
 *
 * <p>With {@code -Dassay.kernel.defer=true} (the build's second run of the rule tests) the kernel defers the second
 * part of its clause rules' checks, and {@link #accepted} and {@link #rejected} take a step's outcome only once its
 * deferred check has run, on a thread of its own: so every rule test also holds for a deferring kernel.
 */
abstract class RuleTestSupport {

    static final boolean DEFER = Boolean.getBoolean("assay.kernel.defer");

    final KernelFixture k = new KernelFixture();
    Problem problem;
    Kernel kernel;
    final Map<String, Fact> facts = new LinkedHashMap<>();

    /** The universal closure of a clause as a formula: {@code forall x y. L1 or L2}. */
    static Formula closure(Clause c) {
        Formula body;
        if (c.isEmpty()) {
            body = Formula.Constant.FALSE;
        } else if (c.width() == 1) {
            body = new Formula.Atomic(c.literal(1));
        } else {
            List<Formula> parts = new ArrayList<>();
            for (Literal l : c.literals()) parts.add(new Formula.Atomic(l));
            body = new Formula.Or(parts);
        }
        List<Variable> vars = c.variables();
        for (int i = vars.size() - 1; i >= 0; i--) body = new Formula.Quantified(true, vars.get(i), body);
        return body;
    }

    /** Starts a check whose axioms are {@code "name: clause"} entries, each also clausified into a clause fact. */
    void start(String... namedClauses) {
        startWithGoal(null, null, namedClauses);
    }

    void startWithGoal(String goalName, String goal, String... namedClauses) {
        Map<String, Clause> clauses = new LinkedHashMap<>();
        for (String entry : namedClauses) {
            int colon = entry.indexOf(':');
            clauses.put(entry.substring(0, colon).trim(), k.clause(entry.substring(colon + 1)));
        }
        Formula g = goal == null ? null : k.formula(goal);
        Problem.Builder b = k.problem("test");
        for (Map.Entry<String, Clause> e : clauses.entrySet()) b.axiom(e.getKey(), closure(e.getValue()));
        if (g != null) b.goal(goalName, g);
        problem = b.build();
        kernel = new Kernel(problem, k.f, DEFER);
        for (Map.Entry<String, Clause> e : clauses.entrySet()) {
            Outcome o = kernel.clausify(e.getKey(), kernel.axiom(e.getKey()), null, e.getValue());
            facts.put(e.getKey(), accepted(o));
        }
    }

    /** Starts a check whose axioms are {@code "name: formula"} entries; no clause facts are made. */
    void startFormulas(String goalName, String goal, String... namedFormulas) {
        Map<String, Formula> formulas = new LinkedHashMap<>();
        for (String entry : namedFormulas) {
            int colon = entry.indexOf(':');
            formulas.put(entry.substring(0, colon).trim(), k.formula(entry.substring(colon + 1)));
        }
        Formula g = goal == null ? null : k.formula(goal);
        Problem.Builder b = k.problem("test");
        for (Map.Entry<String, Formula> e : formulas.entrySet()) b.axiom(e.getKey(), e.getValue());
        if (g != null) b.goal(goalName, g);
        problem = b.build();
        kernel = new Kernel(problem, k.f, DEFER);
    }

    Fact fact(String name) {
        Fact f = facts.get(name);
        if (f == null) throw new IllegalArgumentException("no fact " + name);
        return f;
    }

    /**
     * A deferring kernel's outcome as the step's whole check: the provisional fact's deferred check is run on another
     * thread, and its rejection, if any, replaces the acceptance.
     */
    static Outcome settled(Outcome o) {
        if (!(o instanceof Outcome.Accepted a) || a.fact().pending() == null) return o;
        Deferred d = a.fact().pending();
        Thread t = new Thread(d, "deferred-check");
        t.start();
        try {
            t.join();
            Outcome.Rejected r = d.outcome();
            return r != null ? r : o;
        } catch (InterruptedException e) {
            throw new AssertionError(e);
        }
    }

    static Fact accepted(Outcome o) {
        o = settled(o);
        if (o instanceof Outcome.Rejected r) fail("rejected: " + r.rule() + ": " + r.reason() + " (stated " + r.stated()
                + ", derived " + r.derived() + ")");
        return ((Outcome.Accepted) o).fact();
    }

    /** Asserts a rejection by {@code rule} whose reason contains every fragment. */
    static Outcome.Rejected rejected(Outcome o, String rule, String... fragments) {
        Outcome whole = settled(o);
        Outcome.Rejected r = assertInstanceOf(Outcome.Rejected.class, whole,
                () -> "accepted: " + ((Outcome.Accepted) whole).fact());
        assertEquals(rule, r.rule(), r::toString);
        for (String fragment : fragments) {
            assertTrue(r.reason().contains(fragment), () -> "reason \"" + r.reason() + "\" lacks \"" + fragment + "\"");
        }
        return r;
    }

    /** A second, independent check of the same problem: its facts must not be accepted here. */
    Kernel otherKernel() {
        return new Kernel(problem, k.f, DEFER);
    }
}
