package halfrail.convert;

import halfrail.units.Quantities;
import halfrail.check.DesignAnalysis;
import halfrail.check.DesignReport;
import halfrail.check.StageReport;
import halfrail.check.SwingReport;
import halfrail.circuit.OpAmpParams;
import halfrail.design.CapacitorSpec;
import halfrail.design.Design;
import halfrail.design.DesignCircuit;
import halfrail.design.DesignCircuits;
import halfrail.design.Load;
import halfrail.design.OpAmpChoice;
import halfrail.design.Reference;
import halfrail.design.ReferenceKind;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.design.StageNodes;
import halfrail.design.Supply;
import halfrail.design.Thresholds;
import halfrail.parts.OpAmpArchetype;
import halfrail.parts.PartsLibrary;
import halfrail.solve.AcAnalysis;
import halfrail.solve.AnalysisException;
import halfrail.solve.DcSolver;
import halfrail.solve.MnaSystem;
import halfrail.solve.OperatingPoint;
import halfrail.solve.PowerOnOptions;
import halfrail.solve.PowerOnResult;
import halfrail.solve.PowerOnTransient;
import halfrail.units.ESeries;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.OptionalDouble;

/**
 * Converts a dual-rail stage or chain to one supply: a mid-rail reference, bias resistors,
 * coupling and feedback-leg capacitors, each from the E-series and a suitable technology, with
 * the chain's real lower −3 dB point verified by the engine.
 *
 * <p><b>Reference.</b> A divider of two equal E24 resistors, {@link #DEFAULT_DIVIDER_OHMS} each
 * (common practice: 10 kΩ or more), raised when a current or runtime limit leaves less for it
 * (the divider may take {@link #DIVIDER_SHARE} of what the op-amps leave). It is decoupled by a
 * capacitor whose corner with the divider's Thevenin resistance lies {@link #REFERENCE_CORNER_FACTOR}
 * below the band, and feeds the stages through a bias resistor ({@link ReferenceKind#DIVIDER_DECOUPLED}).
 * <b>Buffered rule:</b> the op-amps' bias currents flow through the bias resistor and, at DC,
 * through the divider's Thevenin resistance; when the divider is so high-impedance that this
 * shift, even with the smallest bias resistor allowed ({@link #MIN_BIAS_OHMS}), exceeds
 * {@link #BIAS_SHIFT_SHARE} of the design's bias-shift limit, a follower buffers the divider
 * ({@link ReferenceKind#DIVIDER_BUFFERED}) so that only its own bias current meets the divider.
 * <b>Off mid-rail:</b> when the op-amps' output windows are lopsided (a part that reaches ground
 * but not the positive rail), one divider resistor is raised in E24 (so the divider never draws
 * more) to put the reference where the worst room for the signal over the supply points is
 * largest, if that gains at least {@link #CENTRING_MIN_GAIN}; the end-point usually decides.
 *
 * <p><b>Corners.</b> The first stage's input capacitor, each non-inverting stage's leg
 * capacitor and the output capacitor each form a high-pass network. With n networks, each
 * corner is placed at {@code bandLow·√(2^(1/n) − 1) / CORNER_MARGIN} — n equal buffered
 * first-order corners at f<sub>c</sub> give a combined −3 dB point of f<sub>c</sub>/√(2^(1/n) − 1)
 * (exact; two give f<sub>c</sub>/0.6436) — and the values are rounded up in the E-series. The
 * engine then finds the chain's real corner; while it lies above the band, every corner-setting
 * capacitor is enlarged by the miss and the design analysed again, at most
 * {@link #MAX_CORNER_ITERATIONS} times. Stages after the first are DC-coupled: each output rests
 * at the reference, which is where the next input wants to be.
 *
 * <p><b>Resistors.</b> R1 and R2 are the original's. When R2 exceeds the design's feedback
 * resistance limit (100 kΩ, common practice) both are divided by the same power of ten, keeping
 * the gain and the E-series membership, as long as R1 stays at or above {@link #MIN_LEG_OHMS};
 * a stage gain above the design's limit (50, common practice) is kept and said so.
 *
 * <p><b>Op-amps.</b> The original's op-amp is kept when it works on the new supply (its supply
 * range, its input range around mid-rail with the signal, and its output swing with the
 * design's headroom at nominal and no clipping at the end-point). Otherwise the archetype of
 * the parts library that does, preferring enough gain-bandwidth and slew rate for the band and
 * then the lowest quiescent current.
 *
 * <p><b>Conflicts.</b> The band and the settle-up limit: {@link ConversionLimits#priority()} says
 * which wins (the band by default); the trade-off curve shows the price. Bias shift against a
 * current limit: the operating point wins, the divider is lowered until the shift fits and the
 * current limit is reported missed.
 */
