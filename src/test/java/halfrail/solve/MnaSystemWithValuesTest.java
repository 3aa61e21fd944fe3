package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.Element;
import halfrail.circuit.Resistor;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

class MnaSystemWithValuesTest {
    private static Circuit divider(double r2) {
        return Circuit.builder().implicitNodes()
                .voltageSource("V1", "in", "0", 10)
                .resistor("R1", "in", "mid", 1e3)
                .resistor("R2", "mid", "0", r2)
                .build();
    }

    @Test
    void aVariantSolvesLikeAFreshlyAssembledSystem() {
        MnaSystem base = MnaSystem.of(divider(1e3));
        Circuit variant = divider(3e3);
        OperatingPoint shared = new DcSolver(base.withValuesOf(variant)).solveFrom(new DcSolver(base).solve().solution());
        // Divider closed form: 10 V · 3k / (1k + 3k) = 7.5 V.
        assertEquals(7.5, shared.voltage("mid"), 1e-9);
        assertEquals(new DcSolver(MnaSystem.of(variant)).solve().voltage("mid"), shared.voltage("mid"), 1e-12);
    }

    @Test
    void aVariantWithAnotherTopologyIsRejected() {
        MnaSystem base = MnaSystem.of(divider(1e3));
        Circuit other = Circuit.builder().implicitNodes()
                .voltageSource("V1", "in", "0", 10)
                .resistor("R1", "in", "mid", 1e3)
                .resistor("R2", "mid", "x", 1e3)
                .resistor("R3", "x", "0", 1e3)
                .build();
        assertEquals(AnalysisException.Kind.BAD_REQUEST,
                assertThrows(AnalysisException.class, () -> base.withValuesOf(other)).kind());
        List<Element> es = new ArrayList<>(divider(1e3).elements());
        es.set(2, new Resistor("R2", "in", "0", 1e3));
        Circuit moved = Circuit.builder().implicitNodes().add(es.get(0)).add(es.get(1)).add(es.get(2)).build();
        assertThrows(AnalysisException.class, () -> base.withValuesOf(moved));
    }
}
