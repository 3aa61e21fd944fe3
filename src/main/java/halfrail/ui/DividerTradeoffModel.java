package halfrail.ui;

import halfrail.check.DividerChoice;
import halfrail.check.DividerTradeoff;
import halfrail.check.DividerTradeoffResult;
import halfrail.design.Design;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.ReadOnlyObjectProperty;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.SimpleBooleanProperty;

import java.util.Locale;
import java.util.Objects;

/**
 * The view-model of the battery trade-off plot: the check layer's {@link DividerTradeoff} of the
 * current design (divider values over the E12 series, each solved for its current, runtime, bias
 * shift, reference time constant and, for a few, settle-up), with the design's own divider marked.
 * The study runs through the executor only while the plot is {@link #wantedProperty() wanted} (its
 * tab shown) and only once per version of the design; a newer design drops an older run's result.
 */
public final class DividerTradeoffModel {
    private final AnalysisExecutor executor;
    private final ReadOnlyObjectWrapper<DividerTradeoffResult> result = new ReadOnlyObjectWrapper<>(this, "result");
    private final ReadOnlyStringWrapper message = new ReadOnlyStringWrapper(this, "message", "");
    private final BooleanProperty wanted = new SimpleBooleanProperty(this, "wanted");
    private Design pending;
    private Design computedFor;
    private long generation;
    private AnalysisExecutor.Job job;

    DividerTradeoffModel(AnalysisExecutor executor) {
        this.executor = Objects.requireNonNull(executor, "executor");
        wanted.addListener((o, was, now) -> maybeRun());
    }

    void designChanged(Design d) {
        pending = d;
        maybeRun();
    }

    private void maybeRun() {
        if (!wanted.get() || pending == null || pending.equals(computedFor)) {
            return;
        }
        if (job != null) {
            job.cancel();
        }
        Design d = pending;
        computedFor = d;
        long mine = ++generation;
        message.set("Trying divider values…");
        job = executor.submit(() -> DividerTradeoff.run(d), r -> {
            if (mine == generation) {
                job = null;
                result.set(r);
                message.set(caption(r));
            }
        }, e -> {
            if (mine == generation) {
                job = null;
                result.set(null);
                message.set("The trade-off could not be computed: " + e.getMessage());
            }
        });
    }

    /** One sentence on the design's own divider. */
    static String caption(DividerTradeoffResult r) {
        DividerChoice c = r.current();
        return String.format(Locale.ROOT, "This design: %s / %s divider, %s through it, %s from the supply%s; "
                        + "bias shift %s; time constant %s%s.",
                DecadeAxis.engineering(c.upperOhms(), "Ω"), DecadeAxis.engineering(c.lowerOhms(), "Ω"),
                DecadeAxis.engineering(c.dividerAmps(), "A"), DecadeAxis.engineering(c.totalAmps(), "A"),
                c.runtimeHours().isPresent() ? String.format(Locale.ROOT, ", about %.0f h on the battery", c.runtimeHours().getAsDouble()) : "",
                DecadeAxis.engineering(c.biasShiftVolts(), "V"),
                c.timeConstantSeconds().isPresent() ? DecadeAxis.engineering(c.timeConstantSeconds().getAsDouble(), "s") : "none (no decoupling)",
                c.settleSeconds().isPresent() ? ", settle-up " + DecadeAxis.engineering(c.settleSeconds().getAsDouble(), "s") : "");
    }

    /** The rows as CSV (one line per divider value, units in the header). */
    public String csv() {
        DividerTradeoffResult r = result.get();
        StringBuilder b = new StringBuilder("upper_ohms,lower_ohms,thevenin_ohms,divider_amps,total_amps,runtime_hours,"
                + "bias_shift_volts,reference_noise_volts_rms,time_constant_seconds,settle_seconds,this_design\n");
        if (r == null) {
            return b.toString();
        }
        for (DividerChoice c : r.choices()) {
            b.append(String.format(Locale.ROOT, "%.6g,%.6g,%.6g,%.6g,%.6g,%s,%.6g,%.6g,%s,%s,%s%n", c.upperOhms(), c.lowerOhms(),
                    c.theveninOhms(), c.dividerAmps(), c.totalAmps(), opt(c.runtimeHours()), c.biasShiftVolts(),
                    c.referenceNoiseVoltsRms(), opt(c.timeConstantSeconds()), opt(c.settleSeconds()), c.current() ? "yes" : ""));
        }
        return b.toString();
    }

    private static String opt(java.util.OptionalDouble v) {
        return v.isPresent() ? String.format(Locale.ROOT, "%.6g", v.getAsDouble()) : "";
    }

    public ReadOnlyObjectProperty<DividerTradeoffResult> resultProperty() {
        return result.getReadOnlyProperty();
    }

    public ReadOnlyStringProperty messageProperty() {
        return message.getReadOnlyProperty();
    }

    /** Whether the plot is on screen (the study runs only then). */
    public BooleanProperty wantedProperty() {
        return wanted;
    }
}
