package halfrail.convert;

import halfrail.design.Supply;
import halfrail.design.SignalSource;

/**
 * What to convert and to what.
 *
 * @param name       a title for the converted design
 * @param original   the dual-rail original
 * @param supply     the new single supply (cells of a chemistry, a USB port or a fixed rail)
 * @param signal     the nominal signal and its source; its band ({@code bandLowHz} to
 *                   {@code bandHighHz}, Hz) is the band of interest the conversion must pass
 * @param loadOhms   the load's resistance to ground, Ω
 * @param loadFarads the load's capacitance to ground, F (0 for none)
 * @param limits     optional limits: settle-up time, supply current, runtime
 */
public record ConversionRequest(String name, DualRailChain original, Supply supply, SignalSource signal,
                                double loadOhms, double loadFarads, ConversionLimits limits) {
    public ConversionRequest {
        name = name == null || name.isBlank() ? "Converted design" : name;
        ConversionException.RULES.required("original", original);
        ConversionException.RULES.required("supply", supply);
        ConversionException.RULES.required("signal", signal);
        ConversionException.RULES.positive("load.ohms", loadOhms, "Ω");
        ConversionException.RULES.nonNegative("load.farads", loadFarads, "F");
        limits = limits == null ? ConversionLimits.none() : limits;
        if (limits.minRuntimeHours().isPresent() && supply.capacityAmpHours().isEmpty()) {
            throw new ConversionException("limits.minRuntimeHours",
                    "a runtime limit needs a supply with a capacity (cells), not " + supply.getClass().getSimpleName());
        }
    }

    public ConversionRequest withLimits(ConversionLimits l) {
        return new ConversionRequest(name, original, supply, signal, loadOhms, loadFarads, l);
    }

    public ConversionRequest withSignal(SignalSource s) {
        return new ConversionRequest(name, original, supply, s, loadOhms, loadFarads, limits);
    }
}
