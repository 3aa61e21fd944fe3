package halfrail.ui;

import halfrail.check.Ladder;
import halfrail.check.LadderLevel;
import halfrail.units.EngineeringValue;
import halfrail.units.Unit;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;

/**
 * Where everything of one voltage ladder goes, in pixels, and what lies under a point. Plain
 * arithmetic with no toolkit, so it is unit-tested on its own; {@link LadderCanvas} only paints
 * what this class lays out.
 *
 * <p>The ladder is drawn as two upright shafts on a shared voltage scale from ground (bottom) to
 * {@code scaleTopVolts} (top): a narrow <em>inputs</em> shaft showing the common-mode range and a
 * wider <em>output</em> shaft showing the swing window, the rest point, the signal envelope, the
 * leakage shift and the tolerance spread. The parts of each shaft that the op-amp cannot use are
 * the forbidden bands. Labels sit to the right, pushed apart so that they never overlap, each with
 * a leader back to its level.
 */
public final class LadderGeometry {
    /** Space above the scale for the title, px. */
    public static final double TITLE_HEIGHT = 46;
    /** Space below the scale for the caption, px. */
    public static final double CAPTION_HEIGHT = 50;
    /** Width of the tick-label gutter left of the shafts, px. */
    public static final double SCALE_GUTTER = 38;
    /** Width of the inputs shaft, px. */
    public static final double INPUT_SHAFT_WIDTH = 20;
    /** Gap between the two shafts, px. */
    public static final double SHAFT_GAP = 10;
    /** Width of the output shaft, px. */
    public static final double OUTPUT_SHAFT_WIDTH = 46;
    /** Gap between the output shaft and the labels (room for the tolerance bracket and leaders), px. */
    public static final double LABEL_GAP = 22;
    /** Vertical room one label needs, px. */
    public static final double LABEL_HEIGHT = 14;
    /** How close to a level a pointer must be to hit it, px. */
    public static final double HIT_TOLERANCE = 5;
    /** How far a drawn excursion may leave the scale before it is cut off, px. */
    public static final double OVERSHOOT = 8;
    /** The fewest tick intervals the scale aims for. */
    static final int MIN_TICKS = 4;

    /** One labelled level: its value, where it is drawn and where its label went. */
    public record Mark(LadderLevel level, double volts, double y, String label, double labelY) {}

    /** A vertical stretch of a shaft, top and bottom in px (top < bottom). */
    public record Span(double top, double bottom) {
        public double height() {
            return bottom - top;
        }

        public boolean contains(double y) {
            return y >= top && y <= bottom;
        }
    }

    /** A horizontal stretch, px. */
    public record Column(double left, double right) {
        public double width() {
            return right - left;
        }

        public double centre() {
            return (left + right) / 2;
        }

        public boolean contains(double x) {
            return x >= left && x <= right;
        }
    }

    /** One scale tick. */
    public record Tick(double volts, double y, String label) {}

    private final Ladder ladder;
    private final double width;
    private final double height;
    private final double scaleTopVolts;
    private final double endPointSupplyVolts;
    private final double plotTop;
    private final double plotBottom;
    private final Column inputs;
    private final Column output;
    private final double labelX;
    private final List<Mark> marks = new ArrayList<>();

    /**
     * Lay out {@code ladder} in a box of {@code width} × {@code height} px.
     *
     * @param scaleTopVolts       the voltage at the top of the scale (shared by the ladders shown together), V
     * @param endPointSupplyVolts the battery's end-point rail to mark, V
     */
    public LadderGeometry(Ladder ladder, double width, double height, double scaleTopVolts,
                          double endPointSupplyVolts) {
        if (!(scaleTopVolts > 0) || !Double.isFinite(scaleTopVolts)) {
            throw new IllegalArgumentException("scale top must be a positive voltage, got " + scaleTopVolts);
        }
        this.ladder = ladder;
        this.width = width;
        this.height = height;
        this.scaleTopVolts = scaleTopVolts;
        this.endPointSupplyVolts = endPointSupplyVolts;
        this.plotTop = TITLE_HEIGHT;
        this.plotBottom = Math.max(plotTop + 1, height - CAPTION_HEIGHT);
        double x = SCALE_GUTTER;
        this.inputs = new Column(x, x + INPUT_SHAFT_WIDTH);
        x += INPUT_SHAFT_WIDTH + SHAFT_GAP;
        this.output = new Column(x, x + OUTPUT_SHAFT_WIDTH);
        this.labelX = output.right() + LABEL_GAP;
        layOutMarks();
    }

