package halfrail.convert;

/** Which requirement wins when the band's low end and the settle-up limit cannot both be met. */
public enum LimitPriority {
    /** The band's low end wins (the default): the circuit passes what it is for, and starts up slower. */
    BAND,
    /** The settle-up limit wins: the circuit starts fast enough, and the lowest frequencies are cut. */
    SETTLE
}
