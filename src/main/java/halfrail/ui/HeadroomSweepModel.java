package halfrail.ui;

import halfrail.check.LowestPassingSupply;
import halfrail.check.StageSupplySweep;
import halfrail.check.SupplySweep;
import halfrail.check.SupplySweepOptions;
import halfrail.check.SupplySweepResult;
import halfrail.design.Design;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;
import javafx.beans.property.ReadOnlyDoubleProperty;
import javafx.beans.property.ReadOnlyDoubleWrapper;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;

/**
 * The view-model of the headroom plot: each signal op-amp's headroom at the nominal signal
 * against the supply voltage, from the battery's end-point to fresh, with the lowest supply at
 * which it still passes. The numbers come from the check layer's {@link SupplySweep} (one
 * operating point per supply voltage, the lowest passing supply refined by bisection), run through
 * the executor like every other analysis; a newer request drops an older one's result.
 *
 * <p>The sweep runs only while the plot is {@link #wantedProperty() wanted} (the main window binds
 * it to the plot's tab being shown, so that the sweep does not compete with the first frame) and
 * once per version of the design, like the divider trade-off.
 */
public final class HeadroomSweepModel {
    /** Supply voltages swept from end-point to fresh, both included. */
    public static final int SWEEP_POINTS = 61;

    /** One point of a curve. @param volts supply, V @param headroomDb headroom, dB */
    public record Point(double volts, double headroomDb) {}

    /**
     * One op-amp's headroom curve; points where it has none (stuck on a rail) are left out.
     *
     * @param lowest the lowest supply at which it still passes (the sweep's verdict, the voltage, and
     *               for a battery the capacity left there)
     */
    public record Curve(String opAmp, List<Point> points, LowestPassingSupply lowest) {
        public Curve {
            points = List.copyOf(points);
        }

        /** Where the plot marks the lowest passing supply: on the limit line at that voltage, when it falls inside the sweep. */
        public OptionalDouble markVolts() {
            return lowest.verdict() == LowestPassingSupply.Verdict.FAILS_BELOW ? lowest.volts() : OptionalDouble.empty();
        }

        /** The lowest passing supply in words, for the legend. */
        public String lowestInWords() {
            return switch (lowest.verdict()) {
                case PASSES_THROUGHOUT -> "passes over the whole range";
                case FAILS_AT_TOP -> "fails even at the top of the range";
                case FAILS_BELOW -> String.format(Locale.ROOT, "passes down to %.2f V%s", lowest.volts().getAsDouble(),
                        lowest.capacityLeftPercent().isPresent()
                                ? String.format(Locale.ROOT, " (%.0f %% of the charge left)", lowest.capacityLeftPercent().getAsDouble())
                                : "");
            };
        }
    }

    private final AnalysisExecutor executor;
    private final ObservableList<Curve> curves = FXCollections.observableArrayList();
    /** Read-only view kept as a field: list listeners hold it only weakly. */
    private final ObservableList<Curve> curvesView = FXCollections.unmodifiableObservableList(curves);
    private final ReadOnlyDoubleWrapper limitDb = new ReadOnlyDoubleWrapper(this, "limitDb");
    private final ReadOnlyDoubleWrapper nominalVolts = new ReadOnlyDoubleWrapper(this, "nominalVolts");
    private final ReadOnlyBooleanWrapper running = new ReadOnlyBooleanWrapper(this, "running");
    private final javafx.beans.property.BooleanProperty wanted = new javafx.beans.property.SimpleBooleanProperty(this, "wanted");
    private long generation;
    private AnalysisExecutor.Job job;
    /** The design of the latest request, swept or waiting for the plot to be wanted. */
    private Design pending;
    private Design sweptFor;

    HeadroomSweepModel(AnalysisExecutor executor) {
        this.executor = executor;
        wanted.addListener((o, was, now) -> maybeRun());
    }

    void request(Design d) {
        pending = d;
        limitDb.set(d.thresholds().minHeadroomDb());
        nominalVolts.set(d.supply().nominalVolts());
        maybeRun();
    }

    private void maybeRun() {
        if (!wanted.get() || pending == null || pending.equals(sweptFor)) {
            return;
        }
        Design d = pending;
        sweptFor = d;
        if (job != null) {
            job.cancel();
        }
        long mine = ++generation;
        running.set(true);
        job = executor.submit(() -> sweep(d), result -> {
            if (mine == generation) {
                job = null;
                running.set(false);
                curves.setAll(result);
            }
        }, e -> {
            if (mine == generation) {
                job = null;
                running.set(false);
                curves.clear();
            }
        });
    }

    /** The sweep itself (runs on the executor's thread). */
    static List<Curve> sweep(Design d) {
        SupplySweepResult r = SupplySweep.run(d, SupplySweepOptions.defaults().withPoints(SWEEP_POINTS));
        double[] volts = r.supplyVolts();
        List<Curve> out = new ArrayList<>();
        for (StageSupplySweep st : r.opAmps()) {
            if (!st.signal()) {
                continue;
            }
            double[] h = st.headroomDb();
            boolean[] sat = st.saturated();
            List<Point> pts = new ArrayList<>();
            for (int i = 0; i < volts.length; i++) {
                if (!sat[i] && Double.isFinite(h[i])) {
                    pts.add(new Point(volts[i], h[i]));
                }
            }
            out.add(new Curve(st.label(), pts, st.lowest()));
        }
        return out;
    }

    public ObservableList<Curve> curves() {
        return curvesView;
    }

    /** The design's least acceptable headroom, dB. */
    public ReadOnlyDoubleProperty limitDbProperty() {
        return limitDb.getReadOnlyProperty();
    }

    /** The design's nominal supply, V. */
    public ReadOnlyDoubleProperty nominalVoltsProperty() {
        return nominalVolts.getReadOnlyProperty();
    }

    /** Whether the plot is wanted (shown): the sweep waits until it is. */
    public javafx.beans.property.BooleanProperty wantedProperty() {
        return wanted;
    }

    public ReadOnlyBooleanProperty runningProperty() {
        return running.getReadOnlyProperty();
    }
}
