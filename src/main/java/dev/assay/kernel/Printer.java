package dev.assay.kernel;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Writes kernel values in the concrete syntax of the certificate language, iteratively. Messages use a length cap
 * so that an exponentially large term prints as a readable prefix; {@link #UNLIMITED} prints everything.
 */
public final class Printer {

    public static final int UNLIMITED = Integer.MAX_VALUE;
    /** Cap for terms and clauses quoted in failure messages. */
    public static final int MESSAGE_LIMIT = 600;

    private Printer() {
    }

    private static final class Out {
        final StringBuilder sb = new StringBuilder();
        final int limit;
        boolean cut;

        Out(int limit) {
            this.limit = limit;
        }

        boolean full() {
            if (sb.length() >= limit) {
                cut = true;
                return true;
            }
            return false;
        }

        void add(String s) {
            if (!full()) sb.append(s);
        }

        String done() {
            if (cut || sb.length() > limit) {
                sb.setLength(Math.min(sb.length(), limit));
                sb.append(" …");
            }
            return sb.toString();
        }
    }

    public static String term(Term t) {
        return term(t, MESSAGE_LIMIT);
    }

    public static String term(Term t, int limit) {
        Out out = new Out(limit);
        writeTerm(t, out);
        return out.done();
    }

    private static void writeTerm(Term root, Out out) {
        ArrayDeque<Object> stack = new ArrayDeque<>();
        stack.push(root);
        while (!stack.isEmpty() && !out.full()) {
            Object o = stack.pop();
            if (o instanceof String s) {
                out.add(s);
            } else if (o instanceof Variable v) {
                out.add(v.name());
            } else {
                Application a = (Application) o;
                if (a.isEquation()) {
                    stack.push(a.argument(1));
                    stack.push(" = ");
                    stack.push(a.argument(0));
                    continue;
                }
                out.add(a.symbol().name());
                if (a.arity() == 0) continue;
                stack.push(")");
                for (int i = a.arity() - 1; i >= 0; i--) {
                    stack.push(a.argument(i));
                    if (i > 0) stack.push(", ");
                }
                stack.push("(");
            }
        }
    }

    public static String literal(Literal l) {
        return literal(l, MESSAGE_LIMIT);
    }

    public static String literal(Literal l, int limit) {
        Out out = new Out(limit);
        writeLiteral(l, out);
        return out.done();
    }

    private static void writeLiteral(Literal l, Out out) {
        if (l.isEquation()) {
            writeTerm(l.left(), out);
            out.add(l.positive() ? " = " : " != ");
            writeTerm(l.right(), out);
        } else {
            if (!l.positive()) out.add("not ");
            writeTerm(l.atom(), out);
        }
    }

    public static String clause(Clause c) {
        return clause(c, MESSAGE_LIMIT);
    }

    /** The clause with its variable bracket, e.g. {@code [x] not Staff(x) or Holds(x, badge(x))}. */
    public static String clause(Clause c, int limit) {
        Out out = new Out(limit);
        if (c.isEmpty()) {
            out.add("false");
            return out.done();
        }
        List<Variable> vars = c.variables();
        if (!vars.isEmpty()) {
            out.add("[");
            for (int i = 0; i < vars.size(); i++) {
                if (i > 0) out.add(", ");
                out.add(vars.get(i).name());
            }
            out.add("] ");
        }
        for (int i = 0; i < c.width() && !out.full(); i++) {
            if (i > 0) out.add(" or ");
            writeLiteral(c.literals().get(i), out);
        }
        return out.done();
    }

    public static String substitution(Substitution s) {
        return substitution(s, MESSAGE_LIMIT);
    }

    public static String substitution(Substitution s, int limit) {
        Out out = new Out(limit);
        out.add("{");
        boolean first = true;
        for (Map.Entry<Variable, Term> e : s.bindings().entrySet()) {
            if (out.full()) break;
            if (!first) out.add(", ");
            first = false;
            out.add(e.getKey().name());
            out.add(" := ");
            writeTerm(e.getValue(), out);
        }
        out.add("}");
        return out.done();
    }

    public static String formula(Formula f) {
        return formula(f, MESSAGE_LIMIT);
    }

    // Binding strength, loosest first, as in the grammar: quantifier, iff, implies, or, and, not.
    private static int strength(Formula f) {
        if (f instanceof Formula.Quantified) return 0;
        if (f instanceof Formula.Iff) return 1;
        if (f instanceof Formula.Implies) return 2;
        if (f instanceof Formula.Or) return 3;
        if (f instanceof Formula.And) return 4;
        if (f instanceof Formula.Not) return 5;
        return 6;
    }

    /** Writes a formula with the fewest parentheses that parse back to the same tree. */
    public static String formula(Formula root, int limit) {
        Out out = new Out(limit);
        ArrayDeque<Object> stack = new ArrayDeque<>();
        stack.push(root);
        while (!stack.isEmpty() && !out.full()) {
            Object o = stack.pop();
            if (o instanceof String s) {
                out.add(s);
                continue;
            }
            Formula f = (Formula) o;
            if (f instanceof Formula.Atomic a) {
                writeLiteral(a.literal(), out);
            } else if (f instanceof Formula.Constant c) {
                out.add(c.value() ? "true" : "false");
            } else if (f instanceof Formula.Not n) {
                out.add("not ");
                pushOperand(stack, n.body(), strength(n.body()) < 5);
            } else if (f instanceof Formula.Quantified q) {
                // Merge a run of like quantifiers: forall x y. body
                List<String> names = new ArrayList<>();
                Formula body = q;
                while (body instanceof Formula.Quantified inner && inner.universal() == q.universal()) {
                    names.add(inner.variable().name());
                    body = inner.body();
                }
                out.add(q.universal() ? "forall " : "exists ");
                out.add(String.join(" ", names));
                out.add(". ");
                stack.push(body);
            } else if (f instanceof Formula.Junction j) {
                String op = j instanceof Formula.And ? " and " : " or ";
                int s = strength(j);
                List<Formula> parts = j.parts();
                for (int i = parts.size() - 1; i >= 0; i--) {
                    // A quantifier operand always gets parentheses: its body would swallow what follows.
                    Formula p = parts.get(i);
                    pushOperand(stack, p, strength(p) <= s);
                    if (i > 0) stack.push(op);
                }
            } else if (f instanceof Formula.Implies imp) {
                pushOperand(stack, imp.right(), strength(imp.right()) < 2);
                stack.push(" implies ");
                pushOperand(stack, imp.left(), strength(imp.left()) <= 2);
            } else if (f instanceof Formula.Iff iff) {
                pushOperand(stack, iff.right(), strength(iff.right()) <= 1);
                stack.push(" iff ");
                pushOperand(stack, iff.left(), strength(iff.left()) <= 1);
            }
        }
        return out.done();
    }

    private static void pushOperand(ArrayDeque<Object> stack, Formula f, boolean paren) {
        if (paren) {
            stack.push(")");
            stack.push(f);
            stack.push("(");
        } else {
            stack.push(f);
        }
    }
}
