package dev.assay.syntax;

import dev.assay.syntax.grammar.AssayLexer;
import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import org.antlr.v4.runtime.ANTLRErrorStrategy;
import org.antlr.v4.runtime.BailErrorStrategy;
import org.antlr.v4.runtime.Parser;
import org.antlr.v4.runtime.ParserRuleContext;
import org.antlr.v4.runtime.Token;
import org.antlr.v4.runtime.TokenSource;
import org.antlr.v4.runtime.TokenStream;
import org.antlr.v4.runtime.UnbufferedTokenStream;
import org.antlr.v4.runtime.atn.PredictionMode;
import org.antlr.v4.runtime.misc.ParseCancellationException;
import org.antlr.v4.runtime.tree.TerminalNode;

/**
 * Parses a file one statement at a time on one unbuffered token stream, so memory holds one
 * statement's tokens and parse tree, never the whole file's.
 *
 * <p>Each statement is parsed first in SLL prediction mode with an error strategy that gives up
 * at once. Only when that fails is the statement parsed again from its first token, in full LL
 * mode with the strategy that reports the error in plain words ({@link SyntaxErrors}); the token
 * stream keeps a mark on the statement's start for that. The grammars are LL(1) (ANTLR generates
 * no adaptive prediction for them), so SLL never rejects what LL accepts and the second parse
 * costs no more than the first; it stays in LL mode so that a grammar change that needs more
 * lookahead stays correct. A statement must be followed by the start of another statement or
 * the end of the file; when it is not, the statement is parsed once more together with its
 * successor (the grammar's "...InContext" rule), so that the message lists everything that could
 * have continued it.
 *
 * <p>Nesting is limited ({@link DepthLimit}); a StackOverflowError that still happens becomes an
 * {@link InputError}.
 *
 * @param <P> the generated parser
 * @param <S> the raw statement type
 */
final class StatementStream<P extends Parser, S> {

    /** What differs between the two languages. */
    interface Language<P extends Parser, S> {

        /** A parser that calls {@code limit.enter} and {@code limit.exit} as it enters and leaves a rule. */
        P newParser(TokenStream tokens, DepthLimit limit);

        /** The parser's rule names, as generated. */
        String[] ruleNames();

        /** Calls the grammar's next...Statement rule: one statement, or end of file. */
        ParserRuleContext next(P parser);

        /** Calls the grammar's ...StatementInContext rule, used only to report an error. */
        ParserRuleContext inContext(P parser);

        /** Whether a token of this type may follow a statement: the start of one, or end of file. */
        boolean startsStatement(int tokenType);

        S build(RawBuilder builder, ParserRuleContext statement) throws InputError;

        /** The next statement read by the direct parser, or null at the end of the file. */
        S direct(DirectParser parser) throws DirectParser.Bail;
    }

    /**
     * Whether to lex with ANTLR's generated lexer instead of {@link FastLexer} (they yield the same tokens; the
     * generated one is the definition). Set with {@code -Dassay.lexer=generated}, to compare the two.
     */
    static final boolean GENERATED_LEXER = "generated".equals(System.getProperty("assay.lexer"));

    /**
     * Whether to read every statement with the generated parser instead of trying {@link DirectParser} first
     * (they build the same raw syntax; the generated one is the definition). Set with
     * {@code -Dassay.parser=generated}; the generated lexer implies it.
     */
    static final boolean GENERATED_PARSER = GENERATED_LEXER || "generated".equals(System.getProperty("assay.parser"));

    private final String file;
    private final int maxDepth;
    private final Language<P, S> language;
    private final ReaderCharStream chars;
    /** The lexer of the generated parser; with the direct parser, made again for each statement it hands over. */
    private TokenSource lexer;
    private final TokenTexts texts;
    /** Null when every statement goes to the generated parser. */
    private final DirectParser direct;
    /** Made by the first {@link #next}, since making one reads the first token. */
    private UnbufferedTokenStream<Token> tokens;
    private P parser;
    private final GrammarRule[] rules;
    private final RawBuilder builder;
    private final SyntaxErrors reporting;
    private final BailErrorStrategy bail = new BailErrorStrategy();
    private final DepthLimit depth;
    private InputError failure;
    /** Statements the direct parser gave up on that the generated parser then read: for tests, which expect none. */
    int readAfterHandOver;
    private IOException readFailure;
    private boolean ended;

    StatementStream(String file, Reader input, int maxDepth, Language<P, S> language) {
        this(file, input, maxDepth, Long.MAX_VALUE, language);
    }

    /** {@code maxTermSize} bounds the symbol occurrences of one statement. */
    StatementStream(String file, Reader input, int maxDepth, long maxTermSize, Language<P, S> language) {
        this(file, input, maxDepth, maxTermSize, language, !GENERATED_PARSER);
    }

