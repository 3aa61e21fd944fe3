package halfrail.circuit;

import java.util.List;

/**
 * A resistor between nodes {@code a} and {@code b}.
 *
 * @param ohms        resistance in Ω, positive
 * @param tolerance   relative tolerance as a fraction (0.05 = ±5 %)
 * @param tempcoPpmPerKelvin temperature coefficient in ppm/K (may be negative)
 */
public record Resistor(String name, String a, String b, double ohms, double tolerance, double tempcoPpmPerKelvin)
        implements Element {

    public Resistor {
        Check.name(name);
        Check.node(name, "a", a);
        Check.node(name, "b", b);
        Check.positive(name, "ohms", ohms, "Ω");
        Check.fraction(name, "tolerance", tolerance);
        Check.finite(name, "tempcoPpmPerKelvin", tempcoPpmPerKelvin, "ppm/K");
    }

    /** A resistor with no stated tolerance and no temperature coefficient. */
    public Resistor(String name, String a, String b, double ohms) {
        this(name, a, b, ohms, 0, 0);
    }

    @Override
    public List<String> terminals() {
        return List.of(a, b);
    }

    /** Copy with another resistance, in Ω. */
    public Resistor withOhms(double newOhms) {
        return new Resistor(name, a, b, newOhms, tolerance, tempcoPpmPerKelvin);
    }
}
