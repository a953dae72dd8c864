package dev.assay.syntax;

/** What a step states: a formula ({@code step s: formula ...}) or a clause ({@code step s: clause ...}). */
public sealed interface RawConclusion permits RawFormula, RawClause {

    Location at();
}
