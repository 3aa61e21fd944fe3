package halfrail.io.report;

import halfrail.check.Finding;
import halfrail.check.StageReport;

import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;

/**
 * One review run: the designs (and netlists) it covers, the tool's version and when it was made.
 * The documents ({@link HtmlReport}, {@link PdfReport}) are drawn from this alone.
 *
 * @param entries     the designs, in the order given
 * @param netlists    the netlists, in the order given; they follow the designs
 * @param toolVersion the program version written into the documents
 * @param generated   when the review was made (written in UTC)
 */
public record Review(List<ReviewEntry> entries, List<NetlistEntry> netlists, String toolVersion, Instant generated) {
    /** Label of a summary row for findings that concern the design as a whole. */
    public static final String WHOLE_DESIGN = "whole design";

    public Review {
        entries = List.copyOf(entries);
        netlists = List.copyOf(netlists);
        Objects.requireNonNull(toolVersion, "toolVersion");
        Objects.requireNonNull(generated, "generated");
        if (entries.isEmpty() && netlists.isEmpty()) {
            throw new IllegalArgumentException("a review needs at least one design or netlist");
        }
    }

    /** A review of designs only. */
    public Review(List<ReviewEntry> entries, String toolVersion, Instant generated) {
        this(entries, List.of(), toolVersion, generated);
    }

    /**
     * One row of the summary: a stage of a design (or the design as a whole, for findings naming
     * no stage) and its verdict.
     *
     * @param entry   index of the design in {@link #entries()}, or the number of designs plus the
     *                index of the netlist in {@link #netlists()}
     * @param design  the design's name (a netlist's title or file)
     * @param source  the file it came from
     * @param stage   the stage's label (a netlist's op-amp name), or {@link #WHOLE_DESIGN}
     * @param verdict the worst of the row's findings
     * @param codes   the row's finding codes, worst first, each once
     */
    public record SummaryRow(int entry, String design, String source, String stage, Verdict verdict,
                             List<String> codes) {
        public SummaryRow {
            codes = List.copyOf(codes);
        }
    }

    /** Whether the documents open with a summary table (more than one design or netlist). */
    public boolean hasSummary() {
        return entries.size() + netlists.size() > 1;
    }

    /**
     * One row per design and stage, plus a {@link #WHOLE_DESIGN} row for a design with findings
     * that name none of its stages (or with no stages at all); sorted worst first, then in file order.
     */
    public List<SummaryRow> summary() {
        List<SummaryRow> rows = new ArrayList<>();
        for (int i = 0; i < entries.size(); i++) {
            ReviewEntry e = entries.get(i);
            String name = e.report().design().name();
            for (StageReport s : e.report().stages()) {
                List<Finding> mine = e.report().findings().stream()
                        .filter(f -> f.opAmp().filter(s.label()::equals).isPresent()).toList();
                rows.add(new SummaryRow(i, name, e.source(), s.label(), Verdict.of(mine), codes(mine)));
            }
            java.util.Set<String> labels = new java.util.HashSet<>();
            e.report().stages().forEach(s -> labels.add(s.label()));
            List<Finding> whole = e.report().findings().stream()
                    .filter(f -> f.opAmp().filter(labels::contains).isEmpty()).toList();
            if (!whole.isEmpty() || e.report().stages().isEmpty()) {
                rows.add(new SummaryRow(i, name, e.source(), WHOLE_DESIGN, Verdict.of(whole), codes(whole)));
            }
        }
        for (int k = 0; k < netlists.size(); k++) {
            NetlistEntry n = netlists.get(k);
            java.util.Set<String> names = new java.util.HashSet<>();
            for (halfrail.solve.OpAmpState o : n.report().opAmps()) {
                names.add(o.name());
                List<Finding> mine = n.report().findings().stream()
                        .filter(f -> f.opAmp().filter(o.name()::equals).isPresent()).toList();
                rows.add(new SummaryRow(entries.size() + k, n.name(), n.source(), o.name(), Verdict.of(mine),
                        codes(mine)));
            }
            List<Finding> whole = n.report().findings().stream()
                    .filter(f -> f.opAmp().filter(names::contains).isEmpty()).toList();
            if (!whole.isEmpty() || n.report().opAmps().isEmpty()) {
                rows.add(new SummaryRow(entries.size() + k, n.name(), n.source(), WHOLE_DESIGN, Verdict.of(whole),
                        codes(whole)));
            }
        }
        rows.sort(Comparator.comparing(SummaryRow::verdict).thenComparingInt(SummaryRow::entry));
        return rows;
    }

    /** The worst verdict over every design and netlist. */
    public Verdict worst() {
        Verdict v = entries.stream().map(e -> Verdict.of(e.report().findings())).min(Comparator.naturalOrder())
                .orElse(Verdict.PASS);
        Verdict w = netlists.stream().map(n -> Verdict.of(n.report().findings())).min(Comparator.naturalOrder())
                .orElse(Verdict.PASS);
        return v.compareTo(w) <= 0 ? v : w;
    }

    /** Designs and netlists together. */
    public int size() {
        return entries.size() + netlists.size();
    }

    private static List<String> codes(List<Finding> findings) {
        return findings.stream().map(Finding::code).distinct().toList();
    }
}
