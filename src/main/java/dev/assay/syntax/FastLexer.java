package dev.assay.syntax;

import dev.assay.syntax.grammar.AssayLexer;
import java.util.HashMap;
import java.util.Map;
import org.antlr.v4.runtime.CharStream;
import org.antlr.v4.runtime.IntStream;
import org.antlr.v4.runtime.Token;
import org.antlr.v4.runtime.TokenFactory;
import org.antlr.v4.runtime.TokenSource;
import org.antlr.v4.runtime.misc.Pair;

/**
 * The tokens of {@code grammar/AssayLexer.g4}, made by hand-written code instead of ANTLR's lexer
 * simulation, which cost more than half of the time of parsing. It yields exactly what the
 * generated {@link AssayLexer} yields on the same characters: the same types, texts, lines,
 * columns and character indices, with whitespace and comments skipped. {@code FastLexerTest}
 * compares the two token by token on every bundled file and on random text; the generated lexer
 * stays the definition.
 *
 * <p>The lexer grammar's rules, and how each is decided here (ANTLR takes the longest match, and
 * the first rule among equally long ones):
 * <ul>
 * <li>a name {@code [A-Za-z_][A-Za-z0-9_]*} is a keyword when it is spelled exactly as one, else
 *     {@code IDENT};</li>
 * <li>{@code [0-9]+} is {@code INT};</li>
 * <li>{@code "} up to the next {@code "} on the line is {@code STRING}; without one, up to the end
 *     of the line it is {@code UNTERMINATED_STRING};</li>
 * <li>{@code :=}, {@code !=}, {@code ->}, {@code <-} are taken before {@code :} and single
 *     characters; a lone {@code !}, {@code -} or {@code <} is {@code ILLEGAL_CHARACTER};</li>
 * <li>the Unicode spellings ∀ ∃ ¬ ∧ ∨ → ↔ ⊤ ⊥ ≠ ↦ are single characters;</li>
 * <li>{@code [ \t\r\n\f\uFEFF]+} and {@code #} to the end of the line are skipped;</li>
 * <li>any other character is {@code ILLEGAL_CHARACTER}.</li>
 * </ul>
 */
final class FastLexer implements TokenSource {

    /** Keywords by spelling, with their token types; also used by {@link DirectParser}. */
    static final Map<String, Integer> KEYWORDS = new HashMap<>();
    /** The token type of each one-character token (punctuation and the Unicode spellings), else 0. */
    static final int[] SINGLE = new int[0x2300];

    static {
        for (int type = 1; type <= AssayLexer.VOCABULARY.getMaxTokenType(); type++) {
            String literal = AssayLexer.VOCABULARY.getLiteralName(type);
            if (literal == null) continue;
            String text = literal.substring(1, literal.length() - 1);
            if (Character.isLetter(text.charAt(0))) KEYWORDS.put(text, type);
        }
        for (String w : new String[] {"forall", "exists", "not", "and", "or", "implies", "iff", "true", "false"}) {
            KEYWORDS.put(w, typeOf(w.toUpperCase()));
        }
        for (String keyword : KEYWORDS.keySet()) {
            // nameType looks a name up only when it could be a keyword: two or more of the letters a to z.
            if (!keyword.matches("[a-z][a-z]+")) throw new IllegalStateException("a keyword of another shape: " + keyword);
        }
        SINGLE['('] = AssayLexer.LPAREN;
        SINGLE[','] = AssayLexer.COMMA;
        SINGLE[')'] = AssayLexer.RPAREN;
        SINGLE['.'] = AssayLexer.DOT;
        SINGLE['='] = AssayLexer.EQ;
        SINGLE['['] = AssayLexer.LBRACKET;
        SINGLE[']'] = AssayLexer.RBRACKET;
        SINGLE['{'] = AssayLexer.LBRACE;
        SINGLE['}'] = AssayLexer.RBRACE;
        SINGLE['@'] = AssayLexer.AT;
        SINGLE['/'] = AssayLexer.SLASH;
        SINGLE['\u2200'] = AssayLexer.FORALL;
        SINGLE['\u2203'] = AssayLexer.EXISTS;
        SINGLE['\u00ac'] = AssayLexer.NOT;
        SINGLE['\u2227'] = AssayLexer.AND;
        SINGLE['\u2228'] = AssayLexer.OR;
        SINGLE['\u2192'] = AssayLexer.IMPLIES;
        SINGLE['\u2194'] = AssayLexer.IFF;
        SINGLE['\u22a4'] = AssayLexer.TRUE;
        SINGLE['\u22a5'] = AssayLexer.FALSE;
        SINGLE['\u2260'] = AssayLexer.NEQ;
        SINGLE['\u21a6'] = AssayLexer.ASSIGN;
    }

    /** The token type of a name: its keyword's, or IDENT. Only names of two or more letters a to z can be keywords. */
    static int nameType(String name, boolean lowerCase) {
        Integer keyword = lowerCase && name.length() > 1 ? KEYWORDS.get(name) : null;
        return keyword == null ? AssayLexer.IDENT : keyword;
    }

