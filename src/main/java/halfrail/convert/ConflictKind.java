package halfrail.convert;

/** The kinds of limit conflict a conversion can meet. */
public enum ConflictKind {
    /** The band's low end wants large R·C, the settle-up limit small. */
    CORNER_VERSUS_SETTLE,
    /** A current (or runtime) limit wants a high-impedance divider; the op-amps' bias current through it shifts the bias. */
    CURRENT_VERSUS_BIAS_SHIFT,
    /** The op-amps alone draw more than the current (or runtime) limit allows. */
    CURRENT_LIMIT_UNREACHABLE,
    /** No op-amp archetype fits the new supply with the nominal signal; the best one still clips or is out of range. */
    NO_FITTING_OP_AMP,
    /** The chain's corner could not be brought into the band with the capacitors the rules allow. */
    CORNER_NOT_MET
}
