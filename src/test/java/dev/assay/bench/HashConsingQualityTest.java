package dev.assay.bench;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.assay.kernel.Symbol;
import dev.assay.kernel.Term;
import dev.assay.kernel.TermFactory;
import java.util.HashSet;
import java.util.Set;
import org.junit.jupiter.api.Test;

/**
 * Found with the hash-consing benchmark: the term hash {@code 31 * h + hash(argument)} of a binary symbol applied to
 * two equal arguments is {@code 961 h(f) + 32 h(t)}, so after about seven such levels every term has the same hash,
 * the factory's map keeps them in one bin and each lookup is linear in the number of such terms (building
 * split^n(x0) is quadratic). These are exactly the terms of the Baader &amp; Snyder unifiers.
 */
class HashConsingQualityTest {

    @Test
    void nestedTermsWithEqualArgumentsHaveDistinctHashes() {
        TermFactory f = new TermFactory();
        Symbol split = new Symbol("split", Symbol.Kind.FUNCTION, 2);
        Term t = f.variable("x0");
        Set<Integer> hashes = new HashSet<>();
        for (int i = 1; i <= 200; i++) {
            t = f.application(split, t, t);
            hashes.add(t.hashCode());
        }
        assertTrue(hashes.size() >= 190, "distinct hashes among 200 nested terms: " + hashes.size());
    }

    @Test
    void nestedUnaryTermsHaveDistinctHashes() {
        // The unary case is fine (31 is odd, so each level is a bijection); it guards the test above's method.
        TermFactory f = new TermFactory();
        Symbol w = new Symbol("w", Symbol.Kind.FUNCTION, 1);
        Term t = f.variable("x0");
        Set<Integer> hashes = new HashSet<>();
        for (int i = 1; i <= 200; i++) {
            t = f.application(w, t);
            hashes.add(t.hashCode());
        }
        assertTrue(hashes.size() >= 190, "distinct hashes among 200 nested terms: " + hashes.size());
    }
}
