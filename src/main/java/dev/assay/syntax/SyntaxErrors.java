package dev.assay.syntax;

import dev.assay.syntax.grammar.AssayLexer;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.antlr.v4.runtime.DefaultErrorStrategy;
import org.antlr.v4.runtime.InputMismatchException;
import org.antlr.v4.runtime.Parser;
import org.antlr.v4.runtime.ParserRuleContext;
import org.antlr.v4.runtime.RecognitionException;
import org.antlr.v4.runtime.Token;
import org.antlr.v4.runtime.TokenStream;
import org.antlr.v4.runtime.atn.ATNState;
import org.antlr.v4.runtime.misc.IntervalSet;

/**
 * The error strategy of the second, exact parse: no recovery, and the first syntax error becomes
 * an {@link InputError} in plain words: where, what was found, what was expected.
 *
 * <p>ANTLR's default strategy repairs the input (deletes or invents a token) and goes on; a
 * checker must not guess what a certificate meant, so every place where it would repair throws.
 */
final class SyntaxErrors extends DefaultErrorStrategy {

    private static final int[] FORMULA_START = {
        AssayLexer.IDENT, AssayLexer.NOT, AssayLexer.FORALL, AssayLexer.EXISTS, AssayLexer.TRUE,
        AssayLexer.FALSE, AssayLexer.LPAREN,
    };
    private static final int[] CLAUSE_START = {
        AssayLexer.LBRACKET, AssayLexer.NOT, AssayLexer.IDENT, AssayLexer.FALSE,
    };
    private static final int[] FORMULA_OR_CLAUSE_START = {
        AssayLexer.NOT, AssayLexer.FORALL, AssayLexer.EXISTS, AssayLexer.TRUE, AssayLexer.FALSE, AssayLexer.LPAREN,
        AssayLexer.LBRACKET,
    };
    private static final int[] RULE_NAMES = {
        AssayLexer.NEGATE, AssayLexer.NNF, AssayLexer.SKOLEMIZE, AssayLexer.CLAUSIFY, AssayLexer.DEFINE,
        AssayLexer.ABBREVIATE, AssayLexer.RESOLVE, AssayLexer.FACTOR, AssayLexer.INSTANTIATE,
        AssayLexer.PARAMODULATE, AssayLexer.EQRES, AssayLexer.EQFACTOR, AssayLexer.REFLEXIVITY,
    };
    private static final int[] PROBLEM_STATEMENTS = {
        AssayLexer.PROBLEM, AssayLexer.DECLARE, AssayLexer.AXIOM, AssayLexer.GOAL,
    };
    private static final int[] CERTIFICATE_STATEMENTS = {
        AssayLexer.CERTIFICATE, AssayLexer.DIGEST, AssayLexer.STEP, AssayLexer.FORGET,
    };
    private static final int[] STATEMENT_KEYWORDS = {
        AssayLexer.PROBLEM, AssayLexer.DECLARE, AssayLexer.AXIOM, AssayLexer.GOAL, AssayLexer.CERTIFICATE,
        AssayLexer.DIGEST, AssayLexer.STEP, AssayLexer.FORGET, AssayLexer.BY,
    };
    private static final int[] LOGICAL_KEYWORDS = {
        AssayLexer.FORALL, AssayLexer.EXISTS, AssayLexer.NOT, AssayLexer.AND, AssayLexer.OR, AssayLexer.IMPLIES,
        AssayLexer.IFF, AssayLexer.TRUE, AssayLexer.FALSE,
    };
    private static final Map<Integer, String> HINTS = Map.of(
            (int) '&', " (write 'and' or '\u2227')",
            (int) '|', " (write 'or' or '\u2228')",
            (int) '~', " (write 'not' or '\u00ac')",
            (int) '!', " (write 'not', or '!=' for 'not equal')",
            (int) '-', " (write '->' in paramodulate, 'implies' in a formula)",
            (int) ';', " (statements need no terminator)");

    private final String file;
    private final GrammarRule[] rules;

