package halfrail.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import halfrail.check.Finding;
import halfrail.convert.ChainFigures;
import halfrail.convert.Change;
import halfrail.convert.Conflict;
import halfrail.convert.ConversionException;
import halfrail.convert.ConversionFiles;
import halfrail.convert.ConversionLimits;
import halfrail.convert.ConversionRequest;
import halfrail.convert.ConversionResult;
import halfrail.convert.Converter;
import halfrail.convert.DualRailChain;
import halfrail.convert.DualRailStage;
import halfrail.convert.LimitPriority;
import halfrail.convert.SupplyPoint;
import halfrail.convert.TradeOffPoint;
import halfrail.design.AmplitudeUnit;
import halfrail.design.CellPack;
import halfrail.design.DesignException;
import halfrail.design.FixedRail;
import halfrail.design.OpAmpChoice;
import halfrail.design.SignalSource;
import halfrail.design.StageKind;
import halfrail.design.Supply;
import halfrail.design.UsbPort;
import halfrail.io.DesignFileException;
import halfrail.io.DesignFiles;
import halfrail.parts.PartsLibrary;
import halfrail.solve.AnalysisException;
import halfrail.units.EngineeringValue;
import halfrail.units.Unit;
import halfrail.units.ValueFormatException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;

/**
 * {@code convert [FILE]}: converts a dual-rail stage or chain to one supply, writes the design
 * file and prints the before/after comparison, the changes, the conflicts and the trade-off
 * curve. The request comes from a JSON file (docs/convert-format.md) or from options.
 */
@Command(name = "convert", mixinStandardHelpOptions = true,
        description = {"Convert a dual-rail op-amp stage or chain to one supply: mid-rail reference, bias resistors,",
                "coupling and feedback-leg capacitors, checked by the engine. Input: a conversion file (JSON,",
                "docs/convert-format.md) or the options below."},
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {"0:the converted design has no failing finding and every limit is met",
                "1:a failing finding remains, or a limit could not be met", "2:bad input", "3:internal error"})
public final class ConvertCommand implements Callable<Integer> {
    /** Output formats of {@code convert}. */
    public enum Format { TEXT, JSON }

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", arity = "0..1", paramLabel = "FILE", description = "A conversion file (JSON).")
    Path file;

    @Option(names = {"-o", "--output"}, paramLabel = "OUT.json", description = "Write the converted design file here.")
    Path output;

    @Option(names = "--format", paramLabel = "FORMAT", description = "text or json (default: ${DEFAULT-VALUE}).")
    Format format = Format.TEXT;

    @Option(names = "--name", description = "Title of the converted design.")
    String name;

    @Option(names = "--stage", paramLabel = "KIND:R1:R2:OPAMP",
            description = "A stage of the original, in signal order: non-inverting:10k:100k:OPAMP, inverting:10k:47k:OPAMP"
                    + " or follower:OPAMP (an archetype id). Repeat for a chain.")
    List<String> stages = new ArrayList<>();

    @Option(names = "--dual-rail", paramLabel = "V[:V]", description = "The original's supply: 15 for ±15 V, 15:12 for +15/−12 V.")
    String dualRail;

    @Option(names = "--cells", paramLabel = "CHEMISTRY:N", description = "New supply: N cells of a chemistry (alkaline-9v-block:1).")
    String cells;

    @Option(names = "--usb", description = "New supply: a USB port.")
    boolean usb;

    @Option(names = "--rail", paramLabel = "V[:TOL]", description = "New supply: a fixed rail, tolerance as a fraction or %% (12:5%%).")
    String rail;

    @Option(names = "--band", paramLabel = "LOW:HIGH", description = "Band of interest, Hz (20:20k).")
    String band;

    @Option(names = "--signal", paramLabel = "VPEAK", description = "Nominal signal, V peak (100m or 100 mV).")
    String signal;

    @Option(names = "--source-ohms", paramLabel = "OHMS", description = "Source resistance (default 0).")
    String sourceOhms;

    @Option(names = "--load", paramLabel = "OHMS", description = "Load resistance.")
    String load;

    @Option(names = "--max-settle", paramLabel = "SECONDS", description = "Settle-up time limit (10 ms).")
    String maxSettle;

