package halfrail.check;

import halfrail.units.Quantities;
import java.util.List;

/** An output that sits on (or within a few per cent of) a swing limit at rest has no room to swing on that side. */
final class RestsOnRail implements DesignCheck {
    static final String CODE = "REST_ON_RAIL";

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        double fraction = e.thresholds().nearRailFraction();
        for (StageReport s : e.stages()) {
            SwingReport n = s.nominal();
            double window = n.swingHighVolts() - n.swingLowVolts();
            double margin = fraction * Math.max(window, 0);
            boolean low = n.availableLowVolts() <= margin;
            boolean high = n.availableHighVolts() <= margin;
            if (n.saturated() || low || high) {
                boolean atLow = n.saturated() ? n.availableLowVolts() < n.availableHighVolts() : low;
                String limit = atLow ? "lower" : "upper";
                String where = window > 0
                        ? ", on its " + limit + " swing limit (window " + Quantities.volts(n.swingLowVolts()) + " to "
                                + Quantities.volts(n.swingHighVolts()) + " at " + Quantities.volts(n.supplyVolts()) + ")"
                        : ": at " + Quantities.volts(n.supplyVolts()) + " the part has no output window at all (it needs "
                                + "more supply than its two output headrooms together)";
                out.add(Finding.at(CODE, Severity.FAIL,
                        s.label() + ": the output rests at " + Quantities.volts(n.quiescentVolts()) + where
                                + (n.saturated() ? "; the op-amp has left its linear region" : ""),
                        List.of(s.designPath()),
                        "bias the stage at the middle of its window, about "
                                + Quantities.volts((n.swingLowVolts() + n.swingHighVolts()) / 2)
                                + ", with unity DC gain for the bias",
                        s.label(), atLow ? LadderLevel.SWING_LOW : LadderLevel.SWING_HIGH));
            }
        }
    }
}
