package halfrail.design;

/**
 * What drives the first stage.
 *
 * @param amplitude   the nominal signal level, in {@code unit}
 * @param unit        how the level is stated
 * @param sourceOhms  the source's output resistance, Ω (0 for an ideal source)
 * @param bandLowHz   lowest frequency of interest, Hz
 * @param bandHighHz  highest frequency of interest, Hz
 */
public record SignalSource(double amplitude, AmplitudeUnit unit, double sourceOhms, double bandLowHz,
                           double bandHighHz) {
    public SignalSource {
        if (!Double.isFinite(amplitude)) {
            throw new DesignException("source.amplitude", "must be a finite number, got " + amplitude);
        }
        DesignException.RULES.required("source.unit", unit);
        if (unit.toVoltsPeak(amplitude) <= 0) {
            throw new DesignException("source.amplitude", "must give a positive peak voltage, got " + amplitude + " " + unit);
        }
        DesignException.RULES.nonNegative("source.sourceOhms", sourceOhms, "Ω");
        DesignException.RULES.positive("source.bandLowHz", bandLowHz, "Hz");
        DesignException.RULES.positive("source.bandHighHz", bandHighHz, "Hz");
        if (bandHighHz <= bandLowHz) {
            throw new DesignException("source.bandHighHz", "must lie above bandLowHz (" + bandLowHz + " Hz)");
        }
    }

    /** The nominal level as a sine's peak voltage, V. */
    public double voltsPeak() {
        return unit.toVoltsPeak(amplitude);
    }
}
