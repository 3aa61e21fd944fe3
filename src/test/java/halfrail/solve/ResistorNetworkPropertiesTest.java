package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.VoltageSource;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Label;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Random connected resistor networks with E12 values from 10 Ω to 10 MΩ (IEC 60063 series) and
 * one or two voltage sources to ground. Properties: Kirchhoff's current law at every node
 * (checked by {@link KclCheck}); superposition for linear circuits (any circuits text, e.g. The
 * Art of Electronics, 3rd ed., §1.2); and the maximum principle for passive resistive networks:
 * every node voltage lies between the lowest and highest fixed potential (the sources and
 * ground), a consequence of KCL with positive conductances (each free node is a weighted mean of
 * its neighbours).
 */
class ResistorNetworkPropertiesTest {
    /** E12 mantissas, IEC 60063. */
    private static final double[] E12 = {1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2};

    record Edge(int a, int b, double ohms) {}

    record Source(int node, double volts) {}

    /** Nodes 1..nodes, node 0 is ground. Edges include a spanning tree, so the network is connected. */
    record Net(int nodes, List<Edge> edges, List<Source> sources) {
        Circuit circuit(double... sourceVolts) {
            Circuit.Builder b = Circuit.builder();
            for (int i = 1; i <= nodes; i++) {
                b.node(name(i));
            }
            for (int k = 0; k < edges.size(); k++) {
                Edge e = edges.get(k);
                b.resistor("R" + k, name(e.a), name(e.b), e.ohms);
            }
            for (int k = 0; k < sources.size(); k++) {
                Source s = sources.get(k);
                b.voltageSource("V" + k, name(s.node), "0", sourceVolts.length > 0 ? sourceVolts[k] : s.volts);
            }
            return b.build();
        }

        double[] volts() {
            return sources.stream().mapToDouble(Source::volts).toArray();
        }
    }

    static String name(int i) {
        return i == 0 ? "0" : "n" + i;
    }

    @Provide
    Arbitrary<Double> e12Ohms() {
        Arbitrary<Double> mantissa = Arbitraries.of(0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11).map(i -> E12[i]);
        Arbitrary<Integer> decade = Arbitraries.integers().between(1, 6);
        Arbitrary<Double> value = Combinators.combine(mantissa, decade).as((m, d) -> m * Math.pow(10, d));
        return Arbitraries.frequencyOf(net.jqwik.api.Tuple.of(30, value), net.jqwik.api.Tuple.of(1, Arbitraries.just(10e6)));
    }

    @Provide
    Arbitrary<Net> networks() {
        return Arbitraries.integers().between(1, 8).flatMap(n -> {
            Arbitrary<List<Edge>> tree = Arbitraries.integers().between(0, Integer.MAX_VALUE).list().ofSize(n)
                    .flatMap(parents -> e12Ohms().list().ofSize(n).map(values -> {
                        List<Edge> edges = new ArrayList<>();
                        for (int i = 1; i <= n; i++) {
                            edges.add(new Edge(i, parents.get(i - 1) % i, values.get(i - 1)));
                        }
                        return edges;
                    }));
            Arbitrary<Edge> extraEdge = Combinators.combine(
                    Arbitraries.integers().between(0, n), Arbitraries.integers().between(0, n), e12Ohms())
                    .as(Edge::new).filter(e -> e.a != e.b);
            Arbitrary<List<Edge>> extras = n >= 2 ? extraEdge.list().ofMaxSize(2 * n) : Arbitraries.just(List.of());
            Arbitrary<Double> volts = Arbitraries.doubles().between(-15, 15).ofScale(3);
            Arbitrary<List<Source>> sources = Arbitraries.integers().between(1, n).set().ofMinSize(1).ofMaxSize(Math.min(2, n))
                    .flatMap(nodes -> volts.list().ofSize(nodes.size()).map(vs -> {
                        List<Source> out = new ArrayList<>();
                        int k = 0;
                        for (int node : nodes) {
                            out.add(new Source(node, vs.get(k++)));
                        }
                        return out;
                    }));
            return Combinators.combine(tree, extras, sources).as((t, x, s) -> {
                List<Edge> all = new ArrayList<>(t);
                all.addAll(x);
                return new Net(n, all, s);
            });
        });
    }

