package halfrail.solve;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.VoltageSource;

/**
 * Generated chains of single-supply non-inverting stages (gain 11, AC-coupled input, bias from a
 * decoupled mid-rail divider, blocking capacitor in the feedback leg), for the solver tests on
 * larger systems. Invented values.
 */
final class OpAmpChains {
    private OpAmpChains() {}

    static final OpAmpParams PART = OpAmpParams.defaults().withSwing(0.02, 1.5).withCommonMode(0, 1.5)
            .withInputErrors(2e-3, 50e-9, 5e-9).withOutputOhms(50).withQuiescent(0.5e-3).withSlewRate(0.5e6);

    /** {@code stages} stages on a 9 V supply sharing one reference; about 6 unknowns per stage. */
    static Circuit chain(int stages) {
        Circuit.Builder b = Circuit.builder().implicitNodes().title(stages + "-stage chain");
        b.add(new VoltageSource("VSUP", "vcc", "0", 9, 0, 1, 1e-3));
        b.resistor("RA", "vcc", "ref", 20e3).resistor("RB", "ref", "0", 20e3);
        b.capacitor("CREF", "ref", "0", 200e-6);
        b.add(new VoltageSource("VSIG", "src", "0", 0, 1, 1e3, 0));
        b.resistor("RF", "src", "flt", 100).capacitor("CF", "flt", "0", 10e-9);
        String prev = "flt";
        for (int i = 1; i <= stages; i++) {
            String p = "s" + i + "p";
            String n = "s" + i + "n";
            String leg = "s" + i + "leg";
            String out = "s" + i + "out";
            b.add(new Capacitor("CIN" + i, p, prev, 1e-6, 0.1, "polyester-film", 50, false, 1e-11));
            b.resistor("RBIAS" + i, "ref", p, 100e3);
            b.resistor("R2_" + i, out, n, 47e3);
            b.resistor("R1_" + i, n, leg, 4.7e3);
            b.add(new Capacitor("CLEG" + i, leg, "0", 22e-6, 0.1, "tantalum", 16, true, 1e-10));
            b.opAmp("U" + i, p, n, "vcc", "0", out, PART);
            prev = out;
        }
        b.add(new Capacitor("COUT", prev, "load", 10e-6, 0.2, "aluminium-electrolytic", 25, true, 1e-9));
        b.resistor("RL", "load", "0", 10e3);
        return b.build();
    }
}
