package halfrail.convert;

import com.fasterxml.jackson.core.JacksonException;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.json.JsonMapper;
import halfrail.circuit.CircuitException;
import halfrail.circuit.OpAmpParams;
import halfrail.design.AmplitudeUnit;
import halfrail.design.CellPack;
import halfrail.design.DesignException;
import halfrail.design.FixedRail;
import halfrail.design.OpAmpChoice;
import halfrail.design.SignalSource;
import halfrail.design.StageKind;
import halfrail.design.Supply;
import halfrail.design.UsbPort;
import halfrail.units.EngineeringValue;
import halfrail.units.Unit;
import halfrail.units.ValueFormatException;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import java.util.Set;

/**
 * Reads conversion requests from JSON files of Halfrail's own format {@value #FORMAT_NAME}
 * (docs/convert-format.md), strictly: unknown and duplicate fields, wrong types, missing
 * required fields and {@code null} are refused, and every error names its JSON path
 * (for example {@code original.stages[0].r2Ohms}).
 */
public final class ConversionFiles {
    /** The {@code format} field's value. */
    public static final String FORMAT_NAME = "halfrail-conversion";
    /** The format version this reader reads. */
    public static final int FORMAT_VERSION = 1;
    /** Largest file accepted, bytes. */
    public static final int MAX_FILE_BYTES = 1 << 20;

