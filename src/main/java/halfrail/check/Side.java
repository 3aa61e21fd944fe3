package halfrail.check;

/** Which rail a signal meets first. */
public enum Side {
    /** The lower limit (towards ground). */
    LOW,
    /** The upper limit (towards the supply). */
    HIGH
}
