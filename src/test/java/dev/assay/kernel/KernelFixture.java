package dev.assay.kernel;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * Test-only shorthand for kernel values. It reads a small subset of the certificate language (FORMAT.md sections 2
 * and 5): terms, atoms, literals, clauses with an optional variable bracket, formulas, and substitutions.
 *
 * <p>An identifier is a variable when a quantifier binds it, when a clause bracket lists it, when it was passed to the
 * constructor, or, by default, when it is a letter from {@code u} to {@code z} followed by digits ({@code x}, {@code y1},
 * {@code x0}). Every other identifier is a symbol: a symbol declared here keeps its kind and arity; an undeclared one is
 * a predicate in atom position and a function elsewhere, with the arity it is used with, and is remembered. Using a name
 * with a second kind or arity throws, so a test cannot build an ill-sorted value by accident (tests that need one build
 * it by hand).
 *
 * <p>This parser is recursive; it is for short test inputs only. Deep inputs are built directly.
 */
final class KernelFixture {

    static final Pattern DEFAULT_VARIABLE = Pattern.compile("[u-z][0-9]*");

    final TermFactory f;
    private final Map<String, Symbol> symbols = new LinkedHashMap<>();
    private final Set<String> variables = new HashSet<>();

    KernelFixture(String... variableNames) {
        this(new TermFactory(), variableNames);
    }

    KernelFixture(TermFactory factory, String... variableNames) {
        this.f = factory;
        variables.addAll(List.of(variableNames));
    }

    // ------------------------------------------------------------------ symbols

    Symbol function(String name, int arity) {
        return declare(new Symbol(name, Symbol.Kind.FUNCTION, arity));
    }

    Symbol predicate(String name, int arity) {
        return declare(new Symbol(name, Symbol.Kind.PREDICATE, arity));
    }

    Symbol symbol(String name) {
        Symbol s = symbols.get(name);
        if (s == null) throw new IllegalArgumentException("no symbol " + name);
        return s;
    }

    private Symbol declare(Symbol s) {
        Symbol old = symbols.putIfAbsent(s.name(), s);
        if (old != null && !old.equals(s)) throw new IllegalArgumentException(s.name() + " is already " + old);
        return s;
    }

    /** Every symbol read or declared so far. */
    List<Symbol> symbols() {
        return new ArrayList<>(symbols.values());
    }

    /** A problem builder with every symbol known so far declared. */
    Problem.Builder problem(String name) {
        Problem.Builder b = new Problem.Builder(name);
        for (Symbol s : symbols.values()) b.declare(s);
        return b;
    }

    Variable var(String name) {
        return f.variable(name);
    }

    // ------------------------------------------------------------------ entry points

    /**
     * A term; also an atom when the text is an equation or its head starts with an upper-case letter, so that
     * unification tests can be written on atoms.
     */
    Term term(String text) {
        Parser p = new Parser(text, Set.of());
        Parser.Raw raw = p.rawTerm();
        Term t;
        if (p.accept("=")) t = k().equation(p.toTerm(raw), p.toTerm(p.rawTerm()));
        else if (Character.isUpperCase(raw.name().charAt(0))) t = p.toAtom(raw);
        else t = p.toTerm(raw);
        p.end();
        return t;
    }

    private TermFactory k() {
        return f;
    }

    Application atom(String text) {
        return literal(text).atom();
    }

    Literal literal(String text) {
        Parser p = new Parser(text, Set.of());
        Literal l = p.literal();
        p.end();
        return l;
    }

    Clause clause(String text) {
        Parser p = new Parser(text, Set.of());
        Clause c = p.clause();
        p.end();
        return c;
    }

    Formula formula(String text) {
        Parser p = new Parser(text, Set.of());
        Formula fm = p.formula();
        p.end();
        return fm;
    }

    /** {@code {x := t, y := g(z)}}; the braces may be left out. Names in {@code extraVariables} are variables too. */
    Substitution substitution(String text, String... extraVariables) {
        Parser p = new Parser(text, Set.of(extraVariables));
        Substitution s = p.substitution();
        p.end();
        return s;
    }

    // ------------------------------------------------------------------ direct builders

    Application app(String symbol, Term... arguments) {
        Symbol s = symbols.get(symbol);
        if (s == null) s = declare(new Symbol(symbol, Symbol.Kind.FUNCTION, arguments.length));
        return f.application(s, arguments);
    }

