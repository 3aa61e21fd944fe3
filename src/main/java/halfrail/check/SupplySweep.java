package halfrail.check;

import halfrail.circuit.Circuit;
import halfrail.circuit.Element;
import halfrail.circuit.VoltageSource;
import halfrail.design.CellPack;
import halfrail.design.Design;
import halfrail.design.DesignCircuits;
import halfrail.design.Supply;
import halfrail.parts.CellChemistry;
import halfrail.solve.AnalysisException;
import halfrail.solve.OperatingPoint;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * Sweep a design's supply over its range — a battery from fresh to its end-point, a fixed rail
 * over its tolerance, a USB port over its allowed range — and report, for every op-amp, the rest
 * point, the swing window, the room on each side and the headroom at the nominal signal against
 * the supply voltage, with the lowest supply at which each op-amp still passes.
 *
 * <p>Every point is a DC operating point of the design's circuit (typical leakage) with only the
 * supply voltage changed — the swept value is the supply's open-circuit voltage (for a battery, the
 * discharge curve's voltage), its internal resistance staying in series — Newton started from the
 * previous point's solution. The signal peak at
 * each output comes from one AC analysis at the nominal supply and is reused at every point
 * (see {@link NominalStudy}). The lowest passing supply is found on the swept data (the highest
 * failing point below a passing one; a linear interpolation of the headroom margin there gives a
 * first estimate) and refined by bisection with a solve at every step.
 */
public final class SupplySweep {
    /** Width of the bracket at which the bisection for the lowest passing supply stops, V. */
    public static final double BISECTION_TOLERANCE_VOLTS = 1e-6;
    /** Largest number of bisection steps for one lowest passing supply; more end in NO_CONVERGENCE. */
    public static final int MAX_BISECTION_STEPS = 80;
    /** A sweep end may lie this fraction of the supply's range outside it (rounding) and still count as inside. */
    static final double RANGE_SLACK = 1e-9;

    private SupplySweep() {}

    /** Sweep the supply's whole range in {@value SupplySweepOptions#DEFAULT_POINTS} points. */
    public static SupplySweepResult run(Design design) {
        return run(design, SupplySweepOptions.defaults());
    }

    /**
     * Sweep {@code design}'s supply as {@code options} say.
     *
     * @throws StudyOptionsException when the range lies outside the supply's lowest..highest voltage
     *                               (field {@code sweep.fromVolts} or {@code sweep.toVolts})
     * @throws AnalysisException     when a point cannot be solved (a floating node, no convergence)
     */
    public static SupplySweepResult run(Design design, SupplySweepOptions options) {
        StudyOptionsException.RULES.required("design", design);
        StudyOptionsException.RULES.required("sweep", options);
        Supply supply = design.supply();
        double low = supply.lowVolts();
        double high = supply.highVolts();
        double slack = RANGE_SLACK * (high - low) + RANGE_SLACK * high;
        if (!(high > low)) {
            throw new StudyOptionsException("sweep.toVolts", "the supply has the one voltage " + low
                    + " V (no tolerance band, no discharge): there is no range to sweep");
        }
        double from = options.fromVolts().orElse(low);
        double to = options.toVolts().orElse(high);
        if (from < low - slack || from > high + slack) {
            throw new StudyOptionsException("sweep.fromVolts", "must lie within the supply's range " + low + " V to "
                    + high + " V, got " + from + " V");
        }
        if (to < low - slack || to > high + slack) {
            throw new StudyOptionsException("sweep.toVolts", "must lie within the supply's range " + low + " V to "
                    + high + " V, got " + to + " V");
        }
        if (!(to > from)) {
            throw new StudyOptionsException("sweep.toVolts", "must lie above fromVolts (" + from + " V), got " + to + " V");
        }
        return new Run(design, from, to, options.points()).result();
    }

    /** The percentage of capacity left when a battery {@code supply} reads {@code volts}; empty for other supplies. */
    static OptionalDouble capacityLeftPercent(Supply supply, double volts) {
        if (supply instanceof CellPack pack) {
            CellChemistry chem = pack.data();
            double perCell = volts / (pack.cellsInSeries() * (double) chem.cellsPerUnit());
            return OptionalDouble.of(100 * (1 - chem.fractionUsedAt(perCell)));
        }
        return OptionalDouble.empty();
    }

    private static final class Run {
        private final Design design;
        private final NominalStudy nominal;
        private final double[] volts;
        private final Circuit template;
        private final VoltageSource supplySource;
        private final int supplyIndex;

        Run(Design design, double from, double to, int points) {
            this.design = design;
            this.nominal = NominalStudy.of(design, design.supply().nominalVolts());
            this.volts = new double[points];
            for (int i = 0; i < points; i++) {
                volts[i] = i == points - 1 ? to : from + (to - from) * i / (points - 1);
            }
            this.template = nominal.circuit.circuit();
            this.supplySource = (VoltageSource) template.element(DesignCircuits.SUPPLY).orElseThrow();
            this.supplyIndex = template.elements().indexOf(supplySource);
        }