    @Property(tries = 400, seed = "244037020438205")
    @Label("random resistor networks solve with KCL holding at every node")
    void randomNetworksSatisfyKcl(@ForAll("networks") Net net) {
        Circuit c = net.circuit();
        OperatingPoint op = DcSolver.operatingPoint(c);
        KclCheck.assertHolds(c, op);
        assertTrue(op.maxKclResidualAmps() <= 1e-12, "solver's own residual " + op.maxKclResidualAmps());
    }

    @Property(tries = 300, seed = "275251802753816")
    @Label("superposition: the response to both sources is the sum of the responses to each alone")
    void superpositionHolds(@ForAll("networks") Net net) {
        double[] v = net.volts();
        OperatingPoint both = DcSolver.operatingPoint(net.circuit(v));
        double[][] alone = new double[v.length][];
        List<OperatingPoint> parts = new ArrayList<>();
        for (int k = 0; k < v.length; k++) {
            alone[k] = new double[v.length];
            alone[k][k] = v[k];
            parts.add(DcSolver.operatingPoint(net.circuit(alone[k])));
        }
        double scale = 0;
        for (double x : v) {
            scale = Math.max(scale, Math.abs(x));
        }
        for (int i = 1; i <= net.nodes(); i++) {
            double sum = 0;
            for (OperatingPoint p : parts) {
                sum += p.voltage(name(i));
            }
            assertEquals(both.voltage(name(i)), sum, 1e-9 * scale + 1e-12, "node " + name(i));
        }
        for (int k = 0; k < v.length; k++) {
            double sum = 0;
            for (OperatingPoint p : parts) {
                sum += p.current("V" + k);
            }
            double i = both.current("V" + k);
            assertEquals(i, sum, 1e-9 * Math.abs(i) + 1e-15, "current of V" + k);
        }
    }

    @Property(tries = 400, seed = "76235079830314")
    @Label("every node voltage of a passive network lies between the lowest and highest fixed potential")
    void nodeVoltagesLieBetweenTheExtremeSourceVoltages(@ForAll("networks") Net net) {
        OperatingPoint op = DcSolver.operatingPoint(net.circuit());
        double lo = 0;
        double hi = 0;
        for (Source s : net.sources()) {
            lo = Math.min(lo, s.volts());
            hi = Math.max(hi, s.volts());
        }
        double eps = 1e-9 * Math.max(1, hi - lo);
        for (int i = 1; i <= net.nodes(); i++) {
            double v = op.voltage(name(i));
            assertTrue(v >= lo - eps && v <= hi + eps, name(i) + " at " + v + " V outside [" + lo + ", " + hi + "]");
        }
    }

    @Property(tries = 200, seed = "79834578659856")
    @Label("the supply branch current of a single-source network equals the power balance V·I = Σ V²/R")
    void sourcePowerEqualsDissipatedPower(@ForAll("networks") Net net) {
        Circuit c = net.circuit();
        OperatingPoint op = DcSolver.operatingPoint(c);
        double delivered = 0;
        for (int k = 0; k < net.sources().size(); k++) {
            delivered += net.sources().get(k).volts() * op.current("V" + k);
        }
        double dissipated = 0;
        double scale = 0;
        for (Edge e : net.edges()) {
            double dv = op.voltage(name(e.a())) - op.voltage(name(e.b()));
            dissipated += dv * dv / e.ohms();
        }
        for (Source s : net.sources()) {
            scale = Math.max(scale, s.volts() * s.volts() / 10);
        }
        // Tellegen's theorem / conservation of energy (any circuits text)
        assertEquals(dissipated, delivered, 1e-9 * Math.max(dissipated, scale) + 1e-18);
        assertTrue(c.elements(VoltageSource.class).size() >= 1);
    }
}
