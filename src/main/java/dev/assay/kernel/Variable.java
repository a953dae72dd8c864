package dev.assay.kernel;

/** A variable, identified by its name within one {@link TermFactory}. */
public final class Variable implements Term {

    private final String name;
    private final int hash;

    Variable(String name) {
        this.name = name;
        this.hash = 0x9e3779b9 * name.hashCode() + 17;
    }

    public String name() {
        return name;
    }

    /** Variables made to rename a clause apart carry a name no identifier can have. */
    public boolean isInternal() {
        return name.indexOf('\'') >= 0;
    }

    @Override
    public long treeSize() {
        return 1;
    }

    @Override
    public int depth() {
        return 1;
    }

    @Override
    public boolean isGround() {
        return false;
    }

    @Override
    public int hashCode() {
        return hash;
    }

    @Override
    public String toString() {
        return name;
    }
}
