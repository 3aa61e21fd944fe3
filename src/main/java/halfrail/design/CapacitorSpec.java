package halfrail.design;

/**
 * A capacitor as the designer chose it.
 *
 * @param farads      capacitance in F
 * @param technology  id of a capacitor technology in the parts library (for example
 *                    {@code "polyester-film"}); it sets polarity, tolerance, leakage and derating
 * @param ratedVolts  rated DC voltage in V
 */
public record CapacitorSpec(double farads, String technology, double ratedVolts) {
    public CapacitorSpec {
        DesignException.RULES.positive("farads", farads, "F");
        if (technology == null || technology.isBlank()) {
            throw new DesignException("technology", "is required (a capacitor technology id)");
        }
        DesignException.RULES.positive("ratedVolts", ratedVolts, "V");
    }

    public CapacitorSpec withFarads(double f) {
        return new CapacitorSpec(f, technology, ratedVolts);
    }

    public CapacitorSpec withTechnology(String t) {
        return new CapacitorSpec(farads, t, ratedVolts);
    }
}
