package halfrail.solve;

import java.util.Optional;

/**
 * Watches the accepted points of a power-on run for a sustained oscillation: a watched node that
 * keeps swinging across its final value, out of the settle band on both sides, with swings that
 * do not die away.
 *
 * <p>Each watched node is on the high side (more than the band above its final value), on the low
 * side (more than the band below), or in between. A change from one side to the other is a
 * crossing; the stretch between two crossings is a half-cycle, and its excursion is the largest
 * distance from the final value reached in it. An oscillation is recognised once
 * {@link #HALF_CYCLES} half-cycles in a row, all begun after the last source ramp, each reach at
 * least {@link #KEPT_FRACTION} of the excursion of the half-cycle two before (the same side), and
 * the full periods among them agree within {@link #PERIOD_SPREAD}. A ringing that decays — as
 * every stable circuit's does — shrinks by more than that from one swing to the next unless its
 * damping is tiny (a quality factor above about 150: a fall of 2 % per period is e^(−π/Q)), and
 * such a ring would not settle within a useful time either. The band hysteresis keeps noise near
 * the final value from counting as crossings. Allocation-free per point.
 */
final class OscillationWatch {
    /** Half-cycles in a row that must keep their swing: three full periods (a choice of this tool). */
    static final int HALF_CYCLES = 6;
    /** Least ratio of a half-cycle's excursion to that of the half-cycle two before. */
    static final double KEPT_FRACTION = 0.98;
    /** Largest relative spread of the full periods (longest − shortest) / shortest. */
    static final double PERIOD_SPREAD = 0.25;

    private final int[] indices;
    private final String[] names;
    private final double[] finals;
    private final double band;
    private final double notBefore;
    /** Per node: −1, 0 or +1; the side it is on (0 before it first leaves the band). */
    private final int[] side;
    /** Per node: largest |x − final| in the current half-cycle. */
    private final double[] peak;
    /** Per node: ring of the last HALF_CYCLES + 2 closed excursions and crossing times. */
    private final double[][] excursions;
    private final double[][] crossings;
    /** Per node: closed half-cycles in a row that count (begun after notBefore, swing kept). */
    private final int[] run;
    /** Per node: crossings recorded (the ring's write position is count % length). */
    private final int[] count;
    private PowerOnResult.Oscillation found;

    /**
     * @param indices   unknown indices of the watched nodes (−1, ground, is skipped)
     * @param names     their names, for the report
     * @param finals    the final (DC operating point) solution
     * @param bandVolts the settle band's half-width, V
     * @param notBefore half-cycles begun before this time (the last source ramp's end), s, do not count
     */
    OscillationWatch(int[] indices, String[] names, double[] finals, double bandVolts, double notBefore) {
        this.indices = indices.clone();
        this.names = names.clone();
        this.finals = finals;
        this.band = bandVolts;
        this.notBefore = notBefore;
        int m = indices.length;
        side = new int[m];
        peak = new double[m];
        excursions = new double[m][HALF_CYCLES + 2];
        crossings = new double[m][HALF_CYCLES + 2];
        run = new int[m];
        count = new int[m];
    }

    /**
     * Take one accepted point.
     *
     * @return whether an oscillation has been recognised (at this point or before)
     */
    boolean accept(double t, double[] x) {
        if (found != null) {
            return true;
        }
        for (int j = 0; j < indices.length; j++) {
            int idx = indices[j];
            if (idx < 0) {
                continue;
            }
            double d = x[idx] - finals[idx];
            int s = d > band ? 1 : d < -band ? -1 : 0;
            if (s == 0) {
                continue;
            }
            double a = Math.abs(d);
            if (side[j] == 0) {
                side[j] = s;
                peak[j] = a;
            } else if (s == side[j]) {
                peak[j] = Math.max(peak[j], a);
            } else {
                cross(j, t);
                side[j] = s;
                peak[j] = a;
                if (found != null) {
                    return true;
                }
            }
        }
        return false;
    }

    /** The oscillation recognised, if any. */
    Optional<PowerOnResult.Oscillation> found() {
        return Optional.ofNullable(found);
    }

    /** Node j crossed to the other side at t: close the half-cycle that ended. */
    private void cross(int j, double t) {
        int len = HALF_CYCLES + 2;
        int c = count[j];
        double[] ex = excursions[j];
        double[] ct = crossings[j];
        // The half-cycle that just closed began at the previous crossing; the stretch before the
        // first crossing is the approach, not a half-cycle.
        boolean closes = c > 0;
        double began = closes ? ct[(c - 1) % len] : Double.NaN;
        ex[c % len] = peak[j];
        ct[c % len] = t;
        count[j] = c + 1;
        if (!closes) {
            return;
        }
        if (!(began >= notBefore)) {
            run[j] = 0;
            return;
        }
        // Compare with the half-cycle two before (same side), when it also counted.
        if (run[j] >= 2) {
            double earlier = ex[(c - 2) % len];
            run[j] = peak[j] >= KEPT_FRACTION * earlier ? run[j] + 1 : 2;
        } else {
            run[j]++;
        }
        if (run[j] < HALF_CYCLES) {
            return;
        }
        // The last HALF_CYCLES half-cycles end at crossings c−HALF_CYCLES+1 … c; full periods span
        // two of them.
        double shortest = Double.POSITIVE_INFINITY;
        double longest = 0;
        for (int k = c; k - 2 >= c - HALF_CYCLES; k--) {
            double p = ct[k % len] - ct[(k - 2) % len];
            shortest = Math.min(shortest, p);
            longest = Math.max(longest, p);
        }
        if (!(shortest > 0) || (longest - shortest) > PERIOD_SPREAD * shortest) {
            return;
        }
        double first = ct[(c - HALF_CYCLES) % len];
        double period = (t - first) / (HALF_CYCLES / 2.0);
        double peakToPeak = ex[c % len] + ex[(c - 1) % len];
        found = new PowerOnResult.Oscillation(names[j], period, peakToPeak, first, t);
    }
}
