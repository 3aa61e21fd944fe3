package halfrail.units;

/**
 * The range rules a field of a design, a request or a study's options must meet, with one
 * wording for all of them. Each layer keeps its own typed exception (naming the field by its
 * path) and makes its rules with it: {@code new FieldRules(DesignException::new)}.
 */
public final class FieldRules {
    /** Makes the layer's exception for a field path and a message. */
    @FunctionalInterface
    public interface Failure {
        RuntimeException at(String path, String message);
    }

    private final Failure failure;

    public FieldRules(Failure failure) {
        if (failure == null) {
            throw new IllegalArgumentException("failure is required");
        }
        this.failure = failure;
    }

    private RuntimeException fail(String path, String message) {
        return failure.at(path, message);
    }

    /** A finite value (any sign). */
    public double finite(String path, double v, String unit) {
        if (!Double.isFinite(v)) {
            throw fail(path, "must be a finite value in " + unit + ", got " + v);
        }
        return v;
    }

    /** A finite value above zero. */
    public double positive(String path, double v, String unit) {
        if (!Double.isFinite(v) || v <= 0) {
            throw fail(path, "must be a positive value in " + unit + ", got " + v);
        }
        return v;
    }

    /** A finite value of zero or more. */
    public double nonNegative(String path, double v, String unit) {
        if (!Double.isFinite(v) || v < 0) {
            throw fail(path, "must be zero or a positive value in " + unit + ", got " + v);
        }
        return v;
    }

    /** A fraction from 0 to 1, both included. */
    public double fraction(String path, double v) {
        if (!Double.isFinite(v) || v < 0 || v > 1) {
            throw fail(path, "must be a fraction between 0 and 1, got " + v);
        }
        return v;
    }

    /** A tolerance as a fraction: from 0 up to, not including, 1 (100 % would let a value reach zero). */
    public double tolerance(String path, double v) {
        if (!Double.isFinite(v) || v < 0) {
            throw fail(path, "must be a fraction of zero or more (0.05 is ±5 %), got " + v);
        }
        if (v >= 1) {
            throw fail(path, "must be below 1 (100 %), got " + v + " (" + 100 * v
                    + " %): at 100 % or more a part's value could reach zero or below");
        }
        return v;
    }

    /** A count of at least {@code min}. */
    public int atLeast(String path, int v, int min) {
        if (v < min) {
            throw fail(path, "must be at least " + min + ", got " + v);
        }
        return v;
    }

    /** A value that must be given. */
    public <T> T required(String path, T v) {
        if (v == null) {
            throw fail(path, "is required");
        }
        return v;
    }
}
