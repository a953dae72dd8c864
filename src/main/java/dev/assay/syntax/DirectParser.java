package dev.assay.syntax;

import dev.assay.syntax.grammar.AssayLexer;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.antlr.v4.runtime.IntStream;

/**
 * Reads one statement straight from the characters into raw syntax, by recursive descent over
 * the grammars in {@code grammar/} without tokens objects, a parse tree or ANTLR's prediction,
 * which together took most of the time of reading a long certificate.
 *
 * <p>It is the fast path only. It accepts a statement only when the statement is well formed
 * and within every limit, and it gives up ({@link Bail}) at anything else: a syntax error, a
 * number out of range, a bad digest, a nesting or size limit met, an {@code iff} chain. The
 * {@link StatementStream} then reads the same statement again with the generated parser, which
 * stays the definition of the language and writes every error message. So this class has one
 * duty: what it accepts, the generated parser accepts too, with the same raw syntax and the same
 * locations. {@code DirectParserTest} compares the two on every bundled file, on random
 * grammar-made files and on files with mistakes.
 *
 * <p>Tokens are scanned as {@link FastLexer} scans them (the lexer grammar's longest match and
 * rule order), one token of lookahead. Formulas go through the {@link FormulaAssembler} that
 * {@link RawBuilder} uses, and terms are read with an explicit stack, so nothing here recurses
 * with the depth of the input. Nesting is counted as {@link DepthLimit} counts it.
 */
final class DirectParser {

    /** Thrown to hand a statement to the generated parser; it carries no stack trace. */
    static final class Bail extends Exception {
        private static final Bail INSTANCE = new Bail();

        private Bail() {
            super(null, null, false, false);
        }
    }

    private static final int EOF = IntStream.EOF;
    private static final int[] SINGLE = FastLexer.SINGLE;
    private static final String[] SPELLING = new String[AssayLexer.VOCABULARY.getMaxTokenType() + 1];

    static {
        for (int type = 1; type <= AssayLexer.VOCABULARY.getMaxTokenType(); type++) {
            String literal = AssayLexer.VOCABULARY.getLiteralName(type);
            if (literal != null) SPELLING[type] = literal.substring(1, literal.length() - 1);
        }
    }

    private final String file;
    private final ReaderCharStream in;
    private final int maxDepth;
    private final long maxTermSize;
    private final FormulaAssembler formula;

    // The position of the next character, as the lexers count it: line from 1, column from 0.
    private int line = 1;
    private int column;

    // The current token: its type, where it starts, its text for a name, its value for a number.
    private int type;
    private int tokenStart;
    private int tokenLine;
    private int tokenColumn;
    private String text;
    /** The value of an INT token, or -1 when it does not fit an int. */
    private int number;

    // Per statement: the open nesting levels and the symbol occurrences, as DepthLimit counts them.
    private int open;
    private long termNodes;

    DirectParser(String file, ReaderCharStream in, int maxDepth, long maxTermSize) {
        this.file = file;
        this.in = in;
        this.maxDepth = maxDepth;
        this.maxTermSize = maxTermSize;
        this.formula = new FormulaAssembler(maxDepth);
    }

    int line() {
        return line;
    }

    int column() {
        return column;
    }

    /** Moves to a place the generated lexer has reached: character {@code index}, at {@code line} and {@code column}. */
    void moveTo(int index, int line, int column) {
        in.seek(index);
        this.line = line;
        this.column = column;
        this.tokenLine = line;
        this.tokenColumn = column;
    }

    /** Where the current token starts, once a statement has been read: the next statement or the end of the file. */
    Location nextTokenAt() {
        return new Location(file, Math.max(1, tokenLine), tokenColumn + 1);
    }

    // ---- statements

    /** The next problem statement, or null at the end of the file. */
    ProblemStatement problemStatement() throws Bail {
        begin();
        Location at = here();
        ProblemStatement statement;
        switch (type) {
            case EOF -> {
                return null;
            }
            case AssayLexer.PROBLEM -> {
                advance();
                statement = new ProblemHeader(name(), at);
            }
            case AssayLexer.DECLARE -> statement = declaration(at);
            case AssayLexer.AXIOM -> {
                advance();
                Name name = name();
                expect(AssayLexer.COLON);
                statement = new Axiom(name, formula(), at);
            }
            case AssayLexer.GOAL -> {
                advance();
                Name name = name();
                expect(AssayLexer.COLON);
                statement = new Goal(name, formula(), at);
            }
            default -> throw Bail.INSTANCE;
        }
        if (type != AssayLexer.PROBLEM && type != AssayLexer.DECLARE && type != AssayLexer.AXIOM
                && type != AssayLexer.GOAL && type != EOF) {
            throw Bail.INSTANCE;
        }
        end();
        return statement;
    }

