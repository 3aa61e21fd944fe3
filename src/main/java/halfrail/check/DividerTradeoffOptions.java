package halfrail.check;

import halfrail.units.ESeries;

/**
 * Which divider values a battery trade-off tries.
 *
 * @param series          the E-series the values come from (IEC 60063)
 * @param minOhms         smallest value of each divider resistor, Ω
 * @param maxOhms         largest value of each divider resistor, Ω
 * @param transientPoints how many values also get a power-on transient (the smallest, the design's
 *                        own, the largest, then evenly spread), 0 to {@link #MAX_TRANSIENT_POINTS}
 */
public record DividerTradeoffOptions(ESeries series, double minOhms, double maxOhms, int transientPoints) {
    /** Largest number of power-on transients one trade-off runs. */
    public static final int MAX_TRANSIENT_POINTS = 20;
    /** Largest number of divider values one trade-off tries (the loop limit). */
    public static final int MAX_VALUES = 2_000;

    public DividerTradeoffOptions {
        StudyOptionsException.RULES.required("tradeoff.series", series);
        StudyOptionsException.RULES.positive("tradeoff.minOhms", minOhms, "Ω");
        StudyOptionsException.RULES.positive("tradeoff.maxOhms", maxOhms, "Ω");
        if (maxOhms < minOhms) {
            throw new StudyOptionsException("tradeoff.maxOhms", "must be at least minOhms (" + minOhms + " Ω), got "
                    + maxOhms + " Ω");
        }
        if (transientPoints < 0 || transientPoints > MAX_TRANSIENT_POINTS) {
            throw new StudyOptionsException("tradeoff.transientPoints",
                    "must be between 0 and " + MAX_TRANSIENT_POINTS + ", got " + transientPoints);
        }
        int count = series.values(minOhms, maxOhms).size();
        if (count == 0) {
            throw new StudyOptionsException("tradeoff.maxOhms", "no " + series + " value lies between " + minOhms
                    + " Ω and " + maxOhms + " Ω");
        }
        if (count > MAX_VALUES) {
            throw new StudyOptionsException("tradeoff.maxOhms", "the range holds " + count + " values, more than "
                    + MAX_VALUES);
        }
    }

    /** E12 from 1 kΩ to 1 MΩ, three transients. */
    public static DividerTradeoffOptions defaults() {
        return new DividerTradeoffOptions(ESeries.E12, 1e3, 1e6, 3);
    }

    public DividerTradeoffOptions withSeries(ESeries s) {
        return new DividerTradeoffOptions(s, minOhms, maxOhms, transientPoints);
    }

    public DividerTradeoffOptions withRange(double min, double max) {
        return new DividerTradeoffOptions(series, min, max, transientPoints);
    }

    public DividerTradeoffOptions withTransientPoints(int n) {
        return new DividerTradeoffOptions(series, minOhms, maxOhms, n);
    }
}
