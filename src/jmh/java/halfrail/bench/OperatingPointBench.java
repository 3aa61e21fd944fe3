package halfrail.bench;

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

/**
 * DC operating point (floating-node check, Newton, stability check, result). Target: the
 * three-stage chain (about 20 nodes) at or under 20 µs median. The scaling chains (1, 4, 16, 64
 * stages) show how the cost grows; the samples are the bundled designs' nominal circuits.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class OperatingPointBench {
    @Param({"chain-3", "scaling-1", "scaling-4", "scaling-16", "scaling-64",
            "handheld-recorder-mic-preamp", "usb-line-driver", "generated-16"})
    public String circuit;

    private DcSolver solver;

    @Setup
    public void setUp() {
        solver = new DcSolver(MnaSystem.of(BenchCircuits.named(circuit).circuit()));
    }

    @Benchmark
    public OperatingPoint operatingPoint() {
        return solver.solve();
    }
}