public final class Converter {
    /** Most design–analyse rounds for the lower corner; beyond it the conversion ends in {@link AnalysisException.Kind#NO_CONVERGENCE}. */
    public static final int MAX_CORNER_ITERATIONS = 8;
    /** Each network's corner lies this factor below its share of the band's low end. */
    public static final double CORNER_MARGIN = 1.25;
    /** When the engine finds the corner above the band, capacitors grow by the miss times this. */
    public static final double CORNER_STEP_MARGIN = 1.1;
    /** Each divider resistor by default, Ω (common practice: two equal resistors of 10 kΩ or more). */
    public static final double DEFAULT_DIVIDER_OHMS = 100e3;
    /** Lowest divider resistor the bias-shift rule may go down to, Ω (common practice). */
    public static final double MIN_DIVIDER_OHMS = 10e3;
    /** Highest divider resistor a current limit may ask for, Ω. */
    public static final double MAX_DIVIDER_OHMS = 10e6;
    /** Share of the current left after the op-amps that the divider may draw. */
    public static final double DIVIDER_SHARE = 0.5;
    /** Bias resistor by default, Ω: the first stage's input resistance (common practice). */
    public static final double DEFAULT_BIAS_OHMS = 100e3;
    /** Largest bias resistor, Ω (common practice: above about 1 MΩ leakage and noise pick-up take over). */
    public static final double MAX_BIAS_OHMS = 1e6;
    /** The bias resistor is made at least this many times the source resistance, so the input loads it by 1 % or less (where the bias-shift rule allows). */
    public static final double SOURCE_LOADING_RATIO = 100;
    /** Smallest bias resistor, Ω: below it the input loads the source (common practice). */
    public static final double MIN_BIAS_OHMS = 10e3;
    /** Share of the design's bias-shift limit the bias resistors and divider may use together. */
    public static final double BIAS_SHIFT_SHARE = 0.5;
    /** Smallest R1 left after scaling R1 and R2 down, Ω (common practice: lower loads the op-amp). */
    public static final double MIN_LEG_OHMS = 100;
    /** Largest ratio between the two divider resistors when the reference is moved off mid-rail. */
    public static final double CENTRING_MAX_RATIO = 4;
    /** Moving the reference off mid-rail must raise the worst room for the signal by at least this fraction. */
    public static final double CENTRING_MIN_GAIN = 0.1;
    /** The reference's decoupling corner lies this factor below the band's low end. */
    public static final double REFERENCE_CORNER_FACTOR = 10;
    /** Isolation resistor between a reference buffer and its capacitor, Ω (common practice: stability into a large capacitor). */
    public static final double ISOLATION_OHMS = 1e3;
    /** The chain's response is searched from this factor below the band to this factor above (as the checks do). */
    public static final double RESPONSE_RANGE_FACTOR = 1000;
    /** Points on the trade-off curve. */
    public static final int TRADE_OFF_POINTS = 6;
    /** The power-on run lasts at least this many times the sum of the design's time constants, s. */
    public static final double SETTLE_RUN_TIME_CONSTANTS = 10;
    /** ln(50): a node stepping by half the rail settles to 1 % of the rail after this many time constants (exact from e^(−t/τ)). */
    static final double SETTLE_TIME_CONSTANTS = Math.log(50);

    private Converter() {}

    /**
     * Convert {@code request}.
     *
     * @throws ConversionException when the request names an unknown part
     * @throws AnalysisException   when the engine cannot solve a candidate, or the corner does not
     *                             come into the band within {@link #MAX_CORNER_ITERATIONS}
     */
    public static ConversionResult convert(ConversionRequest request) {
        return new Run(request).run();
    }

    /** The chain's real lower −3 dB point of {@code design} from the engine, Hz (empty: none in range). */
    public static OptionalDouble lowerCornerHz(Design design) {
        DesignCircuit dc = DesignCircuits.nominal(design);
        OperatingPoint op = new DcSolver(MnaSystem.of(dc.circuit())).solve();
        AcAnalysis ac = new AcAnalysis(op);
        double lo = design.source().bandLowHz();
        double hi = design.source().bandHighHz();
        return ac.passband(dc.signalSource(), dc.loadNode(), lo / RESPONSE_RANGE_FACTOR, hi * RESPONSE_RANGE_FACTOR)
                .lowerCornerHz();
    }

    /** A settle-up measurement: the time, when the run settled, and how long the run went. */
    record Settle(OptionalDouble seconds, double simulatedSeconds) {
        double atLeast() {
            return seconds.isPresent() ? seconds.getAsDouble() : simulatedSeconds;
        }
    }

    /** The power-on transient of {@code design} at its nominal supply, run for at least {@code stopSeconds}. */
    static Settle settle(Design design, double stopSeconds) {
        DesignCircuit dc = DesignCircuits.nominal(design);
        List<String> watched = new ArrayList<>();
        for (StageNodes sn : dc.opAmps()) {
            watched.add(sn.out());
        }
        watched.add(dc.loadNode());
        double stop = Math.max(stopSeconds, 10 * design.powerOnRampSeconds());
        // Run to the stop time even when a node keeps oscillating: the search compares "at least
        // the run's length" with the settle-up limit, which a run cut short on the oscillation
        // would understate.
        PowerOnOptions options = PowerOnOptions.of(stop)
                .withSettleBand(design.thresholds().settleBandFraction() * dc.supplyVolts())
                .withWatchedNodes(watched.toArray(new String[0])).withLoadNodes(dc.loadNode())
                .withStopWhenOscillating(false);
        PowerOnResult r = PowerOnTransient.run(dc.circuit(), options);
        double[] times = r.timesSeconds();
        return new Settle(r.settleTimeSeconds().map(OptionalDouble::of).orElse(OptionalDouble.empty()),
                times[times.length - 1]);
    }

    /** One assembled candidate: the design, its time constants and the changes its parts make. */
    record Build(Design design, double timeConstantSumSeconds, List<Change> partChanges) {}

    private static final class Run {
        private final ConversionRequest req;
        private final DualRailChain original;
        private final Supply supply;
        private final Thresholds thresholds;
        private final double bandLow;
        private final List<Change> changes = new ArrayList<>();
        private final List<Conflict> conflicts = new ArrayList<>();
        private final List<OpAmpChoice> opAmps = new ArrayList<>();
        private final List<double[]> resistors = new ArrayList<>();
        private double dividerOhms = DEFAULT_DIVIDER_OHMS;
        private double upperOhms = DEFAULT_DIVIDER_OHMS;
        private double lowerOhms = DEFAULT_DIVIDER_OHMS;
        private final List<double[]> peaks = new ArrayList<>();
        private double biasOhms = DEFAULT_BIAS_OHMS;
        private OpAmpChoice buffer;
        private OptionalDouble currentBudget = OptionalDouble.empty();

        Run(ConversionRequest req) {
            this.req = req;
            this.original = req.original();
            this.supply = req.supply();
            this.bandLow = req.signal().bandLowHz();
            Thresholds d = Thresholds.defaults();
            ConversionLimits l = req.limits();
            this.thresholds = new Thresholds(d.settleBandFraction(),
                    l.maxSettleSeconds().orElse(d.maxSettleSeconds()), d.minHeadroomDb(), d.offCentreDb(),
                    d.nearRailFraction(), d.maxLeakageDriftVolts(), d.maxRippleVolts(), d.maxBiasShiftVolts(),
                    d.maxStepVolts(), d.maxStageGain(), d.maxFeedbackOhms(), l.minRuntimeHours().orElse(0),
                    d.capacitorDeratingOverride());
        }

