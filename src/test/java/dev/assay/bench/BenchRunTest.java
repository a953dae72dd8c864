package dev.assay.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The whole-check harness end to end, at a tiny size: two child JVMs per certificate. */
class BenchRunTest {

    @TempDir
    Path dir;

    @Test
    void measuresEachSizeInAChildJvmAndReportsTheScaling() throws Exception {
        BenchRun.Options options = new BenchRun.Options(List.of("chain"), List.of(20L, 200L), 1, "256m", true,
                Path.of("certificates", "pelletier"), dir, 120, List.of());
        List<BenchRun.Row> rows = new BenchRun(options, line -> { }).run();
        assertEquals(2, rows.size());
        for (BenchRun.Row r : rows) {
            assertEquals("theorem", r.verdict(), r.toString());
            assertTrue(r.wallSeconds() > 0 && r.checkSeconds() >= 0 && r.wallSeconds() >= r.checkSeconds(), r.toString());
            assertTrue(r.peakLive() > 0 && r.maxCommitted() >= r.peakLive(), r.toString());
            assertTrue(r.bytes() > 0);
            if (r.parseSeconds() != null) assertTrue(r.parseSeconds() >= 0);
        }
        assertEquals(200, rows.get(1).steps());
        assertTrue(Files.exists(dir.resolve("chain-200.proof")), "--keep keeps the generated files");
        String md = BenchRun.markdown(options, rows, "assay bench run --families chain --sizes 20,200");
        assertTrue(md.contains("| chain | 200 |"), md);
        assertTrue(md.contains("Scaling") && md.contains("20 → 200"), md);
    }

    @Test
    void theMedianIgnoresFailedRuns() {
        assertEquals(2.0, BenchRun.median(new double[] {3, 1, 2}));
        assertEquals(2.5, BenchRun.median(new double[] {Double.NaN, 3, 2}));
        assertTrue(Double.isNaN(BenchRun.median(new double[] {Double.NaN})));
    }
}
