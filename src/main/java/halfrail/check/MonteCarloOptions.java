package halfrail.check;

/**
 * How a Monte Carlo study runs.
 *
 * @param builds        number of builds, 1 to {@link #MAX_BUILDS}
 * @param seed          the seed; build i draws its values from a generator seeded from (seed, i)
 *                      alone, so the same seed gives the same numbers on any number of threads
 * @param distribution  how a tolerance around a nominal is drawn
 * @param histogramBins bins of every histogram, 1 to {@link #MAX_BINS}
 */
public record MonteCarloOptions(int builds, long seed, Distribution distribution, int histogramBins) {
    /** Builds when none are given. */
    public static final int DEFAULT_BUILDS = 10_000;
    /** Largest number of builds (the loop limit of a study). */
    public static final int MAX_BUILDS = 10_000_000;
    /** Seed when none is given. */
    public static final long DEFAULT_SEED = 20_240_601L;
    /** Histogram bins when none are given. */
    public static final int DEFAULT_BINS = 40;
    /** Largest number of histogram bins. */
    public static final int MAX_BINS = 10_000;

    /**
     * How a symmetric tolerance (resistance, capacitance, offset voltage and current) is drawn;
     * one-sided ranges (bias current, leakage, tempco, temperature) are always uniform.
     */
    public enum Distribution {
        /** Uniform over nominal ± tolerance: every value in the band equally likely (the cautious reading of a tolerance). */
        UNIFORM,
        /**
         * Normal around the nominal with the tolerance as 3σ, truncated at ±3σ (a part outside
         * its tolerance would have been rejected by its maker): common practice for a production
         * lot; the truncated spread has variance 0.9733·σ².
         */
        NORMAL_3_SIGMA
    }

    public MonteCarloOptions {
        if (builds < 1) {
            throw new StudyOptionsException("monteCarlo.builds", "must be at least 1, got " + builds);
        }
        if (builds > MAX_BUILDS) {
            throw new StudyOptionsException("monteCarlo.builds", "must be at most " + MAX_BUILDS + ", got " + builds);
        }
        StudyOptionsException.RULES.required("monteCarlo.distribution", distribution);
        if (histogramBins < 1 || histogramBins > MAX_BINS) {
            throw new StudyOptionsException("monteCarlo.histogramBins",
                    "must be between 1 and " + MAX_BINS + ", got " + histogramBins);
        }
    }

    /** {@value #DEFAULT_BUILDS} builds, the default seed, normal (3σ) tolerances, {@value #DEFAULT_BINS} bins. */
    public static MonteCarloOptions defaults() {
        return new MonteCarloOptions(DEFAULT_BUILDS, DEFAULT_SEED, Distribution.NORMAL_3_SIGMA, DEFAULT_BINS);
    }

    public MonteCarloOptions withBuilds(int n) {
        return new MonteCarloOptions(n, seed, distribution, histogramBins);
    }

    public MonteCarloOptions withSeed(long s) {
        return new MonteCarloOptions(builds, s, distribution, histogramBins);
    }

    public MonteCarloOptions withDistribution(Distribution d) {
        return new MonteCarloOptions(builds, seed, d, histogramBins);
    }

    public MonteCarloOptions withHistogramBins(int bins) {
        return new MonteCarloOptions(builds, seed, distribution, bins);
    }
}