        ConversionResult run() {
            changes.add(new Change(ChangeKind.SUPPLY_REPLACED, "supply",
                    "+" + Quantities.volts(original.positiveVolts()) + "/−" + Quantities.volts(original.negativeVolts())
                            + " (" + Quantities.volts(original.totalVolts()) + " total)",
                    Quantities.volts(supply.nominalVolts()) + " nominal, " + Quantities.volts(supply.lowVolts()) + " to "
                            + Quantities.volts(supply.highVolts()),
                    "one rail: every stage now rests at a reference near mid-rail instead of at ground"));
            chooseOpAmps();
            checkResistors();
            chooseReference();
            centreReference();

            double scale = 1;
            Build build = null;
            int iteration = 0;
            OptionalDouble corner = OptionalDouble.empty();
            while (true) {
                iteration++;
                if (iteration > MAX_CORNER_ITERATIONS) {
                    throw new AnalysisException(AnalysisException.Kind.NO_CONVERGENCE,
                            "the chain's lower corner stayed at " + Quantities.hertz(corner.getAsDouble())
                                    + ", above the band's low end " + Quantities.hertz(bandLow) + ", after "
                                    + MAX_CORNER_ITERATIONS + " rounds of enlarging the capacitors");
                }
                build = build(bandLow, scale);
                corner = lowerCornerHz(build.design());
                if (corner.isEmpty() || corner.getAsDouble() <= bandLow) {
                    break;
                }
                scale *= corner.getAsDouble() / bandLow * CORNER_STEP_MARGIN;
            }
            if (iteration > 1) {
                changes.add(new Change(ChangeKind.CAPACITORS_ENLARGED, "", "sized from the corner rule",
                        String.format(java.util.Locale.ROOT, "×%.2f", scale),
                        "the engine found the chain's real corner above " + Quantities.hertz(bandLow)
                                + " with the first choice; after " + iteration + " rounds it is "
                                + corner.stream().mapToObj(Quantities::hertz).findFirst().orElse("below the range")));
            }
            Build chosen = build;
            double tauSum = chosen.timeConstantSumSeconds();
            Settle settle = settle(chosen.design(), runLength(tauSum));
            List<TradeOffPoint> curve = tradeOff(scale, settle);

            if (req.limits().maxSettleSeconds().isPresent()) {
                double limit = req.limits().maxSettleSeconds().getAsDouble();
                if (settle.seconds().isEmpty() || settle.seconds().getAsDouble() > limit) {
                    chosen = settleConflict(chosen, scale, settle, curve, limit, corner);
                }
            }
            changes.addAll(chosen.partChanges());
            Design design = chosen.design();
            DesignReport report = DesignAnalysis.analyse(design);
            if (report.failure().isPresent()) {
                throw new AnalysisException(report.failure().get(),
                        "the converted design could not be analysed: " + report.failureMessage(), report.floatingNodes());
            }
            checkCurrent(report);
            Settle finalSettle = chosen == build ? settle : settle(design, runLength(chosen.timeConstantSumSeconds()));
            Comparison comparison = new Comparison(
                    DualRailAnalysis.analyse(original, req.signal(), req.loadOhms(), req.loadFarads()),
                    after(report, finalSettle));
            return new ConversionResult(req, design, report, comparison, changes, conflicts, curve, iteration);
        }

        private double runLength(double tauSum) {
            double limit = req.limits().maxSettleSeconds().orElse(0);
            return Math.max(SETTLE_RUN_TIME_CONSTANTS * tauSum, 5 * limit);
        }

        // ---------------------------------------------------------------- op-amps and resistors

        private void chooseOpAmps() {
            PartsLibrary parts = PartsLibrary.builtIn();
            double peakIn = req.signal().voltsPeak();
            for (int i = 0; i < original.stages().size(); i++) {
                DualRailStage s = original.stages().get(i);
                double peakOut = peakIn * Math.abs(s.gain());
                double plusPeak = s.kind() == StageKind.INVERTING ? 0 : peakIn;
                String path = "stages[" + i + "].opAmp";
                OpAmpParams own = DesignCircuits.params(s.opAmp(), "original." + path);
                Fit ownFit = fit(own, plusPeak, peakOut, s.noiseGain());
                if (ownFit.hard()) {
                    opAmps.add(s.opAmp());
                } else {
                    OpAmpArchetype best = parts.opAmpArchetypes().stream()
                            .filter(a -> fit(a.typical(), plusPeak, peakOut, s.noiseGain()).hard())
                            .min(Comparator.comparing((OpAmpArchetype a) ->
                                            !fit(a.typical(), plusPeak, peakOut, s.noiseGain()).soft())
                                    .thenComparingDouble(a -> a.typical().quiescentAmps()))
                            .orElse(null);
                    if (best == null) {
                        OpAmpArchetype least = parts.opAmpArchetypes().stream()
                                .filter(a -> supplyFits(a.typical()))
                                .max(Comparator.comparingDouble(a -> fit(a.typical(), plusPeak, peakOut,
                                        s.noiseGain()).endPointRoomVolts()))
                                .orElse(null);
                        OpAmpChoice kept = least == null ? s.opAmp() : OpAmpChoice.archetype(least.id());
                        Fit f = least == null ? ownFit : fit(least.typical(), plusPeak, peakOut, s.noiseGain());
                        opAmps.add(kept);
                        conflicts.add(new Conflict(ConflictKind.NO_FITTING_OP_AMP, "the supply and signal as given",
                                s.name() + ": an op-amp that fits", peakOut, f.endPointRoomVolts(),
                                Math.max(0, peakOut - f.endPointRoomVolts()), "V",
                                s.name() + ": no op-amp archetype runs on " + Quantities.volts(supply.lowVolts()) + " to "
                                        + Quantities.volts(supply.highVolts()) + " with the " + Quantities.volts(peakOut)
                                        + " peak output; the best leaves " + Quantities.volts(f.endPointRoomVolts())
                                        + " of room at the end-point. Lower the signal or the gain, or use a higher supply."));
                    } else {
                        opAmps.add(OpAmpChoice.archetype(best.id()));
                        changes.add(new Change(ChangeKind.OP_AMP_REPLACED, path, describe(s.opAmp()), best.id(),
                                s.name() + ": " + ownFit.reason() + "; " + best.displayName() + " works from "
                                        + Quantities.volts(best.typical().supplyMinVolts()) + " and swings within "
                                        + Quantities.volts(Math.max(best.typical().swingLowVolts(),
                                        best.typical().swingHighVolts())) + " of the rails"));
                    }
                }
                peaks.add(new double[] {plusPeak, peakOut});
                peakIn = peakOut;
            }
        }