    static Clause clauseOf(Literal... literals) {
        return new Clause(List.of(literals));
    }

    // ------------------------------------------------------------------ comparison up to renaming

    /**
     * Whether there is a one-to-one renaming of variables that maps every term of {@code a} onto the term of
     * {@code b} at the same index.
     */
    static boolean sameUpToRenaming(List<Term> a, List<Term> b) {
        if (a.size() != b.size()) return false;
        Map<Variable, Variable> forward = new HashMap<>();
        Map<Variable, Variable> backward = new HashMap<>();
        java.util.ArrayDeque<Term[]> stack = new java.util.ArrayDeque<>();
        for (int i = 0; i < a.size(); i++) stack.push(new Term[] {a.get(i), b.get(i)});
        while (!stack.isEmpty()) {
            Term[] p = stack.pop();
            Term x = p[0];
            Term y = p[1];
            if (x instanceof Variable vx) {
                if (!(y instanceof Variable vy)) return false;
                Variable old = forward.putIfAbsent(vx, vy);
                if (old != null && old != vy) return false;
                Variable oldBack = backward.putIfAbsent(vy, vx);
                if (oldBack != null && oldBack != vx) return false;
                continue;
            }
            if (!(y instanceof Application ay)) return false;
            Application ax = (Application) x;
            if (!ax.symbol().equals(ay.symbol())) return false;
            for (int i = 0; i < ax.arity(); i++) stack.push(new Term[] {ax.argument(i), ay.argument(i)});
        }
        return true;
    }

    /** Whether σ and μ agree on {@code vars} up to a one-to-one renaming of the variables in their range. */
    static boolean sameUnifierUpToRenaming(Substitution sigma, Substitution mu, List<Variable> vars) {
        List<Term> a = new ArrayList<>();
        List<Term> b = new ArrayList<>();
        for (Variable v : vars) {
            a.add(sigma.apply(v));
            b.add(mu.apply(v));
        }
        return sameUpToRenaming(a, b);
    }

    static List<Variable> variablesOf(Term... terms) {
        Set<Variable> out = new LinkedHashSet<>();
        for (Term t : terms) Terms.collectVariables(t, out);
        return new ArrayList<>(out);
    }

    // ------------------------------------------------------------------ the parser

    private final class Parser {
        private record Raw(String name, List<Raw> arguments) {
        }

        private final List<String> tokens = new ArrayList<>();
        private int at;
        private final Set<String> extra;
        private final ArrayList<String> bound = new ArrayList<>();
        private Set<String> bracket;

        Parser(String text, Set<String> extra) {
            this.extra = extra;
            int i = 0;
            while (i < text.length()) {
                char c = text.charAt(i);
                if (Character.isWhitespace(c)) {
                    i++;
                } else if (Character.isLetter(c) || c == '_') {
                    int j = i;
                    while (j < text.length() && (Character.isLetterOrDigit(text.charAt(j)) || text.charAt(j) == '_'
                            || text.charAt(j) == '\'')) j++;
                    tokens.add(text.substring(i, j));
                    i = j;
                } else if (text.startsWith("!=", i) || text.startsWith(":=", i)) {
                    tokens.add(text.substring(i, i + 2));
                    i += 2;
                } else if ("(),.[]{}=".indexOf(c) >= 0) {
                    tokens.add(String.valueOf(c));
                    i++;
                } else {
                    throw new IllegalArgumentException("unexpected '" + c + "' in " + text);
                }
            }
        }

        String peek() {
            return at < tokens.size() ? tokens.get(at) : "";
        }

        String next() {
            if (at >= tokens.size()) throw new IllegalArgumentException("unexpected end in " + tokens);
            return tokens.get(at++);
        }

        boolean accept(String t) {
            if (peek().equals(t)) {
                at++;
                return true;
            }
            return false;
        }

        void expect(String t) {
            if (!accept(t)) throw new IllegalArgumentException("expected " + t + " at " + peek() + " in " + tokens);
        }

        void end() {
            if (at != tokens.size()) throw new IllegalArgumentException("trailing " + tokens.subList(at, tokens.size()));
        }

        boolean isVariable(String name) {
            if (bracket != null) return bracket.contains(name) || bound.contains(name);
            return bound.contains(name) || variables.contains(name) || extra.contains(name)
                    || DEFAULT_VARIABLE.matcher(name).matches();
        }

