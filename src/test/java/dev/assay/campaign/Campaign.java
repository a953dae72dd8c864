package dev.assay.campaign;

import dev.assay.campaign.FiniteModelOracle.Judgement;
import dev.assay.campaign.Mutants.Mutant;
import dev.assay.check.CheckResult;
import dev.assay.check.Checker;
import dev.assay.check.Verdict;
import dev.assay.kernel.Clause;
import dev.assay.kernel.Formula;
import dev.assay.kernel.Printer;
import dev.assay.kernel.Problem;
import dev.assay.kernel.Signature;
import dev.assay.kernel.Symbol;
import dev.assay.prover.Prover;
import dev.assay.syntax.DefineArgs;
import dev.assay.syntax.Forget;
import dev.assay.syntax.Name;
import dev.assay.syntax.SkolemizeArgs;
import dev.assay.syntax.Step;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Runs mutants through the checker and judges every step it accepts with the finite-model oracle.
 *
 * <p>A step is judged on the values the checker resolved (the listener hands them over): for {@code skolemize} and
 * {@code define}, every model of the premise must extend to a model of the conclusion by some interpretation of
 * the fresh symbols, where a symbol counts as fresh only when the step lists it and it occurs neither in the problem
 * nor in any earlier step (so a reused name is judged as the old symbol it is); for every other rule the conclusion
 * must hold in every model of the premises ({@code negate} has the negated goal as its premise). A certificate
 * accepted as theorem, unsatisfiable or vacuous is also judged as a whole: a finite model of the axioms (with the
 * negated goal for theorem) would show the accept unsound.
 */
final class Campaign {

    /** Counts of one mutation kind. */
    static final class Row {
        int made;
        int inputError;
        int rejected;
        int sound;
        int undecided;
        int unsound;
        int acceptedSteps;
        int undecidedSteps;
    }

    /** One unsound finding: the step (or "certificate") the oracle refuted, and the mutant. */
    record Finding(String kind, String cert, String where, String step, String detail, String text) {
        String render() {
            return kind + " of " + cert + " (" + where + "): " + step + " is unsound: " + detail + "\n" + text;
        }
    }

    final FiniteModelOracle oracle;
    final Map<String, Row> rows = new LinkedHashMap<>();
    final List<Finding> findings = new ArrayList<>();
    private final Map<String, Judgement> stepCache = new HashMap<>();
    private final Map<String, Judgement> wholeCache = new HashMap<>();
    private final Path work;
    long stepsJudged;
    long judgementsComputed;
    long undecidedJudgements;

    Campaign(FiniteModelOracle oracle, Path work) {
        this.oracle = oracle;
        this.work = work;
        for (String k : Mutants.KINDS.keySet()) rows.put(k, new Row());
    }

    // ================================================================ corpus

    private static final Pattern EXPECTED = Pattern.compile("(?m)^# expected verdict: (theorem|unsatisfiable|vacuous)\\b");

    /** Every valid pair of certificates/depot and certificates/pelletier (by its expected-verdict comment). */
    static List<Cert> bundled(Path root) throws IOException {
        List<Cert> out = new ArrayList<>();
        for (String dir : List.of("depot", "pelletier")) {
            List<Path> proofs = new ArrayList<>();
            try (DirectoryStream<Path> ds = Files.newDirectoryStream(root.resolve(dir), "*.proof")) {
                for (Path p : ds) proofs.add(p);
            }
            proofs.sort(null);
            for (Path proof : proofs) {
                String name = proof.getFileName().toString().replaceFirst("\\.proof$", "");
                Path problem = proof.resolveSibling(name + ".problem");
                if (!Files.exists(problem)) continue;
                if (!EXPECTED.matcher(Files.readString(proof, StandardCharsets.UTF_8)).find()) continue;
                out.add(Cert.load(dir + "/" + name, problem, proof));
            }
        }
        return out;
    }

    /** Certificates the reference prover writes for the lab scenarios: the hand-written ones and {@code random} seeded ones. */
    static List<Cert> proved(Path dir, int random) throws IOException {
        Map<String, String> problems = new LinkedHashMap<>(Scenarios.handWritten());
        for (long seed = 1; seed <= random; seed++) problems.put("rand_lab_" + seed, Scenarios.random(seed));
        List<Cert> out = new ArrayList<>();
        Files.createDirectories(dir);
        for (Map.Entry<String, String> e : problems.entrySet()) {
            Path problem = dir.resolve(e.getKey() + ".problem");
            Path proof = dir.resolve(e.getKey() + ".proof");
            Files.writeString(problem, e.getValue(), StandardCharsets.UTF_8);
            Prover.Outcome o = new Prover(Prover.Options.defaults(Duration.ofSeconds(10))).prove(problem, proof);
            if (o.status() != Prover.Status.PROVED) {
                // The seeded chains are theorems by construction, but a search may still give up; only the
                // hand-written problems must be proved.
                if (e.getKey().startsWith("rand_lab_")) continue;
                throw new IllegalStateException("the prover did not prove " + e.getKey() + ": " + o.message()
                        + "\n" + e.getValue());
            }
            out.add(Cert.load("prover/" + e.getKey(), problem, proof));
        }
        return out;
    }

