package halfrail.design;

/** The kinds of single-supply stage Halfrail builds. */
public enum StageKind {
    /**
     * Non-inverting: signal into +, biased from the reference; R2 from the output to −, R1 from −
     * to ground through the blocking capacitor in the feedback leg (signal gain 1 + R2/R1, bias gain 1).
     */
    NON_INVERTING,
    /** Inverting: signal through R1 into −, R2 from the output to −; + held at the reference. */
    INVERTING,
    /** Unity follower: signal into +, biased from the reference; output tied to −. */
    FOLLOWER
}
