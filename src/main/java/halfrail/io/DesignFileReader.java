package halfrail.io;

import com.fasterxml.jackson.databind.JsonNode;
import halfrail.circuit.CircuitException;
import halfrail.circuit.OpAmpParams;
import halfrail.design.AmplitudeUnit;
import halfrail.design.CapacitorSpec;
import halfrail.design.CellPack;
import halfrail.design.Design;
import halfrail.design.DesignException;
import halfrail.design.FixedRail;
import halfrail.design.Load;
import halfrail.design.OpAmpChoice;
import halfrail.design.Reference;
import halfrail.design.ReferenceKind;
import halfrail.design.SignalSource;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.design.Supply;
import halfrail.design.Thresholds;
import halfrail.design.UsbPort;
import halfrail.io.DesignFileException.Kind;
import halfrail.parts.CapacitorTechnology;
import halfrail.parts.CellChemistry;
import halfrail.parts.OpAmpArchetype;
import halfrail.parts.PartsLibrary;
import halfrail.units.ValueFormatException;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Supplier;

/**
 * Turns the JSON tree of a current-version design file into a {@link Design}, strictly: see
 * {@link FieldReader}. Part ids are checked against the built-in parts library; every value the
 * design model refuses becomes a {@link Kind#BAD_VALUE} naming its JSON path.
 */
final class DesignFileReader {
    /** First segments of the design model's own error paths that name the object being built. */
    private static final Set<String> MODEL_PREFIXES = Set.of("stage", "supply", "source", "reference", "load",
            "thresholds", "opAmp");

    private final PartsLibrary parts = PartsLibrary.builtIn();

    /** Reads the design from {@code root}, which is already migrated to the current version. */
    Design read(FieldReader root) {
        root.allowOnly(DesignFormat.TOP);
        String name = root.string("name");
        String description = root.string("description", "");
        Supply supply = supply(root.object("supply"));
        Reference reference = reference(root.object("reference"));
        List<JsonNode> stageNodes = root.array("stages");
        List<Stage> stages = new ArrayList<>();
        for (int i = 0; i < stageNodes.size(); i++) {
            stages.add(stage(FieldReader.of(stageNodes.get(i), root.pathOf("stages") + "[" + i + "]", root.context())));
        }
        SignalSource source = source(root.object("source"));
        Load load = load(root.object("load"));
        Thresholds thresholds = root.optionalObject("thresholds").map(this::thresholds).orElse(Thresholds.defaults());
        double ramp = root.quantity("powerOnRampSeconds", Quantity.SECONDS, Design.DEFAULT_POWER_ON_RAMP_SECONDS);
        return build(root, () -> new Design(name, description, supply, reference, stages, source, load, thresholds, ramp));
    }

    private Supply supply(FieldReader r) {
        String kind = r.choice("kind", DesignFormat.SUPPLY_KINDS);
        switch (kind) {
            case DesignFormat.CELLS -> {
                r.allowOnly(DesignFormat.CELLS_FIELDS);
                String chemistry = r.string("chemistry");
                if (parts.cellChemistry(chemistry).isEmpty()) {
                    throw unknownId(r, "chemistry", chemistry, "cell chemistry",
                            parts.cellChemistries().stream().map(CellChemistry::id).toList());
                }
                int cells = r.integer("cellsInSeries");
                return build(r, () -> new CellPack(chemistry, cells));
            }
            case DesignFormat.FIXED -> {
                r.allowOnly(DesignFormat.FIXED_FIELDS);
                double volts = r.quantity("volts", Quantity.VOLTS);
                double tolerance = r.quantity("tolerance", Quantity.FRACTION);
                double ripple = r.quantity("rippleVoltsPeak", Quantity.VOLTS, 0);
                double rippleHz = r.quantity("rippleHz", Quantity.HERTZ, 0);
                double ohms = r.quantity("sourceOhms", Quantity.OHMS, 0);
                return build(r, () -> new FixedRail(volts, tolerance, ripple, rippleHz, ohms));
            }
            default -> {
                r.allowOnly(DesignFormat.USB_FIELDS);
                double ripple = r.quantity("rippleVoltsPeak", Quantity.VOLTS, 0);
                double rippleHz = r.quantity("rippleHz", Quantity.HERTZ, 0);
                return build(r, () -> new UsbPort(ripple, rippleHz));
            }
        }
    }

