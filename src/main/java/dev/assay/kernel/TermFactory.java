package dev.assay.kernel;

import java.util.Arrays;
import java.util.List;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicLong;

/**
 * The one place terms are made. Every term is hash-consed: asking twice for the same structure gives the same
 * object, so structural equality is {@code ==} and an exponentially large term tree stays a small graph.
 * Safe for use from several threads.
 */
public final class TermFactory {

    private record Shape(Symbol symbol, Term[] arguments, int hash) {
        @Override
        public boolean equals(Object o) {
            if (!(o instanceof Shape s) || s.hash != hash || !s.symbol.equals(symbol)) return false;
            if (s.arguments.length != arguments.length) return false;
            for (int i = 0; i < arguments.length; i++) if (s.arguments[i] != arguments[i]) return false;
            return true;
        }

        @Override
        public int hashCode() {
            return hash;
        }
    }

    private final ConcurrentHashMap<Shape, Application> applications = new ConcurrentHashMap<>();
    private final ConcurrentHashMap<String, Variable> variables = new ConcurrentHashMap<>();
    private final AtomicLong freshCounter = new AtomicLong();

    /** The variable of this name. */
    public Variable variable(String name) {
        return variables.computeIfAbsent(name, Variable::new);
    }

    /** A variable no parsed clause or formula can contain, for renaming apart. */
    Variable freshVariable(String base) {
        return variable(base + "'" + freshCounter.incrementAndGet());
    }

    /** The application of {@code symbol} to {@code arguments}; the arity must match. */
    public Application application(Symbol symbol, Term... arguments) {
        if (arguments.length != symbol.arity()) {
            throw new IllegalArgumentException(symbol + " applied to " + arguments.length + " arguments");
        }
        for (Term a : arguments) {
            if (a instanceof Application app && app.symbol().kind() == Symbol.Kind.PREDICATE) {
                throw new IllegalArgumentException("atom " + a + " used as an argument of " + symbol);
            }
        }
        Term[] copy = arguments.length == 0 ? arguments : Arrays.copyOf(arguments, arguments.length);
        int hash = Application.shapeHash(symbol, copy);
        Shape shape = new Shape(symbol, copy, hash);
        Application found = applications.get(shape);
        if (found != null) return found;
        return applications.computeIfAbsent(shape, s -> new Application(symbol, copy, hash));
    }

    public Application application(Symbol symbol, List<? extends Term> arguments) {
        return application(symbol, arguments.toArray(new Term[0]));
    }

    /** The atom {@code left = right}, as written. */
    public Application equation(Term left, Term right) {
        return application(Symbol.EQUALITY, left, right);
    }

    /** Number of distinct applications made so far (for measurements). */
    public int size() {
        return applications.size();
    }
}
