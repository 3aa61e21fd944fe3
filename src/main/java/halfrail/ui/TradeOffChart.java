package halfrail.ui;

import halfrail.convert.ChainFigures;
import halfrail.convert.ConversionResult;
import halfrail.convert.TradeOffPoint;
import javafx.scene.chart.LineChart;
import javafx.scene.chart.NumberAxis;
import javafx.scene.chart.XYChart;
import javafx.scene.control.Label;

import java.util.OptionalDouble;

/**
 * The conversion's trade-off plot: the chain's lower −3 dB point (log axis) against its
 * settle-up time after switch-on (log axis) over the converter's range of capacitor choices,
 * every point from the engine. A run that had not settled when it ended is drawn at its length
 * (a lower bound) as a series of its own. The band's low end and the settle-up limit are dashed
 * lines; the converted design is the ◆ mark. It only shows what the result holds.
 */
final class TradeOffChart extends LineChart<Number, Number> {
    /** Series names, as the legend shows them. */
    static final String CURVE = "capacitor choices";
    static final String UNSETTLED = "not settled in the run (at least)";
    static final String CHOSEN = "the converted design";
    static final String BAND = "band low end";
    static final String LIMIT = "settle-up limit";

    private static final String CURVE_COLOUR = "#3b3f9e";
    private static final String UNSETTLED_COLOUR = "#8a4f7d";
    private static final String BAND_COLOUR = "#d7401f";
    private static final String LIMIT_COLOUR = "#138a7e";
    private static final String CHOSEN_FILL = "#2b2d31, #ffd84d";
    private static final String LINE_STYLE = "-fx-stroke-dash-array: 6 4; -fx-stroke-width: 1.5; ";

    TradeOffChart() {
        super(DecadeAxis.of("lower corner", "Hz"), DecadeAxis.of("settle-up", "s"));
        setId("conv-tradeoff");
        setAnimated(false);
        setCreateSymbols(true);
        setLegendVisible(true);
        setMinSize(300, 240);
        setPrefSize(460, 300);
        setHorizontalZeroLineVisible(false);
        setVerticalZeroLineVisible(false);
        getStyleClass().add("tradeoff-chart");
        setAxisSortingPolicy(SortingPolicy.NONE);
        show(null);
    }

