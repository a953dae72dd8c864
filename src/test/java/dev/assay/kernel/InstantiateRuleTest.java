package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/** {@code instantiate A σ} (FORMAT.md section 6, rules on clauses). */
class InstantiateRuleTest extends RuleTestSupport {

    @BeforeEach
    void setUp() {
        k.function("f", 1);
        start("A: [x, y] not P(x) or Q(x, y)", "G: P(a)");
    }

    private Outcome instantiate(String a, String sigma, String stated) {
        return settled(kernel.instantiate("s", fact(a), k.substitution(sigma), k.clause(stated)));
    }

    @Test
    void instance() {
        accepted(instantiate("A", "{x := f(a)}", "[y] not P(f(a)) or Q(f(a), y)"));
        accepted(instantiate("A", "{x := y, y := x}", "[x, y] not P(y) or Q(y, x)"));
        // Simultaneous, not sequential: {x := y, y := a} gives Q(y, a), not Q(a, a).
        accepted(instantiate("A", "{x := y, y := a}", "[y] not P(y) or Q(y, a)"));
    }

    @Test
    void instanceThatMergesLiterals() {
        start("B: [x, y] P(x) or P(y)");
        accepted(instantiate("B", "{y := x}", "[x] P(x)"));
    }

    @Test
    void emptySubstitution() {
        accepted(instantiate("A", "{}", "[x, y] Q(x, y) or not P(x)"));
        accepted(instantiate("G", "{}", "P(a)"));
    }

    @Test
    void notTheInstance() {
        Outcome.Rejected r = rejected(instantiate("A", "{x := a}", "[y] not P(a) or Q(a, a)"), "instantiate",
                "the conclusion differs from the derived clause", "stated but not derived Q(a, a)",
                "derived but not stated Q(a, y)");
        assertEquals("[y] not P(a) or Q(a, y)", r.derived());
        // A renaming of Aσ is not Aσ.
        rejected(instantiate("A", "{}", "[u, v] not P(u) or Q(u, v)"), "instantiate", "differs");
    }

    @Test
    void substitutionBindingAVariableNotInTheClause() {
        rejected(instantiate("A", "{z := a}", "[x, y] not P(x) or Q(x, y)"), "instantiate",
                "the substitution binds z, which is not a variable of A");
        rejected(instantiate("G", "{x := a}", "P(a)"), "instantiate", "binds x, which is not a variable of G");
    }

    @Test
    void unknownSymbolInTheSubstitution() {
        rejected(instantiate("A", "{x := zz3}", "[y] not P(zz3) or Q(zz3, y)"), "instantiate",
                "the symbol zz3/0 is not in the signature");
    }

    @Test
    void premiseThatIsAFormula() {
        rejected(kernel.instantiate("s", kernel.axiom("G"), Substitution.empty(k.f), k.clause("P(a)")), "instantiate",
                "G is a formula; instantiate takes clause steps");
    }

    @Test
    void factOfAnotherKernel() {
        Kernel other = otherKernel();
        Fact foreign = accepted(other.clausify("G", other.axiom("G"), null, k.clause("P(a)")));
        rejected(kernel.instantiate("s", foreign, Substitution.empty(k.f), k.clause("P(a)")), "instantiate",
                "premise G belongs to another check");
    }
}
