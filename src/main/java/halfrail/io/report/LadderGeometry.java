package halfrail.io.report;

import halfrail.check.Ladder;
import halfrail.check.LadderLevel;

import java.util.ArrayList;
import java.util.List;

/**
 * Where the levels of one design's voltage ladders sit in a drawing: one vertical volt scale,
 * shared by every op-amp of the design, from ground (or the lowest signal excursion, if the
 * signal swings below ground) at {@code bottomPx} to the supply (or the highest excursion) at
 * {@code topPx}. Plain geometry: the painters only draw what this places.
 */
public final class LadderGeometry {
    private final Axis volts;

    /**
     * @param ladders  the design's ladders (they share the supply); at least one
     * @param topPx    pixel row of the highest voltage drawn
     * @param bottomPx pixel row of the lowest voltage drawn (below {@code topPx})
     */
    public LadderGeometry(List<Ladder> ladders, double topPx, double bottomPx) {
        if (ladders.isEmpty()) {
            throw new IllegalArgumentException("no ladder to place");
        }
        double low = 0;
        double high = 0;
        for (Ladder l : ladders) {
            low = Math.min(low, l.envelopeLowVolts());
            high = Math.max(high, Math.max(l.supplyVolts(), Math.max(l.envelopeHighVolts(), l.endPointSupplyVolts())));
        }
        if (!(high > low)) {
            high = low + 1;
        }
        this.volts = Axis.linear(low, high, bottomPx, topPx);
    }

    /** The volt scale (bottom to top). */
    public Axis axis() {
        return volts;
    }

    /** Pixel row of {@code v} volts. */
    public double y(double v) {
        return volts.toPixel(v);
    }

    /** One level of a ladder placed on the scale. */
    public record Mark(LadderLevel level, double volts, double y) {}

    /**
     * The single-valued levels of {@code l}, placed: ground, supply, end-point supply, swing limits,
     * common-mode limits, mid-rail and the quiescent point (the envelope, spread and leakage shift
     * are ranges; see {@link #envelope}, {@link #spread}, {@link #leakageShift}).
     */
    public List<Mark> marks(Ladder l) {
        List<Mark> m = new ArrayList<>();
        add(m, LadderLevel.GROUND, 0);
        add(m, LadderLevel.SUPPLY, l.supplyVolts());
        add(m, LadderLevel.END_POINT_SUPPLY, l.endPointSupplyVolts());
        add(m, LadderLevel.SWING_LOW, l.swingLowVolts());
        add(m, LadderLevel.SWING_HIGH, l.swingHighVolts());
        add(m, LadderLevel.COMMON_MODE_LOW, l.commonModeLowVolts());
        add(m, LadderLevel.COMMON_MODE_HIGH, l.commonModeHighVolts());
        add(m, LadderLevel.MID_RAIL, l.midRailVolts());
        add(m, LadderLevel.QUIESCENT, l.quiescentVolts());
        return m;
    }

    /** The mark of one level, if {@link #marks} places it. */
    public java.util.Optional<Mark> mark(Ladder l, LadderLevel level) {
        return marks(l).stream().filter(m -> m.level() == level).findFirst();
    }

    /** Pixel rows {top, bottom} of the signal envelope. */
    public double[] envelope(Ladder l) {
        return new double[] {y(l.envelopeHighVolts()), y(l.envelopeLowVolts())};
    }

    /** Pixel rows {top, bottom} of the tolerance spread, when the ladder has one. */
    public java.util.Optional<double[]> spread(Ladder l) {
        if (l.spreadLowVolts().isEmpty() || l.spreadHighVolts().isEmpty()) {
            return java.util.Optional.empty();
        }
        return java.util.Optional.of(new double[] {y(l.spreadHighVolts().getAsDouble()),
                y(l.spreadLowVolts().getAsDouble())});
    }

    /** Pixel rows {from, to} of the leakage shift: from the quiescent point to where limit leakage moves it. */
    public double[] leakageShift(Ladder l) {
        return new double[] {y(l.quiescentVolts()), y(l.quiescentVolts() + l.leakageShiftVolts())};
    }

    private void add(List<Mark> m, LadderLevel level, double v) {
        m.add(new Mark(level, v, y(v)));
    }
}
