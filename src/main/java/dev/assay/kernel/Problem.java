package dev.assay.kernel;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Set;

/** A problem as the kernel trusts it: its signature, its closed axioms, and at most one closed goal. */
public final class Problem {

    private final String name;
    private final Signature signature;
    private final LinkedHashMap<String, Formula> axioms;
    private final String goalName;
    private final Formula goal;

    private Problem(Builder b) {
        this.name = b.name;
        this.signature = new Signature(b.signature);
        this.axioms = new LinkedHashMap<>(b.axioms);
        this.goalName = b.goalName;
        this.goal = b.goal;
    }

    public String name() {
        return name;
    }

    public Signature signature() {
        return signature;
    }

    public Map<String, Formula> axioms() {
        return Collections.unmodifiableMap(axioms);
    }

    public String goalName() {
        return goalName;
    }

    /** The goal, or null when the problem has none. */
    public Formula goal() {
        return goal;
    }

    /**
     * Collects a problem. Misuse (a second goal, an open formula, a symbol not declared first) is a bug in the
     * caller, which must have reported it with a location already, so it throws.
     */
    public static final class Builder {
        private final String name;
        private final Signature signature = new Signature();
        private final LinkedHashMap<String, Formula> axioms = new LinkedHashMap<>();
        private String goalName;
        private Formula goal;

        public Builder(String name) {
            this.name = name;
        }

        public Builder declare(Symbol s) {
            signature.add(s, Signature.Origin.PROBLEM, null);
            return this;
        }

        public Signature signature() {
            return signature;
        }

        public Builder axiom(String axiomName, Formula f) {
            require(axiomName, f);
            if (axioms.putIfAbsent(axiomName, f) != null) throw new IllegalArgumentException("duplicate " + axiomName);
            return this;
        }

        public Builder goal(String goalName, Formula f) {
            require(goalName, f);
            if (goal != null) throw new IllegalArgumentException("second goal " + goalName);
            this.goalName = goalName;
            this.goal = f;
            return this;
        }

        private void require(String formulaName, Formula f) {
            if (axioms.containsKey(formulaName) || formulaName.equals(goalName)) {
                throw new IllegalArgumentException("duplicate " + formulaName);
            }
            Set<Variable> free = Formulas.freeVariables(f);
            if (!free.isEmpty()) throw new IllegalArgumentException(formulaName + " is not closed: " + free);
            for (Symbol s : Formulas.symbols(f)) {
                if (!signature.admits(s)) throw new IllegalArgumentException(s + " is not declared");
            }
        }

        public Problem build() {
            return new Problem(this);
        }
    }
}
