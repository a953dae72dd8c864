package dev.assay.syntax;

import java.util.Arrays;
import org.antlr.v4.runtime.ParserRuleContext;

/**
 * Counts the open nesting levels of the statement being parsed and stops at the limit. Every
 * level of parentheses, {@code not} and quantifiers passes through one {@code unaryFormula},
 * every level of a term through one {@code term}: the depth is how many of these are open.
 *
 * <p>The parsers call {@link #enter} and {@link #exit} from their {@code enterRule} and
 * {@code exitRule} (see the readers' parser subclasses), which is cheaper than a parse listener.
 */
final class DepthLimit {

    private final String file;
    private final int limit;
    private final boolean[] counted;
    /** Whether the rule frame at each level of the parser's stack is counted. */
    private boolean[] frames = new boolean[256];
    private int level;
    private int open;
    private int deepest;

    DepthLimit(String file, int limit, GrammarRule[] rules) {
        if (limit < 1) {
            throw new IllegalArgumentException("the nesting limit must be positive: " + limit);
        }
        this.file = file;
        this.limit = limit;
        this.counted = new boolean[rules.length];
        for (int i = 0; i < rules.length; i++) {
            counted[i] = rules[i] == GrammarRule.UNARY_FORMULA || rules[i] == GrammarRule.TERM;
        }
    }

    void reset() {
        level = 0;
        open = 0;
        deepest = 0;
    }

    int limit() {
        return limit;
    }

    /** The deepest nesting seen since the last reset. */
    int deepest() {
        return deepest;
    }

    void enter(int ruleIndex, ParserRuleContext ctx) {
        if (++level == frames.length) {
            frames = Arrays.copyOf(frames, frames.length * 2);
        }
        boolean counts = counted[ruleIndex];
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