    SyntaxErrors(String file, GrammarRule[] rules) {
        this.file = file;
        this.rules = rules;
    }

    @Override
    public void reportError(Parser parser, RecognitionException e) {
        throw new SyntaxFailure(describe(parser, e));
    }

    @Override
    public void recover(Parser parser, RecognitionException e) {
        throw new SyntaxFailure(describe(parser, e));
    }

    @Override
    public Token recoverInline(Parser parser) throws RecognitionException {
        throw nextTokensContext == null
                ? new InputMismatchException(parser)
                : new InputMismatchException(parser, nextTokensState, nextTokensContext);
    }

    /** As the default, which finds an error as early as a loop or block decision, but without repair. */
    @Override
    public void sync(Parser parser) throws RecognitionException {
        ATNState state = parser.getInterpreter().atn.states.get(parser.getState());
        int next = parser.getInputStream().LA(1);
        IntervalSet nextTokens = parser.getATN().nextTokens(state);
        if (nextTokens.contains(next)) {
            nextTokensContext = null;
            nextTokensState = ATNState.INVALID_STATE_NUMBER;
            return;
        }
        if (nextTokens.contains(Token.EPSILON)) {
            if (nextTokensContext == null) {
                nextTokensContext = parser.getContext();
                nextTokensState = parser.getState();
            }
            return;
        }
        switch (state.getStateType()) {
            case ATNState.BLOCK_START, ATNState.STAR_BLOCK_START, ATNState.PLUS_BLOCK_START,
                 ATNState.STAR_LOOP_ENTRY, ATNState.PLUS_LOOP_BACK, ATNState.STAR_LOOP_BACK ->
                    throw new InputMismatchException(parser);
            default -> {
            }
        }
    }

    InputError describe(Parser parser, RecognitionException e) {
        Token found = e.getOffendingToken() != null ? e.getOffendingToken() : parser.getCurrentToken();
        IntervalSet expected = expectedAt(parser, e);
        ParserRuleContext context = e.getCtx() instanceof ParserRuleContext c ? c : parser.getContext();
        GrammarRule rule = context == null ? null : rules[context.getRuleIndex()];
        ParserRuleContext parent = context == null ? null : context.getParent();
        if (rule == GrammarRule.TERM && parent != null
                && rules[parent.getRuleIndex()] == GrammarRule.ATOM && parent.getChildCount() == 1) {
            rule = GrammarRule.ATOM; // the term that starts an atom
        }
        return new InputError(locationOf(file, found), reason(parser, found, expected, rule));
    }

    static Location locationOf(String file, Token token) {
        return new Location(file, Math.max(1, token.getLine()), token.getCharPositionInLine() + 1);
    }

    private static IntervalSet expectedAt(Parser parser, RecognitionException e) {
        try {
            IntervalSet expected = e.getExpectedTokens();
            if (expected != null) {
                return expected;
            }
        } catch (RuntimeException ignored) {
            // fall through: the parser's own state says what it expects
        }
        return parser.getExpectedTokens();
    }

    private String reason(Parser parser, Token found, IntervalSet expected, GrammarRule rule) {
        int type = found.getType();
        String suffix = "";
        if (type == AssayLexer.ILLEGAL_CHARACTER) {
            int c = found.getText().codePointAt(0);
            return "illegal character " + showCharacter(c) + HINTS.getOrDefault(c, "");
        }
        if (type == AssayLexer.UNTERMINATED_STRING) {
            return "unterminated string: a string ends with '\"' on the line where it starts";
        }
        if (type == AssayLexer.IFF && !expected.contains(AssayLexer.IFF)) {
            return iffIsNotAssociative();
        }
        if ((type == AssayLexer.RIGHT_ARROW || type == AssayLexer.LEFT_ARROW) && expected.contains(AssayLexer.IMPLIES)) {
            suffix = " (in a formula, write 'implies' or '\u2192')";
        }
        if (isKeyword(type) && expected.contains(AssayLexer.IDENT) && !expected.contains(type)) {
            // A keyword where a name could stand: either the name is missing (`axiom : P` is
            // clearer as "expected a name") or a reserved word is used as one (`P(resolve)`).
            boolean structural = contains(STATEMENT_KEYWORDS, type);
            boolean logical = contains(LOGICAL_KEYWORDS, type);
            boolean onlyName = !containsAny(expected, FORMULA_OR_CLAUSE_START)
                    && rule != GrammarRule.TERM && rule != GrammarRule.ATOM;
            if (nextIsOpeningParenthesis(parser, found) || onlyName && !structural || !structural && !logical) {
                return reservedWord(found.getText());
            }
            if (onlyName) {
                suffix = ", which is a reserved word";
            }
        }
        return "expected " + describeExpected(expected, rule) + context(parser, found, expected, rule)
                + ", found " + describeFound(found) + suffix;
    }

