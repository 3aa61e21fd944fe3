package halfrail.bench;

import halfrail.solve.AcAnalysis;
import halfrail.solve.AcSweep;
import halfrail.solve.DcSolver;
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

/** AC sweep of 200 points, 1 Hz to 1 MHz, from the signal source to the load, at a solved operating point. */
@State(Scope.Thread)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class AcSweepBench {
    /** Points of the sweep (issue 10). */
    public static final int POINTS = 200;

    @Param({"chain-3", "scaling-16", "handheld-recorder-mic-preamp", "usb-line-driver", "generated-16"})
    public String circuit;

    private OperatingPoint op;
    private String input;
    private String output;

    @Setup
    public void setUp() {
        BenchCircuits.Case c = BenchCircuits.named(circuit);
        op = DcSolver.operatingPoint(c.circuit());
        input = c.input();
        output = c.output();
    }

    @Benchmark
    public AcSweep sweep() {
        return new AcAnalysis(op).sweep(input, output, 1, 1e6, POINTS);
    }
}
