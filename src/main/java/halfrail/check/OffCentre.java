package halfrail.check;

import halfrail.units.Quantities;
import java.util.List;

/**
 * A rest point away from the middle of the swing window wastes headroom on one side:
 * lost = 20·log10((window/2) / room on the worse side), at the nominal supply.
 *
 * <p>The default threshold of 1 dB ({@link halfrail.design.Thresholds#offCentreDb()}) is kept on
 * purpose although it fires for the common case of an equal divider under a part whose output
 * reaches ground but not the supply (window 0.02–7.5 V at 9 V, rest 4.5 V: 1.9 dB lost). The loss
 * is real and grows as a battery runs down, because the rest point follows the divider ratio while
 * the headroom below the supply stays fixed: the same design loses 4.2 dB at the 5.4 V end-point.
 * The warning's remedy (a divider ratio at the window's centre) costs nothing; a reviewer who
 * does not care raises the threshold in the design.
 */
final class OffCentre implements DesignCheck {
    static final String CODE = "OFF_CENTRE";

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        for (StageReport s : e.stages()) {
            SwingReport n = s.nominal();
            double half = (n.swingHighVolts() - n.swingLowVolts()) / 2;
            double worse = Math.min(n.availableLowVolts(), n.availableHighVolts());
            if (n.saturated() || half <= 0 || worse <= 0 || !s.signal()) {
                continue;
            }
            double lostDb = 20 * Math.log10(half / worse);
            if (lostDb > e.thresholds().offCentreDb()) {
                double centre = n.swingLowVolts() + half;
                out.add(Finding.at(CODE, Severity.WARN,
                        s.label() + ": the rest point " + Quantities.volts(n.quiescentVolts()) + " is "
                                + Quantities.volts(Math.abs(n.quiescentVolts() - centre)) + " off the window's centre "
                                + Quantities.volts(centre) + ", losing " + Quantities.db(lostDb) + " of headroom on the "
                                + (n.clipsFirst() == Side.LOW ? "low" : "high") + " side",
                        List.of("reference"),
                        "move the mid-rail reference towards " + Quantities.volts(centre)
                                + " (the divider ratio sets it; an op-amp whose window is symmetric about mid-rail also helps)",
                        s.label(), LadderLevel.QUIESCENT));
            }
        }
    }
}