    /** Draw {@code r}'s curve (nothing for null). */
    void show(ConversionResult r) {
        getData().clear();
        NumberAxis x = (NumberAxis) getXAxis();
        NumberAxis y = (NumberAxis) getYAxis();
        if (r == null) {
            DecadeAxis.fit(x, 0, 2);
            DecadeAxis.fit(y, -2, 1);
            return;
        }
        double band = r.request().signal().bandLowHz();
        OptionalDouble limit = r.request().limits().maxSettleSeconds();
        ChainFigures after = r.comparison().after();
        Range fx = new Range();
        Range fy = new Range();
        fx.add(band);
        limit.ifPresent(fy::add);
        XYChart.Series<Number, Number> curve = new XYChart.Series<>();
        curve.setName(CURVE);
        XYChart.Series<Number, Number> open = new XYChart.Series<>();
        open.setName(UNSETTLED);
        for (TradeOffPoint p : r.tradeOff()) {
            if (p.lowerCornerHz().isEmpty()) {
                continue;
            }
            double f = p.lowerCornerHz().getAsDouble();
            double t = p.settleSeconds().orElse(p.simulatedSeconds());
            fx.add(f);
            fy.add(t);
            (p.settleSeconds().isPresent() ? curve : open).getData().add(new XYChart.Data<>(Math.log10(f), Math.log10(t)));
        }
        XYChart.Series<Number, Number> chosen = new XYChart.Series<>();
        chosen.setName(CHOSEN);
        if (after.lowerCornerHz().isPresent()) {
            double f = after.lowerCornerHz().getAsDouble();
            double t = after.settleSeconds().isPresent() ? after.settleSeconds().getAsDouble()
                    : r.tradeOff().stream().mapToDouble(TradeOffPoint::simulatedSeconds).max().orElse(Double.NaN);
            if (Double.isFinite(t) && t > 0) {
                fx.add(f);
                fy.add(t);
                chosen.getData().add(new XYChart.Data<>(Math.log10(f), Math.log10(t)));
            }
        }
        DecadeAxis.fit(x, fx.lo, fx.hi);
        DecadeAxis.fit(y, fy.lo, fy.hi);
        XYChart.Series<Number, Number> bandLine = new XYChart.Series<>();
        bandLine.setName(BAND);
        bandLine.getData().add(new XYChart.Data<>(Math.log10(band), y.getLowerBound()));
        bandLine.getData().add(new XYChart.Data<>(Math.log10(band), y.getUpperBound()));
        XYChart.Series<Number, Number> limitLine = new XYChart.Series<>();
        limitLine.setName(LIMIT);
        limit.ifPresent(l -> {
            limitLine.getData().add(new XYChart.Data<>(x.getLowerBound(), Math.log10(l)));
            limitLine.getData().add(new XYChart.Data<>(x.getUpperBound(), Math.log10(l)));
        });
        getData().add(curve);
        paint(curve, "-fx-stroke: " + CURVE_COLOUR + "; -fx-stroke-width: 2;", CURVE_COLOUR + ", white");
        if (!open.getData().isEmpty()) {
            getData().add(open);
            paint(open, "-fx-stroke: transparent;", UNSETTLED_COLOUR + ", white");
        }
        getData().add(bandLine);
        paint(bandLine, LINE_STYLE + "-fx-stroke: " + BAND_COLOUR + ";", null);
        if (!limitLine.getData().isEmpty()) {
            getData().add(limitLine);
            paint(limitLine, LINE_STYLE + "-fx-stroke: " + LIMIT_COLOUR + ";", null);
        }
        if (!chosen.getData().isEmpty()) {
            getData().add(chosen);
            chosen.getNode().setStyle("-fx-stroke: transparent;");
            chosen.getData().forEach(d -> {
                d.getNode().getStyleClass().add("chosen-mark");
                d.getNode().setStyle(HeadroomChart.MARK_STYLE + "-fx-background-color: " + CHOSEN_FILL + ";");
            });
        }
        applyCss();
        if (lookup(".chart-legend") instanceof javafx.scene.layout.Pane legend) {
            for (javafx.scene.Node n : legend.getChildren()) {
                if (n instanceof Label l && l.getGraphic() != null) {
                    String fill = switch (l.getText()) {
                        case CURVE -> CURVE_COLOUR + ", white";
                        case UNSETTLED -> UNSETTLED_COLOUR + ", white";
                        case BAND -> BAND_COLOUR + ", " + BAND_COLOUR;
                        case LIMIT -> LIMIT_COLOUR + ", " + LIMIT_COLOUR;
                        default -> null;
                    };
                    if (CHOSEN.equals(l.getText())) {
                        l.getGraphic().setStyle(HeadroomChart.MARK_STYLE + "-fx-background-color: " + CHOSEN_FILL + ";");
                    } else if (fill != null) {
                        l.getGraphic().setStyle("-fx-background-color: " + fill + ";");
                    }
                }
            }
        }
    }

    /** Style a series' line and, unless {@code symbolFill} is null (then they are hidden), its points. */
    private static void paint(XYChart.Series<Number, Number> s, String lineStyle, String symbolFill) {
        s.getNode().setStyle(lineStyle);
        for (XYChart.Data<Number, Number> d : s.getData()) {
            if (symbolFill == null) {
                d.getNode().setVisible(false);
            } else {
                d.getNode().setStyle("-fx-background-color: " + symbolFill + ";");
            }
        }
    }

    /** The decades a set of positive values spans, as log10. */
    private static final class Range {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;

        void add(double v) {
            if (v > 0 && Double.isFinite(v)) {
                lo = Math.min(lo, Math.log10(v));
                hi = Math.max(hi, Math.log10(v));
            }
        }
    }
}