    private Reference reference(FieldReader r) {
        r.allowOnly(DesignFormat.REFERENCE_FIELDS);
        ReferenceKind kind = DesignFormat.constant(DesignFormat.REFERENCE_KINDS,
                r.choice("kind", DesignFormat.spellings(DesignFormat.REFERENCE_KINDS, ReferenceKind.class)));
        double upper = r.quantity("upperOhms", Quantity.OHMS);
        double lower = r.quantity("lowerOhms", Quantity.OHMS);
        boolean decoupled = kind != ReferenceKind.DIVIDER_DIRECT;
        boolean buffered = kind == ReferenceKind.DIVIDER_BUFFERED;
        CapacitorSpec decoupling = decoupled ? capacitor(r.object("decoupling"))
                : r.optionalObject("decoupling").map(this::capacitor).orElse(null);
        double bias = decoupled ? r.quantity("biasOhms", Quantity.OHMS) : r.quantity("biasOhms", Quantity.OHMS, 0);
        OpAmpChoice buffer = buffered ? opAmp(r, "buffer")
                : r.has("buffer") ? opAmp(r, "buffer") : null;
        double isolation = buffered ? r.quantity("isolationOhms", Quantity.OHMS)
                : r.quantity("isolationOhms", Quantity.OHMS, 0);
        CapacitorSpec bufferDecoupling = buffered ? capacitor(r.object("bufferDecoupling"))
                : r.optionalObject("bufferDecoupling").map(this::capacitor).orElse(null);
        return build(r, () -> new Reference(kind, upper, lower, decoupling, bias, buffer, isolation, bufferDecoupling));
    }

    private Stage stage(FieldReader r) {
        r.allowOnly(DesignFormat.STAGE_FIELDS);
        String name = r.string("name");
        StageKind kind = DesignFormat.constant(DesignFormat.STAGE_KINDS,
                r.choice("kind", DesignFormat.spellings(DesignFormat.STAGE_KINDS, StageKind.class)));
        OpAmpChoice opAmp = opAmp(r, "opAmp");
        boolean resistors = kind != StageKind.FOLLOWER;
        double feedback = resistors ? r.quantity("feedbackOhms", Quantity.OHMS)
                : r.quantity("feedbackOhms", Quantity.OHMS, 0);
        double leg = resistors ? r.quantity("legOhms", Quantity.OHMS) : r.quantity("legOhms", Quantity.OHMS, 0);
        CapacitorSpec legCapacitor = r.optionalObject("legCapacitor").map(this::capacitor).orElse(null);
        CapacitorSpec inputCapacitor = r.optionalObject("inputCapacitor").map(this::capacitor).orElse(null);
        boolean biased = r.bool("biased", true);
        return build(r, () -> new Stage(name, kind, opAmp, feedback, leg, legCapacitor, inputCapacitor, biased));
    }

    private CapacitorSpec capacitor(FieldReader r) {
        r.allowOnly(DesignFormat.CAPACITOR_FIELDS);
        double farads = r.quantity("farads", Quantity.FARADS);
        String technology = r.string("technology");
        if (parts.capacitorTechnology(technology).isEmpty()) {
            throw unknownId(r, "technology", technology, "capacitor technology",
                    parts.capacitorTechnologies().stream().map(CapacitorTechnology::id).toList());
        }
        double rated = r.quantity("ratedVolts", Quantity.VOLTS);
        return build(r, () -> new CapacitorSpec(farads, technology, rated));
    }

    /** An op-amp: an archetype id as text, or an object of custom parameters. */
    private OpAmpChoice opAmp(FieldReader owner, String field) {
        JsonNode v = owner.required(field);
        String path = owner.pathOf(field);
        if (v.isTextual()) {
            String id = v.textValue();
            if (parts.opAmpArchetype(id).isEmpty()) {
                throw unknownId(owner, field, id, "op-amp archetype",
                        parts.opAmpArchetypes().stream().map(OpAmpArchetype::id).toList());
            }
            return OpAmpChoice.archetype(id);
        }
        if (!v.isObject()) {
            throw owner.context().error(Kind.WRONG_TYPE, path, "an op-amp archetype id or an object of parameters",
                    "expected an op-amp archetype id or an object of parameters, got " + FieldReader.describe(v));
        }
        FieldReader r = FieldReader.of(v, path, owner.context());
        r.allowOnly(DesignFormat.OPAMP_FIELDS.stream().map(Map.Entry::getKey).toList());
        double[] values = new double[DesignFormat.OPAMP_FIELDS.size()];
        for (int i = 0; i < values.length; i++) {
            Map.Entry<String, Quantity> f = DesignFormat.OPAMP_FIELDS.get(i);
            if (f.getKey().equals("supplyMinVolts")) {
                values[i] = r.quantity(f.getKey(), f.getValue(), 0);
            } else if (f.getKey().equals("supplyMaxVolts")) {
                values[i] = r.quantity(f.getKey(), f.getValue(), Double.POSITIVE_INFINITY);
            } else {
                values[i] = r.quantity(f.getKey(), f.getValue());
            }
        }
        OpAmpParams p = build(r, () -> new OpAmpParams(values[0], values[1], values[2], values[3], values[4],
                values[5], values[6], values[7], values[8], values[9], values[10], values[11], values[12], values[13]));
        return OpAmpChoice.custom(p);
    }

