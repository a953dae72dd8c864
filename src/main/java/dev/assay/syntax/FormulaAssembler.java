package dev.assay.syntax;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Builds the raw formula of one parenthesis-balanced run of operators and operands, given in the
 * order they are written, with an operator stack (Dijkstra's shunting yard). It applies the
 * precedence of FORMAT.md §2, gives a quantifier everything to its right (see Logic.g4), flattens
 * chains of one connective, nests {@code implies} to the right and rejects an {@code iff} chain.
 * Nothing here recurses with the nesting of the formula, and the depth of what is built is
 * limited like the parser's ({@link DepthLimit}): each connective, {@code not} and quantifier of
 * the tree is a level, and so is each function application in an atom's arguments. (A chain of
 * implications or of quantifiers is flat to the parser but nests in the tree.)
 *
 * <p>Both readers of the syntax use it: {@link RawBuilder} on a parse tree and
 * {@link DirectParser} on the token stream, so the two cannot build different trees from the
 * same text. The caller has checked the syntax: an operand where one is expected, balanced
 * parentheses. One assembler is reused, formula after formula.
 */
final class FormulaAssembler {

    // The kinds of operator, by how tightly they bind. A quantifier binds loosest: no connective
    // to its right ends its body, only a closing parenthesis or the end of the formula. `not`
    // binds tightest. A parenthesis is a barrier.
    private static final int OPEN_PARENTHESIS = 0;
    private static final int QUANTIFIER = 1;
    static final int IFF = 2;
    static final int IMPLIES = 3;
    static final int OR = 4;
    static final int AND = 5;
    private static final int NOT = 6;

    /** An operator waiting for its right operand: a prefix, or a connective with its operands so far. */
    private static final class Operator {
        final int kind;
        final Location at;
        final boolean universal;
        final List<Name> variables;
        int operands;

        Operator(int kind, Location at, boolean universal, List<Name> variables, int operands) {
            this.kind = kind;
            this.at = at;
            this.universal = universal;
            this.variables = variables;
            this.operands = operands;
        }
    }

    private final int maxDepth;
    private final List<Operator> operators = new ArrayList<>();
    private final List<RawFormula> values = new ArrayList<>();
    /** The depth of each value on the value stack. */
    private int[] depths = new int[16];
    private int depthCount;

    FormulaAssembler(int maxDepth) {
        this.maxDepth = maxDepth;
    }

    /** Starts a formula; what an earlier formula left (after an error) is dropped. */
    void start() {
        operators.clear();
        values.clear();
        depthCount = 0;
    }

    void not(Location at) {
        operators.add(new Operator(NOT, at, false, null, 0));
    }

    void quantifier(boolean universal, List<Name> variables, Location at) {
        operators.add(new Operator(QUANTIFIER, at, universal, variables, 0));
    }

    void openParenthesis() {
        operators.add(new Operator(OPEN_PARENTHESIS, null, false, null, 0));
    }

    void closeParenthesis() throws InputError {
        while (operators.get(operators.size() - 1).kind != OPEN_PARENTHESIS) {
            reduce();
        }
        operators.remove(operators.size() - 1);
    }

    /** An operand: {@code depth} is its own nesting, 0 for a constant, the argument nesting for an atom. */
    void operand(RawFormula formula, int depth) {
        values.add(formula);
        pushDepth(depth);
    }

    /** An atom as an operand, with the nesting of its arguments as its depth. */
    void atom(RawAtomic atomic) {
        operand(new RawAtom(atomic, atomic.at()), depthOf(atomic));
    }

    /** A binary connective, {@link #AND}, {@link #OR}, {@link #IMPLIES} or {@link #IFF}, written at {@code at}. */
    void connective(int kind, Location at) throws InputError {
        // Everything that binds tighter is complete: `not`, and connectives of higher precedence.
        // An equal one stays: `and`/`or` gain an operand, `implies` nests to the right.
        while (!operators.isEmpty() && operators.get(operators.size() - 1).kind > kind) {
            reduce();
        }
        Operator top = operators.isEmpty() ? null : operators.get(operators.size() - 1);
        if (top != null && top.kind == kind && (kind == AND || kind == OR)) {
            top.operands++;
            return;
        }
        if (top != null && top.kind == IFF && kind == IFF) {
            throw new InputError(at, SyntaxErrors.iffIsNotAssociative());
        }
        operators.add(new Operator(kind, at, false, null, 2));
    }

    /** The formula, once every operand and operator has been given. */
    RawFormula finish() throws InputError {
        while (!operators.isEmpty()) {
            reduce();
        }
        if (values.size() != 1) {
            throw new IllegalStateException("a formula left " + values.size() + " values");
        }
        RawFormula result = values.remove(0);
        depthCount = 0;
        return result;
    }

    private void reduce() throws InputError {
        Operator op = operators.remove(operators.size() - 1);
        int last = values.size() - 1;
        RawFormula result;
        int depth;
        switch (op.kind) {
            case NOT -> {
                result = new RawNot(values.remove(last), op.at);
                depth = popDepth() + 1;
            }
            case QUANTIFIER -> {
                result = new RawQuantified(op.universal, op.variables, values.remove(last), op.at);
                depth = popDepth() + 1;
            }
            case AND, OR -> {
                List<RawFormula> tail = values.subList(values.size() - op.operands, values.size());
                List<RawFormula> operands = new ArrayList<>(tail);
                tail.clear();
                depth = 0;
                for (int i = 0; i < op.operands; i++) {
                    depth = Math.max(depth, popDepth());
                }
                depth++;
                result = op.kind == AND
                        ? new RawAnd(operands, operands.get(0).at())
                        : new RawOr(operands, operands.get(0).at());
            }
            case IMPLIES, IFF -> {
                RawFormula right = values.remove(last);
                RawFormula left = values.remove(last - 1);
                depth = Math.max(popDepth(), popDepth()) + 1;
                result = op.kind == IMPLIES ? new RawImplies(left, right, left.at()) : new RawIff(left, right, left.at());
            }
            default -> throw new IllegalStateException("unbalanced parentheses in a formula");
        }
        if (depth > maxDepth) {
            throw new InputError(result.at(), "nesting depth exceeds the limit of " + maxDepth
                    + " (raise it with --max-depth)");
        }
        values.add(result);
        pushDepth(depth);
    }

    private void pushDepth(int depth) {
        if (depthCount == depths.length) {
            depths = Arrays.copyOf(depths, 2 * depthCount);
        }
        depths[depthCount++] = depth;
    }

    private int popDepth() {
        return depths[--depthCount];
    }

    /** The nesting of function applications in the atom's arguments, as {@link DepthLimit} counts it. */
    private static int depthOf(RawAtomic atomic) {
        if (atomic instanceof RawEquation equation) {
            return Math.max(argumentDepth(equation.left()), argumentDepth(equation.right()));
        }
        return argumentDepth(((RawPredicateAtom) atomic).term());
    }

    private static int argumentDepth(RawTerm term) {
        int deepest = 0;
        for (RawTerm arg : term.args()) {
            deepest = Math.max(deepest, applicationDepth(arg));
        }
        return deepest;
    }

    /** 0 for a name, 1 + the deepest argument for an application. Recurses as the parser did. */
    private static int applicationDepth(RawTerm term) {
        return term.args().isEmpty() ? 0 : 1 + argumentDepth(term);
    }
}
