package halfrail.ui;

import halfrail.check.DesignAnalysis;
import halfrail.check.DesignReport;
import halfrail.circuit.Circuit;
import halfrail.circuit.Element;
import halfrail.circuit.OpAmp;
import halfrail.design.Design;
import halfrail.design.DesignCircuit;
import halfrail.design.DesignCircuits;
import halfrail.design.ReferenceKind;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.io.DesignFiles;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.api.Test;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Layout and hit-testing of the circuit drawing, without any toolkit, on every template and sample. */
class SchematicGeometryTest {
    record Case(String name, Design design) {
        @Override
        public String toString() {
            return name;
        }
    }

    static Stream<Case> designs() {
        List<Case> cases = new ArrayList<>();
        for (StageKind sk : StageKind.values()) {
            for (ReferenceKind rk : ReferenceKind.values()) {
                cases.add(new Case(sk + " on " + rk, DesignTemplates.of(sk, rk)));
            }
        }
        cases.add(new Case("instrument boost", SampleDesigns.instrumentBoost()));
        cases.add(new Case("without its leg capacitor", SampleDesigns.missingLegCapacitor()));
        Design boost = SampleDesigns.instrumentBoost();
        Stage s = boost.stages().get(0);
        cases.add(new Case("two boosts in a row", boost.withStages(List.of(s, new Stage("boost 2", s.kind(), s.opAmp(), s.feedbackOhms(), s.legOhms(), s.legCapacitor(), s.inputCapacitor(), s.biased())))));
        for (String f : List.of("handheld-recorder-mic-preamp", "usb-line-driver", "li-ion-sensor-front-end",
                "review-faults", "review-faults-second-pass")) {
            cases.add(new Case(f, DesignFiles.read(Path.of("samples", f + ".json"))));
        }
        return cases.stream();
    }

    private static SchematicGeometry layout(Design d) {
        DesignReport r = DesignAnalysis.analyse(d, false);
        return new SchematicGeometry(d, DesignCircuits.nominal(d), r.nodeVolts(), r.floatingNodes());
    }

    @ParameterizedTest
    @MethodSource("designs")
    void everyNodeButGroundGetsExactlyOneLabelWithItsDcVoltage(Case c) {
        DesignReport r = DesignAnalysis.analyse(c.design(), false);
        DesignCircuit dc = DesignCircuits.nominal(c.design());
        SchematicGeometry g = new SchematicGeometry(c.design(), dc, r.nodeVolts(), r.floatingNodes());
        Map<String, Integer> count = new HashMap<>();
        g.nodeLabels().forEach(l -> count.merge(l.owner(), 1, Integer::sum));
        for (String node : dc.circuit().nodes()) {
            if (node.equals(Circuit.GROUND)) {
                assertFalse(count.containsKey(node), "ground is not labelled");
                continue;
            }
            assertEquals(1, count.getOrDefault(node, 0), "labels of node " + node);
        }
        assertEquals(dc.circuit().nodes().stream().filter(n -> !n.equals(Circuit.GROUND)).count(), g.nodeLabels().size());
        for (SchematicGeometry.Label l : g.nodeLabels()) {
            Double v = r.nodeVolts().get(l.owner());
            if (v != null) {
                assertEquals(String.format(Locale.ROOT, "%.2f V", v), l.lines().get(1), l.owner());
            }
        }
    }

