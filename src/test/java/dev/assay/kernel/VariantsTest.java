package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** {@link Variants#areVariants}: equal as sets of literals under a one-to-one renaming, equations unordered. */
class VariantsTest {

    private final KernelFixture k = new KernelFixture();

    private boolean variants(String a, String b) {
        Clause ca = k.clause(a);
        Clause cb = k.clause(b);
        boolean forward = Variants.areVariants(ca, cb, Variants.DEFAULT_BUDGET);
        boolean backward = Variants.areVariants(cb, ca, Variants.DEFAULT_BUDGET);
        assertTrue(forward == backward, "variance is not symmetric for " + a + " and " + b);
        return forward;
    }

    @Test
    void aClauseIsAVariantOfItself() {
        assertTrue(variants("P(x, f(y)) or not Q(y)", "P(x, f(y)) or not Q(y)"));
        assertTrue(variants("false", "false"));
        assertTrue(variants("S(a)", "S(a)"));
    }

    @Test
    void renaming() {
        assertTrue(variants("P(x, f(y)) or not Q(y)", "P(u, f(v)) or not Q(v)"));
        // A permutation of the variables is a renaming too.
        assertTrue(variants("P(x, y)", "P(y, x)"));
        assertTrue(variants("P(x, y) or Q(y)", "P(y, x) or Q(x)"));
    }

    @Test
    void literalOrder() {
        assertTrue(variants("P(x) or Q(y) or not R(x, y)", "not R(u, v) or Q(v) or P(u)"));
    }

    @Test
    void repetition() {
        assertTrue(variants("P(x) or P(x) or Q(x)", "Q(y) or P(y)"));
    }

    @Test
    void equationOrientation() {
        assertTrue(variants("f(x) = y", "z = f(w)"));
        assertTrue(variants("f(x) != a or P(x)", "a != f(y) or P(y)"));
        // Orientation chosen per literal, with one renaming for the whole clause.
        assertTrue(variants("x = y or f(x) = g(y)", "v = u or g(v) = f(u)"));
    }

    @Test
    void literalsOfTheSameShapeNeedTheRightPairing() {
        // Both literals have the same skeleton; only one pairing is consistent.
        assertTrue(variants("P(x, y) or P(y, z)", "P(v, w) or P(u, v)"));
        assertFalse(variants("P(x, y) or P(y, z)", "P(u, v) or P(w, v)"));
    }

    @Test
    void nonInjectiveRenamingIsNoVariant() {
        assertFalse(variants("P(x, y)", "P(z, z)"));
        assertFalse(variants("S(x) or Q(y)", "S(z) or Q(z)"));
        assertFalse(variants("x = y", "z = z"));
    }

    @Test
    void differentSizes() {
        assertFalse(variants("P(x) or Q(x)", "P(x)"));
        assertFalse(variants("P(x)", "false"));
        // Two distinct literals are not one, even though they are equivalent as formulas.
        assertFalse(variants("P(x) or P(y)", "P(z)"));
    }

    @Test
    void aSymbolIsNotAVariable() {
        assertFalse(variants("P(a)", "P(x)"));
        assertFalse(variants("P(f(x))", "P(y)"));
        assertFalse(variants("a = x", "y = z"));
    }

    @Test
    void signMatters() {
        assertFalse(variants("P(x)", "not P(x)"));
        assertFalse(variants("x = y", "x != y"));
    }

    @Test
    void differentSymbols() {
        assertFalse(variants("P(x)", "Q(x)"));
        assertFalse(variants("P(f(x))", "P(g(x))"));
    }

    @Test
    void exhaustedBudgetIsARejection() {
        Clause a = k.clause("P(x, y) or P(y, z)");
        assertTrue(Variants.areVariants(a, k.clause("P(v, w) or P(u, v)"), Variants.DEFAULT_BUDGET));
        assertFalse(Variants.areVariants(a, k.clause("P(v, w) or P(u, v)"), 1));
    }

    @Test
    void wideClausesEqualAsSetsAreVariantsWithoutSearch() {
        // Twenty literals of one shape, the second clause in reverse order: equal as sets, so the identity renaming
        // pairs them, even with no budget for a search; one variable changed, and they are not variants.
        StringBuilder forward = new StringBuilder();
        StringBuilder backward = new StringBuilder();
        StringBuilder changed = new StringBuilder();
        for (int i = 0; i < 20; i++) {
            String lit = "P(x" + i + ", x" + (i + 1) + ")";
            forward.append(i == 0 ? "" : " or ").append(lit);
            backward.insert(0, lit + (i == 0 ? "" : " or "));
            changed.insert(0, (i == 7 ? "P(x7, x9)" : lit) + (i == 0 ? "" : " or "));
        }
        Clause a = k.clause(forward.toString());
        assertTrue(Variants.areVariants(a, k.clause(backward.toString()), 0));
        assertTrue(Variants.areVariants(k.clause(backward.toString()), a, 0));
        assertFalse(Variants.areVariants(a, k.clause(changed.toString()), Variants.DEFAULT_BUDGET));
        assertFalse(Variants.areVariants(k.clause(changed.toString()), a, Variants.DEFAULT_BUDGET));
    }

    @Test
    void manyLiteralsOfOneShapeFinishQuickly() {
        // A chain P(x0, x1), P(x1, x2), … stated in reverse order with other names: every literal is a candidate for
        // every other, so the pairing is found by the search, not by the skeleton.
        assertTimeoutPreemptively(Duration.ofSeconds(10), () -> {
            int n = 200;
            Symbol p = k.predicate("P", 2);
            List<Literal> a = new ArrayList<>();
            List<Literal> b = new ArrayList<>();
            for (int i = 0; i < n; i++) {
                a.add(new Literal(true, k.f.application(p, k.var("x" + i), k.var("x" + (i + 1)))));
                b.add(new Literal(true, k.f.application(p, k.var("y" + (n - i)), k.var("y" + (n - i + 1)))));
            }
            assertTrue(Variants.areVariants(new Clause(a), new Clause(b), Variants.DEFAULT_BUDGET));
        });
    }
}
