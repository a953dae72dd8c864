package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Worked examples of Skolemization and clause forms from the literature, run through the kernel.
 *
 * <p>Honesty note: the books and papers were not at hand when this was written. The formulas below are recalled from
 * memory of the cited sections, in the cited authors' style, and may differ in detail (symbol names, order of
 * quantifiers) from the printed examples; where something is common practice rather than a particular example it is
 * marked so. What the tests check does not depend on the recollection: each step is verified by the kernel against
 * FORMAT.md section 6.
 */
class ClausalFormLiteratureTest extends RuleTestSupport {

    private Fact step(Outcome o) {
        return accepted(o);
    }

    // ------------------------------------------------------------------ Chang & Lee 1973, chapter 4

    /**
     * C.-L. Chang and R. C.-T. Lee, Symbolic Logic and Mechanical Theorem Proving (Academic Press, 1973), ch. 4,
     * section 4.2 (Skolem standard forms), recalled from memory: the prenex formula
     * ∃x ∀y ∀z ∃u ∀v ∃w P(x, y, z, u, v, w) has the standard form ∀y ∀z ∀v P(a, y, z, f(y, z), v, g(y, z, v)): the
     * outermost existential becomes a constant, every other existential a function of the universals to its left.
     */
    @Test
    void changLeePrenexStandardForm() {
        k.predicate("P", 6);
        startFormulas(null, null, "ex: exists x. forall y z. exists u. forall v. exists w. P(x, y, z, u, v, w)");
        Fact s = step(kernel.skolemize("s1", kernel.axiom("ex"),
                List.of(k.function("a", 0), k.function("f", 2), k.function("g", 3)),
                k.formula("forall y z v. P(a, y, z, f(y, z), v, g(y, z, v))")));
        step(kernel.clausify("c1", s, null, k.clause("[y, z, v] P(a, y, z, f(y, z), v, g(y, z, v))")));
    }

    @Test
    void changLeePrenexStandardFormWithAMissingArgumentIsRejected() {
        k.predicate("P", 6);
        startFormulas(null, null, "ex: exists x. forall y z. exists u. forall v. exists w. P(x, y, z, u, v, w)");
        // w depends on v as well: g(y, z) is not a Skolem term for it.
        rejected(kernel.skolemize("s1", kernel.axiom("ex"),
                List.of(k.function("a", 0), k.function("f", 2), k.function("g", 2)),
                k.formula("forall y z v. P(a, y, z, f(y, z), v, g(y, z))")), "skolemize", "lacks the variable v");
    }

    /**
     * Chang and Lee 1973, ch. 4, section 4.2, recalled from memory: ∀x ∃y ∃z ((¬P(x, y) ∧ Q(x, z)) ∨ R(x, y, z))
     * becomes ∀x ((¬P(x, f(x)) ∧ Q(x, g(x))) ∨ R(x, f(x), g(x))), whose clauses are ¬P(x, f(x)) ∨ R(x, f(x), g(x))
     * and Q(x, g(x)) ∨ R(x, f(x), g(x)).
     */
    @Test
    void changLeeStandardFormAndItsClauses() {
        k.predicate("P", 2);
        k.predicate("Q", 2);
        k.predicate("R", 3);
        startFormulas(null, null, "ax: forall x. exists y. exists z. (not P(x, y) and Q(x, z)) or R(x, y, z)");
        Fact s = step(kernel.skolemize("s1", kernel.axiom("ax"), List.of(k.function("f", 1), k.function("g", 1)),
                k.formula("forall x. (not P(x, f(x)) and Q(x, g(x))) or R(x, f(x), g(x))")));
        step(kernel.clausify("c1", s, null, k.clause("[x] not P(x, f(x)) or R(x, f(x), g(x))")));
        step(kernel.clausify("c2", s, null, k.clause("[x] Q(x, g(x)) or R(x, f(x), g(x))")));
        // Dropping R from a clause is not a consequence.
        rejected(kernel.clausify("c3", s, null, k.clause("[x] Q(x, g(x))")), "clausify");
    }

    /**
     * Common practice (the standard first exercise of refutation by resolution, e.g. in Chang and Lee 1973, ch. 5):
     * from ∀x (P(x) → ∃y R(x, y)) and P(a), conclude ∃y R(a, y). Negate, skolemize, clausify, resolve to false.
     */
    @Test
    void refutationThroughASkolemFunction() {
        k.function("a", 0);
        k.predicate("P", 1);
        k.predicate("R", 2);
        startFormulas("g", "exists y. R(a, y)", "ax: forall x. P(x) implies exists y. R(x, y)", "pa: P(a)");
        Fact g1 = step(kernel.negate("g1", "g", k.formula("forall y. not R(a, y)")));
        Fact s1 = step(kernel.skolemize("s1", kernel.axiom("ax"), List.of(k.function("f", 1)),
                k.formula("forall x. not P(x) or R(x, f(x))")));
        Fact c1 = step(kernel.clausify("c1", s1, null, k.clause("[x] not P(x) or R(x, f(x))")));
        Fact c2 = step(kernel.clausify("c2", kernel.axiom("pa"), null, k.clause("P(a)")));
        Fact c3 = step(kernel.clausify("c3", g1, null, k.clause("[y] not R(a, y)")));
        Fact c4 = step(kernel.resolve("c4", c1, 1, null, c2, 1, null, k.clause("R(a, f(a))")));
        Fact c5 = step(kernel.resolve("c5", c3, 1, null, c4, 1, null, Clause.EMPTY));
        assertTrue(c5.isEmptyClause());
    }

