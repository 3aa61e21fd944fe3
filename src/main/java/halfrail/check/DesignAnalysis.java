package halfrail.check;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.Element;
import halfrail.circuit.CurrentSource;
import halfrail.circuit.OpAmp;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.Resistor;
import halfrail.design.Design;
import halfrail.design.DesignCircuit;
import halfrail.design.DesignCircuits;
import halfrail.design.StageNodes;
import halfrail.design.Supply;
import halfrail.parts.CapacitorTechnology;
import halfrail.parts.LeakageLevel;
import halfrail.parts.PartsLibrary;
import halfrail.solve.AcAnalysis;
import halfrail.solve.AcPassband;
import halfrail.solve.AcSweep;
import halfrail.solve.AnalysisException;
import halfrail.solve.DcSensitivity;
import halfrail.solve.DcSolver;
import halfrail.solve.FloatingNodes;
import halfrail.solve.MnaSystem;
import halfrail.solve.OpAmpState;
import halfrail.solve.OperatingPoint;
import halfrail.solve.PowerOnOptions;
import halfrail.solve.PowerOnResult;
import halfrail.solve.PowerOnTransient;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * The one entry point of the check layer: analyse a design and get back every stage's
 * quiescent point and swing, the capacitors' voltages and corners, the chain's response, the
 * power-on transient, the supply current, one voltage ladder per op-amp and the findings.
 *
 * <p>Everything numeric comes from the engine: DC operating points at the nominal, lowest and
 * highest supply and at three leakage levels, small-signal responses at the nominal operating
 * point, and a power-on transient. Analysis failures of the engine become findings, never
 * exceptions (a failed power-on transient costs only the power-on figures); an invalid design
 * (a {@link halfrail.design.DesignException}) is thrown, naming the field.
 *
 * <p>Signal peaks are clip-aware (the package's {@code SignalEnvelope} has the details). In chain
 * order, signal stage k gets the drive factor D<sub>k</sub> (D<sub>1</sub> = 1); its demanded
 * output peak is P<sub>k</sub> = linear peak × D<sub>k</sub>; it can deliver at most
 * E<sub>k</sub>, the larger of its rooms above and below the rest point at the nominal supply;
 * and it passes on D<sub>k+1</sub> = D<sub>k</sub>·min(1, E<sub>k</sub>/P<sub>k</sub>). A
 * stage's input figures (non-inverting input, input and leg capacitors) scale by
 * D<sub>k</sub>, its output figures (swings, headroom, full-power bandwidth, ladder envelope) are
 * the demand P<sub>k</sub>, the output capacitor takes the drive after the last stage, and a
 * capacitor's signal never exceeds the E of the stage that drives it; the reference's figures
 * stay linear. {@link StageReport#drivenByClipped()} and {@link CapacitorReport#drivenByClipped()}
 * name the first clipping stage behind a reduced figure, and the findings about it say so. This
 * treats clipping as a drop in the drive — the waveform's peak cannot pass the window — a
 * describing-function-like bound, not a waveform simulation; with nothing clipping every figure
 * is the linear one.
 */
public final class DesignAnalysis {
    /** Code of the finding that stands for an engine failure; the report then holds no numbers. */
    public static final String ANALYSIS_FAILED = "ANALYSIS_FAILED";
    /**
     * Code of the finding that says the power-on transient failed; the report then has no
     * power-on figures but keeps every DC and AC result.
     */
    public static final String POWER_ON_FAILED = "POWER_ON_FAILED";
    /** Absolute temperature for thermal-noise figures, K (stated with every noise number). */
    public static final double NOISE_TEMPERATURE_KELVIN = 300;
    /** Boltzmann constant, J/K (SI 2019 exact value). */
    public static final double BOLTZMANN = 1.380649e-23;
    /** Points per decade of the band when integrating noise. */
    static final int NOISE_POINTS_PER_DECADE = 20;
    /** The chain's response is searched for its peak and corners from this factor below the band to this factor above. */
    static final double RESPONSE_RANGE_FACTOR = 1000;
    /** The power-on transient runs at most this many times the settle-time limit, s. */
    static final double POWER_ON_RUN_FACTOR = 5;
    /** The plotted response curves run from this factor below the band to this factor above. */
    static final double PLOT_RANGE_FACTOR = 100;

    private DesignAnalysis() {}

    /** Analyse {@code design} with default options (power-on transient included). */
    public static DesignReport analyse(Design design) {
        return analyse(design, true);
    }

    /**
     * Analyse {@code design}.
     *
     * @param withPowerOn whether to run the power-on transient (the costliest part)
     * @throws halfrail.design.DesignException when the design is invalid (the path names the field)
     */
    public static DesignReport analyse(Design design, boolean withPowerOn) {
        DesignCircuit nominal = DesignCircuits.nominal(design);
        List<String> floating = FloatingNodes.find(nominal.circuit());
        if (!floating.isEmpty()) {
            List<Finding> findings = new ArrayList<>();
            for (String node : floating) {
                findings.add(NoDcPath.finding(nominal, node));
            }
            findings.addAll(SupplyAndRuntime.beforeSolve(design.supply(), nominal));
            return new DesignReport(design, Optional.of(AnalysisException.Kind.FLOATING_NODE),
                    "no DC path at " + String.join(", ", floating), floating, Map.of(), List.of(), List.of(),
                    Optional.empty(), Optional.empty(), Optional.empty(), List.of(), findings);
        }
        try {
            return new Workup(design, nominal, withPowerOn).report();
        } catch (AnalysisException e) {
            List<Finding> findings = new ArrayList<>();
            findings.add(Finding.of(ANALYSIS_FAILED, Severity.FAIL,
                    "the circuit could not be solved (" + e.kind() + "): " + e.getMessage(),
                    List.of(), "check for an op-amp outside its supply range or values far outside the usual range, "
                            + "or simplify the circuit to find the cause"));
            findings.addAll(SupplyAndRuntime.beforeSolve(design.supply(), nominal));
            return new DesignReport(design, Optional.of(e.kind()), e.getMessage(), List.of(), Map.of(), List.of(),
                    List.of(), Optional.empty(), Optional.empty(), Optional.empty(), List.of(), findings);
        }
    }

    /** The computations behind one report. */
    private static final class Workup {
        private final Design design;
        private final DesignCircuit nominal;
        private final boolean withPowerOn;
        private final PartsLibrary parts = PartsLibrary.builtIn();
        private final double sourcePeak;
        /** The nominal circuit's equations: variants with its topology share their unknowns and pattern. */
        private MnaSystem nominalSystem;
        /** The solver of the last variant solved, whose work the next one takes over. */
        private DcSolver variantSolver;

        Workup(Design design, DesignCircuit nominal, boolean withPowerOn) {
            this.design = design;
            this.nominal = nominal;
            this.withPowerOn = withPowerOn;
            this.sourcePeak = design.source().voltsPeak();
        }

        DesignReport report() {
            Supply supply = design.supply();
            DcSolver solver = new DcSolver(MnaSystem.of(nominal.circuit()));
            OperatingPoint op = solver.solve();
            nominalSystem = op.system();
            double[] guess = op.solution();
            OperatingPoint low = solve(DesignCircuits.build(design, supply.lowVolts(), LeakageLevel.TYPICAL), guess);
            OperatingPoint high = solve(DesignCircuits.build(design, supply.highVolts(), LeakageLevel.TYPICAL), guess);
            DesignCircuit noLeakCircuit = DesignCircuits.build(design, supply.nominalVolts(), LeakageLevel.NONE);
            OperatingPoint noLeak = solve(noLeakCircuit, guess);
            OperatingPoint limitLeak = solve(DesignCircuits.build(design, supply.nominalVolts(), LeakageLevel.LIMIT),
                    guess);
            OperatingPoint noBias = solve(withoutBiasCurrents(nominal.circuit()), guess);
            Map<String, OperatingPoint> oneLeaking = new LinkedHashMap<>();
            List<Element> noLeakElements = noLeakCircuit.circuit().elements();
            for (int i = 0; i < noLeakElements.size(); i++) {
                if (!(noLeakElements.get(i) instanceof Capacitor c) || c.technology().isEmpty()) {
                    continue;
                }
                double g = technology(c).leakageSiemens(c.farads(), c.ratedVolts(), LeakageLevel.LIMIT);
                List<Element> changed = new ArrayList<>(noLeakElements);
                changed.set(i, c.withLeakage(g));
                oneLeaking.put(c.name(), solve(noLeakCircuit.circuit().withValues(changed), guess));
            }

            AcAnalysis ac = new AcAnalysis(op);
            DcSensitivity linear = DcSensitivity.ignoringLimits(op);
            double bandLow = design.source().bandLowHz();
            double bandHigh = design.source().bandHighHz();
            String sig = nominal.signalSource();

            // Signal peaks along the chain, each stage's drive reduced by the clipping of those before it.
            SignalEnvelope envelope = SignalEnvelope.of(nominal, op, ac, design.source());
            List<StageReport> stages = new ArrayList<>();
            List<Ladder> ladders = new ArrayList<>();
            List<StageNodes> opAmps = nominal.opAmps();
            // The drives at the end-point and fresh supplies, through those supplies' windows.
            double driveLow = 1;
            double driveHigh = 1;
            for (int k = 0; k < opAmps.size(); k++) {
                StageNodes sn = opAmps.get(k);
                OpAmpState st = op.opAmp(sn.opAmp()).orElseThrow();
                OpAmpState stLow = low.opAmp(sn.opAmp()).orElseThrow();
                OpAmpState stHigh = high.opAmp(sn.opAmp()).orElseThrow();
                OpAmpParams p = ((OpAmp) nominal.circuit().element(sn.opAmp()).orElseThrow()).params();
                double signalPeak = envelope.outputPeakVolts(k);
                double inputPeak = envelope.inputPeakVolts(k);
                double centre = Math.sqrt(bandLow * bandHigh);
                double stageGain;
                if (sn.signal()) {
                    // The stage's own gain: its output over the signal at its own input node, so that
                    // a saturated stage before it (which passes almost nothing) does not inflate it.
                    double before = ac.response(sig, sn.input(), centre).magnitude();
                    double after = ac.response(sig, sn.out(), centre).magnitude();
                    stageGain = before > 0 ? after / before : 0;
                } else {
                    stageGain = 0;
                }
                SwingReport swNom = envelope.swing(k, nominal.supplyVolts(), st.outputVolts(), st.swingLowVolts(),
                        st.swingHighVolts(), st.saturated());
                SwingReport swLow = envelope.swing(k, sn.signal() ? driveLow : 1, supply.lowVolts(),
                        stLow.outputVolts(), stLow.swingLowVolts(), stLow.swingHighVolts(), stLow.saturated());
                SwingReport swHigh = envelope.swing(k, sn.signal() ? driveHigh : 1, supply.highVolts(),
                        stHigh.outputVolts(), stHigh.swingLowVolts(), stHigh.swingHighVolts(), stHigh.saturated());
                driveLow = envelope.passOn(k, driveLow, stLow.outputVolts(), stLow.swingLowVolts(),
                        stLow.swingHighVolts());
                driveHigh = envelope.passOn(k, driveHigh, stHigh.outputVolts(), stHigh.swingLowVolts(),
                        stHigh.swingHighVolts());
                double biasGain = linear.gainFromNode(nominal.referenceNode(), sn.out());
                if (!sn.signal()) {
                    biasGain = linear.gainFromNode("ref", sn.out());
                }
                double outNoLeak = noLeak.voltage(sn.out());
                double drift = limitLeak.voltage(sn.out()) - outNoLeak;
                Map<String, Double> byCap = new LinkedHashMap<>();
                oneLeaking.forEach((name, o) -> byCap.put(name, o.voltage(sn.out()) - outNoLeak));
                double biasShift = op.voltage(sn.inPlus()) - noBias.voltage(sn.inPlus());
                // The slew rate follows the swing the output makes, not a clipped stage's demand.
                double slewPeak = swNom.deliveredPeakVolts();
                OptionalDouble fullPower = slewPeak > 0
                        ? OptionalDouble.of(p.slewRateVoltsPerSecond() / (2 * Math.PI * slewPeak))
                        : OptionalDouble.empty();
                boolean supplyOk = SupplyAndRuntime.inRange(supply, p);
                boolean cmPeaks = st.inPlusVolts() - inputPeak >= st.commonModeLowVolts()
                        && st.inPlusVolts() + inputPeak <= st.commonModeHighVolts();
                stages.add(new StageReport(sn.label(), sn.designPath(), sn.opAmp(), sn.signal(), st.inPlusVolts(),
                        st.inMinusVolts(), st.commonModeLowVolts(), st.commonModeHighVolts(), st.commonModeOk(),
                        inputPeak, cmPeaks, swNom, swLow, swHigh, stageGain, biasGain, drift, byCap, biasShift,
                        fullPower, supplyOk, envelope.driveFactor(k), envelope.clippedBefore(k), List.of()));
                ladders.add(new Ladder(sn.label(), sn.designPath(), nominal.supplyVolts(), supply.lowVolts(),
                        st.swingLowVolts(), st.swingHighVolts(), stLow.swingHighVolts(), st.commonModeLowVolts(),
                        st.commonModeHighVolts(), op.voltage(nominal.referenceNode()), st.outputVolts(),
                        st.outputVolts() - signalPeak, st.outputVolts() + signalPeak, OptionalDouble.empty(),
                        OptionalDouble.empty(), drift));
            }

            List<CapacitorReport> capacitors = new ArrayList<>();
            for (Capacitor c : technologyCapacitors(nominal.circuit())) {
                CapacitorTechnology tech = technology(c);
                double dc = op.voltage(c.plus()) - op.voltage(c.minus());
                double dcLow = low.voltage(c.plus()) - low.voltage(c.minus());
                double dcHigh = high.voltage(c.plus()) - high.voltage(c.minus());
                SignalEnvelope.CapacitorSignal signal = envelope.capacitor(nominal.designPath(c.name()),
                        ac.peakMagnitude(sig, c.plus(), c.minus(), bandLow, bandHigh) * sourcePeak);
                double sigPeak = signal.peakVolts();
                double worst = Math.max(Math.abs(dc), Math.max(Math.abs(dcLow), Math.abs(dcHigh))) + sigPeak;
                double override = design.thresholds().capacitorDeratingOverride();
                double derated = override > 0 ? override * c.ratedVolts() : tech.deratedVolts(c.ratedVolts());
                OptionalDouble seen = seenOhms(ac, c, Math.sqrt(bandLow * bandHigh));
                OptionalDouble corner = seen.isPresent()
                        ? OptionalDouble.of(1 / (2 * Math.PI * seen.getAsDouble() * c.farads())) : OptionalDouble.empty();
                double leak = tech.leakageAmps(c.farads(), c.ratedVolts(), Math.abs(dc), LeakageLevel.LIMIT);
                capacitors.add(new CapacitorReport(c.name(), nominal.designPath(c.name()), tech.id(), c.farads(), dc,
                        sigPeak, worst, c.ratedVolts(), derated, c.polarised(), seen, corner, leak, signal.drivenByClipped()));
            }

            ChainReport chain = chain(ac);
            BatteryReport battery = battery(op);
            Optional<PowerOnReport> powerOn = Optional.empty();
            AnalysisException powerOnFailure = null;
            if (withPowerOn) {
                try {
                    powerOn = Optional.of(powerOn(op));
                } catch (AnalysisException e) {
                    // The DC and AC results stand; only the power-on figures are missing.
                    powerOnFailure = e;
                }
            }

            Evidence evidence = new Evidence(design, nominal, stages, capacitors, chain, powerOn, battery);
            List<Finding> findings = new ArrayList<>();
            for (DesignCheck check : Checks.ALL) {
                check.inspect(evidence, findings);
            }
            if (powerOnFailure != null) {
                findings.add(Finding.of(POWER_ON_FAILED, Severity.WARN, "the power-on transient could not be computed ("
                                + powerOnFailure.kind() + "): " + powerOnFailure.getMessage()
                                + "; the settle-up, start-rail and start-step checks were not made",
                        List.of("thresholds.maxSettleSeconds", "powerOnRampSeconds"),
                        "check the settle-time limit and the supply ramp for values far outside the usual range"));
            }
            List<StageReport> withCodes = new ArrayList<>();
            for (StageReport s : stages) {
                withCodes.add(s.withFindings(findings.stream()
                        .filter(f -> f.opAmp().filter(s.label()::equals).isPresent())
                        .map(Finding::code).distinct().toList()));
            }
            return new DesignReport(design, Optional.empty(), "", List.of(), op.nodeVolts(), withCodes, capacitors,
                    Optional.of(chain), powerOn, Optional.of(battery), ladders, findings);
        }

        /**
         * The resistance capacitor {@code c} sees at {@code hz} (the middle of the band), Ω: the
         * magnitude of the impedance between its terminals with the capacitor itself taken out,
         * every source held, and every other capacitor at its impedance there — coupling and
         * decoupling capacitors all but short. This is the resistance of the short-circuit
         * time-constant method for low-frequency corners (Sedra and Smith, Microelectronic
         * Circuits, low-frequency response of amplifiers — from memory); the DC resistance would
         * count, say, the divider behind a decoupled reference that the band never sees. The
         * capacitor is taken out of the nominal linearisation ({@link AcAnalysis#impedanceWithout}):
         * one more factorisation of the analysis already made, at the nominal operating point.
         * Empty when the circuit without the capacitor is singular at hz: a long cascade sharing one
         * soft reference can close a loop whose gain (the product of the stage gains, 1e16 for
         * sixteen stages of 11) leaves that circuit singular to working precision. The figure only
         * feeds the corner suggestion, so the rest of the analysis stands without it.
         */
        private OptionalDouble seenOhms(AcAnalysis ac, Capacitor c, double hz) {
            try {
                double ohms = ac.impedanceWithout(c.name(), hz).magnitude();
                return Double.isFinite(ohms) ? OptionalDouble.of(ohms) : OptionalDouble.empty();
            } catch (AnalysisException e) {
                if (e.kind() != AnalysisException.Kind.SINGULAR) {
                    throw e;
                }
                return OptionalDouble.empty();
            }
        }

        private ChainReport chain(AcAnalysis ac) {
            double bandLow = design.source().bandLowHz();
            double bandHigh = design.source().bandHighHz();
            AcPassband pb = ac.passband(nominal.signalSource(), nominal.loadNode(), bandLow / RESPONSE_RANGE_FACTOR,
                    bandHigh * RESPONSE_RANGE_FACTOR);
            Supply supply = design.supply();
            double rippleGain = 0;
            double ripple = 0;
            if (supply.rippleVoltsPeak() > 0) {
                // AcAnalysis answers per unit of the named source whatever its AC magnitude (0 for
                // the supply), so this is the supply-to-load transfer; scaled by the ripple below.
                rippleGain = ac.response(nominal.supplySource(), nominal.loadNode(), supply.rippleHz()).magnitude();
                ripple = rippleGain * supply.rippleVoltsPeak();
            }
            return new ChainReport(bandLow, bandHigh, pb.peakMagnitude(), pb.peakHz(), pb.lowerCornerHz(),
                    pb.upperCornerHz(), ripple, rippleGain,
                    ReferenceNoise.voltsRms(ac, nominal.loadNode(), bandLow, bandHigh), responses(ac));
        }

        /** The gain from the source to each signal stage's output and to the load, for plots. */
        private List<ResponseCurve> responses(AcAnalysis ac) {
            double lo = design.source().bandLowHz() / PLOT_RANGE_FACTOR;
            double hi = design.source().bandHighHz() * PLOT_RANGE_FACTOR;
            int points = (int) Math.ceil(Math.log10(hi / lo) * ResponseCurve.POINTS_PER_DECADE) + 1;
            List<ResponseCurve> curves = new ArrayList<>();
            for (StageNodes sn : nominal.opAmps()) {
                if (sn.signal()) {
                    curves.add(curve(ac, sn.label(), sn.out(), false, lo, hi, points));
                }
            }
            curves.add(curve(ac, ResponseCurve.LOAD_LABEL, nominal.loadNode(), true, lo, hi, points));
            return curves;
        }

        private ResponseCurve curve(AcAnalysis ac, String label, String node, boolean atLoad, double lo, double hi,
                                    int points) {
            AcSweep sw = ac.sweep(nominal.signalSource(), node, lo, hi, points);
            OptionalDouble corner = ac.lowerCornerHz(nominal.signalSource(), node,
                    design.source().bandLowHz() / RESPONSE_RANGE_FACTOR,
                    design.source().bandHighHz() * RESPONSE_RANGE_FACTOR);
            return new ResponseCurve(label, node, atLoad, sw.frequenciesHz(), sw.magnitudeDb(), corner);
        }

        private BatteryReport battery(OperatingPoint op) {
            double total = op.current(nominal.supplySource());
            Resistor ra = (Resistor) nominal.circuit().element("RA").orElseThrow();
            double divider = (op.voltage(ra.a()) - op.voltage(ra.b())) / ra.ohms();
            double opAmps = op.opAmps().stream().mapToDouble(OpAmpState::supplyAmps).sum();
            double leakage = 0;
            for (Capacitor c : nominal.circuit().elements(Capacitor.class)) {
                leakage += c.leakageSiemens() * Math.abs(op.voltage(c.plus()) - op.voltage(c.minus()));
            }
            OptionalDouble capacity = design.supply().capacityAmpHours();
            OptionalDouble runtime = capacity.isPresent() && total > 0
                    ? OptionalDouble.of(capacity.getAsDouble() / total) : OptionalDouble.empty();
            return new BatteryReport(total, divider, opAmps, leakage, capacity, runtime);
        }

        private PowerOnReport powerOn(OperatingPoint op) {
            double band = design.thresholds().settleBandFraction() * nominal.supplyVolts();
            List<String> watched = new ArrayList<>();
            for (StageNodes sn : nominal.opAmps()) {
                watched.add(sn.out());
            }
            watched.add(nominal.loadNode());
            double stop = Math.max(design.thresholds().maxSettleSeconds() * POWER_ON_RUN_FACTOR,
                    10 * design.powerOnRampSeconds());
            PowerOnOptions options = PowerOnOptions.of(stop).withSettleBand(band)
                    .withWatchedNodes(watched.toArray(new String[0])).withLoadNodes(nominal.loadNode());
            PowerOnResult r = PowerOnTransient.run(nominal.circuit(), options);
            Map<String, Double> pinned = new LinkedHashMap<>();
            for (StageNodes sn : nominal.opAmps()) {
                r.railTime(sn.opAmp()).ifPresent(t -> pinned.put(sn.label(), t.secondsOnRail()));
            }
            double step = r.loadStep(nominal.loadNode()).map(PowerOnResult.LoadStep::peakDeviationVolts).orElse(0.0);
            OptionalDouble settle = r.settleTimeSeconds().map(OptionalDouble::of).orElse(OptionalDouble.empty());
            double[] times = r.timesSeconds();
            return new PowerOnReport(r.settled(), settle, band, times[times.length - 1], pinned, step,
                    Optional.of(trace(r)), r.oscillation());
        }

        /** Every op-amp output and the load, sampled at evenly spaced times over the run. */
        private PowerOnTrace trace(PowerOnResult r) {
            double[] accepted = r.timesSeconds();
            double end = accepted[accepted.length - 1];
            int n = Math.min(PowerOnTrace.MAX_SAMPLES, Math.max(2, accepted.length));
            double[] t = new double[n];
            for (int i = 0; i < n; i++) {
                t[i] = i == n - 1 ? end : end * i / (n - 1);
            }
            Map<String, double[]> outputs = new LinkedHashMap<>();
            for (StageNodes sn : nominal.opAmps()) {
                outputs.put(sn.label(), sample(r, sn.out(), t));
            }
            return new PowerOnTrace(t, outputs, sample(r, nominal.loadNode(), t));
        }

        private static double[] sample(PowerOnResult r, String node, double[] t) {
            double[] v = new double[t.length];
            for (int i = 0; i < t.length; i++) {
                v[i] = r.voltageAt(node, t[i]);
            }
            return v;
        }

        private OperatingPoint solve(DesignCircuit dc, double[] guess) {
            return solve(dc.circuit(), guess);
        }

        private OperatingPoint solve(Circuit c, double[] guess) {
            DcSolver s;
            if (nominalSystem != null && nominalSystem.hasTopologyOf(c)) {
                // A variant of the nominal circuit: one solver's arrays and sparse factors serve them all.
                MnaSystem system = nominalSystem.withValuesOf(c);
                s = variantSolver == null ? new DcSolver(system) : variantSolver.reusedFor(system);
                variantSolver = s;
            } else {
                s = new DcSolver(MnaSystem.of(c));
            }
            try {
                return s.solveFrom(guess);
            } catch (AnalysisException e) {
                if (e.kind() == AnalysisException.Kind.NO_CONVERGENCE || e.kind() == AnalysisException.Kind.SINGULAR) {
                    return s.solve();
                }
                throw e;
            }
        }

        private Circuit withoutBiasCurrents(Circuit c) {
            List<Element> elements = new ArrayList<>(c.elements());
            for (int i = 0; i < elements.size(); i++) {
                if (elements.get(i) instanceof OpAmp o) {
                    OpAmpParams p = o.params();
                    elements.set(i, o.withParams(p.withInputErrors(p.offsetVolts(), 0, 0)));
                }
            }
            return c.withValues(elements);
        }

        private List<Capacitor> technologyCapacitors(Circuit c) {
            return c.elements(Capacitor.class).stream().filter(x -> !x.technology().isEmpty()).toList();
        }

        private CapacitorTechnology technology(Capacitor c) {
            return parts.requireCapacitorTechnology(c.technology());
        }
    }
}
