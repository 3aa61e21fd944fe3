package halfrail.check;

import halfrail.circuit.Circuit;
import halfrail.circuit.Element;
import halfrail.circuit.Resistor;
import halfrail.solve.AcAnalysis;

import java.util.ArrayList;
import java.util.List;

/**
 * Thermal noise of a design's reference network at one node, integrated over a band: every
 * reference resistor R (RA, RB, RISO, RBIASi) contributes a noise current of density
 * √(4kT/R) across itself (Johnson 1928, Nyquist 1928), carried to the node by the circuit's own
 * transimpedance; the densities add in power and are integrated by the trapezoidal rule on a
 * logarithmic grid of {@link DesignAnalysis#NOISE_POINTS_PER_DECADE} points per decade, at
 * {@link DesignAnalysis#NOISE_TEMPERATURE_KELVIN}. The same method as the design report's
 * reference-noise figure, so the two agree.
 */
final class ReferenceNoise {
    private ReferenceNoise() {}

    static boolean isReferenceResistor(String name) {
        return name.equals("RA") || name.equals("RB") || name.equals("RISO") || name.startsWith("RBIAS");
    }

    /** RMS noise voltage at {@code node} over {@code lowHz}..{@code highHz}, V, on a fresh small-signal analysis of {@code circuit}. */
    static double voltsRms(Circuit circuit, String node, double lowHz, double highHz) {
        return voltsRms(AcAnalysis.of(circuit), node, lowHz, highHz);
    }

    /**
     * RMS noise voltage at {@code node} over {@code lowHz}..{@code highHz}, V, from the analysis
     * {@code ac} already made: each resistor's noise current reaches the node through the
     * transimpedance between its ends ({@link AcAnalysis#transimpedance}), all of which one
     * transposed solve per frequency gives.
     */
    static double voltsRms(AcAnalysis ac, String node, double lowHz, double highHz) {
        List<Resistor> resistors = new ArrayList<>();
        for (Element e : ac.operatingPoint().system().circuit().elements()) {
            if (e instanceof Resistor r && isReferenceResistor(r.name())) {
                resistors.add(r);
            }
        }
        if (resistors.isEmpty()) {
            return 0;
        }
        int points = Math.max(2, (int) Math.ceil(Math.log10(highHz / lowHz) * DesignAnalysis.NOISE_POINTS_PER_DECADE) + 1);
        double fourKt = 4 * DesignAnalysis.BOLTZMANN * DesignAnalysis.NOISE_TEMPERATURE_KELVIN;
        double total = 0;
        double prevF = 0;
        double prevDensity = 0;
        for (int k = 0; k < points; k++) {
            double f = lowHz * Math.pow(highHz / lowHz, k / (double) (points - 1));
            double density = 0;
            for (Resistor r : resistors) {
                double z = ac.transimpedance(r.a(), r.b(), node, f).magnitude();
                density += fourKt / r.ohms() * z * z;
            }
            if (k > 0) {
                total += 0.5 * (density + prevDensity) * (f - prevF);
            }
            prevF = f;
            prevDensity = density;
        }
        return Math.sqrt(total);
    }
}