    // ------------------------------------------------------------------ structure-preserving clause forms

    /**
     * D. A. Plaisted and S. Greenbaum, A structure-preserving clause form translation, J. Symbolic Computation 2
     * (1986) 293–304; A. Nonnengart and C. Weidenbach, Computing small clause normal forms, Handbook of Automated
     * Reasoning (2001), ch. 6, section on formula renaming. Recalled from memory, and common practice since Tseitin:
     * the disjunction of n conjunctions (P1 ∧ Q1) ∨ … ∨ (Pn ∧ Qn) has 2^n clauses in the distributive clause form;
     * naming each conjunction by a new predicate Di(x) ↔ Pi(x) ∧ Qi(x) gives one clause D1(x) ∨ … ∨ Dn(x) plus, since
     * each Di occurs positively only, the "only if" halves ¬Di(x) ∨ Pi(x) and ¬Di(x) ∨ Qi(x): 2n + 1 clauses.
     * Here n = 3 (8 clauses against 7), with facts making every disjunct false at a, refuted by resolution.
     */
    @Test
    void plaistedGreenbaumRenamingOfConjunctionsInADisjunction() {
        k.function("a", 0);
        for (int i = 1; i <= 3; i++) {
            k.predicate("P" + i, 1);
            k.predicate("Q" + i, 1);
        }
        startFormulas(null, null,
                "dis: forall x. (P1(x) and Q1(x)) or (P2(x) and Q2(x)) or (P3(x) and Q3(x))",
                "n1: not P1(a)", "n2: not Q2(a)", "n3: not P3(a)");
        Fact[] defs = new Fact[4];
        for (int i = 1; i <= 3; i++) {
            Symbol d = k.predicate("D" + i, 1);
            defs[i] = step(kernel.define("d" + i, d, k.formula("forall x. (D" + i + "(x) iff P" + i + "(x) and Q" + i + "(x))")));
        }
        // abbreviate replaces every atom of one definition at a time: three steps.
        Fact ab1 = step(kernel.abbreviate("ab1", kernel.axiom("dis"), defs[1],
                k.formula("forall x. D1(x) or (P2(x) and Q2(x)) or (P3(x) and Q3(x))")));
        // ab1 has D1, which unfolding D2 leaves alone: a chain of abbreviations by different definitions works (one
        // definition cannot be used twice on the same atoms, see AbbreviateRuleTest).
        Fact ab2 = step(kernel.abbreviate("ab2", ab1, defs[2], k.formula("forall x. D1(x) or D2(x) or (P3(x) and Q3(x))")));
        Fact ab3 = step(kernel.abbreviate("ab3", ab2, defs[3], k.formula("forall x. D1(x) or D2(x) or D3(x)")));
        Fact top = step(kernel.clausify("c0", ab3, null, k.clause("[x] D1(x) or D2(x) or D3(x)")));
        // The "only if" halves of the definitions, as clauses (the clausify of the definition's nnf).
        Fact h1 = step(kernel.clausify("h1", defs[1], null, k.clause("[x] not D1(x) or P1(x)")));
        Fact h2 = step(kernel.clausify("h2", defs[2], null, k.clause("[x] not D2(x) or Q2(x)")));
        Fact h3 = step(kernel.clausify("h3", defs[3], null, k.clause("[x] not D3(x) or P3(x)")));
        // The "if" half is a clause too, though this refutation does not need it.
        step(kernel.clausify("i1", defs[1], null, k.clause("[x] D1(x) or not P1(x) or not Q1(x)")));
        Fact f1 = step(kernel.clausify("f1", kernel.axiom("n1"), null, k.clause("not P1(a)")));
        Fact f2 = step(kernel.clausify("f2", kernel.axiom("n2"), null, k.clause("not Q2(a)")));
        Fact f3 = step(kernel.clausify("f3", kernel.axiom("n3"), null, k.clause("not P3(a)")));
        Fact r1 = step(kernel.resolve("r1", h1, 2, null, f1, 1, null, k.clause("not D1(a)")));
        Fact r2 = step(kernel.resolve("r2", h2, 2, null, f2, 1, null, k.clause("not D2(a)")));
        Fact r3 = step(kernel.resolve("r3", h3, 2, null, f3, 1, null, k.clause("not D3(a)")));
        Fact r4 = step(kernel.resolve("r4", top, 1, null, r1, 1, null, k.clause("D2(a) or D3(a)")));
        Fact r5 = step(kernel.resolve("r5", r4, 1, null, r2, 1, null, k.clause("D3(a)")));
        assertTrue(step(kernel.resolve("r6", r5, 1, null, r3, 1, null, Clause.EMPTY)).isEmptyClause());
    }

