package dev.assay.report;

import com.github.mustachejava.DefaultMustacheFactory;
import com.github.mustachejava.Mustache;
import dev.assay.check.CheckResult;
import dev.assay.check.Checker;
import dev.assay.check.Failure;
import dev.assay.check.IntroducedSymbol;
import dev.assay.kernel.Clause;
import dev.assay.kernel.Formula;
import dev.assay.kernel.Printer;
import dev.assay.kernel.Problem;
import dev.assay.syntax.Forget;
import dev.assay.syntax.Step;

import java.io.StringWriter;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * A self-contained HTML report of one check, for a review file: nothing is loaded from elsewhere (inline style,
 * inline SVG), and every text from the input goes through the template engine's HTML escaping.
 */
public final class HtmlReport implements Checker.Listener {

    /** Proofs with more steps than this are listed but not drawn. */
    public static final int GRAPH_LIMIT = 400;

    private static final Mustache TEMPLATE = new DefaultMustacheFactory("dev/assay/report").compile("report.mustache");

    private Problem problem;
    private final List<Map<String, Object>> steps = new ArrayList<>();
    private final Map<String, List<String>> premises = new LinkedHashMap<>();

    @Override
    public void problem(Problem p) {
        problem = p;
    }

    @Override
    public void step(Step s, Object conclusion, List<String> used) {
        Map<String, Object> row = new LinkedHashMap<>();
        row.put("label", s.label().text());
        row.put("line", s.at().line());
        row.put("rule", Canonical.rule(s.args()));
        row.put("kind", conclusion instanceof Clause ? "clause" : "formula");
        row.put("conclusion", conclusion instanceof Clause c ? Printer.clause(c, 2000) : Printer.formula((Formula) conclusion, 2000));
        row.put("premises", String.join(", ", used));
        steps.add(row);
        premises.put(s.label().text(), used);
    }

    @Override
    public void forget(Forget f) {
    }

    /** Renders the page; {@code jarSha256} and {@code version} identify the checker, {@code date} the run. */
    public String render(CheckResult r, String version, String jarSha256, String date) {
        Set<String> cone = cone(r.refutation());
        for (Map<String, Object> row : steps) row.put("inCone", cone.contains((String) row.get("label")));
        Map<String, Object> m = new HashMap<>();
        m.put("verdict", r.verdict().word());
        m.put("verdictClass", r.verdict().name().toLowerCase().replace('_', '-'));
        m.put("verified", r.failure() == null && r.refutation() != null);
        m.put("version", version);
        m.put("jarSha256", jarSha256);
        m.put("date", date);
        m.put("problemFile", r.problemFile());
        m.put("problemSha256", r.problemSha256());
        m.put("problemName", r.problemName());
        m.put("certificateFile", r.certificateFile());
        m.put("certificateSha256", r.certificateSha256());
        m.put("digest", r.digest());
        m.put("steps", r.steps());
        m.put("refutation", r.refutation());
        m.put("refutationSteps", r.refutationSteps());
        m.put("axiomsUsed", String.join(", ", r.axiomsUsed()));
        m.put("axiomsUnused", r.axiomsUnused().isEmpty() ? null : String.join(", ", r.axiomsUnused()));
        m.put("goalUsed", r.goalUsed());
        List<Map<String, Object>> symbols = new ArrayList<>();
        for (IntroducedSymbol s : r.introducedSymbols()) {
            symbols.add(Map.of("name", s.name(), "kind", s.kind(), "arity", s.arity(), "step", s.step()));
        }
        m.put("symbols", symbols);
        m.put("hasSymbols", !symbols.isEmpty());
        m.put("problemText", problem == null ? null : Canonical.problem(problem));
        m.put("stepRows", steps);
        Failure f = r.failure();
        if (f != null) {
            m.put("failure", Map.of("location", f.location(), "step", f.step() == null ? "" : f.step(),
                    "rule", f.rule() == null ? "" : f.rule(), "reason", f.reason(),
                    "stated", f.stated() == null ? "" : f.stated(), "derived", f.derived() == null ? "" : f.derived()));
        }
        String laidOut = steps.size() <= GRAPH_LIMIT ? graphviz(cone) : null;
        m.put("graphviz", laidOut);
        m.put("graph", steps.size() <= GRAPH_LIMIT && laidOut == null ? graph(cone) : null);
        m.put("graphOmitted", steps.size() > GRAPH_LIMIT ? steps.size() : null);
        StringWriter out = new StringWriter();
        TEMPLATE.execute(out, m);
        return out.toString();
    }

    private Set<String> cone(String refutation) {
        Set<String> seen = new HashSet<>();
        if (refutation == null) return seen;
        ArrayDeque<String> todo = new ArrayDeque<>();
        todo.push(refutation);
        seen.add(refutation);
        while (!todo.isEmpty()) {
            for (String p : premises.getOrDefault(todo.pop(), List.of())) if (seen.add(p)) todo.push(p);
        }
        return seen;
    }

