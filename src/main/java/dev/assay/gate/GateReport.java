package dev.assay.gate;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.assay.check.Failure;

import javax.xml.stream.XMLOutputFactory;
import javax.xml.stream.XMLStreamException;
import javax.xml.stream.XMLStreamWriter;
import java.io.IOException;
import java.io.StringWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/** The reports of a gate run: a table, JSON (also read back as a baseline), and JUnit XML. */
public final class GateReport {

    private static final ObjectMapper MAPPER = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
    public static final String FORMAT = "assay-gate-report/1";

    private GateReport() {
    }

    /** Counts per verdict, in a fixed order. */
    public static Map<String, Integer> summary(List<GateCase> cases) {
        Map<String, Integer> out = new LinkedHashMap<>();
        for (String v : List.of("theorem", "unsatisfiable", "vacuous", "rejected", "input error", "timeout", "internal error")) {
            int n = 0;
            for (GateCase c : cases) if (c.verdict().equals(v)) n++;
            if (n > 0) out.put(v, n);
        }
        return out;
    }

    public static String table(List<GateCase> cases, boolean withTime) {
        int width = 4;
        for (GateCase c : cases) width = Math.max(width, c.name().length());
        StringBuilder sb = new StringBuilder();
        sb.append(String.format("%-" + width + "s  %-14s %7s%s%n", "case", "verdict", "steps", withTime ? "    time" : ""));
        for (GateCase c : cases) {
            sb.append(String.format("%-" + width + "s  %-14s %7d%s%n", c.name(), c.verdict(), c.steps(),
                    withTime ? String.format(" %6d ms", c.elapsedMillis()) : ""));
            if (c.failure() != null && !c.verified()) {
                sb.append("    ").append(c.failure().location()).append(": ")
                        .append(c.failure().step() != null ? "step " + c.failure().step() + ": " : "")
                        .append(c.failure().reason()).append('\n');
            }
        }
        Map<String, Integer> s = summary(cases);
        int verified = 0;
        for (GateCase c : cases) if (c.verified()) verified++;
        sb.append(String.format("%d case%s: %d verified", cases.size(), cases.size() == 1 ? "" : "s", verified));
        for (Map.Entry<String, Integer> e : s.entrySet()) {
            if (!e.getKey().equals("theorem") && !e.getKey().equals("unsatisfiable")) {
                sb.append(", ").append(e.getValue()).append(' ').append(e.getKey());
            }
        }
        return sb.append('\n').toString();
    }

