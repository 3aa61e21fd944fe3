package halfrail.ui;

import halfrail.check.DesignAnalysis;
import halfrail.check.DesignReport;
import halfrail.check.StageReport;
import halfrail.design.Design;
import halfrail.design.FixedRail;
import halfrail.design.Supply;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;
import javafx.beans.property.ReadOnlyDoubleProperty;
import javafx.beans.property.ReadOnlyDoubleWrapper;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The view-model of the headroom plot: each signal op-amp's headroom at the nominal signal
 * against the supply voltage, from the battery's end-point to fresh. Each point is one ordinary
 * analysis of the design on a fixed rail at that voltage (power-on transient left out), run
 * through the executor like every other analysis; a newer request drops an older one's result.
 * When the check layer offers its own supply sweep, {@link #sweep} is the one place to call it.
 */
public final class HeadroomSweepModel {
    /** Supply voltages analysed from end-point to fresh, both included. */
    public static final int SWEEP_POINTS = 9;

    /** One point of a curve. @param volts supply, V @param headroomDb headroom, dB */
    public record Point(double volts, double headroomDb) {}

    /** One op-amp's headroom curve; points where it has none (no signal, stuck on a rail) are left out. */
    public record Curve(String opAmp, List<Point> points) {
        public Curve {
            points = List.copyOf(points);
        }
    }

    private final AnalysisExecutor executor;
    private final ObservableList<Curve> curves = FXCollections.observableArrayList();
    /** Read-only view kept as a field: list listeners hold it only weakly. */
    private final ObservableList<Curve> curvesView = FXCollections.unmodifiableObservableList(curves);
    private final ReadOnlyDoubleWrapper limitDb = new ReadOnlyDoubleWrapper(this, "limitDb");
    private final ReadOnlyDoubleWrapper nominalVolts = new ReadOnlyDoubleWrapper(this, "nominalVolts");
    private final ReadOnlyBooleanWrapper running = new ReadOnlyBooleanWrapper(this, "running");
    private long generation;
    private AnalysisExecutor.Job job;

    HeadroomSweepModel(AnalysisExecutor executor) {
        this.executor = executor;
    }

    void request(Design d) {
        if (job != null) {
            job.cancel();
        }
        long mine = ++generation;
        running.set(true);
        limitDb.set(d.thresholds().minHeadroomDb());
        nominalVolts.set(d.supply().nominalVolts());
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
        Supply s = d.supply();
        double low = s.lowVolts();
        double high = s.highVolts();
        Map<String, List<Point>> byOpAmp = new LinkedHashMap<>();
        for (int i = 0; i < SWEEP_POINTS; i++) {
            if (Thread.currentThread().isInterrupted()) {
                break;
            }
            double v = low + (high - low) * i / (SWEEP_POINTS - 1);
            Design at = d.withSupply(new FixedRail(v, 0, s.rippleVoltsPeak(), s.rippleHz(), s.internalOhms()));
            DesignReport r = DesignAnalysis.analyse(at, false);
            for (StageReport st : r.stages()) {
                if (!st.signal()) {
                    continue;
                }
                List<Point> pts = byOpAmp.computeIfAbsent(st.label(), k -> new ArrayList<>());
                if (!st.nominal().saturated() && st.nominal().headroomDb().isPresent()) {
                    pts.add(new Point(v, st.nominal().headroomDb().getAsDouble()));
                }
            }
        }
        List<Curve> out = new ArrayList<>();
        byOpAmp.forEach((k, v) -> out.add(new Curve(k, v)));
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

    public ReadOnlyBooleanProperty runningProperty() {
        return running.getReadOnlyProperty();
    }
}
