package halfrail.ui;

import halfrail.check.CancelToken;
import halfrail.check.MonteCarlo;
import halfrail.check.MonteCarloOptions;
import halfrail.check.MonteCarloResult;
import halfrail.check.StudyCancelledException;
import halfrail.check.ToleranceModel;
import halfrail.check.ToleranceOptions;
import halfrail.design.Design;
import javafx.beans.property.DoubleProperty;
import javafx.beans.property.IntegerProperty;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;
import javafx.beans.property.ReadOnlyLongProperty;
import javafx.beans.property.ReadOnlyLongWrapper;
import javafx.beans.property.ReadOnlyObjectProperty;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.SimpleDoubleProperty;
import javafx.beans.property.SimpleIntegerProperty;

import java.util.Locale;
import java.util.Objects;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.Consumer;
import java.util.function.Supplier;

/**
 * The view-model of the Monte Carlo panel: runs {@link MonteCarlo} on the current design in the
 * background, reports its progress, can cancel it, and keeps the latest result (histograms,
 * yield, builds that failed to converge, the worst build).
 *
 * <p>The study is handed to the injected {@link AnalysisExecutor} as one job; inside it the builds
 * run on a fork-join pool of {@link #buildWorkers()} threads made for the run, one fewer than the
 * processors so that the FX thread keeps a core. Progress comes from the worker threads; at most
 * one progress update is waiting on the executor's callback thread at any time, and at most one is
 * handed over per {@link #PROGRESS_INTERVAL_MS}, so a fast study never floods the FX thread. Cancelling sets the study's {@link CancelToken}; the study then
 * ends with {@link StudyCancelledException} and the panel says after how many builds it stopped.
 */
public final class MonteCarloModel {
    /** Build counts the panel offers. */
    public static final int[] BUILD_CHOICES = {1_000, 10_000, 100_000};
    /** Least time between two progress updates handed to the callback thread, ms. */
    public static final long PROGRESS_INTERVAL_MS = 100;
    /** Resistor tolerances the panel offers, fractions. */
    public static final double[] RESISTOR_TOLERANCE_CHOICES = {0.01, 0.02, 0.05};

    /** Where a study stands. */
    public enum State {
        /** No study run on this design yet. */
        IDLE,
        /** Running. */
        RUNNING,
        /** Finished; {@link #resultProperty()} holds it. */
        DONE,
        /** Stopped by the user before the last build. */
        CANCELLED,
        /** Could not run (the nominal design cannot be solved, or the options were refused). */
        FAILED
    }

    private final AnalysisExecutor executor;
    private final Supplier<Design> designSource;
    private final ReadOnlyObjectWrapper<State> state = new ReadOnlyObjectWrapper<>(this, "state", State.IDLE);
    private final ReadOnlyObjectWrapper<MonteCarloResult> result = new ReadOnlyObjectWrapper<>(this, "result");
    private final ReadOnlyLongWrapper done = new ReadOnlyLongWrapper(this, "done");
    private final ReadOnlyLongWrapper total = new ReadOnlyLongWrapper(this, "total");
    private final ReadOnlyStringWrapper message = new ReadOnlyStringWrapper(this, "message",
            "Run a Monte Carlo study to see how part tolerances spread the rest points and the headroom.");
    private final ReadOnlyBooleanWrapper stale = new ReadOnlyBooleanWrapper(this, "stale");
    private final IntegerProperty builds = new SimpleIntegerProperty(this, "builds", MonteCarloOptions.DEFAULT_BUILDS);
    private final DoubleProperty resistorTolerance = new SimpleDoubleProperty(this, "resistorTolerance",
            ToleranceOptions.DEFAULT_RESISTOR_TOLERANCE);
    private Consumer<MonteCarloResult> onResult = r -> { };
    private Consumer<Design> opener = d -> { };

    private long generation;
    private AnalysisExecutor.Job job;
    private CancelToken token;

    /**
     * @param executor     runs the study (never the FX thread)
     * @param designSource the design a study is run on (the one being edited), read on the FX thread
     */
    MonteCarloModel(AnalysisExecutor executor, Supplier<Design> designSource) {
        this.executor = Objects.requireNonNull(executor, "executor");
        this.designSource = Objects.requireNonNull(designSource, "designSource");
    }

    /** Threads the builds run on: one fewer than the processors, at least one. */
    public static int buildWorkers() {
        return Math.max(1, Runtime.getRuntime().availableProcessors() - 1);
    }

    /** The tolerances a study applies: the defaults with the chosen resistor tolerance. */
    public ToleranceOptions tolerances() {
        return ToleranceOptions.defaults().withResistorTolerance(resistorTolerance.get());
    }

    /** Start a study of the current design, stopping one that is running. */
    public void run() {
        stopRunning();
        Design d = designSource.get();
        int n = builds.get();
        double resistors = resistorTolerance.get();
        long mine = ++generation;
        CancelToken mineToken = new CancelToken();
        token = mineToken;
        AtomicLong latest = new AtomicLong();
        AtomicBoolean posted = new AtomicBoolean();
        AtomicLong lastPost = new AtomicLong(System.nanoTime() - PROGRESS_INTERVAL_MS * 1_000_000);
        done.set(0);
        total.set(Math.max(0, n));
        state.set(State.RUNNING);
        message.set(String.format(Locale.ROOT, "Running %,d builds…", n));
        job = executor.submit(() -> {
            // options are checked here, so that a refused value comes back as a failure, not on the FX thread
            MonteCarloOptions options = MonteCarloOptions.defaults().withBuilds(n);
            ToleranceModel model = ToleranceModel.of(d, ToleranceOptions.defaults().withResistorTolerance(resistors));
            ForkJoinPool pool = new ForkJoinPool(buildWorkers());
            try {
                return MonteCarlo.run(model, options, pool, (finished, of) -> {
                    latest.accumulateAndGet(finished, Math::max);
                    long now = System.nanoTime();
                    long last = lastPost.get();
                    if (now - last >= PROGRESS_INTERVAL_MS * 1_000_000 && lastPost.compareAndSet(last, now)
                            && !posted.getAndSet(true)) {
                        executor.post(() -> {
                            posted.set(false);
                            if (mine == generation && state.get() == State.RUNNING) {
                                done.set(latest.get());
                            }
                        });
                    }
                }, mineToken);
            } finally {
                pool.shutdownNow();
            }
        }, r -> {
            if (mine == generation) {
                job = null;
                finished(r);
            }
        }, e -> {
            if (mine == generation) {
                job = null;
                stopped(e);
            }
        });
    }

