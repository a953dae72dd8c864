package dev.assay.syntax;

import java.util.List;
import java.util.Objects;

/** {@code declare function f/2, c/0} or {@code declare predicate Holds/2}. */
public record Declaration(DeclarationKind kind, List<DeclaredSymbol> symbols, Location at)
        implements ProblemStatement {

    public Declaration {
        Objects.requireNonNull(kind, "kind");
        symbols = List.copyOf(symbols);
        if (symbols.isEmpty()) {
            throw new IllegalArgumentException("a declaration declares at least one symbol");
        }
        Objects.requireNonNull(at, "at");
    }
}
