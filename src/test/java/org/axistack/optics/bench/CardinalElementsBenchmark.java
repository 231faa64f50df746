package org.axistack.optics.bench;

import java.util.concurrent.TimeUnit;

import org.axistack.optics.CardinalElements;
import org.axistack.optics.ParaxialOptics;
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
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.OptionsBuilder;

/**
 * Issue 4 performance target: cardinal elements for a new bias set on an already solved stack, &lt;= 5 ms
 * median. Sample-time mode gives the distribution (p0.50 is the median). Run:
 * {@code mvn -q -o test-compile && java -cp target/test-classes:target/classes:$(cat cp.txt)
 * org.axistack.optics.bench.CardinalElementsBenchmark} (cp.txt from {@code mvn dependency:build-classpath}).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class CardinalElementsBenchmark {

    private DemoEinzel demo;
    private int counter;

    @Setup
    public void setUp() {
        demo = new DemoEinzel();
    }

    @Benchmark
    public CardinalElements newBiasSet() {
        double focus = 1500 + (counter++ % 64) * 10.0; // a new bias every call
        return ParaxialOptics.of(demo.solution.withBiases(new double[] {0, focus, 0}), demo.stack).cardinal();
    }

    public static void main(String[] args) throws RunnerException {
        new Runner(new OptionsBuilder().include(CardinalElementsBenchmark.class.getSimpleName()).build()).run();
    }
}
