package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** {@link Printer}: the concrete syntax of FORMAT.md, and a round trip through the test parser where it applies. */
class PrinterTest {

    private final KernelFixture k = new KernelFixture();

    @Test
    void terms() {
        assertEquals("f(x, g(a))", Printer.term(k.term("f(x, g(a))")));
        assertEquals("a", Printer.term(k.term("a")));
        assertEquals("x", Printer.term(k.term("x")));
    }

    @Test
    void literals() {
        assertEquals("not P(x)", Printer.literal(k.literal("not P(x)")));
        assertEquals("a != f(b)", Printer.literal(k.literal("a != f(b)")));
        assertEquals("f(b) = a", Printer.literal(k.literal("f(b) = a")), "orientation as written");
        assertEquals("R", Printer.literal(k.literal("R")));
    }

    @Test
    void clauses() {
        assertEquals("false", Printer.clause(Clause.EMPTY));
        assertEquals("P(a) or not Q(b, b)", Printer.clause(k.clause("P(a) or not Q(b, b)")));
        assertEquals("[x, y] not P(x) or Q(y, x)", Printer.clause(k.clause("not P(x) or Q(y, x)")));
        // The example of FORMAT.md section 8.
        assertEquals("[p] not Staff(p) or Holds(p, badge(p))",
                Printer.clause(k.clause("[p] not Staff(p) or Holds(p, badge(p))")));
    }

    @Test
    void substitutions() {
        Substitution s = new Substitution(k.f, Map.of(k.var("x"), k.term("g(z)")));
        assertEquals("{x := g(z)}", Printer.substitution(s));
        assertEquals("{}", Printer.substitution(Substitution.empty(k.f)));
    }

    @Test
    void longTermsAreCapped() {
        Term t = k.term("a");
        Symbol h = k.function("h", 2);
        for (int i = 0; i < 30; i++) t = k.f.application(h, t, t);
        String s = Printer.term(t);
        assertTrue(s.endsWith(" …"), s);
        assertTrue(s.length() <= Printer.MESSAGE_LIMIT + 2, "length " + s.length());
        assertEquals(40, Printer.term(t, 38).length());
    }

    @ParameterizedTest
    @ValueSource(strings = {
        "P(a)",
        "not P(a)",
        "a = b",
        "a != b",
        "not a = b",
        "A and B or C",
        "A and (B or C)",
        "(A or B) and C",
        "not (A and B)",
        "A implies B implies C",
        "(A implies B) implies C",
        "A iff (B iff C)",
        "(A iff B) iff C",
        "A implies (B iff C)",
        "(A iff B) implies C",
        "forall x y. R(x, y)",
        "forall x. exists y. R(x, y) or P(x)",
        "(forall x. P(x)) or Q(a)",
        "Q(a) and (exists x. P(x))",
        "not (forall x. P(x))",
        "A implies (forall x. P(x))",
        "(forall x. P(x)) implies A",
        "forall x. P(x) iff Q(x)",
        "true and not false",
        "not not A",
        "(A and B) and C",
        "A or (B or C)",
    })
    void formulaRoundTrip(String text) {
        Formula original = k.formula(text);
        String printed = Printer.formula(original);
        Formula again = k.formula(printed);
        assertEquals(printed, Printer.formula(again), "printing is not a fixpoint for " + text);
        assertTrue(Formulas.equivalent(original, again), () -> text + " printed as " + printed);
        assertTrue(RandomFormulas.sameTree(original, again), () -> text + " printed as " + printed + " changes the tree");
    }

    @Test
    void clauseRoundTrip() {
        for (String text : new String[] {"[x, y] not P(x) or Q(y, x) or x = f(y)", "P(a) or b != c", "false",
                "[x] x != x"}) {
            Clause c = k.clause(text);
            Clause again = k.clause(Printer.clause(c));
            assertEquals(c.literals(), again.literals(), text);
            assertEquals(Printer.clause(c), Printer.clause(again));
        }
    }

    @Test
    void termRoundTrip() {
        Term t = k.term("f(x, g(h(a, y)))");
        assertSame(t, k.term(Printer.term(t)));
    }
}
