package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Exact failure positions and messages of {@link Unification}, found by mutation testing (docs/kernel-testing.md). */
class UnificationMutationTest {

    private final TermFactory f = new TermFactory();
    private final Symbol g = new Symbol("g", Symbol.Kind.FUNCTION, 1);
    private final Symbol h = new Symbol("h", Symbol.Kind.FUNCTION, 2);
    private final Term a = f.application(new Symbol("a", Symbol.Kind.FUNCTION, 0));
    private final Term b = f.application(new Symbol("b", Symbol.Kind.FUNCTION, 0));

    /** {@code n} levels of h(a, ·) around {@code inner}: the position of inner is 2.2.….2 (n times). */
    private Term spine(int n, Term inner) {
        Term t = inner;
        for (int i = 0; i < n; i++) t = f.application(h, a, t);
        return t;
    }

    private Unification.NotUnifiable clashAtDepth(int n) {
        return assertInstanceOf(Unification.NotUnifiable.class,
                Unification.mostGeneralUnifier(f, spine(n, f.application(g, a)), spine(n, f.application(g, b))));
    }

    @Test
    void positionsUpToFortyLevelsAreWrittenInFull() {
        Unification.NotUnifiable n = clashAtDepth(39);
        // 39 levels of h, then the argument of g.
        assertEquals("2.".repeat(39) + "1", n.position());
        assertEquals("a and b clash: a against b (position " + n.position() + ")", n.describe());
    }

    @Test
    void longerPositionsKeepTheirEndsAndSayHowMuchIsLeftOut() {
        Unification.NotUnifiable n = clashAtDepth(59); // 60 steps
        String pos = n.position();
        assertTrue(pos.startsWith("2.".repeat(20) + "….("), pos);
        assertTrue(pos.contains(" more levels)…."), pos);
        assertTrue(pos.endsWith(".2.1"), pos);
        assertTrue(pos.length() < 100, pos);
    }

    @Test
    void theLeftOutCountMatchesTheStepsLeftOut() {
        Unification.NotUnifiable n = clashAtDepth(59); // 60 steps
        String pos = n.position();
        int open = pos.indexOf("….(");
        int close = pos.indexOf(" more levels)….");
        int said = Integer.parseInt(pos.substring(open + "….(".length(), close));
        String shown = pos.substring(0, open) + pos.substring(close + " more levels)….".length());
        int steps = shown.replace(".", "").length();
        assertEquals(60, steps + said, pos);
    }

    @Test
    void aClashBelowTheTopSaysWhereTheClassesMet() {
        // x := g(a) from the first argument; the second argument then sets g(b) against x.
        Variable x = f.variable("x");
        Term left = f.application(h, x, x);
        Term right = f.application(h, f.application(g, a), f.application(g, b));
        Unification.NotUnifiable n = assertInstanceOf(Unification.NotUnifiable.class,
                Unification.mostGeneralUnifier(f, left, right));
        assertEquals("a and b clash: a against b", n.explanation());
        assertEquals("2.1", n.position());
        Unification.NotUnifiable m = assertInstanceOf(Unification.NotUnifiable.class,
                Unification.mostGeneralUnifier(f, f.application(h, x, a), f.application(h, f.application(g, a), x)));
        assertEquals("a and g clash: a against g(a) (where a meets x)", m.explanation());
        assertEquals("2", m.position());
    }
}
