package halfrail.circuit;

import java.util.List;

/**
 * A capacitor between {@code plus} and {@code minus}. For a polarised part {@code plus} is the
 * positive terminal; the solver does not treat polarity specially, the checks do.
 *
 * @param farads            capacitance in F, positive
 * @param tolerance         relative tolerance as a fraction
 * @param technology        free-form technology identifier (for example {@code "aluminium-electrolytic"});
 *                          the circuit layer does not interpret it
 * @param ratedVolts        rated DC voltage in V; {@link Double#POSITIVE_INFINITY} when unknown
 * @param polarised         whether reverse DC voltage harms the part
 * @param leakageSiemens    leakage conductance in S in parallel with the capacitance; the DC and
 *                          transient solutions honour it; zero for an ideal part
 */
public record Capacitor(String name, String plus, String minus, double farads, double tolerance, String technology,
                        double ratedVolts, boolean polarised, double leakageSiemens) implements Element {

    public Capacitor {
        Check.name(name);
        Check.node(name, "plus", plus);
        Check.node(name, "minus", minus);
        Check.positive(name, "farads", farads, "F");
        Check.fraction(name, "tolerance", tolerance);
        technology = technology == null ? "" : technology;
        if (Double.isNaN(ratedVolts) || ratedVolts <= 0) {
            throw new CircuitException(CircuitException.Kind.BAD_VALUE, name, "ratedVolts",
                    name + ": ratedVolts must be positive (use infinity when unknown), got " + ratedVolts);
        }
        Check.nonNegative(name, "leakageSiemens", leakageSiemens, "S");
    }

    /** An ideal, unpolarised capacitor with no rating or leakage. */
    public Capacitor(String name, String plus, String minus, double farads) {
        this(name, plus, minus, farads, 0, "", Double.POSITIVE_INFINITY, false, 0);
    }

    @Override
    public List<String> terminals() {
        return List.of(plus, minus);
    }

    /** Copy with another leakage conductance, in S. */
    public Capacitor withLeakage(double siemens) {
        return new Capacitor(name, plus, minus, farads, tolerance, technology, ratedVolts, polarised, siemens);
    }

    /** Copy with another capacitance, in F. */
    public Capacitor withFarads(double newFarads) {
        return new Capacitor(name, plus, minus, newFarads, tolerance, technology, ratedVolts, polarised, leakageSiemens);
    }
}