    @ParameterizedTest
    @MethodSource("designs")
    void everyElementIsDrawnOnceAndEveryTerminalTouchesAWireOfItsNode(Case c) {
        DesignCircuit dc = DesignCircuits.nominal(c.design());
        SchematicGeometry g = layout(c.design());
        assertEquals(dc.circuit().elements().stream().map(Element::name).sorted().toList(),
                g.parts().stream().map(SchematicGeometry.Part::id).sorted().toList());
        for (SchematicGeometry.Part p : g.parts()) {
            Element e = dc.circuit().element(p.id()).orElseThrow();
            if (e instanceof OpAmp u) {
                SchematicGeometry.Box b = p.body();
                double top = b.y() + b.height() / 4;
                double bottom = b.y() + 3 * b.height() / 4;
                assertTouches(g, u.inPlus(), b.x(), p.minusOnTop() ? bottom : top, p.id() + " +");
                assertTouches(g, u.inMinus(), b.x(), p.minusOnTop() ? top : bottom, p.id() + " −");
                assertTouches(g, u.out(), b.x() + b.width(), b.y() + b.height() / 2, p.id() + " out");
            } else {
                List<String> t = e.terminals();
                assertTouches(g, t.get(0), p.x1(), p.y1(), p.id() + " first terminal");
                assertTouches(g, t.get(1), p.x2(), p.y2(), p.id() + " second terminal");
            }
        }
    }

    private static void assertTouches(SchematicGeometry g, String node, double x, double y, String what) {
        if (node.equals(Circuit.GROUND) && g.grounds().contains(new SchematicGeometry.Point(x, y))) {
            return;
        }
        assertTrue(g.wires().stream().anyMatch(w -> w.node().equals(node) && on(w, x, y)),
                what + " at (" + x + ", " + y + ") touches no wire of " + node);
    }

    private static boolean on(SchematicGeometry.Wire w, double x, double y) {
        return x >= Math.min(w.x1(), w.x2()) - 1e-9 && x <= Math.max(w.x1(), w.x2()) + 1e-9
                && y >= Math.min(w.y1(), w.y2()) - 1e-9 && y <= Math.max(w.y1(), w.y2()) + 1e-9;
    }

    @ParameterizedTest
    @MethodSource("designs")
    void eachNodesWiresAndTerminalsFormOneConnectedPiece(Case c) {
        DesignCircuit dc = DesignCircuits.nominal(c.design());
        SchematicGeometry g = layout(c.design());
        for (String node : dc.circuit().nodes()) {
            if (node.equals(Circuit.GROUND)) {
                continue;
            }
            List<SchematicGeometry.Wire> ws = g.wires().stream().filter(w -> w.node().equals(node)).toList();
            assertFalse(ws.isEmpty(), node + " has wires");
            // grow one piece from the first wire; wires join where an end of one lies on the other
            List<SchematicGeometry.Wire> piece = new ArrayList<>(List.of(ws.get(0)));
            boolean grown = true;
            while (grown) {
                grown = false;
                for (SchematicGeometry.Wire w : ws) {
                    if (!piece.contains(w) && piece.stream().anyMatch(p -> joined(p, w))) {
                        piece.add(w);
                        grown = true;
                    }
                }
            }
            assertEquals(ws.size(), piece.size(), "node " + node + " is drawn in more than one piece: " + ws);
        }
    }

    private static boolean joined(SchematicGeometry.Wire a, SchematicGeometry.Wire b) {
        return on(a, b.x1(), b.y1()) || on(a, b.x2(), b.y2()) || on(b, a.x1(), a.y1()) || on(b, a.x2(), a.y2());
    }

    @ParameterizedTest
    @MethodSource("designs")
    void wiresOfDifferentNodesNeverMeet(Case c) {
        List<SchematicGeometry.Wire> ws = layout(c.design()).wires();
        for (int i = 0; i < ws.size(); i++) {
            for (int j = i + 1; j < ws.size(); j++) {
                SchematicGeometry.Wire a = ws.get(i);
                SchematicGeometry.Wire b = ws.get(j);
                if (!a.node().equals(b.node())) {
                    assertFalse(a.box().overlaps(b.box()), a + " meets " + b);
                }
            }
        }
    }