    /**
     * A layered drawing: premises of the problem on the top row, every step one row below its lowest-drawn premise,
     * edges from premise to conclusion; the refutation's cone is highlighted.
     */
    private Map<String, Object> graph(Set<String> cone) {
        Map<String, Integer> rank = new LinkedHashMap<>();
        for (Map.Entry<String, List<String>> e : premises.entrySet()) {
            int r = 0;
            for (String p : e.getValue()) {
                if (!premises.containsKey(p)) rank.putIfAbsent(p, 0);
                r = Math.max(r, rank.getOrDefault(p, 0) + 1);
            }
            rank.put(e.getKey(), r);
        }
        Map<Integer, Integer> used = new HashMap<>();
        Map<String, int[]> at = new LinkedHashMap<>();
        int width = 0;
        int height = 0;
        for (Map.Entry<String, Integer> e : rank.entrySet()) {
            int column = used.merge(e.getValue(), 1, Integer::sum) - 1;
            int x = 20 + column * 120;
            int y = 30 + e.getValue() * 70;
            at.put(e.getKey(), new int[] {x, y});
            width = Math.max(width, x + 120);
            height = Math.max(height, y + 40);
        }
        List<Map<String, Object>> nodes = new ArrayList<>();
        for (Map.Entry<String, int[]> e : at.entrySet()) {
            boolean problemNode = !premises.containsKey(e.getKey());
            String name = e.getKey().startsWith("goal:") ? "¬ " + e.getKey().substring(5) : e.getKey();
            if (name.length() > 13) name = name.substring(0, 12) + "…";
            String cls = problemNode ? "node premise" : "node";
            if (cone.contains(e.getKey()) || (problemNode && touchesCone(e.getKey(), cone))) cls += " cone";
            nodes.add(Map.of("name", name, "x", e.getValue()[0], "y", e.getValue()[1], "tx", e.getValue()[0] + 50,
                    "ty", e.getValue()[1] + 19, "cls", cls));
        }
        List<Map<String, Object>> edges = new ArrayList<>();
        for (Map.Entry<String, List<String>> e : premises.entrySet()) {
            int[] to = at.get(e.getKey());
            for (String p : e.getValue()) {
                int[] from = at.get(p);
                boolean hot = cone.contains(e.getKey());
                edges.add(Map.of("x1", from[0] + 50, "y1", from[1] + 28, "x2", to[0] + 50, "y2", to[1],
                        "cls", hot ? "edge cone" : "edge"));
            }
        }
        return Map.of("width", Math.max(width, 200), "height", Math.max(height, 80), "nodes", nodes, "edges", edges);
    }

    /**
     * The proof laid out by Graphviz's dot, when it is installed: DOT in, SVG out, embedded inline. Null when dot is
     * missing, fails or takes more than 20 s (or -Dassay.graphviz=off), and the built-in layered drawing is used.
     */
    private String graphviz(Set<String> cone) {
        if ("off".equals(System.getProperty("assay.graphviz"))) return null;
        java.nio.file.Path dot = null;
        for (String dir : System.getenv().getOrDefault("PATH", "/usr/bin").split(java.io.File.pathSeparator)) {
            java.nio.file.Path candidate = java.nio.file.Path.of(dir, "dot");
            if (java.nio.file.Files.isExecutable(candidate)) {
                dot = candidate;
                break;
            }
        }
        if (dot == null) return null;
        StringBuilder g = new StringBuilder("digraph proof {\n  rankdir=TB; node [shape=box, style=\"rounded,filled\", "
                + "fillcolor=white, fontname=\"monospace\", fontsize=10]; edge [color=\"#bbbbbb\"];\n");
        Set<String> drawn = new HashSet<>();
        for (Map.Entry<String, List<String>> e : premises.entrySet()) {
            for (String p : e.getValue()) {
                if (!premises.containsKey(p) && drawn.add(p)) {
                    boolean hot = touchesCone(p, cone);
                    String name = p.startsWith("goal:") ? "not " + p.substring(5) : p;
                    g.append("  ").append(quote(p)).append(" [label=").append(quote(name)).append(", fillcolor=\"#f4f4f4\"")
                            .append(hot ? ", color=\"#1565c0\", penwidth=2" : "").append("];\n");
                }
            }
            boolean hot = cone.contains(e.getKey());
            g.append("  ").append(quote(e.getKey())).append(hot ? " [color=\"#1565c0\", penwidth=2]" : "").append(";\n");
            for (String p : e.getValue()) {
                g.append("  ").append(quote(p)).append(" -> ").append(quote(e.getKey()))
                        .append(hot ? " [color=\"#1565c0\"]" : "").append(";\n");
            }
        }
        g.append("}\n");
        try {
            Process proc = new ProcessBuilder(dot.toString(), "-Tsvg").redirectErrorStream(false).start();
            try (var in = proc.getOutputStream()) {
                in.write(g.toString().getBytes(java.nio.charset.StandardCharsets.UTF_8));
            }
            byte[] svg = proc.getInputStream().readAllBytes();
            if (!proc.waitFor(20, java.util.concurrent.TimeUnit.SECONDS) || proc.exitValue() != 0) {
                proc.destroyForcibly();
                return null;
            }
            String text = new String(svg, java.nio.charset.StandardCharsets.UTF_8);
            int open = text.indexOf("<svg");
            if (open < 0) return null;
            // Inline SVG in HTML needs no prolog, doctype or namespace declarations.
            return text.substring(open).replaceAll(" xmlns(:xlink)?=\"[^\"]*\"", "");
        } catch (java.io.IOException e) {
            return null;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return null;
        }
    }

    /** A DOT identifier: labels and names here are identifiers of the language, quoted all the same. */
    private static String quote(String s) {
        return "\"" + s.replace("\\", "\\\\").replace("\"", "\\\"") + "\"";
    }

    private boolean touchesCone(String premise, Set<String> cone) {
        for (Map.Entry<String, List<String>> e : premises.entrySet()) {
            if (cone.contains(e.getKey()) && e.getValue().contains(premise)) return true;
        }
        return false;
    }
}
