package halfrail.ui;

import javafx.geometry.Point2D;
import javafx.scene.Node;
import javafx.scene.chart.Axis;
import javafx.scene.chart.XYChart;
import javafx.scene.control.Tooltip;
import javafx.util.Duration;

import java.util.function.BiFunction;

/**
 * Tooltips for the plots, in the trade's words: what each axis measures, and a read-out of the
 * nearest point of the nearest curve under the pointer.
 */
final class ChartTips {
    /** How long the pointer rests before a tooltip shows, ms. */
    static final double SHOW_DELAY_MS = 300;

    private ChartTips() {}

    /** A tooltip on {@code axis} saying what it measures. */
    static void axis(Axis<?> axis, String text) {
        Tooltip t = new Tooltip(text);
        t.setShowDelay(Duration.millis(SHOW_DELAY_MS));
        t.setWrapText(true);
        t.setMaxWidth(420);
        Tooltip.install(axis, t);
    }

    /**
     * A read-out over the plot area of {@code chart}: the point nearest the pointer (of the curve
     * nearest it), in words from {@code words} (the series and the point); nothing when the pointer
     * is far from every curve.
     */
    static void readout(XYChart<Number, Number> chart, BiFunction<XYChart.Series<Number, Number>, XYChart.Data<Number, Number>, String> words) {
        Tooltip tip = new Tooltip();
        tip.setShowDelay(Duration.millis(SHOW_DELAY_MS));
        tip.setHideDelay(Duration.millis(100));
        chart.applyCss();
        Node plot = chart.lookup(".chart-plot-background");
        if (plot == null) {
            return;
        }
        Tooltip.install(plot, tip);
        plot.setOnMouseMoved(e -> {
            XYChart.Series<Number, Number> bestSeries = null;
            XYChart.Data<Number, Number> best = null;
            double bestDistance = Double.POSITIVE_INFINITY;
            Axis<Number> xa = chart.getXAxis();
            Axis<Number> ya = chart.getYAxis();
            for (XYChart.Series<Number, Number> s : chart.getData()) {
                String name = s.getName();
                if (name == null || name.isEmpty()) {
                    continue;
                }
                for (XYChart.Data<Number, Number> d : s.getData()) {
                    Point2D at = new Point2D(xa.getDisplayPosition(d.getXValue()), ya.getDisplayPosition(d.getYValue()));
                    Point2D px = xa.localToScene(at.getX(), 0);
                    Point2D py = ya.localToScene(0, at.getY());
                    double dx = px.getX() - e.getSceneX();
                    double dy = py.getY() - e.getSceneY();
                    double dist = dx * dx + dy * dy;
                    if (dist < bestDistance) {
                        bestDistance = dist;
                        best = d;
                        bestSeries = s;
                    }
                }
            }
            // within about 40 px of a point of a curve
            tip.setText(best != null && bestDistance < 1600 ? words.apply(bestSeries, best) : "Point at a curve to read its values.");
        });
    }
}