    @Option(names = "--max-current", paramLabel = "AMPS", description = "Supply-current limit (500 µA).")
    String maxCurrent;

    @Option(names = "--min-runtime", paramLabel = "HOURS", description = "Runtime wanted on the cells' capacity, h.")
    Double minRuntime;

    @Option(names = "--priority", paramLabel = "WHICH", description = "band or settle: which wins when they conflict (default: band).")
    LimitPriority priority;

    @Override
    public Integer call() {
        ConversionRequest request = request();
        ConversionResult result;
        try {
            result = Converter.convert(request);
        } catch (ConversionException | DesignException e) {
            throw new BadInputException(where() + e.getMessage());
        } catch (AnalysisException e) {
            PrintWriter err = spec.commandLine().getErr();
            err.println(where() + "the conversion could not be completed (" + e.kind() + "): " + e.getMessage());
            err.flush();
            return ExitCodes.FINDING;
        }
        if (output != null) {
            try {
                DesignFiles.save(result.design(), output);
            } catch (DesignFileException e) {
                throw new BadInputException(output + ": cannot write the design file: " + e.getMessage());
            }
        }
        PrintWriter out = spec.commandLine().getOut();
        out.print(format == Format.JSON ? json(result) : text(result));
        out.flush();
        return result.succeeded() ? ExitCodes.PASS : ExitCodes.FINDING;
    }

    private String where() {
        return file == null ? "convert: " : file + ": ";
    }

    // ------------------------------------------------------------------ input

    ConversionRequest request() {
        boolean circuitOptions = !stages.isEmpty() || dualRail != null || cells != null || usb || rail != null
                || band != null || signal != null || sourceOhms != null || load != null;
        if (file != null) {
            if (circuitOptions) {
                throw new BadInputException("convert: give either FILE or the circuit options (--stage, --dual-rail,"
                        + " --cells/--usb/--rail, --band, --signal, --load), not both");
            }
            ConversionRequest r;
            try {
                r = ConversionFiles.read(file);
            } catch (ConversionException e) {
                throw new BadInputException(file + ": " + (e.path().isEmpty() ? e.getMessage().replaceFirst("^: ", "")
                        : e.getMessage()));
            }
            ConversionLimits l = r.limits();
            l = applyLimitOptions(l);
            r = r.withLimits(l);
            if (name != null) {
                r = new ConversionRequest(name, r.original(), r.supply(), r.signal(), r.loadOhms(), r.loadFarads(), l);
            }
            return r;
        }
        if (stages.isEmpty() || dualRail == null || band == null || signal == null || load == null) {
            throw new BadInputException("convert: give a conversion FILE, or at least --stage, --dual-rail, a new supply"
                    + " (--cells, --usb or --rail), --band, --signal and --load (see --help)");
        }
        try {
            List<DualRailStage> list = new ArrayList<>();
            for (int i = 0; i < stages.size(); i++) {
                list.add(stage(i, stages.get(i)));
            }
            String[] dr = dualRail.split(":", -1);
            if (dr.length > 2) {
                throw new BadInputException("convert: --dual-rail takes V or V:V, got '" + dualRail + "'");
            }
            double pos = value(dr[0], Unit.VOLT, "--dual-rail");
            double neg = dr.length == 2 ? value(dr[1], Unit.VOLT, "--dual-rail") : pos;
            DualRailChain chain = new DualRailChain(list, pos, neg);
            String[] b = band.split(":", -1);
            if (b.length != 2) {
                throw new BadInputException("convert: --band takes LOW:HIGH, got '" + band + "'");
            }
            SignalSource source = new SignalSource(value(signal, Unit.VOLT, "--signal"), AmplitudeUnit.VOLTS_PEAK,
                    sourceOhms == null ? 0 : value(sourceOhms, Unit.OHM, "--source-ohms"),
                    value(b[0], Unit.HERTZ, "--band"), value(b[1], Unit.HERTZ, "--band"));
            return new ConversionRequest(name, chain, supply(), source, value(load, Unit.OHM, "--load"), 0,
                    applyLimitOptions(ConversionLimits.none()));
        } catch (ConversionException | DesignException e) {
            throw new BadInputException("convert: " + e.getMessage());
        }
    }

