package halfrail.design;

/**
 * A design cannot be turned into a circuit because a value or a choice in it is invalid.
 * {@link #path()} names the part and field in the design's own terms (for example
 * {@code stages[1].legCapacitor.farads}), so the editor and the loader can point at it.
 */
public final class DesignException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    private final String path;

    public DesignException(String path, String message) {
        super(path + ": " + message);
        this.path = path;
    }

    /** Where in the design the problem lies, as a dotted path with list indices. */
    public String path() {
        return path;
    }

    static double positive(String path, double v, String unit) {
        if (!Double.isFinite(v) || v <= 0) {
            throw new DesignException(path, "must be a positive value in " + unit + ", got " + v);
        }
        return v;
    }

    static double nonNegative(String path, double v, String unit) {
        if (!Double.isFinite(v) || v < 0) {
            throw new DesignException(path, "must be zero or a positive value in " + unit + ", got " + v);
        }
        return v;
    }

    static double fraction(String path, double v) {
        if (!Double.isFinite(v) || v < 0 || v > 1) {
            throw new DesignException(path, "must be a fraction between 0 and 1, got " + v);
        }
        return v;
    }

    static <T> T required(String path, T v) {
        if (v == null) {
            throw new DesignException(path, "is required");
        }
        return v;
    }
}