    private void finished(MonteCarloResult r) {
        done.set(r.builds());
        result.set(r);
        stale.set(!r.design().equals(designSource.get()));
        state.set(State.DONE);
        message.set(String.format(Locale.ROOT, "Finished %,d builds of \"%s\".", r.builds(), r.design().name()));
        // the ladders' spread is drawn in a later turn of the callback thread, so that the panel and the
        // ladders are not both laid out and painted in one go
        executor.post(() -> {
            if (result.get() == r) {
                onResult.accept(r);
            }
        });
    }

    private void stopped(Throwable e) {
        if (e instanceof StudyCancelledException c) {
            done.set(c.done());
            state.set(State.CANCELLED);
            message.set(String.format(Locale.ROOT, "Stopped after %,d of %,d builds; nothing kept from this run.",
                    c.done(), c.total()));
        } else {
            state.set(State.FAILED);
            message.set("The study could not run: " + e.getMessage());
        }
    }

    /** Ask the running study to stop; it ends at the next build of each worker. */
    public void cancel() {
        if (token != null && state.get() == State.RUNNING) {
            token.cancel();
            message.set("Stopping…");
        }
    }

    private void stopRunning() {
        if (token != null) {
            token.cancel();
        }
        if (job != null) {
            job.cancel();
            job = null;
        }
    }

    /** The edited design changed: a result of another design is marked as out of date. */
    void designChanged(Design d) {
        MonteCarloResult r = result.get();
        stale.set(r != null && !r.design().equals(d));
    }

    /** Forget the result and stop any study (another design was opened). */
    void reset() {
        stopRunning();
        generation++;
        result.set(null);
        stale.set(false);
        done.set(0);
        total.set(0);
        state.set(State.IDLE);
        message.set("Run a Monte Carlo study to see how part tolerances spread the rest points and the headroom.");
    }

    /** Open the result's worst build as a new, unsaved design; false when there is none. */
    public boolean openWorstBuild() {
        MonteCarloResult r = result.get();
        if (r == null || r.worst().isEmpty()) {
            return false;
        }
        opener.accept(r.worst().get().build().design());
        return true;
    }

    void setOnResult(Consumer<MonteCarloResult> c) {
        this.onResult = Objects.requireNonNull(c);
    }

    void setOpener(Consumer<Design> c) {
        this.opener = Objects.requireNonNull(c);
    }

    /** Stop the study when the window closes. */
    void shutdown() {
        stopRunning();
    }

    /** The latest result's histograms as CSV: one line per op-amp, quantity and bin (edges in V or dB, count). */
    public String csv() {
        MonteCarloResult r = result.get();
        StringBuilder b = new StringBuilder("op_amp,quantity,bin_low,bin_high,builds\n");
        if (r == null) {
            return b.toString();
        }
        for (halfrail.check.StageDistribution s : r.opAmps()) {
            row(b, s.label(), "rest_point_volts", s.quiescentVolts());
            if (s.signal()) {
                row(b, s.label(), "headroom_db", s.headroomDb());
            }
        }
        return b.toString();
    }

    private static void row(StringBuilder b, String opAmp, String quantity, halfrail.check.Histogram h) {
        long[] counts = h.counts();
        for (int i = 0; i < counts.length; i++) {
            b.append(String.format(Locale.ROOT, "%s,%s,%.6g,%.6g,%d%n", opAmp.replaceAll("[^A-Za-z0-9_.-]+", "_"), quantity,
                    h.lowEdge() + h.binWidth() * i, h.lowEdge() + h.binWidth() * (i + 1), counts[i]));
        }
    }

    public ReadOnlyObjectProperty<State> stateProperty() {
        return state.getReadOnlyProperty();
    }

    public ReadOnlyObjectProperty<MonteCarloResult> resultProperty() {
        return result.getReadOnlyProperty();
    }

    /** Builds finished so far in the running study. */
    public ReadOnlyLongProperty doneProperty() {
        return done.getReadOnlyProperty();
    }

    /** Builds of the running (or last) study. */
    public ReadOnlyLongProperty totalProperty() {
        return total.getReadOnlyProperty();
    }

    /** A sentence on where the study stands. */
    public ReadOnlyStringProperty messageProperty() {
        return message.getReadOnlyProperty();
    }

    /** Whether the result shown was computed on another version of the design. */
    public ReadOnlyBooleanProperty staleProperty() {
        return stale.getReadOnlyProperty();
    }

    /** Builds of the next study, 1 to {@link MonteCarloOptions#MAX_BUILDS}. */
    public IntegerProperty buildsProperty() {
        return builds;
    }

    /** Resistor tolerance of the next study, a fraction (0.01 = ±1 %). */
    public DoubleProperty resistorToleranceProperty() {
        return resistorTolerance;
    }
}
