package dev.assay.kernel;

import java.lang.ref.Reference;
import java.lang.ref.ReferenceQueue;
import java.lang.ref.WeakReference;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicLong;

/**
 * The one place terms are made. Every term is hash-consed: asking twice for the same structure gives the same
 * object, so structural equality is {@code ==} and an exponentially large term tree stays a small graph.
 * Safe for use from several threads.
 *
 * <p>The table holds its terms weakly: a term no clause, formula or other term still refers to is dropped from it by
 * the garbage collector, so a long certificate that forgets its steps does not keep every term it ever made. That
 * loses nothing, because identity only has to hold between terms that exist at the same time: a term made again after
 * its earlier copy was collected is the only copy.
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

    /** A weakly held term, with the key it is filed under so it can be removed once collected. */
    private static final class Held extends WeakReference<Application> {
        final Shape shape;

        Held(Application a, Shape shape, ReferenceQueue<Application> queue) {
            super(a, queue);
            this.shape = shape;
        }
    }

    private final ConcurrentHashMap<Shape, Held> applications = new ConcurrentHashMap<>();
    private final ReferenceQueue<Application> collected = new ReferenceQueue<>();
    private final ConcurrentHashMap<String, Variable> variables = new ConcurrentHashMap<>();
    private final AtomicLong freshCounter = new AtomicLong();

    /** The variable of this name. */
    public Variable variable(String name) {
        return variables.computeIfAbsent(name, Variable::new);
    }

    /** A variable no parsed clause or formula can contain, for renaming apart. */
    Variable freshVariable(String base) {
        // Not filed by name: no identifier contains a quote, and the counter makes the name unique, so this object is
        // the only variable of its name and the table need not keep it.
        return new Variable(base + "'" + freshCounter.incrementAndGet());
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
        // Looked up with the caller's array, which the probe does not keep; a term made anew gets a copy of its own,
        // and its key is hashed from that copy.
        Held held = applications.get(new Shape(symbol, arguments, Application.shapeHash(symbol, arguments)));
        Application found = held == null ? null : held.get();
        if (found != null) return found;
        Term[] copy = arguments.length == 0 ? arguments : Arrays.copyOf(arguments, arguments.length);
        int hash = Application.shapeHash(symbol, copy);
        Shape shape = new Shape(symbol, copy, hash);
        dropCollected();
        Application[] made = new Application[1];
        applications.compute(shape, (k, old) -> {
            Application a = old == null ? null : old.get();
            if (a != null) {
                made[0] = a;
                return old;
            }
            made[0] = new Application(symbol, copy, hash);
            return new Held(made[0], k, collected);
        });
        return made[0];
    }

    /** Removes the entries of terms the collector has reclaimed. */
    private void dropCollected() {
        for (Reference<? extends Application> r; (r = collected.poll()) != null; ) {
            Held h = (Held) r;
            applications.remove(h.shape, h);
        }
    }

    public Application application(Symbol symbol, List<? extends Term> arguments) {
        return application(symbol, arguments.toArray(new Term[0]));
    }

    /** The atom {@code left = right}, as written. */
    public Application equation(Term left, Term right) {
        return application(Symbol.EQUALITY, left, right);
    }

    /** Number of distinct applications in the table (for measurements; collected ones may still be counted). */
    public int size() {
        return applications.size();
    }
}
