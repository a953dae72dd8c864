package dev.assay.syntax;

import dev.assay.syntax.grammar.AssayLexer;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.antlr.v4.runtime.ParserRuleContext;
import org.antlr.v4.runtime.Token;
import org.antlr.v4.runtime.tree.ParseTree;
import org.antlr.v4.runtime.tree.TerminalNode;

/**
 * Turns the parse tree of one statement into raw syntax. It goes by rule name (see
 * {@link GrammarRule}), so one builder serves both parsers.
 *
 * <p>Formulas are read with an explicit stack, not by recursion; terms recurse once per level,
 * as the parser did.
 */
final class RawBuilder {

    private final String file;
    private final GrammarRule[] rules;
    private final FormulaAssembler assembler;

    RawBuilder(String file, GrammarRule[] rules, int maxDepth) {
        this.file = file;
        this.rules = rules;
        this.assembler = new FormulaAssembler(maxDepth);
    }

    // ---- statements

    ProblemStatement problemStatement(ParserRuleContext statement) throws InputError {
        ParserRuleContext ctx = rule(statement, 0);
        Location at = at(ctx.start);
        return switch (kind(ctx)) {
            case PROBLEM_HEADER -> new ProblemHeader(name(ctx, 1), at);
            case DECLARATION -> declaration(ctx, at);
            case AXIOM -> new Axiom(name(ctx, 1), formula(rule(ctx, 3)), at);
            case GOAL -> new Goal(name(ctx, 1), formula(rule(ctx, 3)), at);
            default -> throw unexpected(ctx);
        };
    }

    CertificateStatement certificateStatement(ParserRuleContext statement) throws InputError {
        ParserRuleContext ctx = rule(statement, 0);
        Location at = at(ctx.start);
        return switch (kind(ctx)) {
            case CERTIFICATE_HEADER -> new CertificateHeader(name(ctx, 2), at);
            case DIGEST -> new Digest(digest(token(ctx, 1)), at);
            case FORGET -> new Forget(names(ctx, 1), at);
            case STEP -> step(ctx, at);
            default -> throw unexpected(ctx);
        };
    }

    private Declaration declaration(ParserRuleContext ctx, Location at) throws InputError {
        DeclarationKind kind = type(ctx, 1) == AssayLexer.FUNCTION ? DeclarationKind.FUNCTION : DeclarationKind.PREDICATE;
        List<DeclaredSymbol> symbols = new ArrayList<>();
        for (int i = 2; i < ctx.getChildCount(); i += 2) {
            ParserRuleContext symbol = rule(ctx, i);
            symbols.add(new DeclaredSymbol(name(symbol, 0), number(token(symbol, 2), 0, "an arity")));
        }
        return new Declaration(kind, symbols, at);
    }

    private String digest(Token string) throws InputError {
        String text = string.getText();
        String content = text.substring(1, text.length() - 1);
        String digits = digestDigits(content);
        if (digits != null) {
            return digits;
        }
        // Refused: say why.
        String prefix = "sha256:";
        if (!content.startsWith(prefix)) {
            throw new InputError(at(string), "a digest is written \"sha256:\" and 64 hexadecimal digits, found "
                    + shorten(text));
        }
        String written = content.substring(prefix.length());
        for (int i = 0; i < written.length(); i++) {
            if (!isHexDigit(written.charAt(i))) {
                int column = string.getCharPositionInLine() + 2 + content.codePointCount(0, prefix.length() + i);
                throw new InputError(new Location(file, string.getLine(), column),
                        "a digest has only hexadecimal digits, found " + SyntaxErrors.showCharacter(written.codePointAt(i)));
            }
        }
        throw new InputError(at(string), "a SHA-256 digest has 64 hexadecimal digits, found " + written.length());
    }

    /** The digits of a digest string's content in lower case, or null when it is not "sha256:" and 64 hexadecimal digits. */
    static String digestDigits(String content) {
        String prefix = "sha256:";
        if (!content.startsWith(prefix) || content.length() != prefix.length() + 64) {
            return null;
        }
        for (int i = prefix.length(); i < content.length(); i++) {
            if (!isHexDigit(content.charAt(i))) {
                return null;
            }
        }
        return content.substring(prefix.length()).toLowerCase(Locale.ROOT);
    }

    private static boolean isHexDigit(char c) {
        return Character.digit(c, 16) >= 0 && c <= 'f';
    }

    private Step step(ParserRuleContext ctx, Location at) throws InputError {
        Name label = name(ctx, 1);
        ParserRuleContext conclusion = rule(ctx, 3);
        RawConclusion stated = type(conclusion, 0) == AssayLexer.FORMULA
                ? formula(rule(conclusion, 1))
                : clause(rule(conclusion, 1));
        ParserRuleContext inference = rule(rule(ctx, 5), 0);
        Name ruleName = name(inference, 0);
        return new Step(label, stated, ruleName, arguments(inference), at);
    }

