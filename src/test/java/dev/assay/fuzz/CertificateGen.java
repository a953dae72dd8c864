package dev.assay.fuzz;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Random certificate text after {@code grammar/CertificateParser.g4}: the header, an optional digest (right, wrong or
 * malformed), step lines with every rule name and every argument shape (literal references {@code A.i},
 * substitutions, positions {@code @ 1.2}, both arrows, {@code fresh}, {@code using}), and {@code forget} lines.
 *
 * <p>Conclusions are chosen so that a fair share of steps is accepted and the check goes on to the next one: a
 * {@code negate} step states {@code not (G)}, {@code instantiate} with {@code {}} restates its premise,
 * {@code reflexivity} states {@code x = x}, {@code define} states a definition of a new predicate. The rest are
 * random and mostly rejected, each at a different check of its rule.
 */
public final class CertificateGen {

    /** Something a step can name: an axiom or an earlier step, with its text when known. */
    public record Known(String label, boolean clause, String text) {
        int literals() {
            return text == null ? 1 : text.split(" or | \u2228 ").length;
        }
    }

    private static final Pattern STEP = Pattern.compile(
            "step\\s+(\\w+)\\s*:\\s*(formula|clause)\\s+(.*?)\\s+by\\s", Pattern.DOTALL);

    private final SyntaxGen g;
    private final List<Known> known = new ArrayList<>();
    private final String goal;
    private final String goalText;
    private int next = 1;
    private int fresh = 1;

    public CertificateGen(SyntaxGen g, List<Known> axioms, String goal, String goalText) {
        this.g = g;
        this.known.addAll(axioms);
        this.goal = goal;
        this.goalText = goalText;
    }

    /** The steps of a valid certificate, to continue it with random steps. */
    public static List<Known> stepsOf(String certificate) {
        List<Known> out = new ArrayList<>();
        Matcher m = STEP.matcher(certificate);
        while (m.find()) out.add(new Known(m.group(1), m.group(2).equals("clause"), m.group(3).replaceAll("\\s+", " ")));
        return out;
    }

    public void know(List<Known> more) {
        known.addAll(more);
        next = known.size() + 1;
    }

    /** A whole certificate for the named problem. */
    public String certificate(String problemName, byte[] problemBytes, int steps, int depth) {
        StringBuilder sb = new StringBuilder();
        if (g.off()) sb.append("# generated certificate\n");
        sb.append(g.off() ? "certificate for " + g.name("other_problem") : "certificate for " + problemName).append('\n');
        if (g.upTo(4) == 0) sb.append(digest(problemBytes)).append('\n');
        sb.append(steps(steps, depth));
        if (g.off()) sb.append(digest(problemBytes)).append('\n');
        return sb.toString();
    }

