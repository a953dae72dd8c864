package dev.assay.syntax;

import dev.assay.syntax.grammar.AssayLexer;
import dev.assay.syntax.grammar.CertificateParser;
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
 * Reads a certificate file (FORMAT.md §6) one statement at a time, so that a certificate of
 * millions of steps is checked in the memory of one:
 * <pre>
 * try (CertificateReader reader = CertificateReader.open(path)) {
 *     for (CertificateStatement s; (s = reader.next()) != null; ) { ... }
 * }
 * </pre>
 * Besides the syntax it checks the file's layout: the {@code certificate for} header comes first
 * and only there, and at most one {@code digest} follows it directly. Labels, premises and rules
 * are left to the checker.
 *
 * <p>Deep nesting needs a deep stack; run a reader inside {@link BigStack#run} for inputs near
 * the default limit. A reader is not thread-safe.
 */
public final class CertificateReader implements Closeable {

    public static final int DEFAULT_MAX_DEPTH = BigStack.SAFE_DEPTH;

    private final StatementStream<CertificateParser, CertificateStatement> stream;
    private CertificateHeader header;
    private Digest digest;
    private CertificateStatement previous;

    public CertificateReader(String file, Reader input) {
        this(file, input, DEFAULT_MAX_DEPTH);
    }

    /** {@code file} names the input in locations; {@code maxDepth} limits nesting (see {@link #DEFAULT_MAX_DEPTH}). */
    public CertificateReader(String file, Reader input, int maxDepth) {
        this.stream = new StatementStream<>(file, input, maxDepth, LANGUAGE);
    }

    /**
     * Reads bytes as strict UTF-8: bytes that are not UTF-8 are an {@link InputError} at the
     * first bad byte (an InputStreamReader would replace them silently).
     */
    public CertificateReader(String file, InputStream input, int maxDepth) {
        this(file, Utf8.of(input), maxDepth);
    }

    /** As {@link #CertificateReader(String, InputStream, int)}, with at most {@code maxTermSize} symbol occurrences per statement. */
    public CertificateReader(String file, InputStream input, int maxDepth, long maxTermSize) {
        this.stream = new StatementStream<>(file, Utf8.of(input), maxDepth, maxTermSize, LANGUAGE);
    }

    /** With {@code direct} false, every statement is read by the generated parser alone: for tests that compare the two. */
    CertificateReader(String file, Reader input, int maxDepth, long maxTermSize, boolean direct) {
        this.stream = new StatementStream<>(file, input, maxDepth, maxTermSize, LANGUAGE, direct);
    }

    /** Opens a file, read as UTF-8; bytes that are not UTF-8 are an {@link InputError} when reached. */
    public static CertificateReader open(Path file) throws IOException {
        return open(file, DEFAULT_MAX_DEPTH);
    }

    public static CertificateReader open(Path file, int maxDepth) throws IOException {
        return new CertificateReader(file.toString(), Utf8.open(file), maxDepth);
    }

    /**
     * The next statement, or null after the last. An input that cannot be parsed is an
     * {@link InputError}; a read that fails (or is interrupted) is an IOException. After either,
     * the reader throws the same again.
     */
    public CertificateStatement next() throws InputError, IOException {
        CertificateStatement statement = stream.next();
        if (statement == null) {
            if (previous == null) {
                throw new InputError(stream.here(),
                        "a certificate starts with 'certificate for <problem name>', found end of file");
            }
            return null;
        }
        if (statement instanceof CertificateHeader h) {
            if (header != null) {
                throw new InputError(h.at(), "a certificate has one 'certificate for' line", header.at());
            }
            header = h;
        } else if (previous == null) {
            throw new InputError(statement.at(), "a certificate starts with 'certificate for <problem name>'");
        } else if (statement instanceof Digest d) {
            if (digest != null) {
                throw new InputError(d.at(), "a certificate has at most one digest", digest.at());
            }
            if (!(previous instanceof CertificateHeader)) {
                throw new InputError(d.at(), "the digest comes right after the 'certificate for' line");
            }
            digest = d;
        }
        previous = statement;
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

    public static List<CertificateStatement> readAll(Path file) throws IOException, InputError {
        return readAll(file, DEFAULT_MAX_DEPTH);
    }

    public static List<CertificateStatement> readAll(Path file, int maxDepth) throws IOException, InputError {
        try (CertificateReader reader = open(file, maxDepth)) {
            return reader.readRest();
        }
    }

    public static List<CertificateStatement> readAll(String file, Reader input) throws InputError, IOException {
        return new CertificateReader(file, input).readRest();
    }

    /** Reads text given in full, as in tests: {@code readAll("t.proof", "certificate for p ...")}. */
    public static List<CertificateStatement> readAll(String file, String text) throws InputError {
        try {
            return readAll(file, new StringReader(text));
        } catch (IOException e) {
            throw new UncheckedIOException(e); // a StringReader does not fail
        }
    }

    private List<CertificateStatement> readRest() throws InputError, IOException {
        List<CertificateStatement> statements = new ArrayList<>();
        for (CertificateStatement s; (s = next()) != null; ) {
            statements.add(s);
        }
        return statements;
    }

    private static final StatementStream.Language<CertificateParser, CertificateStatement> LANGUAGE =
            new StatementStream.Language<>() {
                @Override
                public CertificateParser newParser(TokenStream tokens, DepthLimit limit) {
                    return new CertificateParser(tokens) {
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
                    return CertificateParser.ruleNames;
                }

                @Override
                public ParserRuleContext next(CertificateParser parser) {
                    return parser.nextCertificateStatement();
                }

                @Override
                public ParserRuleContext inContext(CertificateParser parser) {
                    return parser.certificateStatementInContext();
                }

                @Override
                public boolean startsStatement(int type) {
                    return type == AssayLexer.CERTIFICATE || type == AssayLexer.DIGEST || type == AssayLexer.STEP
                            || type == AssayLexer.FORGET || type == AssayLexer.EOF;
                }

                @Override
                public CertificateStatement build(RawBuilder builder, ParserRuleContext statement) throws InputError {
                    return builder.certificateStatement((ParserRuleContext) statement.getChild(0));
                }

                @Override
                public CertificateStatement direct(DirectParser parser) throws DirectParser.Bail {
                    return parser.certificateStatement();
                }
            };
}
