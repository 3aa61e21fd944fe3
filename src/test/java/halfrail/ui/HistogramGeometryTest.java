package halfrail.ui;

import halfrail.check.Histogram;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.OptionalDouble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Where the Monte Carlo histograms put their bars, ticks and marker, without a toolkit. */
class HistogramGeometryTest {
    private static final double W = 400;
    private static final double H = 200;

    private static HistogramGeometry geometry(Histogram h, OptionalDouble marker) {
        return new HistogramGeometry(h, W, H, marker);
    }

    @Test
    void barHeightsAreProportionalToTheirCountsAndTheFullestBinFillsThePlot() {
        HistogramGeometry g = geometry(new Histogram(1, 3, new long[] {2, 8, 4, 0}, 0), OptionalDouble.empty());
        List<HistogramGeometry.Bar> bars = g.bars();
        double full = g.baseY() - g.topY();
        assertEquals(full, bars.get(1).height(), 1e-9);
        assertEquals(full * 2 / 8, bars.get(0).height(), 1e-9);
        assertEquals(full * 4 / 8, bars.get(2).height(), 1e-9);
        assertEquals(0, bars.get(3).height(), 1e-9);
        assertEquals(8, g.maxCount());
        // every bar stands on the base line
        bars.forEach(b -> assertEquals(g.baseY(), b.y() + b.height(), 1e-9));
    }

    @Test
    void barsTileTheValueAxisFromTheLowToTheHighEdge() {
        HistogramGeometry g = geometry(new Histogram(1, 3, new long[] {1, 1, 1, 1}, 0), OptionalDouble.empty());
        List<HistogramGeometry.Bar> bars = g.bars();
        assertEquals(g.xOf(1), bars.get(0).x(), 1e-9);
        assertEquals(g.xOf(3), bars.get(3).x() + bars.get(3).width(), 1e-9);
        assertEquals(1.5, bars.get(1).fromValue(), 1e-12);
        assertEquals(2.0, bars.get(1).toValue(), 1e-12);
    }

    @Test
    void ticksAreMultiplesOfAOneTwoFiveStepInsideTheAxis() {
        HistogramGeometry g = geometry(new Histogram(4.37, 4.63, new long[] {1, 2, 1}, 0), OptionalDouble.empty());
        // range 0.26 over 5 ticks is 0.052: the next 1-2-5 step is 0.1 (common practice for chart axes)
        List<HistogramGeometry.Tick> ticks = g.ticks();
        assertEquals(List.of("4.4", "4.5", "4.6"), ticks.stream().map(HistogramGeometry.Tick::label).toList());
        ticks.forEach(t -> assertTrue(t.value() >= 4.37 && t.value() <= 4.63));
        assertEquals(0.5, HistogramGeometry.niceStep(0.3), 1e-12);
        assertEquals(2e-3, HistogramGeometry.niceStep(1.1e-3), 1e-15);
        assertEquals(10, HistogramGeometry.niceStep(6), 1e-12);
    }

    @Test
    void aHistogramOfEqualValuesGetsOneBarInTheMiddleOfAWidenedAxis() {
        HistogramGeometry g = geometry(new Histogram(4.5, 4.5, new long[] {0, 0, 10}, 0), OptionalDouble.empty());
        assertTrue(g.axisHigh() > g.axisLow());
        assertEquals(4.5, (g.axisLow() + g.axisHigh()) / 2, 1e-12);
        HistogramGeometry.Bar bar = g.bars().get(2);
        assertEquals(g.xOf(4.5), bar.x() + bar.width() / 2, 1e-9);
        assertEquals(g.baseY() - g.topY(), bar.height(), 1e-9);
    }

    @Test
    void theMarkerIsDrawnOnlyWhenItLiesOnTheAxis() {
        Histogram h = new Histogram(10, 20, new long[] {1, 1}, 0);
        assertEquals(geometry(h, OptionalDouble.of(15)).xOf(15), geometry(h, OptionalDouble.of(15)).markerX().getAsDouble(), 1e-9);
        assertFalse(geometry(h, OptionalDouble.of(3)).markerX().isPresent());
        assertFalse(geometry(h, OptionalDouble.empty()).markerX().isPresent());
    }

    @Test
    void aPointOverABarFindsItsBinAndAPointBesideThePlotFindsNone() {
        HistogramGeometry g = geometry(new Histogram(0, 4, new long[] {1, 5, 2, 0}, 0), OptionalDouble.empty());
        HistogramGeometry.Bar second = g.bars().get(1);
        assertEquals(1, g.binAt(second.x() + second.width() / 2, g.baseY() - 1).getAsInt());
        assertEquals(3, g.binAt(g.bars().get(3).x() + 1, g.baseY() - 5).getAsInt(), "an empty bin's column counts");
        assertFalse(g.binAt(2, g.baseY() - 1).isPresent(), "left of the plot");
        assertFalse(g.binAt(second.x() + 1, H - 2).isPresent(), "under the base line");
    }

    @Test
    void anEmptyHistogramDrawsNoBarsAndDoesNotDivideByZero() {
        HistogramGeometry g = geometry(new Histogram(0, 0, new long[] {0, 0, 0}, 5), OptionalDouble.empty());
        g.bars().forEach(b -> assertEquals(0, b.height()));
        g.ticks().forEach(t -> assertTrue(Double.isFinite(t.x())));
    }
}
