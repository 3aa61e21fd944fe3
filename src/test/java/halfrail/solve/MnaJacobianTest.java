package halfrail.solve;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.VoltageSource;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The Jacobians MnaSystem reports, G = ∂f/∂x and C = ∂q/∂x, checked against central finite
 * differences of f and q (common practice for verifying analytic derivatives; the AC and
 * transient analyses build on both). Points are chosen in every region of the op-amp limiter:
 * linear, in each knee, beyond each edge, with a narrow window (knee narrower than its nominal
 * width) and with no window at all, and with output current sourcing, sinking and near zero.
 */
class MnaJacobianTest {
    private static final double STEP = 1e-7;

    private static Circuit circuit(double supply) {
        OpAmpParams p = OpAmpParams.defaults().withOpenLoopGain(50).withSwing(1.2, 1.3).withOutputOhms(20)
                .withInputErrors(2e-3, 1e-7, 2e-8).withQuiescent(1e-3);
        return Circuit.builder().nodes("vcc", "mid", "inp", "inm", "out", "leg")
                .add(new VoltageSource("VBAT", "vcc", "0", supply, 0, 5, 1e-3))
                .resistor("RA", "vcc", "mid", 10e3)
                .resistor("RB", "mid", "0", 10e3)
                .capacitor("CREF", "mid", "0", 1e-6)
                .resistor("RBIAS", "mid", "inp", 47e3)
                .opAmp("U1", "inp", "inm", "vcc", "0", "out", p)
                .resistor("R2", "out", "inm", 100e3)
                .resistor("R1", "inm", "leg", 10e3)
                .add(new Capacitor("C1", "leg", "0", 10e-6, 0.2, "", 16, true, 2e-7))
                .resistor("RL", "out", "0", 1e3)
                .currentSource("IX", "inp", "0", 1e-6)
                .build();
    }

    private static void assertJacobians(MnaSystem s, double[] x, Mode mode, double t, double scale, double gmin) {
        int n = s.size();
        double[] f = new double[n];
        double[][] g = new double[n][n];
        double[] q = new double[n];
        double[][] c = new double[n][n];
        s.evaluate(x, t, mode, scale, gmin, f, g, q, c);
        double[] fp = new double[n];
        double[] fm = new double[n];
        double[] fpp = new double[n];
        double[] fmm = new double[n];
        double[] qp = new double[n];
        double[] qm = new double[n];
        double[] scratch = new double[n];
        for (int j = 0; j < n; j++) {
            double[] xp = x.clone();
            double[] xm = x.clone();
            boolean current = s.unknownName(j).startsWith("I(");
            // current steps far inside the 1 nA smoothing width of the output-current split
            double h = current ? 1e-13 + STEP * Math.abs(x[j]) : STEP * Math.max(1, Math.abs(x[j]));
            xp[j] += h;
            xm[j] -= h;
            s.evaluate(xp, t, mode, scale, gmin, fp, null, qp, null);
            s.evaluate(xm, t, mode, scale, gmin, fm, null, qm, null);
            xp[j] = x[j] + 2 * h;
            xm[j] = x[j] - 2 * h;
            s.evaluate(xp, t, mode, scale, gmin, fpp, null, scratch, null);
            s.evaluate(xm, t, mode, scale, gmin, fmm, null, scratch, null);
            for (int i = 0; i < n; i++) {
                // fourth-order central difference (truncation error of order h^4): the overdrive
                // term of the op-amp's dynamic row curves sharply within a knee width
                double dfd = (8 * (fp[i] - fm[i]) - (fpp[i] - fmm[i])) / (12 * h);
                double dqd = (qp[i] - qm[i]) / (2 * h);
                // truncation error plus the round-off of a difference quotient with step h
                double roundOff = 4e-16 * Math.max(1, Math.max(Math.max(Math.abs(fp[i]), Math.abs(fm[i])),
                        Math.max(Math.abs(fpp[i]), Math.abs(fmm[i])))) * 1.5 / h;
                double tol = 1e-5 * Math.max(1, Math.abs(g[i][j])) + roundOff + 1e-9;
                assertEquals(dfd, g[i][j], tol, "∂f" + s.unknownName(i) + "/∂" + s.unknownName(j) + " at " + mode);
                assertEquals(dqd, c[i][j], 1e-6 * Math.max(1e-6, Math.abs(c[i][j])) + 1e-12,
                        "∂q" + s.unknownName(i) + "/∂" + s.unknownName(j));
            }
        }
    }

    /** A point whose op-amp target u lies at {@code uOffset} from the chosen edge region. */
    private static double[] point(MnaSystem s, Random rnd, double supply, double vdiff, double io) {
        double[] x = new double[s.size()];
        for (int i = 0; i < s.nodeCount(); i++) {
            x[i] = rnd.nextDouble() * supply;
        }
        x[s.nodeIndex("vcc")] = supply;
        x[s.nodeIndex("inm")] = x[s.nodeIndex("inp")] - vdiff;
        x[s.branchIndex("VBAT")] = 1e-3 * rnd.nextGaussian();
        x[s.branchIndex("U1")] = io;
        x[s.stateIndex("U1")] = rnd.nextDouble() * supply;
        return x;
    }

    @Test
    @DisplayName("G and C match finite differences in every limiter region, DC and dynamic forms")
    void jacobiansMatchFiniteDifferences() {
        Random rnd = new Random(7);
        for (double supply : List.of(9.0, 2.53, 2.0)) { // wide window; window 0.03 V (knee 7.5 mV); no window
            MnaSystem s = MnaSystem.of(circuit(supply));
            double gain = 50;
            double lo = 1.2;
            double hi = supply - 1.3;
            double centre = 0.5 * (lo + hi);
            // targets u = gain·(vdiff + Vos): linear, high knee, beyond high, low knee, beyond low
            double[] targets = {centre, hi - 0.004, hi + 0.03, lo + 0.004, lo - 0.05, hi + 1, lo - 1};
            for (double u : targets) {
                double vdiff = u / gain - 2e-3;
                for (double io : List.of(5e-3, -5e-3, 3e-10, 0.0)) {
                    double[] x = point(s, rnd, supply, vdiff, io);
                    for (Mode mode : Mode.values()) {
                        assertJacobians(s, x, mode, 2e-4, 1, 0);
                        assertJacobians(s, x, mode, 2e-4, 0.3, 1e-3);
                    }
                }
            }
        }
    }
}
