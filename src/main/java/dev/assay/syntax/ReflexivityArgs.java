package dev.assay.syntax;

/** {@code reflexivity} takes no arguments. */
public record ReflexivityArgs() implements RuleArgs {

    @Override
    public String ruleName() {
        return "reflexivity";
    }
}
