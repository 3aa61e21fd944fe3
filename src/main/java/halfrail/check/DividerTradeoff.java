package halfrail.check;

import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmp;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.Resistor;
import halfrail.design.Design;
import halfrail.design.DesignCircuit;
import halfrail.design.DesignCircuits;
import halfrail.design.Reference;
import halfrail.design.StageNodes;
import halfrail.parts.LeakageLevel;
import halfrail.solve.AnalysisException;
import halfrail.solve.DcSolver;
import halfrail.solve.FloatingNodes;
import halfrail.solve.MnaSystem;
import halfrail.solve.OperatingPoint;
import halfrail.solve.PowerOnOptions;
import halfrail.solve.PowerOnResult;
import halfrail.solve.PowerOnTransient;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.OptionalDouble;
import java.util.Set;
import java.util.TreeSet;

/**
 * The battery trade-off of the bias divider: a stiffer divider (smaller Ra = Rb) costs battery
 * current; a softer one lets the op-amps' bias currents move the rest points, adds thermal noise
 * and slows the reference's settle-up at switch-on. For every value of an E-series range (Ra = Rb,
 * a mid-rail divider), plus the design's own divider, the design is solved at its nominal supply:
 * divider and total current and the runtime on the supply's capacity; the rest-point shift caused
 * by the input bias and offset currents (the operating point less that of the same circuit with
 * those currents at zero); the reference network's thermal noise at the load over the band
 * ({@link ReferenceNoise}); the time constant (Ra‖Rb)·C of the decoupled reference; and, for a few
 * values, the settle-up of the reference node in a real power-on transient.
 */
public final class DividerTradeoff {
    /** A transient runs at least this many reference time constants (plus ten ramp times), s/s. */
    public static final double RUN_TIME_CONSTANTS = 12;
    /** Relative difference below which the design's divider counts as one of the series values. */
    static final double SAME_VALUE = 1e-9;

    private DividerTradeoff() {}

    /** E12 from 1 kΩ to 1 MΩ with three transients. */
    public static DividerTradeoffResult run(Design design) {
        return run(design, DividerTradeoffOptions.defaults());
    }

    /**
     * The trade-off of {@code design}'s divider over {@code options}' values.
     *
     * @throws AnalysisException when a divider value cannot be solved (a floating node, no convergence)
     */
    public static DividerTradeoffResult run(Design design, DividerTradeoffOptions options) {
        StudyOptionsException.RULES.required("design", design);
        StudyOptionsException.RULES.required("tradeoff", options);
        Reference ref = design.reference();
        record Row(double upper, double lower, boolean current) {}
        List<Row> rows = new ArrayList<>();
        boolean ownFound = false;
        for (double r : options.series().values(options.minOhms(), options.maxOhms())) {
            boolean own = same(r, ref.upperOhms()) && same(r, ref.lowerOhms());
            ownFound |= own;
            rows.add(new Row(r, r, own));
        }
        if (!ownFound) {
            rows.add(new Row(ref.upperOhms(), ref.lowerOhms(), true));
        }
        rows.sort(Comparator.comparingDouble(r -> r.upper() * r.lower() / (r.upper() + r.lower())));
        int currentIndex = 0;
        for (int i = 0; i < rows.size(); i++) {
            if (rows.get(i).current()) {
                currentIndex = i;
            }
        }
        Set<Integer> transients = transientRows(rows.size(), currentIndex, options.transientPoints());
        double volts = design.supply().nominalVolts();
        double band = design.thresholds().settleBandFraction() * volts;
        OptionalDouble capacity = design.supply().capacityAmpHours();
        List<DividerChoice> out = new ArrayList<>();
        OperatingPoint previous = null;
        for (int i = 0; i < rows.size(); i++) {
            Row row = rows.get(i);
            Design d = design.withReference(ref.withDivider(row.upper(), row.lower()));
            DesignCircuit dc = DesignCircuits.build(d, volts, LeakageLevel.TYPICAL);
            OperatingPoint op = solve(dc.circuit(), previous);
            previous = op;
            out.add(choice(d, dc, op, row.upper(), row.lower(), capacity, band, transients.contains(i), row.current()));
        }
        return new DividerTradeoffResult(design, volts, capacity, band, out);
    }

    private static boolean same(double a, double b) {
        return Math.abs(a - b) <= SAME_VALUE * Math.max(Math.abs(a), Math.abs(b));
    }

