package halfrail.check;

import halfrail.units.ESeries;

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
                    .filter(c -> c.signalPeakVolts() > 0 && !c.element().startsWith("CREF"))
                    .max(Comparator.comparingDouble(CapacitorReport::cornerHz));
            String suggestion = highest.map(c -> {
                double target = ESeries.E6.nextHigher(c.farads() * c.cornerHz() * CORNER_MARGIN / ch.bandLowHz());
                return "the highest single corner is " + c.element() + " at " + Text.hertz(c.cornerHz())
                        + " (sees " + Text.ohms(c.seenOhms()) + "); raise it to " + Text.farads(target);
            }).orElse("raise the coupling capacitors so that each corner lies well below the band");
            out.add(Finding.of(LOW_CORNER, Severity.WARN, "the chain's lower −3 dB point is "
                            + Text.hertz(ch.lowerCornerHz().getAsDouble()) + ", above the band's low end "
                            + Text.hertz(ch.bandLowHz()),
                    highest.map(c -> List.of(c.designPath())).orElse(List.of()), suggestion));
        }
        if (ch.upperCornerHz().isPresent() && ch.upperCornerHz().getAsDouble() < ch.bandHighHz()) {
            out.add(Finding.of(UPPER, Severity.WARN, "the chain's upper −3 dB point is "
                            + Text.hertz(ch.upperCornerHz().getAsDouble()) + ", below the band's high end "
                            + Text.hertz(ch.bandHighHz()),
                    List.of(), "use op-amps with more gain-bandwidth (at least stage gain × "
                            + Text.hertz(ch.bandHighHz()) + " × 3 each) or spread the gain over more stages"));
        }
        for (StageReport s : e.stages()) {
            if (s.signal() && s.fullPowerHz().isPresent() && s.fullPowerHz().getAsDouble() < ch.bandHighHz()) {
                out.add(Finding.at(SLEW, Severity.WARN, s.label() + ": at " + Text.volts(s.nominal().signalPeakVolts())
                                + " peak the slew rate limits the output to " + Text.hertz(s.fullPowerHz().getAsDouble())
                                + ", below the band's high end " + Text.hertz(ch.bandHighHz()),
                        List.of(s.designPath() + ".opAmp"), "choose an op-amp with a slew rate of at least "
                                + String.format(java.util.Locale.ROOT, "%.2g V/µs",
                                2 * Math.PI * ch.bandHighHz() * s.nominal().signalPeakVolts() / 1e6),
                        s.label(), LadderLevel.SIGNAL_ENVELOPE));
            }
        }
    }
}
