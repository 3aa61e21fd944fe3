package halfrail.convert;

import java.util.OptionalDouble;

/**
 * Optional limits on the converted design.
 *
 * @param maxSettleSeconds settle-up time limit after switch-on, s
 * @param maxSupplyAmps    largest total current from the supply at the nominal voltage, A
 * @param minRuntimeHours  runtime wanted on the supply's capacity, h (a cell supply only)
 * @param priority         which wins when the band and the settle-up limit conflict
 */
public record ConversionLimits(OptionalDouble maxSettleSeconds, OptionalDouble maxSupplyAmps,
                               OptionalDouble minRuntimeHours, LimitPriority priority) {
    public ConversionLimits {
        maxSettleSeconds = check("limits.maxSettleSeconds", maxSettleSeconds, "s");
        maxSupplyAmps = check("limits.maxSupplyAmps", maxSupplyAmps, "A");
        minRuntimeHours = check("limits.minRuntimeHours", minRuntimeHours, "h");
        priority = priority == null ? LimitPriority.BAND : priority;
    }

    /** No limits; the band wins. */
    public static ConversionLimits none() {
        return new ConversionLimits(OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty(),
                LimitPriority.BAND);
    }

    public ConversionLimits withMaxSettleSeconds(double s) {
        return new ConversionLimits(OptionalDouble.of(s), maxSupplyAmps, minRuntimeHours, priority);
    }

    public ConversionLimits withMaxSupplyAmps(double a) {
        return new ConversionLimits(maxSettleSeconds, OptionalDouble.of(a), minRuntimeHours, priority);
    }

    public ConversionLimits withMinRuntimeHours(double h) {
        return new ConversionLimits(maxSettleSeconds, maxSupplyAmps, OptionalDouble.of(h), priority);
    }

    public ConversionLimits withPriority(LimitPriority p) {
        return new ConversionLimits(maxSettleSeconds, maxSupplyAmps, minRuntimeHours, p);
    }

    private static OptionalDouble check(String path, OptionalDouble v, String unit) {
        if (v == null || v.isEmpty()) {
            return OptionalDouble.empty();
        }
        ConversionException.RULES.positive(path, v.getAsDouble(), unit);
        return v;
    }
}
