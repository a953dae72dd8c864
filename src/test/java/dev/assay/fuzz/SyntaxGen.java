package dev.assay.fuzz;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;

/**
 * Random text for the productions of {@code grammar/imports/Logic.g4} and the step arguments of
 * {@code grammar/CertificateParser.g4}: terms, atoms, formulas, clauses, substitutions, literal references and term
 * positions. The output is mostly well formed, so that the reader gets past the parser and the resolver and the kernel
 * see it; a small share of choices is deliberately off (an arity clash, a keyword as a name, a bound variable applied
 * to arguments, index 0), so that every check between the grammar and the kernel is reached too.
 *
 * <p>The scenario is a tram depot: the symbols are its sheds, roads, trams and rota, not a textbook example.
 */
public final class SyntaxGen {

    /** A symbol of the generated signature: a function (kind 'f') or a predicate ('p') with its arity. */
    public record Sym(String name, char kind, int arity) {
    }

    static final String[] KEYWORDS = {"problem", "declare", "function", "predicate", "axiom", "goal", "certificate",
        "for", "digest", "step", "formula", "clause", "by", "fresh", "using", "forget", "forall", "exists", "not",
        "and", "or", "implies", "iff", "true", "false", "negate", "nnf", "skolemize", "clausify", "define",
        "abbreviate", "resolve", "factor", "instantiate", "paramodulate", "eqres", "eqfactor", "reflexivity"};

    static final String[] RULES = {"negate", "nnf", "skolemize", "clausify", "define", "abbreviate", "resolve",
        "factor", "instantiate", "paramodulate", "eqres", "eqfactor", "reflexivity"};

    private static final String[] VARIABLES = {"x", "y", "z", "d", "t", "k", "s"};

    final Random random;
    /** Name to symbol, in the order they were made: the generated problem's signature. */
    final Map<String, Sym> signature = new LinkedHashMap<>();
    /** How often (in 1/1000) a choice is deliberately off; 0 makes a clean generator. */
    final int offPerMille;
    /** Whether the formula made last was an atom or a constant, which needs no parentheses as an operand. */
    private boolean lastWasAtomic;

    public SyntaxGen(Random random, int offPerMille) {
        this.random = random;
        this.offPerMille = offPerMille;
        String[] functions = {"depot", "yard", "shed", "tram7", "tram14", "night_bus", "next", "road_of", "relief",
            "link", "swap", "join3"};
        int[] functionArity = {0, 0, 0, 0, 0, 0, 1, 1, 1, 2, 2, 3};
        String[] predicates = {"Open", "Late", "Free", "Parked", "Serves", "Drives", "Route", "OnRota"};
        int[] predicateArity = {0, 0, 1, 2, 2, 2, 3, 1};
        for (int i = 0; i < functions.length; i++) {
            if (random.nextInt(4) != 0) signature.put(functions[i], new Sym(functions[i], 'f', functionArity[i]));
        }
        for (int i = 0; i < predicates.length; i++) {
            if (random.nextInt(4) != 0) signature.put(predicates[i], new Sym(predicates[i], 'p', predicateArity[i]));
        }
        // Keep at least one constant and one predicate so every production has something to use.
        signature.putIfAbsent("depot", new Sym("depot", 'f', 0));
        signature.putIfAbsent("Free", new Sym("Free", 'p', 1));
    }

    /** A generator over a given signature (for instance the one of a bundled problem). */
    public SyntaxGen(Random random, int offPerMille, java.util.Collection<Sym> symbols) {
        this.random = random;
        this.offPerMille = offPerMille;
        for (Sym s : symbols) signature.put(s.name(), s);
        if (symbols('f').isEmpty()) signature.put("depot", new Sym("depot", 'f', 0));
        if (symbols('p').isEmpty()) signature.put("Free", new Sym("Free", 'p', 1));
    }

    boolean off() {
        return random.nextInt(1000) < offPerMille;
    }

    int upTo(int n) {
        return random.nextInt(n);
    }

