package halfrail.io.report;

import halfrail.check.Finding;

import java.awt.image.BufferedImage;
import java.util.List;

/**
 * One piece of a review document, in reading order. {@link ReviewDocument} builds the blocks once;
 * the HTML and PDF writers only lay them out, so both documents say the same things.
 */
sealed interface Block {
    /** A heading; level 1 is the document title, 2 a design (a new page in the PDF), 3 a part of one. */
    record Heading(int level, String text, String id) implements Block {}

    /** A paragraph; {@code kind} picks its look. */
    record Para(String text, Kind kind) implements Block {
        enum Kind { TEXT, META, SAFETY, PROBLEM }
    }

    /**
     * A table of text cells. {@code verdicts}, when not empty, holds one verdict per row, shown
     * in column {@code verdictColumn}; {@code links}, when not empty, the id of the block each
     * row's first cell leads to (the HTML links it).
     */
    record Table(String id, String caption, List<String> header, List<List<String>> rows, List<Verdict> verdicts,
                 int verdictColumn, List<String> links) implements Block {
        public Table {
            header = List.copyOf(header);
            rows = rows.stream().map(List::copyOf).toList();
            verdicts = List.copyOf(verdicts);
            links = List.copyOf(links);
        }

        Table(String id, String caption, List<String> header, List<List<String>> rows) {
            this(id, caption, header, rows, List.of(), -1, List.of());
        }

        /** A two-column table of names and values. */
        static Table pairs(String id, String caption, List<List<String>> rows) {
            return new Table(id, caption, List.of(), rows);
        }
    }

    /** A picture with its caption and a text alternative. */
    record Picture(String id, String caption, String alt, BufferedImage image) implements Block {}

    /** One finding with its suggestion. */
    record FindingItem(Finding finding) implements Block {}
}