        /** How one op-amp fits the new supply with one stage's signal. */
        record Fit(boolean hard, boolean soft, String reason, double endPointRoomVolts) {}

        private boolean supplyFits(OpAmpParams p) {
            return supply.lowVolts() >= p.supplyMinVolts() && supply.highVolts() <= p.supplyMaxVolts();
        }

        private Fit fit(OpAmpParams p, double plusPeak, double outPeak, double noiseGain) {
            double nominal = supply.nominalVolts();
            double low = supply.lowVolts();
            double roomNominal = Math.min(nominal / 2 - p.swingLowVolts(), nominal / 2 - p.swingHighVolts());
            double roomLow = Math.min(low / 2 - p.swingLowVolts(), low / 2 - p.swingHighVolts());
            double wantNominal = outPeak * Math.pow(10, thresholds.minHeadroomDb() / 20);
            String reason = "";
            if (!supplyFits(p)) {
                reason = "the part is specified for " + Quantities.volts(p.supplyMinVolts()) + " to "
                        + Quantities.volts(p.supplyMaxVolts()) + ", the supply runs from " + Quantities.volts(low) + " to "
                        + Quantities.volts(supply.highVolts());
            } else if (low / 2 - plusPeak < p.commonModeLowVolts() || low / 2 + plusPeak > low - p.commonModeHighVolts()) {
                reason = "its inputs cannot reach mid-rail ± the signal peak at the end-point supply";
            } else if (roomNominal < wantNominal) {
                reason = "at the nominal supply the output has " + Quantities.volts(roomNominal) + " of room for a "
                        + Quantities.volts(outPeak) + " peak (" + Quantities.db(thresholds.minHeadroomDb()) + " headroom wanted)";
            } else if (roomLow < outPeak) {
                reason = "at the end-point supply the output has " + Quantities.volts(roomLow) + " of room for a "
                        + Quantities.volts(outPeak) + " peak: it would clip";
            }
            boolean hard = reason.isEmpty();
            double bandHigh = req.signal().bandHighHz();
            boolean soft = p.gainBandwidthHz() / noiseGain >= bandHigh
                    && p.slewRateVoltsPerSecond() >= 2 * Math.PI * bandHigh * outPeak;
            return new Fit(hard, soft, reason, roomLow);
        }

        private void checkResistors() {
            for (int i = 0; i < original.stages().size(); i++) {
                DualRailStage s = original.stages().get(i);
                double r1 = s.r1Ohms();
                double r2 = s.r2Ohms();
                String path = "stages[" + i + "]";
                if (s.kind() != StageKind.FOLLOWER && r2 > thresholds.maxFeedbackOhms()) {
                    int k = (int) Math.ceil(Math.log10(r2 / thresholds.maxFeedbackOhms()) - 1e-12);
                    double f = Math.pow(10, k);
                    if (r1 / f >= MIN_LEG_OHMS) {
                        changes.add(new Change(ChangeKind.RESISTORS_SCALED, path,
                                "R1 " + Quantities.ohms(r1) + ", R2 " + Quantities.ohms(r2),
                                "R1 " + Quantities.ohms(r1 / f) + ", R2 " + Quantities.ohms(r2 / f),
                                s.name() + ": R2 above " + Quantities.ohms(thresholds.maxFeedbackOhms())
                                        + " (common practice) turns bias current into offset and adds noise;"
                                        + " both divided by " + (long) f + ", the gain stays "
                                        + String.format(java.util.Locale.ROOT, "%.4g", s.gain())));
                        r1 /= f;
                        r2 /= f;
                    } else {
                        changes.add(new Change(ChangeKind.KEPT_AGAINST_PRACTICE, path + ".feedbackOhms",
                                Quantities.ohms(r2), Quantities.ohms(r2), s.name() + ": R2 is above "
                                + Quantities.ohms(thresholds.maxFeedbackOhms()) + " (common practice), but scaling it down"
                                + " would bring R1 below " + Quantities.ohms(MIN_LEG_OHMS) + "; kept"));
                    }
                }
                if (Math.abs(s.gain()) > thresholds.maxStageGain()) {
                    changes.add(new Change(ChangeKind.KEPT_AGAINST_PRACTICE, path,
                            String.format(java.util.Locale.ROOT, "gain %.4g", s.gain()),
                            String.format(java.util.Locale.ROOT, "gain %.4g", s.gain()),
                            s.name() + ": a stage gain above " + (long) thresholds.maxStageGain()
                                    + " is beyond the common-practice ceiling for one stage; kept, since splitting"
                                    + " it into two stages changes the circuit — consider doing so"));
                }
                resistors.add(new double[] {r1, r2});
            }
        }

        private static String describe(OpAmpChoice c) {
            return c.archetypeId().orElse("custom part");
        }

        // ---------------------------------------------------------------- reference

        /** Σ|Ib| of the stages biased from the reference, A. */
        private double biasedStagesAmps() {
            double sum = 0;
            for (int i = 0; i < original.stages().size(); i++) {
                if (biasedFromReference(i)) {
                    sum += Math.abs(params(i).biasAmps());
                }
            }
            return sum;
        }

        private double largestBiasAmps() {
            double max = 0;
            for (int i = 0; i < original.stages().size(); i++) {
                if (biasedFromReference(i)) {
                    max = Math.max(max, Math.abs(params(i).biasAmps()));
                }
            }
            return max;
        }

        private boolean biasedFromReference(int i) {
            return i == 0 || original.stages().get(i).kind() == StageKind.INVERTING;
        }

