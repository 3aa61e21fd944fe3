package halfrail.circuit;

import java.util.List;

/**
 * An independent voltage source: {@code V(plus) − V(minus) = value(t) − seriesOhms·I}, with the
 * branch current {@code I} flowing out of {@code plus} into the external circuit.
 *
 * @param dcVolts      the settled DC value in V
 * @param acMagnitude  small-signal magnitude in V used by the AC sweep (0 when the source is not an AC input)
 * @param seriesOhms   internal resistance in Ω (0 for an ideal source)
 * @param rampSeconds  power-on ramp: the value rises linearly from 0 at t = 0 to {@code dcVolts}
 *                     at t = {@code rampSeconds}; 0 means a step at t = 0
 */
public record VoltageSource(String name, String plus, String minus, double dcVolts, double acMagnitude,
                            double seriesOhms, double rampSeconds) implements Element {

    public VoltageSource {
        Check.name(name);
        Check.node(name, "plus", plus);
        Check.node(name, "minus", minus);
        Check.finite(name, "dcVolts", dcVolts, "V");
        Check.nonNegative(name, "acMagnitude", acMagnitude, "V");
        Check.nonNegative(name, "seriesOhms", seriesOhms, "Ω");
        Check.nonNegative(name, "rampSeconds", rampSeconds, "s");
        if (plus.equals(minus)) {
            throw new CircuitException(CircuitException.Kind.BAD_CONNECTION, name, "minus",
                    name + ": both terminals on node " + plus);
        }
    }

    /** An ideal DC source with no AC drive and a step at power-on. */
    public VoltageSource(String name, String plus, String minus, double dcVolts) {
        this(name, plus, minus, dcVolts, 0, 0, 0);
    }

    @Override
    public List<String> terminals() {
        return List.of(plus, minus);
    }

    /** The source's value in V at time {@code t} seconds after power-on. */
    public double valueAt(double t) {
        if (t <= 0) {
            return rampSeconds > 0 ? 0 : dcVolts;
        }
        return t >= rampSeconds ? dcVolts : dcVolts * t / rampSeconds;
    }

    /** Copy with another DC value, in V. */
    public VoltageSource withDcVolts(double volts) {
        return new VoltageSource(name, plus, minus, volts, acMagnitude, seriesOhms, rampSeconds);
    }

    /** Copy with another power-on ramp, in s. */
    public VoltageSource withRamp(double seconds) {
        return new VoltageSource(name, plus, minus, dcVolts, acMagnitude, seriesOhms, seconds);
    }
}
