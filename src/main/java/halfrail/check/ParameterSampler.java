package halfrail.check;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.RealDistribution;
import org.apache.commons.math3.distribution.UniformRealDistribution;
import org.apache.commons.math3.random.RandomGenerator;
import org.apache.commons.math3.random.Well512a;

import java.util.List;

/**
 * Draws the values of one Monte Carlo build. Build i's values come from a Well512a generator
 * seeded from (seed, i) alone, one uniform number per parameter in parameter order, turned into
 * the parameter's value through the inverse distribution function of an Apache Commons Math
 * distribution; so the draw does not depend on which thread runs the build or in what order.
 * Truncated normal: a uniform number is mapped into [Φ(−3), Φ(3)] before the inverse, which
 * samples the normal conditioned on |z| ≤ 3 exactly. Immutable and thread-safe.
 */
final class ParameterSampler {
    /** Where a normal tolerance is cut off, in standard deviations (the tolerance is 3σ). */
    static final double SIGMAS = 3;

    private final RealDistribution[] inverse;
    private final double[] fixed;
    private final boolean[] truncated;
    private final double pLow;
    private final double pHigh;

    ParameterSampler(List<ToleranceParameter> params, MonteCarloOptions.Distribution distribution) {
        int n = params.size();
        inverse = new RealDistribution[n];
        fixed = new double[n];
        truncated = new boolean[n];
        NormalDistribution unit = new NormalDistribution(null, 0, 1);
        pLow = unit.cumulativeProbability(-SIGMAS);
        pHigh = unit.cumulativeProbability(SIGMAS);
        for (int j = 0; j < n; j++) {
            ToleranceParameter p = params.get(j);
            if (!(p.highValue() > p.lowValue())) {
                fixed[j] = p.lowValue();
                continue;
            }
            if (p.distribution() == ToleranceParameter.Spread.SYMMETRIC
                    && distribution == MonteCarloOptions.Distribution.NORMAL_3_SIGMA) {
                double centre = 0.5 * (p.lowValue() + p.highValue());
                inverse[j] = new NormalDistribution(null, centre, p.halfRange() / SIGMAS);
                truncated[j] = true;
            } else {
                inverse[j] = new UniformRealDistribution(null, p.lowValue(), p.highValue());
            }
        }
    }

    /** Write build {@code index}'s values into {@code out}. */
    void sample(long seed, long index, double[] out) {
        RandomGenerator rng = new Well512a(seedFor(seed, index));
        for (int j = 0; j < out.length; j++) {
            double u = rng.nextDouble();
            RealDistribution d = inverse[j];
            if (d == null) {
                out[j] = fixed[j];
            } else if (truncated[j]) {
                out[j] = d.inverseCumulativeProbability(pLow + u * (pHigh - pLow));
            } else {
                out[j] = d.inverseCumulativeProbability(u);
            }
        }
    }

    /** Four seed words from (seed, index) by the SplitMix64 finaliser (Steele, Lea, Flood, OOPSLA 2014). */
    static int[] seedFor(long seed, long index) {
        long a = mix(seed ^ mix(index + 0x9E3779B97F4A7C15L));
        long b = mix(a + 0x9E3779B97F4A7C15L);
        return new int[] {(int) a, (int) (a >>> 32), (int) b, (int) (b >>> 32)};
    }

    private static long mix(long z) {
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }
}
