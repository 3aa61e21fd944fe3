package halfrail.cli;

import halfrail.circuit.Circuit;
import halfrail.check.CircuitAnalysis;
import halfrail.check.DesignAnalysis;
import halfrail.check.DesignReport;
import halfrail.check.PowerOnReport;
import halfrail.check.StageReport;
import halfrail.check.SwingReport;
import halfrail.design.Design;
import halfrail.design.DesignCircuits;
import halfrail.design.DesignException;
import halfrail.io.DesignFileException;
import halfrail.io.DesignFiles;
import halfrail.check.CircuitReport;
import halfrail.check.Severity;
import halfrail.circuit.VoltageSource;
import halfrail.io.Netlist;
import halfrail.io.NetlistException;
import halfrail.io.NetlistReader;
import halfrail.solve.OpAmpState;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;

/**
 * {@code check FILE|DIR...}: reads each netlist, finds floating nodes, solves the DC operating
 * point and reports nodes, op-amps and findings. Exit code per {@link ExitCodes}.
 */
@Command(name = "check", mixinStandardHelpOptions = true,
        description = {"Check design files (*.json) and netlists (*.cir, *.net, *.sp): operating point, floating nodes,",
                "op-amps at rest, lower corner, settle-up time and findings.",
                "The netlist options (--input, --output, --ramp, --settle-band, --watch) apply to netlists only."},
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {"0:nothing at or above the --fail-on severity", "1:a finding at or above it",
                "2:bad input (unreadable file, parse error, invalid option)", "3:internal error"})
public final class CheckCommand implements Callable<Integer> {
    /** File name endings read as netlists when a directory is given. */
    public static final List<String> NETLIST_ENDINGS = List.of(".cir", ".net", ".sp");
    /** File name ending read as a Halfrail design file. */
    public static final String DESIGN_ENDING = ".json";
    /** Largest number of nodes {@code check} solves; the dense solver is meant for stage-sized circuits. */
    public static final int MAX_NODES = 500;
    /** Default power-on ramp of every DC voltage source, s. */
    public static final double DEFAULT_RAMP_SECONDS = 1e-3;

    @Spec
    CommandSpec spec;

    @Parameters(arity = "1..*", paramLabel = "FILE|DIR", description = "Design files and netlists, or directories of them.")
    List<Path> paths = new ArrayList<>();

    @Option(names = "--format", paramLabel = "FORMAT", description = "text, json or markdown (default: ${DEFAULT-VALUE}).")
    ReportFormat format = ReportFormat.TEXT;

    @Option(names = "--fail-on", paramLabel = "SEVERITY",
            description = "Lowest severity that makes the exit code 1: fail or warn (default: ${DEFAULT-VALUE}).")
    Severity failOn = Severity.FAIL;

    @Option(names = "--input", paramLabel = "SOURCE",
            description = "Voltage source whose AC magnitude drives the response (default: the only one with AC).")
    String input;

    @Option(names = "--output", paramLabel = "NODE",
            description = "Output node (default: the file's '* output: NODE' comment).")
    String output;

    @Option(names = "--ramp", paramLabel = "SECONDS", converter = SpiceValueConverter.class,
            description = "Power-on ramp of every DC voltage source, s (default: 1m).")
    double rampSeconds = DEFAULT_RAMP_SECONDS;

    @Option(names = "--settle-band", paramLabel = "VOLTS", converter = SpiceValueConverter.class,
            description = "Settling band, V (default: 1 % of the largest supply).")
    Double settleBandVolts;

    @Option(names = "--watch", paramLabel = "NODE", split = ",",
            description = "Nodes watched for settling besides every op-amp output and the output node.")
    List<String> watch = new ArrayList<>();

    /** The result for one file: a report, or the one-line reason it is bad input. */
    record Outcome(String file, FileReport report, String error) {}

