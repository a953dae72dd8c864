package dev.assay.kernel;

/**
 * A signed atom. Equality and hashing treat an equation as unordered ({@code s = t} equals {@code t = s}), so sets of
 * literals are clause sets as the certificate language defines them; {@link #atom()} keeps the orientation as written,
 * which term positions and {@code eqfactor} refer to.
 */
public record Literal(boolean positive, Application atom) {

    public Literal {
        if (atom.symbol().kind() != Symbol.Kind.PREDICATE) {
            throw new IllegalArgumentException(atom + " is a term, not an atom");
        }
    }

    public boolean isEquation() {
        return atom.isEquation();
    }

    public Literal negated() {
        return new Literal(!positive, atom);
    }

    /** Left side of an equation as written. */
    public Term left() {
        return atom.argument(0);
    }

    /** Right side of an equation as written. */
    public Term right() {
        return atom.argument(1);
    }

    @Override
    public boolean equals(Object o) {
        if (this == o) return true;
        if (!(o instanceof Literal other) || other.positive != positive) return false;
        if (other.atom == atom) return true;
        return atom.isEquation() && other.atom.isEquation()
                && atom.argument(0) == other.atom.argument(1) && atom.argument(1) == other.atom.argument(0);
    }

    @Override
    public int hashCode() {
        int h = atom.isEquation() ? atom.argument(0).hashCode() + atom.argument(1).hashCode() : atom.hashCode();
        return positive ? h : ~h;
    }

    @Override
    public String toString() {
        return Printer.literal(this);
    }
}
