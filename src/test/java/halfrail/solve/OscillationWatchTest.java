package halfrail.solve;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import java.util.Optional;
import java.util.function.DoubleUnaryOperator;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The recogniser of sustained oscillations, on waveforms with known shape. */
class OscillationWatchTest {
    static final double BAND = 0.01;
    static final double FINAL = 1.5;

    /** Feed v(t) sampled every dt up to stop, one watched node at index 0; the recognition, if any. */
    static Optional<PowerOnResult.Oscillation> watch(DoubleUnaryOperator v, double dt, double stop, double notBefore) {
        OscillationWatch w = new OscillationWatch(new int[] {0}, new String[] {"out"}, new double[] {FINAL}, BAND,
                notBefore);
        double[] x = new double[1];
        for (double t = 0; t <= stop; t += dt) {
            x[0] = v.applyAsDouble(t);
            if (w.accept(t, x)) {
                break;
            }
        }
        return w.found();
    }

    @Test
    @DisplayName("a steady sine of 1 V amplitude and 2 ms period is recognised with its period and 2 V peak to peak")
    void steadySine() {
        double period = 2e-3;
        PowerOnResult.Oscillation o = watch(t -> FINAL + Math.sin(2 * Math.PI * t / period), 1e-6, 1, 0).orElseThrow();
        assertEquals(period, o.periodSeconds(), period * 1e-3);
        assertEquals(2.0, o.peakToPeakVolts(), 1e-6);
        assertEquals(500, o.frequencyHz(), 0.5);
        assertEquals("out", o.node());
        // recognised after the approach and HALF_CYCLES half-cycles: about (1/2 + 3) periods in
        assertEquals(3.5 * period, o.seenAtSeconds(), 0.05 * period);
    }

    @Test
    @DisplayName("a square wave (rail-to-rail relaxation) is recognised")
    void squareWave() {
        double period = 1.3;
        PowerOnResult.Oscillation o = watch(t -> FINAL + ((int) (t / (period / 2)) % 2 == 0 ? 1.48 : -1.48), 1e-3, 20,
                0).orElseThrow();
        assertEquals(period, o.periodSeconds(), 2e-3);
        assertEquals(2.96, o.peakToPeakVolts(), 1e-9);
    }

    @ParameterizedTest(name = "Q = {0}: sustained {1}")
    @CsvSource({"10, false", "100, false", "200, true", "1000, true"})
    @DisplayName("a decaying ring counts as sustained only when it keeps at least 98 % per period: e^(−π/Q) ≥ 0.98, "
            + "Q above about 155 (envelope of a second-order ring, any circuits text)")
    void decayingRings(double q, boolean sustained) {
        double period = 1e-3;
        assertEquals(sustained, watch(t -> FINAL + Math.exp(-Math.PI * t / (q * period))
                * Math.sin(2 * Math.PI * t / period), 1e-6, 0.2, 0).isPresent());
    }

    @Test
    @DisplayName("a growing oscillation is recognised")
    void growing() {
        double period = 1e-3;
        assertTrue(watch(t -> FINAL + 0.05 * Math.exp(t / (5 * period)) * Math.sin(2 * Math.PI * t / period),
                1e-6, 0.02, 0).isPresent());
    }

    @Test
    @DisplayName("wobbles inside the settle band never count, and a slow exponential approach has no crossings")
    void insideBandAndMonotoneAreNot() {
        assertTrue(watch(t -> FINAL + 0.9 * BAND * Math.sin(2 * Math.PI * t / 1e-3), 1e-6, 0.1, 0).isEmpty());
        assertTrue(watch(t -> FINAL - 1.5 * Math.exp(-t / 0.3), 1e-4, 10, 0).isEmpty());
    }

    @Test
    @DisplayName("half-cycles begun before the last ramp do not count")
    void beforeTheLastRampDoesNotCount() {
        double period = 2e-3;
        DoubleUnaryOperator sine = t -> FINAL + Math.sin(2 * Math.PI * t / period);
        PowerOnResult.Oscillation o = watch(sine, 1e-6, 1, 10 * period).orElseThrow();
        assertTrue(o.fromSeconds() >= 10 * period, "from " + o.fromSeconds());
        assertFalse(watch(sine, 1e-6, 12 * period, 10 * period).isPresent());
    }

    @Test
    @DisplayName("periods that wander by more than a quarter are not taken as one oscillation")
    void irregularCrossingsAreNot() {
        // half-periods alternating 1 ms and 3 ms: full periods all 4 ms, so regular …
        DoubleUnaryOperator regular = t -> FINAL + ((t % 4e-3) < 1e-3 ? 1 : -1);
        assertTrue(watch(regular, 1e-6, 0.1, 0).isPresent());
        // … but full periods growing by half each cycle are not
        DoubleUnaryOperator chirp = t -> FINAL + Math.sin(2 * Math.PI * Math.log1p(t / 1e-3) / Math.log(1.5));
        assertTrue(watch(chirp, 1e-6, 0.5, 0).isEmpty());
    }
}