    private RuleArgs arguments(ParserRuleContext ctx) throws InputError {
        int n = ctx.getChildCount();
        return switch (kind(ctx)) {
            case NEGATE -> new NegateArgs(name(ctx, 1));
            case NNF -> new NnfArgs(name(ctx, 1));
            case SKOLEMIZE -> new SkolemizeArgs(name(ctx, 1), n > 2 ? names(ctx, 3) : List.of());
            case CLAUSIFY -> new ClausifyArgs(name(ctx, 1), n > 2 ? substitution(rule(ctx, 2)) : null);
            case DEFINE -> new DefineArgs(name(ctx, 2));
            case ABBREVIATE -> new AbbreviateArgs(name(ctx, 1), name(ctx, 3));
            case RESOLVE -> resolve(ctx);
            case FACTOR -> new FactorArgs(literalRef(rule(ctx, 1)), literalRef(rule(ctx, 3)),
                    n > 4 ? substitution(rule(ctx, 4)) : null);
            case INSTANTIATE -> new InstantiateArgs(name(ctx, 1), substitution(rule(ctx, 2)));
            case PARAMODULATE -> new ParamodulateArgs(
                    literalRef(rule(ctx, 1)),
                    type(ctx, 2) == AssayLexer.RIGHT_ARROW ? Direction.LEFT_TO_RIGHT : Direction.RIGHT_TO_LEFT,
                    literalRef(rule(ctx, 3)),
                    termPosition(rule(ctx, 5)),
                    n > 6 ? substitution(rule(ctx, 6)) : null,
                    n > 7 ? substitution(rule(ctx, 7)) : null);
            case EQRES -> new EqresArgs(literalRef(rule(ctx, 1)), n > 2 ? substitution(rule(ctx, 2)) : null);
            case EQFACTOR -> new EqfactorArgs(literalRef(rule(ctx, 1)), literalRef(rule(ctx, 3)),
                    n > 4 ? substitution(rule(ctx, 4)) : null);
            case REFLEXIVITY -> new ReflexivityArgs();
            default -> throw unexpected(ctx);
        };
    }

    private ResolveArgs resolve(ParserRuleContext ctx) throws InputError {
        // RESOLVE literalRef substitution? COMMA literalRef substitution?
        int i = 1;
        LiteralRef left = literalRef(rule(ctx, i++));
        RawSubstitution leftSubst = null;
        if (!(ctx.getChild(i) instanceof TerminalNode)) {
            leftSubst = substitution(rule(ctx, i++));
        }
        i++; // the comma
        LiteralRef right = literalRef(rule(ctx, i++));
        RawSubstitution rightSubst = i < ctx.getChildCount() ? substitution(rule(ctx, i)) : null;
        return new ResolveArgs(left, leftSubst, right, rightSubst);
    }

    // ---- formulas

    /**
     * The formula of a parse tree. The parse tree has checked the syntax; this hands its tokens,
     * in order, to a {@link FormulaAssembler}, which applies precedence and builds the tree.
     */
    RawFormula formula(ParserRuleContext root) throws InputError {
        List<ParseTree> pending = new ArrayList<>();
        FormulaAssembler formula = assembler;
        formula.start();
        pending.add(root);
        while (!pending.isEmpty()) {
            ParseTree node = pending.remove(pending.size() - 1);
            if (node instanceof TerminalNode terminal) {
                Token token = terminal.getSymbol();
                switch (token.getType()) {
                    case AssayLexer.NOT -> formula.not(at(token));
                    case AssayLexer.AND -> formula.connective(FormulaAssembler.AND, at(token));
                    case AssayLexer.OR -> formula.connective(FormulaAssembler.OR, at(token));
                    case AssayLexer.IMPLIES -> formula.connective(FormulaAssembler.IMPLIES, at(token));
                    case AssayLexer.IFF -> formula.connective(FormulaAssembler.IFF, at(token));
                    case AssayLexer.LPAREN -> formula.openParenthesis();
                    case AssayLexer.RPAREN -> formula.closeParenthesis();
                    case AssayLexer.TRUE, AssayLexer.FALSE ->
                            formula.operand(new RawConstant(token.getType() == AssayLexer.TRUE, at(token)), 0);
                    default -> throw new IllegalStateException("unexpected token in a formula: " + token.getText());
                }
                continue;
            }
            ParserRuleContext ctx = (ParserRuleContext) node;
            switch (kind(ctx)) {
                case QUANTIFIER -> {
                    int n = ctx.getChildCount();
                    List<Name> variables = new ArrayList<>(n - 2);
                    for (int v = 1; v < n - 1; v++) {
                        variables.add(name(ctx, v));
                    }
                    formula.quantifier(type(ctx, 0) == AssayLexer.FORALL, variables, at(ctx.start));
                }
                case ATOM -> formula.atom(atom(ctx));
                case FORMULA, IMPLIES_FORMULA, OR_FORMULA, AND_FORMULA, UNARY_FORMULA, PRIMARY_FORMULA -> {
                    for (int i = ctx.getChildCount() - 1; i >= 0; i--) {
                        pending.add(ctx.getChild(i));
                    }
                }
                default -> throw unexpected(ctx);
            }
        }
        return formula.finish();
    }

