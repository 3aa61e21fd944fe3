package halfrail.io.report;

import halfrail.check.DesignReport;

import java.util.Objects;

/**
 * One design in a review: where it came from and what the analysis found.
 *
 * @param source the file it was read from, as the user named it (shown in the documents)
 * @param report the analysis of the design
 */
public record ReviewEntry(String source, DesignReport report) {
    public ReviewEntry {
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(report, "report");
    }
}