    /**
     * Plaisted and Greenbaum 1986 (recalled from memory): a renamed subformula under an equivalence occurs with both
     * polarities, so both halves of its definition are needed. ∀x ((∃y R(x, y)) ↔ P(x)) with D(x) ↔ ∃y R(x, y): the
     * definition is skolemized (its "only if" half has the existential), then every half is a clause. With P(a) and
     * ∀y ¬R(a, y) the set is unsatisfiable.
     */
    @Test
    void plaistedGreenbaumBothPolaritiesUnderAnEquivalence() {
        k.function("a", 0);
        k.predicate("P", 1);
        k.predicate("R", 2);
        startFormulas(null, null, "eq: forall x. (exists y. R(x, y)) iff P(x)", "pa: P(a)", "nr: forall y. not R(a, y)");
        Symbol d = k.predicate("D", 1);
        Fact def = step(kernel.define("d", d, k.formula("forall x. (D(x) iff exists y. R(x, y))")));
        Fact ab = step(kernel.abbreviate("ab", kernel.axiom("eq"), def, k.formula("forall x. D(x) iff P(x)")));
        Fact a1 = step(kernel.clausify("a1", ab, null, k.clause("[x] D(x) or not P(x)")));
        step(kernel.clausify("a2", ab, null, k.clause("[x] not D(x) or P(x)")));
        // nnf(def) = forall x. (not D(x) or exists y. R(x, y)) and (D(x) or forall y. not R(x, y)).
        Fact sk = step(kernel.skolemize("sk", def, List.of(k.function("w", 1)),
                k.formula("forall x. (not D(x) or R(x, w(x))) and (D(x) or forall y. not R(x, y))")));
        Fact h1 = step(kernel.clausify("h1", sk, null, k.clause("[x] not D(x) or R(x, w(x))")));
        step(kernel.clausify("h2", sk, null, k.clause("[x, y] D(x) or not R(x, y)")));
        // clausify refuses the definition itself: its nnf still has the existential.
        rejected(kernel.clausify("h0", def, null, k.clause("[x] not D(x) or R(x, w(x))")), "clausify",
                "still has an existential quantifier");
        Fact p = step(kernel.clausify("p", kernel.axiom("pa"), null, k.clause("P(a)")));
        Fact n = step(kernel.clausify("n", kernel.axiom("nr"), null, k.clause("[y] not R(a, y)")));
        Fact r1 = step(kernel.resolve("r1", a1, 2, null, p, 1, null, k.clause("D(a)")));
        Fact r2 = step(kernel.resolve("r2", h1, 1, null, r1, 1, null, k.clause("R(a, w(a))")));
        assertTrue(step(kernel.resolve("r3", n, 1, null, r2, 1, null, Clause.EMPTY)).isEmptyClause());
    }

    /**
     * Nonnengart and Weidenbach 2001 (recalled from memory; renaming before Skolemization is common practice): a
     * subformula with free variables is named by a predicate over exactly those variables; renaming an existential
     * subformula first lets its Skolem function take only the variables it needs. Here ∀x ∀z (P(z) ∨ ∃y R(x, y))
     * with D(x) ↔ ∃y R(x, y): the Skolem function of the definition has one argument, where skolemizing in place
     * could have used both x and z.
     */
    @Test
    void nonnengartWeidenbachRenamingAnExistentialSubformula() {
        k.predicate("P", 1);
        k.predicate("R", 2);
        startFormulas(null, null, "ax: forall x z. P(z) or exists y. R(x, y)");
        Symbol d = k.predicate("D", 1);
        Fact def = step(kernel.define("d", d, k.formula("forall x. (D(x) iff exists y. R(x, y))")));
        Fact ab = step(kernel.abbreviate("ab", kernel.axiom("ax"), def, k.formula("forall x z. P(z) or D(x)")));
        step(kernel.clausify("c1", ab, null, k.clause("[x, z] P(z) or D(x)")));
        Fact sk = step(kernel.skolemize("sk", def, List.of(k.function("w", 1)),
                k.formula("forall x. (not D(x) or R(x, w(x))) and (D(x) or forall y. not R(x, y))")));
        step(kernel.clausify("c2", sk, null, k.clause("[x] not D(x) or R(x, w(x))")));
        // In place, the Skolem term may take both enclosing universals, or only x.
        step(kernel.skolemize("in1", kernel.axiom("ax"), List.of(k.function("w2", 2)),
                k.formula("forall x z. P(z) or R(x, w2(x, z))")));
        step(kernel.skolemize("in2", kernel.axiom("ax"), List.of(k.function("w1", 1)),
                k.formula("forall x z. P(z) or R(x, w1(x))")));
    }
}
