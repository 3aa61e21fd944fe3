package halfrail.check;

import java.util.OptionalDouble;

/**
 * What a supply sweep covers.
 *
 * @param fromVolts lowest supply of the sweep, V; empty for the supply's own lowest
 *                  ({@link halfrail.design.Supply#lowVolts()}: a battery's end-point, the bottom of a tolerance band)
 * @param toVolts   highest supply of the sweep, V; empty for the supply's own highest (a fresh battery)
 * @param points    number of evenly spaced supply voltages, at least 2, at most {@link #MAX_POINTS}
 */
public record SupplySweepOptions(OptionalDouble fromVolts, OptionalDouble toVolts, int points) {
    /** Points used when none are given. */
    public static final int DEFAULT_POINTS = 100;
    /** Largest number of points a sweep may ask for (the loop limit of the sweep). */
    public static final int MAX_POINTS = 100_000;

    public SupplySweepOptions {
        StudyOptionsException.RULES.required("sweep.fromVolts", fromVolts);
        StudyOptionsException.RULES.required("sweep.toVolts", toVolts);
        if (points < 2) {
            throw new StudyOptionsException("sweep.points", "a sweep needs at least 2 points, got " + points);
        }
        if (points > MAX_POINTS) {
            throw new StudyOptionsException("sweep.points", "must be at most " + MAX_POINTS + ", got " + points);
        }
        fromVolts.ifPresent(v -> StudyOptionsException.RULES.positive("sweep.fromVolts", v, "V"));
        toVolts.ifPresent(v -> StudyOptionsException.RULES.positive("sweep.toVolts", v, "V"));
        if (fromVolts.isPresent() && toVolts.isPresent() && !(toVolts.getAsDouble() > fromVolts.getAsDouble())) {
            throw new StudyOptionsException("sweep.toVolts", "must lie above fromVolts (" + fromVolts.getAsDouble()
                    + " V), got " + toVolts.getAsDouble() + " V");
        }
    }

    /** The supply's whole range in {@value #DEFAULT_POINTS} points. */
    public static SupplySweepOptions defaults() {
        return new SupplySweepOptions(OptionalDouble.empty(), OptionalDouble.empty(), DEFAULT_POINTS);
    }

    /** A copy over {@code from}..{@code to} V. */
    public SupplySweepOptions withRange(double from, double to) {
        return new SupplySweepOptions(OptionalDouble.of(from), OptionalDouble.of(to), points);
    }

    /** A copy with {@code n} points. */
    public SupplySweepOptions withPoints(int n) {
        return new SupplySweepOptions(fromVolts, toVolts, n);
    }
}
