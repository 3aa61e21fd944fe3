package halfrail.io.report;

import java.util.ArrayList;
import java.util.List;

/**
 * Maps a value range onto a pixel range, linearly or logarithmically, and picks tick values.
 * Plain geometry with no drawing, so it can be tested without a display. For a vertical axis
 * pass the bottom pixel as {@code startPx} and the top as {@code endPx}: values then rise upward.
 */
public final class Axis {
    /** Largest number of ticks an axis ever proposes, whatever is asked. */
    public static final int MAX_TICKS = 50;
    /** Most coarser steps tried when the first step gives too many ticks (each try at least doubles it). */
    static final int MAX_STEP_SEARCH = 64;

    private final double min;
    private final double max;
    private final double startPx;
    private final double endPx;
    private final boolean log;

    private Axis(double min, double max, double startPx, double endPx, boolean log) {
        if (!(Double.isFinite(min) && Double.isFinite(max) && max > min)) {
            throw new IllegalArgumentException("axis range must be finite and rising, got " + min + " to " + max);
        }
        if (log && min <= 0) {
            throw new IllegalArgumentException("a logarithmic axis needs a positive range, got " + min);
        }
        this.min = min;
        this.max = max;
        this.startPx = startPx;
        this.endPx = endPx;
        this.log = log;
    }

    /** A linear axis from {@code min} at {@code startPx} to {@code max} at {@code endPx}. */
    public static Axis linear(double min, double max, double startPx, double endPx) {
        return new Axis(min, max, startPx, endPx, false);
    }

    /** A logarithmic axis (equal ratios take equal lengths); {@code min} must be positive. */
    public static Axis log(double min, double max, double startPx, double endPx) {
        return new Axis(min, max, startPx, endPx, true);
    }

    public double min() {
        return min;
    }

    public double max() {
        return max;
    }

    public boolean isLog() {
        return log;
    }

    /** The pixel coordinate of {@code value} (values outside the range map outside the pixel range). */
    public double toPixel(double value) {
        double f = log ? Math.log(value / min) / Math.log(max / min) : (value - min) / (max - min);
        return startPx + f * (endPx - startPx);
    }

    /** The value at pixel coordinate {@code px}; the inverse of {@link #toPixel}. */
    public double toValue(double px) {
        double f = (px - startPx) / (endPx - startPx);
        return log ? min * Math.pow(max / min, f) : min + f * (max - min);
    }

    /**
     * Tick values inside the range: for a linear axis multiples of 1, 2 or 5 × 10ⁿ, the
     * finest step giving at most {@code maxTicks} ticks; for a logarithmic axis the powers of ten
     * (every other one, or sparser, when there would be more than {@code maxTicks}).
     */
    public List<Double> ticks(int maxTicks) {
        int limit = Math.max(2, Math.min(maxTicks, MAX_TICKS));
        List<Double> out = new ArrayList<>();
        if (log) {
            int lo = (int) Math.ceil(Math.log10(min) - 1e-9);
            int hi = (int) Math.floor(Math.log10(max) + 1e-9);
            int every = Math.max(1, (int) Math.ceil((hi - lo + 1) / (double) limit));
            for (int e = lo; e <= hi; e += every) {
                out.add(Math.pow(10, e));
            }
            return out;
        }
        double step = niceStep((max - min) / limit);
        for (int tries = 0; tries < MAX_STEP_SEARCH
                && (Math.floor(max / step) - Math.ceil(min / step) + 1) > limit; tries++) {
            step = niceStep(step * 1.01);
        }
        for (long k = (long) Math.ceil(min / step - 1e-9); k * step <= max + step * 1e-9 && out.size() < MAX_TICKS;
             k++) {
            double v = k * step;
            out.add(Math.abs(v) < step * 1e-9 ? 0.0 : v);
        }
        return out;
    }

    /** The smallest of 1, 2, 5 × 10ⁿ not below {@code raw}. */
    static double niceStep(double raw) {
        double p = Math.pow(10, Math.floor(Math.log10(raw)));
        for (double m : new double[] {1, 2, 5, 10}) {
            if (m * p >= raw * (1 - 1e-12)) {
                return m * p;
            }
        }
        return 10 * p;
    }
}
