package dev.assay.syntax;

/**
 * The arguments of a step's rule, one record per rule of FORMAT.md §6. A substitution that the
 * certificate does not write is null; {@code {}} is an empty, non-null one.
 */
public sealed interface RuleArgs
        permits NegateArgs, NnfArgs, SkolemizeArgs, ClausifyArgs, DefineArgs, AbbreviateArgs,
                ResolveArgs, FactorArgs, InstantiateArgs, ParamodulateArgs, EqresArgs, EqfactorArgs,
                ReflexivityArgs {

    /** The rule's keyword, as in {@code by resolve}. */
    String ruleName();
}
