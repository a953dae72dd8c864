package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The kernel keeps two paths for several operations: a direct one for small clauses and terms (at most 8 literals, at
 * most 64 nodes as a tree) and a general one beyond. The rules' tests mostly exercise the small paths; these tests
 * hold the general ones, with the small path as the reference on the same question.
 */
class LargeTermPathsTest {

    private final KernelFixture k = new KernelFixture();

    /** Literals Bay1(x) or not Bay2(x) or ... or Bay_n(x), one for each bay. */
    private List<String> bays(int n) {
        List<String> out = new ArrayList<>();
        for (int i = 1; i <= n; i++) out.add((i % 2 == 0 ? "not " : "") + "Bay" + i + "(x, c" + i + ")");
        return out;
    }

    private Clause clause(List<String> literals) {
        return k.clause(String.join(" or ", literals));
    }

    @Test
    void sameSetOnWideClauses() {
        List<String> literals = bays(12);
        literals.add("u = c1");
        Clause c = clause(literals);
        List<String> shuffled = new ArrayList<>(literals);
        Collections.reverse(shuffled);
        shuffled.set(0, "c1 = u"); // the equation the other way round
        shuffled.add(literals.get(3)); // and one literal twice
        assertTrue(c.sameSet(clause(shuffled)));
        assertTrue(clause(shuffled).sameSet(c));

        List<String> missing = new ArrayList<>(literals.subList(1, literals.size()));
        assertFalse(c.sameSet(clause(missing)), "one literal fewer");
        assertFalse(clause(missing).sameSet(c), "one literal more");

        List<String> changed = new ArrayList<>(literals);
        changed.set(5, "Bay6(x, c7)");
        assertFalse(c.sameSet(clause(changed)), "one literal changed");

        List<String> negated = new ArrayList<>(literals);
        negated.set(0, "not " + literals.get(0));
        assertFalse(c.sameSet(clause(negated)), "one literal negated");
    }

    @Test
    void wideAndNarrowClausesAgreeOnSameSet() {
        // Across the threshold of 8 literals: the two paths answer the same questions the same way.
        for (int n = 6; n <= 11; n++) {
            List<String> literals = bays(n);
            List<String> rotated = new ArrayList<>(literals);
            Collections.rotate(rotated, 2);
            assertTrue(clause(literals).sameSet(clause(rotated)), "rotated, " + n + " literals");
            List<String> changed = new ArrayList<>(rotated);
            changed.set(n - 1, "Bay1(y, c1)");
            assertFalse(clause(literals).sameSet(clause(changed)), "changed, " + n + " literals");
        }
    }

    /** f(f(...f(inner)...)), {@code depth} applications of f. */
    private Term tower(int depth, Term inner) {
        Term t = inner;
        for (int i = 0; i < depth; i++) t = k.app("f", t);
        return t;
    }

    @Test
    void substitutionOnLargeTermsAndClauses() {
        Variable x = k.var("x");
        Variable y = k.var("y");
        Term a = k.term("a");
        Term b = k.term("b");
        Term big = k.app("g", tower(80, x), tower(3, y), x, b); // tree size over 64, with a ground argument
        assertTrue(big.treeSize() > 64);
        Substitution s = k.substitution("{x := a, y := h(x)}");
        Term expected = k.app("g", tower(80, a), tower(3, k.term("h(x)")), a, b);
        assertSame(expected, s.apply(big));

        Symbol p = k.predicate("Tall", 1);
        Symbol q = k.predicate("Low", 1);
        Clause c = new Clause(List.of(new Literal(true, k.f.application(p, big)),
                new Literal(false, k.f.application(q, y)), new Literal(true, k.f.application(q, a)),
                new Literal(true, k.f.application(p, big)))); // the large atom twice: the second is found in the memo
        Clause image = s.apply(c);
        assertSame(k.f.application(p, expected), image.literal(1).atom());
        assertSame(k.f.application(q, k.term("h(x)")), image.literal(2).atom());
        assertFalse(image.literal(2).positive());
        assertSame(c.literal(3), image.literal(3), "a ground literal is kept as it is");
        assertSame(image.literal(1).atom(), image.literal(4).atom());
    }

    @Test
    void variablesOfLargeClausesInOrderOfFirstOccurrence() {
        Variable x = k.var("x");
        Variable y = k.var("y");
        Variable z = k.var("z");
        Symbol p = k.predicate("Pile", 3);
        Term big = k.app("g", tower(70, z), y);
        Clause c = new Clause(List.of(new Literal(true, k.f.application(p, big, x, z)),
                new Literal(false, k.f.application(p, x, k.term("w"), y))));
        assertEquals(List.of(z, y, x, k.var("w")), c.variables());
        Clause small = new Clause(List.of(new Literal(true, k.f.application(p, tower(2, z), x, z)),
                new Literal(false, k.f.application(p, x, k.term("w"), y))));
        assertEquals(List.of(z, x, k.var("w"), y), small.variables());
    }
}
