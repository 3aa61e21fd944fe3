package halfrail.bench;

import halfrail.check.CancelToken;
import halfrail.check.MonteCarlo;
import halfrail.check.MonteCarloOptions;
import halfrail.check.MonteCarloResult;
import halfrail.check.StudyProgress;
import halfrail.check.SupplySweep;
import halfrail.check.SupplySweepOptions;
import halfrail.check.SupplySweepResult;
import halfrail.check.ToleranceModel;
import halfrail.check.ToleranceOptions;
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
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;

import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;

/**
 * The design studies of the check layer: a 100-point supply sweep (target at most 5 ms) and
 * Monte Carlo of 10,000 builds, operating point and headroom each, on all cores (target at
 * most 300 ms), on a generated three-stage design (the preamp stage repeated: it clips from the
 * second stage on), the two-stage Li-ion sample and the settling 4- and 12-stage
 * {@code alternating-N} chains.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class StudiesBench {
    @Param({"generated-3", "li-ion-sensor-front-end", "alternating-4", "alternating-12"})
    public String design;

    private Design d;
    private ToleranceModel model;
    private ExecutorService pool;
    private final MonteCarloOptions options = MonteCarloOptions.defaults();

    @Setup
    public void setUp() {
        d = BenchCircuits.named(design).design();
        model = ToleranceModel.of(d, ToleranceOptions.defaults());
        pool = Executors.newFixedThreadPool(Runtime.getRuntime().availableProcessors());
    }

    @TearDown
    public void tearDown() {
        pool.shutdownNow();
    }

    @Benchmark
    public SupplySweepResult supplySweep100() {
        return SupplySweep.run(d, SupplySweepOptions.defaults());
    }

    @Benchmark
    public MonteCarloResult monteCarlo10k() {
        return MonteCarlo.run(model, options, pool, StudyProgress.NONE, new CancelToken());
    }
}