    /** The smallest, the design's own, the largest, then evenly spread rows, {@code n} in all (at most every row). */
    static Set<Integer> transientRows(int rows, int current, int n) {
        Set<Integer> chosen = new TreeSet<>();
        int[] firsts = {0, current, rows - 1};
        for (int f : firsts) {
            if (chosen.size() < n) {
                chosen.add(f);
            }
        }
        int want = Math.min(n, rows);
        for (int parts = 2; chosen.size() < want && parts <= rows; parts++) {
            for (int k = 1; k < parts && chosen.size() < want; k++) {
                chosen.add((int) Math.round(k * (rows - 1) / (double) parts));
            }
        }
        return chosen;
    }

    private static OperatingPoint solve(Circuit c, OperatingPoint previous) {
        List<String> floating = FloatingNodes.find(c);
        if (!floating.isEmpty()) {
            throw new AnalysisException(AnalysisException.Kind.FLOATING_NODE,
                    "no DC path at " + String.join(", ", floating), floating);
        }
        return previous == null ? new DcSolver(MnaSystem.of(c)).solve() : NominalStudy.solve(c, previous);
    }

    private static DividerChoice choice(Design d, DesignCircuit dc, OperatingPoint op, double upper, double lower,
                                        OptionalDouble capacity, double band, boolean runTransient, boolean current) {
        Circuit c = dc.circuit();
        Resistor ra = (Resistor) c.element("RA").orElseThrow();
        double dividerAmps = (op.voltage(ra.a()) - op.voltage(ra.b())) / ra.ohms();
        double total = op.current(dc.supplySource());
        OptionalDouble runtime = capacity.isPresent() && total > 0
                ? OptionalDouble.of(capacity.getAsDouble() / total) : OptionalDouble.empty();
        Circuit noBias = c;
        for (OpAmp o : c.elements(OpAmp.class)) {
            OpAmpParams p = o.params();
            noBias = noBias.replace(o.name(), e -> ((OpAmp) e).withParams(p.withInputErrors(p.offsetVolts(), 0, 0)));
        }
        OperatingPoint unbiased = NominalStudy.solve(noBias, op);
        double shift = 0;
        for (StageNodes sn : dc.stages()) {
            double s = op.voltage(sn.out()) - unbiased.voltage(sn.out());
            if (Math.abs(s) > Math.abs(shift)) {
                shift = s;
            }
        }
        double noise = ReferenceNoise.voltsRms(c, dc.loadNode(), d.source().bandLowHz(), d.source().bandHighHz());
        double thevenin = upper * lower / (upper + lower);
        OptionalDouble tau = d.reference().decoupling() == null ? OptionalDouble.empty()
                : OptionalDouble.of(thevenin * d.reference().decoupling().farads());
        OptionalDouble settle = OptionalDouble.empty();
        if (runTransient) {
            settle = settle(d, dc, tau, band);
        }
        return new DividerChoice(upper, lower, thevenin, dividerAmps, total, runtime, shift, noise, tau, settle,
                runTransient, current);
    }

    /** Settle-up of the reference node in a power-on transient, s; empty when it does not settle within the run. */
    private static OptionalDouble settle(Design d, DesignCircuit dc, OptionalDouble tau, double band) {
        double stop = Math.max(d.thresholds().maxSettleSeconds() * DesignAnalysis.POWER_ON_RUN_FACTOR,
                RUN_TIME_CONSTANTS * tau.orElse(0) + 10 * d.powerOnRampSeconds());
        String node = dc.referenceNode();
        PowerOnOptions options = PowerOnOptions.of(stop).withSettleBand(band).withWatchedNodes(node)
                .withStopWhenSettled(true);
        PowerOnResult r;
        try {
            r = PowerOnTransient.run(dc.circuit(), options);
        } catch (AnalysisException e) {
            if (e.kind() == AnalysisException.Kind.STEP_LIMIT || e.kind() == AnalysisException.Kind.STEP_TOO_SMALL) {
                return OptionalDouble.empty();
            }
            throw e;
        }
        double fin = r.finalPoint().voltage(node);
        double[] t = r.timesSeconds();
        double[] v = r.voltages(node);
        int last = -1;
        for (int i = 0; i < v.length; i++) {
            if (Math.abs(v[i] - fin) > band) {
                last = i;
            }
        }
        if (last < 0) {
            return OptionalDouble.of(0);
        }
        if (last == v.length - 1) {
            return OptionalDouble.empty();
        }
        double d0 = Math.abs(v[last] - fin);
        double d1 = Math.abs(v[last + 1] - fin);
        return OptionalDouble.of(t[last] + (t[last + 1] - t[last]) * (d0 - band) / (d0 - d1));
    }
}
