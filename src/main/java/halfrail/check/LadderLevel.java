package halfrail.check;

/** The levels drawn on a voltage ladder; a finding may point at one of them. */
public enum LadderLevel {
    GROUND,
    SUPPLY,
    END_POINT_SUPPLY,
    SWING_LOW,
    SWING_HIGH,
    COMMON_MODE_LOW,
    COMMON_MODE_HIGH,
    MID_RAIL,
    QUIESCENT,
    SIGNAL_ENVELOPE,
    TOLERANCE_SPREAD,
    LEAKAGE_SHIFT
}