    /** The next certificate statement, or null at the end of the file. */
    CertificateStatement certificateStatement() throws Bail {
        begin();
        Location at = here();
        CertificateStatement statement;
        switch (type) {
            case EOF -> {
                return null;
            }
            case AssayLexer.STEP -> statement = step(at);
            case AssayLexer.FORGET -> {
                advance();
                statement = new Forget(names(), at);
            }
            case AssayLexer.CERTIFICATE -> {
                advance();
                expect(AssayLexer.FOR);
                statement = new CertificateHeader(name(), at);
            }
            case AssayLexer.DIGEST -> {
                advance();
                if (type != AssayLexer.STRING) throw Bail.INSTANCE;
                String digits = RawBuilder.digestDigits(in.textOf(tokenStart + 1, in.index() - 2));
                if (digits == null) throw Bail.INSTANCE;
                advance();
                statement = new Digest(digits, at);
            }
            default -> throw Bail.INSTANCE;
        }
        if (type != AssayLexer.STEP && type != AssayLexer.FORGET && type != AssayLexer.CERTIFICATE
                && type != AssayLexer.DIGEST && type != EOF) {
            throw Bail.INSTANCE;
        }
        end();
        return statement;
    }

    private void begin() {
        open = 0;
        termNodes = 0;
        advance();
    }

    /** Leaves the next statement's first token unread, for the next call or for the generated parser. */
    private void end() {
        moveTo(tokenStart, tokenLine, tokenColumn);
    }

    private Declaration declaration(Location at) throws Bail {
        advance();
        DeclarationKind kind;
        if (type == AssayLexer.FUNCTION) {
            kind = DeclarationKind.FUNCTION;
        } else if (type == AssayLexer.PREDICATE) {
            kind = DeclarationKind.PREDICATE;
        } else {
            throw Bail.INSTANCE;
        }
        advance();
        List<DeclaredSymbol> symbols = new ArrayList<>();
        while (true) {
            Name name = name();
            expect(AssayLexer.SLASH);
            symbols.add(new DeclaredSymbol(name, number(0)));
            if (type != AssayLexer.COMMA) break;
            advance();
        }
        return new Declaration(kind, symbols, at);
    }

    private Step step(Location at) throws Bail {
        advance();
        Name label = name();
        expect(AssayLexer.COLON);
        RawConclusion stated;
        if (type == AssayLexer.FORMULA) {
            advance();
            stated = formula();
        } else if (type == AssayLexer.CLAUSE) {
            advance();
            stated = clause();
        } else {
            throw Bail.INSTANCE;
        }
        expect(AssayLexer.BY);
        int rule = type;
        if (rule < AssayLexer.NEGATE || rule > AssayLexer.REFLEXIVITY) {
            throw Bail.INSTANCE;
        }
        Name ruleName = new Name(SPELLING[rule], here());
        advance();
        return new Step(label, stated, ruleName, arguments(rule), at);
    }