    public static String json(List<GateCase> cases, boolean withTime) {
        ObjectNode root = MAPPER.createObjectNode();
        root.put("format", FORMAT);
        ObjectNode sum = root.putObject("summary");
        sum.put("cases", cases.size());
        for (Map.Entry<String, Integer> e : summary(cases).entrySet()) sum.put(e.getKey(), e.getValue());
        ArrayNode arr = root.putArray("cases");
        for (GateCase c : cases) {
            ObjectNode n = arr.addObject();
            n.put("case", c.name());
            n.put("problem", c.problem());
            n.put("certificate", c.certificate());
            n.put("verdict", c.verdict());
            n.put("exitStatus", c.exitStatus());
            n.put("steps", c.steps());
            if (withTime) n.put("elapsedMillis", c.elapsedMillis());
            Failure f = c.failure();
            if (f == null) {
                n.putNull("failure");
            } else {
                ObjectNode fn = n.putObject("failure");
                fn.put("file", f.file());
                fn.put("line", f.line());
                fn.put("column", f.column());
                fn.put("step", f.step());
                fn.put("rule", f.rule());
                fn.put("reason", f.reason());
                fn.put("stated", f.stated());
                fn.put("derived", f.derived());
            }
        }
        try {
            return MAPPER.writeValueAsString(root) + "\n";
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Reads a gate JSON report back (a baseline, or a shard to merge). */
    public static List<GateCase> read(Path file) throws IOException {
        JsonNode root = MAPPER.readTree(file.toFile());
        if (root == null || !FORMAT.equals(root.path("format").asText())) {
            throw new IOException(file + " is not an Assay gate report (" + FORMAT + ")");
        }
        List<GateCase> out = new ArrayList<>();
        for (JsonNode n : root.path("cases")) {
            JsonNode f = n.path("failure");
            Failure failure = f.isObject() ? new Failure(f.path("file").asText(), f.path("line").asInt(),
                    f.path("column").asInt(), text(f, "step"), text(f, "rule"), f.path("reason").asText(),
                    text(f, "stated"), text(f, "derived"), null) : null;
            out.add(new GateCase(n.path("case").asText(), n.path("problem").asText(), n.path("certificate").asText(),
                    n.path("verdict").asText(), n.path("exitStatus").asInt(), n.path("steps").asInt(),
                    n.path("elapsedMillis").asLong(), failure));
        }
        return out;
    }

    private static String text(JsonNode n, String field) {
        JsonNode v = n.get(field);
        return v == null || v.isNull() ? null : v.asText();
    }

    /** Joins shard reports: every case once, sorted by name; a case in two shards is an error. */
    public static List<GateCase> merge(List<List<GateCase>> shards) {
        TreeMap<String, GateCase> byName = new TreeMap<>();
        for (List<GateCase> s : shards) {
            for (GateCase c : s) {
                if (byName.put(c.name(), c) != null) {
                    throw new IllegalArgumentException("case " + c.name() + " is in two reports");
                }
            }
        }
        return new ArrayList<>(byName.values());
    }

    /** JUnit XML: one testcase per pair; a rejection is a failure with the located message, an input error an error. */
    public static String junit(List<GateCase> cases, String suite) {
        StringWriter out = new StringWriter();
        try {
            XMLStreamWriter w = XMLOutputFactory.newFactory().createXMLStreamWriter(out);
            w.writeStartDocument("UTF-8", "1.0");
            w.writeCharacters("\n");
            int failures = 0;
            int errors = 0;
            long millis = 0;
            for (GateCase c : cases) {
                if (isError(c)) errors++;
                else if (!c.verified()) failures++;
                millis += c.elapsedMillis();
            }
            w.writeStartElement("testsuite");
            w.writeAttribute("name", suite);
            w.writeAttribute("tests", Integer.toString(cases.size()));
            w.writeAttribute("failures", Integer.toString(failures));
            w.writeAttribute("errors", Integer.toString(errors));
            w.writeAttribute("skipped", "0");
            w.writeAttribute("time", seconds(millis));
            w.writeCharacters("\n");
            for (GateCase c : cases) {
                w.writeCharacters("  ");
                w.writeStartElement("testcase");
                int slash = c.name().lastIndexOf('/');
                w.writeAttribute("classname", slash < 0 ? suite : suite + "." + c.name().substring(0, slash).replace('/', '.'));
                w.writeAttribute("name", slash < 0 ? c.name() : c.name().substring(slash + 1));
                w.writeAttribute("time", seconds(c.elapsedMillis()));
                if (!c.verified()) {
                    w.writeCharacters("\n    ");
                    w.writeStartElement(isError(c) ? "error" : "failure");
                    String message = c.verdict() + (c.failure() == null ? "" : ": " + c.failure().location() + ": "
                            + (c.failure().step() != null ? "step " + c.failure().step() + ": " : "") + c.failure().reason());
                    w.writeAttribute("message", message);
                    w.writeAttribute("type", c.verdict());
                    w.writeCharacters(c.failure() == null ? message : c.failure().render());
                    w.writeEndElement();
                    w.writeCharacters("\n  ");
                }
                w.writeEndElement();
                w.writeCharacters("\n");
            }
            w.writeEndElement();
            w.writeCharacters("\n");
            w.writeEndDocument();
            w.close();
        } catch (XMLStreamException e) {
            throw new IllegalStateException(e);
        }
        return out.toString();
    }

    private static boolean isError(GateCase c) {
        return c.verdict().equals("input error") || c.verdict().equals("timeout") || c.verdict().equals("internal error");
    }

    private static String seconds(long millis) {
        return String.format(java.util.Locale.ROOT, "%.3f", millis / 1000.0);
    }
}
