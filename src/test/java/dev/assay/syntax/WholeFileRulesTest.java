package dev.assay.syntax;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.assay.syntax.grammar.AssayLexer;
import dev.assay.syntax.grammar.CertificateParser;
import dev.assay.syntax.grammar.ProblemParser;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;
import org.antlr.v4.runtime.BaseErrorListener;
import org.antlr.v4.runtime.CharStreams;
import org.antlr.v4.runtime.CommonTokenStream;
import org.antlr.v4.runtime.Parser;
import org.antlr.v4.runtime.RecognitionException;
import org.antlr.v4.runtime.Recognizer;
import org.antlr.v4.runtime.Token;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The grammars' whole-file rules (problemFile, certificateFile) state the languages that the
 * streaming readers accept statement by statement; they must agree on what is well formed.
 */
class WholeFileRulesTest {

    private static final String DIGEST = "digest \"sha256:"
            + "abababababababababababababababababababababababababababababababab\"";

    private static <P extends Parser> List<String> errors(String text, Function<CommonTokenStream, P> parser,
                                                          Function<P, Object> rule) {
        List<String> errors = new ArrayList<>();
        BaseErrorListener collect = new BaseErrorListener() {
            @Override
            public void syntaxError(Recognizer<?, ?> recognizer, Object symbol, int line, int column, String message,
                                    RecognitionException e) {
                errors.add(line + ":" + column + " " + message);
            }
        };
        AssayLexer lexer = new AssayLexer(CharStreams.fromString(text));
        lexer.removeErrorListeners();
        CommonTokenStream tokens = new CommonTokenStream(lexer);
        tokens.fill();
        for (Token token : tokens.getTokens()) {
            if (token.getType() == AssayLexer.ILLEGAL_CHARACTER || token.getType() == AssayLexer.UNTERMINATED_STRING) {
                errors.add(token.getLine() + ":" + token.getCharPositionInLine() + " bad token");
            }
        }
        P p = parser.apply(tokens);
        p.removeErrorListeners();
        p.addErrorListener(collect);
        rule.apply(p);
        return errors;
    }

    private static boolean problemRuleAccepts(String text) {
        return errors(text, ProblemParser::new, ProblemParser::problemFile).isEmpty();
    }

    private static boolean problemReaderAccepts(String text) {
        try {
            ProblemReader.readAll("t.problem", text);
            return true;
        } catch (InputError e) {
            return false;
        }
    }

    private static boolean certificateRuleAccepts(String text) {
        return errors(text, CertificateParser::new, CertificateParser::certificateFile).isEmpty();
    }

    private static boolean certificateReaderAccepts(String text) {
        try {
            CertificateReader.readAll("t.proof", text);
            return true;
        } catch (InputError e) {
            return false;
        }
    }

    @ParameterizedTest
    @ValueSource(strings = {
        "problem p\ndeclare function f/2, c/0\naxiom a: forall x. P(f(x, c))\ngoal g: exists y. P(y)",
        "problem p",
        "problem p\ngoal g: a iff (b iff c)",
        "axiom a: P",
        "problem p\naxiom a: P\nproblem q",
        "problem p\naxiom a: P )",
        "problem p\naxiom a: P\nstep s: clause P by reflexivity",
        "",
    })
    void problemReaderAgreesWithTheProblemFileRule(String text) {
        assertEquals(problemRuleAccepts(text), problemReaderAccepts(text), text);
    }

    @ParameterizedTest
    @ValueSource(strings = {
        "certificate for p\n" + DIGEST + "\nstep s: clause P by reflexivity\nforget s",
        "certificate for p\nstep s: formula forall x. P(x) by nnf a\nstep t: clause false by resolve s.1, s.2",
        "certificate for p",
        "step s: clause P by reflexivity",
        "certificate for p\nstep s: clause P by reflexivity\n" + DIGEST,
        "certificate for p\n" + DIGEST + "\n" + DIGEST,
        "certificate for p\ncertificate for q",
        "certificate for p\nstep s: clause P by paramodulate c.1 -> d.1 @ 1 {} {x := a}",
        "certificate for p\nstep s: clause P by paramodulate c.1 -> d.1 @ 1 {} {x := a} {}",
        "",
    })
    void certificateReaderAgreesWithTheCertificateFileRule(String text) {
        assertEquals(certificateRuleAccepts(text), certificateReaderAccepts(text), text);
    }
}
