package dev.assay.gate;

import dev.assay.check.Checker;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;

import javax.xml.parsers.DocumentBuilderFactory;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class GateTest {

    static final Path CERTS = Path.of("certificates");

    static List<GateCase> run(List<Gate.Pair> pairs, int jobs) {
        return new Gate(jobs, 0, Checker.Options.defaults()).run(pairs, n -> { });
    }

    @Test
    void findsEveryPairSortedByName() throws Exception {
        List<Gate.Pair> pairs = Gate.find(CERTS);
        assertTrue(pairs.size() > 40);
        List<String> names = pairs.stream().map(Gate.Pair::name).toList();
        List<String> sorted = new ArrayList<>(names);
        sorted.sort(null);
        assertEquals(sorted, names);
        assertTrue(names.contains("depot/pit_access"));
        assertTrue(names.contains("broken/resolve-occurs-check"));
    }

    @Test
    void shardsPartitionTheCases() throws Exception {
        List<Gate.Pair> all = Gate.find(CERTS);
        List<String> joined = new ArrayList<>();
        for (int k = 1; k <= 3; k++) Gate.shard(all, k, 3).forEach(p -> joined.add(p.name()));
        joined.sort(null);
        assertEquals(all.stream().map(Gate.Pair::name).toList(), joined);
    }

    @Test
    void oneThreadAndTwoGiveByteIdenticalReports() throws Exception {
        List<Gate.Pair> pairs = Gate.find(CERTS);
        String one = GateReport.json(run(pairs, 1), false);
        String two = GateReport.json(run(pairs, 2), false);
        assertEquals(one, two);
    }

    @Test
    void mergeOfShardsEqualsTheWholeRun() throws Exception {
        List<Gate.Pair> all = Gate.find(CERTS.resolve("depot"));
        List<GateCase> whole = run(all, 2);
        List<GateCase> merged = GateReport.merge(List.of(run(Gate.shard(all, 2, 2), 1), run(Gate.shard(all, 1, 2), 1)));
        assertEquals(GateReport.json(whole, false), GateReport.json(merged, false));
        assertThrows(IllegalArgumentException.class, () -> GateReport.merge(List.of(whole, whole)));
    }

    @Test
    void baselineNamesRegressions(@TempDir Path dir) throws Exception {
        List<GateCase> before = run(Gate.find(CERTS.resolve("depot")), 2);
        Path file = dir.resolve("base.json");
        Files.writeString(file, GateReport.json(before, true), StandardCharsets.UTF_8);
        List<GateCase> readBack = GateReport.read(file);
        assertEquals(GateReport.json(before, false), GateReport.json(readBack, false));
        assertTrue(Baseline.compare(readBack, before).isEmpty());

        // A case that was verified and now is rejected, one that vanished, one that is new.
        List<GateCase> now = new ArrayList<>(before);
        GateCase first = now.remove(0);
        GateCase second = now.get(0);
        now.set(0, new GateCase(second.name(), second.problem(), second.certificate(), "rejected", 1, 3, 1, null));
        now.add(new GateCase("zz_new", "p", "c", "theorem", 0, 5, 1, null));
        List<Baseline.Difference> diffs = Baseline.compare(readBack, now);
        assertTrue(diffs.stream().anyMatch(d -> d.name().equals(first.name()) && d.change() == Baseline.Change.MISSING && d.regression()));
        assertTrue(diffs.stream().anyMatch(d -> d.name().equals(second.name()) && d.change() == Baseline.Change.NEWLY_REJECTED));
        assertTrue(diffs.stream().anyMatch(d -> d.name().equals("zz_new") && !d.regression()));
    }

    @Test
    void junitXmlIsWellFormedAndCarriesTheLocatedMessage() throws Exception {
        List<GateCase> cases = run(Gate.find(CERTS.resolve("broken")), 2);
        String xml = GateReport.junit(cases, "broken <&> \"suite\"");
        Document doc = DocumentBuilderFactory.newInstance().newDocumentBuilder()
                .parse(new ByteArrayInputStream(xml.getBytes(StandardCharsets.UTF_8)));
        assertEquals(cases.size(), doc.getElementsByTagName("testcase").getLength());
        int failing = doc.getElementsByTagName("failure").getLength() + doc.getElementsByTagName("error").getLength();
        assertEquals(cases.size(), failing, "every broken certificate fails");
        assertTrue(xml.contains("resolve-occurs-check.proof:9:"), "located message");
        assertFalse(xml.contains("<&>"), "escaped");
    }

    @Test
    void timeoutStopsACheck(@TempDir Path dir) throws Exception {
        // A long certificate with a tiny limit: stopped between steps, reported as a timeout.
        StringBuilder proof = new StringBuilder("certificate for chain\n");
        StringBuilder problem = new StringBuilder("problem chain\naxiom a0: P0\n");
        for (int i = 0; i < 3000; i++) problem.append("axiom r").append(i).append(": P").append(i).append(" implies P").append(i + 1).append('\n');
        proof.append("step c0: clause P0 by clausify a0\n");
        for (int i = 0; i < 3000; i++) {
            proof.append("step d").append(i).append(": clause not P").append(i).append(" or P").append(i + 1).append(" by clausify r").append(i).append('\n');
            proof.append("step c").append(i + 1).append(": clause P").append(i + 1).append(" by resolve c").append(i).append(".1, d").append(i).append(".1\n");
        }
        Files.writeString(dir.resolve("chain.problem"), problem);
        Files.writeString(dir.resolve("chain.proof"), proof);
        List<GateCase> cases = new Gate(1, 1, Checker.Options.defaults()).run(Gate.find(dir), n -> { });
        assertEquals("timeout", cases.get(0).verdict());
        List<GateCase> unlimited = new Gate(1, 0, Checker.Options.defaults()).run(Gate.find(dir), n -> { });
        assertEquals("rejected", unlimited.get(0).verdict(), "no false step, but every step checked");
        // A total limit for the whole run: the running case stops, the cases not started end without a check.
        Files.writeString(dir.resolve("later.problem"), problem);
        Files.writeString(dir.resolve("later.proof"), proof);
        List<GateCase> total = new Gate(1, 0, 1, Checker.Options.defaults()).run(Gate.find(dir), n -> { });
        assertEquals(2, total.size());
        for (GateCase c : total) assertEquals("timeout", c.verdict(), c.name());
        assertTrue(total.get(1).failure().reason().contains("total time limit"), total.get(1).failure().reason());
    }
}
