package halfrail.check;

import halfrail.circuit.Circuit;
import halfrail.circuit.CurrentSource;
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

    /** RMS noise voltage at {@code node} over {@code lowHz}..{@code highHz}, V. */
    static double voltsRms(Circuit circuit, String node, double lowHz, double highHz) {
        Circuit.Builder b = circuit.toBuilder();
        List<String> sources = new ArrayList<>();
        List<Double> conductance = new ArrayList<>();
        for (Element e : circuit.elements()) {
            if (e instanceof Resistor r && isReferenceResistor(r.name())) {
                String name = "INOISE_" + r.name();
                b.add(new CurrentSource(name, r.a(), r.b(), 0));
                sources.add(name);
                conductance.add(1 / r.ohms());
            }
        }
        if (sources.isEmpty()) {
            return 0;
        }
        AcAnalysis ac = AcAnalysis.of(b.build());
        int points = Math.max(2, (int) Math.ceil(Math.log10(highHz / lowHz) * DesignAnalysis.NOISE_POINTS_PER_DECADE) + 1);
        double fourKt = 4 * DesignAnalysis.BOLTZMANN * DesignAnalysis.NOISE_TEMPERATURE_KELVIN;
        double total = 0;
        double prevF = 0;
        double prevDensity = 0;
        for (int k = 0; k < points; k++) {
            double f = lowHz * Math.pow(highHz / lowHz, k / (double) (points - 1));
            double density = 0;
            for (int s = 0; s < sources.size(); s++) {
                double z = ac.response(sources.get(s), node, f).magnitude();
                density += fourKt * conductance.get(s) * z * z;
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
