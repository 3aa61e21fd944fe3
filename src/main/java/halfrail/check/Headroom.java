package halfrail.check;

import halfrail.units.Quantities;
import java.util.List;

/**
 * The nominal signal against the swing window: clipping at the nominal supply (fail), too
 * little headroom (warn), and clipping at the lowest supply — a battery's end-point (fail).
 */
final class Headroom implements DesignCheck {
    static final String CLIPS = "CLIPS_AT_NOMINAL";
    static final String LOW = "HEADROOM_LOW";
    static final String END_POINT = "CLIPS_AT_END_POINT";

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        double margin = e.thresholds().minHeadroomDb();
        for (StageReport s : e.stages()) {
            // A stage saturated at rest is reported once, by RestsOnRail; its headroom means nothing.
            if (!s.signal() || s.nominal().saturated()) {
                continue;
            }
            SwingReport n = s.nominal();
            if (n.clips()) {
                out.add(Finding.at(CLIPS, Severity.FAIL, s.label() + ": the nominal signal of "
                                + Quantities.volts(n.signalPeakVolts()) + " peak at the output clips on the "
                                + side(n) + " side at " + Quantities.volts(n.supplyVolts()) + ": only "
                                + Quantities.volts(Math.max(0, Math.min(n.availableLowVolts(), n.availableHighVolts())))
                                + " of room (" + db(n) + ")" + SignalEnvelope.drivenNote(s.drivenByClipped()),
                        List.of(s.designPath()), suggestion(n), s.label(), LadderLevel.SIGNAL_ENVELOPE));
            } else if (n.headroomDb().isPresent() && n.headroomDb().getAsDouble() < margin) {
                out.add(Finding.at(LOW, Severity.WARN, s.label() + ": headroom at the nominal signal is "
                                + db(n) + " on the " + side(n) + " side, below the "
                                + Quantities.db(margin) + " asked for" + SignalEnvelope.drivenNote(s.drivenByClipped()),
                        List.of(s.designPath()), suggestion(n), s.label(), LadderLevel.SIGNAL_ENVELOPE));
            }
            SwingReport end = s.endPoint();
            if (!n.clips() && end.clips()) {
                out.add(Finding.at(END_POINT, Severity.FAIL, s.label() + ": at the lowest supply, "
                                + Quantities.volts(end.supplyVolts()) + ", the nominal signal clips on the " + side(end)
                                + " side (" + (end.saturated() ? "the output sits on a rail" : db(end))
                                + "); the largest source level that fits there is "
                                + Quantities.volts(end.largestSourcePeakVolts().orElse(0)) + " peak"
                                + SignalEnvelope.drivenNote(s.drivenByClipped()),
                        List.of(s.designPath(), "supply"),
                        "lower the stage gain, choose an op-amp with outputs closer to the rails, or a supply that ends higher",
                        s.label(), LadderLevel.END_POINT_SUPPLY));
            }
        }
    }

    private static String db(SwingReport r) {
        return r.headroomDb().isPresent() ? Quantities.db(r.headroomDb().getAsDouble()) : "no room at all";
    }

    private static String side(SwingReport r) {
        return r.clipsFirst() == Side.LOW ? "low" : "high";
    }

    private static String suggestion(SwingReport n) {
        return "the largest source level that fits is " + Quantities.volts(n.largestSourcePeakVolts().orElse(0))
                + " peak; lower the gain, centre the rest point, or use an op-amp with a wider swing window";
    }
}
