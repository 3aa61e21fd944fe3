package halfrail.ui;

import halfrail.check.ChainReport;
import halfrail.check.DesignReport;
import halfrail.check.PowerOnReport;
import halfrail.check.PowerOnTrace;
import halfrail.check.ResponseCurve;
import javafx.beans.property.ReadOnlyObjectProperty;
import javafx.beans.property.ReadOnlyObjectWrapper;

import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The view-model of the power-on and low-frequency response plots: the power-on trace and the
 * response curves the latest analysis kept ({@link PowerOnReport#trace()}, {@link ChainReport#responses()}).
 * Nothing is computed here; the numbers are the analysis's.
 */
public final class ReportPlotsModel {
    private final ReadOnlyObjectWrapper<PowerOnReport> powerOn = new ReadOnlyObjectWrapper<>(this, "powerOn");
    private final ReadOnlyObjectWrapper<ChainReport> chain = new ReadOnlyObjectWrapper<>(this, "chain");

    void show(DesignReport r) {
        powerOn.set(r.powerOn().orElse(null));
        chain.set(r.chain().orElse(null));
    }

    void clear() {
        powerOn.set(null);
        chain.set(null);
    }

    /** The power-on trace as CSV: time, then each op-amp's output and the load, V. */
    public String powerOnCsv() {
        PowerOnReport p = powerOn.get();
        if (p == null || p.trace().isEmpty()) {
            return "time_seconds\n";
        }
        PowerOnTrace t = p.trace().get();
        StringBuilder b = new StringBuilder("time_seconds");
        Map<String, double[]> outs = t.outputVolts();
        outs.keySet().forEach(k -> b.append(',').append(csvName(k)).append("_volts"));
        b.append(",load_volts\n");
        double[] times = t.timesSeconds();
        double[] load = t.loadVolts();
        List<double[]> cols = List.copyOf(outs.values());
        for (int i = 0; i < times.length; i++) {
            b.append(String.format(Locale.ROOT, "%.6g", times[i]));
            for (double[] c : cols) {
                b.append(String.format(Locale.ROOT, ",%.6g", c[i]));
            }
            b.append(String.format(Locale.ROOT, ",%.6g%n", load[i]));
        }
        return b.toString();
    }

    /** The response curves as CSV: one line per curve and frequency (label, Hz, dB). */
    public String responseCsv() {
        ChainReport c = chain.get();
        StringBuilder b = new StringBuilder("curve,frequency_hz,gain_db\n");
        if (c == null) {
            return b.toString();
        }
        for (ResponseCurve rc : c.responses()) {
            double[] f = rc.frequenciesHz();
            double[] g = rc.gainDb();
            for (int i = 0; i < f.length; i++) {
                b.append(String.format(Locale.ROOT, "%s,%.6g,%.6g%n", csvName(rc.label()), f[i], g[i]));
            }
        }
        return b.toString();
    }

    private static String csvName(String s) {
        return s.replaceAll("[^A-Za-z0-9_.-]+", "_");
    }

    public ReadOnlyObjectProperty<PowerOnReport> powerOnProperty() {
        return powerOn.getReadOnlyProperty();
    }

    public ReadOnlyObjectProperty<ChainReport> chainProperty() {
        return chain.getReadOnlyProperty();
    }
}