    private ConversionLimits applyLimitOptions(ConversionLimits l) {
        if (maxSettle != null) {
            l = l.withMaxSettleSeconds(value(maxSettle, Unit.SECOND, "--max-settle"));
        }
        if (maxCurrent != null) {
            l = l.withMaxSupplyAmps(value(maxCurrent, Unit.AMPERE, "--max-current"));
        }
        if (minRuntime != null) {
            if (!(minRuntime > 0) || minRuntime.isInfinite()) {
                throw new BadInputException("convert: --min-runtime must be a positive number of hours");
            }
            l = l.withMinRuntimeHours(minRuntime);
        }
        if (priority != null) {
            l = l.withPriority(priority);
        }
        return l;
    }

    private Supply supply() {
        int given = (cells != null ? 1 : 0) + (usb ? 1 : 0) + (rail != null ? 1 : 0);
        if (given != 1) {
            throw new BadInputException("convert: give exactly one new supply: --cells, --usb or --rail");
        }
        if (usb) {
            return new UsbPort(0, 0);
        }
        if (cells != null) {
            String[] c = cells.split(":", -1);
            int n;
            try {
                n = c.length == 2 ? Integer.parseInt(c[1].strip()) : 1;
            } catch (NumberFormatException e) {
                throw new BadInputException("convert: --cells takes CHEMISTRY:N with a whole N, got '" + cells + "'");
            }
            CellPack p = new CellPack(c[0].strip(), n);
            p.data();
            return p;
        }
        String[] r = rail.split(":", -1);
        double tol = 0;
        if (r.length == 2) {
            String t = r[1].strip();
            tol = t.endsWith("%") ? value(t.substring(0, t.length() - 1), Unit.NONE, "--rail") / 100
                    : value(t, Unit.NONE, "--rail");
        }
        return new FixedRail(value(r[0], Unit.VOLT, "--rail"), tol, 0, 0, 0);
    }

    private static DualRailStage stage(int i, String spec) {
        String[] p = spec.split(":", -1);
        String option = "--stage " + (i + 1);
        StageKind kind = switch (p[0].strip().toLowerCase(Locale.ROOT)) {
            case "non-inverting" -> StageKind.NON_INVERTING;
            case "inverting" -> StageKind.INVERTING;
            case "follower" -> StageKind.FOLLOWER;
            default -> throw new BadInputException("convert: " + option + ": the kind must be non-inverting, inverting"
                    + " or follower, got '" + p[0] + "'");
        };
        String id;
        double r1 = 0;
        double r2 = 0;
        if (kind == StageKind.FOLLOWER) {
            if (p.length != 2) {
                throw new BadInputException("convert: " + option + ": a follower takes follower:OPAMP");
            }
            id = p[1].strip();
        } else {
            if (p.length != 4) {
                throw new BadInputException("convert: " + option + ": takes KIND:R1:R2:OPAMP, got '" + spec + "'");
            }
            r1 = value(p[1], Unit.OHM, option + " R1");
            r2 = value(p[2], Unit.OHM, option + " R2");
            id = p[3].strip();
        }
        if (PartsLibrary.builtIn().opAmpArchetype(id).isEmpty()) {
            throw new BadInputException("convert: " + option + ": unknown op-amp archetype '" + id + "'; known: "
                    + PartsLibrary.builtIn().opAmpArchetypes().stream().map(a -> a.id()).toList());
        }
        return new DualRailStage("stage" + (i + 1), kind, r1, r2, OpAmpChoice.archetype(id));
    }

    private static double value(String text, Unit unit, String option) {
        try {
            return EngineeringValue.parse(text.strip(), unit);
        } catch (ValueFormatException e) {
            throw new BadInputException("convert: " + option + ": '" + text + "' is not a value"
                    + (unit == Unit.NONE ? "" : " in " + unit.symbol()));
        }
    }

    // ------------------------------------------------------------------ output

