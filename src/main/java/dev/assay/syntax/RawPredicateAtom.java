package dev.assay.syntax;

import java.util.Objects;

/** {@code P(t1, ..., tn)}, or {@code P} alone for a propositional atom, written as a term. */
public record RawPredicateAtom(RawTerm term) implements RawAtomic {

    public RawPredicateAtom {
        Objects.requireNonNull(term, "term");
    }

    @Override
    public Location at() {
        return term.at();
    }
}
