package halfrail.ui;

import javafx.collections.ListChangeListener;
import javafx.scene.chart.LineChart;
import javafx.scene.chart.NumberAxis;
import javafx.scene.chart.XYChart;

/** The view of the headroom plot: one line per op-amp and the design's headroom limit as a flat line. */
public final class HeadroomChart extends LineChart<Number, Number> {
    private final HeadroomSweepModel model;

    public HeadroomChart(HeadroomSweepModel model) {
        super(axis("supply voltage, V"), axis("headroom, dB"));
        this.model = model;
        setId("headroom-chart");
        setTitle("Headroom at the nominal signal, from the battery's end-point to fresh");
        setAnimated(false);
        setCreateSymbols(true);
        setLegendVisible(true);
        ((NumberAxis) getXAxis()).setForceZeroInRange(false);
        model.curves().addListener((ListChangeListener<HeadroomSweepModel.Curve>) c -> redraw());
        model.limitDbProperty().addListener((o, was, now) -> redraw());
        redraw();
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
            s.setName(c.opAmp());
            for (HeadroomSweepModel.Point p : c.points()) {
                s.getData().add(new XYChart.Data<>(p.volts(), p.headroomDb()));
                lo = Math.min(lo, p.volts());
                hi = Math.max(hi, p.volts());
            }
            getData().add(s);
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
