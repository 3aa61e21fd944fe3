package halfrail.circuit;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;

class CircuitWithValuesTest {
    private static Circuit divider() {
        return Circuit.builder().implicitNodes()
                .voltageSource("V1", "in", "0", 10)
                .resistor("R1", "in", "mid", 1e3)
                .resistor("R2", "mid", "0", 1e3)
                .build();
    }

    @Test
    void aCopyWithNewValuesKeepsTheNodesAndNamesAndCarriesTheValues() {
        Circuit c = divider();
        List<Element> es = new ArrayList<>(c.elements());
        es.set(1, ((Resistor) es.get(1)).withOhms(2e3));
        Circuit v = c.withValues(es);
        assertEquals(c.nodes(), v.nodes());
        assertEquals(2e3, ((Resistor) v.element("R1").orElseThrow()).ohms(), 0);
        assertEquals(1e3, ((Resistor) c.element("R1").orElseThrow()).ohms(), 0, "the original is unchanged");
        assertSame(es.get(2), v.element("R2").orElseThrow());
    }

    @Test
    void aCopyThatChangesTheTopologyIsRejected() {
        Circuit c = divider();
        List<Element> moved = new ArrayList<>(c.elements());
        moved.set(2, new Resistor("R2", "mid", "in", 1e3));
        assertEquals(CircuitException.Kind.BAD_CONNECTION,
                assertThrows(CircuitException.class, () -> c.withValues(moved)).kind());
        List<Element> renamed = new ArrayList<>(c.elements());
        renamed.set(2, new Resistor("R3", "mid", "0", 1e3));
        assertThrows(CircuitException.class, () -> c.withValues(renamed));
        assertThrows(CircuitException.class, () -> c.withValues(c.elements().subList(0, 2)));
    }
}
