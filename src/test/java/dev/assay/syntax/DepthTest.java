package dev.assay.syntax;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Deep nesting gives the right tree or a clear InputError that names the limit, never a
 * StackOverflowError. The readers recurse (ANTLR parsers are recursive descent), so inputs this
 * deep are read on a big stack, as the command line does ({@link BigStack}).
 */
class DepthTest {

    private static final int LEVELS = 100_000;

    private static String problem(String formula) {
        return "problem deep\naxiom a: " + formula + "\n";
    }

    private static RawFormula readAxiom(String text, int maxDepth) throws Exception {
        return BigStack.run(() -> {
            ProblemReader reader = new ProblemReader("deep.problem", new StringReader(text), maxDepth);
            reader.next();
            RawFormula formula = ((Axiom) reader.next()).formula();
            assertEquals(null, reader.next());
            return formula;
        });
    }

    @Test
    void aHundredThousandParenthesesAreRead() throws Exception {
        RawFormula formula = readAxiom(problem("(".repeat(LEVELS) + "P(x)" + ")".repeat(LEVELS)),
                ProblemReader.DEFAULT_MAX_DEPTH);
        assertEquals("P(x)", Show.formula(formula));
    }

    @Test
    void aHundredThousandNotsAreRead() throws Exception {
        RawFormula formula = readAxiom(problem("not ".repeat(LEVELS) + "P"), ProblemReader.DEFAULT_MAX_DEPTH);
        int nots = 0;
        while (formula instanceof RawNot not) {
            nots++;
            formula = not.body();
        }
        assertEquals(LEVELS, nots);
        assertEquals("P", Show.formula(formula));
    }

    @Test
    void aHundredThousandNestedApplicationsAreRead() throws Exception {
        RawFormula formula = readAxiom(problem("P(" + "f(".repeat(LEVELS) + "c" + ")".repeat(LEVELS + 1)),
                ProblemReader.DEFAULT_MAX_DEPTH);
        RawTerm term = ((RawPredicateAtom) ((RawAtom) formula).atom()).term().args().get(0);
        int depth = 0;
        while (!term.args().isEmpty()) {
            assertEquals("f", term.name());
            depth++;
            term = term.args().get(0);
        }
        assertEquals(LEVELS, depth);
        assertEquals("c", term.name());
    }

    @Test
    void aHundredThousandNestedQuantifiersAreRead() throws Exception {
        // 99,999 quantifiers and the conjunction of their body: 100,000 levels.
        StringBuilder text = new StringBuilder();
        for (int i = 0; i < LEVELS - 1; i++) {
            text.append("forall x").append(i % 7).append(". ");
        }
        RawFormula formula = readAxiom(problem(text + "P(x0) and Q"), ProblemReader.DEFAULT_MAX_DEPTH);
        int quantifiers = 0;
        while (formula instanceof RawQuantified q) {
            quantifiers++;
            formula = q.body();
        }
        assertEquals(LEVELS - 1, quantifiers);
        assertEquals("(and P(x0) Q)", Show.formula(formula));
    }

    @Test
    void aHundredThousandNestedTermsInAClauseAreRead() throws Exception {
        String text = "certificate for deep\nstep c: clause [x] P(" + "f(".repeat(LEVELS) + "x" + ")".repeat(LEVELS + 1)
                + " by reflexivity\n";
        List<CertificateStatement> statements = BigStack.run(() -> CertificateReader.readAll("deep.proof", text));
        RawClause clause = (RawClause) ((Step) statements.get(1)).conclusion();
        RawTerm term = ((RawPredicateAtom) clause.literals().get(0).atom()).term();
        int depth = 0;
        while (!term.args().isEmpty()) {
            depth++;
            term = term.args().get(0);
        }
        assertEquals(LEVELS + 1, depth);
    }

    @Test
    void theLimitIsReportedWhereItIsExceeded() {
        // Each parenthesis, `not` and quantifier opens a level, and so does each function
        // application in an atom's arguments: `((not P(f(c))))` is 2 + 1 + 1 = 4 levels deep.
        InputError error = assertThrows(InputError.class, () -> readAxiom(problem("((not P(f(c))))"), 3));
        assertEquals("deep.problem:2:18: nesting depth exceeds the limit of 3 (raise it with --max-depth)",
                error.getMessage());
        assertEquals("(not P(f(c)))", assertDoesNotThrowShow(problem("((not P(f(c))))"), 4));
        assertEquals("deep.problem:2:11: nesting depth exceeds the limit of 1 (raise it with --max-depth)",
                assertThrows(InputError.class, () -> readAxiom(problem("((P))"), 1)).getMessage());
    }