        private OpAmpParams params(int i) {
            return DesignCircuits.params(opAmps.get(i), "stages[" + i + "].opAmp");
        }

        private void chooseReference() {
            double opAmpAmps = 0;
            for (int i = 0; i < opAmps.size(); i++) {
                opAmpAmps += params(i).quiescentAmps();
            }
            ConversionLimits l = req.limits();
            OptionalDouble budget = l.maxSupplyAmps();
            if (l.minRuntimeHours().isPresent()) {
                double fromRuntime = supply.capacityAmpHours().getAsDouble() / l.minRuntimeHours().getAsDouble();
                budget = OptionalDouble.of(budget.isPresent() ? Math.min(budget.getAsDouble(), fromRuntime) : fromRuntime);
            }
            currentBudget = budget;
            boolean forcedHigh = false;
            if (budget.isPresent()) {
                double left = budget.getAsDouble() - opAmpAmps;
                if (left <= 0) {
                    conflicts.add(new Conflict(ConflictKind.CURRENT_LIMIT_UNREACHABLE, "the op-amps' quiescent current",
                            "supply-current limit", budget.getAsDouble(), opAmpAmps, opAmpAmps - budget.getAsDouble(), "A",
                            "the op-amps alone draw " + Quantities.amps(opAmpAmps) + ", more than the "
                                    + Quantities.amps(budget.getAsDouble()) + " the current or runtime limit allows;"
                                    + " choose lower-power op-amps or relax the limit"));
                    dividerOhms = MAX_DIVIDER_OHMS;
                    forcedHigh = true;
                } else {
                    double needed = supply.nominalVolts() / (2 * DIVIDER_SHARE * left);
                    if (needed > DEFAULT_DIVIDER_OHMS) {
                        dividerOhms = Math.min(MAX_DIVIDER_OHMS, ESeries.E24.nextHigher(needed));
                        forcedHigh = true;
                    }
                }
            }
            double allowed = BIAS_SHIFT_SHARE * thresholds.maxBiasShiftVolts();
            double sumIb = biasedStagesAmps();
            double maxIb = largestBiasAmps();
            double rth = dividerOhms / 2;
            if (sumIb * rth + maxIb * MIN_BIAS_OHMS > allowed) {
                OpAmpArchetype b = forcedHigh ? bufferFor(rth, allowed) : null;
                if (b != null) {
                    buffer = OpAmpChoice.archetype(b.id());
                    changes.add(new Change(ChangeKind.REFERENCE_BUFFERED, "reference.buffer", "none", b.id(),
                            "the current limit needs " + Quantities.ohms(dividerOhms) + " per divider resistor; the stages'"
                                    + " bias current " + Quantities.amps(sumIb) + " through its " + Quantities.ohms(rth)
                                    + " would shift the bias by " + Quantities.volts(sumIb * rth) + " (allowed "
                                    + Quantities.volts(allowed) + "), so a " + b.displayName() + " (bias current "
                                    + Quantities.amps(Math.abs(b.typical().biasAmps())) + ") buffers the divider"));
                } else {
                    double wanted = dividerOhms;
                    double fitting = 2 * (allowed - maxIb * MIN_BIAS_OHMS) / sumIb;
                    dividerOhms = Math.max(MIN_DIVIDER_OHMS, ESeries.E24.nextLower(Math.max(fitting, MIN_DIVIDER_OHMS)));
                    rth = dividerOhms / 2;
                    if (forcedHigh && budget.isPresent()) {
                        double extra = supply.nominalVolts() / (2 * dividerOhms) - supply.nominalVolts() / (2 * wanted);
                        double achieved = opAmpAmps + supply.nominalVolts() / (2 * dividerOhms);
                        conflicts.add(new Conflict(ConflictKind.CURRENT_VERSUS_BIAS_SHIFT,
                                "bias shift within " + Quantities.volts(allowed), "supply-current limit",
                                budget.getAsDouble(), achieved, Math.max(0, achieved - budget.getAsDouble()), "A",
                                "the stages' bias current " + Quantities.amps(sumIb) + " through a divider of "
                                        + Quantities.ohms(wanted) + " per resistor would shift the bias by "
                                        + Quantities.volts(sumIb * wanted / 2) + "; no buffer archetype fits, so the divider"
                                        + " is lowered to " + Quantities.ohms(dividerOhms) + ", drawing " + Quantities.amps(extra)
                                        + " more (estimated; the engine's figure is in the comparison)"));
                    }
                }
            }
            double maxBias = buffer != null
                    ? (allowed - Math.abs(DesignCircuits.params(buffer, "reference.buffer").biasAmps()) * rth)
                    / Math.max(maxIb, 1e-15) - ISOLATION_OHMS
                    : (allowed - sumIb * rth) / Math.max(maxIb, 1e-15);
            double wanted = Math.min(MAX_BIAS_OHMS, Math.max(DEFAULT_BIAS_OHMS,
                    ESeries.E24.nextHigher(Math.max(1, SOURCE_LOADING_RATIO * req.signal().sourceOhms()))));
            biasOhms = Math.max(MIN_BIAS_OHMS, ESeries.E24.nextLower(Math.max(MIN_BIAS_OHMS,
                    Math.min(wanted, maxBias))));
        }

        private String centring = "";

        /**
         * Move the reference off mid-rail when the op-amps' output windows are lopsided (a part
         * that reaches ground but stops well short of the positive rail): of the divider pairs
         * that keep one resistor at the chosen value and raise the other in E24 (so the divider
         * never draws more), take the one whose worst room for the signal, over the supply
         * points and stages, is largest; keep equal resistors unless that gains at least
         * {@link #CENTRING_MIN_GAIN}.
         */
        private void centreReference() {
            upperOhms = dividerOhms;
            lowerOhms = dividerOhms;
            double equal = worstRoom(0.5);
            double best = equal;
            double bestUpper = dividerOhms;
            double bestLower = dividerOhms;
            for (double x : ESeries.E24.values(dividerOhms, CENTRING_MAX_RATIO * dividerOhms)) {
                double[][] pairs = {{x, dividerOhms}, {dividerOhms, x}};
                for (double[] pair : pairs) {
                    double w = worstRoom(pair[1] / (pair[0] + pair[1]));
                    if (w > best) {
                        best = w;
                        bestUpper = pair[0];
                        bestLower = pair[1];
                    }
                }
            }
            if (best > equal * (1 + CENTRING_MIN_GAIN) && best > 0) {
                upperOhms = bestUpper;
                lowerOhms = bestLower;
                centring = "worst room for the signal " + String.format(java.util.Locale.ROOT, "%.2f", best)
                        + " times its peak instead of " + String.format(java.util.Locale.ROOT, "%.2f", Math.max(0, equal));
            }
        }

