package halfrail.parts;

/** Which leakage a capacitor model should carry. */
public enum LeakageLevel {
    /** An ideal capacitor: no leakage. */
    NONE,
    /** A typical part at room temperature: the technology's stated fraction of the limit. */
    TYPICAL,
    /** The worst a conforming part may show: the limit of the technology's standard. */
    LIMIT
}
