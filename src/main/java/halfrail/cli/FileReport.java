package halfrail.cli;

import halfrail.solve.OpAmpState;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * What {@code check} found in one file.
 *
 * @param file           the file as named on the command line (or found in a directory)
 * @param title          the netlist's title line
 * @param outputNode     the output node, from {@code --output} or the file's {@code * output:} comment
 * @param nodeVolts      node name → DC voltage in V; null for a floating node, whose voltage is undefined
 * @param opAmps         each op-amp at the operating point; empty when no operating point was found
 * @param floating       nodes with no DC path, in circuit order
 * @param lowerCornerHz  lower −3 dB corner in Hz; filled by the AC analysis, null until then
 * @param settleSeconds  power-on settle time in s; filled by the transient analysis, null until then
 * @param findings       the findings, worst first
 * @param notes          what the netlist reader accepted without acting on it
 */
public record FileReport(String file, String title, Optional<String> outputNode, Map<String, Double> nodeVolts,
                         List<OpAmpState> opAmps, List<String> floating, Double lowerCornerHz, Double settleSeconds,
                         List<Finding> findings, List<String> notes) {

    public FileReport {
        nodeVolts = Collections.unmodifiableMap(new LinkedHashMap<>(nodeVolts));
        opAmps = List.copyOf(opAmps);
        floating = List.copyOf(floating);
        findings = List.copyOf(findings);
        notes = List.copyOf(notes);
    }

    /** The worst severity found; empty when there is no finding. */
    public Optional<Severity> worst() {
        return findings.stream().map(Finding::severity).max(Enum::compareTo);
    }

    /** Whether anything at or above {@code threshold} was found. */
    public boolean failsAt(Severity threshold) {
        return worst().map(s -> s.compareTo(threshold) >= 0).orElse(false);
    }

    /** {@code pass} when there is no finding, else the worst severity's label. */
    public String verdict() {
        return worst().map(Severity::label).orElse("pass");
    }
}
