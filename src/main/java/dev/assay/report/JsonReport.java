package dev.assay.report;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.assay.check.CheckResult;
import dev.assay.check.Failure;
import dev.assay.check.IntroducedSymbol;

import java.util.Map;

/** The machine-readable report of a check. Field order is fixed so the output is byte-identical across runs. */
public final class JsonReport {

    private static final ObjectMapper MAPPER = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    private JsonReport() {
    }

    /** The JSON tree; {@code withTime} false leaves out the elapsed time, for comparisons. */
    public static ObjectNode tree(CheckResult r, boolean withTime) {
        ObjectNode o = MAPPER.createObjectNode();
        o.put("format", "assay-check-report/1");
        o.put("verdict", r.verdict().word());
        o.put("exitStatus", r.exitStatus());
        ObjectNode problem = o.putObject("problem");
        problem.put("file", r.problemFile());
        problem.put("name", r.problemName());
        problem.put("sha256", r.problemSha256());
        ObjectNode cert = o.putObject("certificate");
        cert.put("file", r.certificateFile());
        cert.put("sha256", r.certificateSha256());
        cert.put("digest", r.digest());
        o.put("steps", r.steps());
        ObjectNode byRule = o.putObject("stepsByRule");
        for (Map.Entry<String, Integer> e : r.stepsByRule().entrySet()) byRule.put(e.getKey(), e.getValue());
        if (r.refutation() != null) {
            ObjectNode ref = o.putObject("refutation");
            ref.put("step", r.refutation());
            ref.put("steps", r.refutationSteps());
            ref.put("goalUsed", r.goalUsed());
            ArrayNode used = ref.putArray("axiomsUsed");
            r.axiomsUsed().forEach(used::add);
            ArrayNode unused = ref.putArray("axiomsUnused");
            r.axiomsUnused().forEach(unused::add);
        } else {
            o.putNull("refutation");
        }
        ArrayNode syms = o.putArray("introducedSymbols");
        for (IntroducedSymbol s : r.introducedSymbols()) {
            ObjectNode n = syms.addObject();
            n.put("name", s.name());
            n.put("kind", s.kind());
            n.put("arity", s.arity());
            n.put("step", s.step());
            n.put("rule", s.rule());
        }
        Failure f = r.failure();
        if (f != null) {
            ObjectNode n = o.putObject("failure");
            n.put("file", f.file());
            n.put("line", f.line());
            n.put("column", f.column());
            n.put("step", f.step());
            n.put("rule", f.rule());
            n.put("reason", f.reason());
            n.put("stated", f.stated());
            n.put("derived", f.derived());
            n.put("seeAlso", f.otherLocation());
        } else {
            o.putNull("failure");
        }
        if (withTime) o.put("elapsedMillis", r.elapsedMillis());
        return o;
    }

    public static String render(CheckResult r, boolean withTime) {
        try {
            return MAPPER.writeValueAsString(tree(r, withTime)) + "\n";
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("JSON rendering failed", e);
        }
    }
}
