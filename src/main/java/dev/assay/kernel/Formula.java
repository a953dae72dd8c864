package dev.assay.kernel;

import java.util.List;

/**
 * First-order formulas as parsed. Values are plain immutable data with identity equality: compare them with
 * {@link Formulas#equivalent}, which works modulo renaming of bound variables, associativity and commutativity of
 * {@code and} and {@code or}, and the orientation of equations.
 * A bound variable is the {@link Variable} of its name; free variables of a formula are variables no quantifier binds.
 */
public sealed interface Formula {

    /** An atom or a negated atom; {@code s != t} is the negative literal of {@code s = t}. */
    final class Atomic implements Formula {
        private final Literal literal;

        public Atomic(Literal literal) {
            this.literal = literal;
        }

        public Literal literal() {
            return literal;
        }

        @Override
        public String toString() {
            return Printer.formula(this);
        }
    }

    final class Constant implements Formula {
        public static final Constant TRUE = new Constant(true);
        public static final Constant FALSE = new Constant(false);
        private final boolean value;

        private Constant(boolean value) {
            this.value = value;
        }

        public static Constant of(boolean value) {
            return value ? TRUE : FALSE;
        }

        public boolean value() {
            return value;
        }

        @Override
        public String toString() {
            return value ? "true" : "false";
        }
    }

    final class Not implements Formula {
        private final Formula body;

        public Not(Formula body) {
            this.body = body;
        }

        public Formula body() {
            return body;
        }

        @Override
        public String toString() {
            return Printer.formula(this);
        }
    }

    /** {@code and} or {@code or} over two or more parts. */
    sealed interface Junction extends Formula permits And, Or {
        List<Formula> parts();
    }

    final class And implements Junction {
        private final List<Formula> parts;

        public And(List<Formula> parts) {
            if (parts.size() < 2) throw new IllegalArgumentException("and needs two parts");
            this.parts = List.copyOf(parts);
        }

        @Override
        public List<Formula> parts() {
            return parts;
        }

        @Override
        public String toString() {
            return Printer.formula(this);
        }
    }

    final class Or implements Junction {
        private final List<Formula> parts;

        public Or(List<Formula> parts) {
            if (parts.size() < 2) throw new IllegalArgumentException("or needs two parts");
            this.parts = List.copyOf(parts);
        }

        @Override
        public List<Formula> parts() {
            return parts;
        }

        @Override
        public String toString() {
            return Printer.formula(this);
        }
    }

    final class Implies implements Formula {
        private final Formula left;
        private final Formula right;

        public Implies(Formula left, Formula right) {
            this.left = left;
            this.right = right;
        }

        public Formula left() {
            return left;
        }

        public Formula right() {
            return right;
        }

        @Override
        public String toString() {
            return Printer.formula(this);
        }
    }

    final class Iff implements Formula {
        private final Formula left;
        private final Formula right;

        public Iff(Formula left, Formula right) {
            this.left = left;
            this.right = right;
        }

        public Formula left() {
            return left;
        }

        public Formula right() {
            return right;
        }

        @Override
        public String toString() {
            return Printer.formula(this);
        }
    }

    /** {@code forall x. body} or {@code exists x. body}; {@code forall x y. body} is two nested nodes. */
    final class Quantified implements Formula {
        private final boolean universal;
        private final Variable variable;
        private final Formula body;

        public Quantified(boolean universal, Variable variable, Formula body) {
            this.universal = universal;
            this.variable = variable;
            this.body = body;
        }

        public boolean universal() {
            return universal;
        }

        public Variable variable() {
            return variable;
        }

        public Formula body() {
            return body;
        }

        @Override
        public String toString() {
            return Printer.formula(this);
        }
    }
}
