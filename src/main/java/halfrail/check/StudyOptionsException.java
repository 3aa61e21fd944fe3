package halfrail.check;

/**
 * The options of a study (a supply sweep, a tolerance model, a Monte Carlo run, a divider
 * trade-off) are invalid. {@link #field()} names the option, for example {@code sweep.points}
 * or {@code tolerance.resistorTolerance}, so a form can point at it.
 */
public final class StudyOptionsException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    private final String field;

    public StudyOptionsException(String field, String message) {
        super(field + ": " + message);
        this.field = field;
    }

    /** The option at fault, as a dotted path. */
    public String field() {
        return field;
    }

    static double finite(String field, double v, String unit) {
        if (!Double.isFinite(v)) {
            throw new StudyOptionsException(field, "must be a finite value in " + unit + ", got " + v);
        }
        return v;
    }

    static double positive(String field, double v, String unit) {
        if (!Double.isFinite(v) || v <= 0) {
            throw new StudyOptionsException(field, "must be a positive value in " + unit + ", got " + v);
        }
        return v;
    }

    static double nonNegative(String field, double v, String unit) {
        if (!Double.isFinite(v) || v < 0) {
            throw new StudyOptionsException(field, "must be zero or a positive value in " + unit + ", got " + v);
        }
        return v;
    }

    /** A tolerance as a fraction: from 0 up to, not including, 1 (100 % would let a value reach zero). */
    static double tolerance(String field, double v) {
        if (!Double.isFinite(v) || v < 0) {
            throw new StudyOptionsException(field, "must be a fraction of zero or more (0.05 is ±5 %), got " + v);
        }
        if (v >= 1) {
            throw new StudyOptionsException(field, "must be below 1 (100 %), got " + v + " (" + 100 * v
                    + " %): at 100 % or more a part's value could reach zero or below");
        }
        return v;
    }

    static int atLeast(String field, int v, int min) {
        if (v < min) {
            throw new StudyOptionsException(field, "must be at least " + min + ", got " + v);
        }
        return v;
    }

    static <T> T required(String field, T v) {
        if (v == null) {
            throw new StudyOptionsException(field, "is required");
        }
        return v;
    }
}