    /** The smallest width that fits the shafts and the labels, px. */
    public static double preferredWidth() {
        return SCALE_GUTTER + INPUT_SHAFT_WIDTH + SHAFT_GAP + OUTPUT_SHAFT_WIDTH + LABEL_GAP + 150;
    }

    public Ladder ladder() {
        return ladder;
    }

    public double width() {
        return width;
    }

    public double height() {
        return height;
    }

    public double plotTop() {
        return plotTop;
    }

    public double plotBottom() {
        return plotBottom;
    }

    public Column inputs() {
        return inputs;
    }

    public Column output() {
        return output;
    }

    /** Left edge of the labels, px. */
    public double labelX() {
        return labelX;
    }

    /** The vertical position of {@code volts} on the scale, px (ground at the bottom), not limited to the scale. */
    public double y(double volts) {
        return plotBottom - volts / scaleTopVolts * (plotBottom - plotTop);
    }

    /** As {@link #y(double)}, kept within {@link #OVERSHOOT} of the scale. */
    public double clampedY(double volts) {
        return Math.max(plotTop - OVERSHOOT, Math.min(plotBottom + OVERSHOOT, y(volts)));
    }

    /**
     * As {@link #y(double)}, kept within {@link #OVERSHOOT} of the rails: an output can never go
     * beyond them, so an unclipped excursion past a rail is drawn cut off just outside it.
     */
    public double railClampedY(double volts) {
        return Math.max(y(ladder.supplyVolts()) - OVERSHOOT, Math.min(y(0) + OVERSHOOT, y(volts)));
    }

    /** The voltage at vertical position {@code y}, V. */
    public double volts(double y) {
        return (plotBottom - y) / (plotBottom - plotTop) * scaleTopVolts;
    }

    /** Every labelled level, from the top of the scale down. */
    public List<Mark> marks() {
        List<Mark> list = new ArrayList<>(marks);
        list.sort(Comparator.comparingDouble(Mark::y));
        return list;
    }

    /** The (first) mark of {@code level}; the end-point level has a second mark, the output top at the end-point. */
    public Optional<Mark> mark(LadderLevel level) {
        return marks.stream().filter(m -> m.level() == level).findFirst();
    }

    /** The output band the op-amp cannot reach below its swing window. */
    public Span forbiddenOutputLow() {
        return new Span(y(ladder.swingLowVolts()), y(0));
    }

    /** The output band the op-amp cannot reach above its swing window. */
    public Span forbiddenOutputHigh() {
        return new Span(y(ladder.supplyVolts()), y(ladder.swingHighVolts()));
    }

    /** The input band below the common-mode range. */
    public Span forbiddenInputLow() {
        return new Span(y(Math.max(0, ladder.commonModeLowVolts())), y(0));
    }

    /** The input band above the common-mode range. */
    public Span forbiddenInputHigh() {
        return new Span(y(ladder.supplyVolts()), y(Math.min(ladder.supplyVolts(), ladder.commonModeHighVolts())));
    }

    /** The signal envelope around the rest point, as drawn (cut off near the scale's ends). */
    public Span envelope() {
        return new Span(railClampedY(ladder.envelopeHighVolts()), railClampedY(ladder.envelopeLowVolts()));
    }

    /** The part of the envelope above the swing window (clipping on the high side), if any. */
    public Optional<Span> clippedHigh() {
        if (ladder.envelopeHighVolts() <= ladder.swingHighVolts()) {
            return Optional.empty();
        }
        return Optional.of(new Span(railClampedY(ladder.envelopeHighVolts()), y(ladder.swingHighVolts())));
    }

    /** The part of the envelope below the swing window (clipping on the low side), if any. */
    public Optional<Span> clippedLow() {
        if (ladder.envelopeLowVolts() >= ladder.swingLowVolts()) {
            return Optional.empty();
        }
        return Optional.of(new Span(y(ladder.swingLowVolts()), railClampedY(ladder.envelopeLowVolts())));
    }

