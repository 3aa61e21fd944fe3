package halfrail.check;

import halfrail.solve.PowerOnResult;

import halfrail.solve.OpAmpState;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * What {@link CircuitAnalysis} found in a bare circuit (a netlist rather than a design).
 *
 * @param floating       nodes with no DC path, in circuit order
 * @param nodeVolts      node → DC voltage, V; null for a floating node, whose voltage is undefined
 * @param opAmps         each op-amp at the operating point; empty when none was found
 * @param lowerCornerHz  lower −3 dB point from the input source to the output node, Hz, when both are known and it exists
 * @param upperCornerHz  upper −3 dB point, Hz, likewise
 * @param settled        whether the power-on transient settled within its run (false when it was not run)
 * @param settleSeconds  the settle-up time, s, when it settled
 * @param findings       every finding, most serious first
 * @param oscillation    a node that kept oscillating after power-on, when the run saw one
 */
public record CircuitReport(List<String> floating, Map<String, Double> nodeVolts, List<OpAmpState> opAmps,
                            OptionalDouble lowerCornerHz, OptionalDouble upperCornerHz, boolean settled,
                            OptionalDouble settleSeconds, List<Finding> findings,
                            Optional<PowerOnResult.Oscillation> oscillation) {
    public CircuitReport {
        oscillation = oscillation == null ? Optional.empty() : oscillation;
        floating = List.copyOf(floating);
        nodeVolts = Collections.unmodifiableMap(new LinkedHashMap<>(nodeVolts));
        opAmps = List.copyOf(opAmps);
        findings = findings.stream().sorted(java.util.Comparator.comparing(Finding::severity)).toList();
    }
}
