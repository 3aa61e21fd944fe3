package halfrail.check;

/** How serious a finding is, most serious first. */
public enum Severity {
    /** The design will not work as intended (a stage on a rail, clipping at the nominal signal, a reversed electrolytic). */
    FAIL,
    /** The design works but with too little margin, or against common practice. */
    WARN,
    /** Worth knowing; no action needed. */
    NOTE;

    /** Whether this severity is at least as serious as {@code other}. */
    public boolean atLeast(Severity other) {
        return ordinal() <= other.ordinal();
    }
}
