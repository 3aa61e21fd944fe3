package halfrail.ui;

import halfrail.check.BatteryReport;
import halfrail.check.ChainReport;
import halfrail.check.DesignReport;
import halfrail.check.PowerOnReport;
import halfrail.check.Side;
import halfrail.check.StageReport;
import halfrail.units.EngineeringValue;
import halfrail.units.Unit;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The view-model of the readings table: the analysis's numbers per op-amp, and the chain's and
 * the supply's, as text ready to show. Formatting only; every number comes from the report.
 */
public final class ReadingsPanelModel {
    /** One op-amp's readings, formatted. */
    public record Reading(String opAmp, String rest, String window, String headroom, String nearer,
                          String biasGain, String leakageShift) {}

    /** One named figure of the whole design. */
    public record Figure(String name, String value) {}

    private final ObservableList<Reading> readings = FXCollections.observableArrayList();
    /** Read-only view kept as a field: list listeners hold it only weakly. */
    private final ObservableList<Reading> readingsView = FXCollections.unmodifiableObservableList(readings);
    private final ObservableList<Figure> figures = FXCollections.observableArrayList();
    /** Read-only view kept as a field: list listeners hold it only weakly. */
    private final ObservableList<Figure> figuresView = FXCollections.unmodifiableObservableList(figures);

    void clear() {
        readings.clear();
        figures.clear();
    }

    void show(DesignReport r) {
        List<Reading> rows = new ArrayList<>();
        for (StageReport s : r.stages()) {
            String head;
            if (s.nominal().saturated()) {
                head = "on a rail";
            } else if (!s.signal() || s.nominal().headroomDb().isEmpty()) {
                head = s.signal() && s.nominal().hasSignal() ? "none" : "—";
            } else {
                head = String.format(Locale.ROOT, "%.1f dB", s.nominal().headroomDb().getAsDouble());
            }
            rows.add(new Reading(s.label(), v(s.outputVolts()),
                    String.format(Locale.ROOT, "%.2f–%.2f V", s.nominal().swingLowVolts(), s.nominal().swingHighVolts()), head,
                    s.signal() ? (s.nominal().clipsFirst() == Side.HIGH ? "top" : "floor") : "—",
                    String.format(Locale.ROOT, "%.3g", s.biasGain()), signed(s.leakageDriftVolts())));
        }
        readings.setAll(rows);
        List<Figure> list = new ArrayList<>();
        if (r.failure().isPresent()) {
            list.add(new Figure("analysis", "not solved: " + r.failureMessage()));
        }
        r.chain().ifPresent(c -> chain(c, list));
        clipsFirst(r, list);
        r.battery().ifPresent(b -> battery(b, list));
        r.powerOn().ifPresent(p -> powerOn(p, list));
        figures.setAll(list);
    }

    private static void chain(ChainReport c, List<Figure> list) {
        list.add(new Figure("chain gain, peak", String.format(Locale.ROOT, "%.3g V/V at %s", c.peakGain(),
                EngineeringValue.format(c.peakHz(), Unit.HERTZ))));
        list.add(new Figure("lower −3 dB corner", c.lowerCornerHz().isPresent()
                ? EngineeringValue.format(c.lowerCornerHz().getAsDouble(), Unit.HERTZ) : "none found"));
        list.add(new Figure("upper −3 dB corner", c.upperCornerHz().isPresent()
                ? EngineeringValue.format(c.upperCornerHz().getAsDouble(), Unit.HERTZ) : "none found"));
        if (c.rippleAtLoadVolts() > 0) {
            list.add(new Figure("ripple at the load", EngineeringValue.format(c.rippleAtLoadVolts(), Unit.VOLT)
                    + " peak"));
        }
        list.add(new Figure("reference noise at the load", EngineeringValue.format(c.referenceNoiseVoltsRms(),
                Unit.VOLT) + " rms over the band"));
    }

    /** The first stage that clips at the nominal signal, and how much of their drive the last stage after it gets. */
    private static void clipsFirst(DesignReport r, List<Figure> list) {
        StageReport last = null;
        for (StageReport s : r.stages()) {
            if (s.drivenByClipped().isPresent()) {
                last = s;
            }
        }
        if (last != null) {
            list.add(new Figure("clips first", last.drivenByClipped().get() + "; " + last.label() + " gets "
                    + String.format(Locale.ROOT, "%.3g", 100 * last.driveFactor()) + " % of its linear drive"));
        }
    }

    private static void battery(BatteryReport b, List<Figure> list) {
        list.add(new Figure("supply current", EngineeringValue.format(b.totalAmps(), Unit.AMPERE)));
        if (b.runtimeHours().isPresent()) {
            list.add(new Figure("runtime, planning figure", String.format(Locale.ROOT, "%.0f h",
                    b.runtimeHours().getAsDouble())));
        }
    }

    private static void powerOn(PowerOnReport p, List<Figure> list) {
        list.add(new Figure("settle-up after power-on", p.settleSummary()));
        list.add(new Figure("power-on step at the load", EngineeringValue.format(p.loadStepVolts(), Unit.VOLT)));
    }

    /**
     * The op-amp readings and the design figures as CSV (RFC 4180: comma-separated, fields with a
     * comma, quote or line break quoted, quotes doubled), op-amps first, then a blank line and the figures.
     */
    public String csv() {
        StringBuilder b = new StringBuilder();
        b.append("op-amp,rest point,swing window,headroom,nearer limit,bias gain,leakage shift\r\n");
        for (Reading r : readings) {
            b.append(String.join(",", quote(r.opAmp()), quote(r.rest()), quote(r.window()), quote(r.headroom()),
                    quote(r.nearer()), quote(r.biasGain()), quote(r.leakageShift()))).append("\r\n");
        }
        b.append("\r\nfigure,value\r\n");
        for (Figure f : figures) {
            b.append(quote(f.name())).append(',').append(quote(f.value())).append("\r\n");
        }
        return b.toString();
    }

    static String quote(String field) {
        if (field.contains(",") || field.contains("\"") || field.contains("\n") || field.contains("\r")) {
            return '"' + field.replace("\"", "\"\"") + '"';
        }
        return field;
    }

    static String v(double volts) {
        return String.format(Locale.ROOT, "%.2f V", volts);
    }

    private static String signed(double volts) {
        return (volts >= 0 ? "+" : "−") + EngineeringValue.format(Math.abs(volts), Unit.VOLT);
    }

    public ObservableList<Reading> readings() {
        return readingsView;
    }

    public ObservableList<Figure> figures() {
        return figuresView;
    }
}
