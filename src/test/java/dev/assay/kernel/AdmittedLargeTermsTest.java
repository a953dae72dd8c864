package dev.assay.kernel;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/**
 * Every symbol of a stated conclusion or substitution must be in the signature. For a large term (more than 64 nodes
 * as a tree) the kernel remembers that it was admitted, so that later conclusions sharing it are checked only for
 * their new part. These tests hold that remembering never admits a symbol the signature lacks, and that the symbol a
 * rejection names is still the first outside the signature in pre-order.
 */
class AdmittedLargeTermsTest extends RuleTestSupport {

    @BeforeEach
    void setUp() {
        k.function("w", 1);
        k.function("vial", 0);
        k.function("g", 2);
        start("A: [x] Sample(x)");
    }

    /** w(w(...w(inner)...)), {@code depth} applications of w. */
    private Term tower(int depth, Term inner) {
        Term t = inner;
        for (int i = 0; i < depth; i++) t = k.app("w", t);
        return t;
    }

    /** {@code instantiate A {x := t}} with the conclusion {@code Sample(t)}: both name every symbol of t. */
    private Outcome sample(Term t) {
        Variable x = k.var("x");
        Substitution sigma = new Substitution(k.f, java.util.Map.of(x, t));
        Clause stated = new Clause(java.util.List.of(new Literal(true, k.f.application(k.symbol("Sample"), t))));
        return kernel.instantiate("s", fact("A"), sigma, stated);
    }

    @Test
    void aTermAdmittedBeforeDoesNotCarryAnUnknownSymbolThrough() {
        Term admitted = tower(80, k.term("vial"));
        assertTrue(admitted.treeSize() > 64);
        accepted(sample(admitted));
        accepted(sample(admitted)); // again, now from what the kernel remembers
        accepted(sample(tower(5, admitted))); // a new top over a remembered part

        // Symbols the problem does not have, made after the check started.
        Term onTop = k.app("zz", admitted);
        rejected(sample(onTop), "instantiate", "the symbol zz/1 is not in the signature");
        Term inside = tower(70, k.app("zz", k.term("vial")));
        rejected(sample(inside), "instantiate", "the symbol zz/1 is not in the signature");
        Term besideRemembered = k.app("g", admitted, k.app("zz", k.term("vial")));
        rejected(sample(besideRemembered), "instantiate", "the symbol zz/1 is not in the signature");
        // Rejected terms are not remembered: asked again, they are rejected again.
        rejected(sample(onTop), "instantiate", "zz/1");
        rejected(sample(besideRemembered), "instantiate", "zz/1");
        rejected(sample(k.app("g", besideRemembered, admitted)), "instantiate", "zz/1");
    }

    @Test
    void theFirstSymbolOutsideInPreOrderIsNamed() {
        Term admitted = tower(80, k.term("vial"));
        accepted(sample(admitted));
        // yy comes first left to right, zz second; a remembered part between them changes nothing.
        Term both = k.app("g", k.app("g", admitted, k.app("yy", admitted)), k.app("zz", admitted));
        rejected(sample(both), "instantiate", "the symbol yy/1 is not in the signature");
        Term swapped = k.app("g", k.app("zz", admitted), k.app("g", admitted, k.app("yy", admitted)));
        rejected(sample(swapped), "instantiate", "the symbol zz/1 is not in the signature");
        // A known name used with another arity is outside too, and said so, also above a remembered part.
        Symbol w2 = new Symbol("w", Symbol.Kind.FUNCTION, 2);
        rejected(sample(k.f.application(w2, admitted, admitted)), "instantiate",
                "the symbol w is used as a function w/2 but is a function w/1");
        rejected(sample(tower(3, k.f.application(w2, k.term("vial"), admitted))), "instantiate", "function w/2");
    }
}
