package dev.assay.syntax;

import dev.assay.syntax.grammar.AssayLexer;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.antlr.v4.runtime.Token;
import org.antlr.v4.runtime.TokenSource;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The hand-written lexer yields exactly the tokens of the generated one, which is the definition. */
class FastLexerTest {

    /** Type, text, line, column and character indices of every token up to and including end of file. */
    private static List<String> tokens(String text, boolean generated) {
        ReaderCharStream chars = new ReaderCharStream("t", new StringReader(text));
        TokenSource lexer;
        if (generated) {
            AssayLexer l = new AssayLexer(chars);
            l.removeErrorListeners();
            l.setTokenFactory(new TokenTexts(chars));
            lexer = l;
        } else {
            lexer = new FastLexer(chars, new TokenTexts(chars));
        }
        List<String> out = new ArrayList<>();
        while (true) {
            Token t = lexer.nextToken();
            String shown = t.getType() == Token.EOF ? "<EOF>" : t.getText();
            out.add(t.getType() + " " + shown + " @" + t.getLine() + ":" + t.getCharPositionInLine() + " ["
                    + t.getStartIndex() + ".." + t.getStopIndex() + "] ch" + t.getChannel());
            if (t.getType() == Token.EOF) break;
        }
        out.add("end @" + lexer.getLine() + ":" + lexer.getCharPositionInLine());
        return out;
    }

    private static void same(String text) {
        assertEquals(tokens(text, true), tokens(text, false), () -> "on input: " + text);
    }

    @Test
    void everyBundledFileLexesTheSame() throws IOException {
        int n = 0;
        for (Path root : List.of(Path.of("certificates"), Path.of("src/test/resources"))) {
            try (Stream<Path> s = Files.walk(root)) {
                for (Path p : s.filter(Files::isRegularFile).filter(p -> p.toString().endsWith(".problem")
                        || p.toString().endsWith(".proof")).sorted().toList()) {
                    byte[] bytes = Files.readAllBytes(p);
                    // Files that are not UTF-8 on purpose are the readers' business, not the lexers'.
                    String text = new String(bytes, StandardCharsets.UTF_8);
                    if (!java.util.Arrays.equals(text.getBytes(StandardCharsets.UTF_8), bytes)) continue;
                    same(text);
                    n++;
                }
            }
        }
        assertTrue(n > 150, "only " + n + " files");
    }

    @Test
    void edgesOfEveryRule() {
        for (String t : List.of("", " ", "\n", "#", "# c\n", "#c\r\nx", "step", "steps", "step1", "_", "_step", "Step",
                "forall", "forallx", "∀x.", "∀∃¬∧∨→↔⊤⊥≠↦", "0", "007", "12ab", "a12", "\"", "\"abc", "\"abc\"", "\"a\"b\"",
                "\"abc\ndef\"", "\"a\rb", ":", ":=", "::=", ":==", "!", "!=", "!!=", "-", "->", "-->", "<", "<-", "<<-",
                "<->", "=", "==", "@", "/", "[]{}(),.", "\t\f\uFEFF x", "x\u00a0y", "é", "x😀y", "\u0000", "a\rb\nc",
                "digest \"sha256:ab\"", "A.0 A.99999999999", "p(x) != q", "{x := f(y)}", "@ 1.2.3",
                "negate nnf skolemize clausify define abbreviate resolve factor instantiate paramodulate eqres"
                        + " eqfactor reflexivity fresh using forget problem declare function predicate axiom goal"
                        + " certificate for digest formula clause by true false iff implies or and not exists")) {
            same(t);
        }
    }

    @Provide
    Arbitrary<String> texts() {
        // Characters that start or continue some token, and some that start none.
        Arbitrary<Character> c = Arbitraries.of('a', 'z', 'Q', '_', '0', '9', ' ', '\t', '\n', '\r', '#', '"', ':', '=',
                '!', '-', '>', '<', '(', ')', ',', '.', '[', ']', '{', '}', '@', '/', '∀', '¬', '≠', '↦', 'é', '\f',
                '\uFEFF', '$', '%');
        Arbitrary<String> words = Arbitraries.of("step", "forall", "not", "or", "resolve", "formula", "clause", "by",
                ":=", "->", "<-", "!=", "# note", "\"s\"", "x1", "12");
        return Arbitraries.oneOf(c.map(String::valueOf), words).list().ofMaxSize(60)
                .map(parts -> String.join("", parts));
    }

    @Property(tries = 3000, seed = "3")
    void randomTextLexesTheSame(@ForAll("texts") String text) {
        same(text);
    }
}