    private static int typeOf(String symbolic) {
        for (int type = 1; type <= AssayLexer.VOCABULARY.getMaxTokenType(); type++) {
            if (symbolic.equals(AssayLexer.VOCABULARY.getSymbolicName(type))) return type;
        }
        throw new IllegalStateException("no token " + symbolic);
    }

    private final ReaderCharStream in;
    private final Pair<TokenSource, CharStream> source;
    private TokenFactory<?> factory;
    private int line = 1;
    private int column;
    /** The text of the name just scanned. */
    private String name;

    FastLexer(ReaderCharStream in, TokenFactory<?> factory) {
        this(in, factory, 1, 0);
    }

    /** A lexer that starts where {@code in} stands, which is at {@code line} and {@code column} (from 0) of the file. */
    FastLexer(ReaderCharStream in, TokenFactory<?> factory, int line, int column) {
        this.in = in;
        this.factory = factory;
        this.source = new Pair<>(this, in);
        this.line = line;
        this.column = column;
    }

    @Override
    public Token nextToken() {
        int marker = in.mark();
        try {
            while (true) {
                int start = in.index();
                int startLine = line;
                int startColumn = column;
                int c = in.LA(1);
                if (c == IntStream.EOF) {
                    return factory.create(source, Token.EOF, null, Token.DEFAULT_CHANNEL, start, start - 1, line, column);
                }
                name = null;
                int type = scan(c);
                if (type == 0) continue; // whitespace or a comment
                // A name's text was made to tell it from a keyword; the factory need not make it again.
                return factory.create(source, type, type == AssayLexer.IDENT ? name : null, Token.DEFAULT_CHANNEL,
                        start, in.index() - 1, startLine, startColumn);
            }
        } finally {
            in.release(marker);
        }
    }

    /** Consumes one token starting with {@code c}; its type, or 0 for skipped text. */
    private int scan(int c) {
        if (isSpace(c)) {
            do {
                consume(c);
                c = in.LA(1);
            } while (isSpace(c));
            return 0;
        }
        if (c == '#') {
            do {
                consume(c);
                c = in.LA(1);
            } while (c != IntStream.EOF && c != '\r' && c != '\n');
            return 0;
        }
        if (isNameStart(c)) {
            name = in.consumeName(); // a name has no line break: only the column moves
            column += name.length();
            return in.nameType;
        }
        if (c >= '0' && c <= '9') {
            do {
                consume(c);
                c = in.LA(1);
            } while (c >= '0' && c <= '9');
            return AssayLexer.INT;
        }
        if (c == '"') {
            consume(c);
            while (true) {
                c = in.LA(1);
                if (c == IntStream.EOF || c == '\r' || c == '\n') return AssayLexer.UNTERMINATED_STRING;
                consume(c);
                if (c == '"') return AssayLexer.STRING;
            }
        }
        int pair = pairType(c, in.LA(2));
        if (pair > 0) {
            consume(c);
            if (pair != AssayLexer.COLON) consume(in.LA(1));
            return pair;
        }
        consume(c);
        if (pair == 0) return AssayLexer.ILLEGAL_CHARACTER;
        int single = c < SINGLE.length ? SINGLE[c] : 0;
        return single != 0 ? single : AssayLexer.ILLEGAL_CHARACTER;
    }

    /**
     * For a character {@code c} followed by {@code next}: the type of the two-character token they make ({@code :=},
     * {@code !=}, {@code ->}, {@code <-}), COLON for a lone {@code :}, 0 for a lone {@code !}, {@code -} or {@code <}
     * (an illegal character), and -1 when {@code c} starts no such token.
     */
    static int pairType(int c, int next) {
        return switch (c) {
            case ':' -> next == '=' ? AssayLexer.ASSIGN : AssayLexer.COLON;
            case '!' -> next == '=' ? AssayLexer.NEQ : 0;
            case '-' -> next == '>' ? AssayLexer.RIGHT_ARROW : 0;
            case '<' -> next == '-' ? AssayLexer.LEFT_ARROW : 0;
            default -> -1;
        };
    }

    private void consume(int c) {
        in.consume();
        if (c == '\n') {
            line++;
            column = 0;
        } else {
            column++;
        }
    }

    private static boolean isSpace(int c) {
        return c == ' ' || c == '\t' || c == '\r' || c == '\n' || c == '\f' || c == '\uFEFF';
    }

    private static boolean isNameStart(int c) {
        return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || c == '_';
    }

    @Override
    public int getLine() {
        return line;
    }

    @Override
    public int getCharPositionInLine() {
        return column;
    }

    @Override
    public CharStream getInputStream() {
        return in;
    }

    @Override
    public String getSourceName() {
        return in.getSourceName();
    }

    @Override
    public void setTokenFactory(TokenFactory<?> factory) {
        this.factory = factory;
    }

    @Override
    public TokenFactory<?> getTokenFactory() {
        return factory;
    }
}
