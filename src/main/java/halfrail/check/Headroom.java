package halfrail.check;

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
            if (!s.signal() || s.nominal().saturated()) {
                continue;
            }
            SwingReport n = s.nominal();
            if (n.headroomDb() < 0) {
                out.add(Finding.at(CLIPS, Severity.FAIL, s.label() + ": the nominal signal of "
                                + Text.volts(n.signalPeakVolts()) + " peak at the output clips on the "
                                + side(n) + " side at " + Text.volts(n.supplyVolts()) + ": only "
                                + Text.volts(Math.max(0, Math.min(n.availableLowVolts(), n.availableHighVolts())))
                                + " of room (" + Text.db(n.headroomDb()) + ")",
                        List.of(s.designPath()), suggestion(e, s, n), s.label(), LadderLevel.SIGNAL_ENVELOPE));
            } else if (n.headroomDb() < margin) {
                out.add(Finding.at(LOW, Severity.WARN, s.label() + ": headroom at the nominal signal is "
                                + Text.db(n.headroomDb()) + " on the " + side(n) + " side, below the "
                                + Text.db(margin) + " asked for",
                        List.of(s.designPath()), suggestion(e, s, n), s.label(), LadderLevel.SIGNAL_ENVELOPE));
            }
            SwingReport end = s.endPoint();
            if (n.headroomDb() >= 0 && (end.saturated() || end.headroomDb() < 0)) {
                out.add(Finding.at(END_POINT, Severity.FAIL, s.label() + ": at the lowest supply, "
                                + Text.volts(end.supplyVolts()) + ", the nominal signal clips on the " + side(end)
                                + " side (" + (end.saturated() ? "the output sits on a rail" : Text.db(end.headroomDb()))
                                + "); the largest source level that fits there is "
                                + Text.volts(end.largestSourcePeakVolts()) + " peak",
                        List.of(s.designPath(), "supply"),
                        "lower the stage gain, choose an op-amp with outputs closer to the rails, or a supply that ends higher",
                        s.label(), LadderLevel.END_POINT_SUPPLY));
            }
        }
    }

    private static String side(SwingReport r) {
        return r.clipsFirst() == Side.LOW ? "low" : "high";
    }

    private static String suggestion(Evidence e, StageReport s, SwingReport n) {
        double fits = n.largestSourcePeakVolts();
        return "the largest source level that fits is " + Text.volts(fits) + " peak; lower the gain, centre the rest point, "
                + "or use an op-amp with a wider swing window";
    }
}