        /** The smallest ratio of room to signal peak over every signal op-amp and supply point, with the reference at {@code k} of the rail; −∞ when an input leaves its range. */
        private double worstRoom(double k) {
            double worst = Double.POSITIVE_INFINITY;
            for (double v : new double[] {supply.lowVolts(), supply.nominalVolts(), supply.highVolts()}) {
                double ref = k * v;
                for (int i = 0; i < opAmps.size(); i++) {
                    OpAmpParams p = params(i);
                    double plusPeak = peaks.get(i)[0];
                    double outPeak = peaks.get(i)[1];
                    if (ref - plusPeak < p.commonModeLowVolts() || ref + plusPeak > v - p.commonModeHighVolts()) {
                        return Double.NEGATIVE_INFINITY;
                    }
                    double room = Math.min(ref - p.swingLowVolts(), v - p.swingHighVolts() - ref);
                    worst = Math.min(worst, room / Math.max(outPeak, 1e-12));
                }
                if (buffer != null) {
                    OpAmpParams b = DesignCircuits.params(buffer, "reference.buffer");
                    if (ref < b.commonModeLowVolts() || ref > v - b.commonModeHighVolts() || ref < b.swingLowVolts()
                            || ref > v - b.swingHighVolts()) {
                        return Double.NEGATIVE_INFINITY;
                    }
                }
            }
            return worst;
        }

        private OpAmpArchetype bufferFor(double rth, double allowed) {
            double mid = supply.lowVolts() / 2;
            return PartsLibrary.builtIn().opAmpArchetypes().stream()
                    .filter(a -> {
                        OpAmpParams p = a.typical();
                        return supplyFits(p) && mid >= p.commonModeLowVolts()
                                && mid <= supply.lowVolts() - p.commonModeHighVolts()
                                && mid >= p.swingLowVolts() && mid <= supply.lowVolts() - p.swingHighVolts()
                                && Math.abs(p.biasAmps()) * rth <= allowed / 2;
                    })
                    .min(Comparator.comparingDouble(a -> a.typical().quiescentAmps()))
                    .orElse(null);
        }

        // ---------------------------------------------------------------- assembly

