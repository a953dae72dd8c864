package dev.assay.campaign;

import dev.assay.campaign.Mutants.Mutant;
import dev.assay.check.Verdict;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * The certificate mutation campaign (docs/campaign.md). Every valid bundled certificate and every certificate the
 * reference prover writes for the lab scenarios is mutated in each named way; every mutant is checked, and every step
 * the checker accepts, in any mutant, is judged by the finite-model oracle. A step the oracle refutes fails the test
 * with the mutant printed.
 *
 * <p>{@code -Dassay.campaign=full} runs the full campaign (at least 10,000 mutants); the default is a fixed-seed
 * sample small enough for every build. {@code -Dassay.campaign.report=FILE} also writes the table to FILE.
 */
class MutationCampaignTest {

    private static final String MODE = System.getProperty("assay.campaign", "sample");
    private static final long SEED = Long.getLong("assay.campaign.seed", 20261207L);

    /** The sample leaves out the few longest certificates (over this many steps); the full campaign has them all. */
    private static final int SAMPLE_MAX_STEPS = 100;
    /** The share of (certificate, kind) pairs the sample mutates, in percent. */
    private static final int SAMPLE_PERCENT = 75;

    @TempDir
    Path dir;

    private static boolean full() {
        return MODE.equals("full");
    }

    @Test
    void theModeIsOneTheCampaignKnows() {
        assertTrue(Set.of("sample", "full").contains(MODE), "assay.campaign must be sample or full, not " + MODE);
        System.out.println("[campaign] assay.campaign=" + MODE + " (seed " + SEED + ")");
    }

    @Test
    void theOracleRefutesWhatTheVerdictWouldHide() throws Exception {
        // The whole-certificate judgement on problems the checker never sees refuted: a consistent rota, and a claim
        // that does not follow from it. Both must be found to have a finite model.
        Campaign c = new Campaign(new FiniteModelOracle(), dir.resolve("w"));
        Path p = dir.resolve("rota.problem");
        Files.writeString(p, """
                problem rota
                axiom cover: forall s. exists t. Covers(t, s)
                axiom rest:  forall t s. Covers(t, s) implies not Rests(t, s)
                goal g: exists t. Rests(t, t)
                """, StandardCharsets.UTF_8);
        var problem = new dev.assay.syntax.Resolver(new dev.assay.kernel.TermFactory())
                .problem(dev.assay.syntax.ProblemReader.readAll(p, 100));
        assertTrue(c.whole(p, problem, Verdict.UNSATISFIABLE).yes(), "the axioms have a model");
        assertTrue(c.whole(p, problem, Verdict.THEOREM).yes(), "the axioms with the negated goal have a model");
    }

