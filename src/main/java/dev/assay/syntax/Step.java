package dev.assay.syntax;

import java.util.Objects;

/**
 * {@code step LABEL: formula F by RULE ARGS} or {@code step LABEL: clause C by RULE ARGS}.
 * {@code rule} is the rule's name as written, for its location; {@code args} says which rule it is.
 */
public record Step(Name label, RawConclusion conclusion, Name rule, RuleArgs args, Location at)
        implements CertificateStatement {

    public Step {
        Objects.requireNonNull(label, "label");
        Objects.requireNonNull(conclusion, "conclusion");
        Objects.requireNonNull(rule, "rule");
        Objects.requireNonNull(args, "args");
        Objects.requireNonNull(at, "at");
    }

    public boolean isFormulaStep() {
        return conclusion instanceof RawFormula;
    }

    public boolean isClauseStep() {
        return conclusion instanceof RawClause;
    }
}