    @Override
    public Integer call() {
        validateOptions();
        List<Path> files = new ArrayList<>();
        List<Outcome> outcomes = new ArrayList<>();
        for (Path p : paths) {
            if (Files.isDirectory(p)) {
                List<Path> found = netlistsIn(p);
                if (found.isEmpty()) {
                    outcomes.add(new Outcome(p.toString(), null,
                            p + ": no design files (" + DESIGN_ENDING + ") or netlists (" + String.join(", ", NETLIST_ENDINGS)
                                    + ") in this directory"));
                }
                files.addAll(found);
            } else {
                files.add(p);
            }
        }
        for (Path f : files) {
            try {
                outcomes.add(new Outcome(f.toString(), analyse(f), null));
            } catch (BadInputException e) {
                outcomes.add(new Outcome(f.toString(), null, e.getMessage()));
            }
        }
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        out.print(switch (format) {
            case TEXT -> Reports.text(outcomes);
            case MARKDOWN -> Reports.markdown(outcomes);
            case JSON -> Reports.json(outcomes, failOn);
        });
        out.flush();
        boolean bad = false;
        boolean failing = false;
        for (Outcome o : outcomes) {
            if (o.error() != null) {
                err.println(o.error());
                bad = true;
            } else if (o.report().failsAt(failOn)) {
                failing = true;
            }
        }
        err.flush();
        return bad ? ExitCodes.BAD_INPUT : failing ? ExitCodes.FINDING : ExitCodes.PASS;
    }

    private void validateOptions() {
        if (!Double.isFinite(rampSeconds) || rampSeconds < 0) {
            throw new ParameterException(spec.commandLine(),
                    "--ramp must be zero or a positive number of seconds, got " + rampSeconds);
        }
        if (settleBandVolts != null && (!Double.isFinite(settleBandVolts) || settleBandVolts <= 0)) {
            throw new ParameterException(spec.commandLine(),
                    "--settle-band must be a positive number of volts, got " + settleBandVolts);
        }
        for (String w : watch) {
            if (w.isBlank()) {
                throw new ParameterException(spec.commandLine(), "--watch holds an empty node name");
            }
        }
    }

    private static List<Path> netlistsIn(Path dir) {
        List<Path> found = new ArrayList<>();
        try (DirectoryStream<Path> s = Files.newDirectoryStream(dir)) {
            for (Path p : s) {
                String name = p.getFileName().toString().toLowerCase(Locale.ROOT);
                if (Files.isRegularFile(p) && (name.endsWith(DESIGN_ENDING)
                        || NETLIST_ENDINGS.stream().anyMatch(name::endsWith))) {
                    found.add(p);
                }
            }
        } catch (IOException | SecurityException e) {
            throw new BadInputException(dir + ": cannot list the directory (" + e.getClass().getSimpleName() + ")");
        }
        found.sort(null);
        return found;
    }

    /** Whether {@code file} is read as a design file rather than a netlist (by its name). */
    static boolean isDesignFile(Path file) {
        return file.getFileName() != null
                && file.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(DESIGN_ENDING);
    }

    /** Read and analyse one design file; the netlist options do not apply to designs. */
    static FileReport analyseDesign(Path file) {
        String name = file.toString();
        Design design = readDesign(file);
        DesignReport r;
        try {
            r = DesignAnalysis.analyse(design);
        } catch (DesignException e) {
            throw new BadInputException(name + ": " + e.getMessage());
        }
        List<OpAmpRow> rows = new ArrayList<>();
        for (StageReport s : r.stages()) {
            SwingReport n = s.nominal();
            rows.add(new OpAmpRow(s.label(), n.quiescentVolts(), s.inPlusVolts(), s.inMinusVolts(), n.swingLowVolts(),
                    n.swingHighVolts(), s.commonModeLowVolts(), s.commonModeHighVolts(), n.saturated(),
                    s.commonModeOkAtRest()));
        }
        Double corner = r.chain().map(c -> boxed(c.lowerCornerHz())).orElse(null);
        Double settle = r.powerOn().map(p -> boxed(p.settleSeconds())).orElse(null);
        String load = DesignCircuits.nominal(design).loadNode();
        return new FileReport(name, design.name(), Optional.of(load), r.nodeVolts(), rows, r.floatingNodes(), corner,
                settle, r.powerOn().flatMap(PowerOnReport::oscillation), r.findings(), List.of());
    }

