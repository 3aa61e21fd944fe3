package halfrail.bench;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;

/**
 * Generated circuits for the benchmarks: chains of single-supply non-inverting stages, each
 * with input coupling, bias resistor, feedback-leg blocking capacitor, sharing one decoupled
 * mid-rail divider. Invented values, for timing only.
 */
final class BenchCircuits {
    private BenchCircuits() {}

    /** Op-amp used in every generated stage: a representative single-supply part. */
    static final OpAmpParams PART = OpAmpParams.defaults().withSwing(0.02, 1.5).withCommonMode(0, 1.5)
            .withInputErrors(2e-3, 50e-9, 5e-9).withOutputOhms(50).withQuiescent(0.5e-3).withSlewRate(0.5e6);

    /**
     * A chain of {@code stages} stages on a 9 V supply. The reference is stiff (10 kΩ Thevenin, 200 µF)
     * because a soft reference shared through bias resistors closes a low-frequency feedback loop
     * around the chain that can oscillate (seen with 100 kΩ and 20 µF at three stages). With three stages the circuit has
     * about 20 nodes. Time constants span from the 1 µs input filter to the 2 s reference.
     */
    static Circuit chain(int stages) {
        Circuit.Builder b = Circuit.builder().implicitNodes().title(stages + "-stage chain");
        b.add(new halfrail.circuit.VoltageSource("VSUP", "vcc", "0", 9, 0, 1, 1e-3));
        b.resistor("RA", "vcc", "ref", 20e3).resistor("RB", "ref", "0", 20e3);
        b.capacitor("CREF", "ref", "0", 200e-6);
        b.add(new halfrail.circuit.VoltageSource("VSIG", "src", "0", 0, 1, 1e3, 0));
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
