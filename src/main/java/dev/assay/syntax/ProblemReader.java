package dev.assay.syntax;

import dev.assay.syntax.grammar.AssayLexer;
import dev.assay.syntax.grammar.ProblemParser;
import java.io.Closeable;
import java.io.IOException;
import java.io.InputStream;
import java.io.Reader;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.antlr.v4.runtime.ParserRuleContext;
import org.antlr.v4.runtime.TokenStream;

/**
 * Reads a problem file (FORMAT.md §4) one statement at a time:
 * <pre>
 * try (ProblemReader reader = ProblemReader.open(path)) {
 *     for (ProblemStatement s; (s = reader.next()) != null; ) { ... }
 * }
 * </pre>
 * Besides the syntax it checks the file's layout: the {@code problem} header comes first and only
 * there, and there is at most one goal. Everything about names (duplicates, kinds, arities) is
 * left to the layer that resolves them.
 *
 * <p>Deep nesting needs a deep stack; run a reader inside {@link BigStack#run} for inputs near
 * the default limit. A reader is not thread-safe.
 */
public final class ProblemReader implements Closeable {

    /** The default nesting limit; see {@link BigStack} for the stack it is safe with. */
    public static final int DEFAULT_MAX_DEPTH = BigStack.SAFE_DEPTH;

    private final StatementStream<ProblemParser, ProblemStatement> stream;
    private ProblemHeader header;
    private Goal goal;
    private boolean started;

    public ProblemReader(String file, Reader input) {
        this(file, input, DEFAULT_MAX_DEPTH);
    }

    /** {@code file} names the input in locations; {@code maxDepth} limits nesting (see {@link #DEFAULT_MAX_DEPTH}). */
    public ProblemReader(String file, Reader input, int maxDepth) {
        this.stream = new StatementStream<>(file, input, maxDepth, LANGUAGE);
    }

    /**
     * Reads bytes as strict UTF-8: bytes that are not UTF-8 are an {@link InputError} at the
     * first bad byte (an InputStreamReader would replace them silently).
     */
    public ProblemReader(String file, InputStream input, int maxDepth) {
        this(file, Utf8.of(input), maxDepth);
    }

    /** As {@link #ProblemReader(String, InputStream, int)}, with at most {@code maxTermSize} symbol occurrences per statement. */
    public ProblemReader(String file, InputStream input, int maxDepth, long maxTermSize) {
        this.stream = new StatementStream<>(file, Utf8.of(input), maxDepth, maxTermSize, LANGUAGE);
    }

    /** With {@code direct} false, every statement is read by the generated parser alone: for tests that compare the two. */
    ProblemReader(String file, Reader input, int maxDepth, long maxTermSize, boolean direct) {
        this.stream = new StatementStream<>(file, input, maxDepth, maxTermSize, LANGUAGE, direct);
    }

    /** Opens a file, read as UTF-8; bytes that are not UTF-8 are an {@link InputError} when reached. */
    public static ProblemReader open(Path file) throws IOException {
        return open(file, DEFAULT_MAX_DEPTH);
    }

    public static ProblemReader open(Path file, int maxDepth) throws IOException {
        return new ProblemReader(file.toString(), Utf8.open(file), maxDepth);
    }

    /**
     * The next statement, or null after the last. An input that cannot be parsed is an
     * {@link InputError}; a read that fails (or is interrupted) is an IOException. After either,
     * the reader throws the same again.
     */
    public ProblemStatement next() throws InputError, IOException {
        ProblemStatement statement = stream.next();
        if (statement == null) {
            if (!started) {
                throw new InputError(stream.here(), "a problem file starts with 'problem <name>', found end of file");
            }
            return null;
        }
        if (statement instanceof ProblemHeader h) {
            if (header != null) {
                throw new InputError(h.at(), "a problem file has one 'problem' line", header.at());
            }
            header = h;
        } else if (!started) {
            throw new InputError(statement.at(), "a problem file starts with 'problem <name>'");
        } else if (statement instanceof Goal g) {
            if (goal != null) {
                throw new InputError(g.at(), "a problem has at most one goal", goal.at());
            }
            goal = g;
        }
        started = true;
        return statement;
    }

    /** How many statements the direct parser handed over that the generated parser then read (see DirectParserTest). */
    int readAfterHandOver() {
        return stream.readAfterHandOver;
    }

    @Override
    public void close() throws IOException {
        stream.close();
    }

    public static List<ProblemStatement> readAll(Path file) throws IOException, InputError {
        return readAll(file, DEFAULT_MAX_DEPTH);
    }

    public static List<ProblemStatement> readAll(Path file, int maxDepth) throws IOException, InputError {
        try (ProblemReader reader = open(file, maxDepth)) {
            return reader.readRest();
        }
    }

    public static List<ProblemStatement> readAll(String file, Reader input) throws InputError, IOException {
        return new ProblemReader(file, input).readRest();
    }

    /** Reads text given in full, as in tests: {@code readAll("t.problem", "problem p ...")}. */
    public static List<ProblemStatement> readAll(String file, String text) throws InputError {
        try {
            return readAll(file, new StringReader(text));
        } catch (IOException e) {
            throw new UncheckedIOException(e); // a StringReader does not fail
        }
    }

    private List<ProblemStatement> readRest() throws InputError, IOException {
        List<ProblemStatement> statements = new ArrayList<>();
        for (ProblemStatement s; (s = next()) != null; ) {
            statements.add(s);
        }
        return statements;
    }

    private static final StatementStream.Language<ProblemParser, ProblemStatement> LANGUAGE =
            new StatementStream.Language<>() {
                @Override
                public ProblemParser newParser(TokenStream tokens, DepthLimit limit) {
                    return new ProblemParser(tokens) {
                        @Override
                        public void enterRule(ParserRuleContext ctx, int state, int ruleIndex) {
                            super.enterRule(ctx, state, ruleIndex);
                            limit.enter(ruleIndex, ctx, getInputStream());
                        }

                        @Override
                        public void exitRule() {
                            limit.exit();
                            super.exitRule();
                        }
                    };
                }

                @Override
                public String[] ruleNames() {
                    return ProblemParser.ruleNames;
                }

                @Override
                public ParserRuleContext next(ProblemParser parser) {
                    return parser.nextProblemStatement();
                }

                @Override
                public ParserRuleContext inContext(ProblemParser parser) {
                    return parser.problemStatementInContext();
                }

                @Override
                public boolean startsStatement(int type) {
                    return type == AssayLexer.PROBLEM || type == AssayLexer.DECLARE || type == AssayLexer.AXIOM
                            || type == AssayLexer.GOAL || type == AssayLexer.EOF;
                }

                @Override
                public ProblemStatement build(RawBuilder builder, ParserRuleContext statement) throws InputError {
                    return builder.problemStatement((ParserRuleContext) statement.getChild(0));
                }

                @Override
                public ProblemStatement direct(DirectParser parser) throws DirectParser.Bail {
                    return parser.problemStatement();
                }
            };
}
