package dev.assay.syntax;

import java.util.Objects;

/**
 * {@code paramodulate A.i -> B.j @ p [σA] [σB]}, or {@code <-}. Substitutions not written are
 * null; when only one is written it is {@code fromSubst} (σA), so {@code intoSubst} is null
 * unless both are written (grammar decision, see CertificateParser.g4).
 */
public record ParamodulateArgs(LiteralRef from, Direction direction, LiteralRef into, TermPosition position,
                               RawSubstitution fromSubst, RawSubstitution intoSubst) implements RuleArgs {

    public ParamodulateArgs {
        Objects.requireNonNull(from, "from");
        Objects.requireNonNull(direction, "direction");
        Objects.requireNonNull(into, "into");
        Objects.requireNonNull(position, "position");
        if (intoSubst != null && fromSubst == null) {
            throw new IllegalArgumentException("σB is written only after σA");
        }
    }

    @Override
    public String ruleName() {
        return "paramodulate";
    }
}
