package halfrail.design;

/**
 * The mid-rail reference network, shared by every stage.
 *
 * @param kind           how the reference reaches the stages
 * @param upperOhms      divider resistor from the supply to the mid point, Ω
 * @param lowerOhms      divider resistor from the mid point to ground, Ω
 * @param decoupling     capacitor from the mid point to ground; null only for {@link ReferenceKind#DIVIDER_DIRECT}
 * @param biasOhms       resistor from the reference to each stage's non-inverting input, Ω;
 *                       unused for {@link ReferenceKind#DIVIDER_DIRECT}
 * @param buffer         the buffer op-amp; null unless {@link ReferenceKind#DIVIDER_BUFFERED}
 * @param isolationOhms  resistor between the buffer's output and its decoupling capacitor, Ω (buffered only)
 * @param bufferDecoupling capacitor after the isolation resistor (buffered only)
 */
public record Reference(ReferenceKind kind, double upperOhms, double lowerOhms, CapacitorSpec decoupling,
                        double biasOhms, OpAmpChoice buffer, double isolationOhms,
                        CapacitorSpec bufferDecoupling) {

    public Reference {
        DesignException.RULES.required("reference.kind", kind);
        DesignException.RULES.positive("reference.upperOhms", upperOhms, "Ω");
        DesignException.RULES.positive("reference.lowerOhms", lowerOhms, "Ω");
        if (kind != ReferenceKind.DIVIDER_DIRECT) {
            DesignException.RULES.required("reference.decoupling", decoupling);
            DesignException.RULES.positive("reference.biasOhms", biasOhms, "Ω");
        }
        if (kind == ReferenceKind.DIVIDER_BUFFERED) {
            DesignException.RULES.required("reference.buffer", buffer);
            DesignException.RULES.positive("reference.isolationOhms", isolationOhms, "Ω");
            DesignException.RULES.required("reference.bufferDecoupling", bufferDecoupling);
        }
    }

    /** A divider straight into the first stage's input, with no decoupling. */
    public static Reference direct(double upperOhms, double lowerOhms) {
        return new Reference(ReferenceKind.DIVIDER_DIRECT, upperOhms, lowerOhms, null, 0, null, 0, null);
    }

    /** A decoupled divider feeding the stages through bias resistors. */
    public static Reference decoupled(double upperOhms, double lowerOhms, CapacitorSpec decoupling, double biasOhms) {
        return new Reference(ReferenceKind.DIVIDER_DECOUPLED, upperOhms, lowerOhms, decoupling, biasOhms, null, 0, null);
    }

    /** A decoupled divider, buffered, isolated and decoupled again, feeding stages through bias resistors. */
    public static Reference buffered(double upperOhms, double lowerOhms, CapacitorSpec decoupling, double biasOhms,
                                     OpAmpChoice buffer, double isolationOhms, CapacitorSpec bufferDecoupling) {
        return new Reference(ReferenceKind.DIVIDER_BUFFERED, upperOhms, lowerOhms, decoupling, biasOhms, buffer,
                isolationOhms, bufferDecoupling);
    }

    /** Thevenin resistance of the divider, Ra‖Rb, Ω. */
    public double theveninOhms() {
        return upperOhms * lowerOhms / (upperOhms + lowerOhms);
    }

    public Reference withDivider(double upper, double lower) {
        return new Reference(kind, upper, lower, decoupling, biasOhms, buffer, isolationOhms, bufferDecoupling);
    }
}
