package halfrail.check;

/**
 * Counts of values in equal bins from {@code lowEdge} to {@code highEdge} (the smallest and
 * largest value counted); the unit is that of the quantity the owner names. A value equal to
 * the high edge falls in the last bin. Immutable: the counts are copied in and out.
 *
 * @param lowEdge   lower edge of the first bin
 * @param highEdge  upper edge of the last bin (equal to lowEdge when every value is the same)
 * @param counts    values per bin
 * @param excluded  values left out because they are not finite (for example −∞ dB headroom: no room at all)
 */
public record Histogram(double lowEdge, double highEdge, long[] counts, long excluded) {
    public Histogram {
        counts = counts.clone();
    }

    @Override
    public long[] counts() {
        return counts.clone();
    }

    /** Width of one bin. */
    public double binWidth() {
        return (highEdge - lowEdge) / counts.length;
    }

    /** Total of the counts (the excluded values not included). */
    public long total() {
        long t = 0;
        for (long c : counts) {
            t += c;
        }
        return t;
    }

    /** Histogram of the finite values among the first {@code n} of {@code values}, selected by {@code use}. */
    static Histogram of(double[] values, boolean[] use, int bins) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        long excluded = 0;
        for (int i = 0; i < values.length; i++) {
            if (!use[i]) {
                continue;
            }
            if (!Double.isFinite(values[i])) {
                excluded++;
                continue;
            }
            lo = Math.min(lo, values[i]);
            hi = Math.max(hi, values[i]);
        }
        long[] counts = new long[bins];
        if (lo > hi) {
            return new Histogram(0, 0, counts, excluded);
        }
        double width = (hi - lo) / bins;
        for (int i = 0; i < values.length; i++) {
            if (!use[i] || !Double.isFinite(values[i])) {
                continue;
            }
            int b = width > 0 ? (int) ((values[i] - lo) / width) : 0;
            counts[Math.min(bins - 1, Math.max(0, b))]++;
        }
        return new Histogram(lo, hi, counts, excluded);
    }
}