    /** The rest point moved by limit leakage, px (equal to the rest point when there is no shift). */
    public double shiftedQuiescentY() {
        return clampedY(ladder.quiescentVolts() + ladder.leakageShiftVolts());
    }

    /** The tolerance spread of the rest point, when a tolerance analysis filled it in. */
    public Optional<Span> spread() {
        if (ladder.spreadLowVolts().isEmpty() || ladder.spreadHighVolts().isEmpty()) {
            return Optional.empty();
        }
        return Optional.of(new Span(clampedY(ladder.spreadHighVolts().getAsDouble()),
                clampedY(ladder.spreadLowVolts().getAsDouble())));
    }

    /** Horizontal position of the tolerance bracket, px. */
    public double spreadX() {
        return output.right() + 6;
    }

    /** The end-point rail marked on this ladder, V. */
    public double endPointSupplyVolts() {
        return endPointSupplyVolts;
    }

    /** Scale ticks at a round step, from ground up to the top of the scale. */
    public List<Tick> ticks() {
        double step = tickStep(scaleTopVolts);
        List<Tick> ticks = new ArrayList<>();
        int n = (int) Math.floor(scaleTopVolts / step + 1e-9);
        for (int i = 0; i <= n; i++) {
            double v = i * step;
            ticks.add(new Tick(v, y(v), EngineeringValue.format(v, Unit.NONE, 3)));
        }
        return ticks;
    }

    /**
     * A round tick step (1, 2 or 5 times a power of ten) that divides {@code span} into at least
     * {@link #MIN_TICKS} intervals.
     */
    static double tickStep(double span) {
        double raw = span / MIN_TICKS;
        double decade = Math.pow(10, Math.floor(Math.log10(raw)));
        for (double m : new double[] {5, 2, 1}) {
            if (m * decade <= raw) {
                return m * decade;
            }
        }
        return decade;
    }

    /**
     * What lies under the point ({@code x}, {@code y}): the nearest level within
     * {@link #HIT_TOLERANCE}, else the envelope or spread when the point is on them.
     */
    public Optional<LadderLevel> hit(double x, double y) {
        if (x < inputs.left() - HIT_TOLERANCE || x > width) {
            return Optional.empty();
        }
        boolean onLabels = x >= labelX - HIT_TOLERANCE;
        boolean onInputs = x <= inputs.right() + SHAFT_GAP / 2;
        Mark best = null;
        double bestDistance = HIT_TOLERANCE;
        for (Mark m : marks) {
            boolean inputLevel = m.level() == LadderLevel.COMMON_MODE_LOW || m.level() == LadderLevel.COMMON_MODE_HIGH;
            boolean outputOnly = m.level() == LadderLevel.SWING_LOW || m.level() == LadderLevel.SWING_HIGH
                    || m.level() == LadderLevel.QUIESCENT || m.level() == LadderLevel.LEAKAGE_SHIFT;
            if (!onLabels && (onInputs ? outputOnly : inputLevel)) {
                continue;
            }
            double d = Math.abs((onLabels ? m.labelY() : m.y()) - y);
            if (d < bestDistance || (d == bestDistance && best != null && precedes(m.level(), best.level()))
                    || (d <= bestDistance && best == null)) {
                best = m;
                bestDistance = d;
            }
        }
        if (best != null) {
            return Optional.of(best.level());
        }
        if (output.contains(x) && envelope().contains(y)) {
            return Optional.of(LadderLevel.SIGNAL_ENVELOPE);
        }
        Optional<Span> spread = spread();
        if (spread.isPresent() && Math.abs(x - spreadX()) <= HIT_TOLERANCE && spread.get().contains(y)) {
            return Optional.of(LadderLevel.TOLERANCE_SPREAD);
        }
        return Optional.empty();
    }

    /** Where levels coincide, the one drawn on top wins: the rest point, then the limits, then the rails. */
    static boolean precedes(LadderLevel a, LadderLevel b) {
        return rank(a) < rank(b);
    }

    private static int rank(LadderLevel l) {
        return switch (l) {
            case QUIESCENT -> 0;
            case LEAKAGE_SHIFT -> 1;
            case SWING_HIGH, SWING_LOW -> 2;
            case COMMON_MODE_HIGH, COMMON_MODE_LOW -> 3;
            case MID_RAIL -> 4;
            case END_POINT_SUPPLY -> 5;
            case SIGNAL_ENVELOPE, TOLERANCE_SPREAD -> 6;
            case SUPPLY, GROUND -> 7;
        };
    }

