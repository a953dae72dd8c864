package dev.assay.bench.jmh;

import dev.assay.kernel.Symbol;
import dev.assay.kernel.Term;
import dev.assay.kernel.TermFactory;
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
 * Hash-consing: building a term of {@code depth} nested applications in a fresh factory (every node is new) and in a
 * factory that already holds it (every node is found), as the reader does for a term it has seen before.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class HashConsingBenchmark {

    @Param({"10", "1000"})
    public int depth;

    private final Symbol w = Build.function("w", 1);
    private final Symbol pair = Build.function("pair", 2);
    private final Symbol vial = Build.function("vial", 0);
    private TermFactory warm;

    @Setup
    public void setUp() {
        warm = new TermFactory();
        build(warm);
    }

    private Term build(TermFactory f) {
        Term t = f.application(vial);
        for (int i = 0; i < depth; i++) t = f.application(i % 2 == 0 ? w : pair, i % 2 == 0 ? new Term[] {t} : new Term[] {t, t});
        return t;
    }

    @Benchmark
    public Term freshFactory() {
        return build(new TermFactory());
    }

    @Benchmark
    public Term everyNodeFound() {
        return build(warm);
    }
}