    private static final JsonMapper MAPPER = JsonMapper.builder()
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION).build();

    private ConversionFiles() {}

    /**
     * Read the request in {@code file}.
     *
     * @throws ConversionException naming the JSON path (empty for the file as a whole)
     */
    public static ConversionRequest read(Path file) {
        byte[] bytes;
        try {
            if (Files.size(file) > MAX_FILE_BYTES) {
                throw new ConversionException("", "the file is larger than " + MAX_FILE_BYTES + " bytes");
            }
            bytes = Files.readAllBytes(file);
        } catch (IOException | SecurityException e) {
            throw new ConversionException("", "cannot read the file (" + e.getClass().getSimpleName() + ")");
        }
        return read(new String(bytes, StandardCharsets.UTF_8));
    }

    /**
     * Read a request from JSON text.
     *
     * @throws ConversionException naming the JSON path
     */
    public static ConversionRequest read(String json) {
        if (json == null || json.length() > MAX_FILE_BYTES) {
            throw new ConversionException("", json == null ? "no text" : "the text is too large");
        }
        JsonNode root;
        try {
            root = MAPPER.readTree(json);
        } catch (JacksonException e) {
            String msg = e.getOriginalMessage() == null ? "" : e.getOriginalMessage().replaceAll("[\\r\\n]+", " ");
            throw new ConversionException("", "not valid JSON: " + (msg.length() > 120 ? msg.substring(0, 120) + "…" : msg));
        }
        if (root == null || !root.isObject()) {
            throw new ConversionException("", "expected a JSON object");
        }
        return new Reader().request(root);
    }

    private static final class Reader {
        ConversionRequest request(JsonNode root) {
            fields(root, "", Set.of("format", "formatVersion", "name", "original", "supply", "band", "signal", "load",
                    "limits"));
            String format = text(root, "", "format", true);
            if (!FORMAT_NAME.equals(format)) {
                throw new ConversionException("format", "must be \"" + FORMAT_NAME + "\", got \"" + format + "\"");
            }
            int version = whole(root, "", "formatVersion");
            if (version != FORMAT_VERSION) {
                throw new ConversionException("formatVersion", "this reader reads version " + FORMAT_VERSION
                        + ", got " + version);
            }
            String name = root.has("name") ? text(root, "", "name", true) : "";
            DualRailChain original = original(object(root, "", "original"));
            Supply supply = supply(object(root, "", "supply"));
            JsonNode band = object(root, "", "band");
            fields(band, "band", Set.of("lowHz", "highHz"));
            double low = quantity(band, "band", "lowHz", Unit.HERTZ, true);
            double high = quantity(band, "band", "highHz", Unit.HERTZ, true);
            JsonNode sig = object(root, "", "signal");
            fields(sig, "signal", Set.of("amplitude", "amplitudeUnit", "sourceOhms"));
            AmplitudeUnit unit = amplitudeUnit(text(sig, "signal", "amplitudeUnit", true));
            double amplitude = amplitude(sig, unit);
            double rs = sig.has("sourceOhms") ? quantity(sig, "signal", "sourceOhms", Unit.OHM, true) : 0;
            SignalSource source;
            try {
                source = new SignalSource(amplitude, unit, rs, low, high);
            } catch (DesignException e) {
                throw new ConversionException(sourcePath(e.path()), afterPath(e));
            }
            JsonNode load = object(root, "", "load");
            fields(load, "load", Set.of("ohms", "farads"));
            double ohms = quantity(load, "load", "ohms", Unit.OHM, true);
            double farads = load.has("farads") ? quantity(load, "load", "farads", Unit.FARAD, true) : 0;
            ConversionLimits limits = root.has("limits") ? limits(object(root, "", "limits")) : ConversionLimits.none();
            return new ConversionRequest(name, original, supply, source, ohms, farads, limits);
        }

        private static String sourcePath(String designPath) {
            return switch (designPath) {
                case "source.bandLowHz" -> "band.lowHz";
                case "source.bandHighHz" -> "band.highHz";
                default -> designPath.replace("source.", "signal.");
            };
        }

        private DualRailChain original(JsonNode o) {
            fields(o, "original", Set.of("positiveVolts", "negativeVolts", "stages"));
            double pos = quantity(o, "original", "positiveVolts", Unit.VOLT, true);
            double neg = quantity(o, "original", "negativeVolts", Unit.VOLT, true);
            JsonNode arr = present(o, "original", "stages");
            if (!arr.isArray()) {
                throw new ConversionException("original.stages", "expected an array of stages, got " + kind(arr));
            }
            if (arr.size() > DualRailChain.MAX_STAGES) {
                throw new ConversionException("original.stages", "at most " + DualRailChain.MAX_STAGES
                        + " stages, got " + arr.size());
            }
            List<DualRailStage> stages = new ArrayList<>();
            for (int i = 0; i < arr.size(); i++) {
                String path = "original.stages[" + i + "]";
                JsonNode s = arr.get(i);
                if (!s.isObject()) {
                    throw new ConversionException(path, "expected an object, got " + kind(s));
                }
                fields(s, path, Set.of("name", "kind", "r1Ohms", "r2Ohms", "opAmp"));
                String name = text(s, path, "name", true);
                StageKind kind = switch (text(s, path, "kind", true)) {
                    case "non-inverting" -> StageKind.NON_INVERTING;
                    case "inverting" -> StageKind.INVERTING;
                    case "follower" -> StageKind.FOLLOWER;
                    default -> throw new ConversionException(path + ".kind",
                            "must be \"non-inverting\", \"inverting\" or \"follower\"");
                };
                boolean needsR = kind != StageKind.FOLLOWER;
                double r1 = s.has("r1Ohms") || needsR ? quantity(s, path, "r1Ohms", Unit.OHM, true) : 0;
                double r2 = s.has("r2Ohms") || needsR ? quantity(s, path, "r2Ohms", Unit.OHM, true) : 0;
                OpAmpChoice op = opAmp(present(s, path, "opAmp"), path + ".opAmp");
                try {
                    stages.add(new DualRailStage(name, kind, r1, r2, op));
                } catch (ConversionException e) {
                    throw new ConversionException(path + "." + e.path(), afterPath(e));
                }
            }
            return new DualRailChain(stages, pos, neg);
        }

        private OpAmpChoice opAmp(JsonNode v, String path) {
            if (v.isTextual()) {
                String id = v.asText();
                if (halfrail.parts.PartsLibrary.builtIn().opAmpArchetype(id).isEmpty()) {
                    throw new ConversionException(path, "unknown op-amp archetype \"" + id + "\"; known: "
                            + halfrail.parts.PartsLibrary.builtIn().opAmpArchetypes().stream()
                            .map(halfrail.parts.OpAmpArchetype::id).toList());
                }
                return OpAmpChoice.archetype(id);
            }
            if (!v.isObject()) {
                throw new ConversionException(path, "expected an archetype id or an object of parameters, got " + kind(v));
            }
            List<String> names = List.of("openLoopGain", "gainBandwidthHz", "slewRateVoltsPerSecond", "offsetVolts",
                    "biasAmps", "offsetCurrentAmps", "commonModeLowVolts", "commonModeHighVolts", "swingLowVolts",
                    "swingHighVolts", "outputOhms", "quiescentAmps", "supplyMinVolts", "supplyMaxVolts");
            fields(v, path, Set.copyOf(names));
            Unit[] units = {Unit.NONE, Unit.HERTZ, Unit.NONE, Unit.VOLT, Unit.AMPERE, Unit.AMPERE, Unit.VOLT, Unit.VOLT,
                    Unit.VOLT, Unit.VOLT, Unit.OHM, Unit.AMPERE, Unit.VOLT, Unit.VOLT};
            double[] x = new double[names.size()];
            for (int i = 0; i < names.size(); i++) {
                String n = names.get(i);
                boolean optional = n.equals("supplyMinVolts") || n.equals("supplyMaxVolts");
                if (optional && !v.has(n)) {
                    x[i] = n.equals("supplyMinVolts") ? 0 : Double.POSITIVE_INFINITY;
                } else if (n.equals("slewRateVoltsPerSecond")) {
                    x[i] = slewRate(v, path, n);
                } else {
                    x[i] = quantity(v, path, n, units[i], false);
                }
            }
            try {
                return OpAmpChoice.custom(new OpAmpParams(x[0], x[1], x[2], x[3], x[4], x[5], x[6], x[7], x[8], x[9],
                        x[10], x[11], x[12], x[13]));
            } catch (CircuitException e) {
                throw new ConversionException(path + "." + e.field(), e.getMessage());
            }
        }

        private double slewRate(JsonNode o, String path, String field) {
            JsonNode v = present(o, path, field);
            if (v.isTextual()) {
                String t = v.asText().strip();
                double factor = 1;
                if (t.endsWith("V/µs") || t.endsWith("V/us")) {
                    factor = 1e6;
                    t = t.substring(0, t.length() - 4);
                } else if (t.endsWith("V/s")) {
                    t = t.substring(0, t.length() - 3);
                }
                return parse(t.strip(), Unit.NONE, path + "." + field) * factor;
            }
            return quantity(o, path, field, Unit.NONE, true);
        }

        private Supply supply(JsonNode o) {
            String kind = text(o, "supply", "kind", true);
            try {
                return switch (kind) {
                    case "cells" -> {
                        fields(o, "supply", Set.of("kind", "chemistry", "cellsInSeries"));
                        String chem = text(o, "supply", "chemistry", true);
                        CellPack p = new CellPack(chem, whole(o, "supply", "cellsInSeries"));
                        p.data();
                        yield p;
                    }
                    case "usb" -> {
                        fields(o, "supply", Set.of("kind", "rippleVoltsPeak", "rippleHz"));
                        yield new UsbPort(optional(o, "supply", "rippleVoltsPeak", Unit.VOLT),
                                optional(o, "supply", "rippleHz", Unit.HERTZ));
                    }
                    case "fixed" -> {
                        fields(o, "supply", Set.of("kind", "volts", "tolerance", "rippleVoltsPeak", "rippleHz",
                                "sourceOhms"));
                        yield new FixedRail(quantity(o, "supply", "volts", Unit.VOLT, true), fraction(o, "supply", "tolerance"),
                                optional(o, "supply", "rippleVoltsPeak", Unit.VOLT),
                                optional(o, "supply", "rippleHz", Unit.HERTZ), optional(o, "supply", "sourceOhms", Unit.OHM));
                    }
                    default -> throw new ConversionException("supply.kind", "must be \"cells\", \"usb\" or \"fixed\", got \""
                            + kind + "\"");
                };
            } catch (DesignException e) {
                throw new ConversionException(e.path(), afterPath(e));
            }
        }

        private ConversionLimits limits(JsonNode o) {
            fields(o, "limits", Set.of("maxSettleSeconds", "maxSupplyAmps", "minRuntimeHours", "priority"));
            OptionalDouble settle = o.has("maxSettleSeconds")
                    ? OptionalDouble.of(quantity(o, "limits", "maxSettleSeconds", Unit.SECOND, true)) : OptionalDouble.empty();
            OptionalDouble amps = o.has("maxSupplyAmps")
                    ? OptionalDouble.of(quantity(o, "limits", "maxSupplyAmps", Unit.AMPERE, true)) : OptionalDouble.empty();
            OptionalDouble hours = OptionalDouble.empty();
            if (o.has("minRuntimeHours")) {
                JsonNode v = present(o, "limits", "minRuntimeHours");
                if (v.isTextual() && v.asText().strip().endsWith("h")) {
                    String t = v.asText().strip();
                    hours = OptionalDouble.of(positive(parse(t.substring(0, t.length() - 1).strip(), Unit.NONE,
                            "limits.minRuntimeHours"), "limits.minRuntimeHours"));
                } else {
                    hours = OptionalDouble.of(quantity(o, "limits", "minRuntimeHours", Unit.NONE, true));
                }
            }
            LimitPriority priority = LimitPriority.BAND;
            if (o.has("priority")) {
                priority = switch (text(o, "limits", "priority", true)) {
                    case "band" -> LimitPriority.BAND;
                    case "settle" -> LimitPriority.SETTLE;
                    default -> throw new ConversionException("limits.priority", "must be \"band\" or \"settle\"");
                };
            }
            return new ConversionLimits(settle, amps, hours, priority);
        }

        private static AmplitudeUnit amplitudeUnit(String t) {
            return switch (t) {
                case "V-peak" -> AmplitudeUnit.VOLTS_PEAK;
                case "V-rms" -> AmplitudeUnit.VOLTS_RMS;
                case "dBu" -> AmplitudeUnit.DBU;
                case "dBV" -> AmplitudeUnit.DBV;
                default -> throw new ConversionException("signal.amplitudeUnit",
                        "must be \"V-peak\", \"V-rms\", \"dBu\" or \"dBV\", got \"" + t + "\"");
            };
        }

        private double amplitude(JsonNode sig, AmplitudeUnit unit) {
            JsonNode v = present(sig, "signal", "amplitude");
            boolean db = unit == AmplitudeUnit.DBU || unit == AmplitudeUnit.DBV;
            if (db && v.isTextual()) {
                String t = v.asText().strip();
                for (String suffix : new String[] {"dBu", "dBV", "dB"}) {
                    if (t.endsWith(suffix)) {
                        t = t.substring(0, t.length() - suffix.length()).strip();
                        break;
                    }
                }
                return parse(t, Unit.NONE, "signal.amplitude");
            }
            if (db) {
                return quantity(sig, "signal", "amplitude", Unit.NONE, false);
            }
            return quantity(sig, "signal", "amplitude", Unit.VOLT, true);
        }

        // ------------------------------------------------------------ primitives

        private static void fields(JsonNode o, String path, Set<String> allowed) {
            for (java.util.Map.Entry<String, JsonNode> entry : o.properties()) {
                String f = entry.getKey();
                if (!allowed.contains(f)) {
                    String shown = f.length() > 60 ? f.substring(0, 60) + "…" : f;
                    throw new ConversionException(child(path, shown), "unknown field; known here: "
                            + allowed.stream().sorted().toList());
                }
                if (o.get(f).isNull()) {
                    throw new ConversionException(child(path, f), "null is not accepted; leave the field out instead");
                }
            }
        }

        private static String child(String path, String field) {
            return path.isEmpty() ? field : path + "." + field;
        }

        private static JsonNode present(JsonNode o, String path, String field) {
            JsonNode v = o.get(field);
            if (v == null || v.isNull()) {
                throw new ConversionException(child(path, field), "is required");
            }
            return v;
        }

        private static JsonNode object(JsonNode o, String path, String field) {
            JsonNode v = present(o, path, field);
            if (!v.isObject()) {
                throw new ConversionException(child(path, field), "expected an object, got " + kind(v));
            }
            return v;
        }

        private static String text(JsonNode o, String path, String field, boolean required) {
            JsonNode v = present(o, path, field);
            if (!v.isTextual()) {
                throw new ConversionException(child(path, field), "expected a text, got " + kind(v));
            }
            return v.asText();
        }

        private static int whole(JsonNode o, String path, String field) {
            JsonNode v = present(o, path, field);
            if (!v.isIntegralNumber() || !v.canConvertToInt()) {
                throw new ConversionException(child(path, field), "expected a whole number, got " + kind(v));
            }
            return v.asInt();
        }

        private static double optional(JsonNode o, String path, String field, Unit unit) {
            return o.has(field) ? quantity(o, path, field, unit, false) : 0;
        }

        private static double fraction(JsonNode o, String path, String field) {
            JsonNode v = present(o, path, field);
            if (v.isTextual() && v.asText().strip().endsWith("%")) {
                String t = v.asText().strip();
                return parse(t.substring(0, t.length() - 1).strip(), Unit.NONE, child(path, field)) / 100;
            }
            return quantity(o, path, field, Unit.NONE, false);
        }

        /** A number in SI units or an engineering-value text in {@code unit}; positive when {@code positive}. */
        private static double quantity(JsonNode o, String path, String field, Unit unit, boolean positive) {
            JsonNode v = present(o, path, field);
            String p = child(path, field);
            double x;
            if (v.isNumber()) {
                x = v.asDouble();
            } else if (v.isTextual()) {
                x = parse(v.asText(), unit, p);
            } else {
                throw new ConversionException(p, "expected a number or a value text"
                        + (unit == Unit.NONE ? "" : " in " + unit.symbol()) + ", got " + kind(v));
            }
            if (!Double.isFinite(x)) {
                throw new ConversionException(p, "must be a finite number");
            }
            return positive ? positive(x, p) : x;
        }

        private static double positive(double x, String p) {
            if (!(x > 0)) {
                throw new ConversionException(p, "must be positive, got " + x);
            }
            return x;
        }

        private static double parse(String text, Unit unit, String path) {
            try {
                return EngineeringValue.parse(text, unit);
            } catch (ValueFormatException e) {
                String t = text.length() > 40 ? text.substring(0, 40) + "…" : text;
                throw new ConversionException(path, "\"" + t + "\" is not a value"
                        + (unit == Unit.NONE ? "" : " in " + unit.symbol()));
            }
        }

        private static String kind(JsonNode v) {
            return v.getNodeType().name().toLowerCase(Locale.ROOT);
        }

        private static String afterPath(RuntimeException e) {
            String m = e.getMessage();
            int i = m.indexOf(": ");
            return i >= 0 ? m.substring(i + 2) : m;
        }
    }
}
