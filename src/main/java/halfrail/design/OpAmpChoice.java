package halfrail.design;

import halfrail.circuit.OpAmpParams;

import java.util.Optional;

/**
 * Which op-amp a stage uses: an archetype from the parts library by id, or a custom part
 * described by its own parameters (from a data sheet).
 *
 * @param archetype id of an archetype, or null for a custom part
 * @param custom    the custom part's parameters, or null for an archetype
 */
public record OpAmpChoice(String archetype, OpAmpParams custom) {
    public OpAmpChoice {
        if ((archetype == null) == (custom == null)) {
            throw new DesignException("opAmp", "give either an archetype id or custom parameters, not both or neither");
        }
    }

    public static OpAmpChoice archetype(String id) {
        return new OpAmpChoice(id, null);
    }

    public static OpAmpChoice custom(OpAmpParams params) {
        return new OpAmpChoice(null, params);
    }

    public Optional<String> archetypeId() {
        return Optional.ofNullable(archetype);
    }

    public Optional<OpAmpParams> customParams() {
        return Optional.ofNullable(custom);
    }
}
