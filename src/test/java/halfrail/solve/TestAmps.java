package halfrail.solve;

import halfrail.circuit.OpAmpParams;

/** Op-amp parameter sets shared by the solver tests. */
final class TestAmps {
    /**
     * Open-loop gain high enough that the ideal-op-amp formulas hold to better than 1 µV at the
     * voltages used here (closed-loop error about Vout·(noise gain)/A).
     */
    static final double NEAR_IDEAL_GAIN = 1e8;
    /** Output headroom of a classic bipolar part, V (The Art of Electronics, 3rd ed., ch. 4 — from memory: 1–2 V). */
    static final double BIPOLAR_HEADROOM = 1.5;

    private TestAmps() {}

    /** A near-ideal amplifier: huge gain, outputs and inputs reaching both rails, no errors. */
    static OpAmpParams ideal() {
        return OpAmpParams.defaults().withOpenLoopGain(NEAR_IDEAL_GAIN);
    }

    /** A near-ideal amplifier with the classic bipolar part's 1.5 V output headroom on each side. */
    static OpAmpParams bipolarSwing() {
        return ideal().withSwing(BIPOLAR_HEADROOM, BIPOLAR_HEADROOM).withCommonMode(2, 2);
    }

    /** The netlist defaults (gain 1e5) with the classic bipolar headroom: a realistic finite-gain part. */
    static OpAmpParams bipolarFiniteGain() {
        return OpAmpParams.defaults().withSwing(BIPOLAR_HEADROOM, BIPOLAR_HEADROOM).withCommonMode(2, 2)
                .withInputErrors(1e-3, 80e-9, 20e-9).withQuiescent(1.5e-3);
    }
}
