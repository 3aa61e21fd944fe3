package halfrail.bench;

import halfrail.circuit.Circuit;
import halfrail.solve.DcSolver;
import halfrail.solve.MnaSystem;
import halfrail.solve.OperatingPoint;
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

/** DC operating point of generated chains. Target: three stages (about 20 nodes) at or under 20 µs median. */
@State(Scope.Thread)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class OperatingPointBench {
    @Param({"1", "3", "4", "16", "64"})
    public int stages;

    private DcSolver solver;

    @Setup
    public void setUp() {
        Circuit c = BenchCircuits.chain(stages);
        solver = new DcSolver(MnaSystem.of(c));
    }

    @Benchmark
    public OperatingPoint operatingPoint() {
        return solver.solve();
    }
}