        /**
         * Assemble the design with every corner-setting capacitor sized for a chain corner of
         * {@code targetHz} and then multiplied by {@code scale}.
         */
        private Build build(double targetHz, double scale) {
            List<Change> parts = new ArrayList<>();
            double drift = thresholds.maxLeakageDriftVolts();
            List<DualRailStage> ss = original.stages();
            int networks = 1 + 1; // the input and the output capacitor
            for (DualRailStage s : ss) {
                if (s.kind() == StageKind.NON_INVERTING) {
                    networks++;
                }
            }
            double each = targetHz * Math.sqrt(Math.pow(2, 1.0 / networks) - 1) / CORNER_MARGIN;
            double tau = 0;
            double rs = req.signal().sourceOhms();
            double rth = upperOhms * lowerOhms / (upperOhms + lowerOhms);
            List<Stage> stages = new ArrayList<>();
            for (int i = 0; i < ss.size(); i++) {
                DualRailStage s = ss.get(i);
                double r1 = resistors.get(i)[0];
                double r2 = resistors.get(i)[1];
                String path = "stages[" + i + "]";
                CapacitorSpec leg = null;
                CapacitorSpec in = null;
                if (s.kind() == StageKind.NON_INVERTING) {
                    double g = 1 + r2 / r1;
                    double k = g > Math.sqrt(2) ? Math.sqrt(1 - 2 / (g * g)) : 1;
                    CapacitorRules.Choice c = CapacitorRules.choose(scale * k / (2 * Math.PI * each * r1),
                            CapacitorRules.Position.LEG, r2, supply, drift);
                    leg = c.spec();
                    tau += r1 * leg.farads();
                    parts.add(new Change(ChangeKind.LEG_CAPACITOR_ADDED, path + ".legCapacitor", "R1 to ground",
                            capText(leg), s.name() + ": blocks DC in the leg so the stage amplifies its bias by 1,"
                            + " not " + String.format(java.util.Locale.ROOT, "%.4g", g) + "; corner "
                            + Quantities.hertz(k / (2 * Math.PI * r1 * leg.farads())) + " with R1 (target "
                            + Quantities.hertz(each) + "); " + c.rule()));
                }
                if (i == 0) {
                    double seen = rs + (s.kind() == StageKind.INVERTING ? r1 : biasOhms);
                    double leakOhms = s.kind() == StageKind.INVERTING ? r2 : biasOhms + rth;
                    CapacitorRules.Choice c = CapacitorRules.choose(scale / (2 * Math.PI * each * seen),
                            CapacitorRules.Position.INPUT, leakOhms, supply, drift);
                    in = c.spec();
                    tau += seen * in.farads();
                    parts.add(new Change(ChangeKind.INPUT_CAPACITOR_ADDED, path + ".inputCapacitor", "DC-coupled",
                            capText(in), s.name() + ": the source rests at 0 V, the input at mid-rail; corner "
                            + Quantities.hertz(1 / (2 * Math.PI * seen * in.farads())) + " with " + Quantities.ohms(seen)
                            + " (target " + Quantities.hertz(each) + "); " + c.rule()));
                }
                if (biasedFromReference(i) && (i == 0 || s.kind() == StageKind.INVERTING)) {
                    parts.add(new Change(ChangeKind.BIAS_RESISTOR_ADDED, "reference.biasOhms",
                            s.kind() == StageKind.INVERTING ? "+ input at ground" : "+ input at the source",
                            Quantities.ohms(biasOhms), s.name() + ": brings the + input to the reference; "
                            + Quantities.ohms(biasOhms) + " keeps the bias-current shift within "
                            + Quantities.volts(BIAS_SHIFT_SHARE * thresholds.maxBiasShiftVolts())
                            + (s.kind() == StageKind.INVERTING ? "" : " and is now the input resistance"
                            + (rs > 0 ? ", which with the " + Quantities.ohms(rs) + " source costs "
                            + Quantities.db(-20 * Math.log10(biasOhms / (biasOhms + rs))) + " of gain" : ""))));
                }
                stages.add(new Stage(s.name(), s.kind(), opAmps.get(i), r2, r1, leg, in));
            }
            CapacitorRules.Choice out = CapacitorRules.choose(scale / (2 * Math.PI * each * req.loadOhms()),
                    CapacitorRules.Position.OUTPUT, req.loadOhms(), supply, drift);
            tau += req.loadOhms() * out.spec().farads();
            parts.add(new Change(ChangeKind.OUTPUT_CAPACITOR_ADDED, "load.outputCapacitor", "DC-coupled",
                    capText(out.spec()), "the last output rests at mid-rail, the load wants 0 V DC; corner "
                    + Quantities.hertz(1 / (2 * Math.PI * req.loadOhms() * out.spec().farads())) + " with the "
                    + Quantities.ohms(req.loadOhms()) + " load (target " + Quantities.hertz(each) + "); " + out.rule()));

            double refCorner = targetHz / REFERENCE_CORNER_FACTOR;
            CapacitorRules.Choice cref = CapacitorRules.choose(scale / (2 * Math.PI * rth * refCorner),
                    CapacitorRules.Position.REFERENCE, rth, supply, drift);
            tau += rth * cref.spec().farads();
            Reference reference;
            double refFraction = lowerOhms / (upperOhms + lowerOhms);
            String refText = "divider " + Quantities.ohms(upperOhms) + " + " + Quantities.ohms(lowerOhms) + ", "
                    + capText(cref.spec());
            String refWhy = (upperOhms == lowerOhms ? "mid-rail " + Quantities.volts(supply.nominalVolts() / 2)
                    + " from two equal resistors (E24),"
                    : Quantities.volts(refFraction * supply.nominalVolts()) + " (" + String.format(java.util.Locale.ROOT,
                    "%.0f %%", 100 * refFraction) + " of the rail) from two E24 resistors, at the centre of the"
                    + " op-amps' output window at the end-point supply rather than at mid-rail (" + centring
                    + "; at the nominal supply it then sits off the window's centre, which the checks note),")
                    + " drawing " + Quantities.amps(supply.nominalVolts() / (upperOhms + lowerOhms))
                    + (currentBudget.isPresent() ? " within the current budget " + Quantities.amps(currentBudget.getAsDouble())
                    : "") + "; decoupled at " + Quantities.hertz(1 / (2 * Math.PI * rth * cref.spec().farads()))
                    + ", a decade below the band, so supply noise and ripple stay off the inputs; " + cref.rule();
            if (buffer == null) {
                reference = Reference.decoupled(upperOhms, lowerOhms, cref.spec(), biasOhms);
            } else {
                CapacitorRules.Choice cb = CapacitorRules.choose(scale / (2 * Math.PI * ISOLATION_OHMS * refCorner),
                        CapacitorRules.Position.BUFFER_OUTPUT, ISOLATION_OHMS, supply, drift);
                tau += ISOLATION_OHMS * cb.spec().farads();
                reference = Reference.buffered(upperOhms, lowerOhms, cref.spec(), biasOhms, buffer, ISOLATION_OHMS,
                        cb.spec());
                refText += "; buffered, " + Quantities.ohms(ISOLATION_OHMS) + " into " + capText(cb.spec());
                refWhy += "; the buffer's " + Quantities.ohms(ISOLATION_OHMS) + " isolation keeps it stable into "
                        + capText(cb.spec()) + " (" + cb.rule() + ")";
            }
            parts.add(0, new Change(ChangeKind.REFERENCE_ADDED, "reference", "ground", refText, refWhy));
            Load load = new Load(req.loadOhms(), req.loadFarads(), out.spec());
            String description = "Converted from a dual-rail original on +" + Quantities.volts(original.positiveVolts())
                    + "/−" + Quantities.volts(original.negativeVolts()) + " by Halfrail's conversion assistant.";
            Design design = new Design(req.name(), description, supply, reference, stages, req.signal(), load,
                    thresholds, Design.DEFAULT_POWER_ON_RAMP_SECONDS);
            return new Build(design, tau, parts);
        }

        private static String capText(CapacitorSpec c) {
            return Quantities.farads(c.farads()) + " " + c.technology() + " " + Quantities.volts(c.ratedVolts());
        }

        // ---------------------------------------------------------------- limits

        private List<TradeOffPoint> tradeOff(double scale, Settle base) {
            OptionalDouble limit = req.limits().maxSettleSeconds();
            double top = 8;
            if (limit.isPresent() && base.atLeast() > limit.getAsDouble()) {
                top = Math.max(top, 2 * base.atLeast() / limit.getAsDouble());
            }
            double bottom = 0.5;
            List<TradeOffPoint> points = new ArrayList<>();
            for (int k = 0; k < TRADE_OFF_POINTS; k++) {
                double factor = bottom * Math.pow(top / bottom, k / (double) (TRADE_OFF_POINTS - 1));
                double target = bandLow * factor;
                Build b = build(target, scale);
                OptionalDouble corner = lowerCornerHz(b.design());
                Settle st = settle(b.design(), runLength(b.timeConstantSumSeconds()));
                boolean meetsBand = corner.isEmpty() || corner.getAsDouble() <= bandLow;
                boolean meetsSettle = limit.isEmpty()
                        || st.seconds().isPresent() && st.seconds().getAsDouble() <= limit.getAsDouble();
                points.add(new TradeOffPoint(target, 1 / factor, corner, st.seconds(), st.simulatedSeconds(),
                        meetsBand, meetsSettle));
            }
            return points;
        }

