package halfrail.convert;

/**
 * A conversion request is invalid. {@link #path()} names the field in the request's own terms
 * (for example {@code original.stages[0].r2Ohms}), so a reader or a dialog can point at it.
 */
public final class ConversionException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    private final String path;

    public ConversionException(String path, String message) {
        super(path + ": " + message);
        this.path = path;
    }

    /** Where in the request the problem lies, as a dotted path with list indices. */
    public String path() {
        return path;
    }

    static double positive(String path, double v, String unit) {
        if (!Double.isFinite(v) || v <= 0) {
            throw new ConversionException(path, "must be a positive value in " + unit + ", got " + v);
        }
        return v;
    }

    static double nonNegative(String path, double v, String unit) {
        if (!Double.isFinite(v) || v < 0) {
            throw new ConversionException(path, "must be zero or a positive value in " + unit + ", got " + v);
        }
        return v;
    }

    static <T> T required(String path, T v) {
        if (v == null) {
            throw new ConversionException(path, "is required");
        }
        return v;
    }
}