    // ================================================================ a check, judged

    /** What a judged check found. */
    record Outcome(CheckResult result, int steps, int undecidedSteps, List<String[]> unsound, Judgement whole) {
        boolean accepted() {
            Verdict v = result.verdict();
            return v == Verdict.THEOREM || v == Verdict.UNSATISFIABLE || v == Verdict.VACUOUS;
        }
    }

    private static String print(Object value) {
        return value instanceof Clause c ? "clause " + Printer.clause(c, Printer.UNLIMITED)
                : "formula " + Printer.formula((Formula) value, Printer.UNLIMITED);
    }

    /** Records the checker's resolved steps and judges each one. */
    private final class Judge implements Checker.Listener {
        Problem problem;
        final Map<String, Object> conclusions = new HashMap<>();
        final Map<Object, String> printed = new java.util.IdentityHashMap<>();
        final Set<String> seen = new HashSet<>();
        int steps;
        int undecided;
        final List<String[]> unsound = new ArrayList<>();

        @Override
        public void problem(Problem p) {
            problem = p;
            for (Signature.Entry e : p.signature().entries()) seen.add(e.symbol().name());
            for (Formula f : p.axioms().values()) for (Symbol s : Mutants.symbols(f)) seen.add(s.name());
            if (p.goal() != null) for (Symbol s : Mutants.symbols(p.goal())) seen.add(s.name());
        }

        @Override
        public void step(Step s, Object conclusion, List<String> premises) {
            List<Object> values = new ArrayList<>();
            for (String n : premises) {
                Object v;
                if (n.startsWith("goal:")) v = new Formula.Not(problem.goal());
                else if (conclusions.containsKey(n)) v = conclusions.get(n);
                else v = problem.axioms().get(n);
                if (v == null) throw new IllegalStateException("premise " + n + " of " + s.label().text() + " unknown");
                values.add(v);
            }
            Set<String> listed = new TreeSet<>();
            if (s.args() instanceof SkolemizeArgs a) for (Name n : a.fresh()) listed.add(n.text());
            if (s.args() instanceof DefineArgs a) listed.add(a.fresh().text());
            List<Symbol> fresh = new ArrayList<>();
            boolean introduces = s.args() instanceof SkolemizeArgs || s.args() instanceof DefineArgs;
            for (Symbol x : Mutants.symbols(conclusion)) if (listed.contains(x.name()) && !seen.contains(x.name())) fresh.add(x);
            List<String> texts = new ArrayList<>();
            for (Object v : values) texts.add(printed.computeIfAbsent(v, Campaign::print));
            String text = print(conclusion);
            printed.put(conclusion, text);
            Judgement j = judge(introduces, values, texts, conclusion, text, fresh);
            steps++;
            if (j.undecided()) undecided++;
            if (j.no()) {
                unsound.add(new String[] {"step " + s.label().text() + " (" + s.args().ruleName() + ")", j.detail()});
            }
            conclusions.put(s.label().text(), conclusion);
            for (Symbol x : Mutants.symbols(conclusion)) seen.add(x.name());
        }

        @Override
        public void forget(Forget f) {
        }
    }

    private Judgement judge(boolean introduces, List<Object> premises, List<String> premiseTexts, Object conclusion,
                            String conclusionText, List<Symbol> fresh) {
        StringBuilder key = new StringBuilder(introduces ? "X" : "E");
        for (Symbol f : fresh) key.append(' ').append(f);
        List<String> ps = new ArrayList<>(premiseTexts);
        ps.sort(null);
        for (String p : ps) key.append('\n').append(p);
        key.append("\n|- ").append(conclusionText);
        stepsJudged++;
        String k = key.toString();
        Judgement j = stepCache.get(k);
        if (j == null) {
            long t0 = System.nanoTime();
            j = introduces ? oracle.extendsEveryModel(premises, conclusion, fresh) : oracle.entails(premises, conclusion);
            long ms = (System.nanoTime() - t0) / 1_000_000;
            if (ms > 200 && Boolean.getBoolean("assay.campaign.verbose")) {
                System.out.println("[campaign] slow judgement, " + ms + " ms, " + j.answer() + ", " + j.nodes() + " nodes: "
                        + j.detail() + "\n" + k);
            }
            judgementsComputed++;
            if (j.undecided()) undecidedJudgements++;
            stepCache.put(k, j);
        }
        return j;
    }

