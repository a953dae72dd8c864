package dev.assay.syntax;

import dev.assay.syntax.grammar.AssayLexer;
import java.util.Arrays;
import org.antlr.v4.runtime.ParserRuleContext;
import org.antlr.v4.runtime.TokenStream;

/**
 * Counts the open nesting levels of the statement being parsed and stops at the limit. The depth
 * is the number of open parentheses, {@code not}s and quantifiers (each is one
 * {@code unaryFormula} of the parser) plus the nesting of function applications in an atom's
 * arguments (each is one {@code term} inside another): {@code not not P(f(f(c)))} is 4 deep.
 *
 * <p>The parsers call {@link #enter} and {@link #exit} from their {@code enterRule} and
 * {@code exitRule} (see the readers' parser subclasses), which is cheaper than a parse listener.
 */
final class DepthLimit {

    private final String file;
    private final int limit;
    private final GrammarRule[] rules;
    /** Whether the rule frame at each level of the parser's stack is counted. */
    private boolean[] frames = new boolean[256];
    private int level;
    private int open;
    private int deepest;
    /** The most symbol occurrences (term nodes) one statement may have. */
    private final long termLimit;
    private long termNodes;

    DepthLimit(String file, int limit, GrammarRule[] rules) {
        this(file, limit, Long.MAX_VALUE, rules);
    }

    DepthLimit(String file, int limit, long termLimit, GrammarRule[] rules) {
        if (limit < 1) {
            throw new IllegalArgumentException("the nesting limit must be positive: " + limit);
        }
        if (termLimit < 1) {
            throw new IllegalArgumentException("the term size limit must be positive: " + termLimit);
        }
        this.file = file;
        this.limit = limit;
        this.termLimit = termLimit;
        this.rules = rules;
    }

    void reset() {
        level = 0;
        open = 0;
        deepest = 0;
        termNodes = 0;
    }

    int limit() {
        return limit;
    }

    /** The deepest nesting seen since the last reset. */
    int deepest() {
        return deepest;
    }

    void enter(int ruleIndex, ParserRuleContext ctx, TokenStream tokens) {
        if (++level == frames.length) {
            frames = Arrays.copyOf(frames, frames.length * 2);
        }
        boolean counts = switch (rules[ruleIndex]) {
            case UNARY_FORMULA -> {
                int next = ctx.start.getType();
                yield next == AssayLexer.NOT || next == AssayLexer.FORALL || next == AssayLexer.EXISTS
                        || next == AssayLexer.LPAREN;
            }
            case TERM -> {
                if (++termNodes > termLimit) {
                    throw new SyntaxFailure(new InputError(SyntaxErrors.locationOf(file, ctx.start),
                            "this statement has more than " + termLimit + " symbol occurrences, the term size limit"
                                    + " (raise it with --max-term-size)"));
                }
                yield tokens.LA(2) == AssayLexer.LPAREN && ctx.getParent() != null
                        && rules[ctx.getParent().getRuleIndex()] == GrammarRule.TERM;
            }
            default -> false;
        };
        frames[level] = counts;
        if (counts && ++open > deepest) {
            deepest = open;
            if (open > limit) {
                throw new SyntaxFailure(new InputError(SyntaxErrors.locationOf(file, ctx.start),
                        "nesting depth exceeds the limit of " + limit + " (raise it with --max-depth)"));
            }
        }
    }

    void exit() {
        if (level > 0) {
            if (frames[level]) {
                open--;
            }
            level--;
        }
    }
}
