package dev.assay.prover;

import dev.assay.kernel.Problem;
import dev.assay.kernel.Signature;

import java.util.HashSet;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * Chooses the names the prover writes: bound and clause variables, Skolem functions, defined predicates and step
 * labels. Symbol names and variable names are kept apart across the whole certificate (a clause bracket cannot list a
 * name that is also a symbol it uses), and no name is a reserved word of the languages.
 */
final class Names {

    /** Reserved words of both languages (docs/format.md section 1). */
    static final Set<String> RESERVED = Set.of("problem", "declare", "function", "predicate", "axiom", "goal",
            "certificate", "for", "digest", "step", "formula", "clause", "by", "fresh", "using", "forget", "forall",
            "exists", "not", "and", "or", "implies", "iff", "true", "false", "negate", "nnf", "skolemize", "clausify",
            "define", "abbreviate", "resolve", "factor", "instantiate", "paramodulate", "eqres", "eqfactor",
            "reflexivity");

    private static final Pattern IDENTIFIER = Pattern.compile("[A-Za-z_][A-Za-z0-9_]*");

    private final Set<String> symbols = new HashSet<>();
    private final Set<String> variables = new HashSet<>();
    private final Set<String> problemNames = new HashSet<>();

    Names(Problem problem) {
        for (Signature.Entry e : problem.signature().entries()) symbols.add(e.symbol().name());
        problemNames.addAll(problem.axioms().keySet());
        if (problem.goalName() != null) problemNames.add(problem.goalName());
    }

    static boolean isIdentifier(String name) {
        return IDENTIFIER.matcher(name).matches() && !RESERVED.contains(name);
    }

    boolean isSymbol(String name) {
        return symbols.contains(name);
    }

    /** A name for a new symbol: {@code base} followed by the first number that is free. */
    String freshSymbol(String base) {
        for (int k = 1; ; k++) {
            String candidate = base + k;
            if (!symbols.contains(candidate) && !variables.contains(candidate) && isIdentifier(candidate)) {
                symbols.add(candidate);
                return candidate;
            }
        }
    }

    /**
     * A variable name based on {@code original}: the name itself when it is an identifier, no symbol's name and not in
     * {@code taken}; otherwise its stem followed by the first free number.
     */
    String variable(String original, Set<String> taken) {
        String name = original;
        if (!isIdentifier(name) || symbols.contains(name) || taken.contains(name)) {
            String stem = original.replaceAll("[0-9]+$", "");
            if (!IDENTIFIER.matcher(stem).matches()) stem = "x";
            for (int k = 1; ; k++) {
                name = stem + k;
                if (isIdentifier(name) && !symbols.contains(name) && !taken.contains(name)) break;
            }
        }
        variables.add(name);
        return name;
    }

    /** A prefix P such that no symbol is named P followed by digits: the stem of the prover's clause variables. */
    String variablePrefix() {
        for (String p : new String[] {"X", "Y", "Z", "V", "W", "U", "X_", "Y_", "Z_"}) {
            if (free(p)) return p;
        }
        for (int k = 1; ; k++) if (free("X" + "_".repeat(k + 1))) return "X" + "_".repeat(k + 1);
    }

    private boolean free(String prefix) {
        Pattern p = Pattern.compile(Pattern.quote(prefix) + "[0-9]+");
        for (String s : symbols) if (p.matcher(s).matches()) return false;
        return true;
    }

    /** A prefix for step labels that no axiom or goal name continues with digits. */
    String labelPrefix(String preferred) {
        String p = preferred;
        while (true) {
            Pattern pattern = Pattern.compile(Pattern.quote(p) + "[0-9]+");
            boolean clash = false;
            for (String n : problemNames) if (pattern.matcher(n).matches()) clash = true;
            if (!clash) return p;
            p = p + "_";
        }
    }
}