    RawAtomic atom(ParserRuleContext ctx) {
        RawTerm left = term(rule(ctx, 0));
        if (ctx.getChildCount() == 1) {
            return new RawPredicateAtom(left);
        }
        return new RawEquation(left, term(rule(ctx, 2)), type(ctx, 1) == AssayLexer.NEQ, left.at());
    }

    RawTerm term(ParserRuleContext ctx) {
        Token name = token(ctx, 0);
        int n = ctx.getChildCount();
        if (n == 1) {
            return new RawTerm(name.getText(), List.of(), at(name));
        }
        // IDENT ( term , term ... )
        List<RawTerm> args = new ArrayList<>(n / 2);
        for (int i = 2; i < n; i += 2) {
            args.add(term(rule(ctx, i)));
        }
        return new RawTerm(name.getText(), args, at(name));
    }

    // ---- clauses and rule arguments

    RawClause clause(ParserRuleContext ctx) {
        if (type(ctx, 0) == AssayLexer.FALSE) {
            return new RawClause(null, List.of(), at(ctx.start));
        }
        int i = 0;
        List<Name> variables = null;
        if (kind(rule(ctx, 0)) == GrammarRule.VARIABLE_LIST) {
            variables = names(rule(ctx, 0), 1);
            i = 1;
        }
        int n = ctx.getChildCount();
        List<RawLiteral> literals = new ArrayList<>((n - i + 1) / 2);
        for (; i < n; i += 2) {
            ParserRuleContext literal = rule(ctx, i);
            boolean negated = literal.getChildCount() == 2;
            literals.add(new RawLiteral(negated, atom(rule(literal, negated ? 1 : 0)), at(literal.start)));
        }
        return new RawClause(variables, literals, at(ctx.start));
    }

    RawSubstitution substitution(ParserRuleContext ctx) {
        int n = ctx.getChildCount();
        List<RawBinding> bindings = new ArrayList<>(n / 2);
        for (int i = 1; i < n - 1; i += 2) {
            ParserRuleContext binding = rule(ctx, i);
            bindings.add(new RawBinding(name(binding, 0), term(rule(binding, 2))));
        }
        return new RawSubstitution(bindings, at(ctx.start));
    }

    LiteralRef literalRef(ParserRuleContext ctx) throws InputError {
        return new LiteralRef(name(ctx, 0), number(token(ctx, 2), 1, "literal indices"), at(ctx.start));
    }

    TermPosition termPosition(ParserRuleContext ctx) throws InputError {
        List<Integer> path = new ArrayList<>();
        for (int i = 0; i < ctx.getChildCount(); i += 2) {
            path.add(number(token(ctx, i), 1, "term positions"));
        }
        return new TermPosition(path, at(ctx.start));
    }

    /** The number a token spells, at least {@code least}; {@code what} names it in the message. */
    private int number(Token token, int least, String what) throws InputError {
        String digits = token.getText();
        long value = 0;
        for (int i = 0; i < digits.length(); i++) {
            value = value * 10 + (digits.charAt(i) - '0');
            if (value > Integer.MAX_VALUE) {
                throw new InputError(at(token), "the number " + shorten(digits) + " is too large");
            }
        }
        if (value < least) {
            throw new InputError(at(token), least == 1 ? what + " count from 1, found 0" : what + " must be at least " + least);
        }
        return (int) value;
    }

    // ---- tree access

    private GrammarRule kind(ParserRuleContext ctx) {
        return rules[ctx.getRuleIndex()];
    }

    private static ParserRuleContext rule(ParserRuleContext ctx, int i) {
        return (ParserRuleContext) ctx.getChild(i);
    }

    private static Token token(ParserRuleContext ctx, int i) {
        return ((TerminalNode) ctx.getChild(i)).getSymbol();
    }

    private static int type(ParserRuleContext ctx, int i) {
        ParseTree child = ctx.getChild(i);
        return child instanceof TerminalNode terminal ? terminal.getSymbol().getType() : -1;
    }

    private Name name(ParserRuleContext ctx, int i) {
        Token token = token(ctx, i);
        return new Name(token.getText(), at(token));
    }

    /** The names at children {@code from}, {@code from + 2}, ... (a comma-separated list). */
    private List<Name> names(ParserRuleContext ctx, int from) {
        List<Name> names = new ArrayList<>();
        for (int i = from; i < ctx.getChildCount(); i += 2) {
            names.add(name(ctx, i));
        }
        return names;
    }

    private Location at(Token token) {
        return SyntaxErrors.locationOf(file, token);
    }

    private static String shorten(String text) {
        return text.length() > 40 ? text.substring(0, 37) + "..." : text;
    }

    private IllegalStateException unexpected(ParserRuleContext ctx) {
        return new IllegalStateException("grammar and builder disagree at rule " + kind(ctx));
    }
}
