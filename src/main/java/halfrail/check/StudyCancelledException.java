package halfrail.check;

/**
 * A study was stopped through its {@link CancelToken} before it finished. No partial result is
 * returned: which builds had run depends on thread timing, and a result must be reproducible.
 */
public final class StudyCancelledException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    private final long done;
    private final long total;

    public StudyCancelledException(long done, long total) {
        super("cancelled after " + done + " of " + total + " builds");
        this.done = done;
        this.total = total;
    }

    /** Builds finished when the study stopped. */
    public long done() {
        return done;
    }

    /** Builds the study was asked for. */
    public long total() {
        return total;
    }
}
