package halfrail.cli;

import halfrail.circuit.Circuit;
import halfrail.circuit.Element;
import halfrail.circuit.OpAmp;
import halfrail.solve.OpAmpState;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Set;

/**
 * The findings {@code check} makes on a netlist from its floating nodes and its DC operating point.
 * Codes are stable; tools may switch on them.
 */
final class NetlistFindings {
    /** A node has no DC path to ground or to a driven output (fail). */
    static final String FLOATING_NODE = "FLOATING_NODE";
    /** An op-amp's output sits on a limit of its swing window with no signal: it has left its linear region (fail). */
    static final String SATURATED_AT_REST = "SATURATED_AT_REST";
    /** An op-amp input rests outside the part's common-mode range (fail). */
    static final String INPUT_OUTSIDE_COMMON_MODE = "INPUT_OUTSIDE_COMMON_MODE";
    /** An op-amp output rests within {@link #HEADROOM_WARN_FRACTION} of its swing window from a limit (warn). */
    static final String LOW_HEADROOM = "LOW_HEADROOM";
    /** The DC operating point could not be solved (fail). */
    static final String NO_OPERATING_POINT = "NO_OPERATING_POINT";

    /**
     * Fraction of the swing window (swing high − swing low, V) below which the distance of the
     * resting output from the nearer limit draws a warning. Common practice: bias the output
     * near the middle of the window so the signal can swing both ways.
     */
    static final double HEADROOM_WARN_FRACTION = 0.10;

    private NetlistFindings() {}

    static List<Finding> floating(Circuit circuit, List<String> floating) {
        List<Finding> out = new ArrayList<>();
        for (String node : floating) {
            out.add(new Finding(FLOATING_NODE, Severity.FAIL, "node " + node
                    + " has no DC path to ground or to a driven output, so its voltage is undefined"
                    + "; voltages that depend on it are computed with it tied to ground through "
                    + String.format(Locale.ROOT, "%.0f", CheckCommand.FLOATING_TIE_OHMS / 1e6) + " MΩ",
                    touching(circuit, node)));
        }
        return out;
    }

    /** Findings on op-amps; op-amps with a terminal on a floating node are left to the floating-node finding. */
    static List<Finding> opAmps(Circuit circuit, List<OpAmpState> states, Set<String> floating) {
        List<Finding> out = new ArrayList<>();
        for (OpAmpState s : states) {
            OpAmp o = circuit.element(s.name()).map(OpAmp.class::cast).orElseThrow();
            if (o.terminals().stream().anyMatch(floating::contains)) {
                continue;
            }
            double window = s.swingHighVolts() - s.swingLowVolts();
            double toLow = s.outputVolts() - s.swingLowVolts();
            double toHigh = s.swingHighVolts() - s.outputVolts();
            boolean nearHigh = toHigh < toLow;
            List<String> parts = List.of(s.name());
            if (s.saturated()) {
                out.add(new Finding(SATURATED_AT_REST, Severity.FAIL, String.format(Locale.ROOT,
                        "%s output rests at %.3f V against its %s limit of %.3f V: the stage is saturated with no signal"
                                + " (inputs %.3f V and %.3f V)",
                        s.name(), s.outputVolts(), nearHigh ? "upper" : "lower",
                        nearHigh ? s.swingHighVolts() : s.swingLowVolts(), s.inPlusVolts(), s.inMinusVolts()), parts));
            } else if (window > 0 && Math.min(toLow, toHigh) < HEADROOM_WARN_FRACTION * window) {
                out.add(new Finding(LOW_HEADROOM, Severity.WARN, String.format(Locale.ROOT,
                        "%s output rests at %.3f V, %.3f V from its %s limit of %.3f V, less than %.0f %% of its"
                                + " %.3f V swing window",
                        s.name(), s.outputVolts(), Math.min(toLow, toHigh), nearHigh ? "upper" : "lower",
                        nearHigh ? s.swingHighVolts() : s.swingLowVolts(), HEADROOM_WARN_FRACTION * 100, window),
                        parts));
            }
            if (!s.commonModeOk()) {
                boolean plusOut = s.inPlusVolts() < s.commonModeLowVolts() || s.inPlusVolts() > s.commonModeHighVolts();
                out.add(new Finding(INPUT_OUTSIDE_COMMON_MODE, Severity.FAIL, String.format(Locale.ROOT,
                        "%s %s input rests at %.3f V, outside the common-mode range %.3f V to %.3f V",
                        s.name(), plusOut ? "non-inverting" : "inverting",
                        plusOut ? s.inPlusVolts() : s.inMinusVolts(), s.commonModeLowVolts(),
                        s.commonModeHighVolts()), parts));
            }
        }
        return out;
    }

    static Finding noOperatingPoint(String reason) {
        return new Finding(NO_OPERATING_POINT, Severity.FAIL, "no DC operating point: " + reason, List.of());
    }

    /** Worst first, then in the order made. */
    static List<Finding> sorted(List<Finding> findings) {
        List<Finding> out = new ArrayList<>(findings);
        out.sort(Comparator.comparing(Finding::severity).reversed());
        return out;
    }

    private static List<String> touching(Circuit circuit, String node) {
        List<String> parts = new ArrayList<>();
        for (Element e : circuit.elements()) {
            if (e.terminals().contains(node)) {
                parts.add(e.name());
            }
        }
        return parts;
    }
}
