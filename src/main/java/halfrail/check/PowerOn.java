package halfrail.check;

import halfrail.units.Quantities;
import java.util.List;
import java.util.Map;

/**
 * The power-on transient: settle-up longer than the design's limit (or no settling within the
 * run), outputs pinned to a rail during start, and a large step delivered into the load.
 */
final class PowerOn implements DesignCheck {
    static final String SLOW = "SETTLE_SLOW";
    static final String PINNED = "PINNED_AT_START";
    static final String STEP = "START_STEP";
    /** Time on a rail during start above which it is reported, s. */
    static final double PINNED_REPORT_SECONDS = 1e-3;

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        if (e.powerOn().isEmpty()) {
            return;
        }
        PowerOnReport p = e.powerOn().get();
        double limit = e.thresholds().maxSettleSeconds();
        if (!p.settled()) {
            out.add(Finding.of(SLOW, Severity.WARN, "the circuit had not settled within "
                            + Quantities.volts(p.bandVolts()) + " of its final state after " + Quantities.seconds(p.simulatedSeconds()),
                    List.of("reference"), "shorten the longest time constant: usually the reference decoupling "
                            + "(divider ‖ resistance × capacitor) or the feedback-leg capacitor"));
        } else if (p.settleSeconds().isPresent() && p.settleSeconds().getAsDouble() > limit) {
            out.add(Finding.of(SLOW, Severity.WARN, "settle-up takes " + Quantities.seconds(p.settleSeconds().getAsDouble())
                            + " to within " + Quantities.volts(p.bandVolts()) + ", longer than the limit " + Quantities.seconds(limit),
                    List.of("reference"), "shorten the longest time constant: usually the reference decoupling "
                            + "(divider ‖ resistance × capacitor) or the feedback-leg capacitor"));
        }
        for (Map.Entry<String, Double> en : p.pinnedSeconds().entrySet()) {
            if (en.getValue() > PINNED_REPORT_SECONDS) {
                String path = e.stages().stream().filter(s -> s.label().equals(en.getKey()))
                        .map(StageReport::designPath).findFirst().orElse("");
                out.add(Finding.at(PINNED, Severity.NOTE, en.getKey() + ": the output sits on a rail for "
                                + Quantities.seconds(en.getValue()) + " after switch-on while the capacitors charge",
                        List.of(path), "expected with large feedback-leg or reference capacitors; mute the output "
                                + "during start if the load must not see it", en.getKey(), LadderLevel.QUIESCENT));
            }
        }
        if (p.loadStepVolts() > e.thresholds().maxStepVolts()) {
            boolean coupled = e.design().load().outputCapacitor() != null;
            out.add(Finding.of(STEP, Severity.WARN, "at switch-on the load sees a step of up to "
                            + Quantities.volts(p.loadStepVolts()) + " (limit " + Quantities.volts(e.thresholds().maxStepVolts()) + ")",
                    List.of(coupled ? "load.outputCapacitor" : "load"), coupled
                            ? "ramp the supply more slowly, add a resistor to ground before the output capacitor so it "
                            + "charges before the load is connected, or mute at start"
                            : "the load is DC-coupled, so it rises with the output from 0 V to the rest point and then "
                            + "carries it: couple it through an output capacitor (with a resistor to ground before it)"));
        }
    }
}
