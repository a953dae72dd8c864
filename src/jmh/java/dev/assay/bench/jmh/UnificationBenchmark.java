package dev.assay.bench.jmh;

import dev.assay.kernel.Symbol;
import dev.assay.kernel.Term;
import dev.assay.kernel.TermFactory;
import dev.assay.kernel.Unification;
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

import java.util.concurrent.TimeUnit;

/**
 * Most general unifiers: the Baader &amp; Snyder families, whose unifier is exponential as a tree, and a small
 * everyday pair. The term factory is kept between calls, so after the first call every term the unifier makes is
 * found again by the hash-consing (the steady state of a long check).
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class UnificationBenchmark {

    @Param({"row", "grid"})
    public String family;

    @Param({"16", "64", "256"})
    public int n;

    private TermFactory terms;
    private Term left;
    private Term right;
    private Term smallLeft;
    private Term smallRight;

    @Setup
    public void setUp() {
        terms = new TermFactory();
        Term[] pair = Build.baaderSnyder(terms, family, n);
        left = pair[0];
        right = pair[1];
        // Link(x, next(y), y) =? Link(gate(z), next(gate(a)), z): a typical resolution step.
        Symbol link = Build.function("link", 3);
        Symbol next = Build.function("next", 1);
        Symbol gate = Build.function("gate", 1);
        Symbol a = Build.function("a", 0);
        Variable x = terms.variable("x");
        Variable y = terms.variable("y");
        Variable z = terms.variable("z");
        smallLeft = terms.application(link, x, terms.application(next, y), y);
        smallRight = terms.application(link, terms.application(gate, z), terms.application(next, terms.application(gate,
                terms.application(a))), z);
    }

    @Benchmark
    public Unification.Result exponentialFamily() {
        return Unification.mostGeneralUnifier(terms, left, right);
    }

    @Benchmark
    public Unification.Result smallPair() {
        return Unification.mostGeneralUnifier(terms, smallLeft, smallRight);
    }
}
