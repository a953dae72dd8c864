package dev.assay.report;

import dev.assay.kernel.Clause;
import dev.assay.kernel.Formula;
import dev.assay.kernel.Printer;
import dev.assay.kernel.Problem;
import dev.assay.kernel.Signature;
import dev.assay.kernel.Symbol;
import dev.assay.syntax.AbbreviateArgs;
import dev.assay.syntax.ClausifyArgs;
import dev.assay.syntax.DefineArgs;
import dev.assay.syntax.Direction;
import dev.assay.syntax.EqfactorArgs;
import dev.assay.syntax.EqresArgs;
import dev.assay.syntax.FactorArgs;
import dev.assay.syntax.InstantiateArgs;
import dev.assay.syntax.LiteralRef;
import dev.assay.syntax.Name;
import dev.assay.syntax.NegateArgs;
import dev.assay.syntax.NnfArgs;
import dev.assay.syntax.ParamodulateArgs;
import dev.assay.syntax.RawBinding;
import dev.assay.syntax.RawSubstitution;
import dev.assay.syntax.RawTerm;
import dev.assay.syntax.ResolveArgs;
import dev.assay.syntax.RuleArgs;
import dev.assay.syntax.SkolemizeArgs;
import dev.assay.syntax.Step;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;

/** The canonical re-print of a problem and of certificate steps as the checker understood them. */
public final class Canonical {

    private Canonical() {
    }

    public static String problem(Problem p) {
        StringBuilder sb = new StringBuilder("problem ").append(p.name()).append('\n');
        List<String> functions = new ArrayList<>();
        List<String> predicates = new ArrayList<>();
        for (Signature.Entry e : p.signature().entries()) {
            Symbol s = e.symbol();
            (s.kind() == Symbol.Kind.FUNCTION ? functions : predicates).add(s.name() + "/" + s.arity());
        }
        if (!functions.isEmpty()) sb.append("declare function ").append(String.join(", ", functions)).append('\n');
        if (!predicates.isEmpty()) sb.append("declare predicate ").append(String.join(", ", predicates)).append('\n');
        for (Map.Entry<String, Formula> a : p.axioms().entrySet()) {
            sb.append("axiom ").append(a.getKey()).append(": ").append(Printer.formula(a.getValue(), Printer.UNLIMITED))
                    .append('\n');
        }
        if (p.goal() != null) {
            sb.append("goal ").append(p.goalName()).append(": ").append(Printer.formula(p.goal(), Printer.UNLIMITED))
                    .append('\n');
        }
        return sb.toString();
    }

    public static String step(Step s, Object conclusion) {
        String body = conclusion instanceof Clause c ? "clause " + Printer.clause(c, Printer.UNLIMITED)
                : "formula " + Printer.formula((Formula) conclusion, Printer.UNLIMITED);
        return "step " + s.label().text() + ": " + body + " by " + s.args().ruleName() + arguments(s.args());
    }

    /** The rule and its arguments as written, e.g. {@code resolve c1.1, c2.1}. */
    public static String rule(RuleArgs a) {
        return a.ruleName() + arguments(a);
    }

    private static String arguments(RuleArgs a) {
        if (a instanceof NegateArgs x) return " " + x.goal().text();
        if (a instanceof NnfArgs x) return " " + x.premise().text();
        if (a instanceof SkolemizeArgs x) {
            return " " + x.premise().text() + (x.fresh().isEmpty() ? ""
                    : " fresh " + x.fresh().stream().map(Name::text).collect(Collectors.joining(", ")));
        }
        if (a instanceof ClausifyArgs x) return " " + x.premise().text() + subst(x.theta());
        if (a instanceof DefineArgs x) return " fresh " + x.fresh().text();
        if (a instanceof AbbreviateArgs x) return " " + x.premise().text() + " using " + x.definition().text();
        if (a instanceof ResolveArgs x) {
            return " " + ref(x.left()) + subst(x.leftSubst()) + ", " + ref(x.right()) + subst(x.rightSubst());
        }
        if (a instanceof FactorArgs x) return " " + ref(x.first()) + ", " + ref(x.second()) + subst(x.subst());
        if (a instanceof InstantiateArgs x) return " " + x.premise().text() + subst(x.subst());
        if (a instanceof ParamodulateArgs x) {
            String pos = x.position().path().stream().map(String::valueOf).collect(Collectors.joining("."));
            String sa = x.fromSubst() == null && x.intoSubst() != null ? " {}" : subst(x.fromSubst());
            return " " + ref(x.from()) + (x.direction() == Direction.LEFT_TO_RIGHT ? " -> " : " <- ") + ref(x.into())
                    + " @ " + pos + sa + subst(x.intoSubst());
        }
        if (a instanceof EqresArgs x) return " " + ref(x.literal()) + subst(x.subst());
        if (a instanceof EqfactorArgs x) return " " + ref(x.first()) + ", " + ref(x.second()) + subst(x.subst());
        return "";
    }

    private static String ref(LiteralRef r) {
        return r.label().text() + "." + r.index();
    }

    private static String subst(RawSubstitution s) {
        if (s == null) return "";
        List<String> parts = new ArrayList<>();
        for (RawBinding b : s.bindings()) parts.add(b.variable().text() + " := " + term(b.term()));
        return " {" + String.join(", ", parts) + "}";
    }

    private static String term(RawTerm t) {
        if (t.args().isEmpty()) return t.name();
        return t.name() + "(" + t.args().stream().map(Canonical::term).collect(Collectors.joining(", ")) + ")";
    }
}