    <T> T pick(List<T> items) {
        return items.get(random.nextInt(items.size()));
    }

    String pick(String... items) {
        return items[random.nextInt(items.length)];
    }

    List<Sym> symbols(char kind) {
        List<Sym> out = new ArrayList<>();
        for (Sym s : signature.values()) if (s.kind() == kind) out.add(s);
        return out;
    }

    /** A name: mostly ordinary, sometimes a keyword, a very long identifier, or characters outside the alphabet. */
    public String name(String usual) {
        if (!off()) return usual;
        return switch (upTo(6)) {
            case 0 -> pick(KEYWORDS);
            case 1 -> usual + "_" + "q".repeat(200 + upTo(3000));
            case 2 -> usual + "\u00e9";
            case 3 -> "_" + usual;
            case 4 -> usual.toUpperCase();
            default -> usual + upTo(100);
        };
    }

    /** A number where the grammar has INT: mostly 1..3, sometimes 0, past 2^31-1, or a huge numeral. */
    public String number() {
        if (!off()) return Integer.toString(1 + upTo(3));
        return switch (upTo(6)) {
            case 0 -> "0";
            case 1 -> "99999999999";
            case 2 -> "2147483648";
            case 3 -> "2147483647";
            case 4 -> "0" + (1 + upTo(3));
            default -> "9".repeat(50 + upTo(5000));
        };
    }

    /** A term over the function symbols and the variables in scope. */
    public String term(int depth, List<String> vars) {
        if (!vars.isEmpty() && (depth <= 0 || upTo(3) == 0) && !off()) return pick(vars);
        List<Sym> fs = symbols('f');
        Sym f = pick(fs);
        if (depth <= 0 && f.arity() > 0) {
            List<Sym> constants = fs.stream().filter(s -> s.arity() == 0).toList();
            if (!constants.isEmpty()) f = pick(constants);
            // A signature without constants: end the term with a variable, or with a name it does not know.
            else return vars.isEmpty() ? "depot" : pick(vars);
        }
        if (depth < -2) return vars.isEmpty() ? pick(fs).name() : pick(vars);
        int arity = off() ? upTo(4) : f.arity();
        if (!vars.isEmpty() && off()) return pick(vars) + "(" + term(depth - 1, vars) + ")";
        return application(name(f.name()), arity, depth, vars);
    }

    private String application(String name, int arity, int depth, List<String> vars) {
        if (arity == 0) return off() ? name + "()" : name;
        StringBuilder sb = new StringBuilder(name).append('(');
        for (int i = 0; i < arity; i++) {
            if (i > 0) sb.append(", ");
            sb.append(term(depth - 1, vars));
        }
        return sb.append(')').toString();
    }

    /** An atom: a predicate application or an equation or disequation of two terms. */
    public String atom(int depth, List<String> vars) {
        if (upTo(4) == 0) {
            String op = upTo(3) == 0 ? pick("!=", "\u2260") : "=";
            return term(depth, vars) + " " + op + " " + term(depth, vars);
        }
        Sym p = pick(symbols('p'));
        int arity = off() ? upTo(4) : p.arity();
        if (off()) p = pick(symbols('f'));
        return application(name(p.name()), arity, depth, vars);
    }

