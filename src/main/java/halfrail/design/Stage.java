package halfrail.design;

/**
 * One op-amp stage of the chain.
 *
 * @param name          a short label of the designer's, unique in the design (for example {@code "pre"})
 * @param kind          the stage's topology
 * @param opAmp         the op-amp it uses
 * @param feedbackOhms  R2, from the output to the inverting input, Ω (unused by a follower)
 * @param legOhms       R1, Ω: for a non-inverting stage from − towards ground (through the
 *                      leg capacitor); for an inverting stage from the input to − (unused by a follower)
 * @param legCapacitor  the blocking capacitor in series with R1 of a non-inverting stage; null
 *                      leaves the leg DC-coupled to ground (the stage then amplifies its own bias);
 *                      unused by other kinds
 * @param inputCapacitor coupling capacitor at the stage's input; null for DC coupling from the
 *                      previous stage (or the source)
 * @param biased        whether the stage's non-inverting input gets its bias resistor from the
 *                      reference when its input is AC-coupled; false models a forgotten bias
 *                      resistor (the input then has no DC path — a fault the checks report)
 */
public record Stage(String name, StageKind kind, OpAmpChoice opAmp, double feedbackOhms, double legOhms,
                    CapacitorSpec legCapacitor, CapacitorSpec inputCapacitor, boolean biased) {

    /** A stage with its bias resistor in place. */
    public Stage(String name, StageKind kind, OpAmpChoice opAmp, double feedbackOhms, double legOhms,
                 CapacitorSpec legCapacitor, CapacitorSpec inputCapacitor) {
        this(name, kind, opAmp, feedbackOhms, legOhms, legCapacitor, inputCapacitor, true);
    }

    public Stage {
        if (name == null || name.isBlank()) {
            throw new DesignException("stage.name", "is required");
        }
        DesignException.RULES.required("stage.kind", kind);
        DesignException.RULES.required("stage.opAmp", opAmp);
        if (kind != StageKind.FOLLOWER) {
            DesignException.RULES.positive("stage.feedbackOhms", feedbackOhms, "Ω");
            DesignException.RULES.positive("stage.legOhms", legOhms, "Ω");
        }
    }

    /** Signal gain in the band, V/V (negative for an inverting stage), from the resistor values alone. */
    public double nominalGain() {
        return switch (kind) {
            case NON_INVERTING -> 1 + feedbackOhms / legOhms;
            case INVERTING -> -feedbackOhms / legOhms;
            case FOLLOWER -> 1;
        };
    }

    public Stage withFeedbackOhms(double r2) {
        return new Stage(name, kind, opAmp, r2, legOhms, legCapacitor, inputCapacitor, biased);
    }

    public Stage withLegOhms(double r1) {
        return new Stage(name, kind, opAmp, feedbackOhms, r1, legCapacitor, inputCapacitor, biased);
    }

    public Stage withLegCapacitor(CapacitorSpec c) {
        return new Stage(name, kind, opAmp, feedbackOhms, legOhms, c, inputCapacitor, biased);
    }

    public Stage withInputCapacitor(CapacitorSpec c) {
        return new Stage(name, kind, opAmp, feedbackOhms, legOhms, legCapacitor, c, biased);
    }

    public Stage withBiased(boolean b) {
        return new Stage(name, kind, opAmp, feedbackOhms, legOhms, legCapacitor, inputCapacitor, b);
    }

    public Stage withOpAmp(OpAmpChoice o) {
        return new Stage(name, kind, o, feedbackOhms, legOhms, legCapacitor, inputCapacitor, biased);
    }
}
