package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;

/**
 * The guards and small methods of the kernel's value classes (symbols, literals, clauses, formulas, facts, problems,
 * signatures, the term factory), which the rule tests reach only on their good path (JaCoCo branch coverage,
 * docs/kernel-testing.md).
 */
class KernelValuesBranchTest {

    private final KernelFixture k = new KernelFixture();

    @Test
    void aSymbolNeedsANameAKindAndANonNegativeArity() {
        assertThrows(IllegalArgumentException.class, () -> new Symbol(null, Symbol.Kind.FUNCTION, 0));
        assertThrows(IllegalArgumentException.class, () -> new Symbol("f", null, 0));
        assertThrows(IllegalArgumentException.class, () -> new Symbol("f", Symbol.Kind.FUNCTION, -1));
        Symbol f = new Symbol("f", Symbol.Kind.FUNCTION, 1);
        assertEquals(f, new Symbol("f", Symbol.Kind.FUNCTION, 1));
        assertNotEquals(f, new Symbol("f", Symbol.Kind.FUNCTION, 2));
        assertNotEquals(f, new Symbol("f", Symbol.Kind.PREDICATE, 1));
        assertNotEquals(f, new Symbol("g", Symbol.Kind.FUNCTION, 1));
        assertNotEquals(f, (Object) "f");
        assertTrue(new Symbol("=", Symbol.Kind.PREDICATE, 2).isEquality());
        assertFalse(new Symbol("=", Symbol.Kind.FUNCTION, 2).isEquality());
    }

    @Test
    void termsWithCollidingHashesStayApart() {
        // "Aa" and "BB" have the same String hash, so the two constants have the same shape hash.
        Symbol aa = new Symbol("Aa", Symbol.Kind.FUNCTION, 0);
        Symbol bb = new Symbol("BB", Symbol.Kind.FUNCTION, 0);
        assertEquals(aa.hashCode(), bb.hashCode());
        Application x = k.f.application(aa);
        Application y = k.f.application(bb);
        assertNotSame(x, y);
        assertEquals(x.hashCode(), y.hashCode());
        assertSame(x, k.f.application(aa));
    }

    @Test
    void literalsCompareEquationsUnordered() {
        Literal ab = k.literal("a = b");
        Literal ba = k.literal("b = a");
        assertEquals(ab, ba);
        assertEquals(ab.hashCode(), ba.hashCode());
        assertNotEquals(ab, k.literal("a != b"));
        assertNotEquals(ab, k.literal("a = c"));
        assertNotEquals(ab, k.literal("c = b"));
        assertNotEquals(k.literal("P(a)"), k.literal("P(b)"));
        assertNotEquals(ab, (Object) "a = b");
        assertEquals("a = b", ab.toString());
        assertEquals("not P(a)", k.literal("not P(a)").toString());
        assertThrows(IllegalArgumentException.class, () -> new Literal(true, (Application) k.term("f(a)")));
    }

    @Test
    void clausesMadeFromACollectionAndPrinted() {
        Clause c = Clause.of(new LinkedHashSet<>(List.of(k.literal("P(x)"), k.literal("not Q(x, a)"))));
        assertEquals(2, c.width());
        assertEquals("[x] P(x) or not Q(x, a)", c.toString());
        assertEquals("false", Clause.EMPTY.toString());
    }

    @Test
    void formulasPrintAndJunctionsNeedTwoParts() {
        assertEquals("true", Formula.Constant.TRUE.toString());
        assertEquals("false", Formula.Constant.of(false).toString());
        Formula p = k.formula("P(a)");
        assertThrows(IllegalArgumentException.class, () -> new Formula.And(List.of(p)));
        assertThrows(IllegalArgumentException.class, () -> new Formula.Or(List.of(p)));
        assertEquals("P(a) and P(a)", new Formula.And(List.of(p, p)).toString());
        assertEquals("P(a) or P(a)", new Formula.Or(List.of(p, p)).toString());
    }

    @Test
    void aFactIsAFormulaOrAClauseNeverBothOrNeither() {
        Problem problem = k.problem("facts").build();
        Kernel kernel = new Kernel(problem, k.f);
        Formula p = k.formula("P(a)");
        Clause c = k.clause("P(a)");
        assertThrows(IllegalArgumentException.class, () -> new Fact(kernel, "x", null, null));
        assertThrows(IllegalArgumentException.class, () -> new Fact(kernel, "x", p, c));
        assertEquals("f: P(a)", new Fact(kernel, "f", p, null).toString());
        Fact clause = new Fact(kernel, "c", null, c);
        assertEquals("c: P(a)", clause.toString());
        assertFalse(clause.isEmptyClause());
        assertTrue(new Fact(kernel, "e", null, Clause.EMPTY).isEmptyClause());
        assertFalse(new Fact(kernel, "f", p, null).isEmptyClause());
    }

