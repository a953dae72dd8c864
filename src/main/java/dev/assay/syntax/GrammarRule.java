package dev.assay.syntax;

import java.util.Locale;

/**
 * The rules of the grammars, by name. ProblemParser and CertificateParser each get their own copy
 * of the imported Logic rules, with their own rule numbers and context classes, so the code that
 * turns parse trees into raw syntax goes by rule name, through this table, and serves both.
 */
enum GrammarRule {
    // Logic.g4
    TERM, ATOM, FORMULA, IMPLIES_FORMULA, OR_FORMULA, AND_FORMULA, UNARY_FORMULA, QUANTIFIER,
    PRIMARY_FORMULA, CLAUSE, VARIABLE_LIST, LITERAL, SUBSTITUTION, BINDING, LITERAL_REF, TERM_POSITION,
    // ProblemParser.g4
    PROBLEM_FILE, NEXT_PROBLEM_STATEMENT, PROBLEM_STATEMENT_IN_CONTEXT, PROBLEM_STATEMENT, PROBLEM_HEADER,
    DECLARATION, SYMBOL_ARITY, AXIOM, GOAL,
    // CertificateParser.g4
    CERTIFICATE_FILE, NEXT_CERTIFICATE_STATEMENT, CERTIFICATE_STATEMENT_IN_CONTEXT, CERTIFICATE_STATEMENT,
    CERTIFICATE_HEADER, DIGEST, FORGET, STEP, CONCLUSION, INFERENCE, NEGATE, NNF, SKOLEMIZE, CLAUSIFY,
    DEFINE, ABBREVIATE, RESOLVE, FACTOR, INSTANTIATE, PARAMODULATE, EQRES, EQFACTOR, REFLEXIVITY;

    /** The table from a parser's rule numbers to these names; fails if the two have drifted apart. */
    static GrammarRule[] tableFor(String[] names) {
        GrammarRule[] table = new GrammarRule[names.length];
        for (int i = 0; i < names.length; i++) {
            table[i] = valueOf(names[i].replaceAll("([a-z0-9])([A-Z])", "$1_$2").toUpperCase(Locale.ROOT));
        }
        return table;
    }
}
