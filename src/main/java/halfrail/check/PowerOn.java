package halfrail.check;

import halfrail.design.StageNodes;
import halfrail.solve.PowerOnResult;
import halfrail.units.Quantities;

import java.util.List;
import java.util.Map;

/**
 * The power-on transient: a sustained oscillation after switch-on, settle-up longer than the
 * design's limit (or no settling within the run), outputs pinned to a rail during start, and a
 * large step delivered into the load.
 */
final class PowerOn implements DesignCheck {
    static final String OSCILLATES = "KEEPS_OSCILLATING";
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
        if (p.oscillation().isPresent()) {
            oscillation(e, p.oscillation().get(), out);
        } else if (!p.settled()) {
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
            // An oscillating chain swings from rail to rail: the oscillation finding says so, and
            // "while the capacitors charge" would not be true.
            if (en.getValue() > PINNED_REPORT_SECONDS && p.oscillation().isEmpty()) {
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

    /** A circuit that keeps oscillating never reaches its operating point: a failure. */
    private static void oscillation(Evidence e, PowerOnResult.Oscillation o, List<Finding> out) {
        String where = o.node();
        String opAmp = null;
        for (StageNodes sn : e.circuit().opAmps()) {
            if (sn.out().equals(o.node())) {
                where = sn.label() + "'s output";
                opAmp = sn.label();
                break;
            }
        }
        if (opAmp == null && o.node().equals(e.circuit().loadNode())) {
            where = "the load";
        }
        List<String> parts = List.of("reference");
        String message = "after switch-on the circuit does not settle: " + where + " keeps swinging "
                + Quantities.volts(o.peakToPeakVolts()) + " peak to peak with a period of "
                + Quantities.seconds(o.periodSeconds()) + " (" + Quantities.hertz(o.frequencyHz())
                + "), from " + Quantities.seconds(o.fromSeconds()) + " on (recognised at "
                + Quantities.seconds(o.seenAtSeconds()) + ")";
        String suggestion = "a loop closes round the chain at low frequency (motorboating), most often through a "
                + "reference shared by several stages: decouple the reference more heavily or give each stage's "
                + "bias its own decoupled feed, and keep the chain's gain below the signal band low (smaller "
                + "feedback-leg or coupling capacitors)";
        out.add(opAmp == null ? Finding.of(OSCILLATES, Severity.FAIL, message, parts, suggestion)
                : Finding.at(OSCILLATES, Severity.FAIL, message, parts, suggestion, opAmp, LadderLevel.QUIESCENT));
    }
}
