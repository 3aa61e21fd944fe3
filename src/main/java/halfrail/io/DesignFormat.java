package halfrail.io;

import halfrail.design.AmplitudeUnit;
import halfrail.design.ReferenceKind;
import halfrail.design.StageKind;

import java.util.List;
import java.util.Map;

/**
 * The names of the design-file format (docs/design-format.md), shared by the reader and the
 * writer so the two cannot drift apart.
 */
final class DesignFormat {
    private DesignFormat() {}

    static final List<String> TOP = List.of("format", "formatVersion", "name", "description", "supply", "reference",
            "stages", "source", "load", "thresholds", "powerOnRampSeconds");

    static final String CELLS = "cells";
    static final String FIXED = "fixed";
    static final String USB = "usb";
    static final List<String> SUPPLY_KINDS = List.of(CELLS, FIXED, USB);
    static final List<String> CELLS_FIELDS = List.of("kind", "chemistry", "cellsInSeries");
    static final List<String> FIXED_FIELDS = List.of("kind", "volts", "tolerance", "rippleVoltsPeak", "rippleHz",
            "sourceOhms");
    static final List<String> USB_FIELDS = List.of("kind", "rippleVoltsPeak", "rippleHz");

    static final List<String> REFERENCE_FIELDS = List.of("kind", "upperOhms", "lowerOhms", "decoupling", "biasOhms",
            "buffer", "isolationOhms", "bufferDecoupling");
    static final Map<ReferenceKind, String> REFERENCE_KINDS = Map.of(
            ReferenceKind.DIVIDER_DIRECT, "direct",
            ReferenceKind.DIVIDER_DECOUPLED, "decoupled",
            ReferenceKind.DIVIDER_BUFFERED, "buffered");

    static final List<String> STAGE_FIELDS = List.of("name", "kind", "opAmp", "feedbackOhms", "legOhms",
            "legCapacitor", "inputCapacitor", "biased");
    static final Map<StageKind, String> STAGE_KINDS = Map.of(
            StageKind.NON_INVERTING, "non-inverting",
            StageKind.INVERTING, "inverting",
            StageKind.FOLLOWER, "follower");

    static final List<String> CAPACITOR_FIELDS = List.of("farads", "technology", "ratedVolts");

    /** Custom op-amp parameters in file order, with their kinds; the last two are optional. */
    static final List<Map.Entry<String, Quantity>> OPAMP_FIELDS = List.of(
            Map.entry("openLoopGain", Quantity.GAIN),
            Map.entry("gainBandwidthHz", Quantity.HERTZ),
            Map.entry("slewRateVoltsPerSecond", Quantity.SLEW),
            Map.entry("offsetVolts", Quantity.VOLTS),
            Map.entry("biasAmps", Quantity.AMPS),
            Map.entry("offsetCurrentAmps", Quantity.AMPS),
            Map.entry("commonModeLowVolts", Quantity.VOLTS),
            Map.entry("commonModeHighVolts", Quantity.VOLTS),
            Map.entry("swingLowVolts", Quantity.VOLTS),
            Map.entry("swingHighVolts", Quantity.VOLTS),
            Map.entry("outputOhms", Quantity.OHMS),
            Map.entry("quiescentAmps", Quantity.AMPS),
            Map.entry("supplyMinVolts", Quantity.VOLTS),
            Map.entry("supplyMaxVolts", Quantity.VOLTS));

    static final List<String> SOURCE_FIELDS = List.of("amplitude", "amplitudeUnit", "sourceOhms", "bandLowHz",
            "bandHighHz");
    static final Map<AmplitudeUnit, String> AMPLITUDE_UNITS = Map.of(
            AmplitudeUnit.VOLTS_PEAK, "V-peak",
            AmplitudeUnit.VOLTS_RMS, "V-rms",
            AmplitudeUnit.DBU, "dBu",
            AmplitudeUnit.DBV, "dBV");

    static final List<String> LOAD_FIELDS = List.of("ohms", "farads", "outputCapacitor");

    /** Thresholds in file order (the record's order), with their kinds; every one is optional. */
    static final List<Map.Entry<String, Quantity>> THRESHOLD_FIELDS = List.of(
            Map.entry("settleBandFraction", Quantity.FRACTION),
            Map.entry("maxSettleSeconds", Quantity.SECONDS),
            Map.entry("minHeadroomDb", Quantity.DECIBELS),
            Map.entry("offCentreDb", Quantity.DECIBELS),
            Map.entry("nearRailFraction", Quantity.FRACTION),
            Map.entry("maxLeakageDriftVolts", Quantity.VOLTS),
            Map.entry("maxRippleVolts", Quantity.VOLTS),
            Map.entry("maxBiasShiftVolts", Quantity.VOLTS),
            Map.entry("maxStepVolts", Quantity.VOLTS),
            Map.entry("maxStageGain", Quantity.GAIN),
            Map.entry("maxFeedbackOhms", Quantity.OHMS),
            Map.entry("minRuntimeHours", Quantity.HOURS),
            Map.entry("capacitorDeratingOverride", Quantity.FRACTION));

    /** The file spelling of an enum constant. */
    static <E extends Enum<E>> String spelling(Map<E, String> spellings, E value) {
        return spellings.get(value);
    }

    /** The spellings of an enum's constants, in declaration order. */
    static <E extends Enum<E>> List<String> spellings(Map<E, String> spellings, Class<E> type) {
        return java.util.Arrays.stream(type.getEnumConstants()).map(spellings::get).toList();
    }

    /** The enum constant a file spelling names (the spelling must be one of {@link #spellings}). */
    static <E extends Enum<E>> E constant(Map<E, String> spellings, String spelling) {
        return spellings.entrySet().stream().filter(e -> e.getValue().equals(spelling)).findFirst().orElseThrow().getKey();
    }
}