    private RuleArgs arguments(int rule) throws Bail {
        switch (rule) {
            case AssayLexer.NEGATE:
                return new NegateArgs(name());
            case AssayLexer.NNF:
                return new NnfArgs(name());
            case AssayLexer.SKOLEMIZE: {
                Name premise = name();
                if (type != AssayLexer.FRESH) return new SkolemizeArgs(premise, List.of());
                advance();
                return new SkolemizeArgs(premise, names());
            }
            case AssayLexer.CLAUSIFY:
                return new ClausifyArgs(name(), optionalSubstitution());
            case AssayLexer.DEFINE:
                expect(AssayLexer.FRESH);
                return new DefineArgs(name());
            case AssayLexer.ABBREVIATE: {
                Name premise = name();
                expect(AssayLexer.USING);
                return new AbbreviateArgs(premise, name());
            }
            case AssayLexer.RESOLVE: {
                LiteralRef left = literalRef();
                RawSubstitution leftSubst = optionalSubstitution();
                expect(AssayLexer.COMMA);
                LiteralRef right = literalRef();
                return new ResolveArgs(left, leftSubst, right, optionalSubstitution());
            }
            case AssayLexer.FACTOR: {
                LiteralRef first = literalRef();
                expect(AssayLexer.COMMA);
                return new FactorArgs(first, literalRef(), optionalSubstitution());
            }
            case AssayLexer.INSTANTIATE: {
                Name premise = name();
                if (type != AssayLexer.LBRACE) throw Bail.INSTANCE;
                return new InstantiateArgs(premise, substitution());
            }
            case AssayLexer.PARAMODULATE: {
                LiteralRef from = literalRef();
                Direction direction;
                if (type == AssayLexer.RIGHT_ARROW) {
                    direction = Direction.LEFT_TO_RIGHT;
                } else if (type == AssayLexer.LEFT_ARROW) {
                    direction = Direction.RIGHT_TO_LEFT;
                } else {
                    throw Bail.INSTANCE;
                }
                advance();
                LiteralRef into = literalRef();
                expect(AssayLexer.AT);
                TermPosition position = termPosition();
                RawSubstitution first = optionalSubstitution();
                RawSubstitution second = first == null ? null : optionalSubstitution();
                return new ParamodulateArgs(from, direction, into, position, first, second);
            }
            case AssayLexer.EQRES: {
                LiteralRef literal = literalRef();
                return new EqresArgs(literal, optionalSubstitution());
            }
            case AssayLexer.EQFACTOR: {
                LiteralRef first = literalRef();
                expect(AssayLexer.COMMA);
                return new EqfactorArgs(first, literalRef(), optionalSubstitution());
            }
            case AssayLexer.REFLEXIVITY:
                return new ReflexivityArgs();
            default:
                throw Bail.INSTANCE;
        }
    }

    // ---- formulas

    /** formula: operands and operators in the order of the grammar's precedence rules, assembled as RawBuilder does. */
    private RawFormula formula() throws Bail {
        FormulaAssembler f = formula;
        f.start();
        // pending[level]: the not and quantifier prefixes at this parenthesis level still waiting for their operand.
        int[] pending = new int[8];
        int level = 0;
        try {
            while (true) {
                // An operand, after any prefixes.
                while (true) {
                    if (type == AssayLexer.NOT) {
                        f.not(here());
                        deeper();
                        pending[level]++;
                        advance();
                    } else if (type == AssayLexer.FORALL || type == AssayLexer.EXISTS) {
                        boolean universal = type == AssayLexer.FORALL;
                        Location at = here();
                        advance();
                        if (type != AssayLexer.IDENT) throw Bail.INSTANCE;
                        List<Name> variables = new ArrayList<>(2);
                        do {
                            variables.add(new Name(text, here()));
                            advance();
                        } while (type == AssayLexer.IDENT);
                        expect(AssayLexer.DOT);
                        f.quantifier(universal, variables, at);
                        deeper();
                        pending[level]++;
                    } else if (type == AssayLexer.LPAREN) {
                        f.openParenthesis();
                        deeper();
                        if (++level == pending.length) pending = Arrays.copyOf(pending, 2 * level);
                        pending[level] = 0;
                        advance();
                    } else {
                        break;
                    }
                }
                if (type == AssayLexer.TRUE || type == AssayLexer.FALSE) {
                    f.operand(new RawConstant(type == AssayLexer.TRUE, here()), 0);
                    advance();
                } else if (type == AssayLexer.IDENT) {
                    RawAtomic atomic = atom();
                    f.operand(new RawAtom(atomic, atomic.at()), atomDepth);
                } else {
                    throw Bail.INSTANCE;
                }
                open -= pending[level];
                pending[level] = 0;
                // Closing parentheses, each completing an operand of the level around it.
                while (type == AssayLexer.RPAREN && level > 0) {
                    f.closeParenthesis();
                    open--;
                    level--;
                    open -= pending[level];
                    pending[level] = 0;
                    advance();
                }
                int connective = switch (type) {
                    case AssayLexer.AND -> FormulaAssembler.AND;
                    case AssayLexer.OR -> FormulaAssembler.OR;
                    case AssayLexer.IMPLIES -> FormulaAssembler.IMPLIES;
                    case AssayLexer.IFF -> FormulaAssembler.IFF;
                    default -> -1;
                };
                if (connective < 0) {
                    if (level > 0) throw Bail.INSTANCE;
                    return f.finish();
                }
                f.connective(connective, here());
                advance();
            }
        } catch (InputError e) {
            throw Bail.INSTANCE; // an iff chain or a tree too deep: the generated parser says which
        }
    }