    static String iffIsNotAssociative() {
        return "'iff' is not associative: write parentheses, as in (a iff b) iff c";
    }

    static String reservedWord(String word) {
        return "'" + word + "' is a reserved word and cannot be a symbol, variable or label";
    }

    static String showCharacter(int c) {
        String code = String.format("U+%04X", c);
        return Character.isISOControl(c) || Character.isWhitespace(c) ? code : "'" + Character.toString(c) + "' (" + code + ")";
    }

    private static boolean nextIsOpeningParenthesis(Parser parser, Token found) {
        TokenStream tokens = parser.getInputStream();
        Token after = tokens.LT(1) == found ? tokens.LT(2) : tokenAt(tokens, found.getTokenIndex() + 1);
        return after != null && after.getType() == AssayLexer.LPAREN;
    }

    private static Token tokenAt(TokenStream tokens, int index) {
        if (index < 0) {
            return null;
        }
        try {
            return tokens.get(index);
        } catch (RuntimeException outsideTheBuffer) {
            return null;
        }
    }

    private static String context(Parser parser, Token found, IntervalSet expected, GrammarRule rule) {
        if (rule == null) {
            return "";
        }
        if (expected.contains(AssayLexer.COLON) && expected.size() == 1) {
            switch (rule) {
                case STEP: return " after the step label";
                case AXIOM: return " after the axiom's name";
                case GOAL: return " after the goal's name";
                default: break;
            }
        }
        Token before = tokenAt(parser.getInputStream(), found.getTokenIndex() - 1);
        if (before != null && isKeyword(before.getType()) && !contains(STATEMENT_KEYWORDS, before.getType())
                && !contains(LOGICAL_KEYWORDS, before.getType())) {
            return " after '" + before.getText() + "'";
        }
        if (before != null && before.getType() == AssayLexer.BY) {
            return " after 'by'";
        }
        return "";
    }

    static String describeFound(Token found) {
        return switch (found.getType()) {
            case Token.EOF -> "end of file";
            case AssayLexer.STRING -> "a string";
            default -> {
                String text = found.getText();
                yield "'" + (text.length() > 40 ? text.substring(0, 37) + "..." : text) + "'";
            }
        };
    }

