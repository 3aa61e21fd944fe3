package halfrail.check;

import halfrail.design.Design;
import halfrail.solve.AnalysisException;

import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Everything Halfrail found about one design. When the design could not be solved
 * ({@link #failure()} present, or floating nodes) the numeric parts are empty rather than
 * wrong, and the findings say why.
 *
 * @param design        the design analysed
 * @param failure       why the circuit could not be solved, when it could not
 * @param floatingNodes circuit nodes with no DC path (empty when every node has one)
 * @param nodeVolts     every circuit node's DC voltage at the nominal supply, V
 * @param stages        every op-amp, the reference buffer first
 * @param capacitors    every capacitor at the nominal operating point
 * @param chain         the signal chain's response
 * @param powerOn       the power-on transient
 * @param battery       the supply current and runtime
 * @param ladders       one voltage ladder per op-amp
 * @param findings      every finding, most serious first
 */
public record DesignReport(Design design, Optional<AnalysisException.Kind> failure, String failureMessage,
                           List<String> floatingNodes, Map<String, Double> nodeVolts, List<StageReport> stages,
                           List<CapacitorReport> capacitors, Optional<ChainReport> chain,
                           Optional<PowerOnReport> powerOn, Optional<BatteryReport> battery, List<Ladder> ladders,
                           List<Finding> findings) {
    public DesignReport {
        floatingNodes = List.copyOf(floatingNodes);
        nodeVolts = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(nodeVolts));
        stages = List.copyOf(stages);
        capacitors = List.copyOf(capacitors);
        ladders = List.copyOf(ladders);
        findings = findings.stream().sorted(Comparator.comparing(Finding::severity)).toList();
    }

    /** The most serious severity among the findings, if there are any. */
    public Optional<Severity> worst() {
        return findings.stream().map(Finding::severity).min(Comparator.naturalOrder());
    }

    /** Whether any finding is at least as serious as {@code level}. */
    public boolean has(Severity level) {
        return findings.stream().anyMatch(f -> f.severity().atLeast(level));
    }

    /** The findings with one code. */
    public List<Finding> findings(String code) {
        return findings.stream().filter(f -> f.code().equals(code)).toList();
    }

    public Optional<StageReport> stage(String label) {
        return stages.stream().filter(s -> s.label().equals(label)).findFirst();
    }
}