    /** One more open nesting level, as DepthLimit counts them. */
    private void deeper() throws Bail {
        if (++open > maxDepth) throw Bail.INSTANCE;
    }

    // ---- atoms and terms

    /** The nesting of function applications in the arguments of the last atom read. */
    private int atomDepth;

    /** atom: term ((EQ | NEQ) term)? */
    private RawAtomic atom() throws Bail {
        RawTerm left = term();
        int depth = termDepth;
        if (type != AssayLexer.EQ && type != AssayLexer.NEQ) {
            atomDepth = depth;
            return new RawPredicateAtom(left);
        }
        boolean negated = type == AssayLexer.NEQ;
        advance();
        if (type != AssayLexer.IDENT) throw Bail.INSTANCE;
        RawTerm right = term();
        atomDepth = Math.max(depth, termDepth);
        return new RawEquation(left, right, negated, left.at());
    }

    /** The nesting of function applications in the arguments of the last term read (0 for a name or f(a, b)). */
    private int termDepth;

    private static final class Frame {
        String name;
        Location at;
        final List<RawTerm> args = new ArrayList<>(4);
        /** The deepest applicationDepth among the arguments so far. */
        int deepest;
    }

    private Frame[] frames = new Frame[16];

    /** term: IDENT (LPAREN term (COMMA term)* RPAREN)?, read with a stack of open applications. */
    private RawTerm term() throws Bail {
        int depth = 0; // open applications
        while (true) {
            if (type != AssayLexer.IDENT) throw Bail.INSTANCE;
            if (++termNodes > maxTermSize) throw Bail.INSTANCE;
            String name = text;
            Location at = here();
            advance();
            RawTerm value;
            int applicationDepth;
            if (type == AssayLexer.LPAREN) {
                if (depth > 0) deeper(); // an application inside another
                if (depth == frames.length) frames = Arrays.copyOf(frames, 2 * depth);
                Frame frame = frames[depth];
                if (frame == null) frame = frames[depth] = new Frame();
                frame.name = name;
                frame.at = at;
                frame.args.clear();
                frame.deepest = 0;
                depth++;
                advance();
                continue;
            }
            value = new RawTerm(name, List.of(), at);
            applicationDepth = 0;
            // Close every application this argument ends.
            while (true) {
                if (depth == 0) {
                    termDepth = applicationDepth == 0 ? 0 : applicationDepth - 1;
                    return value;
                }
                Frame frame = frames[depth - 1];
                frame.args.add(value);
                frame.deepest = Math.max(frame.deepest, applicationDepth);
                if (type == AssayLexer.COMMA) {
                    advance();
                    break;
                }
                if (type != AssayLexer.RPAREN) throw Bail.INSTANCE;
                advance();
                depth--;
                if (depth > 0) open--;
                value = new RawTerm(frame.name, frame.args, frame.at);
                applicationDepth = 1 + frame.deepest;
            }
        }
    }

    // ---- clauses and rule arguments

    /** clause: variableList? literal (OR literal)* | FALSE */
    private RawClause clause() throws Bail {
        Location at = here();
        if (type == AssayLexer.FALSE) {
            advance();
            return new RawClause(null, List.of(), at);
        }
        List<Name> variables = null;
        if (type == AssayLexer.LBRACKET) {
            advance();
            variables = names();
            expect(AssayLexer.RBRACKET);
        }
        List<RawLiteral> literals = new ArrayList<>(4);
        while (true) {
            Location literalAt = here();
            boolean negated = type == AssayLexer.NOT;
            if (negated) advance();
            if (type != AssayLexer.IDENT) throw Bail.INSTANCE;
            literals.add(new RawLiteral(negated, atom(), literalAt));
            if (type != AssayLexer.OR) break;
            advance();
        }
        return new RawClause(variables, literals, at);
    }

    private RawSubstitution optionalSubstitution() throws Bail {
        return type == AssayLexer.LBRACE ? substitution() : null;
    }