    /** The whole-certificate judgement: is there a finite model of what the verdict says is contradictory? */
    Judgement whole(Path problemFile, Problem p, Verdict v) {
        String key = problemFile + " " + v;
        Judgement j = wholeCache.get(key);
        if (j == null) {
            List<Formula> fs = new ArrayList<>(p.axioms().values());
            if (v == Verdict.THEOREM) fs.add(new Formula.Not(p.goal()));
            j = oracle.hasModel(fs);
            wholeCache.put(key, j);
        }
        return j;
    }

    /**
     * Mutants whose report from a check on four threads (reading ahead, two threads for the kernel's deferred checks)
     * differs from the judged check's, which checks every step in order: the first few, with both reports.
     */
    final List<String> threadDifferences = new ArrayList<>();
    int threadComparisons;
    int threadDifferenceCount;
    private static final Checker PARALLEL = new Checker(Checker.Options.defaults().withThreads(4));

    Outcome check(Path problem, Path proof) {
        Judge judge = new Judge();
        CheckResult r = new Checker().check(problem, proof, judge);
        String inOrder = dev.assay.report.JsonReport.render(r, false);
        String parallel = dev.assay.report.JsonReport.render(PARALLEL.check(problem, proof), false);
        threadComparisons++;
        if (!inOrder.equals(parallel) && threadDifferenceCount++ < 5) {
            threadDifferences.add(proof + " (" + problem + "):\n" + inOrder + "\nbut on four threads:\n" + parallel);
        }
        Judgement whole = null;
        Verdict v = r.verdict();
        if (v == Verdict.THEOREM || v == Verdict.UNSATISFIABLE || v == Verdict.VACUOUS) whole = whole(problem, judge.problem, v);
        return new Outcome(r, judge.steps, judge.undecided, judge.unsound, whole);
    }

    // ================================================================ mutants

    private Path mutantFile() throws IOException {
        Files.createDirectories(work);
        return work.resolve("mutant.proof");
    }

    void run(Cert base, Mutant m) throws IOException {
        Path file = mutantFile();
        Files.writeString(file, m.text(), StandardCharsets.UTF_8);
        Outcome o = check(base.problemFile, file);
        Row row = rows.get(m.kind());
        row.made++;
        for (String[] u : o.unsound()) findings.add(new Finding(m.kind(), base.id, m.where(), u[0], u[1], m.text()));
        Verdict v = o.result().verdict();
        if (v == Verdict.INPUT_ERROR) {
            row.inputError++;
        } else if (v == Verdict.REJECTED) {
            row.rejected++;
        } else if (o.accepted()) {
            row.acceptedSteps += o.steps();
            row.undecidedSteps += o.undecidedSteps();
            boolean wholeUnsound = o.whole().yes();
            if (wholeUnsound) {
                findings.add(new Finding(m.kind(), base.id, m.where(), "the certificate (" + v.word() + ")",
                        "a finite model exists: " + o.whole().detail(), m.text()));
            }
            if (wholeUnsound || !o.unsound().isEmpty()) row.unsound++;
            else if (o.undecidedSteps() > 0 || o.whole().undecided()) row.undecided++;
            else row.sound++;
        } else {
            throw new IllegalStateException(m.kind() + " of " + base.id + ": unexpected verdict " + v);
        }
    }

    // ================================================================ table

    String table() {
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(Locale.ROOT, "| %-21s | %6s | %11s | %8s | %16s | %19s | %17s |%n", "kind", "made",
                "input error", "rejected", "accepted, sound", "accepted, undecided", "accepted, unsound"));
        sb.append("|-----------------------|-------:|------------:|---------:|-----------------:|--------------------:|------------------:|\n");
        Row total = new Row();
        for (Map.Entry<String, Row> e : rows.entrySet()) {
            Row r = e.getValue();
            line(sb, e.getKey(), r);
            total.made += r.made;
            total.inputError += r.inputError;
            total.rejected += r.rejected;
            total.sound += r.sound;
            total.undecided += r.undecided;
            total.unsound += r.unsound;
        }
        line(sb, "total", total);
        return sb.toString();
    }

    private static void line(StringBuilder sb, String kind, Row r) {
        sb.append(String.format(Locale.ROOT, "| %-21s | %6d | %11d | %8d | %16d | %19d | %17d |%n", kind, r.made,
                r.inputError, r.rejected, r.sound, r.undecided, r.unsound));
    }

    int total() {
        int n = 0;
        for (Row r : rows.values()) n += r.made;
        return n;
    }
}
