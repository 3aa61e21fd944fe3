package halfrail.solve;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.CurrentSource;
import halfrail.circuit.Element;
import halfrail.circuit.OpAmp;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.Resistor;
import halfrail.circuit.VoltageSource;

import java.util.HashMap;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * Kirchhoff's current law checked independently of {@link MnaSystem}: the current of every
 * element is computed here from the reported node voltages (Ohm's law for resistors and
 * capacitor leakage, the stated source values) and the reported branch currents of voltage
 * sources and op-amp outputs, and summed at every node. Also checks each voltage source's own
 * equation V(+) − V(−) = V − Rs·I. Source: Kirchhoff's current law (any circuits text, e.g.
 * Horowitz &amp; Hill, The Art of Electronics, 3rd ed., ch. 1).
 *
 * <p>Op-amp terminal currents follow the element's documented model: Ib + Ios/2 into in+,
 * Ib − Ios/2 into in−, the reported supply current into V+, the reported output current out
 * of the output pin, and the balance out of V−.
 */
public final class KclCheck {
    /** Absolute floor of the per-node tolerance, A. */
    public static final double ABSOLUTE_TOLERANCE_AMPS = 1e-12;
    /** Relative part of the per-node tolerance, times the largest current at that node. */
    public static final double RELATIVE_TOLERANCE = 1e-8;
    /** Slack on the V+ pin current for the solver's smoothed sourcing/sinking split, A. */
    public static final double SPLIT_SLACK_AMPS = 1e-9;

    private KclCheck() {}

    /** Asserts KCL at every node of {@code circuit} for {@code op}, with the default tolerances. */
    public static void assertHolds(Circuit circuit, OperatingPoint op) {
        assertHolds(circuit, op, ABSOLUTE_TOLERANCE_AMPS, RELATIVE_TOLERANCE);
    }

    /** The largest KCL residual over all nodes, A, computed without the solver's equations. */
    public static double maxResidualAmps(Circuit circuit, OperatingPoint op) {
        Sums s = sums(circuit, op);
        double worst = 0;
        for (double r : s.net.values()) {
            worst = Math.max(worst, Math.abs(r));
        }
        return worst;
    }

    public static void assertHolds(Circuit circuit, OperatingPoint op, double absoluteAmps, double relative) {
        for (double v : op.solution()) {
            assertTrue(Double.isFinite(v), "solution holds a non-finite value: " + op);
        }
        Sums s = sums(circuit, op);
        for (String node : circuit.nodes()) {
            double net = s.net.getOrDefault(node, 0.0);
            double scale = s.largest.getOrDefault(node, 0.0);
            double tol = absoluteAmps + relative * scale;
            if (!(Math.abs(net) <= tol)) {
                fail("KCL fails at node " + node + ": net current " + net + " A, tolerance " + tol
                        + " A (largest element current there " + scale + " A); " + op);
            }
        }
        for (VoltageSource v : circuit.elements(VoltageSource.class)) {
            double i = op.current(v.name());
            double lhs = op.voltage(v.plus()) - op.voltage(v.minus());
            double rhs = v.dcVolts() - v.seriesOhms() * i;
            double tol = 1e-9 * Math.max(1, Math.abs(v.dcVolts()));
            assertTrue(Math.abs(lhs - rhs) <= tol, v.name() + ": V(+) − V(−) = " + lhs + " V but the source gives " + rhs);
        }
        for (OpAmp o : circuit.elements(OpAmp.class)) {
            OpAmpState st = op.opAmp(o.name()).orElseThrow();
            double io = op.current(o.name());
            double expected = o.params().quiescentAmps() + Math.max(io, 0);
            assertTrue(Math.abs(st.supplyAmps() - expected) <= SPLIT_SLACK_AMPS + 1e-9 * Math.abs(expected),
                    o.name() + ": V+ pin current " + st.supplyAmps() + " A, expected quiescent plus sourced current "
                            + expected + " A");
        }
    }

    private record Sums(Map<String, Double> net, Map<String, Double> largest) {
        void leaving(String node, double amps) {
            if (Circuit.GROUND.equals(node)) {
                return;
            }
            net.merge(node, amps, Double::sum);
            largest.merge(node, Math.abs(amps), Math::max);
        }
    }

    private static Sums sums(Circuit circuit, OperatingPoint op) {
        Sums s = new Sums(new HashMap<>(), new HashMap<>());
        for (Element e : circuit.elements()) {
            if (e instanceof Resistor r) {
                double i = (op.voltage(r.a()) - op.voltage(r.b())) / r.ohms();
                s.leaving(r.a(), i);
                s.leaving(r.b(), -i);
            } else if (e instanceof Capacitor c) {
                double i = (op.voltage(c.plus()) - op.voltage(c.minus())) * c.leakageSiemens();
                s.leaving(c.plus(), i);
                s.leaving(c.minus(), -i);
            } else if (e instanceof VoltageSource v) {
                double i = op.current(v.name());
                s.leaving(v.plus(), -i);
                s.leaving(v.minus(), i);
            } else if (e instanceof CurrentSource c) {
                s.leaving(c.from(), c.amps());
                s.leaving(c.to(), -c.amps());
            } else if (e instanceof OpAmp o) {
                OpAmpParams p = o.params();
                double ibp = p.biasAmps() + p.offsetCurrentAmps() / 2;
                double ibm = p.biasAmps() - p.offsetCurrentAmps() / 2;
                double supply = op.opAmp(o.name()).orElseThrow().supplyAmps();
                double io = op.current(o.name());
                s.leaving(o.inPlus(), ibp);
                s.leaving(o.inMinus(), ibm);
                s.leaving(o.vPos(), supply);
                s.leaving(o.out(), -io);
                s.leaving(o.vNeg(), -(ibp + ibm + supply - io));
            }
        }
        return s;
    }
}
