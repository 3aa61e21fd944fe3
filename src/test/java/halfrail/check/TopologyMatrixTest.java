package halfrail.check;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.Element;
import halfrail.circuit.OpAmp;
import halfrail.circuit.Resistor;
import halfrail.design.AmplitudeUnit;
import halfrail.design.Design;
import halfrail.design.DesignCircuit;
import halfrail.design.DesignCircuits;
import halfrail.design.DesignException;
import halfrail.design.FixedRail;
import halfrail.design.Load;
import halfrail.design.OpAmpChoice;
import halfrail.design.Reference;
import halfrail.design.ReferenceKind;
import halfrail.design.SignalSource;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.design.Thresholds;
import halfrail.parts.OpAmpArchetype;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

import static halfrail.check.TestDesigns.film;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Every reference kind with chains of one to three stages of every kind, AC- or DC-coupled
 * between stages (the first stage is always AC-coupled: the source sits at 0 V). Each builds,
 * solves and gives sane numbers: a KCL-consistent operating point, mid-rail at V/2 for an equal
 * divider, and each stage's signal gain from its resistors.
 */
class TopologyMatrixTest {
    static final double VOLTS = 9;

    static Stream<Arguments> chains() {
        List<Arguments> out = new ArrayList<>();
        StageKind[] kinds = StageKind.values();
        for (ReferenceKind ref : ReferenceKind.values()) {
            for (int n = 1; n <= 3; n++) {
                int combos = (int) Math.pow(kinds.length, n);
                for (int k = 0; k < combos; k++) {
                    List<StageKind> chain = new ArrayList<>();
                    int c = k;
                    for (int i = 0; i < n; i++) {
                        chain.add(kinds[c % kinds.length]);
                        c /= kinds.length;
                    }
                    out.add(Arguments.of(ref, chain, true));
                    if (n > 1) {
                        out.add(Arguments.of(ref, chain, false));
                    }
                }
            }
        }
        return out.stream();
    }

    static Reference reference(ReferenceKind kind) {
        return switch (kind) {
            case DIVIDER_DIRECT -> Reference.direct(100e3, 100e3);
            case DIVIDER_DECOUPLED -> Reference.decoupled(100e3, 100e3, film(10e-6), 100e3);
            case DIVIDER_BUFFERED -> Reference.buffered(100e3, 100e3, film(10e-6), 100e3,
                    OpAmpChoice.archetype(OpAmpArchetype.SINGLE_SUPPLY_BIPOLAR), 1e3, film(10e-6));
        };
    }

    static Stage stage(int i, StageKind kind, boolean acCoupled) {
        OpAmpChoice part = OpAmpChoice.archetype(OpAmpArchetype.SINGLE_SUPPLY_BIPOLAR);
        var in = acCoupled ? film(1e-6) : null;
        return switch (kind) {
            case NON_INVERTING -> new Stage("s" + i, kind, part, 20e3, 10e3, film(10e-6), in);
            case INVERTING -> new Stage("s" + i, kind, part, 20e3, 10e3, null, in);
            case FOLLOWER -> new Stage("s" + i, kind, part, 0, 0, null, in);
        };
    }

    static Design design(ReferenceKind ref, List<StageKind> kinds, boolean acBetween) {
        List<Stage> stages = new ArrayList<>();
        for (int i = 0; i < kinds.size(); i++) {
            stages.add(stage(i, kinds.get(i), i == 0 || acBetween));
        }
        return new Design(ref + " " + kinds, "", new FixedRail(VOLTS, 0.05, 0, 0, 0), reference(ref), stages,
                new SignalSource(0.01, AmplitudeUnit.VOLTS_PEAK, 1e3, 20, 20e3), new Load(10e3, 0, film(4.7e-6)),
                Thresholds.defaults(), 1e-3);
    }

    /**
     * The direct reference's rule, worked out on its own: a stage sits on the divider node when it
     * is inverting, or AC-coupled non-inverting or follower (which also puts signal there). More
     * than one stage on the node with signal on it is refused.
     */
    static boolean refused(ReferenceKind ref, List<StageKind> kinds, boolean acBetween) {
        if (ref != ReferenceKind.DIVIDER_DIRECT) {
            return false;
        }
        int on = 0;
        boolean signal = false;
        for (int i = 0; i < kinds.size(); i++) {
            boolean ac = i == 0 || acBetween;
            if (kinds.get(i) == StageKind.INVERTING) {
                on++;
            } else if (ac) {
                on++;
                signal = true;
            }
        }
        return on > 1 && signal;
    }

