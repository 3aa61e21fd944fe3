package halfrail.cli;

import halfrail.check.Finding;
import halfrail.check.Severity;
import halfrail.solve.PowerOnResult;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * What {@code check} found in one file, a netlist or a design.
 *
 * @param file           the file as named on the command line (or found in a directory)
 * @param title          the netlist's title line or the design's name
 * @param outputNode     the output node (netlists: {@code --output} or the file's {@code * output:} comment; designs: the load)
 * @param nodeVolts      node name → DC voltage in V; null for a floating node, whose voltage is undefined
 * @param opAmps         each op-amp at the operating point; empty when no operating point was found
 * @param floating       nodes with no DC path, in circuit order
 * @param lowerCornerHz  lower −3 dB point of the response in Hz; null when there is none or it could not be found
 * @param settleSeconds  power-on settle-up time in s; null when the circuit did not settle or was not run
 * @param oscillation    the node that kept oscillating after power-on, with its period and swing, when one did
 * @param findings       the findings, worst first
 * @param notes          what the reader accepted without acting on it
 */
public record FileReport(String file, String title, Optional<String> outputNode, Map<String, Double> nodeVolts,
                         List<OpAmpRow> opAmps, List<String> floating, Double lowerCornerHz, Double settleSeconds,
                         Optional<PowerOnResult.Oscillation> oscillation, List<Finding> findings, List<String> notes) {

    public FileReport {
        oscillation = oscillation == null ? Optional.empty() : oscillation;
        nodeVolts = Collections.unmodifiableMap(new LinkedHashMap<>(nodeVolts));
        opAmps = List.copyOf(opAmps);
        floating = List.copyOf(floating);
        findings = List.copyOf(findings);
        notes = List.copyOf(notes);
    }

    /** The worst severity found; empty when there is no finding. */
    public Optional<Severity> worst() {
        return findings.stream().map(Finding::severity).min(Enum::compareTo);
    }

    /** Whether anything at or above {@code threshold} was found. */
    public boolean failsAt(Severity threshold) {
        return worst().map(s -> s.atLeast(threshold)).orElse(false);
    }

    /** {@code pass} when nothing at WARN or above was found, else the worst severity in lower case. */
    public String verdict() {
        return worst().filter(s -> s.atLeast(Severity.WARN)).map(FileReport::label).orElse("pass");
    }

    static String label(Severity s) {
        return s.name().toLowerCase(Locale.ROOT);
    }
}
