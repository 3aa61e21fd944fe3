package halfrail.ui;

import javafx.collections.ListChangeListener;
import javafx.scene.chart.LineChart;
import javafx.scene.chart.NumberAxis;
import javafx.scene.chart.XYChart;

/**
 * The view of the headroom plot: one line per op-amp, the design's headroom limit as a flat dashed
 * line, and on it a mark at each op-amp's lowest passing supply (named in the legend with the
 * battery's charge left there).
 */
public final class HeadroomChart extends LineChart<Number, Number> {
    private final HeadroomSweepModel model;

    public HeadroomChart(HeadroomSweepModel model) {
        super(axis("supply voltage, V"), axis("headroom, dB"));
        this.model = model;
        setId("headroom-chart");
        setTitle("Headroom at the nominal signal, from the battery's end-point to fresh; ◆ lowest supply that still passes");
        setAnimated(false);
        setCreateSymbols(true);
        setLegendVisible(true);
        ((NumberAxis) getXAxis()).setForceZeroInRange(false);
        ChartTips.axis(getXAxis(), "Supply voltage, from the battery's end-point (flat) to fresh: both swing limits move with it.");
        ChartTips.axis(getYAxis(), "Headroom: 20·log10(available swing ÷ signal peak) on the side nearer a rail. "
                + "At 0 dB the signal's peak just reaches the swing limit; below it the stage clips.");
        ChartTips.readout(this, (s, d) -> String.format(java.util.Locale.ROOT, "%s%nat %.2f V supply: headroom %.1f dB",
                s.getName(), d.getXValue().doubleValue(), d.getYValue().doubleValue()));
        model.curves().addListener((ListChangeListener<HeadroomSweepModel.Curve>) c -> redraw());
        model.limitDbProperty().addListener((o, was, now) -> redraw());
        redraw();
    }

    /** The curves' colours in the light appearance, in the order halfrail.css gives them (default-color0 to 3; the marks' mark-colour0 to 3). */
    static final String[] CURVE_COLOURS = {"#3b3f9e", "#138a7e", "#8a4f7d", "#b8860b"};
    /** A diamond mark, larger than a curve's points. */
    static final String MARK_STYLE = "-fx-shape: \"M5,0 L10,5 L5,10 L0,5 Z\"; -fx-background-radius: 0; -fx-padding: 7px; "
            + "-fx-background-insets: 0, 2.5; ";

    /** Leave the lowest-supply marks (unnamed series) out of the legend. */
    @Override
    protected void updateLegend() {
        super.updateLegend();
        if (getLegend() instanceof javafx.scene.layout.Pane legend) {
            legend.getChildren().removeIf(n -> n instanceof javafx.scene.control.Label l
                    && (l.getText() == null || l.getText().isEmpty()));
        }
    }

    private static NumberAxis axis(String label) {
        NumberAxis a = new NumberAxis();
        a.setLabel(label);
        a.setAutoRanging(true);
        return a;
    }

    private void redraw() {
        getData().clear();
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (HeadroomSweepModel.Curve c : model.curves()) {
            XYChart.Series<Number, Number> s = new XYChart.Series<>();
            s.setName(c.opAmp() + ": " + c.lowestInWords());
            for (HeadroomSweepModel.Point p : c.points()) {
                s.getData().add(new XYChart.Data<>(p.volts(), p.headroomDb()));
                lo = Math.min(lo, p.volts());
                hi = Math.max(hi, p.volts());
            }
            getData().add(s);
            s.getData().forEach(d -> d.getNode().setVisible(false));
        }
        int index = 0;
        for (HeadroomSweepModel.Curve c : model.curves()) {
            // the mark sits on the limit line at the lowest passing supply, in its curve's colour (no legend entry of its own)
            String colour = "mark-colour" + (index++ % CURVE_COLOURS.length);
            c.markVolts().ifPresent(v -> {
                XYChart.Series<Number, Number> mark = new XYChart.Series<>();
                mark.getData().add(new XYChart.Data<>(v, model.limitDbProperty().get()));
                getData().add(mark);
                mark.getData().forEach(d -> {
                    d.getNode().getStyleClass().addAll("lowest-supply-mark", colour);
                    d.getNode().setStyle(MARK_STYLE);
                });
            });
        }
        if (lo < hi) {
            XYChart.Series<Number, Number> limit = new XYChart.Series<>();
            limit.setName("least headroom asked for");
            limit.getData().add(new XYChart.Data<>(lo, model.limitDbProperty().get()));
            limit.getData().add(new XYChart.Data<>(hi, model.limitDbProperty().get()));
            getData().add(limit);
            // the limit is drawn as a dashed line without point marks
            limit.getNode().getStyleClass().add("headroom-limit");
            limit.getData().forEach(d -> d.getNode().setVisible(false));
        }
    }
}
