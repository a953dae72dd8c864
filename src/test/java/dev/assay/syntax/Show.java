package dev.assay.syntax;

import java.util.List;
import java.util.stream.Collectors;

/**
 * Raw syntax as compact S-expressions without locations, so tests can state a whole tree in one
 * string: {@code (and P(x) (not (= a b)))}, {@code [x] P(x) | ~Q(x)}, {@code {x:=f(y)}}.
 */
final class Show {

    private Show() {
    }

    static String term(RawTerm t) {
        if (t.args().isEmpty()) {
            return t.name();
        }
        return t.name() + "(" + t.args().stream().map(Show::term).collect(Collectors.joining(",")) + ")";
    }

    static String atom(RawAtomic a) {
        if (a instanceof RawEquation e) {
            return "(" + (e.negated() ? "!=" : "=") + " " + term(e.left()) + " " + term(e.right()) + ")";
        }
        return term(((RawPredicateAtom) a).term());
    }

    static String formula(RawFormula f) {
        if (f instanceof RawAtom a) {
            return atom(a.atom());
        } else if (f instanceof RawConstant c) {
            return c.value() ? "true" : "false";
        } else if (f instanceof RawNot n) {
            return "(not " + formula(n.body()) + ")";
        } else if (f instanceof RawAnd a) {
            return "(and " + all(a.operands()) + ")";
        } else if (f instanceof RawOr o) {
            return "(or " + all(o.operands()) + ")";
        } else if (f instanceof RawImplies i) {
            return "(implies " + formula(i.left()) + " " + formula(i.right()) + ")";
        } else if (f instanceof RawIff i) {
            return "(iff " + formula(i.left()) + " " + formula(i.right()) + ")";
        } else if (f instanceof RawQuantified q) {
            return "(" + (q.universal() ? "forall" : "exists") + " "
                    + q.variables().stream().map(Name::text).collect(Collectors.joining(" ")) + " "
                    + formula(q.body()) + ")";
        }
        throw new AssertionError(f);
    }

    private static String all(List<RawFormula> formulas) {
        return formulas.stream().map(Show::formula).collect(Collectors.joining(" "));
    }

    static String clause(RawClause c) {
        if (c.literals().isEmpty()) {
            return "false";
        }
        String literals = c.literals().stream()
                .map(l -> (l.negated() ? "~" : "") + atom(l.atom()))
                .collect(Collectors.joining(" | "));
        if (c.variables() == null) {
            return literals;
        }
        return "[" + c.variables().stream().map(Name::text).collect(Collectors.joining(" ")) + "] " + literals;
    }

    static String conclusion(RawConclusion c) {
        return c instanceof RawClause clause ? clause(clause) : formula((RawFormula) c);
    }

    static String substitution(RawSubstitution s) {
        if (s == null) {
            return "-";
        }
        return "{" + s.bindings().stream()
                .map(b -> b.variable().text() + ":=" + term(b.term()))
                .collect(Collectors.joining(",")) + "}";
    }

    static String args(RuleArgs args) {
        if (args instanceof NegateArgs a) {
            return a.goal().text();
        } else if (args instanceof NnfArgs a) {
            return a.premise().text();
        } else if (args instanceof SkolemizeArgs a) {
            return a.premise().text() + " fresh " + a.fresh().stream().map(Name::text).collect(Collectors.joining(","));
        } else if (args instanceof ClausifyArgs a) {
            return a.premise().text() + " " + substitution(a.theta());
        } else if (args instanceof DefineArgs a) {
            return "fresh " + a.fresh().text();
        } else if (args instanceof AbbreviateArgs a) {
            return a.premise().text() + " using " + a.definition().text();
        } else if (args instanceof ResolveArgs a) {
            return a.left() + " " + substitution(a.leftSubst()) + " " + a.right() + " " + substitution(a.rightSubst());
        } else if (args instanceof FactorArgs a) {
            return a.first() + " " + a.second() + " " + substitution(a.subst());
        } else if (args instanceof InstantiateArgs a) {
            return a.premise().text() + " " + substitution(a.subst());
        } else if (args instanceof ParamodulateArgs a) {
            return a.from() + (a.direction() == Direction.LEFT_TO_RIGHT ? " -> " : " <- ") + a.into() + " @ "
                    + a.position() + " " + substitution(a.fromSubst()) + " " + substitution(a.intoSubst());
        } else if (args instanceof EqresArgs a) {
            return a.literal() + " " + substitution(a.subst());
        } else if (args instanceof EqfactorArgs a) {
            return a.first() + " " + a.second() + " " + substitution(a.subst());
        } else if (args instanceof ReflexivityArgs) {
            return "";
        }
        throw new AssertionError(args);
    }

    static String step(Step s) {
        return s.label().text() + ": " + (s.isClauseStep() ? "clause " : "formula ") + conclusion(s.conclusion())
                + " by " + s.rule().text() + (args(s.args()).isEmpty() ? "" : " " + args(s.args()));
    }
}