        Raw rawTerm() {
            String name = next();
            if (!Character.isLetter(name.charAt(0)) && name.charAt(0) != '_') {
                throw new IllegalArgumentException("expected an identifier at " + name);
            }
            List<Raw> args = new ArrayList<>();
            if (accept("(")) {
                do args.add(rawTerm()); while (accept(","));
                expect(")");
            }
            return new Raw(name, args);
        }

        Term toTerm(Raw r) {
            if (r.arguments.isEmpty() && isVariable(r.name)) return f.variable(r.name);
            Term[] args = new Term[r.arguments.size()];
            for (int i = 0; i < args.length; i++) args[i] = toTerm(r.arguments.get(i));
            Symbol s = symbols.get(r.name);
            if (s == null) s = declare(new Symbol(r.name, Symbol.Kind.FUNCTION, args.length));
            return f.application(s, args);
        }

        Application toAtom(Raw r) {
            Term[] args = new Term[r.arguments.size()];
            for (int i = 0; i < args.length; i++) args[i] = toTerm(r.arguments.get(i));
            Symbol s = symbols.get(r.name);
            if (s == null) s = declare(new Symbol(r.name, Symbol.Kind.PREDICATE, args.length));
            return f.application(s, args);
        }

        /** An atom, or an equation or disequation as a literal. */
        Literal atomLiteral() {
            Raw left = rawTerm();
            if (accept("=")) return new Literal(true, f.equation(toTerm(left), toTerm(rawTerm())));
            if (accept("!=")) return new Literal(false, f.equation(toTerm(left), toTerm(rawTerm())));
            return new Literal(true, toAtom(left));
        }

        Literal literal() {
            if (accept("not")) return atomLiteral().negated();
            return atomLiteral();
        }

        Clause clause() {
            if (accept("[")) {
                bracket = new HashSet<>();
                do bracket.add(next()); while (accept(","));
                expect("]");
            }
            if (accept("false")) return Clause.EMPTY;
            List<Literal> out = new ArrayList<>();
            do out.add(literal()); while (accept("or"));
            return new Clause(out);
        }

        Substitution substitution() {
            boolean braces = accept("{");
            Map<Variable, Term> out = new LinkedHashMap<>();
            if (!(braces && peek().equals("}"))) {
                do {
                    String v = next();
                    expect(":=");
                    out.put(f.variable(v), toTerm(rawTerm()));
                } while (accept(","));
            }
            if (braces) expect("}");
            return new Substitution(f, out);
        }

        Formula formula() {
            if (peek().equals("forall") || peek().equals("exists")) return quantified();
            Formula left = implication();
            if (accept("iff")) return new Formula.Iff(left, implication());
            return left;
        }

        Formula quantified() {
            boolean universal = next().equals("forall");
            List<String> names = new ArrayList<>();
            while (!peek().equals(".")) names.add(next());
            expect(".");
            bound.addAll(names);
            Formula body = formula();
            for (int i = 0; i < names.size(); i++) bound.remove(bound.size() - 1);
            for (int i = names.size() - 1; i >= 0; i--) body = new Formula.Quantified(universal, f.variable(names.get(i)), body);
            return body;
        }

        Formula implication() {
            Formula left = disjunction();
            if (accept("implies")) return new Formula.Implies(left, implicationOrQuantified());
            return left;
        }

        private Formula implicationOrQuantified() {
            if (peek().equals("forall") || peek().equals("exists")) return quantified();
            return implication();
        }

        Formula disjunction() {
            List<Formula> parts = new ArrayList<>();
            parts.add(conjunction());
            while (accept("or")) parts.add(conjunction());
            return parts.size() == 1 ? parts.get(0) : new Formula.Or(parts);
        }

        Formula conjunction() {
            List<Formula> parts = new ArrayList<>();
            parts.add(unary());
            while (accept("and")) parts.add(unary());
            return parts.size() == 1 ? parts.get(0) : new Formula.And(parts);
        }

        Formula unary() {
            if (accept("not")) return new Formula.Not(unary());
            if (accept("true")) return Formula.Constant.TRUE;
            if (accept("false")) return Formula.Constant.FALSE;
            if (peek().equals("forall") || peek().equals("exists")) return quantified();
            if (accept("(")) {
                Formula inner = formula();
                expect(")");
                return inner;
            }
            return new Formula.Atomic(atomLiteral());
        }
    }
}
