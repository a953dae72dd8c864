package dev.assay.bench.jmh;

import dev.assay.kernel.Clause;
import dev.assay.kernel.Fact;
import dev.assay.kernel.Kernel;
import dev.assay.kernel.Literal;
import dev.assay.kernel.Outcome;
import dev.assay.kernel.Substitution;
import dev.assay.kernel.Symbol;
import dev.assay.kernel.Term;
import dev.assay.kernel.TermFactory;
import dev.assay.kernel.Variable;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.concurrent.TimeUnit;

/**
 * Clause rules on wide clauses, through {@link Kernel}: a resolvent with the unifier left to the kernel (renaming
 * apart, unification, the resolvent, and the variant check against the stated clause, whose variables are renamed and
 * literals shuffled); the same step with the substitutions stated (set comparison, no variant search); and a factoring
 * step without σ. The difference between the first two is roughly the cost of unification plus the variant check.
 *
 * <p>The clause is the store's window: {@code Bin(bay_k, x_k)} for k below {@code width}, plus {@code Lost(x_0)}; in
 * the {@code same-shape} variant every literal is {@code Bin(bay, x_k)}, so the variant check cannot tell literals
 * apart by their shape and must search.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class RuleBenchmark {

    @Param({"8", "60"})
    public int width;

    @Param({"distinct", "same-shape"})
    public String shapes;

    private Kernel kernel;
    private Fact window;
    private Fact vacant;
    private Fact twins;
    private Clause resolvent;
    private Clause factored;
    private Substitution vacantStated;

    @Setup
    public void setUp() {
        TermFactory f = new TermFactory();
        Symbol bin = Build.predicate("Bin", 2);
        Symbol lost = Build.predicate("Lost", 1);
        List<Symbol> symbols = new ArrayList<>(List.of(bin, lost));
        List<Literal> lits = new ArrayList<>();
        List<Literal> renamed = new ArrayList<>();
        List<Term> bays = new ArrayList<>();
        for (int k = 0; k < width; k++) {
            Symbol bay = Build.function(shapes.equals("distinct") ? "bay" + k : "bay", 0);
            if (!symbols.contains(bay)) symbols.add(bay);
            bays.add(f.application(bay));
        }
        for (int k = 0; k < width; k++) {
            lits.add(Build.literal(true, f.application(bin, bays.get(k), f.variable("x" + k))));
            if (k > 0) renamed.add(Build.literal(true, f.application(bin, bays.get(k), f.variable("v" + k))));
        }
        lits.add(Build.literal(true, f.application(lost, f.variable("x0"))));
        renamed.add(Build.literal(true, f.application(lost, f.variable("u"))));
        Collections.shuffle(renamed, new Random(7));
        Variable b = f.variable("b");
        Variable z = f.variable("z");
        Clause vacantClause = new Clause(List.of(Build.literal(false, f.application(bin, b, z))));
        // Twins: Bin(bay_0, x) or Bin(bay_0, y) or the rest over x: factoring the first two merges y into x.
        List<Literal> twinLits = new ArrayList<>();
        twinLits.add(Build.literal(true, f.application(bin, bays.get(0), f.variable("x"))));
        twinLits.add(Build.literal(true, f.application(bin, bays.get(0), f.variable("y"))));
        List<Literal> factoredLits = new ArrayList<>();
        factoredLits.add(Build.literal(true, f.application(bin, bays.get(0), f.variable("x"))));
        for (int k = 1; k < width; k++) {
            twinLits.add(Build.literal(true, f.application(bin, bays.get(k), f.variable("x"))));
            factoredLits.add(Build.literal(true, f.application(bin, bays.get(k), f.variable("x"))));
        }
        Build.Facts facts = new Build.Facts(f, symbols, List.of(new Clause(lits), vacantClause, new Clause(twinLits)));
        kernel = facts.kernel;
        window = facts.facts.get(0);
        vacant = facts.facts.get(1);
        twins = facts.facts.get(2);
        resolvent = new Clause(renamed);
        factored = new Clause(factoredLits);
        vacantStated = new Substitution(f, Map.of(b, bays.get(0), z, f.variable("x0")));
        // Each benchmark must be an accepted step, or it measures a rejection.
        Build.accepted(resolveByUnifier());
        Build.accepted(factorByUnifier());
        Build.accepted(resolveStated());
    }

    @Benchmark
    public Outcome resolveByUnifier() {
        return kernel.resolve("r", window, 1, null, vacant, 1, null, resolvent);
    }

    @Benchmark
    public Outcome resolveStated() {
        return kernel.resolve("r", window, 1, Substitution.empty(kernel.terms()), vacant, 1, vacantStated, statedResolvent());
    }

    private Clause statedCache;

    private Clause statedResolvent() {
        if (statedCache == null) {
            List<Literal> rest = new ArrayList<>(window.clause().literals());
            rest.remove(0);
            statedCache = new Clause(rest);
        }
        return statedCache;
    }

    @Benchmark
    public Outcome factorByUnifier() {
        return kernel.factor("f", twins, 1, 2, null, factored);
    }

}