    private static String assertDoesNotThrowShow(String text, int maxDepth) {
        try {
            return Show.formula(readAxiom(text, maxDepth));
        } catch (Exception e) {
            throw new AssertionError(e);
        }
    }

    @Test
    void theLimitAppliesToEachKindOfNesting() {
        String[][] justDeepEnoughAndTooDeep = {
            {"not ".repeat(1_000) + "P", "not ".repeat(1_001) + "P"},
            {"(".repeat(1_000) + "P" + ")".repeat(1_000), "(".repeat(1_001) + "P" + ")".repeat(1_001)},
            {"P(" + "f(".repeat(1_000) + "c" + ")".repeat(1_001), "P(" + "f(".repeat(1_001) + "c" + ")".repeat(1_002)},
            {"forall x. ".repeat(1_000) + "P", "forall x. ".repeat(1_001) + "P"},
        };
        for (String[] pair : justDeepEnoughAndTooDeep) {
            assertDoesNotThrowShow(problem(pair[0]), 1_000);
            InputError error = assertThrows(InputError.class, () -> readAxiom(problem(pair[1]), 1_000));
            assertTrue(error.reason().equals("nesting depth exceeds the limit of 1000 (raise it with --max-depth)"),
                    error.getMessage());
        }
    }

    @Test
    void theLimitAlsoBoundsTreesDeeperThanTheirParse() {
        // A chain of implications, or of quantifiers each in the last operand of the one before,
        // is flat to the parser but nests in the syntax tree; later layers walk that tree.
        String implications = "P implies ".repeat(1_001) + "P";
        String quantifiers = "forall x. P(x) and ".repeat(1_001) + "Q";
        for (String formula : new String[] {implications, quantifiers}) {
            InputError error = assertThrows(InputError.class, () -> readAxiom(problem(formula), 1_000));
            assertTrue(error.reason().startsWith("nesting depth exceeds the limit of 1000"), error.getMessage());
        }
    }

    @Test
    void theDirectParserDoesNotRecurse() throws Exception {
        // On a thread with a small stack and no effective limit, the direct parser reads what would exhaust the stack
        // of the generated one (next test).
        String text = problem("(".repeat(LEVELS) + "not P(" + "f(".repeat(LEVELS) + "c" + ")".repeat(LEVELS + 1)
                + ")".repeat(LEVELS));
        ProblemStatement axiom = BigStack.run(() -> {
            ProblemReader reader = new ProblemReader("deep.problem", new StringReader(text), Integer.MAX_VALUE);
            reader.next();
            return reader.next();
        }, 256 * 1024);
        assertInstanceOf(RawNot.class, ((Axiom) axiom).formula());
    }

    @Test
    void aStackOverflowBecomesAnInputError() {
        // A thread with a small stack and no effective limit: the generated parser runs out of stack. The stray
        // parenthesis at the end makes the direct parser hand the statement over to it.
        String text = problem("(".repeat(LEVELS) + "P" + ")".repeat(LEVELS) + " )");
        InputError error = assertThrows(InputError.class, () -> BigStack.run(() -> {
            ProblemReader reader = new ProblemReader("deep.problem", new StringReader(text), Integer.MAX_VALUE);
            reader.next();
            try {
                return reader.next();
            } catch (InputError e) {
                // The reader stays failed: it reports the same error again.
                assertEquals(e.getMessage(), assertThrows(InputError.class, reader::next).getMessage());
                throw e;
            }
        }, 256 * 1024));
        assertTrue(error.reason().startsWith("nesting depth exceeds the parser's stack at depth "), error.getMessage());
        assertTrue(error.reason().contains("the limit is 2147483647"), error.getMessage());
        assertEquals(2, error.at().line());
    }

    @Test
    void theDefaultLimitIsSafeOnTheBigStack() throws Exception {
        // Measured: on the 1 GiB stack of BigStack the parser reads a million levels of each
        // kind, so the default limit of 100,000 has a margin of ten. Parentheses and quantifiers
        // cost the parser most stack (six rule frames a level); twice the default still reads.
        assertEquals(100_000, ProblemReader.DEFAULT_MAX_DEPTH);
        int twice = 2 * ProblemReader.DEFAULT_MAX_DEPTH;
        RawFormula formula = readAxiom(problem("(".repeat(twice) + "P" + ")".repeat(twice)), twice);
        assertInstanceOf(RawAtom.class, formula);
    }

    @Test
    void bigStackRethrowsWhatTheTaskThrows() {
        InputError error = new InputError(new Location("f", 1, 1), "no");
        assertEquals(error, assertThrows(InputError.class, () -> BigStack.run(() -> {
            throw error;
        })));
        AssertionError bug = new AssertionError("bug");
        assertEquals(bug, assertThrows(AssertionError.class, () -> BigStack.run(() -> {
            throw bug;
        })));
    }
}