    @Test
    void aProblemRefusesMisuseByItsCaller() {
        Formula p = k.formula("P(a)");
        Problem.Builder b = k.problem("misuse").axiom("ax", p);
        assertTrue(b.signature().admits(k.symbol("P")));
        assertThrows(IllegalArgumentException.class, () -> b.axiom("ax", p), "duplicate axiom");
        assertThrows(IllegalArgumentException.class, () -> b.goal("ax", p), "goal named like an axiom");
        b.goal("g", p);
        assertThrows(IllegalArgumentException.class, () -> b.goal("g2", p), "second goal");
        assertThrows(IllegalArgumentException.class, () -> b.axiom("g", p), "axiom named like the goal");
        assertThrows(IllegalArgumentException.class, () -> b.axiom("open", k.formula("P(x)")), "open formula");
        assertThrows(IllegalArgumentException.class,
                () -> new Problem.Builder("bare").axiom("ax", p), "undeclared symbol");
        Problem built = b.build();
        assertEquals("misuse", built.name());
        assertEquals("g", built.goalName());
        assertSame(p, built.goal());
        assertThrows(UnsupportedOperationException.class, () -> built.axioms().put("more", p));
    }

    @Test
    void aSignatureKeepsOneSymbolPerName() {
        Signature s = new Signature();
        Symbol f1 = new Symbol("f", Symbol.Kind.FUNCTION, 1);
        s.add(f1, Signature.Origin.PROBLEM, null);
        s.add(new Symbol("f", Symbol.Kind.FUNCTION, 1), Signature.Origin.SKOLEM, "s1"); // the same symbol again
        assertEquals(Signature.Origin.PROBLEM, s.entry("f").origin());
        assertThrows(IllegalArgumentException.class, () -> s.add(new Symbol("f", Symbol.Kind.FUNCTION, 2),
                Signature.Origin.SKOLEM, "s2"));
        s.add(new Symbol("g", Symbol.Kind.FUNCTION, 0), Signature.Origin.DEFINITION, "d1");
        assertEquals(List.of("f", "g"), new ArrayList<>(s.view().keySet()));
        assertEquals(1, s.introduced().size());
        assertEquals("d1", s.introduced().get(0).step());
        assertThrows(UnsupportedOperationException.class, () -> s.view().clear());
        assertEquals(2, s.entries().size());
    }

    @Test
    void termsAndSubstitutionsPrintAndAnswer() {
        assertEquals("f(x, g(a))", k.term("f(x, g(a))").toString());
        assertEquals("x", k.var("x").toString());
        Substitution s = k.substitution("{x := g(a), y := z}");
        assertEquals("{x := g(a), y := z}", s.toString());
        assertSame(k.term("g(a)"), s.get(k.var("x")));
        assertSame(k.var("z"), s.get(k.var("y")));
        assertEquals(null, s.get(k.var("z")));
        assertSame(k.term("f(g(a), z)"), s.apply(k.term("f(x, y)")));
        Term ground = k.term("f(a, a)");
        assertSame(ground, s.apply(ground));
    }

    @Test
    void everyFormulaPrintsItself() {
        assertEquals("P(a)", k.formula("P(a)").toString());
        assertEquals("not (P(a) or S)", k.formula("not (P(a) or S)").toString());
        assertEquals("P(a) implies S", k.formula("P(a) implies S").toString());
        assertEquals("P(a) iff S", k.formula("P(a) iff S").toString());
        assertEquals("forall x. exists y. R(x, y)", k.formula("forall x. exists y. R(x, y)").toString());
    }

    @Test
    void printingCutsAtTheLimitAndOnlyThere() {
        Term fa = k.term("f(a)");
        assertEquals("f(a)", Printer.term(fa, 4), "an exact fit is not cut");
        assertEquals("f(a …", Printer.term(fa, 3));
        // A name longer than the room left is cut inside the name.
        assertEquals("abc …", Printer.term(k.term("abcdef"), 3));
        assertEquals("abcdef", Printer.term(k.term("abcdef"), 6));
    }

    @Test
    void internalVariablesAndTheFactorysCount() {
        assertTrue(new Variable("'1").isInternal());
        assertTrue(k.f.freshVariable("x").isInternal());
        assertFalse(k.var("x").isInternal());
        assertEquals("x", k.var("x").toString());
        TermFactory fresh = new TermFactory();
        Symbol c = new Symbol("c", Symbol.Kind.FUNCTION, 0);
        Symbol g = new Symbol("g", Symbol.Kind.FUNCTION, 1);
        fresh.application(g, fresh.application(c));
        fresh.application(g, fresh.application(c));
        assertEquals(2, fresh.size());
    }

    @Test
    void aProblemAnswersForItsParts() {
        Formula p = k.formula("P(a)");
        Problem.Builder b = k.problem("parts");
        assertSame(b, b.axiom("ax", p));
        assertSame(b, b.goal("g", p));
        Problem built = b.build();
        assertTrue(built.signature().admits(k.symbol("P")));
        assertEquals("parts", built.name());
    }

    @Test
    void variablesOfALargeTermWithSharedSubtermsInOrder() {
        // More than 64 nodes: the iterative walk with a visited set; the shared subterm s is entered once.
        Symbol f = k.function("f", 1);
        Symbol h = k.function("h", 3);
        Term s = k.var("y");
        for (int i = 0; i < 40; i++) s = k.f.application(f, s);
        Term t = k.f.application(h, s, k.var("x"), s);
        assertTrue(t.treeSize() > 64);
        Set<Variable> vars = new LinkedHashSet<>();
        Terms.collectVariables(t, vars);
        assertEquals(List.of(k.var("y"), k.var("x")), new ArrayList<>(vars));
        Set<Variable> none = new LinkedHashSet<>();
        Terms.collectVariables(k.f.application(h, k.term("a"), k.term("a"), k.term("a")), none);
        assertTrue(none.isEmpty());
    }
}
