package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * Worked equational derivations in the style of the literature, every step checked by the kernel.
 *
 * <p>Honesty about sources: the papers named below were not at hand when these tests were written. The derivations
 * are recalled from memory and from common textbook practice, not copied from the papers; step numbers, rule numbers
 * and section numbers of the originals are deliberately not claimed. What the tests do establish is independent of
 * the recollection: each step is a correct application of the rule as FORMAT.md section 6 defines it, and the kernel
 * accepts it. The group axioms (left identity, left inverse, associativity) are the standard one-sided
 * axiomatisation, common practice in every algebra text.
 */
class EqualityLiteratureTest extends EqualityTestSupport {

    @BeforeEach
    void setUp() {
        k.function("e", 0);
        k.function("c", 0);
        k.function("i", 1);
        k.function("mul", 2);
        start("G1: [x] mul(e, x) = x",
                "G2: [x] mul(i(x), x) = e",
                "G3: [x, y, z] mul(mul(x, y), z) = mul(x, mul(y, z))",
                "NG: mul(c, e) != c");
    }

    /**
     * Robinson &amp; Wos, "Paramodulation and theorem-proving in first-order theories with equality", Machine
     * Intelligence 4, 1969, introduced paramodulation and illustrated it on group theory; recalled from memory, we do
     * not claim these are the paper's own steps. From the three axioms, paramodulation alone derives left
     * cancellation {@code i(x)·(x·z) = z}, then {@code i(i(x))·z = x·z}, the right inverse {@code x·i(x) = e}, the
     * right identity {@code x·e = x}, {@code i(e) = e} and {@code i(i(x)) = x}; finally the negated claim
     * {@code c·e != c} is refuted by paramodulation and eqres.
     */
    @Test
    void groupTheoryByParamodulationAlone() {
        // e·z is what (i(x)·x)·z becomes when i(x)·x is rewritten to e at 1.1.
        step("l1", () -> paramodulate("G2", 1, "->", "G3", 1, "1.1", "[x, z] mul(e, z) = mul(i(x), mul(x, z))"));
        // Left cancellation, stated with the equation flipped (a variant).
        step("l2", () -> paramodulate("G1", 1, "->", "l1", 1, "1", "[x, z] mul(i(x), mul(x, z)) = z"));
        // l2 into a renamed copy of itself at 1.2: x' := i(x), z' := x·z.
        step("l3", () -> paramodulate("l2", 1, "->", "l2", 1, "1.2", "[x, z] mul(i(i(x)), z) = mul(x, z)"));
        // Right inverse: i(x)·x = e against i(i(x'))·z', so x := i(x') and z' := i(x').
        step("l4", () -> paramodulate("G2", 1, "->", "l3", 1, "1", "[x] mul(x, i(x)) = e"));
        step("l5", () -> paramodulate("l4", 1, "->", "G3", 1, "1.1", "[x, z] mul(e, z) = mul(x, mul(i(x), z))"));
        step("l6", () -> paramodulate("G1", 1, "->", "l5", 1, "1", "[x, z] mul(x, mul(i(x), z)) = z"));
        // Right identity: i(x)·x rewritten to e inside x'·(i(x')·z') with z' := x.
        step("l7", () -> paramodulate("G2", 1, "->", "l6", 1, "1.2", "[x] mul(x, e) = x"));
        step("l8", () -> paramodulate("G2", 1, "->", "l7", 1, "1", "i(e) = e"));
        step("l9", () -> paramodulate("l7", 1, "->", "l3", 1, "1", "[x] i(i(x)) = mul(x, e)"));
        step("l10", () -> paramodulate("l7", 1, "->", "l9", 1, "2", "[x] i(i(x)) = x"));
        // The same right identity step with both substitutions written out.
        step("l7s", () -> paramodulate("G2", 1, "->", "l6", 1, "1.2", "{x := x}", "{z := x}", "[x] mul(x, e) = x"));
        // Refute the negated claim c·e != c: rewrite c·e to c, then eqres.
        step("r1", () -> paramodulate("l7", 1, "->", "NG", 1, "1", "c != c"));
        Fact empty = step("r2", () -> eqres("r1", 1, null, "false"));
        assertTrue(empty.isEmptyClause());
    }

    @Test
    void aWrongGroupStepIsRefused() {
        step("l1", () -> paramodulate("G2", 1, "->", "G3", 1, "1.1", "[x, z] mul(e, z) = mul(i(x), mul(x, z))"));
        // Rewriting with G2 at position 1 of G3 (the whole left side (x·y)·z) is not left cancellation.
        rejected(paramodulate("G2", 1, "->", "G3", 1, "1", "[x, z] mul(i(x), mul(x, z)) = z"), "paramodulate",
                "the side rewritten by ->, mul(i(x), x), does not unify with mul(mul(x, y), z) at position 1 of G3.1",
                "i and mul clash");
        // Right identity does not follow from left identity by rewriting in the wrong direction.
        rejected(paramodulate("G1", 1, "<-", "l1", 1, "1", "[x, z] z = mul(i(x), mul(x, z))"), "paramodulate",
                "not a variant");
        rejected(paramodulate("G1", 1, "->", "NG", 1, "1", "c != c"), "paramodulate",
                "the side rewritten by ->, mul(e, x), does not unify with mul(c, e) at position 1 of NG.1",
                "e and c clash");
    }

