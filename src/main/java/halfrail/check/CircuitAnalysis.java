package halfrail.check;

import halfrail.units.Quantities;
import halfrail.circuit.Circuit;
import halfrail.circuit.Element;
import halfrail.circuit.OpAmp;
import halfrail.circuit.Resistor;
import halfrail.circuit.VoltageSource;
import halfrail.solve.AcAnalysis;
import halfrail.solve.AcPassband;
import halfrail.solve.AnalysisException;
import halfrail.solve.DcSolver;
import halfrail.solve.FloatingNodes;
import halfrail.solve.OpAmpState;
import halfrail.solve.OperatingPoint;
import halfrail.solve.PowerOnOptions;
import halfrail.solve.PowerOnResult;
import halfrail.solve.PowerOnTransient;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;

/**
 * Checks a bare circuit — a netlist, with no design behind it: floating nodes, the DC operating
 * point, each op-amp against its swing window and common-mode range, the lower and upper −3 dB
 * points from the input source to the output node, and the power-on settle-up time. Engine
 * failures become findings, never exceptions.
 */
public final class CircuitAnalysis {
    /**
     * Resistance that ties each floating node to ground so that the rest of the circuit can still
     * be solved, Ω; the tied nodes' voltages are reported as undefined. Low enough that its
     * conductance stays well above the LU pivot threshold next to an op-amp's open-loop gain.
     */
    public static final double TIE_OHMS = 1e6;
    /** Lowest frequency searched for the response's peak and corners, Hz. */
    public static final double SEARCH_LOW_HZ = 1e-3;
    /** Highest frequency searched for the response's peak and corners, Hz. */
    public static final double SEARCH_HIGH_HZ = 1e8;
    /** Longest power-on run, s of circuit time; a circuit not settled by then is reported so. */
    public static final double POWER_ON_STOP_SECONDS = 30;
    /** Default settle band as a fraction of the largest DC source voltage. */
    public static final double DEFAULT_BAND_FRACTION = 0.01;
    /** An output at rest closer than this fraction of its swing window to a limit draws a warning. */
    public static final double NEAR_RAIL_FRACTION = 0.10;

    static final String REST_NEAR_RAIL = "REST_NEAR_RAIL";
    static final String NOT_SETTLED = "NOT_SETTLED";
    static final String KEEPS_OSCILLATING = PowerOn.OSCILLATES;
    static final String ANALYSIS_FAILED = "ANALYSIS_FAILED";

    /**
     * What to analyse beyond the operating point.
     *
     * @param output          the output node, for the response and the settle-up watch
     * @param input           the source driving the response; empty: the only source with an AC magnitude
     * @param settleBandVolts the settle band, V; empty: {@link #DEFAULT_BAND_FRACTION} of the largest DC source
     * @param watch           further nodes watched for settling besides every op-amp output and the output node
     * @param powerOn         whether to run the power-on transient
     */
    public record Options(Optional<String> output, Optional<String> input, OptionalDouble settleBandVolts,
                          List<String> watch, boolean powerOn) {
        public Options {
            watch = List.copyOf(watch);
        }

        public static Options defaults() {
            return new Options(Optional.empty(), Optional.empty(), OptionalDouble.empty(), List.of(), true);
        }
    }

    private CircuitAnalysis() {}

