package dev.assay.kernel;

/** A function or predicate symbol with its arity. Equality is built in and is not a symbol of the signature. */
public record Symbol(String name, Kind kind, int arity) {

    public enum Kind { FUNCTION, PREDICATE }

    /** The built-in equality predicate; its name cannot be written as an identifier. */
    public static final Symbol EQUALITY = new Symbol("=", Kind.PREDICATE, 2);

    public Symbol {
        if (name == null || kind == null || arity < 0) throw new IllegalArgumentException("bad symbol");
    }

    // Symbols are compared on every unification and variant step: identity first, then the fields.
    @Override
    public boolean equals(Object o) {
        if (this == o) return true;
        return o instanceof Symbol s && s.arity == arity && s.kind == kind && s.name.equals(name);
    }

    @Override
    public int hashCode() {
        return name.hashCode() * 31 + arity;
    }

    public boolean isEquality() {
        return this.equals(EQUALITY);
    }

    @Override
    public String toString() {
        return name + "/" + arity;
    }
}