    /** substitution: LBRACE (binding (COMMA binding)*)? RBRACE, at an LBRACE. */
    private RawSubstitution substitution() throws Bail {
        Location at = here();
        advance();
        List<RawBinding> bindings = new ArrayList<>(2);
        if (type != AssayLexer.RBRACE) {
            while (true) {
                Name variable = name();
                expect(AssayLexer.ASSIGN);
                if (type != AssayLexer.IDENT) throw Bail.INSTANCE;
                bindings.add(new RawBinding(variable, term()));
                if (type != AssayLexer.COMMA) break;
                advance();
            }
        }
        expect(AssayLexer.RBRACE);
        return new RawSubstitution(bindings, at);
    }

    /** literalRef: IDENT DOT INT, the index at least 1. */
    private LiteralRef literalRef() throws Bail {
        Location at = here();
        Name label = name();
        expect(AssayLexer.DOT);
        return new LiteralRef(label, number(1), at);
    }

    /** termPosition: INT (DOT INT)*, each at least 1. */
    private TermPosition termPosition() throws Bail {
        Location at = here();
        List<Integer> path = new ArrayList<>(4);
        path.add(number(1));
        while (type == AssayLexer.DOT) {
            advance();
            path.add(number(1));
        }
        return new TermPosition(path, at);
    }

    /** An INT token's value, at least {@code least}. */
    private int number(int least) throws Bail {
        if (type != AssayLexer.INT || number < least) throw Bail.INSTANCE;
        int value = number;
        advance();
        return value;
    }

    private Name name() throws Bail {
        if (type != AssayLexer.IDENT) throw Bail.INSTANCE;
        Name name = new Name(text, here());
        advance();
        return name;
    }

    /** IDENT (COMMA IDENT)* */
    private List<Name> names() throws Bail {
        List<Name> names = new ArrayList<>(2);
        names.add(name());
        while (type == AssayLexer.COMMA) {
            advance();
            names.add(name());
        }
        return names;
    }

    private void expect(int expected) throws Bail {
        if (type != expected) throw Bail.INSTANCE;
        advance();
    }

    private Location here() {
        return new Location(file, tokenLine, tokenColumn + 1);
    }

    // ---- tokens

    /** Scans the next token, skipping white space and comments, as FastLexer does. */
    private void advance() {
        ReaderCharStream in = this.in;
        int c = in.LA(1);
        while (true) {
            if (c == ' ' || c == '\t' || c == '\r' || c == '\f' || c == '\uFEFF') {
                in.consume();
                column++;
            } else if (c == '\n') {
                in.consume();
                line++;
                column = 0;
            } else if (c == '#') {
                do {
                    in.consume();
                    column++;
                    c = in.LA(1);
                } while (c != EOF && c != '\r' && c != '\n');
                continue;
            } else {
                break;
            }
            c = in.LA(1);
        }
        tokenStart = in.index();
        tokenLine = line;
        tokenColumn = column;
        if (c == EOF) {
            type = EOF;
            return;
        }
        if ((c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || c == '_') {
            text = in.consumeName();
            column += text.length();
            type = in.nameType;
            return;
        }
        if (c >= '0' && c <= '9') {
            long value = 0;
            do {
                if (value <= Integer.MAX_VALUE) value = value * 10 + (c - '0');
                in.consume();
                column++;
                c = in.LA(1);
            } while (c >= '0' && c <= '9');
            number = value > Integer.MAX_VALUE ? -1 : (int) value;
            type = AssayLexer.INT;
            return;
        }
        if (c == '"') {
            in.consume();
            column++;
            while (true) {
                c = in.LA(1);
                if (c == EOF || c == '\r' || c == '\n') {
                    type = AssayLexer.UNTERMINATED_STRING;
                    return;
                }
                in.consume();
                column++;
                if (c == '"') {
                    type = AssayLexer.STRING;
                    return;
                }
            }
        }
        int pair = FastLexer.pairType(c, in.LA(2));
        in.consume();
        column++;
        if (pair > 0) {
            if (pair != AssayLexer.COLON) {
                in.consume();
                column++;
            }
            type = pair;
            return;
        }
        if (pair == 0) {
            type = AssayLexer.ILLEGAL_CHARACTER;
            return;
        }
        int single = c < SINGLE.length ? SINGLE[c] : 0;
        type = single != 0 ? single : AssayLexer.ILLEGAL_CHARACTER;
    }
}