    /**
     * Knuth &amp; Bendix, "Simple word problems in universal algebras", in Computational Problems in Abstract Algebra
     * (J. Leech, ed.), Pergamon, 1970: completion of the group axioms oriented as rules e·x → x, i(x)·x → e,
     * (x·y)·z → x·(y·z). Recalled from memory (common practice in every rewriting text): the first critical pair comes
     * from overlapping i(x)·x → e into the subterm x·y of the associativity rule, that is the term (i(x)·x)·z, which
     * rewrites to e·z one way and to i(x)·(x·z) the other; normalising e·z gives the new rule i(x)·(x·z) → z. A
     * critical pair is exactly a paramodulant of one rule's equation into a non-variable position of another's left
     * side.
     */
    @Test
    void knuthBendixCriticalPairOfInverseAndAssociativity() {
        Fact cp = step("cp", () -> paramodulate("G2", 1, "->", "G3", 1, "1.1",
                "[x, z] mul(e, z) = mul(i(x), mul(x, z))"));
        // The same critical pair with the unifier written out: σA empty, σB {x := i(x), y := x}.
        step("cps", () -> paramodulate("G2", 1, "->", "G3", 1, "1.1", "{}", "{x := i(x), y := x}",
                "[x, z] mul(e, z) = mul(i(x), mul(x, z))"));
        // Normalising the left side with e·x → x: the new rule.
        Fact rule = step("r4", () -> paramodulate("G1", 1, "->", "cp", 1, "1", "[x, z] z = mul(i(x), mul(x, z))"));
        assertEquals(1, cp.clause().width());
        assertEquals(1, rule.clause().width());
    }

    /**
     * Knuth &amp; Bendix 1970 (recalled from memory, as above): a critical pair whose two sides have the same normal
     * form adds nothing. The associativity rule overlapped with itself at 1.1, on ((x·y)·z)·w, gives
     * (x·(y·z))·w = (x·y)·(z·w); three more rewrites with associativity bring both sides to x·(y·(z·w)), and the
     * result is an instance of reflexivity.
     */
    @Test
    void knuthBendixAssociativityOverlapIsJoinable() {
        step("cp", () -> paramodulate("G3", 1, "->", "G3", 1, "1.1",
                "[x, y, z, w] mul(mul(x, mul(y, z)), w) = mul(mul(x, y), mul(z, w))"));
        step("j1", () -> paramodulate("G3", 1, "->", "cp", 1, "1",
                "[x, y, z, w] mul(x, mul(mul(y, z), w)) = mul(mul(x, y), mul(z, w))"));
        step("j2", () -> paramodulate("G3", 1, "->", "j1", 1, "1.2",
                "[x, y, z, w] mul(x, mul(y, mul(z, w))) = mul(mul(x, y), mul(z, w))"));
        Fact joined = step("j3", () -> paramodulate("G3", 1, "->", "j2", 1, "2",
                "[x, y, z, w] mul(x, mul(y, mul(z, w))) = mul(x, mul(y, mul(z, w)))"));
        Literal l = joined.clause().literal(1);
        assertSame(l.left(), l.right(), "both sides of the critical pair have the same normal form");
        accepted(reflexivity("[x, y, z, w] mul(x, mul(y, mul(z, w))) = mul(x, mul(y, mul(z, w)))"));
        // Stopping one rewrite short leaves two different sides, which reflexivity refuses.
        assertFalse(reflexivity("[x, y, z, w] mul(x, mul(y, mul(z, w))) = mul(mul(x, y), mul(z, w))").accepted());
    }

    /**
     * The trivial instance of equality factoring and equality resolution in the same setting: from e = x·i(x) or
     * e = i(x)·x (a clause one could get from a weakened axiom), eqfactor yields x·i(x) != i(x)·x or e = i(x)·x.
     * Common practice, not from either paper.
     */
    @Test
    void equalityFactoringAndResolutionOnGroupTerms() {
        start("W: [x] e = mul(x, i(x)) or e = mul(i(x), x)",
                "D: [x] mul(x, e) != mul(e, x) or mul(x, x) = e");
        accepted(eqfactor("W", 1, 2, null, "[x] mul(x, i(x)) != mul(i(x), x) or e = mul(i(x), x)"));
        // x·e != e·x unifies only by x := e.
        accepted(eqres("D", 1, null, "mul(e, e) = e"));
        accepted(eqres("D", 1, "{x := e}", "mul(e, e) = e"));
        rejected(eqres("D", 1, "{x := c}", "mul(c, c) = e"), "eqres",
                "under {x := c} the sides become mul(c, e) and mul(e, c): not equal");
    }
}
