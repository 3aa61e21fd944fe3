package halfrail.parts;

import halfrail.circuit.OpAmpParams;

import java.util.Map;
import java.util.Set;

/**
 * A class of op-amp described only by its parameters — representative figures for the class,
 * not those of any one part. The built-in entries live in
 * {@code halfrail/parts/opamp-archetypes.json}; {@link #basis()} says which figures are common
 * practice or from memory.
 *
 * @param id          stable id, for example {@value #CMOS_RRIO_LOW_VOLTAGE}
 * @param displayName name to show people
 * @param description one sentence on what sets the class apart
 * @param typical     typical parameters at no load
 * @param spread      worst-case input errors and load dependence of the output headroom
 * @param basis       per field ({@code typical}, {@code spread}), where the figures come from
 */
public record OpAmpArchetype(String id, String displayName, String description, OpAmpParams typical,
                             OpAmpSpread spread, Map<String, String> basis) implements PartEntry {

    public static final String CLASSIC_BIPOLAR_DUAL_SUPPLY = "classic-bipolar-dual-supply";
    public static final String SINGLE_SUPPLY_BIPOLAR = "single-supply-bipolar";
    public static final String JFET_INPUT_AUDIO = "jfet-input-audio";
    public static final String CMOS_RRIO_LOW_VOLTAGE = "cmos-rrio-low-voltage";
    public static final String MICROPOWER = "micropower";

    private static final Set<String> BASIS_FIELDS = Set.of("typical", "spread");

    public OpAmpArchetype {
        Require.id("op-amp archetype", id);
        String owner = "op-amp archetype " + id;
        Require.text(owner, "displayName", displayName);
        Require.text(owner, "description", description);
        if (typical == null) {
            throw Require.bad("typical", owner + ": typical parameters are missing");
        }
        if (spread == null) {
            throw Require.bad("spread", owner + ": spread is missing");
        }
        if (Math.abs(typical.offsetVolts()) > spread.offsetVoltsMax()
                || Math.abs(typical.biasAmps()) > spread.biasAmpsMax()
                || Math.abs(typical.offsetCurrentAmps()) > spread.offsetCurrentAmpsMax()) {
            throw Require.bad("spread", owner + ": a typical input error (offset voltage, bias or offset current) "
                    + "exceeds its maximum in spread");
        }
        basis = Require.basis(owner, basis, BASIS_FIELDS, BASIS_FIELDS);
    }

    /** Output headroom above V− in V when the output carries {@code loadAmps} A (either direction). */
    public double swingLowVoltsAt(double loadAmps) {
        return typical.swingLowVolts() + extraHeadroom(loadAmps);
    }

    /** Output headroom below V+ in V when the output carries {@code loadAmps} A (either direction). */
    public double swingHighVoltsAt(double loadAmps) {
        return typical.swingHighVolts() + extraHeadroom(loadAmps);
    }

    /**
     * The typical parameters with both output headrooms widened for a load current of
     * {@code loadAmps} A. Both sides grow, whichever way the current flows: the cautious
     * reading, since the output may source on one half-cycle and sink on the other.
     */
    public OpAmpParams typicalAtLoad(double loadAmps) {
        return typical.withSwing(swingLowVoltsAt(loadAmps), swingHighVoltsAt(loadAmps));
    }

    private double extraHeadroom(double loadAmps) {
        Require.finite(id, "loadAmps", loadAmps, "A");
        return spread.swingHeadroomVoltsPerAmp() * Math.abs(loadAmps);
    }
}
