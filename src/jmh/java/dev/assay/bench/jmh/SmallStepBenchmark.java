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
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;

/**
 * The two steps a long chain certificate (assay bench generate chain) repeats, through {@link Kernel}: resolving
 * {@code Badge(p, gate0)} with {@code not Badge(p, g) or not Ring(g, h) or Badge(p, h)} with the unifier left to the
 * kernel (renaming apart, unification, variant check), and the same kind of step with the substitution stated (set
 * comparison). Small clauses, where the fixed cost of a step is most of it.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class SmallStepBenchmark {

    private Kernel kernel;
    private Fact start;
    private Fact carry;
    private Fact opened;
    private Clause byUnifier;
    private Clause byStated;
    private Substitution gate1;

    @Setup
    public void setUp() {
        TermFactory f = new TermFactory();
        Symbol badge = Build.predicate("Badge", 2);
        Symbol ring = Build.predicate("Ring", 2);
        Symbol g0 = Build.function("gate0", 0);
        Symbol g1 = Build.function("gate1", 0);
        Term gate0 = f.application(g0);
        Term gate1Term = f.application(g1);
        Variable p = f.variable("p");
        Variable g = f.variable("g");
        Variable h = f.variable("h");
        Clause startClause = new Clause(List.of(Build.literal(true, f.application(badge, p, gate0))));
        Clause carryClause = new Clause(List.of(Build.literal(false, f.application(badge, p, g)),
                Build.literal(false, f.application(ring, g, h)), Build.literal(true, f.application(badge, p, h))));
        Clause openedClause = new Clause(List.of(Build.literal(true, f.application(badge, p, gate1Term))));
        Build.Facts facts = new Build.Facts(f, List.of(badge, ring, g0, g1),
                List.of(startClause, carryClause, openedClause));
        kernel = facts.kernel;
        start = facts.facts.get(0);
        carry = facts.facts.get(1);
        opened = facts.facts.get(2);
        byUnifier = new Clause(List.of(Build.literal(true, f.application(badge, p, h)),
                Build.literal(false, f.application(ring, gate0, h))));
        byStated = new Clause(List.of(Build.literal(false, f.application(ring, gate1Term, h)),
                Build.literal(true, f.application(badge, p, h))));
        gate1 = new Substitution(f, Map.of(g, gate1Term));
        // Each benchmark must be an accepted step, or it measures a rejection.
        Build.accepted(resolveByUnifier());
        Build.accepted(resolveStated());
    }

    @Benchmark
    public Outcome resolveByUnifier() {
        return kernel.resolve("s1", start, 1, null, carry, 1, null, byUnifier);
    }

    @Benchmark
    public Outcome resolveStated() {
        return kernel.resolve("s3", carry, 1, gate1, opened, 1, null, byStated);
    }
}