        private Build settleConflict(Build chosen, double scale, Settle settle, List<TradeOffPoint> curve, double limit,
                                     OptionalDouble corner) {
            TradeOffPoint fastEnough = curve.stream().filter(TradeOffPoint::meetsSettle)
                    .filter(p -> p.lowerCornerHz().isPresent())
                    .min(Comparator.comparingDouble(p -> p.lowerCornerHz().getAsDouble())).orElse(null);
            String cornerText = corner.isPresent() ? Quantities.hertz(corner.getAsDouble()) : "below the range";
            if (req.limits().priority() == LimitPriority.BAND || fastEnough == null) {
                double achieved = settle.atLeast();
                TradeOffPoint fastest = curve.stream().filter(p -> p.settleSeconds().isPresent())
                        .min(Comparator.comparingDouble(p -> p.settleSeconds().getAsDouble())).orElse(null);
                String price = fastEnough == null ? (fastest == null ? "no point of the trade-off curve settles"
                        : "no point of the trade-off curve meets the limit: even capacitors "
                        + String.format(java.util.Locale.ROOT, "%.3g", fastest.capacitanceScale())
                        + " times these (corner " + fastest.lowerCornerHz().stream().mapToObj(Quantities::hertz)
                        .findFirst().orElse("none") + ") take " + Quantities.seconds(fastest.settleSeconds().getAsDouble()))
                        : "meeting it would need capacitors about " + String.format(java.util.Locale.ROOT, "%.3g",
                        fastEnough.capacitanceScale()) + " times these, moving the corner to "
                        + Quantities.hertz(fastEnough.lowerCornerHz().getAsDouble()) + ", "
                        + Quantities.hertz(fastEnough.lowerCornerHz().getAsDouble() - bandLow) + " above the band's low end";
                conflicts.add(new Conflict(ConflictKind.CORNER_VERSUS_SETTLE,
                        "band low end " + Quantities.hertz(bandLow) + " (corner " + cornerText + ")",
                        "settle-up limit " + Quantities.seconds(limit), limit, achieved, achieved - limit, "s",
                        "a corner of " + cornerText + " needs time constants that settle in "
                                + (settle.seconds().isPresent() ? Quantities.seconds(achieved) : "more than " + Quantities.seconds(achieved))
                                + ", missing the " + Quantities.seconds(limit) + " limit by "
                                + (settle.seconds().isPresent() ? "" : "at least ") + Quantities.seconds(achieved - limit)
                                + "; the band wins" + (req.limits().priority() == LimitPriority.SETTLE
                                ? " because nothing on the curve settles in time" : "") + "; " + price));
                return chosen;
            }
            double factor = bandLow / fastEnough.targetCornerHz();
            Build fast = build(fastEnough.targetCornerHz(), scale);
            double fastCorner = fastEnough.lowerCornerHz().getAsDouble();
            List<Change> parts = new ArrayList<>(fast.partChanges());
            parts.add(new Change(ChangeKind.CAPACITORS_REDUCED_FOR_SETTLE, "", "sized for " + Quantities.hertz(bandLow),
                    "sized for " + Quantities.hertz(fastEnough.targetCornerHz()),
                    String.format(java.util.Locale.ROOT, "capacitors ×%.3g", factor) + " so that settle-up takes "
                            + Quantities.seconds(fastEnough.settleSeconds().getAsDouble()) + ", within "
                            + Quantities.seconds(limit)));
            conflicts.add(new Conflict(ConflictKind.CORNER_VERSUS_SETTLE, "settle-up limit " + Quantities.seconds(limit),
                    "band low end " + Quantities.hertz(bandLow), bandLow, fastCorner, fastCorner - bandLow, "Hz",
                    "meeting the band (corner " + cornerText + ") would take "
                            + Quantities.seconds(settle.atLeast()) + " to settle; the settle-up limit wins, and the chain's"
                            + " corner rises to " + Quantities.hertz(fastCorner) + ", " + Quantities.hertz(fastCorner - bandLow)
                            + " above the band's low end"));
            return new Build(fast.design(), fast.timeConstantSumSeconds(), parts);
        }

        private void checkCurrent(DesignReport report) {
            if (currentBudget.isEmpty() || report.battery().isEmpty()) {
                return;
            }
            double total = report.battery().get().totalAmps();
            double budget = currentBudget.getAsDouble();
            boolean reported = conflicts.stream().anyMatch(c -> c.kind() == ConflictKind.CURRENT_LIMIT_UNREACHABLE
                    || c.kind() == ConflictKind.CURRENT_VERSUS_BIAS_SHIFT);
            if (total > budget && !reported) {
                conflicts.add(new Conflict(ConflictKind.CURRENT_LIMIT_UNREACHABLE, "the circuit as converted",
                        "supply-current limit", budget, total, total - budget, "A",
                        "the engine finds " + Quantities.amps(total) + " drawn at the nominal supply, "
                                + Quantities.amps(total - budget) + " over the " + Quantities.amps(budget) + " budget"));
            }
        }

        private ChainFigures after(DesignReport report, Settle settle) {
            List<SupplyPoint> points = new ArrayList<>();
            StageReport last = report.stages().stream().filter(StageReport::signal)
                    .reduce((a, b) -> b).orElseThrow();
            points.add(point("nominal", last.nominal()));
            points.add(point("fresh", last.fresh()));
            points.add(point("end-point", last.endPoint()));
            // The linear gain: the reported peak is reduced by the drive factor behind a clipping stage.
            double gain = last.driveFactor() > 0
                    ? last.nominal().signalPeakVolts() / last.driveFactor() / req.signal().voltsPeak() : 0;
            double amps = report.battery().map(b -> b.totalAmps()).orElse(Double.NaN);
            OptionalDouble corner = report.chain().map(c -> c.lowerCornerHz()).orElse(OptionalDouble.empty());
            return new ChainFigures("single-supply conversion", points, gain, amps, 0, corner, settle.seconds());
        }

        private static SupplyPoint point(String label, SwingReport s) {
            return new SupplyPoint(label, s.supplyVolts(), s.quiescentVolts(), s.availableLowVolts(),
                    s.availableHighVolts(), s.signalPeakVolts(), s.headroomDbOrInfinite());
        }
    }
}
