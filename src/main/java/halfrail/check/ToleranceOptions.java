package halfrail.check;

import halfrail.parts.OpAmpSpread;

import java.util.Map;

/**
 * The tolerances a worst-case or Monte Carlo study applies on top of what the parts library
 * says. Capacitor tolerance comes from each part's technology ({@code typicalTolerance}), the
 * op-amps' input-error spread from their archetype ({@link OpAmpSpread}), leakage between each
 * technology's typical value and its standard's limit.
 *
 * @param resistorTolerance          relative tolerance of every resistor of the design, a fraction
 *                                   (0.01 = ±1 %), from 0 up to, not including, 1
 * @param resistorTempcoPpmPerKelvin largest temperature coefficient of a resistor, ppm/K, not negative;
 *                                   each resistor's own coefficient lies anywhere within ±this
 * @param minTemperatureCelsius      lowest operating temperature, °C
 * @param maxTemperatureCelsius      highest operating temperature, °C (the whole board sits at one temperature)
 * @param opAmpInputErrors           whether offset voltage, bias current and offset current vary
 * @param capacitorLeakage           whether capacitor leakage varies between typical and limit
 * @param customOpAmpSpreads         input-error spread of custom op-amps, by design path (for
 *                                   example {@code stages[0].opAmp} or {@code reference.buffer});
 *                                   a custom op-amp not listed has no spread
 */
public record ToleranceOptions(double resistorTolerance, double resistorTempcoPpmPerKelvin,
                               double minTemperatureCelsius, double maxTemperatureCelsius,
                               boolean opAmpInputErrors, boolean capacitorLeakage,
                               Map<String, OpAmpSpread> customOpAmpSpreads) {
    /** Resistor tolerance when none is given: ±1 % (common practice: metal-film resistors). */
    public static final double DEFAULT_RESISTOR_TOLERANCE = 0.01;
    /** Resistor temperature coefficient when none is given: ±100 ppm/K (common practice: metal film 50–100 ppm/K). */
    public static final double DEFAULT_TEMPCO_PPM_PER_KELVIN = 100;
    /** Lowest operating temperature when none is given: 0 °C (common practice for indoor equipment). */
    public static final double DEFAULT_MIN_CELSIUS = 0;
    /** Highest operating temperature when none is given: 50 °C (common practice for indoor equipment). */
    public static final double DEFAULT_MAX_CELSIUS = 50;
    /** The temperature at which resistor values are specified, °C (common practice: 25 °C). */
    public static final double REFERENCE_CELSIUS = 25;
    /** Coldest temperature accepted, °C (absolute zero). */
    public static final double ABSOLUTE_ZERO_CELSIUS = -273.15;

    public ToleranceOptions {
        StudyOptionsException.RULES.tolerance("tolerance.resistorTolerance", resistorTolerance);
        StudyOptionsException.RULES.nonNegative("tolerance.resistorTempcoPpmPerKelvin", resistorTempcoPpmPerKelvin, "ppm/K");
        StudyOptionsException.RULES.finite("tolerance.minTemperatureCelsius", minTemperatureCelsius, "°C");
        StudyOptionsException.RULES.finite("tolerance.maxTemperatureCelsius", maxTemperatureCelsius, "°C");
        if (minTemperatureCelsius < ABSOLUTE_ZERO_CELSIUS) {
            throw new StudyOptionsException("tolerance.minTemperatureCelsius",
                    "must not lie below absolute zero, got " + minTemperatureCelsius + " °C");
        }
        if (maxTemperatureCelsius < minTemperatureCelsius) {
            throw new StudyOptionsException("tolerance.maxTemperatureCelsius",
                    "must be at least minTemperatureCelsius (" + minTemperatureCelsius + " °C), got "
                            + maxTemperatureCelsius + " °C");
        }
        StudyOptionsException.RULES.required("tolerance.customOpAmpSpreads", customOpAmpSpreads);
        customOpAmpSpreads = Map.copyOf(customOpAmpSpreads);
        // A relative drift above 100 % would make a resistance negative.
        double drift = resistorTempcoPpmPerKelvin * 1e-6 * Math.max(Math.abs(minTemperatureCelsius - REFERENCE_CELSIUS),
                Math.abs(maxTemperatureCelsius - REFERENCE_CELSIUS));
        if (drift >= 1) {
            throw new StudyOptionsException("tolerance.resistorTempcoPpmPerKelvin",
                    "over the temperature range it would change a resistance by " + 100 * drift + " %, 100 % or more");
        }
    }

    /** ±1 %, ±100 ppm/K over 0–50 °C, op-amp input errors and leakage varying, no custom spreads. */
    public static ToleranceOptions defaults() {
        return new ToleranceOptions(DEFAULT_RESISTOR_TOLERANCE, DEFAULT_TEMPCO_PPM_PER_KELVIN, DEFAULT_MIN_CELSIUS,
                DEFAULT_MAX_CELSIUS, true, true, Map.of());
    }

    /** Resistor tolerance only (no temperature drift, op-amp spread or leakage variation): for divider checks. */
    public static ToleranceOptions resistorsOnly(double tolerance) {
        return new ToleranceOptions(tolerance, 0, REFERENCE_CELSIUS, REFERENCE_CELSIUS, false, false, Map.of());
    }

    public ToleranceOptions withResistorTolerance(double t) {
        return new ToleranceOptions(t, resistorTempcoPpmPerKelvin, minTemperatureCelsius, maxTemperatureCelsius,
                opAmpInputErrors, capacitorLeakage, customOpAmpSpreads);
    }

    public ToleranceOptions withTempco(double ppmPerKelvin, double minCelsius, double maxCelsius) {
        return new ToleranceOptions(resistorTolerance, ppmPerKelvin, minCelsius, maxCelsius, opAmpInputErrors,
                capacitorLeakage, customOpAmpSpreads);
    }

    public ToleranceOptions withOpAmpInputErrors(boolean vary) {
        return new ToleranceOptions(resistorTolerance, resistorTempcoPpmPerKelvin, minTemperatureCelsius,
                maxTemperatureCelsius, vary, capacitorLeakage, customOpAmpSpreads);
    }

    public ToleranceOptions withCapacitorLeakage(boolean vary) {
        return new ToleranceOptions(resistorTolerance, resistorTempcoPpmPerKelvin, minTemperatureCelsius,
                maxTemperatureCelsius, opAmpInputErrors, vary, customOpAmpSpreads);
    }

    public ToleranceOptions withCustomOpAmpSpreads(Map<String, OpAmpSpread> spreads) {
        return new ToleranceOptions(resistorTolerance, resistorTempcoPpmPerKelvin, minTemperatureCelsius,
                maxTemperatureCelsius, opAmpInputErrors, capacitorLeakage, spreads);
    }
}
