package dev.assay.syntax;

import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;

/** Shortcuts for tests: parse one formula, clause or step, or the error a text gives. */
final class Parse {

    static final String PROBLEM_FILE = "t.problem";
    static final String PROOF_FILE = "t.proof";

    private Parse() {
    }

    /** The formula of {@code axiom a: TEXT}; the text starts at line 2, column 10. */
    static RawFormula formula(String text) throws InputError {
        List<ProblemStatement> statements = ProblemReader.readAll(PROBLEM_FILE, "problem t\naxiom a: " + text);
        return ((Axiom) statements.get(1)).formula();
    }

    static String showFormula(String text) throws InputError {
        return Show.formula(formula(text));
    }

    /** The one step of a certificate {@code certificate for t / step TEXT}; the step starts at line 2, column 1. */
    static Step step(String text) throws InputError {
        List<CertificateStatement> statements = CertificateReader.readAll(PROOF_FILE, "certificate for t\nstep " + text);
        return (Step) statements.get(1);
    }

    static String showStep(String text) throws InputError {
        return Show.step(step(text));
    }

    static InputError problemError(String text) {
        return assertThrows(InputError.class, () -> ProblemReader.readAll(PROBLEM_FILE, text));
    }

    static InputError certificateError(String text) {
        return assertThrows(InputError.class, () -> CertificateReader.readAll(PROOF_FILE, text));
    }

    /** The error of {@code axiom a: TEXT}, whose text starts at line 2, column 10. */
    static InputError formulaError(String text) {
        return problemError("problem t\naxiom a: " + text);
    }
}