    /** Which side the stage clips on at the nominal signal, if it does: the side that overflows more. */
    public Optional<halfrail.check.Side> clipSide() {
        double over = ladder.envelopeHighVolts() - ladder.swingHighVolts();
        double under = ladder.swingLowVolts() - ladder.envelopeLowVolts();
        if (over <= 0 && under <= 0) {
            return Optional.empty();
        }
        return Optional.of(over >= under ? halfrail.check.Side.HIGH : halfrail.check.Side.LOW);
    }

    /** Which half of the swing window the rest point lies in (the rail a stuck output sits on). */
    public halfrail.check.Side restSide() {
        double centre = (ladder.swingLowVolts() + ladder.swingHighVolts()) / 2;
        return ladder.quiescentVolts() >= centre ? halfrail.check.Side.HIGH : halfrail.check.Side.LOW;
    }

    private void layOutMarks() {
        List<Mark> raw = new ArrayList<>();
        raw.add(raw(LadderLevel.SUPPLY, ladder.supplyVolts(), "rail"));
        raw.add(raw(LadderLevel.END_POINT_SUPPLY, endPointSupplyVolts, "end-point rail"));
        raw.add(raw(LadderLevel.SWING_HIGH, ladder.swingHighVolts(), "output top"));
        raw.add(raw(LadderLevel.END_POINT_SUPPLY, ladder.endPointSwingHighVolts(), "top at end-point"));
        raw.add(raw(LadderLevel.COMMON_MODE_HIGH, Math.min(ladder.supplyVolts(), ladder.commonModeHighVolts()),
                "input top"));
        raw.add(raw(LadderLevel.MID_RAIL, ladder.midRailVolts(), "mid-rail"));
        raw.add(raw(LadderLevel.QUIESCENT, ladder.quiescentVolts(), "rest"));
        raw.add(raw(LadderLevel.COMMON_MODE_LOW, Math.max(0, ladder.commonModeLowVolts()), "input floor"));
        raw.add(raw(LadderLevel.SWING_LOW, ladder.swingLowVolts(), "output floor"));
        raw.add(raw(LadderLevel.GROUND, 0, "ground"));
        if (Math.abs(ladder.leakageShiftVolts()) > 0) {
            raw.add(new Mark(LadderLevel.LEAKAGE_SHIFT, ladder.quiescentVolts() + ladder.leakageShiftVolts(),
                    shiftedQuiescentY(), "leak " + signed(ladder.leakageShiftVolts()), 0));
        }
        List<Mark> placed = spreadLabels(raw, plotTop - OVERSHOOT, plotBottom + LABEL_HEIGHT);
        marks.addAll(placed);
    }

    private Mark raw(LadderLevel level, double volts, String name) {
        return new Mark(level, volts, clampedY(volts), name + " " + EngineeringValue.format(volts, Unit.VOLT), 0);
    }

    private static String signed(double volts) {
        String s = EngineeringValue.format(Math.abs(volts), Unit.VOLT);
        return (volts < 0 ? "−" : "+") + s;
    }

    /**
     * Place labels as near their levels as they can go without overlapping: sort by level,
     * push each one down below the one above it, then push the whole stack back up where it
     * ran past {@code lowest}.
     */
    static List<Mark> spreadLabels(List<Mark> marks, double highest, double lowest) {
        List<Mark> sorted = new ArrayList<>(marks);
        sorted.sort(Comparator.comparingDouble(Mark::y).thenComparing(m -> m.level().ordinal()));
        int n = sorted.size();
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            double want = Math.max(highest, sorted.get(i).y());
            y[i] = i == 0 ? want : Math.max(want, y[i - 1] + LABEL_HEIGHT);
        }
        for (int i = n - 1; i >= 0; i--) {
            double limit = i == n - 1 ? lowest : y[i + 1] - LABEL_HEIGHT;
            y[i] = Math.min(y[i], limit);
        }
        List<Mark> out = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            Mark m = sorted.get(i);
            out.add(new Mark(m.level(), m.volts(), m.y(), m.label(), y[i]));
        }
        return out;
    }
}
