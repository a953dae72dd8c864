package dev.assay.syntax;

/** The atom of a formula or a literal: a predicate application or an equation. */
public sealed interface RawAtomic permits RawPredicateAtom, RawEquation {

    Location at();
}
