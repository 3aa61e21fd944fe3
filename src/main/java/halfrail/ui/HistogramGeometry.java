package halfrail.ui;

import halfrail.check.Histogram;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/**
 * Where a histogram's bars, value ticks and marker line go in a box of a given size, and which
 * bar a point falls on. Plain geometry (pixels from the top-left corner), no toolkit: the
 * {@link HistogramCanvas} only paints what this class computes.
 *
 * <p>The value axis runs from the histogram's low edge to its high edge. When every value was
 * the same (the two edges equal) the axis is widened to {@link #FLAT_HALF_WIDTH_FRACTION} of the
 * value on each side (at least {@link #FLAT_HALF_WIDTH_MIN}) and the single bar sits in the middle.
 * A marker (a limit, a nominal value) is drawn only when it lies on the axis.
 */
public final class HistogramGeometry {
    /** Room left of the bars for the count axis, px. */
    public static final double LEFT = 44;
    /** Room right of the bars, px. */
    public static final double RIGHT = 12;
    /** Room above the bars for the title, px. */
    public static final double TOP = 20;
    /** Room under the bars for the value ticks and the unit, px. */
    public static final double BOTTOM = 32;
    /** Value ticks aimed at on the axis (the 1-2-5 step nearest to the range over this). */
    public static final int TARGET_TICKS = 5;
    /** Half-width of the axis around a histogram whose values are all equal, as a fraction of the value. */
    public static final double FLAT_HALF_WIDTH_FRACTION = 0.01;
    /** Smallest half-width of that axis, in the quantity's unit. */
    public static final double FLAT_HALF_WIDTH_MIN = 1e-3;

    /**
     * One bar. @param bin its index @param x left edge, px @param y top, px @param width px
     * @param height px @param fromValue lower edge of its bin @param toValue upper edge @param count values in it
     */
    public record Bar(int bin, double x, double y, double width, double height, double fromValue, double toValue,
                      long count) {
        public boolean contains(double px, double py) {
            return px >= x && px < x + width && py >= TOP && py <= y + height;
        }
    }

    /** A tick on the value axis. @param value in the quantity's unit @param x px @param label its text */
    public record Tick(double value, double x, String label) {}

    private final Histogram histogram;
    private final double width;
    private final double height;
    private final double axisLow;
    private final double axisHigh;
    private final long maxCount;
    private final List<Bar> bars;
    private final OptionalDouble marker;

    /**
     * @param histogram what to draw
     * @param width     the box's width, px
     * @param height    the box's height, px
     * @param marker    a value to mark with a line (empty for none), in the histogram's unit
     */
    public HistogramGeometry(Histogram histogram, double width, double height, OptionalDouble marker) {
        this.histogram = histogram;
        this.width = width;
        this.height = height;
        this.marker = marker;
        double lo = histogram.lowEdge();
        double hi = histogram.highEdge();
        boolean flat = !(hi > lo);
        if (flat) {
            double half = Math.max(Math.abs(lo) * FLAT_HALF_WIDTH_FRACTION, FLAT_HALF_WIDTH_MIN);
            axisLow = lo - half;
            axisHigh = lo + half;
        } else {
            axisLow = lo;
            axisHigh = hi;
        }
        long[] counts = histogram.counts();
        long max = 0;
        for (long c : counts) {
            max = Math.max(max, c);
        }
        maxCount = max;
        List<Bar> list = new ArrayList<>();
        double plotW = plotWidth();
        double barW = plotW / counts.length;
        for (int i = 0; i < counts.length; i++) {
            double from = flat ? lo : lo + histogram.binWidth() * i;
            double to = flat ? lo : lo + histogram.binWidth() * (i + 1);
            double x = flat ? xOf(lo) - barW / 2 : LEFT + barW * i;
            double h = max == 0 ? 0 : plotHeight() * counts[i] / max;
            list.add(new Bar(i, x, TOP + plotHeight() - h, barW, h, from, to, counts[i]));
        }
        bars = List.copyOf(list);
    }

    private double plotWidth() {
        return Math.max(1, width - LEFT - RIGHT);
    }

    private double plotHeight() {
        return Math.max(1, height - TOP - BOTTOM);
    }

    /** The x of a value, px. */
    public double xOf(double value) {
        return LEFT + plotWidth() * (value - axisLow) / (axisHigh - axisLow);
    }

    /** The y of the bars' base (count zero), px. */
    public double baseY() {
        return TOP + plotHeight();
    }

    /** The y of the tallest bar's top, px. */
    public double topY() {
        return TOP;
    }

    public double plotLeft() {
        return LEFT;
    }

    public double plotRight() {
        return LEFT + plotWidth();
    }

    public List<Bar> bars() {
        return bars;
    }

    /** Builds in the fullest bin. */
    public long maxCount() {
        return maxCount;
    }

    /** Lowest value on the axis. */
    public double axisLow() {
        return axisLow;
    }

    /** Highest value on the axis. */
    public double axisHigh() {
        return axisHigh;
    }

    /** The marker's x, px, when the marker lies on the axis. */
    public OptionalDouble markerX() {
        if (marker.isEmpty()) {
            return OptionalDouble.empty();
        }
        double v = marker.getAsDouble();
        return v >= axisLow && v <= axisHigh ? OptionalDouble.of(xOf(v)) : OptionalDouble.empty();
    }

    /** The value axis's ticks: multiples of a 1-2-5 step inside the axis. */
    public List<Tick> ticks() {
        double step = niceStep((axisHigh - axisLow) / TARGET_TICKS);
        int decimals = Math.max(0, (int) -Math.floor(Math.log10(step) + 1e-9));
        List<Tick> out = new ArrayList<>();
        double first = Math.ceil(axisLow / step - 1e-9) * step;
        for (int k = 0; k <= 4 * TARGET_TICKS; k++) {
            double v = first + k * step;
            if (v > axisHigh + step * 1e-9) {
                break;
            }
            double shown = Math.abs(v) < step * 1e-6 ? 0 : v;
            out.add(new Tick(v, xOf(v), String.format(java.util.Locale.ROOT, "%." + decimals + "f", shown)));
        }
        return out;
    }

    /** The 1, 2 or 5 times a power of ten nearest above {@code rough}. */
    static double niceStep(double rough) {
        if (!(rough > 0) || !Double.isFinite(rough)) {
            return 1;
        }
        double p = Math.pow(10, Math.floor(Math.log10(rough)));
        double f = rough / p;
        double nice = f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
        return nice * p;
    }

    /** The bin under a point, if any (a point over an empty bin's column counts too). */
    public OptionalInt binAt(double px, double py) {
        for (Bar b : bars) {
            if (px >= b.x() && px < b.x() + b.width() && py >= TOP && py <= baseY()) {
                return OptionalInt.of(b.bin());
            }
        }
        return OptionalInt.empty();
    }

    /** The bar of a bin. */
    public Optional<Bar> bar(int bin) {
        return bin >= 0 && bin < bars.size() ? Optional.of(bars.get(bin)) : Optional.empty();
    }

    public Histogram histogram() {
        return histogram;
    }
}
