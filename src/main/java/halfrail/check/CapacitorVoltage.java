package halfrail.check;

import halfrail.units.Quantities;
import halfrail.parts.CapacitorTechnology;
import halfrail.parts.PartsLibrary;

import java.util.List;
import java.util.Optional;

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
                                + ") is reverse biased by " + Quantities.volts(-c.dcVolts()) + " at rest",
                        List.of(c.designPath()), "turn it round (positive terminal towards the higher DC voltage), "
                                + "or use a non-polarised film or ceramic part"));
            }
            if (c.worstVolts() > c.deratedVolts()) {
                double needed = c.worstVolts() * c.ratedVolts() / c.deratedVolts();
                out.add(Finding.of(OVER, Severity.FAIL, c.element() + " sees up to " + Quantities.volts(c.worstVolts())
                                + " (DC plus signal peak over the supply range), above its derated "
                                + Quantities.volts(c.deratedVolts()) + " (rated " + Quantities.volts(c.ratedVolts()) + ")"
                                + SignalEnvelope.drivenNote(c.drivenByClipped()),
                        List.of(c.designPath()), suggestion(c, needed)));
            }
        }
    }

    /**
     * The rating to use: the smallest of the technology's standard ratings at or above
     * {@code needed} (the rating whose derated voltage covers the worst voltage, with the derating
     * the check applied), or {@code needed} itself when no standard rating reaches it.
     */
    private static String suggestion(CapacitorReport c, double needed) {
        Optional<CapacitorTechnology> tech = PartsLibrary.builtIn().capacitorTechnology(c.technology());
        Optional<Double> standard = tech.flatMap(t -> t.standardRatedVolts().stream().filter(v -> v >= needed)
                .findFirst());
        return standard.map(v -> "use a part rated " + Quantities.volts(v) + " (the smallest standard rating whose derated "
                        + "voltage covers " + Quantities.volts(c.worstVolts()) + "; at least " + Quantities.volts(needed) + " is needed)")
                .orElse("use a part rated for at least " + Quantities.volts(needed)
                        + ", or another technology: no standard rating of this one reaches it");
    }
}
