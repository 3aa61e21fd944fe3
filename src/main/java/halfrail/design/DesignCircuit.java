package halfrail.design;

import halfrail.circuit.Circuit;

import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A design turned into a circuit for the engine, with the names that tie the circuit back to
 * the design.
 *
 * @param circuit      the circuit
 * @param supplyVolts  the supply voltage it was built for, V
 * @param supplySource element name of the supply
 * @param signalSource element name of the signal source (DC 0 V, AC magnitude 1 V)
 * @param supplyNode   the supply rail node
 * @param referenceNode the node the stages are biased from (after decoupling or buffering)
 * @param loadNode     the node across the load
 * @param opAmps       every op-amp in signal order, the reference buffer (if any) first
 * @param designPaths  element name → design path, for findings that name parts
 */
public record DesignCircuit(Circuit circuit, double supplyVolts, String supplySource, String signalSource,
                            String supplyNode, String referenceNode, String loadNode, List<StageNodes> opAmps,
                            Map<String, String> designPaths) {

    public DesignCircuit {
        opAmps = List.copyOf(opAmps);
        designPaths = Map.copyOf(designPaths);
    }

    /** The signal stages only, in chain order. */
    public List<StageNodes> stages() {
        return opAmps.stream().filter(StageNodes::signal).toList();
    }

    /** The reference buffer, when the design has one. */
    public Optional<StageNodes> buffer() {
        return opAmps.stream().filter(s -> !s.signal()).findFirst();
    }

    /** The design path of a circuit element, or the element name when it has none. */
    public String designPath(String element) {
        return designPaths.getOrDefault(element, element);
    }
}