    @ParameterizedTest(name = "{0}, {1}, AC between stages: {2}")
    @MethodSource("chains")
    void everyChainBuildsSolvesAndGivesSaneNumbers(ReferenceKind ref, List<StageKind> kinds, boolean acBetween) {
        Design d = design(ref, kinds, acBetween);
        if (refused(ref, kinds, acBetween)) {
            DesignException e = assertThrows(DesignException.class, () -> DesignCircuits.nominal(d));
            assertTrue(e.path().startsWith("stages["), e.path());
            assertThrows(DesignException.class, () -> DesignAnalysis.analyse(d, false));
            return;
        }
        DesignReport r = DesignAnalysis.analyse(d, false);
        assertTrue(r.failure().isEmpty(), r.failureMessage() + " " + r.floatingNodes());
        ReportAssertions.assertAllFinite(r);
        DesignCircuit c = DesignCircuits.nominal(d);
        assertKirchhoffCurrentLaw(c.circuit(), r.nodeVolts());

        // Equal divider: mid-rail at V/2 (the single-supply part's 45 nA through 50 kΩ moves it by a few mV).
        assertEquals(VOLTS / 2, r.nodeVolts().get(c.referenceNode()), 0.02);
        for (StageReport s : r.stages()) {
            // Unity DC gain for the bias in every stage: each output rests at mid-rail, within offsets
            // amplified by at most 3 along a DC-coupled chain.
            assertEquals(VOLTS / 2, s.outputVolts(), 0.15, s.label());
            assertTrue(!s.nominal().saturated(), s.label());
        }
        List<StageReport> signal = r.stages().stream().filter(StageReport::signal).toList();
        for (int i = 0; i < kinds.size(); i++) {
            // Gain 1 + R2/R1 = 3, |−R2/R1| = 2, follower 1 (any op-amp text), at the band's centre.
            double expected = Math.abs(d.stages().get(i).nominalGain());
            assertEquals(expected, signal.get(i).stageGain(), expected * 0.02, signal.get(i).label());
        }
    }

    /**
     * Kirchhoff's current law at every node that only resistors, capacitor leakage and op-amp
     * inputs meet, evaluated here from the reported node voltages and the element values.
     */
    static void assertKirchhoffCurrentLaw(Circuit circuit, Map<String, Double> volts) {
        for (String node : circuit.nodes()) {
            if (node.equals(Circuit.GROUND) || !volts.containsKey(node)) {
                continue;
            }
            double leaving = 0;
            boolean checkable = true;
            for (Element e : circuit.elements()) {
                if (!e.terminals().contains(node)) {
                    continue;
                }
                if (e instanceof Resistor res) {
                    double i = (v(volts, res.a()) - v(volts, res.b())) / res.ohms();
                    leaving += node.equals(res.a()) ? i : -i;
                } else if (e instanceof Capacitor cap) {
                    double i = (v(volts, cap.plus()) - v(volts, cap.minus())) * cap.leakageSiemens();
                    leaving += node.equals(cap.plus()) ? i : -i;
                } else if (e instanceof OpAmp o && !node.equals(o.out()) && !node.equals(o.vPos())
                        && !node.equals(o.vNeg())) {
                    var p = o.params();
                    if (node.equals(o.inPlus())) {
                        leaving += p.biasAmps() + p.offsetCurrentAmps() / 2;
                    }
                    if (node.equals(o.inMinus())) {
                        leaving += p.biasAmps() - p.offsetCurrentAmps() / 2;
                    }
                } else {
                    checkable = false;
                }
            }
            if (checkable) {
                final double sum = leaving;
                assertEquals(0, sum, 1e-10, () -> "KCL at " + node + ": " + sum + " A");
            }
        }
    }

    private static double v(Map<String, Double> volts, String node) {
        return node.equals(Circuit.GROUND) ? 0 : volts.get(node);
    }
}