    static String text(ConversionResult r) {
        StringBuilder sb = new StringBuilder();
        sb.append("Conversion: ").append(r.design().name()).append('\n');
        sb.append(r.succeeded() ? "Result: converted; no failing finding, every limit met\n"
                : "Result: " + (r.hasFailingFinding() ? "a failing finding remains" : "converted")
                + (r.limitsMet() ? "" : "; " + r.conflicts().size() + " limit(s) not met") + "\n");
        sb.append("\nBefore and after (last stage's output, nominal signal)\n");
        ChainFigures b = r.comparison().before();
        ChainFigures a = r.comparison().after();
        row(sb, "", b.version(), a.version());
        row(sb, "supply", volts(b.point("nominal").supplyVolts()) + " (±)", volts(a.point("nominal").supplyVolts()));
        for (String label : List.of("fresh", "nominal", "end-point")) {
            SupplyPoint pa = a.point(label);
            SupplyPoint pb = b.point("nominal");
            String beforeText = label.equals("nominal") ? swing(pb) : "(fixed ± supply)";
            row(sb, "swing at " + label, beforeText, swing(pa) + " at " + volts(pa.supplyVolts()));
            row(sb, "headroom at " + label, label.equals("nominal") ? db(pb.headroomDb()) : "—", db(pa.headroomDb()));
        }
        row(sb, "gain", num(b.gain()) + " V/V", num(a.gain()) + " V/V");
        row(sb, "supply current", amps(b.supplyAmps()) + " + " + amps(b.negativeRailAmps()) + " (−)", amps(a.supplyAmps()));
        row(sb, "lower corner", hz(b.lowerCornerHz()), hz(a.lowerCornerHz()));
        row(sb, "settle-up", secs(b.settleSeconds()), secs(a.settleSeconds()));
        sb.append("\nChanges (").append(r.changes().size()).append(")\n");
        for (Change c : r.changes()) {
            sb.append("  ").append(c.kind()).append(c.designPath().isEmpty() ? "" : " " + c.designPath()).append(": ")
                    .append(c.before()).append(" -> ").append(c.after()).append('\n')
                    .append("      ").append(c.reason()).append('\n');
        }
        sb.append("\nConflicts (").append(r.conflicts().size()).append(")\n");
        for (Conflict c : r.conflicts()) {
            sb.append("  ").append(c.kind()).append(": ").append(c.winner()).append(" wins over ").append(c.loser())
                    .append("; missed by ").append(EngineeringValue.format(c.missedBy(), unitOf(c.unit()))).append('\n')
                    .append("      ").append(c.explanation()).append('\n');
        }
        sb.append("\nTrade-off: lower corner against settle-up time\n");
        sb.append(String.format(Locale.ROOT, "  %-14s %-12s %-12s %-14s %s%n", "target corner", "capacitors", "corner",
                "settle-up", "meets"));
        for (TradeOffPoint p : r.tradeOff()) {
            sb.append(String.format(Locale.ROOT, "  %-14s %-12s %-12s %-14s %s%n",
                    EngineeringValue.format(p.targetCornerHz(), Unit.HERTZ),
                    String.format(Locale.ROOT, "x%.3g", p.capacitanceScale()), hz(p.lowerCornerHz()),
                    p.settleSeconds().isPresent() ? secs(p.settleSeconds())
                            : "> " + EngineeringValue.format(p.simulatedSeconds(), Unit.SECOND),
                    (p.meetsBand() ? "band" : "") + (p.meetsBand() && p.meetsSettle() ? ", " : "")
                            + (p.meetsSettle() ? "settle" : "")));
        }
        sb.append("\nFindings on the converted design (").append(r.report().findings().size()).append(")\n");
        for (Finding f : r.report().findings()) {
            sb.append("  ").append(f.severity()).append(' ').append(f.code()).append(": ").append(f.message()).append('\n');
        }
        return sb.toString();
    }

    private static Unit unitOf(String u) {
        return switch (u) {
            case "s" -> Unit.SECOND;
            case "Hz" -> Unit.HERTZ;
            case "A" -> Unit.AMPERE;
            case "V" -> Unit.VOLT;
            default -> Unit.NONE;
        };
    }

    private static void row(StringBuilder sb, String label, String before, String after) {
        sb.append(String.format(Locale.ROOT, "  %-22s %-32s %s%n", label, before, after));
    }

    private static String swing(SupplyPoint p) {
        return volts(p.availableLowVolts()) + " below, " + volts(p.availableHighVolts()) + " above";
    }

    private static String volts(double v) {
        return Double.isFinite(v) ? EngineeringValue.format(v, Unit.VOLT) : String.valueOf(v);
    }

