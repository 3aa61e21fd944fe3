package halfrail.check;

import halfrail.units.Quantities;
import halfrail.circuit.OpAmp;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.units.ESeries;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;

/**
 * The chain's response against the band of interest: the real lower −3 dB point (from the
 * complex response of the whole cascade) above the band's low end; the upper −3 dB point
 * (gain-bandwidth) or the full-power bandwidth (slew rate at the nominal swing) below its high end.
 */
final class Bandwidth implements DesignCheck {
    static final String LOW_CORNER = "CORNER_ABOVE_BAND";
    static final String UPPER = "BANDWIDTH_SHORT";
    static final String SLEW = "SLEW_LIMITED";
    /** A suggested capacitor puts its own corner this factor below the band's low end. */
    static final double CORNER_MARGIN = 5;

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        ChainReport ch = e.chain();
        if (ch.lowerCornerHz().isPresent() && ch.lowerCornerHz().getAsDouble() > ch.bandLowHz()) {
            Optional<CapacitorReport> highest = e.capacitors().stream()
                    .filter(c -> c.signalPeakVolts() > 0 && !c.element().startsWith("CREF") && c.cornerHz().isPresent())
                    .max(Comparator.comparingDouble(c -> c.cornerHz().getAsDouble()));
            String suggestion = highest.map(c -> {
                double target = ESeries.E6.nextHigher(c.farads() * c.cornerHz().getAsDouble() * CORNER_MARGIN / ch.bandLowHz());
                return "the highest single corner is " + c.element() + " at " + Quantities.hertz(c.cornerHz().getAsDouble())
                        + " (sees " + Quantities.ohms(c.seenOhms().getAsDouble()) + "); raise it to " + Quantities.farads(target);
            }).orElse("raise the coupling capacitors so that each corner lies well below the band");
            out.add(Finding.of(LOW_CORNER, Severity.WARN, "the chain's lower −3 dB point is "
                            + Quantities.hertz(ch.lowerCornerHz().getAsDouble()) + ", above the band's low end "
                            + Quantities.hertz(ch.bandLowHz()),
                    highest.map(c -> List.of(c.designPath())).orElse(List.of()), suggestion));
        }
        if (ch.upperCornerHz().isPresent() && ch.upperCornerHz().getAsDouble() < ch.bandHighHz()) {
            out.add(Finding.of(UPPER, Severity.WARN, "the chain's upper −3 dB point is "
                            + Quantities.hertz(ch.upperCornerHz().getAsDouble()) + ", below the band's high end "
                            + Quantities.hertz(ch.bandHighHz()),
                    slowStages(e, ch.bandHighHz()), "use op-amps with more gain-bandwidth (at least stage gain × "
                            + Quantities.hertz(ch.bandHighHz()) + " × 3 each) or spread the gain over more stages"));
        }
        for (StageReport s : e.stages()) {
            if (s.signal() && s.fullPowerHz().isPresent() && s.fullPowerHz().getAsDouble() < ch.bandHighHz()) {
                double swing = s.nominal().deliveredPeakVolts();
                out.add(Finding.at(SLEW, Severity.WARN, s.label() + ": at " + Quantities.volts(swing)
                                + " peak the slew rate limits the output to " + Quantities.hertz(s.fullPowerHz().getAsDouble())
                                + ", below the band's high end " + Quantities.hertz(ch.bandHighHz())
                                + SignalEnvelope.drivenNote(s.drivenByClipped()),
                        List.of(s.designPath() + ".opAmp"), "choose an op-amp with a slew rate of at least "
                                + String.format(java.util.Locale.ROOT, "%.2g V/µs",
                                2 * Math.PI * ch.bandHighHz() * swing / 1e6),
                        s.label(), LadderLevel.SIGNAL_ENVELOPE));
            }
        }
    }

    /**
     * The op-amps whose own closed-loop bandwidth, GBW / noise gain (any op-amp text), lies below
     * {@code hz}; all signal stages' op-amps when none does alone (a cascade narrows the band).
     */
    private static List<String> slowStages(Evidence e, double hz) {
        List<Stage> stages = e.design().stages();
        List<StageReport> reports = e.stages().stream().filter(StageReport::signal).toList();
        List<String> slow = new ArrayList<>();
        List<String> all = new ArrayList<>();
        for (int i = 0; i < stages.size(); i++) {
            Stage st = stages.get(i);
            StageReport r = reports.get(i);
            double noiseGain = st.kind() == StageKind.FOLLOWER ? 1 : 1 + st.feedbackOhms() / st.legOhms();
            double gbw = ((OpAmp) e.circuit().circuit().element(r.opAmp()).orElseThrow()).params().gainBandwidthHz();
            all.add(r.designPath() + ".opAmp");
            if (gbw / noiseGain < hz) {
                slow.add(r.designPath() + ".opAmp");
            }
        }
        return slow.isEmpty() ? all : slow;
    }
}