    /** Read a design file; its problems are bad input naming the file and JSON path. */
    static Design readDesign(Path file) {
        try {
            return DesignFiles.read(file);
        } catch (DesignFileException e) {
            throw new BadInputException(e.getMessage().startsWith(file.toString()) ? e.getMessage()
                    : file + ": " + e.getMessage());
        }
    }

    /** Read, validate against the options, solve and judge one netlist. */
    FileReport analyse(Path file) {
        String name = file.toString();
        if (isDesignFile(file)) {
            return analyseDesign(file);
        }
        Netlist netlist;
        try {
            netlist = NetlistReader.read(file);
        } catch (NetlistException e) {
            throw new BadInputException(name + ": " + e.getMessage());
        }
        Circuit circuit = netlist.circuit();
        if (circuit.nodes().size() > MAX_NODES) {
            throw new BadInputException(name + ": " + circuit.nodes().size() + " nodes, more than the "
                    + MAX_NODES + " that check solves");
        }
        Optional<String> outputNode = netlist.outputNode();
        if (output != null) {
            outputNode = Optional.of(node(circuit, output, name, "--output"));
        }
        if (input != null && circuit.elements(VoltageSource.class).stream()
                .noneMatch(v -> v.name().equalsIgnoreCase(input))) {
            throw new BadInputException(name + ": --input names '" + input + "', which is not a voltage source"
                    + " of this netlist");
        }
        Circuit powered = withRamp(circuit, rampSeconds);
        CircuitAnalysis.Options options = new CircuitAnalysis.Options(outputNode,
                Optional.ofNullable(input).map(i -> sourceName(circuit, i)),
                settleBandVolts == null ? OptionalDouble.empty() : OptionalDouble.of(settleBandVolts),
                watch.stream().map(w -> node(circuit, w.strip(), name, "--watch")).toList(), true);
        CircuitReport r = CircuitAnalysis.analyse(powered, options);
        List<OpAmpRow> rows = r.opAmps().stream().map(CheckCommand::row).toList();
        List<String> notes = netlist.notes().stream().map(Netlist.Note::toString).toList();
        return new FileReport(name, circuit.title(), outputNode, r.nodeVolts(), rows, r.floating(),
                boxed(r.lowerCornerHz()), boxed(r.settleSeconds()), r.oscillation(), r.findings(), notes);
    }

    static OpAmpRow row(OpAmpState s) {
        return new OpAmpRow(s.name(), s.outputVolts(), s.inPlusVolts(), s.inMinusVolts(), s.swingLowVolts(),
                s.swingHighVolts(), s.commonModeLowVolts(), s.commonModeHighVolts(), s.saturated(), s.commonModeOk());
    }

    static Double boxed(OptionalDouble v) {
        return v.isPresent() ? v.getAsDouble() : null;
    }

    private static String sourceName(Circuit c, String wanted) {
        return c.elements(VoltageSource.class).stream().map(VoltageSource::name)
                .filter(n -> n.equalsIgnoreCase(wanted)).findFirst().orElse(wanted);
    }

    private static String node(Circuit c, String wanted, String file, String option) {
        for (String n : c.nodes()) {
            if (n.equalsIgnoreCase(wanted)) {
                return n;
            }
        }
        throw new BadInputException(file + ": " + option + " names node '" + wanted + "', which is not a node"
                + " of this netlist");
    }

    /** Every DC voltage source ramping from 0 over {@code seconds}; the DC point does not change. */
    static Circuit withRamp(Circuit c, double seconds) {
        Circuit out = c;
        for (VoltageSource v : c.elements(VoltageSource.class)) {
            out = out.replace(v.name(), e -> ((VoltageSource) e).withRamp(seconds));
        }
        return out;
    }
}
