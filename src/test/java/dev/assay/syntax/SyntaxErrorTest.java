package dev.assay.syntax;

import static dev.assay.syntax.Parse.certificateError;
import static dev.assay.syntax.Parse.formulaError;
import static dev.assay.syntax.Parse.problemError;
import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

/**
 * Each kind of input error: where it is reported (file:line:column of the offending token) and
 * what it says (what was found, what was expected, in plain words).
 */
class SyntaxErrorTest {

    /** Errors in {@code certificate for t / step TEXT}; the step is on line 2. */
    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            s formula P by nnf a                  | 2:8: expected ':' after the step label, found 'formula'
            s: P by nnf a                         | 2:9: expected 'formula' or 'clause', found 'P'
            s: formula P(x or Q by nnf a          | 2:21: expected ',' or ')', found 'or'
            s: formula P ) by nnf a               | 2:19: expected '(', '=', '!=', 'and', 'or', 'implies', 'iff' or 'by', found ')'
            s: formula P and ) by nnf a           | 2:23: expected a formula, found ')'
            s: formula forall x. P and ) by nnf a | 2:33: expected a formula, found ')'
            s: formula (P by nnf a                | 2:20: expected '(', ')', '=', '!=', 'and', 'or', 'implies' or 'iff', found 'by'
            s: formula forall . P by nnf a        | 2:24: expected a name, found '.'
            s: formula forall x P by nnf a        | 2:28: expected a name or '.', found 'by', which is a reserved word
            s: formula not by nnf a               | 2:21: expected a formula, found 'by'
            s: formula P by                       | 2:21: expected a rule name after 'by', found end of file
            s: formula P by resolv c1.1, c2.1     | 2:22: expected a rule name after 'by', found 'resolv'
            s: formula P by nnf a extra           | 2:28: expected 'certificate', 'digest', 'step', 'forget' or end of file, found 'extra'
            s: clause P by nnf                    | 2:24: expected a name after 'nnf', found end of file
            s: clause not not P by nnf a          | 2:20: expected an atom, found 'not'
            s: clause (P or Q) by nnf a           | 2:16: expected a clause after 'clause', found '('
            s: clause [x] false by nnf a          | 2:20: expected a literal, found 'false'
            s: clause [] P by nnf a               | 2:17: expected a name, found ']'
            s: clause P or by nnf a               | 2:21: expected a literal, found 'by'
            s: clause P = by nnf a                | 2:20: expected a term, found 'by'
            s: clause P by resolve c1.1 c2.1      | 2:34: expected ',' or '{', found 'c2'
            s: clause P by resolve c1, c2.1       | 2:31: expected '.', found ','
            s: clause P by resolve c1.x, c2.1     | 2:32: expected a number, found 'x'
            s: clause P by resolve c1.1 {x = a}, c2.1 | 2:37: expected ':=', found '='
            s: clause P by resolve c1.1 {x := }, c2.1 | 2:40: expected a term, found '}'
            s: clause P by instantiate c1         | 2:35: expected '{', found end of file
            s: clause P by paramodulate c1.1 => c2.1 @ 1 | 2:39: expected '->' or '<-', found '='
            s: clause P by paramodulate c1.1 -> c2.1 1   | 2:47: expected '@', found '1'
            s: clause P by paramodulate c1.1 -> c2.1 @ x | 2:49: expected a number, found 'x'
            s: clause P by define Q               | 2:28: expected 'fresh' after 'define', found 'Q'
            s: clause P by abbreviate a d         | 2:34: expected 'using', found 'd'
            s: formula P by skolemize a fresh     | 2:39: expected a name after 'fresh', found end of file
            s: formula P by reflexivity c1        | 2:34: expected 'certificate', 'digest', 'step', 'forget' or end of file after 'reflexivity', found 'c1'
            """)
    void stepErrors(String step, String expected) {
        assertEquals("t.proof:" + expected, certificateError("certificate for t\nstep " + step).getMessage());
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            problem p\\naxiom : P                | 2:7: expected a name, found ':'
            problem p\\naxiom a P                | 2:9: expected ':' after the axiom's name, found 'P'
            problem p\\ngoal g P                 | 2:8: expected ':' after the goal's name, found 'P'
            problem p\\ndeclare function f/2, c  | 2:24: expected '/', found end of file
            problem p\\ndeclare func f/2         | 2:9: expected 'function' or 'predicate', found 'func'
            problem p\\ndeclare function f/x     | 2:20: expected a number, found 'x'
            problem p\\ndeclare function f       | 2:19: expected '/', found end of file
            problem p\\naxiom a: P )             | 2:12: expected '(', '=', '!=', 'and', 'or', 'implies', 'iff', the next statement or end of file, found ')'
            problem p\\naxiom a: P(x) =          | 2:16: expected a term, found end of file
            problem\\naxiom a: P                 | 2:1: expected a name, found 'axiom', which is a reserved word
            problem p q                         | 1:11: expected 'problem', 'declare', 'axiom', 'goal' or end of file, found 'q'
            """)
    void problemErrors(String text, String expected) {
        assertEquals("t.problem:" + expected, problemError(text.replace("\\n", "\n")).getMessage());
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            'step and: clause P by reflexivity'              | 2:6: 'and' is a reserved word and cannot be a symbol, variable or label
            'step s: clause P(resolve) by reflexivity'       | 2:18: 'resolve' is a reserved word and cannot be a symbol, variable or label
            'step s: formula resolve(x) by nnf a'            | 2:17: 'resolve' is a reserved word and cannot be a symbol, variable or label
            'step s: formula fresh by nnf a'                 | 2:17: 'fresh' is a reserved word and cannot be a symbol, variable or label
            'step s: formula step(x) by nnf a'               | 2:17: 'step' is a reserved word and cannot be a symbol, variable or label
            'step s: clause P by nnf by'                     | 2:25: expected a name after 'nnf', found 'by', which is a reserved word
            'step s: formula forall step. P by nnf a'        | 2:24: expected a name, found 'step', which is a reserved word
            'step s: formula forall or. P by nnf a'          | 2:24: 'or' is a reserved word and cannot be a symbol, variable or label
            'step s: clause P by skolemize a fresh goal'     | 2:39: expected a name after 'fresh', found 'goal', which is a reserved word
            'step s: clause P by instantiate c {problem := a}' | 2:36: expected a name or '}', found 'problem', which is a reserved word
            'forget c1, reflexivity'                         | 2:12: 'reflexivity' is a reserved word and cannot be a symbol, variable or label
            """)
    void reservedWordsAreNotNames(String statement, String expected) {
        assertEquals("t.proof:" + expected, certificateError("certificate for t\n" + statement).getMessage());
    }

    @Test
    void everyRuleNameIsReserved() {
        for (String rule : new String[] {"negate", "nnf", "skolemize", "clausify", "define", "abbreviate", "resolve",
                "factor", "instantiate", "paramodulate", "eqres", "eqfactor", "reflexivity"}) {
            assertEquals("t.problem:2:10: '" + rule + "' is a reserved word and cannot be a symbol, variable or label",
                    formulaError(rule + "(x)").getMessage());
            assertEquals("t.problem:1:9: '" + rule + "' is a reserved word and cannot be a symbol, variable or label",
                    problemError("problem " + rule).getMessage());
        }
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            'step s: clause P by resolve c1.0, c2.1'          | 2:32: literal indices count from 1, found 0
            'step s: clause P by eqres c1.00'                 | 2:30: literal indices count from 1, found 0
            'step s: clause P by paramodulate c1.1 -> c2.1 @ 1.0.2' | 2:51: term positions count from 1, found 0
            'step s: clause P by resolve c1.99999999999, c2.1' | 2:32: the number 99999999999 is too large
            'step s: clause P by resolve c1.2147483648, c2.1'  | 2:32: the number 2147483648 is too large
            """)
    void numbersAreCheckedWhereFormatRestrictsThem(String statement, String expected) {
        assertEquals("t.proof:" + expected, certificateError("certificate for t\n" + statement).getMessage());
    }

    @Test
    void arityZeroIsAllowedAndLeadingZerosAreJustDigits() throws InputError {
        Declaration d = (Declaration) ProblemReader.readAll("t.problem", "problem t\ndeclare function c/0, f/02").get(1);
        assertEquals(0, d.symbols().get(0).arity());
        assertEquals(2, d.symbols().get(1).arity());
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', quoteCharacter = '"', textBlock = """
            P $ Q          | 2:12: illegal character '$' (U+0024)
            P & Q          | 2:12: illegal character '&' (U+0026) (write 'and' or '∧')
            ~P             | 2:10: illegal character '~' (U+007E) (write 'not' or '¬')
            P(x) -> Q(x)   | 2:15: expected '=', '!=', 'and', 'or', 'implies', 'iff', the next statement or end of file, found '->' (in a formula, write 'implies' or '→')
            P ∧ é          | 2:14: illegal character 'é' (U+00E9)
            P ∧ 😀         | 2:14: illegal character '😀' (U+1F600)
            P - Q          | 2:12: illegal character '-' (U+002D) (write '->' in paramodulate, 'implies' in a formula)
            P;             | 2:11: illegal character ';' (U+003B) (statements need no terminator)
            """)
    void illegalCharactersAreReportedWhereTheyAre(String formula, String expected) {
        assertEquals("t.problem:" + expected, formulaError(formula).getMessage());
    }

    @Test
    void aVerticalBarIsNotOr() {
        assertEquals("t.problem:2:12: illegal character '|' (U+007C) (write 'or' or '\u2228')",
                formulaError("P | Q").getMessage());
    }

    @Test
    void controlCharactersAreShownByTheirCodePoint() {
        assertEquals("t.problem:2:14: illegal character U+0007", formulaError("P \u2227 \u0007").getMessage());
    }

    @Test
    void theFirstErrorInTheFileIsTheOneReported() {
        // A syntax error before an illegal character: the syntax error is first in the file.
        assertEquals("t.problem:2:16: expected a formula, found ')'", formulaError("P and ) $").getMessage());
    }

    @Test
    void errorsAtTheEndOfTheFileAreAtItsLastPosition() {
        assertEquals("t.problem:4:1: expected a formula, found end of file",
                problemError("problem t\naxiom a: P implies\n# a comment\n").getMessage());
    }

    @Test
    void windowsLineEndingsAndTabsKeepLinesAndColumns() {
        // A tab counts as one column, like any character.
        assertEquals("t.problem:3:3: expected a formula, found ')'",
                problemError("problem t\r\naxiom a:\r\n\t )").getMessage());
    }
}