    @ParameterizedTest
    @MethodSource("designs")
    void partsAndLabelsDoNotOverlap(Case c) {
        SchematicGeometry g = layout(c.design());
        assertEquals(List.of(), g.unplaced(), "labels without a clear spot in " + c + ": " + g.partLabels() + g.nodeLabels() + g.parts());
        List<SchematicGeometry.Box> bodies = g.parts().stream().map(SchematicGeometry.Part::body).toList();
        List<SchematicGeometry.Label> labels = new ArrayList<>(g.nodeLabels());
        labels.addAll(g.partLabels());
        for (int i = 0; i < bodies.size(); i++) {
            for (int j = i + 1; j < bodies.size(); j++) {
                assertFalse(bodies.get(i).overlaps(bodies.get(j)), g.parts().get(i).id() + " overlaps " + g.parts().get(j).id());
            }
        }
        for (int i = 0; i < labels.size(); i++) {
            SchematicGeometry.Label a = labels.get(i);
            assertTrue(a.box().x() >= 0 && a.box().x() + a.box().width() <= g.width()
                    && a.box().y() >= 0 && a.box().y() + a.box().height() <= g.height(), a + " inside the drawing");
            for (int j = i + 1; j < labels.size(); j++) {
                assertFalse(a.box().overlaps(labels.get(j).box()), a + " overlaps " + labels.get(j));
            }
            for (SchematicGeometry.Part p : g.parts()) {
                assertFalse(a.box().overlaps(p.body()), a + " covers " + p.id());
            }
            for (SchematicGeometry.Wire w : g.wires()) {
                assertFalse(a.box().overlaps(w.box()), a + " covers " + w);
            }
        }
        assertEquals(g.parts().size(), g.partLabels().size(), "one label per part");
    }

    @ParameterizedTest
    @MethodSource("designs")
    void clickingAPartReturnsItsIdAndEmptyPaperReturnsNothing(Case c) {
        SchematicGeometry g = layout(c.design());
        for (SchematicGeometry.Part p : g.parts()) {
            SchematicGeometry.Box b = p.body();
            assertEquals(p.id(), g.hit(b.x() + b.width() / 2, b.y() + b.height() / 2).orElseThrow().id());
        }
        assertTrue(g.hit(1, 1).isEmpty(), "the top-left corner is paper");
        assertTrue(g.hit(g.width() - 1, g.height() - 1).isEmpty(), "the bottom-right corner is paper");
    }

    @Test
    void partsCarryTheDesignPathsThatFindingsName() {
        SchematicGeometry g = layout(SampleDesigns.instrumentBoost());
        assertEquals("stages[0].legCapacitor", g.part("CLEG1").orElseThrow().designPath());
        assertEquals("stages[0].feedbackOhms", g.part("R2_1").orElseThrow().designPath());
        assertEquals("reference.decoupling", g.part("CREF").orElseThrow().designPath());
        assertEquals("load.outputCapacitor", g.part("COUT").orElseThrow().designPath());
        assertEquals("ref", g.busNode());
    }

    @Test
    void aFindingAboutAStageSpotlightsItsPartsOnly() {
        SchematicModel m = new SchematicModel();
        m.spotlight(List.of("stages[0]"));
        assertTrue(m.isSpotlit("stages[0].legCapacitor"));
        assertTrue(m.isSpotlit("stages[0].opAmp"));
        assertFalse(m.isSpotlit("stages[1].legCapacitor"));
        assertFalse(m.isSpotlit("reference.decoupling"));
        m.spotlight(List.of("load.outputCapacitor"));
        assertTrue(m.isSpotlit("load.outputCapacitor"));
        assertFalse(m.isSpotlit("load.ohms"));
    }

    @Test
    void aFloatingNodeIsLabelledSo() {
        // without its input's bias resistor the non-inverting input has no DC path (DESIGN.md, "Inputs need a DC path")
        Design d = SampleDesigns.instrumentBoost();
        Design unbiased = d.withStage(0, d.stages().get(0).withBiased(false));
        DesignReport r = DesignAnalysis.analyse(unbiased, false);
        assertTrue(r.floatingNodes().contains("s1.p"), "the analysis finds the floating input: " + r.floatingNodes());
        SchematicGeometry g = new SchematicGeometry(unbiased, DesignCircuits.nominal(unbiased), r.nodeVolts(), r.floatingNodes());
        assertEquals(List.of("s1.p", "floating"), g.nodeLabels().stream()
                .filter(l -> l.owner().equals("s1.p")).findFirst().orElseThrow().lines());
    }
}