    private static String amps(double v) {
        return Double.isFinite(v) ? EngineeringValue.format(v, Unit.AMPERE) : "—";
    }

    private static String db(double v) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, "%.1f dB", v) : (v > 0 ? "no signal" : "clips");
    }

    private static String num(double v) {
        return String.format(Locale.ROOT, "%.4g", v);
    }

    private static String hz(OptionalDouble v) {
        return v.isPresent() ? EngineeringValue.format(v.getAsDouble(), Unit.HERTZ) : "none (passes DC)";
    }

    private static String secs(OptionalDouble v) {
        return v.isPresent() ? EngineeringValue.format(v.getAsDouble(), Unit.SECOND) : "not settled";
    }

    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    String json(ConversionResult r) {
        ObjectNode root = JSON.createObjectNode();
        root.put("name", r.design().name());
        root.put("designFile", output == null ? null : output.toString());
        root.put("succeeded", r.succeeded());
        root.put("hasFailingFinding", r.hasFailingFinding());
        root.put("limitsMet", r.limitsMet());
        root.put("cornerIterations", r.cornerIterations());
        ObjectNode cmp = root.putObject("comparison");
        cmp.set("before", figures(r.comparison().before()));
        cmp.set("after", figures(r.comparison().after()));
        ArrayNode changes = root.putArray("changes");
        for (Change c : r.changes()) {
            ObjectNode o = changes.addObject();
            o.put("kind", c.kind().name());
            o.put("designPath", c.designPath());
            o.put("before", c.before());
            o.put("after", c.after());
            o.put("reason", c.reason());
        }
        ArrayNode conflicts = root.putArray("conflicts");
        for (Conflict c : r.conflicts()) {
            ObjectNode o = conflicts.addObject();
            o.put("kind", c.kind().name());
            o.put("winner", c.winner());
            o.put("loser", c.loser());
            o.put("limit", c.limit());
            o.put("achieved", c.achieved());
            o.put("missedBy", c.missedBy());
            o.put("unit", c.unit());
            o.put("explanation", c.explanation());
        }
        ArrayNode curve = root.putArray("tradeOff");
        for (TradeOffPoint p : r.tradeOff()) {
            ObjectNode o = curve.addObject();
            o.put("targetCornerHz", p.targetCornerHz());
            o.put("capacitanceScale", p.capacitanceScale());
            optional(o, "lowerCornerHz", p.lowerCornerHz());
            optional(o, "settleSeconds", p.settleSeconds());
            o.put("simulatedSeconds", p.simulatedSeconds());
            o.put("meetsBand", p.meetsBand());
            o.put("meetsSettle", p.meetsSettle());
        }
        ArrayNode findings = root.putArray("findings");
        for (Finding f : r.report().findings()) {
            ObjectNode o = findings.addObject();
            o.put("code", f.code());
            o.put("severity", f.severity().name());
            o.put("message", f.message());
        }
        try {
            return JSON.writeValueAsString(root) + "\n";
        } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
            throw new IllegalStateException("a JSON tree of our own could not be written", e);
        }
    }

    private static JsonNode figures(ChainFigures f) {
        ObjectNode o = JSON.createObjectNode();
        o.put("version", f.version());
        o.put("gain", f.gain());
        o.put("supplyAmps", f.supplyAmps());
        o.put("negativeRailAmps", f.negativeRailAmps());
        optional(o, "lowerCornerHz", f.lowerCornerHz());
        optional(o, "settleSeconds", f.settleSeconds());
        ArrayNode points = o.putArray("points");
        for (SupplyPoint p : f.points()) {
            ObjectNode x = points.addObject();
            x.put("label", p.label());
            x.put("supplyVolts", p.supplyVolts());
            x.put("restVolts", p.restVolts());
            x.put("availableLowVolts", p.availableLowVolts());
            x.put("availableHighVolts", p.availableHighVolts());
            x.put("signalPeakVolts", p.signalPeakVolts());
            if (Double.isFinite(p.headroomDb())) {
                x.put("headroomDb", p.headroomDb());
            } else {
                x.putNull("headroomDb");
            }
        }
        return o;
    }

    private static void optional(ObjectNode o, String field, OptionalDouble v) {
        if (v.isPresent()) {
            o.put(field, v.getAsDouble());
        } else {
            o.putNull(field);
        }
    }
}
