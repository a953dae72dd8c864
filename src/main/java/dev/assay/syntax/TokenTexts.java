package dev.assay.syntax;

import dev.assay.syntax.grammar.AssayLexer;
import org.antlr.v4.runtime.CharStream;
import org.antlr.v4.runtime.CommonToken;
import org.antlr.v4.runtime.TokenFactory;
import org.antlr.v4.runtime.TokenSource;
import org.antlr.v4.runtime.misc.Pair;

/**
 * Makes tokens with their text, which the windowed character stream forgets once the token is
 * lexed. A keyword or punctuation token gets its one shared spelling instead of a new string.
 */
final class TokenTexts implements TokenFactory<CommonToken> {

    private static final String[] FIXED = new String[AssayLexer.VOCABULARY.getMaxTokenType() + 1];
    private static final String[] UNICODE = new String[FIXED.length];

    static {
        for (int type = 1; type < FIXED.length; type++) {
            String literal = AssayLexer.VOCABULARY.getLiteralName(type);
            if (literal != null) {
                FIXED[type] = literal.substring(1, literal.length() - 1);
            }
        }
        String[][] spellings = {
            {"FORALL", "forall", "\u2200"}, {"EXISTS", "exists", "\u2203"}, {"NOT", "not", "\u00ac"},
            {"AND", "and", "\u2227"}, {"OR", "or", "\u2228"}, {"IMPLIES", "implies", "\u2192"},
            {"IFF", "iff", "\u2194"}, {"TRUE", "true", "\u22a4"}, {"FALSE", "false", "\u22a5"},
            {"NEQ", "!=", "\u2260"}, {"ASSIGN", ":=", "\u21a6"},
        };
        for (String[] spelling : spellings) {
            int type = typeNamed(spelling[0]);
            FIXED[type] = spelling[1];
            UNICODE[type] = spelling[2];
        }
    }

    private final ReaderCharStream chars;

    TokenTexts(ReaderCharStream chars) {
        this.chars = chars;
    }

    @Override
    public CommonToken create(Pair<TokenSource, CharStream> source, int type, String text, int channel,
                              int start, int stop, int line, int charPositionInLine) {
        CommonToken token = new CommonToken(source, type, channel, start, stop);
        token.setLine(line);
        token.setCharPositionInLine(charPositionInLine);
        if (text != null) {
            token.setText(text);
        } else if (type > 0 && UNICODE[type] != null) {
            token.setText(stop == start ? UNICODE[type] : FIXED[type]);
        } else if (type > 0 && FIXED[type] != null) {
            token.setText(FIXED[type]);
        } else if (type > 0) {
            token.setText(chars.textOf(start, stop));
        }
        return token;
    }

    @Override
    public CommonToken create(int type, String text) {
        return new CommonToken(type, text);
    }

    private static int typeNamed(String symbolic) {
        for (int type = 1; type < FIXED.length; type++) {
            if (symbolic.equals(AssayLexer.VOCABULARY.getSymbolicName(type))) {
                return type;
            }
        }
        throw new IllegalStateException("no token " + symbolic);
    }
}
