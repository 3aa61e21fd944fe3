package halfrail.io.report;

import halfrail.check.CircuitReport;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * One netlist in a review: a bare circuit with the circuit-level checks, without the design
 * model (so without ladders, supply or stage tables).
 *
 * @param source     the file it was read from, as the user named it
 * @param title      the netlist's title line (may be empty)
 * @param outputNode the output node the response was taken at, when known
 * @param report     what the circuit analysis found
 * @param notes      what the reader accepted without acting on it
 */
public record NetlistEntry(String source, String title, Optional<String> outputNode, CircuitReport report,
                           List<String> notes) {
    public NetlistEntry {
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(report, "report");
        title = title == null ? "" : title;
        outputNode = outputNode == null ? Optional.empty() : outputNode;
        notes = List.copyOf(notes);
    }

    /** The heading it gets: its title, or its file when it has none. */
    public String name() {
        return title.isBlank() ? source : title;
    }
}
