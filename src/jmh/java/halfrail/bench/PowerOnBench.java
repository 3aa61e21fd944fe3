package halfrail.bench;

import halfrail.circuit.Circuit;
import halfrail.solve.PowerOnOptions;
import halfrail.solve.PowerOnResult;
import halfrail.solve.PowerOnTransient;
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
 * Power-on transient over 10 s of circuit time, time constants from 1 µs (input filter) to 2 s
 * (reference decoupling), no early stop; target at most 20 ms median for the three-stage chain.
 * The scaling chains show how the cost grows with the stage count. The run that ends once
 * settled, as the checks use it, is {@link PowerOnSettledBench}.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class PowerOnBench {
    @Param({"chain-3", "scaling-1", "scaling-4", "scaling-16", "scaling-64"})
    public String circuit;

    private Circuit c;
    private PowerOnOptions full;

    @Setup
    public void setUp() {
        c = BenchCircuits.named(circuit).circuit();
        full = PowerOnOptions.of(10).withStopWhenSettled(false);
    }

    @Benchmark
    public PowerOnResult toStopTime() {
        return PowerOnTransient.run(c, full);
    }
}
