package halfrail.ui;

import halfrail.check.PowerOnReport;
import halfrail.check.PowerOnTrace;
import javafx.scene.chart.LineChart;
import javafx.scene.chart.NumberAxis;
import javafx.scene.chart.XYChart;

import java.util.Locale;
import java.util.Map;

/**
 * The view of the power-on transient: every op-amp's output and the load's voltage from switch-on,
 * with the settle-up time marked by a dashed vertical line (named in the legend).
 */
public final class PowerOnChart extends LineChart<Number, Number> {
    public PowerOnChart(ReportPlotsModel model) {
        super(axis("time after switch-on, s"), axis("voltage, V"));
        setId("power-on-chart");
        setAnimated(false);
        setCreateSymbols(false);
        setTitle("Power-on: outputs and load from switch-on, every capacitor empty");
        ChartTips.axis(getXAxis(), "Time after the supply is switched on, every capacitor empty at the start.");
        ChartTips.axis(getYAxis(), "Voltage to ground of each op-amp output and of the load. Settle-up: the last moment "
                + "any of them leaves the band around its final value.");
        ChartTips.readout(this, (s, d) -> String.format(java.util.Locale.ROOT, "%s%n%s after switch-on: %s",
                s.getName(), DecadeAxis.engineering(d.getXValue().doubleValue(), "s"), DecadeAxis.engineering(d.getYValue().doubleValue(), "V")));
        model.powerOnProperty().addListener((o, was, now) -> redraw(now));
        redraw(model.powerOnProperty().get());
    }

    private static NumberAxis axis(String label) {
        NumberAxis a = new NumberAxis();
        a.setLabel(label);
        a.setForceZeroInRange(true);
        return a;
    }

    private void redraw(PowerOnReport p) {
        getData().clear();
        if (p == null || p.trace().isEmpty()) {
            return;
        }
        PowerOnTrace t = p.trace().get();
        double[] times = t.timesSeconds();
        double lo = 0;
        double hi = 0;
        for (Map.Entry<String, double[]> e : t.outputVolts().entrySet()) {
            getData().add(series(e.getKey() + " output", times, e.getValue()));
            for (double v : e.getValue()) {
                lo = Math.min(lo, v);
                hi = Math.max(hi, v);
            }
        }
        getData().add(series("load", times, t.loadVolts()));
        for (double v : t.loadVolts()) {
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
        }
        XYChart.Series<Number, Number> settle = new XYChart.Series<>();
        if (p.settleSeconds().isPresent()) {
            double s = p.settleSeconds().getAsDouble();
            settle.setName(String.format(Locale.ROOT, "settled after %s (within ±%s)", DecadeAxis.engineering(s, "s"),
                    DecadeAxis.engineering(p.bandVolts(), "V")));
            settle.getData().add(new XYChart.Data<>(s, lo));
            settle.getData().add(new XYChart.Data<>(s, hi));
        } else {
            settle.setName(p.oscillation().map(o -> String.format(Locale.ROOT, "keeps oscillating, period %s",
                    DecadeAxis.engineering(o.periodSeconds(), "s"))).orElse(String.format(Locale.ROOT,
                    "not settled within the %s run", DecadeAxis.engineering(p.simulatedSeconds(), "s"))));
        }
        getData().add(settle);
        settle.getNode().getStyleClass().add("settle-mark");
    }

    private static XYChart.Series<Number, Number> series(String name, double[] x, double[] y) {
        XYChart.Series<Number, Number> s = new XYChart.Series<>();
        s.setName(name);
        for (int i = 0; i < x.length; i++) {
            s.getData().add(new XYChart.Data<>(x[i], y[i]));
        }
        return s;
    }
}