        OperatingPoint solveAt(double v, OperatingPoint guess) {
            List<Element> elements = new ArrayList<>(template.elements());
            elements.set(supplyIndex, supplySource.withDcVolts(v));
            return NominalStudy.solve(template.withValues(elements), guess);
        }

        SupplySweepResult result() {
            int n = volts.length;
            int m = nominal.opAmps.size();
            SwingReport[][] swings = new SwingReport[m][n];
            OperatingPoint guess = nominal.op;
            List<OperatingPoint> solutions = new ArrayList<>(n);
            for (int i = 0; i < n; i++) {
                OperatingPoint p = solveAt(volts[i], guess);
                guess = p;
                solutions.add(p);
                for (int k = 0; k < m; k++) {
                    swings[k][i] = nominal.swing(p, k, volts[i]);
                }
            }
            Supply supply = design.supply();
            Optional<double[]> left = Optional.empty();
            if (supply instanceof CellPack) {
                double[] l = new double[n];
                for (int i = 0; i < n; i++) {
                    l[i] = capacityLeftPercent(supply, volts[i]).getAsDouble();
                }
                left = Optional.of(l);
            }
            List<StageSupplySweep> out = new ArrayList<>();
            for (int k = 0; k < m; k++) {
                double[] q = new double[n];
                double[] lo = new double[n];
                double[] hi = new double[n];
                double[] aLo = new double[n];
                double[] aHi = new double[n];
                double[] hr = new double[n];
                boolean[] sat = new boolean[n];
                boolean[] pass = new boolean[n];
                for (int i = 0; i < n; i++) {
                    SwingReport s = swings[k][i];
                    q[i] = s.quiescentVolts();
                    lo[i] = s.swingLowVolts();
                    hi[i] = s.swingHighVolts();
                    aLo[i] = s.availableLowVolts();
                    aHi[i] = s.availableHighVolts();
                    hr[i] = s.headroomDbOrInfinite();
                    sat[i] = s.saturated();
                    pass[i] = nominal.passes(s, k);
                }
                LowestPassingSupply lowest = lowest(k, pass, hr, solutions);
                out.add(new StageSupplySweep(nominal.opAmps.get(k).label(), nominal.opAmps.get(k).designPath(),
                        nominal.opAmps.get(k).signal(), nominal.signalPeakVolts[k], q, lo, hi, aLo, aHi, hr, sat,
                        pass, lowest));
            }
            return new SupplySweepResult(design, volts, left, out);
        }

        private LowestPassingSupply lowest(int k, boolean[] pass, double[] headroom, List<OperatingPoint> solutions) {
            int n = volts.length;
            if (!pass[n - 1]) {
                return new LowestPassingSupply(LowestPassingSupply.Verdict.FAILS_AT_TOP, OptionalDouble.empty(),
                        OptionalDouble.empty());
            }
            int j = n - 2;
            while (j >= 0 && pass[j]) {
                j--;
            }
            if (j < 0) {
                return new LowestPassingSupply(LowestPassingSupply.Verdict.PASSES_THROUGHOUT,
                        OptionalDouble.of(volts[0]), capacityLeftPercent(design.supply(), volts[0]));
            }
            // Bracket: fails at volts[j], passes at volts[j+1].
            double failV = volts[j];
            double passV = volts[j + 1];
            OperatingPoint guess = solutions.get(j + 1);
            double margin = nominal.minHeadroomDb;
            double mFail = headroom[j] - margin;
            double mPass = headroom[j + 1] - margin;
            if (Double.isFinite(mFail) && Double.isFinite(mPass) && mPass > mFail) {
                double estimate = passV - mPass * (passV - failV) / (mPass - mFail);
                if (estimate > failV && estimate < passV) {
                    if (passesAt(k, estimate, guess)) {
                        passV = estimate;
                    } else {
                        failV = estimate;
                    }
                }
            }
            int steps = 0;
            while (passV - failV > BISECTION_TOLERANCE_VOLTS) {
                if (++steps > MAX_BISECTION_STEPS) {
                    throw new AnalysisException(AnalysisException.Kind.NO_CONVERGENCE,
                            "the lowest passing supply of " + nominal.opAmps.get(k).label() + " was not bracketed to "
                                    + BISECTION_TOLERANCE_VOLTS + " V within " + MAX_BISECTION_STEPS + " bisection steps");
                }
                double mid = 0.5 * (failV + passV);
                if (passesAt(k, mid, guess)) {
                    passV = mid;
                } else {
                    failV = mid;
                }
            }
            return new LowestPassingSupply(LowestPassingSupply.Verdict.FAILS_BELOW, OptionalDouble.of(passV),
                    capacityLeftPercent(design.supply(), passV));
        }

        private boolean passesAt(int k, double v, OperatingPoint guess) {
            OperatingPoint p = solveAt(v, guess);
            return nominal.passes(nominal.swing(p, k, v), k);
        }
    }
}