    private SignalSource source(FieldReader r) {
        r.allowOnly(DesignFormat.SOURCE_FIELDS);
        AmplitudeUnit unit = DesignFormat.constant(DesignFormat.AMPLITUDE_UNITS,
                r.choice("amplitudeUnit", DesignFormat.spellings(DesignFormat.AMPLITUDE_UNITS, AmplitudeUnit.class)));
        double amplitude = amplitude(r, unit);
        double ohms = r.quantity("sourceOhms", Quantity.OHMS, 0);
        double low = r.quantity("bandLowHz", Quantity.HERTZ);
        double high = r.quantity("bandHighHz", Quantity.HERTZ);
        return build(r, () -> new SignalSource(amplitude, unit, ohms, low, high));
    }

    /** A level in volts ("100 mV") or, for a dB unit, in dB ("-10 dBV", the suffix matching the unit). */
    private static double amplitude(FieldReader r, AmplitudeUnit unit) {
        if (unit == AmplitudeUnit.VOLTS_PEAK || unit == AmplitudeUnit.VOLTS_RMS) {
            return r.quantity("amplitude", Quantity.VOLTS);
        }
        JsonNode v = r.required("amplitude");
        String suffix = DesignFormat.spelling(DesignFormat.AMPLITUDE_UNITS, unit);
        String expected = "a level in " + suffix + " (a number, or text such as -10 " + suffix + ")";
        if (v.isTextual()) {
            String text = v.textValue().strip();
            if (text.endsWith(suffix)) {
                text = text.substring(0, text.length() - suffix.length());
            }
            double level;
            try {
                level = Quantity.DECIBELS.parse(text);
            } catch (ValueFormatException e) {
                throw r.context().error(Kind.BAD_VALUE, r.pathOf("amplitude"), expected,
                        "expected " + expected + ", got \"" + FieldReader.shorten(v.textValue()) + "\"");
            }
            if (!Double.isFinite(level)) {
                throw r.context().error(Kind.BAD_VALUE, r.pathOf("amplitude"), expected,
                        "expected " + expected + ", got a level beyond the range of a double");
            }
            return level;
        }
        return FieldReader.quantityValue(v, r.pathOf("amplitude"), Quantity.DECIBELS, r.context());
    }

    private Load load(FieldReader r) {
        r.allowOnly(DesignFormat.LOAD_FIELDS);
        double ohms = r.quantity("ohms", Quantity.OHMS);
        double farads = r.quantity("farads", Quantity.FARADS, 0);
        CapacitorSpec out = r.optionalObject("outputCapacitor").map(this::capacitor).orElse(null);
        return build(r, () -> new Load(ohms, farads, out));
    }

    private Thresholds thresholds(FieldReader r) {
        r.allowOnly(DesignFormat.THRESHOLD_FIELDS.stream().map(Map.Entry::getKey).toList());
        Thresholds d = Thresholds.defaults();
        double[] defaults = {d.settleBandFraction(), d.maxSettleSeconds(), d.minHeadroomDb(), d.offCentreDb(),
                d.nearRailFraction(), d.maxLeakageDriftVolts(), d.maxRippleVolts(), d.maxBiasShiftVolts(),
                d.maxStepVolts(), d.maxStageGain(), d.maxFeedbackOhms(), d.minRuntimeHours(),
                d.capacitorDeratingOverride()};
        double[] v = new double[defaults.length];
        for (int i = 0; i < v.length; i++) {
            Map.Entry<String, Quantity> f = DesignFormat.THRESHOLD_FIELDS.get(i);
            v[i] = r.quantity(f.getKey(), f.getValue(), defaults[i]);
        }
        return build(r, () -> new Thresholds(v[0], v[1], v[2], v[3], v[4], v[5], v[6], v[7], v[8], v[9], v[10],
                v[11], v[12]));
    }

    private static DesignFileException unknownId(FieldReader r, String field, String id, String what, List<String> known) {
        String expected = "a " + what + " id: one of " + String.join(", ", known);
        return r.context().error(Kind.BAD_VALUE, r.pathOf(field), expected,
                "unknown " + what + " '" + FieldReader.shorten(id) + "'; expected " + expected);
    }

    /** Runs a model constructor, turning what the model refuses into a BAD_VALUE at the right JSON path. */
    private static <T> T build(FieldReader r, Supplier<T> constructor) {
        try {
            return constructor.get();
        } catch (DesignException e) {
            throw r.context().error(Kind.BAD_VALUE, jsonPath(r.path(), e.path()), "", e.getMessage());
        } catch (CircuitException e) {
            String at = e.field().isEmpty() ? r.path() : FieldReader.child(r.path(), e.field());
            throw r.context().error(Kind.BAD_VALUE, at, "", e.getMessage());
        }
    }

    /** The JSON path of a design-model error path reported while building the object at {@code objectPath}. */
    static String jsonPath(String objectPath, String modelPath) {
        int dot = modelPath.indexOf('.');
        String first = dot < 0 ? modelPath : modelPath.substring(0, dot);
        if (MODEL_PREFIXES.contains(first)) {
            return dot < 0 ? objectPath : objectPath + "." + modelPath.substring(dot + 1);
        }
        return modelPath.isEmpty() ? objectPath : objectPath + "." + modelPath;
    }
}
