package halfrail.check;

import java.util.List;

/**
 * Polarised capacitors must never see reverse DC voltage; no capacitor may see more than its
 * derated voltage (DC over the supply range plus the signal peak).
 */
final class CapacitorVoltage implements DesignCheck {
    static final String REVERSED = "REVERSE_BIASED";
    static final String OVER = "OVER_VOLTAGE";
    /**
     * Reverse DC below this magnitude is treated as zero, V: it is what offsets leave across a
     * capacitor between two nodes that both sit at the reference.
     */
    static final double REVERSE_TOLERANCE_VOLTS = 0.05;

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        for (CapacitorReport c : e.capacitors()) {
            if (c.polarised() && c.dcVolts() < -REVERSE_TOLERANCE_VOLTS) {
                out.add(Finding.of(REVERSED, Severity.FAIL, c.element() + " (" + c.technology()
                                + ") is reverse biased by " + Text.volts(-c.dcVolts()) + " at rest",
                        List.of(c.designPath()), "turn it round (positive terminal towards the higher DC voltage), "
                                + "or use a non-polarised film or ceramic part"));
            }
            if (c.worstVolts() > c.deratedVolts()) {
                double rating = e.design().supply().highVolts();
                out.add(Finding.of(OVER, Severity.FAIL, c.element() + " sees up to " + Text.volts(c.worstVolts())
                                + " (DC plus signal peak over the supply range), above its derated "
                                + Text.volts(c.deratedVolts()) + " (rated " + Text.volts(c.ratedVolts()) + ")",
                        List.of(c.designPath()), "use a part rated for at least "
                                + Text.volts(c.worstVolts() * c.ratedVolts() / c.deratedVolts())
                                + " (the supply alone reaches " + Text.volts(rating) + ")"));
            }
        }
    }
}
