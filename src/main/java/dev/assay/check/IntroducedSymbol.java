package dev.assay.check;

/** A symbol that a certificate step introduced: a Skolem function or a definition's predicate. */
public record IntroducedSymbol(String name, String kind, int arity, String step, String rule) {
}