    /** Step and forget lines only, to append to a valid prefix. */
    public String steps(int steps, int depth) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < steps; i++) {
            sb.append(step(depth, i == steps - 1 && g.upTo(2) == 0)).append('\n');
            if (g.upTo(12) == 0) sb.append(forget()).append('\n');
        }
        return sb.toString();
    }

    String digest(byte[] problemBytes) {
        String sha = sha256(problemBytes);
        if (!g.off()) return "digest \"sha256:" + (g.upTo(2) == 0 ? sha : sha.toUpperCase()) + "\"";
        return switch (g.upTo(5)) {
            case 0 -> "digest \"sha256:" + sha.substring(1) + "0\"";
            case 1 -> "digest \"sha256:" + sha.substring(3) + "\"";
            case 2 -> "digest \"md5:" + sha + "\"";
            case 3 -> "digest \"sha256:" + sha;
            default -> "digest sha256:" + sha;
        };
    }

    String forget() {
        List<String> names = new ArrayList<>();
        int n = 1 + g.upTo(2);
        for (int i = 0; i < n; i++) names.add(g.off() ? "nowhere" : premise(null));
        return "forget " + String.join(", ", names);
    }

    /** An earlier label of the wanted kind (null for any), or now and then something that is not one. */
    String premise(Boolean clause) {
        if (g.off()) {
            return switch (g.upTo(4)) {
                case 0 -> goal == null ? "claim" : goal;
                case 1 -> "s" + (next + 1);
                case 2 -> "s" + next;
                default -> g.pick(SyntaxGen.KEYWORDS);
            };
        }
        List<Known> fit = known.stream().filter(k -> clause == null || k.clause() == clause).toList();
        if (fit.isEmpty()) fit = known;
        if (fit.isEmpty()) return "a1";
        return g.pick(fit).label();
    }

    Known premiseKnown(boolean clause) {
        String label = premise(clause);
        for (Known k : known) if (k.label().equals(label)) return k;
        return new Known(label, clause, null);
    }

    String ref(Known k) {
        if (g.off()) return g.literalRef(k.label());
        return k.label() + "." + (1 + g.upTo(Math.max(1, k.literals())));
    }

    String sub() {
        return g.substitution(List.of("x", "y", "z"));
    }

    String optSub() {
        return g.upTo(2) == 0 ? " " + sub() : "";
    }

    String step(int depth, boolean empty) {
        String label = g.off() ? g.pick(g.pick(SyntaxGen.KEYWORDS), known.isEmpty() ? "s1" : g.pick(known).label(),
                g.name("s" + next)) : "s" + next;
        next++;
        String rule = g.off() && g.upTo(3) == 0 ? g.name(g.pick(SyntaxGen.RULES)) : g.pick(SyntaxGen.RULES);
        boolean clauseRule = switch (rule) {
            case "negate", "nnf", "skolemize", "define", "abbreviate" -> false;
            default -> true;
        };
        String args;
        String conclusion = null;
        switch (rule) {
            case "negate" -> {
                String target = g.off() ? premise(false) : (goal == null ? "claim" : goal);
                args = target;
                if (goalText != null && !g.off()) conclusion = "not (" + goalText + ")";
            }
            case "nnf", "skolemize", "abbreviate" -> {
                Known p = premiseKnown(false);
                args = p.label();
                if (rule.equals("skolemize") && g.upTo(4) != 0) {
                    List<String> names = new ArrayList<>();
                    int n = 1 + g.upTo(2);
                    for (int i = 0; i < n; i++) {
                        names.add(g.off() ? g.pick(new ArrayList<>(g.signature.keySet())) : "sk" + fresh++);
                    }
                    args += " fresh " + String.join(", ", names);
                }
                if (rule.equals("abbreviate")) args += " using " + premise(false);
                if (p.text() != null && !p.clause() && g.upTo(2) == 0) conclusion = p.text();
            }
            case "define" -> {
                int k = g.upTo(3);
                String q = g.off() ? g.pick(new ArrayList<>(g.signature.keySet())) : "Q" + fresh++;
                List<String> vars = List.of("x", "y", "z").subList(0, k);
                String head = k == 0 ? q : q + "(" + String.join(", ", vars) + ")";
                String body = g.formula(depth, vars);
                String def = head + " iff " + (body.contains(" ") ? "(" + body + ")" : body);
                conclusion = k == 0 ? def : "forall " + String.join(" ", vars) + ". (" + def + ")";
                args = "fresh " + q;
                if (!g.signature.containsKey(q)) g.signature.put(q, new SyntaxGen.Sym(q, 'p', k));
            }
            case "clausify" -> {
                Known p = premiseKnown(false);
                args = p.label() + optSub();
            }
            case "resolve" -> {
                Known a = premiseKnown(true);
                Known b = premiseKnown(true);
                args = ref(a) + optSub() + ", " + ref(b) + optSub();
            }
            case "factor", "eqfactor" -> {
                Known a = premiseKnown(true);
                args = ref(a) + ", " + ref(a) + optSub();
            }
            case "instantiate" -> {
                Known a = premiseKnown(true);
                if (a.text() != null && a.clause() && g.upTo(2) == 0) {
                    conclusion = a.text();
                    args = a.label() + " {}";
                } else {
                    args = a.label() + " " + sub();
                }
            }
            case "paramodulate" -> {
                Known a = premiseKnown(true);
                Known b = premiseKnown(true);
                args = ref(a) + (g.upTo(2) == 0 ? " -> " : " <- ") + ref(b) + " @ " + g.position();
                if (g.upTo(2) == 0) args += " " + sub() + optSub();
            }
            case "eqres" -> args = ref(premiseKnown(true)) + optSub();
            case "reflexivity" -> {
                args = "";
                conclusion = g.upTo(2) == 0 ? "[x] x = x" : g.term(2, List.of()) + " = " + g.term(1, List.of());
            }
            default -> args = premise(null);
        }
        boolean clause = rule.equals("clausify") || clauseRule;
        if (g.off()) clause = !clause;
        if (empty && clause) conclusion = "false";
        if (conclusion == null) conclusion = clause ? g.clause(1 + g.upTo(3), 2) : g.formula(depth, List.of());
        known.add(new Known(label, clause, conclusion));
        String sep = g.upTo(6) == 0 ? "\n      " : " ";
        return "step " + label + ": " + (clause ? "clause " : "formula ") + conclusion + sep + "by " + rule
                + (args.isEmpty() ? "" : " " + args);
    }

    static String sha256(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    static byte[] utf8(String s) {
        return s.getBytes(StandardCharsets.UTF_8);
    }
}
