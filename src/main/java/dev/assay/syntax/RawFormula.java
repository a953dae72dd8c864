package dev.assay.syntax;

/**
 * A formula as written. Chains of one operator are flattened into one node: {@code a and b and c}
 * is one {@link RawAnd} of three; parentheses are kept as structure, so {@code (a and b) and c}
 * is an {@link RawAnd} whose first operand is an {@link RawAnd}. Each node's location is where it
 * starts (the first operand of a connective, the keyword of {@code not} and of a quantifier).
 *
 * <p>A formula can nest as deep as the reader's depth limit; code that walks one should use an
 * explicit stack or run on a big stack ({@link BigStack}). The records' generated
 * {@code equals}, {@code hashCode} and {@code toString} recurse.
 */
public sealed interface RawFormula extends RawConclusion
        permits RawAtom, RawNot, RawAnd, RawOr, RawImplies, RawIff, RawQuantified, RawConstant {

    @Override
    Location at();
}