    public static CircuitReport analyse(Circuit circuit, Options options) {
        List<String> floating = FloatingNodes.find(circuit);
        Set<String> floatingSet = new HashSet<>(floating);
        List<Finding> findings = new ArrayList<>();
        for (String node : floating) {
            findings.add(Finding.of(NoDcPath.CODE, Severity.FAIL, "node " + node
                            + " has no DC path to ground or to a driven output, so its voltage is undefined;"
                            + " voltages that depend on it are computed with it tied to ground through "
                            + Quantities.ohms(TIE_OHMS), touching(circuit, node),
                    "add a resistor from " + node + " to a defined voltage (the mid-rail reference)"));
        }
        Map<String, Double> volts = new LinkedHashMap<>();
        OperatingPoint op;
        try {
            op = DcSolver.operatingPoint(floating.isEmpty() ? circuit : tied(circuit, floating));
        } catch (AnalysisException e) {
            for (String n : circuit.nodes()) {
                volts.put(n, null);
            }
            findings.add(Finding.of(ANALYSIS_FAILED, Severity.FAIL, "no DC operating point (" + e.kind() + "): "
                    + e.getMessage(), List.of(), "look for values far outside the usual range"));
            return new CircuitReport(floating, volts, List.of(), OptionalDouble.empty(), OptionalDouble.empty(),
                    false, OptionalDouble.empty(), findings, Optional.empty());
        }
        for (String n : circuit.nodes()) {
            volts.put(n, floatingSet.contains(n) ? null : op.voltage(n));
        }
        findings.addAll(opAmpFindings(circuit, op.opAmps(), floatingSet));
        OptionalDouble lower = OptionalDouble.empty();
        OptionalDouble upper = OptionalDouble.empty();
        boolean settled = false;
        OptionalDouble settle = OptionalDouble.empty();
        Optional<PowerOnResult.Oscillation> oscillation = Optional.empty();
        if (floating.isEmpty()) {
            Optional<String> input = options.input().or(() -> onlyAcSource(circuit));
            if (input.isPresent() && options.output().isPresent()) {
                try {
                    AcPassband pb = new AcAnalysis(op).passband(input.get(), options.output().get(), SEARCH_LOW_HZ,
                            SEARCH_HIGH_HZ);
                    lower = pb.lowerCornerHz();
                    upper = pb.upperCornerHz();
                } catch (AnalysisException e) {
                    findings.add(Finding.of(ANALYSIS_FAILED, Severity.WARN, "the small-signal response could not be "
                            + "computed (" + e.kind() + "): " + e.getMessage(), List.of(), ""));
                }
            }
            if (options.powerOn()) {
                try {
                    PowerOnResult r = PowerOnTransient.run(circuit, powerOnOptions(circuit, op, options));
                    settled = r.settled();
                    settle = r.settleTimeSeconds().map(OptionalDouble::of).orElse(OptionalDouble.empty());
                    oscillation = r.oscillation();
                    if (r.oscillation().isPresent()) {
                        PowerOnResult.Oscillation o = r.oscillation().get();
                        // A warning, not a failure: a netlist may be an oscillator on purpose.
                        findings.add(Finding.of(KEEPS_OSCILLATING, Severity.WARN, "after power-on " + o.node()
                                        + " keeps swinging " + Quantities.volts(o.peakToPeakVolts())
                                        + " peak to peak with a period of " + Quantities.seconds(o.periodSeconds())
                                        + " (" + Quantities.hertz(o.frequencyHz()) + "); it never settles",
                                List.of(), "if it is not meant to oscillate, look for a loop with gain round it: "
                                        + "positive feedback, or a shared bias or supply node with too little decoupling"));
                    } else if (!settled) {
                        findings.add(Finding.of(NOT_SETTLED, Severity.WARN, "the circuit had not settled within "
                                        + Quantities.volts(r.settleBandVolts()) + " of its operating point after "
                                        + Quantities.seconds(POWER_ON_STOP_SECONDS) + " of power-on",
                                List.of(), "look for a very long time constant or a low-frequency oscillation"));
                    }
                } catch (AnalysisException e) {
                    findings.add(Finding.of(ANALYSIS_FAILED, Severity.WARN, "the power-on transient could not be "
                            + "computed (" + e.kind() + "): " + e.getMessage(), List.of(), ""));
                }
            }
        }
        return new CircuitReport(floating, volts, op.opAmps(), lower, upper, settled, settle, findings, oscillation);
    }

    private static PowerOnOptions powerOnOptions(Circuit circuit, OperatingPoint op, Options options) {
        double largest = 0;
        for (VoltageSource v : circuit.elements(VoltageSource.class)) {
            largest = Math.max(largest, Math.abs(v.dcVolts()));
        }
        double band = options.settleBandVolts().orElse(largest > 0 ? DEFAULT_BAND_FRACTION * largest : 0.01);
        Set<String> watched = new LinkedHashSet<>();
        for (OpAmp o : circuit.elements(OpAmp.class)) {
            watched.add(o.out());
        }
        options.output().ifPresent(watched::add);
        watched.addAll(options.watch());
        watched.remove(Circuit.GROUND);
        PowerOnOptions p = PowerOnOptions.of(POWER_ON_STOP_SECONDS).withSettleBand(band)
                .withWatchedNodes(watched.toArray(new String[0]));
        if (options.output().isPresent() && !Circuit.GROUND.equals(options.output().get())) {
            p = p.withLoadNodes(options.output().get());
        }
        return p;
    }