    /** A formula with every connective, quantifiers binding one to three variables, and Unicode spellings. */
    public String formula(int depth, List<String> vars) {
        int choice = depth <= 0 ? upTo(10) : upTo(22);
        lastWasAtomic = choice < 10;
        if (choice < 8) return atom(Math.max(depth, 1), vars);
        if (choice == 8) return pick("true", "false", "\u22a4", "\u22a5");
        if (choice == 9) return "(" + atom(1, vars) + ")";
        if (choice <= 12) {
            List<String> inner = new ArrayList<>(vars);
            StringBuilder q = new StringBuilder(pick("forall", "exists", "forall", "exists", "\u2200", "\u2203"));
            int n = off() ? 0 : 1 + upTo(3);
            for (int i = 0; i < n; i++) {
                String v = off() ? pick(symbols('f')).name() : pick(VARIABLES);
                q.append(' ').append(name(v));
                inner.add(v);
            }
            q.append(off() ? " " : ". ");
            String body = formula(depth - 1, inner);
            lastWasAtomic = false;
            return upTo(3) == 0 ? "(" + q + body + ")" : q + body;
        }
        if (choice <= 14) {
            String operand = unary(depth - 1, vars);
            lastWasAtomic = false;
            return pick("not ", "not ", "\u00ac") + operand;
        }
        String op = switch (choice) {
            case 15, 16 -> pick("and", "and", "\u2227");
            case 17, 18 -> pick("or", "or", "\u2228");
            case 19, 20 -> pick("implies", "\u2192");
            default -> pick("iff", "\u2194");
        };
        int n = op.equals("iff") || op.equals("\u2194") || op.equals("implies") || op.equals("\u2192") ? 2 : 2 + upTo(2);
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < n; i++) {
            if (i > 0) sb.append(' ').append(op).append(' ');
            String part = formula(depth - 1, vars);
            // Mostly parenthesised, so that the precedence rules are exercised without making every file an error.
            // A clean generator parenthesises every operand that is not atomic: two unparenthesised iff at one
            // level are a parse error (iff is non-associative), which only a deliberate slip may make.
            boolean bare = upTo(4) == 0 && (offPerMille > 0 || lastWasAtomic);
            sb.append(bare ? part : "(" + part + ")");
        }
        lastWasAtomic = false;
        return sb.toString();
    }

    private String unary(int depth, List<String> vars) {
        String f = formula(depth, vars);
        return upTo(3) == 0 && (offPerMille > 0 || lastWasAtomic) ? f : "(" + f + ")";
    }

    /** A closed formula: free names are symbols anyway (FORMAT.md §2), so any formula is closed by construction. */
    public String closedFormula(int depth) {
        return formula(depth, List.of());
    }

    /** A clause with its variable bracket; {@code false} sometimes. */
    public String clause(int literals, int depth) {
        if (upTo(10) == 0) return off() ? "[x] false" : pick("false", "\u22a5");
        List<String> vars = new ArrayList<>();
        int nv = upTo(3);
        for (int i = 0; i < nv; i++) if (!vars.contains(VARIABLES[i])) vars.add(VARIABLES[i]);
        StringBuilder sb = new StringBuilder();
        if (!vars.isEmpty() || off()) {
            List<String> listed = new ArrayList<>(vars);
            if (off()) listed.add(pick(VARIABLES));
            if (off() && !listed.isEmpty()) listed.remove(0);
            sb.append('[').append(String.join(", ", listed)).append("] ");
        }
        for (int i = 0; i < Math.max(1, literals); i++) {
            if (i > 0) sb.append(pick(" or ", " or ", " \u2228 "));
            if (upTo(2) == 0) sb.append(pick("not ", "\u00ac"));
            sb.append(atom(depth, vars));
        }
        return sb.toString();
    }

    /** {@code {x := t, ...}}, sometimes {@code {}} or with {@code ↦}. */
    public String substitution(List<String> vars) {
        int n = upTo(4);
        StringBuilder sb = new StringBuilder("{");
        for (int i = 0; i < n; i++) {
            if (i > 0) sb.append(", ");
            String v = off() || vars.isEmpty() ? pick(VARIABLES) : pick(vars);
            sb.append(v).append(upTo(5) == 0 ? " \u21a6 " : " := ").append(term(2, List.of(VARIABLES).subList(0, 3)));
        }
        return sb.append('}').toString();
    }

    /** {@code A.i}. */
    public String literalRef(String label) {
        return label + "." + number();
    }

    /** {@code 1.2.1}. */
    public String position() {
        int n = 1 + upTo(3);
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < n; i++) {
            if (i > 0) sb.append('.');
            sb.append(number());
        }
        return sb.toString();
    }
}
