package dev.assay.prover;

import dev.assay.kernel.Formula;
import dev.assay.kernel.Symbol;

import java.util.List;

/**
 * A formula step of the clausifier: {@code negate} the goal, {@code nnf} or {@code skolemize} a premise,
 * {@code define} a fresh predicate, or {@code abbreviate} a premise using a definition. The premise is either an axiom
 * of the problem (by name) or an earlier formula step.
 */
final class FormulaStep implements ProofStep {

    enum Rule {
        NEGATE("negate"), NNF("nnf"), SKOLEMIZE("skolemize"), DEFINE("define"), ABBREVIATE("abbreviate");

        final String word;

        Rule(String word) {
            this.word = word;
        }
    }

    private final int sequence;
    final Rule rule;
    final Formula formula;
    /** For negate the goal's name; otherwise the axiom the step rests on, or null when {@link #premise} is set. */
    final String problemName;
    final FormulaStep premise;
    /** The define step an abbreviate step uses. */
    final FormulaStep definition;
    /** The symbols a skolemize or define step introduces, in order. */
    final List<Symbol> fresh;

    FormulaStep(int sequence, Rule rule, Formula formula, String problemName, FormulaStep premise,
                FormulaStep definition, List<Symbol> fresh) {
        this.sequence = sequence;
        this.rule = rule;
        this.formula = formula;
        this.problemName = problemName;
        this.premise = premise;
        this.definition = definition;
        this.fresh = List.copyOf(fresh);
    }

    @Override
    public int sequence() {
        return sequence;
    }
}