    /** {@code direct} says whether to try the {@link DirectParser} first; false reads with the generated parser only. */
    StatementStream(String file, Reader input, int maxDepth, long maxTermSize, Language<P, S> language,
                    boolean direct) {
        this.file = file;
        this.maxDepth = maxDepth;
        this.language = language;
        this.chars = new ReaderCharStream(file, input);
        // The window of the char stream holds only the current token's characters: tokens copy theirs.
        this.texts = new TokenTexts(chars);
        if (GENERATED_LEXER) {
            AssayLexer generated = new AssayLexer(chars);
            generated.removeErrorListeners();
            generated.setTokenFactory(texts);
            this.lexer = generated;
        } else if (!direct) {
            this.lexer = new FastLexer(chars, texts);
        }
        this.direct = direct && !GENERATED_LEXER ? new DirectParser(file, chars, maxDepth, maxTermSize) : null;
        this.rules = GrammarRule.tableFor(language.ruleNames());
        this.depth = new DepthLimit(file, maxDepth, maxTermSize, rules);
        this.builder = new RawBuilder(file, rules, maxDepth);
        this.reporting = new SyntaxErrors(file, rules);
    }

    /** The next statement, or null at the end of the file. After an error, the same error again. */
    S next() throws InputError, IOException {
        if (failure != null) {
            throw failure;
        }
        if (readFailure != null) {
            throw readFailure;
        }
        if (ended) {
            return null;
        }
        try {
            if (direct != null) {
                return directOrHandOver();
            }
            if (tokens == null) {
                openTokens();
            }
            return parseOne();
        } catch (SyntaxFailure e) {
            failure = e.error;
        } catch (UncheckedIOException e) {
            readFailure = e.getCause();
            throw readFailure;
        } catch (StackOverflowError e) {
            failure = new InputError(here(), "nesting depth exceeds the parser's stack at depth " + depth.deepest()
                    + " (the limit is " + maxDepth + "; a deeper input needs a bigger thread stack,"
                    + " a lower --max-depth reports it sooner)");
        }
        throw failure;
    }

    /**
     * The next statement by the direct parser; when it gives up, the same statement by the generated parser,
     * which then says what is wrong, if anything. The direct parser goes on after the statement.
     */
    private S directOrHandOver() throws InputError {
        int start = chars.index();
        int line = direct.line();
        int column = direct.column();
        int marker = chars.mark();
        try {
            try {
                S statement = language.direct(direct);
                if (statement == null) {
                    ended = true;
                }
                return statement;
            } catch (DirectParser.Bail bail) {
                chars.seek(start);
            }
            lexer = new FastLexer(chars, texts, line, column);
            openTokens();
            S statement = parseOne();
            readAfterHandOver++;
            // Back to the direct parser, at the first token of the next statement.
            Token next = tokens.LT(1);
            direct.moveTo(next.getStartIndex(), next.getLine(), next.getCharPositionInLine());
            tokens = null;
            parser = null;
            return statement;
        } finally {
            chars.releaseFrom(marker); // a StackOverflowError may have left the lexer's mark behind
        }
    }

    private void openTokens() {
        tokens = new UnbufferedTokenStream<>(lexer, 256);
        parser = language.newParser(tokens, depth);
        parser.removeErrorListeners();
    }

    /** Where the stream is now: the next token, or where reading stopped. */
    Location here() {
        if (direct != null && tokens == null) {
            return direct.nextTokenAt();
        }
        if (tokens == null) {
            return new Location(file, 1, 1);
        }
        try {
            return SyntaxErrors.locationOf(file, tokens.LT(1));
        } catch (RuntimeException e) {
            return new Location(file, 1, 1);
        }
    }

    void close() throws IOException {
        chars.close();
    }

    private S parseOne() throws InputError {
        int start = tokens.index();
        int marker = tokens.mark();
        try {
            ParserRuleContext statement = fastParse();
            if (statement == null) {
                tokens.seek(start);
                statement = exactParse(start);
            }
            if (statement == null) {
                ended = true;
                return null;
            }
            return language.build(builder, statement);
        } finally {
            tokens.release(marker);
        }
    }

    /** The statement parsed in SLL mode; null for end of file, or when it fails. */
    private ParserRuleContext fastParse() {
        prepare(bail, PredictionMode.SLL);
        ParserRuleContext next;
        try {
            next = language.next(parser);
        } catch (ParseCancellationException e) {
            return null;
        }
        if (isEndOfFile(next)) {
            return null;
        }
        return language.startsStatement(tokens.LA(1)) ? next : null;
    }

    /** The statement parsed in LL mode; null at end of file; throws at the first error. */
    private ParserRuleContext exactParse(int start) throws InputError {
        prepare(reporting, PredictionMode.LL);
        ParserRuleContext next = language.next(parser);
        if (isEndOfFile(next)) {
            return null;
        }
        if (language.startsStatement(tokens.LA(1))) {
            return next;
        }
        tokens.seek(start);
        prepare(reporting, PredictionMode.LL);
        language.inContext(parser);
        // Not reached: the statement parsed alone, so with its successor it fails at the successor.
        throw new InputError(here(), "expected the next statement or end of file, found "
                + SyntaxErrors.describeFound(tokens.LT(1)));
    }

    private boolean isEndOfFile(ParserRuleContext next) {
        if (next.getChild(0) instanceof TerminalNode) {
            return true;
        }
        if (next.getChildCount() != 1) {
            throw new IllegalStateException("a statement rule matched " + next.getChildCount() + " parts");
        }
        return false;
    }

    private void prepare(ANTLRErrorStrategy strategy, PredictionMode mode) {
        parser.setErrorHandler(strategy);
        strategy.reset(parser);
        parser.getInterpreter().setPredictionMode(mode);
        depth.reset();
    }
}
