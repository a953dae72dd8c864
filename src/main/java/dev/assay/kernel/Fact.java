package dev.assay.kernel;

/**
 * A formula or clause the kernel has accepted: an axiom of the problem, or the conclusion of a step whose rule
 * checked. Only the kernel makes facts; code outside can hold them and pass them back as premises.
 *
 * <p>A kernel that defers checks (see {@link Kernel#Kernel(Problem, TermFactory, boolean)}) makes the fact of a clause
 * step before the second part of its check has run: such a fact is provisional, {@link #pending} is that check, and
 * only {@link Kernel#settle} returning null says that it, and every other fact of the kernel, is checked.
 */
public final class Fact {

    private final Kernel owner;
    private final String label;
    private final Formula formula;
    private final Clause clause;
    private final Definition definition;
    private final Deferred pending;

    /** What a {@code define} step established: {@code forall params. (symbol(params) iff body)}. */
    record Definition(Symbol symbol, java.util.List<Variable> parameters, Formula body) {
    }

    Fact(Kernel owner, String label, Formula formula, Clause clause) {
        this(owner, label, formula, clause, null);
    }

    Fact(Kernel owner, String label, Formula formula, Clause clause, Definition definition) {
        this(owner, label, formula, clause, definition, null);
    }

    /** A provisional clause fact, whose check {@code pending} has still to pass. */
    static Fact provisional(Kernel owner, String label, Clause clause, Deferred pending) {
        return new Fact(owner, label, null, clause, null, pending);
    }

    private Fact(Kernel owner, String label, Formula formula, Clause clause, Definition definition, Deferred pending) {
        if ((formula == null) == (clause == null)) throw new IllegalArgumentException("formula xor clause");
        this.owner = owner;
        this.label = label;
        this.formula = formula;
        this.clause = clause;
        this.definition = definition;
        this.pending = pending;
    }

    /**
     * The deferred check this fact was made before, or null when its rule checked it in full. Code outside the kernel
     * runs it on a thread of its choice; whether it passed is {@link Kernel#settle}'s to say.
     */
    public Deferred pending() {
        return pending;
    }

    /** The definition a {@code define} step made, or null. */
    Definition definition() {
        return definition;
    }

    Kernel owner() {
        return owner;
    }

    public String label() {
        return label;
    }

    public boolean isClause() {
        return clause != null;
    }

    /** The formula, or null for a clause fact. */
    public Formula formula() {
        return formula;
    }

    /** The clause, or null for a formula fact. */
    public Clause clause() {
        return clause;
    }

    public boolean isEmptyClause() {
        return clause != null && clause.isEmpty();
    }

    @Override
    public String toString() {
        return label + ": " + (clause != null ? Printer.clause(clause) : Printer.formula(formula));
    }
}
