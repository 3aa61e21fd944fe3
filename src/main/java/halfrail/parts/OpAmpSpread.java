package halfrail.parts;

/**
 * How far an op-amp archetype's input errors may stray from typical, and how its output
 * headroom grows with load current — data for tolerance and load checks.
 *
 * @param offsetVoltsMax           largest input offset voltage magnitude in V
 * @param biasAmpsMax              largest input bias current magnitude in A
 * @param offsetCurrentAmpsMax     largest input offset current magnitude in A
 * @param swingHeadroomVoltsPerAmp extra output headroom per ampere of load current, in V/A
 *                                 (0.1 V per mA is 100 V/A)
 */
public record OpAmpSpread(double offsetVoltsMax, double biasAmpsMax, double offsetCurrentAmpsMax,
                          double swingHeadroomVoltsPerAmp) {

    public OpAmpSpread {
        Require.nonNegative("op-amp spread", "offsetVoltsMax", offsetVoltsMax, "V");
        Require.nonNegative("op-amp spread", "biasAmpsMax", biasAmpsMax, "A");
        Require.nonNegative("op-amp spread", "offsetCurrentAmpsMax", offsetCurrentAmpsMax, "A");
        Require.nonNegative("op-amp spread", "swingHeadroomVoltsPerAmp", swingHeadroomVoltsPerAmp, "V/A");
    }
}
