package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** The term factory, literals, clauses and substitutions: the data the rules stand on. */
class TermsTest {

    private final KernelFixture k = new KernelFixture();

    @Test
    void structurallyEqualTermsAreTheSameObject() {
        assertSame(k.term("f(x, g(a))"), k.term("f(x, g(a))"));
        assertSame(k.var("x"), k.term("x"));
        assertNotEquals(k.term("f(x, g(a))"), k.term("f(x, g(b))"));
    }

    @Test
    void arityIsEnforced() {
        Symbol f = k.function("f", 2);
        assertThrows(IllegalArgumentException.class, () -> k.f.application(f, k.term("a")));
    }

    @Test
    void atomsAreNotArguments() {
        Application atom = k.atom("P(a)");
        Symbol g = k.function("g", 1);
        assertThrows(IllegalArgumentException.class, () -> k.f.application(g, atom));
        assertThrows(IllegalArgumentException.class, () -> k.f.equation(atom, k.term("a")));
        assertThrows(IllegalArgumentException.class, () -> new Literal(true, (Application) k.term("g(a)")));
    }

    @Test
    void sizes() {
        Term t = k.term("f(g(x), g(x))");
        assertEquals(5, t.treeSize());
        assertEquals(3, t.depth());
        assertFalse(t.isGround());
        assertTrue(k.term("f(g(a), g(b))").isGround());
    }

    @Test
    void equationsAreUnorderedLiterals() {
        Literal l = k.literal("a = f(b)");
        Literal r = k.literal("f(b) = a");
        assertEquals(l, r);
        assertEquals(l.hashCode(), r.hashCode());
        assertNotEquals(l, k.literal("a != f(b)"));
        assertEquals(k.literal("a != f(b)"), k.literal("f(b) != a"));
        assertSame(k.term("a"), r.right(), "orientation kept as written");
    }

    @Test
    void clausesAreSets() {
        Clause c = k.clause("P(x) or a = b or P(x) or b = a");
        assertEquals(4, c.width());
        assertEquals(2, c.asSet().size());
        assertTrue(c.sameSet(k.clause("b = a or P(x)")));
        assertFalse(c.sameSet(k.clause("P(y) or a = b")));
        assertNull(c.literal(0));
        assertNull(c.literal(5));
        assertEquals(List.of(k.var("x")), c.variables());
        assertTrue(Clause.EMPTY.isEmpty());
    }

    @Test
    void substitutionIsSimultaneous() {
        Substitution s = new Substitution(k.f, Map.of(k.var("x"), k.term("y"), k.var("y"), k.term("f(x)")));
        assertSame(k.term("g(y, f(x))"), s.apply(k.term("g(x, y)")));
        assertSame(k.term("g(a, b)"), s.apply(k.term("g(a, b)")));
    }

    @Test
    void substitutionOnASharedGraphIsCheap() {
        // h(t, t) nested 60 times is a tree of 2^61 - 1 symbols but a graph of 61 nodes.
        Symbol h = k.function("h", 2);
        Term t = k.var("x");
        for (int i = 0; i < 60; i++) t = k.f.application(h, t, t);
        Substitution s = new Substitution(k.f, Map.of(k.var("x"), k.term("a")));
        Term applied = s.apply(t);
        assertTrue(applied.isGround());
        assertEquals((1L << 61) - 1, applied.treeSize());
    }

    @Test
    void renamedVariablesCannotBeWritten() {
        assertTrue(k.var("x'1").isInternal());
        assertFalse(k.var("x1").isInternal());
    }
}
