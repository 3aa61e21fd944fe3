package halfrail.ui;

import halfrail.check.DividerChoice;
import halfrail.check.DividerTradeoffResult;
import javafx.geometry.Insets;
import javafx.scene.chart.LineChart;
import javafx.scene.chart.NumberAxis;
import javafx.scene.chart.XYChart;
import javafx.scene.control.Label;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;

import java.util.function.ToDoubleFunction;

/**
 * The view of the battery trade-off: against the current through the bias divider (log scale),
 * the rest-point shift the op-amps' bias currents cause, the reference's time constant and
 * settle-up (log scale), and the battery runtime; the design's own divider is marked ◆ in each.
 */
public final class DividerTradeoffChart extends VBox {
    private final DividerTradeoffModel model;
    private final LineChart<Number, Number> shift;
    private final LineChart<Number, Number> timing;
    private final LineChart<Number, Number> runtime;

    public DividerTradeoffChart(DividerTradeoffModel model) {
        this.model = model;
        setId("tradeoff");
        setSpacing(2);
        setPadding(new Insets(4));
        Label caption = new Label();
        caption.setId("tradeoff-caption");
        caption.setWrapText(true);
        caption.textProperty().bind(model.messageProperty());
        Label what = new Label("Bias divider trade-off (Ra = Rb over E12, 1 kΩ to 1 MΩ): a stiffer divider costs battery current; "
                + "a softer one lets bias currents move the rest points and slows the reference at switch-on. ◆ this design.");
        what.getStyleClass().add("panel-title");
        for (Label l : new Label[] {what, caption}) {
            l.setWrapText(true);
            l.setMaxWidth(Double.MAX_VALUE);
            l.setMinHeight(javafx.scene.layout.Region.USE_PREF_SIZE);
        }
        shift = chart("rest-point shift, mV", new NumberAxis());
        ((NumberAxis) shift.getYAxis()).setForceZeroInRange(true);
        timing = chart("reference time, s", DecadeAxis.of("reference time", "s"));
        timing.setHorizontalZeroLineVisible(false);
        runtime = chart("battery runtime, h", new NumberAxis());
        String current = "Current through the mid-rail divider, Vs ÷ (Ra + Rb), drawn from the battery all the time (logarithmic).";
        for (LineChart<Number, Number> c : new LineChart[] {shift, timing, runtime}) {
            ChartTips.axis(c.getXAxis(), current);
        }
        ChartTips.axis(shift.getYAxis(), "How far the op-amps' input bias currents move the rest points: about Ib × the "
                + "reference's Thevenin resistance Ra‖Rb (plus the bias resistor).");
        ChartTips.axis(timing.getYAxis(), "The reference's time constant (Ra‖Rb)·C, which also sets its ripple-filter corner "
                + "1/(2π·(Ra‖Rb)·C), and the settle-up time of a power-on run (logarithmic).");
        ChartTips.axis(runtime.getYAxis(), "Battery runtime at the design's total supply current, from the cell's planning capacity.");
        ChartTips.readout(shift, (s, d) -> String.format(java.util.Locale.ROOT, "%s divider current: rest points move %.2f mV",
                DecadeAxis.engineering(Math.pow(10, d.getXValue().doubleValue()), "A"), d.getYValue().doubleValue()));
        ChartTips.readout(timing, (s, d) -> String.format(java.util.Locale.ROOT, "%s%n%s divider current: %s", s.getName(),
                DecadeAxis.engineering(Math.pow(10, d.getXValue().doubleValue()), "A"),
                DecadeAxis.engineering(Math.pow(10, d.getYValue().doubleValue()), "s")));
        ChartTips.readout(runtime, (s, d) -> String.format(java.util.Locale.ROOT, "%s divider current: runtime %.0f h",
                DecadeAxis.engineering(Math.pow(10, d.getXValue().doubleValue()), "A"), d.getYValue().doubleValue()));
        HBox charts = new HBox(4, shift, timing, runtime);
        for (LineChart<Number, Number> c : new LineChart[] {shift, timing, runtime}) {
            HBox.setHgrow(c, Priority.ALWAYS);
        }
        VBox.setVgrow(charts, Priority.ALWAYS);
        getChildren().addAll(what, caption, charts);
        model.resultProperty().addListener((o, was, now) -> redraw(now));
        redraw(model.resultProperty().get());
    }

