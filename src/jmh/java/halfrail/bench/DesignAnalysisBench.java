package halfrail.bench;

import halfrail.check.DesignAnalysis;
import halfrail.check.DesignReport;
import halfrail.design.Design;
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
 * Full analysis of a design (everything the check layer does but Monte Carlo), with and without
 * the power-on transient, on the bundled samples, the settling 4- and 12-stage
 * {@code alternating-N} chains and the motorboating {@code generated-12/16} chains (their power-on
 * run stops once the oscillation is recognised, some three periods in). Target: at most 10 ms
 * median.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class DesignAnalysisBench {
    @Param({"handheld-recorder-mic-preamp", "li-ion-sensor-front-end", "usb-line-driver", "alternating-4",
            "alternating-12", "generated-12", "generated-16"})
    public String design;

    private Design d;

    @Setup
    public void setUp() {
        d = BenchCircuits.named(design).design();
    }

    @Benchmark
    public DesignReport withPowerOn() {
        return DesignAnalysis.analyse(d, true);
    }

    @Benchmark
    public DesignReport withoutPowerOn() {
        return DesignAnalysis.analyse(d, false);
    }
}
