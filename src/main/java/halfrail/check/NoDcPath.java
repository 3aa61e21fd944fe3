package halfrail.check;

import halfrail.circuit.Element;
import halfrail.design.DesignCircuit;

import java.util.ArrayList;
import java.util.List;

/**
 * A node with no DC path to a defined voltage: an op-amp input or a node behind a coupling
 * capacitor with nothing to carry its bias current. The stage drifts into a rail. Found from
 * the circuit graph before any solve (see {@link halfrail.solve.FloatingNodes}).
 */
final class NoDcPath {
    static final String CODE = "NO_DC_PATH";

    private NoDcPath() {}

    static Finding finding(DesignCircuit circuit, String node) {
        List<String> parts = new ArrayList<>();
        for (Element e : circuit.circuit().elements()) {
            if (e.terminals().contains(node)) {
                parts.add(circuit.designPath(e.name()));
            }
        }
        String opAmp = circuit.opAmps().stream()
                .filter(s -> s.inPlus().equals(node) || s.inMinus().equals(node))
                .map(s -> s.label()).findFirst().orElse(null);
        String what = opAmp != null ? "the input of " + opAmp + " (node " + node + ")" : "node " + node;
        return new Finding(CODE, Severity.FAIL,
                what + " has no DC path to a defined voltage: its bias current has nowhere to flow and it will drift to a rail",
                parts, "add a bias resistor from the mid-rail reference to " + node
                        + " (or DC-couple it), so that the input's bias current has a path",
                java.util.Optional.ofNullable(opAmp), java.util.Optional.empty());
    }
}