    static String describeExpected(IntervalSet expected, GrammarRule rule) {
        IntervalSet rest = new IntervalSet(expected);
        rest.remove(Token.EPSILON);
        List<String> parts = new ArrayList<>();
        if (containsAll(rest, FORMULA_START)) {
            parts.add("a formula");
            removeAll(rest, FORMULA_START);
        } else if (containsAll(rest, CLAUSE_START)) {
            parts.add("a clause");
            removeAll(rest, CLAUSE_START);
        } else if (rest.contains(AssayLexer.NOT) && rest.contains(AssayLexer.IDENT)
                && (rule == GrammarRule.CLAUSE || rule == GrammarRule.LITERAL || rule == GrammarRule.VARIABLE_LIST)) {
            parts.add("a literal");
            rest.remove(AssayLexer.NOT);
            rest.remove(AssayLexer.IDENT);
        }
        if (containsAll(rest, RULE_NAMES)) {
            parts.add("a rule name");
            removeAll(rest, RULE_NAMES);
        }
        if (rest.contains(AssayLexer.IDENT)) {
            parts.add(rule == GrammarRule.ATOM ? "an atom"
                    : rule == GrammarRule.TERM || rule == GrammarRule.BINDING && !rest.contains(AssayLexer.RBRACE)
                    ? "a term" : "a name");
            rest.remove(AssayLexer.IDENT);
        }
        if (rest.contains(AssayLexer.INT)) {
            parts.add("a number");
            rest.remove(AssayLexer.INT);
        }
        if (rest.contains(AssayLexer.STRING)) {
            parts.add("a string \"sha256:...\"");
            rest.remove(AssayLexer.STRING);
        }
        boolean statements = (containsAll(rest, PROBLEM_STATEMENTS) || containsAll(rest, CERTIFICATE_STATEMENTS))
                && (!parts.isEmpty() || hasOtherThan(rest, PROBLEM_STATEMENTS, CERTIFICATE_STATEMENTS));
        if (statements) {
            removeAll(rest, PROBLEM_STATEMENTS);
            removeAll(rest, CERTIFICATE_STATEMENTS);
        }
        boolean endOfFile = rest.contains(Token.EOF);
        rest.remove(Token.EOF);
        for (int type : rest.toList()) {
            if (!isKeyword(type)) {
                parts.add("'" + spelling(type) + "'");
            }
        }
        for (int type : rest.toList()) {
            if (contains(LOGICAL_KEYWORDS, type)) {
                parts.add("'" + spelling(type) + "'");
            }
        }
        for (int type : rest.toList()) {
            if (isKeyword(type) && !contains(LOGICAL_KEYWORDS, type)) {
                parts.add("'" + spelling(type) + "'");
            }
        }
        if (statements) {
            parts.add("the next statement");
        }
        if (endOfFile) {
            parts.add("end of file");
        }
        if (parts.isEmpty()) {
            return "something else";
        }
        StringBuilder text = new StringBuilder(parts.get(0));
        for (int i = 1; i < parts.size(); i++) {
            text.append(i == parts.size() - 1 ? " or " : ", ").append(parts.get(i));
        }
        return text.toString();
    }

    /** The ASCII spelling of a token type, as the languages write it. */
    static String spelling(int type) {
        return switch (type) {
            case AssayLexer.FORALL -> "forall";
            case AssayLexer.EXISTS -> "exists";
            case AssayLexer.NOT -> "not";
            case AssayLexer.AND -> "and";
            case AssayLexer.OR -> "or";
            case AssayLexer.IMPLIES -> "implies";
            case AssayLexer.IFF -> "iff";
            case AssayLexer.TRUE -> "true";
            case AssayLexer.FALSE -> "false";
            case AssayLexer.NEQ -> "!=";
            case AssayLexer.ASSIGN -> ":=";
            default -> {
                String literal = AssayLexer.VOCABULARY.getLiteralName(type);
                yield literal != null ? literal.substring(1, literal.length() - 1)
                        : AssayLexer.VOCABULARY.getDisplayName(type);
            }
        };
    }

    static boolean isKeyword(int type) {
        return type >= AssayLexer.PROBLEM && type <= AssayLexer.REFLEXIVITY;
    }

    private static boolean contains(int[] types, int type) {
        for (int t : types) {
            if (t == type) {
                return true;
            }
        }
        return false;
    }

    private static boolean containsAny(IntervalSet set, int[] types) {
        for (int type : types) {
            if (set.contains(type)) {
                return true;
            }
        }
        return false;
    }

    private static boolean containsAll(IntervalSet set, int[] types) {
        for (int type : types) {
            if (!set.contains(type)) {
                return false;
            }
        }
        return true;
    }

    private static void removeAll(IntervalSet set, int[] types) {
        for (int type : types) {
            set.remove(type);
        }
    }

    private static boolean hasOtherThan(IntervalSet set, int[] a, int[] b) {
        for (int type : set.toList()) {
            if (type != Token.EOF && !contains(a, type) && !contains(b, type)) {
                return true;
            }
        }
        return false;
    }
}
