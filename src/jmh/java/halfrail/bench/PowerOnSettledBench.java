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
 * Power-on transient until settled (the run stops once every node lies near its final value, as
 * the checks run it, or once a sustained oscillation is recognised; at most 10 s of circuit
 * time), on samples, the three-stage chain, the settling 12-stage {@code alternating-12} and the
 * motorboating {@code generated-16}.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class PowerOnSettledBench {
    @Param({"chain-3", "handheld-recorder-mic-preamp", "usb-line-driver", "alternating-12", "generated-16"})
    public String circuit;

    private Circuit c;
    private PowerOnOptions settled;

    @Setup
    public void setUp() {
        c = BenchCircuits.named(circuit).circuit();
        settled = PowerOnOptions.of(10);
    }

    @Benchmark
    public PowerOnResult toSettled() {
        return PowerOnTransient.run(c, settled);
    }
}