    @Test
    void mutantsOfValidCertificatesAreRejectedOrSound() throws IOException {
        long start = System.nanoTime();
        int perPair = full() ? 9 : 1;
        List<Cert> corpus = new ArrayList<>(Campaign.bundled(Path.of("certificates")));
        int bundled = corpus.size();
        corpus.addAll(Campaign.proved(dir.resolve("prover"), full() ? 30 : 8));
        if (!full()) corpus.removeIf(c -> c.steps().size() > SAMPLE_MAX_STEPS);
        bundled = (int) corpus.stream().filter(c -> !c.id.startsWith("prover/")).count();
        long loaded = System.nanoTime();
        long nodes = Long.getLong("assay.campaign.budget", full() ? FiniteModelOracle.DEFAULT_NODES : 30_000);
        FiniteModelOracle oracle = new FiniteModelOracle(FiniteModelOracle.MAX_DOMAIN, nodes, nodes * 200);
        Campaign campaign = new Campaign(oracle, dir.resolve("work"));

        // The canonical re-print of each original gets its verdict back, and the oracle finds none of its steps unsound.
        long originalSteps = 0;
        long originalUndecided = 0;
        int wholeUndecided = 0;
        for (Cert c : corpus) {
            long t0 = System.nanoTime();
            Path file = dir.resolve("work").resolve("original.proof");
            Files.createDirectories(file.getParent());
            Files.writeString(file, c.print(), StandardCharsets.UTF_8);
            Campaign.Outcome o = campaign.check(c.problemFile, file);
            assertNull(o.result().failure(), () -> c.id + " re-printed: " + o.result().failure().render() + "\n" + c.print());
            assertEquals(c.verdict, o.result().verdict(), c.id);
            for (String[] u : o.unsound()) fail(c.id + ": the original's " + u[0] + " is refuted: " + u[1]);
            assertTrue(!o.whole().yes(), c.id + ": the problem has a finite model: " + o.whole().detail());
            originalSteps += o.steps();
            originalUndecided += o.undecidedSteps();
            if (o.whole().undecided()) wholeUndecided++;
            long ms = (System.nanoTime() - t0) / 1_000_000;
            if (ms > 300 && Boolean.getBoolean("assay.campaign.verbose")) {
                System.out.println("[campaign] original " + c.id + ": " + ms + " ms, " + o.steps() + " steps, "
                        + o.undecidedSteps() + " undecided, whole " + o.whole().answer());
            }
        }
        long baseline = System.nanoTime();

        java.util.Map<String, Long> cost = new java.util.HashMap<>();
        for (Cert c : corpus) {
            long t0 = System.nanoTime();
            for (String kind : Mutants.KINDS.keySet()) {
                Random r = new Random(SEED ^ (31L * c.id.hashCode() + kind.hashCode()));
                if (!full() && r.nextInt(100) >= SAMPLE_PERCENT) continue;
                for (Mutant m : Mutants.generate(c, kind, perPair, r)) campaign.run(c, m);
            }
            cost.put(c.id, System.nanoTime() - t0);
        }
        if (Boolean.getBoolean("assay.campaign.verbose")) {
            cost.entrySet().stream().sorted((a, b) -> Long.compare(b.getValue(), a.getValue())).limit(12)
                    .forEach(e -> System.out.printf(Locale.ROOT, "[campaign] mutants of %s: %.1f s%n", e.getKey(), e.getValue() / 1e9));
        }
        long end = System.nanoTime();

        String table = campaign.table();
        String summary = String.format(Locale.ROOT,
                "[campaign] %s, oracle budget %d partial interpretations per question: %d certificates (%d bundled, %d from the prover), %d original steps judged (%d undecided),"
                        + " %d problems undecided as a whole%n"
                        + "[campaign] %d mutants; %d step judgements (%d computed, %d of those undecided)%n"
                        + "[campaign] corpus %.1f s, originals %.1f s, mutants %.1f s%n",
                MODE, nodes, corpus.size(), bundled, corpus.size() - bundled, originalSteps, originalUndecided, wholeUndecided,
                campaign.total(), campaign.stepsJudged, campaign.judgementsComputed, campaign.undecidedJudgements,
                (loaded - start) / 1e9, (baseline - loaded) / 1e9, (end - baseline) / 1e9);
        System.out.print(summary);
        System.out.print(table);
        String report = System.getProperty("assay.campaign.report");
        if (report != null) Files.writeString(Path.of(report), summary + table, StandardCharsets.UTF_8);

        System.out.printf(Locale.ROOT, "[campaign] %d checks repeated on four threads, %d with another report%n",
                campaign.threadComparisons, campaign.threadDifferenceCount);
        if (!campaign.threadDifferences.isEmpty()) {
            fail("checking on four threads changed the report:\n" + campaign.threadDifferences.get(0));
        }
        if (!campaign.findings.isEmpty()) {
            StringBuilder sb = new StringBuilder(campaign.findings.size() + " unsound accepted steps:\n");
            for (Campaign.Finding f : campaign.findings.subList(0, Math.min(5, campaign.findings.size()))) {
                sb.append(f.render()).append('\n');
            }
            fail(sb.toString());
        }
        assertTrue(campaign.total() >= (full() ? 10_000 : 1_000), "mutants made: " + campaign.total());
        for (var e : campaign.rows.entrySet()) {
            Campaign.Row r = e.getValue();
            assertTrue(r.made > 0, e.getKey() + " made no mutant");
            assertEquals(0, r.unsound, e.getKey());
        }
        for (String control : List.of("rename-variable", "duplicate-literal")) {
            assertTrue(campaign.rows.get(control).sound > 0, control + " mutants are accepted and judged sound");
        }
        for (String kind : List.of("drop-literal", "negate-literal", "reuse-fresh-symbol", "skolem-fewer-args")) {
            Campaign.Row r = campaign.rows.get(kind);
            assertTrue(r.rejected + r.inputError > 0, kind + " mutants are refused");
        }
    }
}
