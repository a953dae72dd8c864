package dev.assay.check;

import dev.assay.kernel.Clause;
import dev.assay.kernel.Signature;
import dev.assay.kernel.Substitution;
import dev.assay.kernel.Symbol;
import dev.assay.kernel.TermFactory;
import dev.assay.kernel.Variable;
import dev.assay.syntax.ClausifyArgs;
import dev.assay.syntax.DefineArgs;
import dev.assay.syntax.EqfactorArgs;
import dev.assay.syntax.EqresArgs;
import dev.assay.syntax.FactorArgs;
import dev.assay.syntax.InputError;
import dev.assay.syntax.InstantiateArgs;
import dev.assay.syntax.ParamodulateArgs;
import dev.assay.syntax.RawClause;
import dev.assay.syntax.RawSubstitution;
import dev.assay.syntax.ReflexivityArgs;
import dev.assay.syntax.ResolveArgs;
import dev.assay.syntax.Resolver;
import dev.assay.syntax.RuleArgs;
import dev.assay.syntax.SkolemizeArgs;
import dev.assay.syntax.Step;
import dev.assay.syntax.StepProblem;

import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;

/**
 * Resolves the names of clause steps on the reading thread, ahead of the checker, so that the checking thread only
 * runs the kernel. It is a cache, not a judge: a step it cannot resolve, for any reason, is left for the checker,
 * which then resolves it itself and words any error in its own order; a step it did resolve comes out exactly as the
 * checker would have resolved it, because both use the same {@link Resolver} code on the same text with the same
 * symbols, and resolving has no effect besides its result.
 *
 * <p>The symbols known at a step are the problem's and those introduced by the skolemize and define steps before it.
 * The checker stops at the first step it does not accept, so a step it reaches comes after accepted steps only, and an
 * accepted step adds exactly the symbols its {@code fresh} list names with the kind and arity their use gives. This
 * table adds the same symbols, as the steps are read; the checker still compares the number of symbols each
 * resolution assumed with its signature's, and resolves again on any difference. After a skolemize or define step
 * whose symbols cannot be worked out here, nothing more is prepared.
 */
final class Preparer {

    /**
     * A clause step resolved ahead: its conclusion and its stated substitutions in the order the checker asks for
     * them (null where none is stated), with the number of symbols the resolution assumed.
     */
    record Prepared(Step step, Clause clause, Substitution[] substitutions, int signatureSize) {
    }

    private final Resolver resolver;
    private final Map<String, Symbol> symbols = new HashMap<>();
    private boolean stopped;

    /** Made on the checker's thread, before the reading thread starts; used only on the reading thread after that. */
    Preparer(TermFactory terms, Signature signature) {
        this.resolver = new Resolver(terms);
        for (Signature.Entry e : signature.entries()) symbols.put(e.symbol().name(), e.symbol());
    }

    /** The step resolved, or null when it is not a clause step or cannot be resolved here. */
    Prepared prepare(Step s) {
        if (stopped) return null;
        RuleArgs args = s.args();
        try {
            if (args instanceof SkolemizeArgs a) {
                introduce(resolver.freshSymbols(s.conclusion(), a.fresh(), symbols::get));
                return null;
            }
            if (args instanceof DefineArgs a) {
                introduce(resolver.freshSymbols(s.conclusion(), List.of(a.fresh()), symbols::get));
                return null;
            }
            RawSubstitution[] raw = substitutions(args);
            if (raw == null || !(s.conclusion() instanceof RawClause rc)) return null;
            Clause c = resolver.stepClause(rc, symbols::get);
            Substitution[] out = new Substitution[raw.length];
            for (int i = 0; i < raw.length; i++) out[i] = substitution(raw[i], c);
            return new Prepared(s, c, out, symbols.size());
        } catch (InputError | StepProblem | RuntimeException e) {
            // Left for the checker, which reports it in its place. A symbol table that may be wrong is not used again.
            if (args instanceof SkolemizeArgs || args instanceof DefineArgs) stopped = true;
            return null;
        }
    }

    private void introduce(List<Symbol> fresh) {
        for (Symbol f : fresh) symbols.put(f.name(), f);
    }

    private Substitution substitution(RawSubstitution raw, Clause conclusion) throws InputError, StepProblem {
        if (raw == null) return null;
        List<Variable> vars = conclusion.variables();
        return resolver.substitution(raw, symbols::get, vars.size() <= 16 ? vars : new HashSet<>(vars));
    }

    /**
     * The stated substitutions of a clause rule, in the order {@code Checker} resolves them; null for a rule whose
     * conclusion is a formula.
     */
    static RawSubstitution[] substitutions(RuleArgs args) {
        if (args instanceof ResolveArgs a) return new RawSubstitution[] {a.leftSubst(), a.rightSubst()};
        if (args instanceof FactorArgs a) return new RawSubstitution[] {a.subst()};
        if (args instanceof InstantiateArgs a) return new RawSubstitution[] {a.subst()};
        if (args instanceof ParamodulateArgs a) return new RawSubstitution[] {a.fromSubst(), a.intoSubst()};
        if (args instanceof EqresArgs a) return new RawSubstitution[] {a.subst()};
        if (args instanceof EqfactorArgs a) return new RawSubstitution[] {a.subst()};
        if (args instanceof ClausifyArgs a) return new RawSubstitution[] {a.theta()};
        if (args instanceof ReflexivityArgs) return new RawSubstitution[0];
        return null;
    }
}
