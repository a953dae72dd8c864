package dev.assay.campaign;

import dev.assay.campaign.Cert.Entry;
import dev.assay.campaign.Cert.ForgetLine;
import dev.assay.campaign.Cert.StepLine;
import dev.assay.kernel.Application;
import dev.assay.kernel.Clause;
import dev.assay.kernel.Formula;
import dev.assay.kernel.Literal;
import dev.assay.kernel.Printer;
import dev.assay.kernel.Symbol;
import dev.assay.kernel.Term;
import dev.assay.kernel.Variable;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import java.util.function.Function;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The mutation kinds of the campaign. Each kind changes one thing of a valid certificate (a literal, an index, a
 * binding, a symbol, a step's place...) and prints the whole certificate again; the mutant is then an ordinary file
 * for the checker. Conclusions are changed on the checker's resolved values where the change is about literals and
 * re-printed with the kernel's printer; symbols, arities, arguments, rule names and premises are changed on the
 * canonical text, token by token. A kind picks its site at random; a site where it does not apply gives nothing.
 *
 * <p>Some kinds are controls that keep a certificate sound (renaming a variable, repeating a literal, swapping the
 * premises of a resolution): they show that accepted mutants reach the oracle and are judged sound.
 */
final class Mutants {

    private Mutants() {
    }

    record Mutant(String kind, String text, String where) {
    }

    /** Makes one mutant of c, or null when the site it picked does not admit the change. */
    interface Maker {
        List<Entry> make(Cert c, Random r, StringBuilder where);
    }

    static final Map<String, Maker> KINDS = new LinkedHashMap<>();

    static {
        KINDS.put("drop-literal", Mutants::dropLiteral);
        KINDS.put("negate-literal", Mutants::negateLiteral);
        KINDS.put("swap-literals", Mutants::swapLiterals);
        KINDS.put("literal-index", Mutants::literalIndex);
        KINDS.put("term-position", Mutants::termPosition);
        KINDS.put("substitution-binding", Mutants::substitutionBinding);
        KINDS.put("drop-substitution", Mutants::dropSubstitution);
        KINDS.put("change-symbol", Mutants::changeSymbol);
        KINDS.put("change-arity", Mutants::changeArity);
        KINDS.put("generalize-constant", Mutants::generalizeConstant);
        KINDS.put("reuse-fresh-symbol", Mutants::reuseFreshSymbol);
        KINDS.put("skolem-fewer-args", Mutants::skolemFewerArgs);
        KINDS.put("reorder-steps", Mutants::reorderSteps);
        KINDS.put("drop-step", Mutants::dropStep);
        KINDS.put("swap-premises", Mutants::swapPremises);
        KINDS.put("change-premise", Mutants::changePremise);
        KINDS.put("change-rule", Mutants::changeRule);
        KINDS.put("flip-direction", Mutants::flipDirection);
        KINDS.put("change-quantifier", Mutants::changeQuantifier);
        KINDS.put("change-connective", Mutants::changeConnective);
        KINDS.put("rename-variable", Mutants::renameVariable);
        KINDS.put("duplicate-literal", Mutants::duplicateLiteral);
    }

    /** Up to {@code count} distinct mutants of one kind, none equal to the canonical certificate. */
    static List<Mutant> generate(Cert c, String kind, int count, Random r) {
        Maker m = KINDS.get(kind);
        if (m == null) throw new IllegalArgumentException("no kind " + kind);
        String original = c.print();
        Set<String> seen = new LinkedHashSet<>();
        List<Mutant> out = new ArrayList<>();
        for (int attempt = 0; attempt < count * 12 && out.size() < count; attempt++) {
            StringBuilder where = new StringBuilder();
            List<Entry> es = m.make(c, r, where);
            if (es == null) continue;
            String text = c.print(es);
            if (text.equals(original) || !seen.add(text)) continue;
            out.add(new Mutant(kind, text, where.toString()));
        }
        return out;
    }

    // ================================================================ values

    /** The symbols of a formula or clause in order of first occurrence; equality is not a symbol. */
    static List<Symbol> symbols(Object value) {
        Set<Symbol> out = new LinkedHashSet<>();
        ArrayDeque<Term> terms = new ArrayDeque<>();
        if (value instanceof Clause c) {
            for (Literal l : c.literals()) collect(l.atom(), out, terms);
        } else {
            ArrayDeque<Formula> todo = new ArrayDeque<>();
            todo.push((Formula) value);
            while (!todo.isEmpty()) {
                Formula f = todo.pop();
                if (f instanceof Formula.Atomic a) collect(a.literal().atom(), out, terms);
                else if (f instanceof Formula.Not n) todo.push(n.body());
                else if (f instanceof Formula.Junction j) for (int i = j.parts().size() - 1; i >= 0; i--) todo.push(j.parts().get(i));
                else if (f instanceof Formula.Implies i) {
                    todo.push(i.right());
                    todo.push(i.left());
                } else if (f instanceof Formula.Iff i) {
                    todo.push(i.right());
                    todo.push(i.left());
                } else if (f instanceof Formula.Quantified q) todo.push(q.body());
            }
        }
        return new ArrayList<>(out);
    }

    private static void collect(Term root, Set<Symbol> out, ArrayDeque<Term> stack) {
        stack.push(root);
        while (!stack.isEmpty()) {
            Term t = stack.pop();
            if (t instanceof Application a) {
                if (!a.symbol().isEquality()) out.add(a.symbol());
                for (int i = a.arity() - 1; i >= 0; i--) stack.push(a.argument(i));
            }
        }
    }

    /** Names that are variables somewhere in the value (clause variables, bound and free variables of a formula). */
    static Set<String> variableNames(Object value) {
        Set<String> out = new LinkedHashSet<>();
        if (value instanceof Clause c) {
            for (Variable v : c.variables()) out.add(v.name());
            return out;
        }
        ArrayDeque<Formula> todo = new ArrayDeque<>();
        todo.push((Formula) value);
        while (!todo.isEmpty()) {
            Formula f = todo.pop();
            if (f instanceof Formula.Quantified q) {
                out.add(q.variable().name());
                todo.push(q.body());
            } else if (f instanceof Formula.Atomic a) {
                ArrayDeque<Term> ts = new ArrayDeque<>();
                ts.push(a.literal().atom());
                while (!ts.isEmpty()) {
                    Term t = ts.pop();
                    if (t instanceof Variable v) out.add(v.name());
                    else for (Term x : ((Application) t).arguments()) ts.push(x);
                }
            } else {
                for (Formula x : children(f)) todo.push(x);
            }
        }
        return out;
    }

    private static List<Formula> children(Formula f) {
        if (f instanceof Formula.Not n) return List.of(n.body());
        if (f instanceof Formula.Junction j) return j.parts();
        if (f instanceof Formula.Implies i) return List.of(i.left(), i.right());
        if (f instanceof Formula.Iff i) return List.of(i.left(), i.right());
        if (f instanceof Formula.Quantified q) return List.of(q.body());
        return List.of();
    }

    private static int atomicCount(Formula f) {
        if (f instanceof Formula.Atomic) return 1;
        int n = 0;
        for (Formula c : children(f)) n += atomicCount(c);
        return n;
    }

    /** f with atomic occurrence {@code target} (pre-order) replaced; a null replacement drops it from its junction. */
    private static Formula editAtomic(Formula f, int target, Function<Formula.Atomic, Formula> replace, int[] counter,
                                      boolean[] done) {
        if (f instanceof Formula.Atomic a) {
            if (counter[0]++ != target) return a;
            done[0] = true;
            return replace.apply(a);
        }
        if (f instanceof Formula.Junction j) {
            List<Formula> parts = new ArrayList<>();
            for (Formula p : j.parts()) {
                Formula q = editAtomic(p, target, replace, counter, done);
                if (q != null) parts.add(q);
            }
            if (parts.isEmpty()) return null;
            if (parts.size() == 1) return parts.get(0);
            return j instanceof Formula.And ? new Formula.And(parts) : new Formula.Or(parts);
        }
        Formula x;
        if (f instanceof Formula.Not n) {
            x = editAtomic(n.body(), target, replace, counter, done);
            return x == null ? null : new Formula.Not(x);
        }
        if (f instanceof Formula.Implies i) {
            Formula l = editAtomic(i.left(), target, replace, counter, done);
            Formula r = editAtomic(i.right(), target, replace, counter, done);
            return l == null || r == null ? null : new Formula.Implies(l, r);
        }
        if (f instanceof Formula.Iff i) {
            Formula l = editAtomic(i.left(), target, replace, counter, done);
            Formula r = editAtomic(i.right(), target, replace, counter, done);
            return l == null || r == null ? null : new Formula.Iff(l, r);
        }
        if (f instanceof Formula.Quantified q) {
            x = editAtomic(q.body(), target, replace, counter, done);
            return x == null ? null : new Formula.Quantified(q.universal(), q.variable(), x);
        }
        return f;
    }

    // ================================================================ entry helpers

    private static <T> T pick(List<T> xs, Random r) {
        return xs.isEmpty() ? null : xs.get(r.nextInt(xs.size()));
    }

    private static List<Integer> stepIndices(Cert c, java.util.function.Predicate<StepLine> p) {
        List<Integer> out = new ArrayList<>();
        for (int i = 0; i < c.entries.size(); i++) if (c.entries.get(i) instanceof StepLine s && p.test(s)) out.add(i);
        return out;
    }

    private static List<Entry> replaced(Cert c, int index, Entry e) {
        List<Entry> es = new ArrayList<>(c.entries);
        es.set(index, e);
        return es;
    }

    private static String printClause(List<Literal> lits) {
        return Printer.clause(new Clause(lits), Printer.UNLIMITED);
    }

    private static String printFormula(Formula f) {
        return Printer.formula(f, Printer.UNLIMITED);
    }

    // ================================================================ literal kinds (on values)

    private static List<Entry> dropLiteral(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> s.clause() ? ((Clause) s.conclusion()).width() > 0
                : atomicCount((Formula) s.conclusion()) > 1), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        if (s.clause()) {
            List<Literal> lits = new ArrayList<>(((Clause) s.conclusion()).literals());
            int k = r.nextInt(lits.size());
            lits.remove(k);
            where.append(s.label()).append(" literal ").append(k + 1);
            return replaced(c, i, s.withConclusion(printClause(lits)));
        }
        Formula f = (Formula) s.conclusion();
        int k = r.nextInt(atomicCount(f));
        Formula g = editAtomic(f, k, a -> null, new int[1], new boolean[1]);
        if (g == null) return null;
        where.append(s.label()).append(" atom ").append(k + 1);
        return replaced(c, i, s.withConclusion(printFormula(g)));
    }

    private static List<Entry> negateLiteral(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> !(s.clause() && ((Clause) s.conclusion()).width() == 0)), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        if (s.clause()) {
            List<Literal> lits = new ArrayList<>(((Clause) s.conclusion()).literals());
            int k = r.nextInt(lits.size());
            lits.set(k, lits.get(k).negated());
            where.append(s.label()).append(" literal ").append(k + 1);
            return replaced(c, i, s.withConclusion(printClause(lits)));
        }
        Formula f = (Formula) s.conclusion();
        int n = atomicCount(f);
        if (n == 0) return null;
        int k = r.nextInt(n);
        Formula g = editAtomic(f, k, a -> new Formula.Atomic(a.literal().negated()), new int[1], new boolean[1]);
        where.append(s.label()).append(" atom ").append(k + 1);
        return replaced(c, i, s.withConclusion(printFormula(g)));
    }

    private static List<Entry> swapLiterals(Cert c, Random r, StringBuilder where) {
        List<Integer> cs = stepIndices(c, s -> s.clause() && ((Clause) s.conclusion()).width() > 0);
        if (cs.size() < 2) return null;
        int a = cs.get(r.nextInt(cs.size()));
        int b = cs.get(r.nextInt(cs.size()));
        if (a == b) return null;
        StepLine sa = (StepLine) c.entries.get(a);
        StepLine sb = (StepLine) c.entries.get(b);
        List<Literal> la = new ArrayList<>(((Clause) sa.conclusion()).literals());
        List<Literal> lb = new ArrayList<>(((Clause) sb.conclusion()).literals());
        int i = r.nextInt(la.size());
        int j = r.nextInt(lb.size());
        if (la.get(i).equals(lb.get(j))) return null;
        Literal x = la.get(i);
        la.set(i, lb.get(j));
        lb.set(j, x);
        where.append(sa.label()).append('.').append(i + 1).append(" <-> ").append(sb.label()).append('.').append(j + 1);
        List<Entry> es = replaced(c, a, sa.withConclusion(printClause(la)));
        es.set(b, sb.withConclusion(printClause(lb)));
        return es;
    }

    private static List<Entry> duplicateLiteral(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> s.clause() && ((Clause) s.conclusion()).width() > 0), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        List<Literal> lits = new ArrayList<>(((Clause) s.conclusion()).literals());
        int k = r.nextInt(lits.size());
        lits.add(lits.get(k));
        where.append(s.label()).append(" literal ").append(k + 1).append(" repeated");
        return replaced(c, i, s.withConclusion(printClause(lits)));
    }

    // ================================================================ argument kinds (on text)

    private static final Pattern REF = Pattern.compile("(?<![A-Za-z0-9_])([A-Za-z_][A-Za-z0-9_]*)\\.(\\d+)");
    private static final Pattern POSITION = Pattern.compile("@ ([0-9]+(?:\\.[0-9]+)*)");
    private static final Pattern IDENT = Pattern.compile("[A-Za-z_][A-Za-z0-9_]*");
    private static final Set<String> KEYWORDS = Set.of("forall", "exists", "not", "and", "or", "implies", "iff", "true",
            "false", "fresh", "using");

    private static String splice(String s, int from, int to, String with) {
        return s.substring(0, from) + with + s.substring(to);
    }

    private static int width(Cert c, String label) {
        int i = c.indexOf(label);
        if (i < 0) return 0;
        StepLine s = (StepLine) c.entries.get(i);
        return s.clause() ? ((Clause) s.conclusion()).width() : 0;
    }

    private static List<Entry> literalIndex(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> REF.matcher(s.args()).find()), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        List<int[]> spans = new ArrayList<>();
        Matcher m = REF.matcher(s.args());
        List<String> labels = new ArrayList<>();
        while (m.find()) {
            spans.add(new int[] {m.start(2), m.end(2)});
            labels.add(m.group(1));
        }
        int k = r.nextInt(spans.size());
        int old = Integer.parseInt(s.args().substring(spans.get(k)[0], spans.get(k)[1]));
        int max = Math.max(old + 1, width(c, labels.get(k)) + 1);
        int now = 1 + r.nextInt(max);
        if (now == old) return null;
        where.append(s.label()).append(": ").append(labels.get(k)).append('.').append(old).append(" -> .").append(now);
        return replaced(c, i, s.withArgs(splice(s.args(), spans.get(k)[0], spans.get(k)[1], String.valueOf(now))));
    }

    private static List<Entry> termPosition(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> s.rule().equals("paramodulate")), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        Matcher m = POSITION.matcher(s.args());
        if (!m.find()) return null;
        List<String> path = new ArrayList<>(List.of(m.group(1).split("\\.")));
        switch (r.nextInt(3)) {
            case 0 -> {
                int k = r.nextInt(path.size());
                path.set(k, String.valueOf(1 + r.nextInt(3)));
            }
            case 1 -> path.add(String.valueOf(1 + r.nextInt(2)));
            default -> {
                if (path.size() < 2) return null;
                path.remove(path.size() - 1);
            }
        }
        String now = String.join(".", path);
        where.append(s.label()).append(": @ ").append(m.group(1)).append(" -> @ ").append(now);
        return replaced(c, i, s.withArgs(splice(s.args(), m.start(1), m.end(1), now)));
    }

    /** Top-level parts of s split at sep, outside parentheses and braces. */
    static List<String> splitTop(String s, char sep) {
        List<String> out = new ArrayList<>();
        int depth = 0;
        int start = 0;
        for (int k = 0; k < s.length(); k++) {
            char ch = s.charAt(k);
            if (ch == '(' || ch == '{') depth++;
            else if (ch == ')' || ch == '}') depth--;
            else if (ch == sep && depth == 0) {
                out.add(s.substring(start, k));
                start = k + 1;
            }
        }
        out.add(s.substring(start));
        return out;
    }

    /** [start, end) of each {...} group in the arguments, braces included. */
    private static List<int[]> braceGroups(String args) {
        List<int[]> out = new ArrayList<>();
        int open = -1;
        for (int k = 0; k < args.length(); k++) {
            if (args.charAt(k) == '{') open = k;
            else if (args.charAt(k) == '}' && open >= 0) {
                out.add(new int[] {open, k + 1});
                open = -1;
            }
        }
        return out;
    }

    /** Terms to put in a binding: constants of the problem, variables of the conclusion, terms bound elsewhere. */
    private static List<String> termPool(Cert c, StepLine s) {
        List<String> pool = new ArrayList<>();
        for (Symbol x : c.symbols.values()) if (x.kind() == Symbol.Kind.FUNCTION && x.arity() == 0) pool.add(x.name());
        if (s.conclusion() != null) pool.addAll(variableNames(s.conclusion()));
        for (int[] g : braceGroups(s.args())) {
            String inner = s.args().substring(g[0] + 1, g[1] - 1).trim();
            if (inner.isEmpty()) continue;
            for (String b : splitTop(inner, ',')) {
                int eq = b.indexOf(":=");
                if (eq > 0) pool.add(b.substring(eq + 2).trim());
            }
        }
        List<String> unary = new ArrayList<>();
        for (Symbol x : c.symbols.values()) if (x.kind() == Symbol.Kind.FUNCTION && x.arity() == 1) unary.add(x.name());
        if (!unary.isEmpty() && !pool.isEmpty()) {
            pool.add(unary.get(0) + "(" + pool.get(0) + ")");
        }
        return pool;
    }

    private static List<Entry> substitutionBinding(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> s.args().contains(":=")), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        List<int[]> groups = new ArrayList<>();
        for (int[] g : braceGroups(s.args())) if (s.args().substring(g[0], g[1]).contains(":=")) groups.add(g);
        int[] g = groups.get(r.nextInt(groups.size()));
        List<String> bindings = new ArrayList<>(splitTop(s.args().substring(g[0] + 1, g[1] - 1), ','));
        int k = r.nextInt(bindings.size());
        String b = bindings.get(k).trim();
        int eq = b.indexOf(":=");
        String var = b.substring(0, eq).trim();
        String term = b.substring(eq + 2).trim();
        int op = r.nextInt(5);
        if (op <= 2) {
            String t = pick(termPool(c, s), r);
            if (t == null || t.equals(term)) return null;
            bindings.set(k, var + " := " + t);
            where.append(s.label()).append(": ").append(var).append(" := ").append(term).append(" -> ").append(t);
        } else if (op == 3) {
            bindings.remove(k);
            where.append(s.label()).append(": binding ").append(var).append(" dropped");
        } else {
            List<String> others = new ArrayList<>();
            for (String o : bindings) others.add(o.substring(0, o.indexOf(":=")).trim());
            others.remove(var);
            if (s.conclusion() != null) others.addAll(variableNames(s.conclusion()));
            others.add("v9");
            String w = pick(others, r);
            if (w.equals(var)) return null;
            bindings.set(k, w + " := " + term);
            where.append(s.label()).append(": bound variable ").append(var).append(" -> ").append(w);
        }
        List<String> trimmed = new ArrayList<>();
        for (String x : bindings) trimmed.add(x.trim());
        String group = "{" + String.join(", ", trimmed) + "}";
        return replaced(c, i, s.withArgs(splice(s.args(), g[0], g[1], group)));
    }

    private static List<Entry> dropSubstitution(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> s.args().contains("{")), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        List<int[]> groups = braceGroups(s.args());
        int[] g = groups.get(r.nextInt(groups.size()));
        int from = g[0] > 0 && s.args().charAt(g[0] - 1) == ' ' ? g[0] - 1 : g[0];
        where.append(s.label()).append(": ").append(s.args(), g[0], g[1]).append(" dropped");
        return replaced(c, i, s.withArgs(splice(s.args(), from, g[1], "")));
    }

    private static List<Entry> flipDirection(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> s.rule().equals("paramodulate")), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        String a = s.args();
        String now = a.contains(" -> ") ? a.replace(" -> ", " <- ") : a.replace(" <- ", " -> ");
        where.append(s.label()).append(": direction flipped");
        return replaced(c, i, s.withArgs(now));
    }

    private static List<Entry> swapPremises(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> Set.of("resolve", "factor", "eqfactor", "paramodulate", "abbreviate")
                .contains(s.rule())), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        String a = s.args();
        String now;
        switch (s.rule()) {
            case "resolve" -> {
                List<String> parts = splitTop(a, ',');
                if (parts.size() != 2) return null;
                now = " " + parts.get(1).trim() + ", " + parts.get(0).trim();
            }
            case "abbreviate" -> {
                String[] parts = a.trim().split(" using ");
                now = " " + parts[1] + " using " + parts[0];
            }
            default -> {
                Matcher m = REF.matcher(a);
                List<int[]> spans = new ArrayList<>();
                while (m.find()) spans.add(new int[] {m.start(), m.end()});
                if (spans.size() != 2) return null;
                String x = a.substring(spans.get(0)[0], spans.get(0)[1]);
                String y = a.substring(spans.get(1)[0], spans.get(1)[1]);
                now = a.substring(0, spans.get(0)[0]) + y + a.substring(spans.get(0)[1], spans.get(1)[0]) + x
                        + a.substring(spans.get(1)[1]);
            }
        }
        where.append(s.label()).append(": premises swapped");
        return replaced(c, i, s.withArgs(now));
    }

    /** The labels of earlier steps and the axiom names, as premise candidates for the step at index i. */
    private static List<String> earlierPremises(Cert c, int index, Boolean clauses) {
        List<String> out = new ArrayList<>();
        if (clauses == null || !clauses) out.addAll(c.problem.axioms().keySet());
        for (int k = 0; k < index; k++) {
            if (c.entries.get(k) instanceof StepLine s && (clauses == null || s.clause() == clauses)) out.add(s.label());
        }
        return out;
    }

    private static List<Entry> changePremise(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> !s.rule().equals("define") && !s.rule().equals("reflexivity")
                && !s.rule().equals("negate")), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        Set<String> known = new LinkedHashSet<>(earlierPremises(c, i, null));
        List<int[]> spans = new ArrayList<>();
        String a = s.args();
        List<int[]> braces = braceGroups(a);
        Matcher m = IDENT.matcher(a);
        boolean afterFresh = false;
        while (m.find()) {
            String w = m.group();
            if (w.equals("fresh")) afterFresh = true;
            if (afterFresh || !known.contains(w)) continue;
            boolean inBraces = false;
            for (int[] g : braces) inBraces |= m.start() > g[0] && m.start() < g[1];
            if (!inBraces) spans.add(new int[] {m.start(), m.end()});
        }
        if (spans.isEmpty()) return null;
        int[] sp = spans.get(r.nextInt(spans.size()));
        String old = a.substring(sp[0], sp[1]);
        List<String> candidates = earlierPremises(c, i, r.nextInt(4) == 0 ? null : s.clause() && !s.rule().equals("clausify"));
        candidates.remove(old);
        String now = pick(candidates, r);
        if (now == null) return null;
        where.append(s.label()).append(": premise ").append(old).append(" -> ").append(now);
        return replaced(c, i, s.withArgs(splice(a, sp[0], sp[1], now)));
    }

    private static final List<String> ALL_RULES = List.of("negate", "nnf", "skolemize", "clausify", "define",
            "abbreviate", "resolve", "factor", "instantiate", "paramodulate", "eqres", "eqfactor", "reflexivity");

    private static List<Entry> changeRule(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> true), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        List<String> group;
        boolean subst = s.args().contains("{");
        if (r.nextInt(5) == 0) group = ALL_RULES;
        else if (Set.of("nnf", "skolemize", "clausify").contains(s.rule()) && !subst && s.fresh().isEmpty()) {
            group = List.of("nnf", "skolemize", "clausify");
        } else if (Set.of("clausify", "instantiate").contains(s.rule()) && subst) {
            group = List.of("clausify", "instantiate");
        } else if (Set.of("factor", "eqfactor").contains(s.rule())) {
            group = List.of("factor", "eqfactor");
        } else if (Set.of("eqres", "reflexivity").contains(s.rule())) {
            group = List.of("eqres", "reflexivity", "instantiate");
        } else {
            group = ALL_RULES;
        }
        String now = pick(group, r);
        if (now.equals(s.rule())) return null;
        where.append(s.label()).append(": ").append(s.rule()).append(" -> ").append(now);
        StepLine t = s.withRule(now);
        if (now.equals("reflexivity")) t = t.withArgs("");
        return replaced(c, i, t);
    }

    // ================================================================ symbol and term kinds (on text)

    /** Spans of the identifier tokens of text that are symbols here (known to c and not a variable of the value). */
    private static List<int[]> symbolSpans(Cert c, StepLine s, java.util.function.Predicate<Symbol> p) {
        Set<String> vars = s.conclusion() == null ? Set.of() : variableNames(s.conclusion());
        List<int[]> out = new ArrayList<>();
        Matcher m = IDENT.matcher(s.conclusionText());
        while (m.find()) {
            String w = m.group();
            Symbol x = c.symbols.get(w);
            if (x != null && !vars.contains(w) && !KEYWORDS.contains(w) && p.test(x)) out.add(new int[] {m.start(), m.end()});
        }
        return out;
    }

    private static List<Entry> changeSymbol(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> true), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        int[] sp = pick(symbolSpans(c, s, x -> true), r);
        if (sp == null) return null;
        String old = s.conclusionText().substring(sp[0], sp[1]);
        Symbol x = c.symbols.get(old);
        List<String> candidates = new ArrayList<>();
        boolean sameShape = r.nextInt(4) != 0;
        for (Symbol y : c.symbols.values()) {
            if (y.name().equals(old)) continue;
            if (!sameShape || (y.kind() == x.kind() && y.arity() == x.arity())) candidates.add(y.name());
        }
        String now = pick(candidates, r);
        if (now == null) return null;
        where.append(s.label()).append(": symbol ").append(old).append(" -> ").append(now);
        return replaced(c, i, s.withConclusion(splice(s.conclusionText(), sp[0], sp[1], now)));
    }

    /** The index just past the parenthesis that closes the one at {@code open}. */
    private static int closing(String text, int open) {
        int depth = 0;
        for (int k = open; k < text.length(); k++) {
            if (text.charAt(k) == '(') depth++;
            else if (text.charAt(k) == ')' && --depth == 0) return k + 1;
        }
        return -1;
    }

    private static List<Entry> changeArity(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> true), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        int[] sp = pick(symbolSpans(c, s, x -> true), r);
        if (sp == null) return null;
        String text = s.conclusionText();
        String name = text.substring(sp[0], sp[1]);
        if (sp[1] < text.length() && text.charAt(sp[1]) == '(') {
            int end = closing(text, sp[1]);
            List<String> args = new ArrayList<>(splitTop(text.substring(sp[1] + 1, end - 1), ','));
            if (r.nextBoolean()) {
                int k = r.nextInt(args.size());
                args.remove(k);
                where.append(s.label()).append(": ").append(name).append(" loses argument ").append(k + 1);
            } else {
                int k = r.nextInt(args.size() + 1);
                args.add(k, args.get(r.nextInt(args.size())).trim());
                where.append(s.label()).append(": ").append(name).append(" gains an argument at ").append(k + 1);
            }
            List<String> trimmed = new ArrayList<>();
            for (String a : args) trimmed.add(a.trim());
            String app = trimmed.isEmpty() ? name : name + "(" + String.join(", ", trimmed) + ")";
            return replaced(c, i, s.withConclusion(splice(text, sp[0], end, app)));
        }
        List<String> pool = termPool(c, s);
        String arg = pick(pool, r);
        if (arg == null) return null;
        where.append(s.label()).append(": ").append(name).append(" gains an argument");
        return replaced(c, i, s.withConclusion(splice(text, sp[0], sp[1], name + "(" + arg + ")")));
    }

    private static List<Entry> generalizeConstant(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> s.clause()), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        int[] sp = pick(symbolSpans(c, s, x -> x.kind() == Symbol.Kind.FUNCTION && x.arity() == 0), r);
        if (sp == null) return null;
        String text = s.conclusionText();
        String v = "V";
        while (c.symbols.containsKey(v) || variableNames(s.conclusion()).contains(v)) v = v + "v";
        String body = splice(text, sp[0], sp[1], v);
        String now = body.startsWith("[") ? body.replaceFirst("]", ", " + v + "]") : "[" + v + "] " + body;
        where.append(s.label()).append(": constant ").append(text, sp[0], sp[1]).append(" -> variable");
        return replaced(c, i, s.withConclusion(now));
    }

    private static String renameToken(String text, String from, String to) {
        return text.replaceAll("(?<![A-Za-z0-9_])" + Pattern.quote(from) + "(?![A-Za-z0-9_])", Matcher.quoteReplacement(to));
    }

    private static List<Entry> reuseFreshSymbol(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> !s.fresh().isEmpty()), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        String fresh = pick(s.fresh(), r);
        Symbol x = c.symbols.get(fresh);
        Set<String> before = new LinkedHashSet<>();
        for (dev.assay.kernel.Signature.Entry e : c.problem.signature().entries()) before.add(e.symbol().name());
        for (Formula f : c.problem.axioms().values()) for (Symbol y : symbols(f)) before.add(y.name());
        for (int k = 0; k < i; k++) if (c.entries.get(k) instanceof StepLine t) before.addAll(t.fresh());
        List<String> same = new ArrayList<>();
        List<String> any = new ArrayList<>();
        for (String n : before) {
            Symbol y = c.symbols.get(n);
            if (y == null || n.equals(fresh)) continue;
            any.add(n);
            if (x != null && y.kind() == x.kind() && y.arity() == x.arity()) same.add(n);
        }
        String now = pick(!same.isEmpty() && r.nextInt(4) != 0 ? same : any, r);
        if (now == null) return null;
        where.append(s.label()).append(": fresh ").append(fresh).append(" -> ").append(now).append(" (already used)");
        List<Entry> es = new ArrayList<>(c.entries);
        for (int k = i; k < es.size(); k++) {
            if (!(es.get(k) instanceof StepLine t)) continue;
            List<String> f = new ArrayList<>();
            for (String n : t.fresh()) f.add(n.equals(fresh) ? now : n);
            es.set(k, new StepLine(t.label(), t.clause(), null, renameToken(t.conclusionText(), fresh, now), t.rule(),
                    renameToken(t.args(), fresh, now), f));
        }
        return es;
    }

    /** text with argument {@code drop} (from 0) of every application of {@code symbol} removed, nested ones too. */
    static String dropArgument(String text, String symbol, int drop) {
        StringBuilder out = new StringBuilder();
        Matcher m = IDENT.matcher(text);
        int at = 0;
        while (m.find(at)) {
            out.append(text, at, m.start());
            if (m.group().equals(symbol) && m.end() < text.length() && text.charAt(m.end()) == '(') {
                int end = closing(text, m.end());
                List<String> args = new ArrayList<>();
                for (String a : splitTop(text.substring(m.end() + 1, end - 1), ',')) args.add(dropArgument(a.trim(), symbol, drop));
                if (drop < args.size()) args.remove(drop);
                out.append(symbol);
                if (!args.isEmpty()) out.append('(').append(String.join(", ", args)).append(')');
                at = end;
            } else {
                out.append(m.group());
                at = m.end();
            }
        }
        out.append(text.substring(at));
        return out.toString();
    }

    private static List<Entry> skolemFewerArgs(Cert c, Random r, StringBuilder where) {
        List<String[]> sites = new ArrayList<>();
        for (int k = 0; k < c.entries.size(); k++) {
            if (!(c.entries.get(k) instanceof StepLine s) || !s.rule().equals("skolemize")) continue;
            for (String f : s.fresh()) {
                Symbol x = c.symbols.get(f);
                if (x != null && x.kind() == Symbol.Kind.FUNCTION && x.arity() > 0) sites.add(new String[] {String.valueOf(k), f});
            }
        }
        String[] site = pick(sites, r);
        if (site == null) return null;
        int i = Integer.parseInt(site[0]);
        Symbol x = c.symbols.get(site[1]);
        int drop = r.nextInt(x.arity());
        boolean everywhere = r.nextInt(10) < 7;
        where.append(((StepLine) c.entries.get(i)).label()).append(": ").append(x.name()).append(" loses argument ")
                .append(drop + 1).append(everywhere ? " everywhere" : " in its skolemize step");
        List<Entry> es = new ArrayList<>(c.entries);
        for (int k = i; k < (everywhere ? es.size() : i + 1); k++) {
            if (es.get(k) instanceof StepLine t) {
                es.set(k, t.withConclusion(dropArgument(t.conclusionText(), x.name(), drop))
                        .withArgs(dropArgument(t.args(), x.name(), drop)));
            }
        }
        return es;
    }

    // ================================================================ formula connectives (on text)

    private static List<Entry> swapToken(Cert c, Random r, StringBuilder where, Set<String> from, List<String> to) {
        Integer i = pick(stepIndices(c, s -> !s.clause()), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        Set<String> vars = variableNames(s.conclusion());
        List<int[]> spans = new ArrayList<>();
        Matcher m = IDENT.matcher(s.conclusionText());
        while (m.find()) if (from.contains(m.group()) && !vars.contains(m.group())) spans.add(new int[] {m.start(), m.end()});
        int[] sp = pick(spans, r);
        if (sp == null) return null;
        String old = s.conclusionText().substring(sp[0], sp[1]);
        String now = pick(to, r);
        if (now.equals(old)) return null;
        where.append(s.label()).append(": ").append(old).append(" -> ").append(now);
        return replaced(c, i, s.withConclusion(splice(s.conclusionText(), sp[0], sp[1], now)));
    }

    private static List<Entry> changeQuantifier(Cert c, Random r, StringBuilder where) {
        return swapToken(c, r, where, Set.of("forall", "exists"), List.of("forall", "exists"));
    }

    private static List<Entry> changeConnective(Cert c, Random r, StringBuilder where) {
        return swapToken(c, r, where, Set.of("and", "or", "implies", "iff"), List.of("and", "or", "implies", "iff"));
    }

    // ================================================================ step kinds

    private static List<Entry> reorderSteps(Cert c, Random r, StringBuilder where) {
        List<Integer> steps = stepIndices(c, s -> true);
        if (steps.size() < 2) return null;
        int k = 1 + r.nextInt(steps.size() - 1);
        int to = r.nextBoolean() ? k - 1 : r.nextInt(k);
        List<Entry> es = new ArrayList<>(c.entries);
        Entry moved = es.remove((int) steps.get(k));
        es.add(steps.get(to), moved);
        where.append(((StepLine) moved).label()).append(" moved before ")
                .append(((StepLine) c.entries.get(steps.get(to))).label());
        return es;
    }

    private static List<Entry> dropStep(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> true), r);
        if (i == null) return null;
        String label = ((StepLine) c.entries.get(i)).label();
        List<Entry> es = new ArrayList<>();
        for (int k = 0; k < c.entries.size(); k++) {
            Entry e = c.entries.get(k);
            if (k == i) continue;
            if (e instanceof ForgetLine f) {
                List<String> ls = new ArrayList<>(f.labels());
                ls.remove(label);
                if (!ls.isEmpty()) es.add(new ForgetLine(ls));
            } else {
                es.add(e);
            }
        }
        where.append(label).append(" dropped");
        return es;
    }

    // ================================================================ controls

    private static List<Entry> renameVariable(Cert c, Random r, StringBuilder where) {
        Integer i = pick(stepIndices(c, s -> s.clause() && !((Clause) s.conclusion()).variables().isEmpty()), r);
        if (i == null) return null;
        StepLine s = (StepLine) c.entries.get(i);
        List<Variable> vars = ((Clause) s.conclusion()).variables();
        String v = vars.get(r.nextInt(vars.size())).name();
        String w = "W";
        Set<String> used = variableNames(s.conclusion());
        while (c.symbols.containsKey(w) || used.contains(w) || c.indexOf(w) >= 0 || s.args().contains(w)) w = w + "w";
        // A substitution's range may name conclusion variables; its domain names premise variables.
        StringBuilder args = new StringBuilder();
        String a = s.args();
        int at = 0;
        for (int[] g : braceGroups(a)) {
            args.append(a, at, g[0]);
            List<String> bs = new ArrayList<>();
            String inner = a.substring(g[0] + 1, g[1] - 1);
            if (!inner.isBlank()) {
                for (String b : splitTop(inner, ',')) {
                    int eq = b.indexOf(":=");
                    bs.add(b.substring(0, eq).trim() + " := " + renameToken(b.substring(eq + 2).trim(), v, w));
                }
            }
            args.append('{').append(String.join(", ", bs)).append('}');
            at = g[1];
        }
        args.append(a.substring(at));
        where.append(s.label()).append(": variable ").append(v).append(" -> ").append(w);
        return replaced(c, i, new StepLine(s.label(), true, null, renameToken(s.conclusionText(), v, w), s.rule(),
                args.toString(), s.fresh()));
    }
}
