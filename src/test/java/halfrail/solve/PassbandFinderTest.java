package halfrail.solve;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.util.function.DoubleUnaryOperator;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The peak and corner search on closed-form magnitude curves, apart from any circuit. */
class PassbandFinderTest {
    /** Centre frequency, Hz; deliberately off the search grid. */
    private static final double F0 = 1234.5;

    /** Second-order band-pass: |H| = 1/√(1 + Q²(x − 1/x)²), x = f/f0. */
    private static DoubleUnaryOperator bandPass(double q) {
        return f -> {
            double x = f / F0;
            double d = q * (x - 1 / x);
            return 1 / Math.sqrt(1 + d * d);
        };
    }

    @ParameterizedTest(name = "Q = {0}")
    @ValueSource(doubles = {0.5, 2, 10, 40})
    @DisplayName("second-order band-pass: peak at f0, corners at f0·(√(1 + 1/4Q²) ∓ 1/2Q), bandwidth f0/Q (any circuits text, resonance of a series RLC)")
    void bandPassPeakAndCornersMatchTheClosedForm(double q) {
        AcPassband band = new PassbandFinder(bandPass(q)).find(1, 1e6);
        // the peak's place is found to about 1e-6 decades, so its height to second order in that
        assertEquals(1, band.peakMagnitude(), 1e-10);
        assertEquals(F0, band.peakHz(), 1e-6 * F0);
        double root = Math.sqrt(1 + 1 / (4 * q * q));
        double lower = F0 * (root - 1 / (2 * q));
        double upper = F0 * (root + 1 / (2 * q));
        assertEquals(lower, band.lowerCornerHz().orElseThrow(), 1e-9 * lower);
        assertEquals(upper, band.upperCornerHz().orElseThrow(), 1e-9 * upper);
        assertEquals(F0 / q, band.upperCornerHz().getAsDouble() - band.lowerCornerHz().getAsDouble(), 1e-8 * F0);
    }

    @Test
    @DisplayName("a first-order high-pass peaks at the top of the range and a low-pass at the bottom, exactly, "
            + "with one evaluation beyond the grid (|H| = 1/√(1 + (fc/f)²) and 1/√(1 + (f/fc)²), any circuits text)")
    void monotoneResponsesPeakAtTheEndOfTheRange() {
        double fc = 100;
        int[] calls = {0};
        AcPassband high = new PassbandFinder(f -> {
            calls[0]++;
            return 1 / Math.sqrt(1 + (fc / f) * (fc / f));
        }).find(20, 20e3, false, false);
        assertEquals(20e3, high.peakHz(), 1e-9 * 20e3);
        assertEquals(1 / Math.sqrt(1 + (fc / 20e3) * (fc / 20e3)), high.peakMagnitude(), 1e-15);
        // the grid: ceil(3 decades · 20 per decade) + 1 points, then one probe just inside the end
        int grid = (int) Math.ceil(3 * AcAnalysis.GRID_POINTS_PER_DECADE) + 1;
        assertEquals(grid + 1, calls[0]);
        AcPassband low = new PassbandFinder(f -> 1 / Math.sqrt(1 + (f / fc) * (f / fc))).find(20, 20e3, false, false);
        assertEquals(20, low.peakHz(), 1e-9 * 20);
        assertEquals(1 / Math.sqrt(1 + (20 / fc) * (20 / fc)), low.peakMagnitude(), 1e-15);
    }

    @Test
    void aFlatResponseHasNoCorners() {
        AcPassband band = new PassbandFinder(f -> 2.5).find(10, 1e5);
        assertEquals(2.5, band.peakMagnitude());
        assertTrue(band.lowerCornerHz().isEmpty());
        assertTrue(band.upperCornerHz().isEmpty());
    }

    @Test
    void aZeroResponseHasNoCorners() {
        AcPassband band = new PassbandFinder(f -> 0).find(10, 1e5);
        assertEquals(Double.NEGATIVE_INFINITY, band.peakDb());
        assertTrue(band.lowerCornerHz().isEmpty());
        assertTrue(band.upperCornerHz().isEmpty());
    }

    @Test
    void reachingTheCornerEvaluationLimitEndsInNoConvergence() {
        PassbandFinder finder = new PassbandFinder(bandPass(2), AcAnalysis.MAX_PEAK_EVALUATIONS, 3);
        AnalysisException e = assertThrows(AnalysisException.class, () -> finder.find(1, 1e6));
        assertEquals(AnalysisException.Kind.NO_CONVERGENCE, e.kind());
    }

    @Test
    void reachingThePeakEvaluationLimitEndsInNoConvergence() {
        PassbandFinder finder = new PassbandFinder(bandPass(2), 2, AcAnalysis.MAX_CORNER_EVALUATIONS);
        AnalysisException e = assertThrows(AnalysisException.class, () -> finder.find(1, 1e6));
        assertEquals(AnalysisException.Kind.NO_CONVERGENCE, e.kind());
    }
}
