package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** The budget of {@link Variants#areVariants}, found by mutation testing (docs/kernel-testing.md). */
class VariantsMutationTest {

    private final KernelFixture k = new KernelFixture();

    @Test
    void aSearchWithoutBudgetLeftIsARejection() {
        Clause a = k.clause("[x] P(x) or Q(x)");
        Clause b = k.clause("[y] P(y) or Q(y)");
        // No step at all: the search stops before its first literal.
        assertFalse(Variants.areVariants(a, b, 0));
        // One step: it stops before its first match.
        assertFalse(Variants.areVariants(a, b, 1));
        assertTrue(Variants.areVariants(a, b, 100));
        // Equal as written needs no search.
        assertTrue(Variants.areVariants(a, k.clause("[x] P(x) or Q(x)"), 0));
    }

    @Test
    void reorderedLiteralsNeedTheFullSearchAndItsBudget() {
        Clause a = k.clause("[x, y] P(x) or R(x, y) or Q(y)");
        Clause b = k.clause("[u, v] Q(v) or P(u) or R(u, v)");
        assertTrue(Variants.areVariants(a, b, Variants.DEFAULT_BUDGET));
        assertFalse(Variants.areVariants(a, b, 3));
        assertFalse(Variants.areVariants(a, k.clause("[u, v] Q(u) or P(u) or R(u, v)"), Variants.DEFAULT_BUDGET));
    }
}
