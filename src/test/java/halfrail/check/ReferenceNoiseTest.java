package halfrail.check;

import halfrail.circuit.Circuit;
import halfrail.circuit.VoltageSource;
import halfrail.solve.AcAnalysis;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The reference network's thermal noise against the closed form for a resistance R = Ra‖Rb
 * shunted by C: density 4kTR/(1 + (f/fc)²), fc = 1/(2πRC), so the band from f1 to f2 holds
 * v² = (2kT/(πC))·(atan(f2/fc) − atan(f1/fc)); over all frequencies that is kT/C (Johnson 1928,
 * Nyquist 1928; the kT/C result as in Horowitz and Hill, The Art of Electronics — from memory).
 */
class ReferenceNoiseTest {
    static final double RA = 100e3;
    static final double RB = 47e3;
    static final double C = 10e-6;

    static Circuit divider() {
        return Circuit.builder().nodes("vcc", "ref")
                .add(new VoltageSource("VSUP", "vcc", "0", 9))
                .resistor("RA", "vcc", "ref", RA)
                .resistor("RB", "ref", "0", RB)
                .capacitor("CREF", "ref", "0", C)
                .build();
    }

    static double closedForm(double f1, double f2) {
        double r = RA * RB / (RA + RB);
        double fc = 1 / (2 * Math.PI * r * C);
        double kt = DesignAnalysis.BOLTZMANN * DesignAnalysis.NOISE_TEMPERATURE_KELVIN;
        return Math.sqrt(2 * kt / (Math.PI * C) * (Math.atan(f2 / fc) - Math.atan(f1 / fc)));
    }

    @Test
    @DisplayName("the divider's noise at the decoupled mid point over 20 Hz–20 kHz and 0.01 Hz–1 MHz matches "
            + "(2kT/πC)·(atan(f2/fc) − atan(f1/fc)) within the trapezoid rule's 0.5 %")
    void dividerNoiseMatchesTheClosedForm() {
        AcAnalysis ac = AcAnalysis.of(divider());
        for (double[] band : new double[][] {{20, 20e3}, {0.01, 1e6}, {0.05, 1}}) {
            double expected = closedForm(band[0], band[1]);
            assertEquals(expected, ReferenceNoise.voltsRms(ac, "ref", band[0], band[1]), 0.005 * expected,
                    band[0] + "–" + band[1] + " Hz");
        }
        // over (nearly) every frequency: √(kT/C), 20 nV for 10 µF at 300 K
        double kt = DesignAnalysis.BOLTZMANN * DesignAnalysis.NOISE_TEMPERATURE_KELVIN;
        assertEquals(Math.sqrt(kt / C), ReferenceNoise.voltsRms(ac, "ref", 1e-6, 1e6), 0.01 * Math.sqrt(kt / C));
        // the circuit-only form (a fresh analysis) gives the same figure
        assertEquals(ReferenceNoise.voltsRms(ac, "ref", 20, 20e3), ReferenceNoise.voltsRms(divider(), "ref", 20, 20e3),
                1e-12);
    }
}
