package dev.assay.syntax;

/** Which way {@code paramodulate} uses its equation {@code s = t}. */
public enum Direction {
    /** {@code ->}: rewrites s into t. */
    LEFT_TO_RIGHT,
    /** {@code <-}: rewrites t into s. */
    RIGHT_TO_LEFT
}
