package dev.assay.kernel;

/**
 * Shorthand for calling the equality rules of the kernel (FORMAT.md section 6) from tests, on top of
 * {@link RuleTestSupport}: premises are named clause facts, substitutions and clauses are written as text, and a term
 * position as {@code "1.2"}. A substitution argument of null means "not written".
 */
abstract class EqualityTestSupport extends RuleTestSupport {

    static final boolean LEFT_TO_RIGHT = true;
    static final boolean RIGHT_TO_LEFT = false;

    /** The label the next rule call gives its conclusion; see {@link #step}. */
    private String label = "s";

    /** {@code "1.2.1"} as an argument path; {@code ""} is the empty path (the atom itself). */
    static int[] position(String dotted) {
        if (dotted.isEmpty()) return new int[0];
        String[] parts = dotted.split("\\.");
        int[] out = new int[parts.length];
        for (int k = 0; k < parts.length; k++) out[k] = Integer.parseInt(parts[k]);
        return out;
    }

    Substitution subst(String text) {
        return text == null ? null : k.substitution(text);
    }

    /** {@code paramodulate A.i -> B.j @ p} ({@code arrow} is "->" or "<-") without substitutions. */
    Outcome paramodulate(String a, int i, String arrow, String b, int j, String at, String stated) {
        return paramodulate(a, i, arrow, b, j, at, null, null, stated);
    }

    /** {@code paramodulate A.i -> B.j @ p [σA] [σB]}; a null substitution is one not written. */
    Outcome paramodulate(String a, int i, String arrow, String b, int j, String at, String sa, String sb,
                         String stated) {
        boolean leftToRight = switch (arrow) {
            case "->" -> LEFT_TO_RIGHT;
            case "<-" -> RIGHT_TO_LEFT;
            default -> throw new IllegalArgumentException("arrow " + arrow);
        };
        return settled(kernel.paramodulate(label, fact(a), i, leftToRight, fact(b), j, position(at), subst(sa),
                subst(sb), k.clause(stated)));
    }

    Outcome eqres(String a, int i, String sigma, String stated) {
        return settled(kernel.eqres(label, fact(a), i, subst(sigma), k.clause(stated)));
    }

    Outcome eqfactor(String a, int i, int j, String sigma, String stated) {
        return settled(kernel.eqfactor(label, fact(a), i, j, subst(sigma), k.clause(stated)));
    }

    Outcome reflexivity(String stated) {
        return kernel.reflexivity(label, k.clause(stated));
    }

    /**
     * Runs one rule call with {@code stepLabel} as the conclusion's label, asserts that it is accepted, and keeps the
     * fact under that label as a premise for later steps of the same check.
     */
    Fact step(String stepLabel, java.util.function.Supplier<Outcome> rule) {
        label = stepLabel;
        try {
            Fact f = accepted(rule.get());
            facts.put(stepLabel, f);
            return f;
        } finally {
            label = "s";
        }
    }
}
