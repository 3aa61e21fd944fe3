package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;

/** Circuits that stress the operating-point search, shared by the convergence tests. */
final class StageCircuits {
    static final double VS = 9;

    private StageCircuits() {}

    /** 9 V battery and a decoupled 100 kΩ/100 kΩ divider to node {@code mid}. */
    static Circuit.Builder supplyAndMid() {
        return Circuit.builder().nodes("vcc", "mid")
                .voltageSource("VBAT", "vcc", "0", VS)
                .resistor("RA", "vcc", "mid", 100e3)
                .resistor("RB", "mid", "0", 100e3)
                .capacitor("CREF", "mid", "0", 10e-6);
    }

    /**
     * {@code stages} inverting stages referenced to mid-rail, each with gain {@code gain}
     * (Rin 10 kΩ, Rf = gain·10 kΩ), fed from a source {@code inputOffset} volts above mid-rail.
     * Output of stage k is node {@code o<k>}, starting at 1.
     */
    static Circuit invertingCascade(int stages, double[] gains, double inputOffset, OpAmpParams p) {
        Circuit.Builder b = supplyAndMid().node("in")
                .voltageSource("VIN", "in", "0", VS / 2 + inputOffset);
        String prev = "in";
        for (int k = 1; k <= stages; k++) {
            String m = "m" + k;
            String o = "o" + k;
            b.nodes(m, o)
                    .resistor("RIN" + k, prev, m, 10e3)
                    .resistor("RF" + k, o, m, 10e3 * gains[(k - 1) % gains.length])
                    .opAmp("U" + k, "mid", m, "vcc", "0", o, p);
            prev = o;
        }
        return b.build();
    }

    /**
     * Non-inverting Schmitt trigger: − input at mid-rail, + input fed from {@code in} through
     * R1 and from the output through R2 (positive feedback). Thresholds mid ∓ (R1/R2)·(swing window edges − mid).
     */
    static Circuit schmitt(double vin, double r1, double r2, OpAmpParams p) {
        return supplyAndMid().nodes("in", "inp", "out")
                .voltageSource("VIN", "in", "0", vin)
                .resistor("R1", "in", "inp", r1)
                .resistor("R2", "out", "inp", r2)
                .opAmp("U1", "inp", "mid", "vcc", "0", "out", p)
                .build();
    }
}
