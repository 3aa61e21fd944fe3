package halfrail.convert;

import halfrail.design.OpAmpChoice;
import halfrail.design.StageKind;

/**
 * One stage of the dual-rail original, as drawn for plus and minus supplies: DC-coupled, its
 * non-inverting input (or, for an inverting stage, its reference) at 0 V.
 *
 * @param name   a short label, unique in the chain
 * @param kind   non-inverting, inverting or follower
 * @param r1Ohms R1, Ω: from − to ground (non-inverting) or from the input to − (inverting); unused by a follower
 * @param r2Ohms R2, the feedback resistor from the output to −, Ω; unused by a follower
 * @param opAmp  the op-amp: an archetype id or custom parameters
 */
public record DualRailStage(String name, StageKind kind, double r1Ohms, double r2Ohms, OpAmpChoice opAmp) {
    public DualRailStage {
        if (name == null || name.isBlank()) {
            throw new ConversionException("name", "is required");
        }
        ConversionException.RULES.required("kind", kind);
        ConversionException.RULES.required("opAmp", opAmp);
        if (kind != StageKind.FOLLOWER) {
            ConversionException.RULES.positive("r1Ohms", r1Ohms, "Ω");
            ConversionException.RULES.positive("r2Ohms", r2Ohms, "Ω");
        }
    }

    /** Signal gain from the resistor values alone, V/V (negative for an inverting stage). */
    public double gain() {
        return switch (kind) {
            case NON_INVERTING -> 1 + r2Ohms / r1Ohms;
            case INVERTING -> -r2Ohms / r1Ohms;
            case FOLLOWER -> 1;
        };
    }

    /** Noise gain 1 + R2/R1 (1 for a follower), V/V: what the op-amp's gain-bandwidth is divided by. */
    public double noiseGain() {
        return kind == StageKind.FOLLOWER ? 1 : 1 + r2Ohms / r1Ohms;
    }
}
