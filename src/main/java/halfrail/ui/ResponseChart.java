package halfrail.ui;

import halfrail.check.ChainReport;
import halfrail.check.ResponseCurve;
import javafx.scene.chart.LineChart;
import javafx.scene.chart.NumberAxis;
import javafx.scene.chart.XYChart;

import java.util.Locale;

/**
 * The view of the low-frequency response: the gain from the source to each signal stage's output
 * and to the load against frequency on a logarithmic axis, with the band's lowest frequency marked
 * by a dashed vertical line and each curve's lower −3 dB corner named in the legend.
 */
public final class ResponseChart extends LineChart<Number, Number> {
    public ResponseChart(ReportPlotsModel model) {
        super(DecadeAxis.of("frequency", "Hz"), axis());
        setId("response-chart");
        setAnimated(false);
        setCreateSymbols(false);
        setTitle("Gain from the source; dashed: where the band starts");
        setVerticalZeroLineVisible(false);
        ChartTips.axis(getXAxis(), "Signal frequency (logarithmic). The coupling and feedback-leg capacitors make "
                + "first-order high-pass corners; their cascade sets the lower −3 dB point.");
        ChartTips.axis(getYAxis(), "Small-signal gain from the source to the point named, 20·log10(Vout ÷ Vsource).");
        ChartTips.readout(this, (s, d) -> String.format(java.util.Locale.ROOT, "%s%nat %s: %.1f dB",
                s.getName(), DecadeAxis.engineering(Math.pow(10, d.getXValue().doubleValue()), "Hz"), d.getYValue().doubleValue()));
        model.chainProperty().addListener((o, was, now) -> redraw(now));
        redraw(model.chainProperty().get());
    }

    private static NumberAxis axis() {
        NumberAxis a = new NumberAxis();
        a.setLabel("gain, dB");
        a.setForceZeroInRange(false);
        return a;
    }

    private void redraw(ChainReport c) {
        getData().clear();
        if (c == null || c.responses().isEmpty()) {
            return;
        }
        double fLo = Double.POSITIVE_INFINITY;
        double fHi = Double.NEGATIVE_INFINITY;
        double gLo = Double.POSITIVE_INFINITY;
        double gHi = Double.NEGATIVE_INFINITY;
        for (ResponseCurve rc : c.responses()) {
            XYChart.Series<Number, Number> s = new XYChart.Series<>();
            String corner = rc.lowerCornerHz().isPresent()
                    ? ", −3 dB at " + DecadeAxis.engineering(rc.lowerCornerHz().getAsDouble(), "Hz") : "";
            s.setName((rc.atLoad() ? "at the load" : rc.label() + " output") + corner);
            double[] f = rc.frequenciesHz();
            double[] g = rc.gainDb();
            for (int i = 0; i < f.length; i++) {
                if (f[i] > 0 && Double.isFinite(g[i])) {
                    s.getData().add(new XYChart.Data<>(Math.log10(f[i]), g[i]));
                    fLo = Math.min(fLo, Math.log10(f[i]));
                    fHi = Math.max(fHi, Math.log10(f[i]));
                    gLo = Math.min(gLo, g[i]);
                    gHi = Math.max(gHi, g[i]);
                }
            }
            getData().add(s);
        }
        DecadeAxis.fit((NumberAxis) getXAxis(), fLo, fHi);
        if (c.bandLowHz() > 0 && Double.isFinite(gLo)) {
            XYChart.Series<Number, Number> band = new XYChart.Series<>();
            band.setName(String.format(Locale.ROOT, "band starts at %s", DecadeAxis.engineering(c.bandLowHz(), "Hz")));
            band.getData().add(new XYChart.Data<>(Math.log10(c.bandLowHz()), gLo));
            band.getData().add(new XYChart.Data<>(Math.log10(c.bandLowHz()), gHi));
            getData().add(band);
            band.getNode().getStyleClass().add("band-mark");
        }
    }
}