    private static Optional<String> onlyAcSource(Circuit c) {
        List<VoltageSource> ac = c.elements(VoltageSource.class).stream().filter(v -> v.acMagnitude() > 0).toList();
        return ac.size() == 1 ? Optional.of(ac.get(0).name()) : Optional.empty();
    }

    /** Findings on op-amps; op-amps with a terminal on a floating node are left to the floating-node finding. */
    private static List<Finding> opAmpFindings(Circuit circuit, List<OpAmpState> states, Set<String> floating) {
        List<Finding> out = new ArrayList<>();
        for (OpAmpState s : states) {
            OpAmp o = circuit.element(s.name()).map(OpAmp.class::cast).orElseThrow();
            if (o.terminals().stream().anyMatch(floating::contains)) {
                continue;
            }
            double window = s.swingHighVolts() - s.swingLowVolts();
            double toLow = s.outputVolts() - s.swingLowVolts();
            double toHigh = s.swingHighVolts() - s.outputVolts();
            boolean nearHigh = toHigh < toLow;
            LadderLevel level = nearHigh ? LadderLevel.SWING_HIGH : LadderLevel.SWING_LOW;
            String limit = (nearHigh ? "upper" : "lower") + " limit of "
                    + Quantities.volts(nearHigh ? s.swingHighVolts() : s.swingLowVolts());
            if (s.saturated()) {
                out.add(Finding.at(RestsOnRail.CODE, Severity.FAIL, s.name() + ": the output rests at "
                                + Quantities.volts(s.outputVolts()) + " against its " + limit
                                + ": the op-amp has left its linear region with no signal (inputs "
                                + Quantities.volts(s.inPlusVolts()) + " and " + Quantities.volts(s.inMinusVolts()) + ")",
                        List.of(s.name()), "give the stage unity DC gain for its bias and bias it mid-window",
                        s.name(), level));
            } else if (window > 0 && Math.min(toLow, toHigh) < NEAR_RAIL_FRACTION * window) {
                out.add(Finding.at(REST_NEAR_RAIL, Severity.WARN, s.name() + ": the output rests at "
                                + Quantities.volts(s.outputVolts()) + ", " + Quantities.volts(Math.min(toLow, toHigh))
                                + " from its " + limit + String.format(Locale.ROOT, ", less than %.0f %% of its ",
                                NEAR_RAIL_FRACTION * 100) + Quantities.volts(window) + " swing window",
                        List.of(s.name()), "move the rest point towards the middle of the window", s.name(), level));
            }
            if (!s.commonModeOk()) {
                boolean plusOut = s.inPlusVolts() < s.commonModeLowVolts() || s.inPlusVolts() > s.commonModeHighVolts();
                double v = plusOut ? s.inPlusVolts() : s.inMinusVolts();
                out.add(Finding.at(CommonMode.CODE, Severity.FAIL, s.name() + ": the "
                                + (plusOut ? "non-inverting" : "inverting") + " input rests at " + Quantities.volts(v)
                                + ", outside the common-mode range " + Quantities.volts(s.commonModeLowVolts()) + " to "
                                + Quantities.volts(s.commonModeHighVolts()),
                        List.of(s.name()), "bias the inputs inside the range, or choose a part whose inputs reach that rail",
                        s.name(), v < s.commonModeLowVolts() ? LadderLevel.COMMON_MODE_LOW : LadderLevel.COMMON_MODE_HIGH));
            }
        }
        return out;
    }

    private static List<String> touching(Circuit circuit, String node) {
        List<String> parts = new ArrayList<>();
        for (Element e : circuit.elements()) {
            if (e.terminals().contains(node)) {
                parts.add(e.name());
            }
        }
        return parts;
    }

    /** A copy with each floating node tied to ground through {@link #TIE_OHMS}. */
    static Circuit tied(Circuit c, List<String> floating) {
        Set<String> names = new HashSet<>();
        for (Element e : c.elements()) {
            names.add(e.name().toLowerCase(Locale.ROOT));
        }
        Circuit.Builder b = c.toBuilder();
        int i = 0;
        for (String n : floating) {
            String name;
            do {
                name = "Rtie" + (++i);
            } while (names.contains(name.toLowerCase(Locale.ROOT)));
            b.add(new Resistor(name, n, Circuit.GROUND, TIE_OHMS));
        }
        return b.build();
    }
}
