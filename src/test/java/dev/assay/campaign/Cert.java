package dev.assay.campaign;

import dev.assay.check.CheckResult;
import dev.assay.check.Checker;
import dev.assay.check.Verdict;
import dev.assay.kernel.Clause;
import dev.assay.kernel.Formula;
import dev.assay.kernel.Printer;
import dev.assay.kernel.Problem;
import dev.assay.kernel.Signature;
import dev.assay.kernel.Symbol;
import dev.assay.report.Canonical;
import dev.assay.syntax.Forget;
import dev.assay.syntax.Name;
import dev.assay.syntax.Step;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A valid certificate as the checker understood it, one canonical line per statement, ready to be mutated: the
 * header (with the digest line when the original has one), each step with its resolved conclusion, and each forget.
 */
final class Cert {

    /** A statement of the certificate: a header line, a step, or a forget. */
    sealed interface Entry permits Line, StepLine, ForgetLine {
        String print();
    }

    record Line(String text) implements Entry {
        @Override
        public String print() {
            return text;
        }
    }

    /** {@code step LABEL: clause|formula CONCLUSION by RULE ARGS}; {@code args} starts with a space unless empty. */
    record StepLine(String label, boolean clause, Object conclusion, String conclusionText, String rule, String args,
                    List<String> fresh) implements Entry {
        @Override
        public String print() {
            return "step " + label + ": " + (clause ? "clause " : "formula ") + conclusionText + " by " + rule + args;
        }

        StepLine withConclusion(String text) {
            return new StepLine(label, clause, null, text, rule, args, fresh);
        }

        StepLine withArgs(String newArgs) {
            return new StepLine(label, clause, conclusion, conclusionText, rule, newArgs, fresh);
        }

        StepLine withRule(String newRule) {
            return new StepLine(label, clause, conclusion, conclusionText, newRule, args, fresh);
        }
    }

    record ForgetLine(List<String> labels) implements Entry {
        @Override
        public String print() {
            return "forget " + String.join(", ", labels);
        }
    }

    final String id;
    final Path problemFile;
    final Problem problem;
    final Verdict verdict;
    final List<Entry> entries;
    /** Every symbol of the problem and of the steps, by name. */
    final Map<String, Symbol> symbols;
    final String originalText;

    private Cert(String id, Path problemFile, Problem problem, Verdict verdict, List<Entry> entries,
                 Map<String, Symbol> symbols, String originalText) {
        this.id = id;
        this.problemFile = problemFile;
        this.problem = problem;
        this.verdict = verdict;
        this.entries = List.copyOf(entries);
        this.symbols = symbols;
        this.originalText = originalText;
    }

    private static final Pattern DIGEST = Pattern.compile("(?m)^\\s*digest\\s+\"[^\"]*\"");

    /** Reads and checks the pair; the canonical re-print is checked again and must get the same verdict. */
    static Cert load(String id, Path problemFile, Path proofFile) throws IOException {
        String text = Files.readString(proofFile, StandardCharsets.UTF_8);
        List<Entry> entries = new ArrayList<>();
        Problem[] problem = {null};
        Map<String, Symbol> symbols = new LinkedHashMap<>();
        Checker.Listener listener = new Checker.Listener() {
            @Override
            public void problem(Problem p) {
                problem[0] = p;
                entries.add(new Line("certificate for " + p.name()));
                Matcher m = DIGEST.matcher(text);
                if (m.find()) entries.add(new Line(m.group().trim()));
                for (Signature.Entry e : p.signature().entries()) symbols.put(e.symbol().name(), e.symbol());
                for (Formula f : p.axioms().values()) for (Symbol s : Mutants.symbols(f)) symbols.putIfAbsent(s.name(), s);
                if (p.goal() != null) for (Symbol s : Mutants.symbols(p.goal())) symbols.putIfAbsent(s.name(), s);
            }

            @Override
            public void step(Step s, Object conclusion, List<String> premises) {
                String body = conclusion instanceof Clause c ? Printer.clause(c, Printer.UNLIMITED)
                        : Printer.formula((Formula) conclusion, Printer.UNLIMITED);
                String rule = s.args().ruleName();
                String args = Canonical.rule(s.args()).substring(rule.length());
                List<String> fresh = new ArrayList<>();
                if (s.args() instanceof dev.assay.syntax.SkolemizeArgs a) for (Name n : a.fresh()) fresh.add(n.text());
                if (s.args() instanceof dev.assay.syntax.DefineArgs a) fresh.add(a.fresh().text());
                entries.add(new StepLine(s.label().text(), conclusion instanceof Clause, conclusion, body, rule, args,
                        List.copyOf(fresh)));
                for (Symbol x : Mutants.symbols(conclusion)) symbols.putIfAbsent(x.name(), x);
            }

            @Override
            public void forget(Forget f) {
                List<String> labels = new ArrayList<>();
                for (Name n : f.labels()) labels.add(n.text());
                entries.add(new ForgetLine(labels));
            }
        };
        CheckResult r = new Checker().check(problemFile, proofFile, listener);
        if (r.failure() != null) {
            throw new IllegalStateException(id + " does not check: " + r.failure().render());
        }
        return new Cert(id, problemFile, problem[0], r.verdict(), entries, symbols, text);
    }

    String print(List<Entry> es) {
        StringBuilder sb = new StringBuilder();
        for (Entry e : es) sb.append(e.print()).append('\n');
        return sb.toString();
    }

    String print() {
        return print(entries);
    }

    List<StepLine> steps() {
        List<StepLine> out = new ArrayList<>();
        for (Entry e : entries) if (e instanceof StepLine s) out.add(s);
        return out;
    }

    int indexOf(String label) {
        for (int i = 0; i < entries.size(); i++) if (entries.get(i) instanceof StepLine s && s.label().equals(label)) return i;
        return -1;
    }
}
