package dev.assay.fuzz;

import java.util.ArrayList;
import java.util.List;

/**
 * Random problem files after {@code grammar/ProblemParser.g4}: a header, declarations (sometimes contradicting the
 * uses, sometimes repeated), axioms and zero, one or (rarely) two goals, statements in any order, comments and
 * Unicode spellings.
 */
public final class ProblemGen {

    /** The generated text and what a certificate for it may refer to. */
    public record Generated(String name, String text, List<CertificateGen.Known> axioms, String goal, String goalText) {
    }

    private ProblemGen() {
    }

    public static Generated generate(SyntaxGen g, int axiomCount, int depth) {
        String name = g.name(g.pick("rota_check", "shed_plan", "night_shift", "yard_moves", "relief_cover"));
        List<String> statements = new ArrayList<>();
        List<String> axioms = new ArrayList<>();
        List<CertificateGen.Known> known = new ArrayList<>();
        // Declarations: most of the signature, sometimes with a wrong arity or kind (a clash with a later use).
        for (char kind : new char[] {'f', 'p'}) {
            List<String> items = new ArrayList<>();
            for (SyntaxGen.Sym s : g.symbols(kind)) {
                if (g.upTo(6) == 0) continue;
                int arity = g.off() ? s.arity() + 1 : s.arity();
                items.add(g.name(s.name()) + "/" + (g.off() ? g.number() : Integer.toString(arity)));
            }
            if (items.isEmpty()) continue;
            String keyword = kind == 'f' ? "function" : "predicate";
            if (g.off()) keyword = kind == 'f' ? "predicate" : "function";
            statements.add("declare " + keyword + " " + String.join(", ", items));
        }
        for (int i = 0; i < axiomCount; i++) {
            String label = g.off() && !axioms.isEmpty() ? g.pick(axioms) : "a" + (i + 1);
            axioms.add(label);
            String formula = g.closedFormula(depth);
            known.add(new CertificateGen.Known(label, false, formula));
            statements.add("axiom " + label + ": " + formula);
        }
        String goal = null;
        String goalText = null;
        int goals = g.upTo(3) == 0 ? 0 : (g.off() ? 2 : 1);
        for (int i = 0; i < goals; i++) {
            goal = g.off() && !axioms.isEmpty() ? g.pick(axioms) : "claim" + (i == 0 ? "" : i);
            goalText = g.closedFormula(depth);
            statements.add("goal " + goal + ": " + goalText);
        }
        if (g.off()) java.util.Collections.shuffle(statements, g.random);
        StringBuilder sb = new StringBuilder();
        if (g.off()) sb.append("# a depot problem, generated\n");
        sb.append(g.off() ? "problem" : "problem " + name).append('\n');
        for (String s : statements) {
            sb.append(s).append(g.upTo(8) == 0 ? "   # note\n" : "\n");
            if (g.off()) sb.append("problem ").append(name).append('\n');
        }
        return new Generated(name, sb.toString(), known, goal, goalText);
    }
}
