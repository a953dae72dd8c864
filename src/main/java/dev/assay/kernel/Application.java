package dev.assay.kernel;

import java.util.List;

/** A symbol applied to arguments; a constant or propositional atom has none. Made only by {@link TermFactory}. */
public final class Application implements Term {

    private final Symbol symbol;
    private final Term[] arguments;
    private final int hash;
    private final long treeSize;
    private final int depth;
    private final boolean ground;

    Application(Symbol symbol, Term[] arguments, int hash) {
        this.symbol = symbol;
        this.arguments = arguments;
        long size = 1;
        int d = 0;
        boolean g = true;
        for (Term a : arguments) {
            size += a.treeSize();
            if (size < 0) size = Long.MAX_VALUE;
            d = Math.max(d, a.depth());
            g &= a.isGround();
        }
        this.hash = hash;
        this.treeSize = size;
        this.depth = d + 1;
        this.ground = g;
    }

    public Symbol symbol() {
        return symbol;
    }

    public int arity() {
        return arguments.length;
    }

    public Term argument(int index) {
        return arguments[index];
    }

    public List<Term> arguments() {
        return List.of(arguments);
    }

    public boolean isEquation() {
        return symbol.isEquality();
    }

    Term[] argumentArray() {
        return arguments;
    }

    @Override
    public long treeSize() {
        return treeSize;
    }

    @Override
    public int depth() {
        return depth;
    }

    @Override
    public boolean isGround() {
        return ground;
    }

    @Override
    public int hashCode() {
        return hash;
    }

    @Override
    public String toString() {
        return Printer.term(this);
    }

    static int shapeHash(Symbol s, Term[] args) {
        // Mixed per argument (multiply, xor-shift): with h = 31 * h + a, a term f(t, t) would multiply t's hash by 32,
        // and a tower of such terms would shift its hashes to zero and share a few buckets.
        int h = s.hashCode();
        for (Term a : args) {
            h = (h ^ a.hashCode()) * 0x9e3779b1;
            h ^= h >>> 16;
        }
        return h;
    }
}
