package dev.assay.kernel;

import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * A clause: literals as written (literal indices count from 1 over this list), read as a set for every comparison.
 * Its variables are implicitly universally quantified and local to it.
 */
public final class Clause {

    private final List<Literal> literals;
    private volatile Set<Literal> set;
    private volatile List<Variable> variables;

    public Clause(List<Literal> literals) {
        this.literals = List.copyOf(literals);
    }

    public static Clause of(Collection<Literal> literals) {
        return new Clause(new ArrayList<>(literals));
    }

    public static final Clause EMPTY = new Clause(List.of());

    /** The literals as written. */
    public List<Literal> literals() {
        return literals;
    }

    /** Number of literals as written. */
    public int width() {
        return literals.size();
    }

    /** Literal {@code index}, counting from 1; null when out of range. */
    public Literal literal(int index) {
        return index >= 1 && index <= literals.size() ? literals.get(index - 1) : null;
    }

    /** The literals as a set (repetition removed, equations unordered), in order of first occurrence. */
    public Set<Literal> asSet() {
        Set<Literal> s = set;
        if (s == null) {
            s = new LinkedHashSet<>(literals);
            set = s;
        }
        return s;
    }

    public boolean isEmpty() {
        return literals.isEmpty();
    }

    /** Equal as sets of literals: same literals up to order, repetition and orientation of equations. */
    public boolean sameSet(Clause other) {
        if (literals.size() <= 8 && other.literals.size() <= 8) {
            // A few literals: each set contained in the other, without building either set.
            for (Literal l : literals) if (!other.literals.contains(l)) return false;
            for (Literal l : other.literals) if (!literals.contains(l)) return false;
            return true;
        }
        return asSet().equals(other.asSet());
    }

    /** The variables in order of first occurrence. */
    public List<Variable> variables() {
        List<Variable> v = variables;
        if (v == null) {
            List<Application> atoms = new ArrayList<>(literals.size());
            for (int i = 0; i < literals.size(); i++) atoms.add(literals.get(i).atom());
            v = List.copyOf(Terms.variablesOf(atoms));
            variables = v;
        }
        return v;
    }

    @Override
    public String toString() {
        return Printer.clause(this);
    }
}
