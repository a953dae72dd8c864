package dev.assay.syntax;

/** What a {@code declare} statement declares. */
public enum DeclarationKind {
    FUNCTION,
    PREDICATE
}
