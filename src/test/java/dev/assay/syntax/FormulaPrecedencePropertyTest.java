package dev.assay.syntax;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.stream.Collectors;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;

/**
 * Random formula trees, written with as few parentheses as the rules of FORMAT.md §2 allow, read
 * back as the same tree. The writer below is an independent statement of those rules: binding
 * strength (quantifier, iff, implies, or, and, not, from loosest), iff non-associative, implies
 * to the right, and a quantifier's body extending as far right as possible, so that a quantifier
 * needs no parentheses exactly where nothing follows it up to the enclosing parenthesis.
 */
class FormulaPrecedencePropertyTest {

    private sealed interface F permits Atom, Not, Chain, Binary, Quantifier, Constant {
    }

    private record Atom(String text, String shown) implements F {
    }

    private record Not(F body) implements F {
    }

    private record Chain(boolean and, List<F> operands) implements F {
    }

    private record Binary(boolean iff, F left, F right) implements F {
    }

    private record Quantifier(boolean forall, List<String> variables, F body) implements F {
    }

    private record Constant(boolean value) implements F {
    }

    private static final String[][] ATOMS = {
        {"P", "P"}, {"Q(x)", "Q(x)"}, {"R(f(x), y)", "R(f(x),y)"}, {"x = f(y)", "(= x f(y))"}, {"a != b", "(!= a b)"},
    };

    private static F random(Random random, int depth) {
        int choice = depth == 0 ? random.nextInt(2) : random.nextInt(9);
        switch (choice) {
            case 0, 1 -> {
                if (random.nextInt(8) == 0) {
                    return new Constant(random.nextBoolean());
                }
                String[] atom = ATOMS[random.nextInt(ATOMS.length)];
                return new Atom(atom[0], atom[1]);
            }
            case 2 -> {
                return new Not(random(random, depth - 1));
            }
            case 3, 4 -> {
                List<F> operands = new ArrayList<>();
                int n = 2 + random.nextInt(3);
                for (int i = 0; i < n; i++) {
                    operands.add(random(random, depth - 1));
                }
                return new Chain(choice == 3, operands);
            }
            case 5, 6 -> {
                return new Binary(choice == 5, random(random, depth - 1), random(random, depth - 1));
            }
            default -> {
                List<String> variables = random.nextBoolean() ? List.of("x") : List.of("x", "y");
                return new Quantifier(random.nextBoolean(), variables, random(random, depth - 1));
            }
        }
    }

    private static String shown(F f) {
        if (f instanceof Atom a) {
            return a.shown();
        } else if (f instanceof Constant c) {
            return String.valueOf(c.value());
        } else if (f instanceof Not n) {
            return "(not " + shown(n.body()) + ")";
        } else if (f instanceof Chain c) {
            return "(" + (c.and() ? "and " : "or ") + c.operands().stream().map(FormulaPrecedencePropertyTest::shown)
                    .collect(Collectors.joining(" ")) + ")";
        } else if (f instanceof Binary b) {
            return "(" + (b.iff() ? "iff " : "implies ") + shown(b.left()) + " " + shown(b.right()) + ")";
        }
        Quantifier q = (Quantifier) f;
        return "(" + (q.forall() ? "forall " : "exists ") + String.join(" ", q.variables()) + " " + shown(q.body()) + ")";
    }

    /** How tightly each kind binds, loosest first. */
    private static int strength(F f) {
        if (f instanceof Quantifier) {
            return 0;
        } else if (f instanceof Binary b) {
            return b.iff() ? 1 : 2;
        } else if (f instanceof Chain c) {
            return c.and() ? 4 : 3;
        } else if (f instanceof Not) {
            return 5;
        }
        return 6;
    }

    /**
     * {@code f} written where it must bind at least {@code least}; {@code last} says whether
     * nothing follows it up to the enclosing parenthesis or the end.
     */
    private static String operand(F f, int least, boolean last, Words words) {
        boolean bare = f instanceof Quantifier ? last : strength(f) >= least;
        return bare ? write(f, last, words) : "(" + write(f, true, words) + ")";
    }

    private static String write(F f, boolean last, Words words) {
        if (f instanceof Atom a) {
            return words.atom(a.text());
        } else if (f instanceof Constant c) {
            return c.value() ? words.top : words.bottom;
        } else if (f instanceof Not n) {
            return words.not + " " + operand(n.body(), 5, last, words);
        } else if (f instanceof Chain c) {
            // An operand of the same connective is parenthesized: chains are kept as written.
            int least = c.and() ? 5 : 4;
            List<String> parts = new ArrayList<>();
            for (int i = 0; i < c.operands().size(); i++) {
                parts.add(operand(c.operands().get(i), least, last && i == c.operands().size() - 1, words));
            }
            return String.join(" " + (c.and() ? words.and : words.or) + " ", parts);
        } else if (f instanceof Binary b) {
            if (b.iff()) {
                return operand(b.left(), 2, false, words) + " " + words.iff + " " + operand(b.right(), 2, last, words);
            }
            return operand(b.left(), 3, false, words) + " " + words.implies + " " + operand(b.right(), 2, last, words);
        }
        Quantifier q = (Quantifier) f;
        return (q.forall() ? words.forall : words.exists) + " " + String.join(" ", q.variables()) + ". "
                + write(q.body(), last, words);
    }

    private record Words(String not, String and, String or, String implies, String iff, String forall, String exists,
                         String top, String bottom, boolean unicodeNotEqual) {
        static final Words ASCII = new Words("not", "and", "or", "implies", "iff", "forall", "exists", "true", "false", false);
        static final Words UNICODE = new Words("¬", "∧", "∨", "→", "↔", "∀", "∃", "⊤", "⊥", true);

        String atom(String text) {
            return unicodeNotEqual ? text.replace("!=", "≠") : text;
        }
    }

    @Property(tries = 400)
    void minimallyParenthesizedFormulasReadBackAsTheSameTree(@ForAll long seed) throws InputError {
        F f = random(new Random(seed), 5);
        String text = write(f, true, Words.ASCII);
        assertEquals(shown(f), Parse.showFormula(text), text);
    }

    @Property(tries = 200)
    void unicodeSpellingsReadAsTheSameTree(@ForAll long seed) throws InputError {
        F f = random(new Random(seed), 5);
        String text = write(f, true, Words.UNICODE);
        assertEquals(shown(f), Parse.showFormula(text), text);
    }

    @Property(tries = 200)
    void fullyParenthesizedFormulasReadBackAsTheSameTree(@ForAll long seed) throws InputError {
        F f = random(new Random(seed), 5);
        String text = parenthesized(f);
        assertEquals(shown(f), Parse.showFormula(text), text);
    }

    private static String parenthesized(F f) {
        if (f instanceof Atom a) {
            return a.text();
        } else if (f instanceof Constant c) {
            return String.valueOf(c.value());
        } else if (f instanceof Not n) {
            return "(not " + parenthesized(n.body()) + ")";
        } else if (f instanceof Chain c) {
            return "(" + c.operands().stream().map(FormulaPrecedencePropertyTest::parenthesized)
                    .collect(Collectors.joining(c.and() ? " and " : " or ")) + ")";
        } else if (f instanceof Binary b) {
            return "(" + parenthesized(b.left()) + (b.iff() ? " iff " : " implies ") + parenthesized(b.right()) + ")";
        }
        Quantifier q = (Quantifier) f;
        return "(" + (q.forall() ? "forall " : "exists ") + String.join(" ", q.variables()) + ". "
                + parenthesized(q.body()) + ")";
    }
}
