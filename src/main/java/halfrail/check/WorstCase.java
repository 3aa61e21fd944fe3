package halfrail.check;

import halfrail.design.Design;
import halfrail.solve.AnalysisException;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Extreme-value analysis: the lowest and highest rest point of each op-amp, and its headroom
 * there, over the tolerance corners of a {@link ToleranceModel}.
 *
 * <p>Method: one solve per parameter at its low and one at its high value, every other at
 * nominal, gives a secant sensitivity of each rest point to each parameter (finite differences
 * on the solved circuit, over the parameter's whole range — not {@link halfrail.solve.DcSensitivity},
 * which is a derivative at the nominal point). For each op-amp the corner that drives its rest
 * point highest puts every parameter at the end that raises it; the lowest, at the other end.
 * Both corners are then solved in full (limits and all), so the extremes are solved values, not
 * a linear sum; for a rest point that is monotonic in each parameter — every resistor divider and
 * bias network — they are the true extremes over the whole box of tolerances. Headroom is
 * evaluated at those corners at the nominal signal gain: with the gain held and the swing window
 * set by the supply, headroom depends on the rest point alone and is smallest at one of its two
 * extremes.
 *
 * <p>Temperature drift is bilinear (coefficient × temperature excursion) and has no secant at a
 * nominal coefficient of zero or at 25 °C; so every corner, and the secants of the coefficients,
 * are taken at the end of the temperature range farthest from 25 °C, where each coefficient
 * within its ±bound reaches its largest drift.
 */
public final class WorstCase {
    private WorstCase() {}

    /** Worst case of {@code design} at its nominal supply. */
    public static WorstCaseResult run(Design design, ToleranceOptions options) {
        return run(ToleranceModel.of(design, options));
    }

    /**
     * Worst case over {@code model}'s parameters.
     *
     * @throws AnalysisException when the nominal build or a corner cannot be solved
     */
    public static WorstCaseResult run(ToleranceModel model) {
        StudyOptionsException.RULES.required("model", model);
        BuildEvaluator ev = new BuildEvaluator(model);
        List<ToleranceParameter> params = model.parameters();
        int m = ev.opAmpCount();
        int np = params.size();
        double[] nominal = model.nominalValues();
        double[] q0 = new double[m];
        double[] h0 = new double[m];
        boolean[] s0 = new boolean[m];
        ev.evaluate(nominal, q0, h0, s0);
        int solves = 1;
        double[] base = nominal.clone();
        for (int j = 0; j < np; j++) {
            ToleranceParameter p = params.get(j);
            if (p.kind() == ToleranceParameter.Kind.TEMPERATURE) {
                double ref = ToleranceOptions.REFERENCE_CELSIUS;
                base[j] = Math.abs(p.highValue() - ref) >= Math.abs(p.lowValue() - ref) ? p.highValue() : p.lowValue();
            }
        }
        double[][] swing = new double[m][np];
        double[] qLo = new double[m];
        double[] qHi = new double[m];
        double[] h = new double[m];
        boolean[] s = new boolean[m];
        for (int j = 0; j < np; j++) {
            if (params.get(j).kind() == ToleranceParameter.Kind.TEMPERATURE) {
                continue;
            }
            double[] v = (params.get(j).kind() == ToleranceParameter.Kind.TEMPCO ? base : nominal).clone();
            v[j] = params.get(j).lowValue();
            ev.evaluate(v, qLo, h, s);
            v[j] = params.get(j).highValue();
            ev.evaluate(v, qHi, h, s);
            solves += 2;
            for (int k = 0; k < m; k++) {
                swing[k][j] = qHi[k] - qLo[k];
            }
        }
        List<StageWorstCase> out = new ArrayList<>();
        for (int k = 0; k < m; k++) {
            double[] high = base.clone();
            double[] low = base.clone();
            List<PartInfluence> drivers = new ArrayList<>();
            for (int j = 0; j < np; j++) {
                ToleranceParameter p = params.get(j);
                if (swing[k][j] > 0) {
                    high[j] = p.highValue();
                    low[j] = p.lowValue();
                } else if (swing[k][j] < 0) {
                    high[j] = p.lowValue();
                    low[j] = p.highValue();
                }
                if (swing[k][j] != 0) {
                    drivers.add(new PartInfluence(p.id(), p.designPath(), p.kind(),
                            swing[k][j] / (p.highValue() - p.lowValue()), swing[k][j]));
                }
            }
            drivers.sort(Comparator.comparingDouble((PartInfluence d) -> -Math.abs(d.swingVolts())));
            double[] qa = new double[m];
            double[] ha = new double[m];
            boolean[] sa = new boolean[m];
            double[] qb = new double[m];
            double[] hb = new double[m];
            boolean[] sb = new boolean[m];
            ev.evaluate(low, qa, ha, sa);
            ev.evaluate(high, qb, hb, sb);
            solves += 2;
            double qMin = Math.min(q0[k], Math.min(qa[k], qb[k]));
            double qMax = Math.max(q0[k], Math.max(qa[k], qb[k]));
            double hMin = Math.min(ha[k], hb[k]);
            double hMax = Math.max(h0[k], Math.max(ha[k], hb[k]));
            boolean pass = ev.passes(k, ha[k], sa[k]) && ev.passes(k, hb[k], sb[k]);
            String label = ev.nominal.opAmps.get(k).label();
            out.add(new StageWorstCase(label, ev.nominal.opAmps.get(k).designPath(), ev.nominal.opAmps.get(k).signal(),
                    q0[k], qMin, qMax, h0[k], hMin, hMax, sa[k] || sb[k], pass, drivers,
                    model.buildDesign(low, model.design().name() + " (" + label + " lowest corner)"),
                    model.buildDesign(high, model.design().name() + " (" + label + " highest corner)")));
        }
        return new WorstCaseResult(model.design(), ev.nominal.supplyVolts, params, out, solves);
    }
}