    private static LineChart<Number, Number> chart(String yLabel, NumberAxis y) {
        y.setLabel(yLabel);
        LineChart<Number, Number> c = new LineChart<>(DecadeAxis.of("divider current", "A"), y);
        c.setAnimated(false);
        c.setLegendVisible(true);
        c.setCreateSymbols(true);
        c.setMinWidth(220);
        c.getStyleClass().add("tradeoff-chart");
        return c;
    }

    private void redraw(DividerTradeoffResult r) {
        shift.getData().clear();
        timing.getData().clear();
        runtime.getData().clear();
        if (r == null) {
            return;
        }
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (DividerChoice c : r.choices()) {
            lo = Math.min(lo, Math.log10(c.dividerAmps()));
            hi = Math.max(hi, Math.log10(c.dividerAmps()));
        }
        for (LineChart<Number, Number> c : new LineChart[] {shift, timing, runtime}) {
            DecadeAxis.fit((NumberAxis) c.getXAxis(), lo, hi);
        }
        add(shift, r, "bias shift", c -> 1e3 * Math.abs(c.biasShiftVolts()));
        double tLo = Double.POSITIVE_INFINITY;
        double tHi = Double.NEGATIVE_INFINITY;
        for (DividerChoice c : r.choices()) {
            for (java.util.OptionalDouble t : new java.util.OptionalDouble[] {c.timeConstantSeconds(), c.settleSeconds()}) {
                if (t.isPresent() && t.getAsDouble() > 0) {
                    tLo = Math.min(tLo, Math.log10(t.getAsDouble()));
                    tHi = Math.max(tHi, Math.log10(t.getAsDouble()));
                }
            }
        }
        DecadeAxis.fit((NumberAxis) timing.getYAxis(), tLo, tHi);
        add(timing, r, "time constant (Ra‖Rb)·C", c -> c.timeConstantSeconds().isPresent() && c.timeConstantSeconds().getAsDouble() > 0
                ? Math.log10(c.timeConstantSeconds().getAsDouble()) : Double.NaN);
        add(timing, r, "settle-up (power-on run)", c -> c.settleSeconds().isPresent() && c.settleSeconds().getAsDouble() > 0
                ? Math.log10(c.settleSeconds().getAsDouble()) : Double.NaN);
        if (r.capacityAmpHours().isPresent()) {
            add(runtime, r, "runtime", c -> c.runtimeHours().orElse(Double.NaN));
        } else {
            runtime.setTitle("no capacity: a fixed supply");
        }
    }

    /** A curve over every row where {@code y} is a number, and the design's own row as a ◆ mark. */
    private static void add(LineChart<Number, Number> chart, DividerTradeoffResult r, String name, ToDoubleFunction<DividerChoice> y) {
        XYChart.Series<Number, Number> s = new XYChart.Series<>();
        s.setName(name);
        XYChart.Series<Number, Number> mine = new XYChart.Series<>();
        for (DividerChoice c : r.choices()) {
            double v = y.applyAsDouble(c);
            if (!Double.isFinite(v)) {
                continue;
            }
            XYChart.Data<Number, Number> d = new XYChart.Data<>(Math.log10(c.dividerAmps()), v);
            s.getData().add(d);
            if (c.current()) {
                mine.getData().add(new XYChart.Data<>(Math.log10(c.dividerAmps()), v));
            }
        }
        if (s.getData().isEmpty()) {
            return;
        }
        chart.getData().add(s);
        if (!mine.getData().isEmpty()) {
            mine.setName("");
            chart.getData().add(mine);
            mine.getData().forEach(d -> {
                d.getNode().getStyleClass().add("chosen-mark");
                // a grey edge and a yellow face read on the light and the dark paper alike
                d.getNode().setStyle(HeadroomChart.MARK_STYLE + "-fx-background-color: #8a8f98, #ffd84d;");
            });
        }
        chart.applyCss();
        javafx.scene.Node legend = chart.lookup(".chart-legend");
        if (legend instanceof javafx.scene.layout.Pane p) {
            p.getChildren().removeIf(n -> n instanceof Label l && (l.getText() == null || l.getText().isEmpty()));
        }
    }
}
