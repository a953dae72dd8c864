package dev.assay.kernel;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * {@code abbreviate P using D} (FORMAT.md section 6): D is a {@code define} step for Q, and replacing every atom
 * {@code Q(t1,…,tk)} of the conclusion by {@code φ[x1 := t1, …]}, without capture, gives the premise.
 */
class AbbreviateRuleTest extends RuleTestSupport {

    private Fact def;
    private Fact def0;

    @BeforeEach
    void setUp() {
        k.function("a", 0);
        k.function("f", 1);
        k.predicate("P", 1);
        k.predicate("Q", 1);
        k.predicate("R", 2);
        k.predicate("S", 0);
        startFormulas(null, null,
                "pos: forall x. P(x) or exists y. (R(x, y) and Q(y))",
                "neg: forall x. (exists y. (R(x, y) and Q(y))) implies P(x)",
                "negnot: forall x. not (exists y. (R(x, y) and Q(y))) or P(x)",
                "twice: forall x. (exists y. (R(x, y) and Q(y))) and (P(x) or exists y. (R(f(x), y) and Q(y)))",
                "iffpos: forall x. (exists y. (R(x, y) and Q(y))) iff P(x)",
                // The body of D binds y; here y is also the outer variable whose value is passed as the argument.
                "capture: forall y. exists z. (R(y, z) and Q(z))",
                "captured: forall y. exists y. (R(y, y) and Q(y))",
                "ground: S and P(a)",
                "plain: forall x. P(x)");
        Symbol d = k.predicate("D", 1);
        def = accepted(kernel.define("d", d, k.formula("forall x. (D(x) iff exists y. (R(x, y) and Q(y)))")));
        Symbol d0 = k.predicate("D0", 0);
        def0 = accepted(kernel.define("d0", d0, k.formula("D0 iff S and P(a)")));
    }

    private Outcome abbreviate(String premise, String stated) {
        return kernel.abbreviate("ab", kernel.axiom(premise), def, k.formula(stated));
    }

    // ------------------------------------------------------------------ acceptance

    @Test
    void positivePosition() {
        accepted(abbreviate("pos", "forall x. P(x) or D(x)"));
        // Bound variables may be renamed and disjuncts permuted.
        accepted(abbreviate("pos", "forall u. D(u) or P(u)"));
    }

    @Test
    void negativePositionUnderImplies() {
        accepted(abbreviate("neg", "forall x. D(x) implies P(x)"));
    }

    @Test
    void negativePositionUnderNot() {
        accepted(abbreviate("negnot", "forall x. not D(x) or P(x)"));
    }

    @Test
    void bothPolaritiesUnderIff() {
        accepted(abbreviate("iffpos", "forall x. D(x) iff P(x)"));
    }

    @Test
    void severalOccurrencesWithDifferentArguments() {
        accepted(abbreviate("twice", "forall x. D(x) and (P(x) or D(f(x)))"));
        // Abbreviating only some occurrences is fine too: the others stay as they are.
        accepted(abbreviate("twice", "forall x. D(x) and (P(x) or exists y. (R(f(x), y) and Q(y)))"));
    }

    @Test
    void boundVariableOfTheBodyIsRenamedApart() {
        // Unfolding D(y) must give exists y'. (R(y, y') and Q(y')), not the captured exists y. (R(y, y) and Q(y)).
        accepted(abbreviate("capture", "forall y. D(y)"));
    }

    @Test
    void naiveSubstitutionWouldAcceptACapturedPremise() {
        // forall y. exists y. (R(y, y) and Q(y)) is what naive substitution of y into D's body gives; it is not the
        // unfolding of forall y. D(y), so this is rejected.
        rejected(abbreviate("captured", "forall y. D(y)"), "abbreviate",
                "unfolding D in the conclusion does not give captured");
    }

    @Test
    void propositionalDefinition() {
        accepted(kernel.abbreviate("ab", kernel.axiom("ground"), def0, k.formula("D0")));
    }

    @Test
    void nothingAbbreviated() {
        accepted(abbreviate("plain", "forall z. P(z)"));
    }

    @Test
    void aPremiseThatAlreadyHasTheDefinedAtomCannotBeAbbreviatedAgain() {
        // Every atom D(…) of the conclusion is unfolded, so the unfolding has no D while this premise has one: the
        // rule as FORMAT.md states it abbreviates from the unabbreviated formula only (do all occurrences at once).
        Fact first = accepted(abbreviate("twice", "forall x. D(x) and (P(x) or exists y. (R(f(x), y) and Q(y)))"));
        rejected(kernel.abbreviate("ab2", first, def, k.formula("forall x. D(x) and (P(x) or D(f(x)))")), "abbreviate",
                "unfolding D in the conclusion does not give ab");
    }

    // ------------------------------------------------------------------ rejection

    @Test
    void definitionThatIsNoDefineStep() {
        rejected(kernel.abbreviate("ab", kernel.axiom("pos"), kernel.axiom("plain"), k.formula("forall x. P(x)")),
                "abbreviate", "plain is not a define step");
    }

    @Test
    void unfoldingGivesAnotherFormula() {
        rejected(abbreviate("pos", "forall x. P(x) or D(f(x))"), "abbreviate",
                "unfolding D in the conclusion does not give pos");
        rejected(abbreviate("pos", "forall x. P(x) and D(x)"), "abbreviate", "does not give pos");
        // Wrong polarity.
        rejected(abbreviate("pos", "forall x. P(x) or not D(x)"), "abbreviate", "does not give pos");
    }

    @Test
    void unfoldingComparesWithoutNegationNormalForm() {
        // D(x) implies P(x) unfolds to (exists y. …) implies P(x), not to the premise written with not … or.
        rejected(abbreviate("negnot", "forall x. D(x) implies P(x)"), "abbreviate", "does not give negnot");
    }

    @Test
    void premiseIsAClause() {
        Fact clause = accepted(kernel.clausify("c1", kernel.axiom("plain"), null, k.clause("[x] P(x)")));
        rejected(kernel.abbreviate("ab", clause, def, k.formula("forall x. P(x)")), "abbreviate",
                "c1 is a clause step; abbreviate takes a formula");
    }

    @Test
    void definitionIsAClause() {
        Fact clause = accepted(kernel.clausify("c1", kernel.axiom("plain"), null, k.clause("[x] P(x)")));
        rejected(kernel.abbreviate("ab", kernel.axiom("plain"), clause, k.formula("forall x. P(x)")), "abbreviate",
                "c1 is a clause step");
    }

    @Test
    void definitionOfAnotherCheck() {
        Kernel other = otherKernel();
        rejected(other.abbreviate("ab", other.axiom("pos"), def, k.formula("forall x. P(x) or D(x)")), "abbreviate",
                "belongs to another check");
    }

    @Test
    void unknownSymbolInTheConclusion() {
        rejected(abbreviate("pos", "forall x. P(x) or Zed(x)"), "abbreviate", "Zed/1 is not in the signature");
    }
}
