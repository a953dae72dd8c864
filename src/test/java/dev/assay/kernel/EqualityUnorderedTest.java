package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * Equations are unordered everywhere (FORMAT.md section 5: {@code s = t} and {@code t = s} are one literal, likewise
 * {@code !=}): in literal equality and hashing, in clause sets, in resolve, factor, variants, and in the conclusions
 * of the equality rules.
 */
class EqualityUnorderedTest extends EqualityTestSupport {

    @BeforeEach
    void setUp() {
        k.function("b", 0);
        k.function("c", 0);
        start("AB: a = b",
                "NBA: not b = a",
                "NEBA: b != a",
                "S: [x, y] x = y or y = x",
                "FX: [x] f(x) = a or P(x)",
                "NFY: [y] a != f(y) or Q(y)",
                "GX: [x] g(x) = x",
                "BOTH: a = b or b = a or P(c)");
    }

    @Test
    void literalEqualityAndHashIgnoreOrientation() {
        Literal ab = k.literal("a = b");
        Literal ba = k.literal("b = a");
        assertEquals(ab, ba);
        assertEquals(ab.hashCode(), ba.hashCode());
        assertEquals(k.literal("a != b"), k.literal("b != a"));
        assertEquals(k.literal("a != b").hashCode(), k.literal("b != a").hashCode());
        assertNotEquals(ab, k.literal("a != b"));
        // The atom keeps the orientation as written, which positions and eqfactor refer to.
        assertEquals("b = a", Printer.literal(ba));
    }

    @Test
    void clauseSetsIgnoreOrientationAndRepetition() {
        assertTrue(k.clause("a = b or P(c)").sameSet(k.clause("P(c) or b = a or a = b")));
        assertEquals(2, fact("BOTH").clause().asSet().size());
    }

    @Test
    void resolveAnEquationWithItsFlippedNegation() {
        accepted(kernel.resolve("s", fact("AB"), 1, null, fact("NBA"), 1, null, Clause.EMPTY));
        accepted(kernel.resolve("s", fact("NEBA"), 1, null, fact("AB"), 1, null, Clause.EMPTY));
        accepted(kernel.resolve("s", fact("AB"), 1, subst("{}"), fact("NBA"), 1, null, Clause.EMPTY));
    }

    @Test
    void resolveNonGroundEquationsInEitherOrientation() {
        // f(x) = a against a != f(y): unifies only with one side swapped.
        accepted(kernel.resolve("s", fact("FX"), 1, null, fact("NFY"), 1, null, k.clause("[x] P(x) or Q(x)")));
    }

    @Test
    void factorAnEquationWithItsFlip() {
        // As a set, x = y or y = x is the single literal x = y; factoring by x := y gives y = y.
        accepted(kernel.factor("s", fact("S"), 1, 2, null, k.clause("[y] y = y")));
        accepted(kernel.factor("s", fact("S"), 1, 2, null, k.clause("[x, y] x = y")));
        accepted(kernel.factor("s", fact("S"), 1, 2, subst("{x := y}"), k.clause("[y] y = y")));
    }

    @Test
    void variantsWithFlippedEquations() {
        assertTrue(Variants.areVariants(k.clause("[x] f(x) = a or P(x)"), k.clause("[y] P(y) or a = f(y)"),
                Variants.DEFAULT_BUDGET));
        assertTrue(Variants.areVariants(k.clause("[x, y] x != f(y)"), k.clause("[u, v] f(v) != u"),
                Variants.DEFAULT_BUDGET));
        // Flipping is not renaming: x = f(y) and y = f(x) are variants; x = f(y) and f(x) = x are not.
        assertTrue(Variants.areVariants(k.clause("[x, y] x = f(y)"), k.clause("[x, y] y = f(x)"),
                Variants.DEFAULT_BUDGET));
        assertFalse(Variants.areVariants(k.clause("[x, y] x = f(y)"), k.clause("[x] f(x) = x"),
                Variants.DEFAULT_BUDGET));
    }

    @Test
    void instantiateAndEqualityRulesAcceptFlippedConclusions() {
        accepted(kernel.instantiate("s", fact("FX"), subst("{x := c}"), k.clause("a = f(c) or P(c)")));
        // g(x) = x into f(g(y)) = a (FX under {x := g(y)}) at 1.1, stated as a = f(y).
        accepted(paramodulate("GX", 1, "->", "FX", 1, "1.1", "{x := y}", "{x := g(y)}", "[y] a = f(y) or P(g(y))"));
        accepted(paramodulate("GX", 1, "->", "FX", 1, "1.1", "[y] P(g(y)) or a = f(y)"));
    }
}
