package halfrail.convert;

/** The kinds of change a conversion makes to the dual-rail original. */
public enum ChangeKind {
    /** The ± supply became one rail. */
    SUPPLY_REPLACED,
    /** A mid-rail divider with its decoupling capacitor was added. */
    REFERENCE_ADDED,
    /** The reference was buffered by a follower (a high-impedance divider with bias current to carry). */
    REFERENCE_BUFFERED,
    /** A bias resistor from the reference to a non-inverting input was added. */
    BIAS_RESISTOR_ADDED,
    /** A coupling capacitor was put in front of the first stage. */
    INPUT_CAPACITOR_ADDED,
    /** A blocking capacitor was put in series with R1 of a non-inverting stage. */
    LEG_CAPACITOR_ADDED,
    /** A coupling capacitor was put between the last stage and the load. */
    OUTPUT_CAPACITOR_ADDED,
    /** The op-amp cannot work on the single supply and was replaced by an archetype that can. */
    OP_AMP_REPLACED,
    /** R1 and R2 were scaled together by a power of ten (gain unchanged) to meet a common-practice rule. */
    RESISTORS_SCALED,
    /** A value breaks a common-practice rule and was kept, since changing it would change the circuit's purpose. */
    KEPT_AGAINST_PRACTICE,
    /** Capacitors were enlarged after the engine's analysis showed the chain's corner above the band. */
    CAPACITORS_ENLARGED,
    /** Capacitors were made smaller so that the settle-up limit wins over the band. */
    CAPACITORS_REDUCED_FOR_SETTLE
}
