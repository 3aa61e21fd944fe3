package halfrail.io.report;

import halfrail.check.Finding;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDDocumentInformation;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.PDPageContentStream;
import org.apache.pdfbox.pdmodel.common.PDRectangle;
import org.apache.pdfbox.pdmodel.font.PDType1Font;
import org.apache.pdfbox.pdmodel.font.Standard14Fonts;
import org.apache.pdfbox.pdmodel.graphics.image.LosslessFactory;
import org.apache.pdfbox.pdmodel.graphics.image.PDImageXObject;

import java.awt.Color;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.Calendar;
import java.util.List;
import java.util.Map;
import java.util.TimeZone;

/**
 * Writes a review as a PDF with Apache PDFBox: A4 pages, the standard Helvetica faces, the same
 * blocks as the HTML. The title page holds the summary (for more than one design); every design
 * after the first on a page of its own starts a new page. Characters the standard fonts cannot
 * show are written out (Ω as "ohm", − as "-", ≥ as ">=").
 */
public final class PdfReport {
    /** Page margin, pt. */
    static final float MARGIN = 48;
    /** Body text size, pt. */
    static final float BODY = 9.5f;
    /** Widest single word a table column makes room for before cutting it, pt. */
    static final float MAX_WORD_PT = 150;
    /** Line height over text size. */
    static final float LEADING = 1.32f;

    private PdfReport() {}

    /** The review as PDF bytes. */
    public static byte[] render(Review review) {
        try (PDDocument doc = new PDDocument()) {
            Layout l = new Layout(doc);
            List<Block> blocks = ReviewDocument.blocks(review);
            boolean firstDesign = true;
            for (int k = 0; k < blocks.size(); k++) {
                Block b = blocks.get(k);
                if (b instanceof Block.Heading h) {
                    if (h.level() == 3 && k + 1 < blocks.size() && blocks.get(k + 1) instanceof Block.Picture p) {
                        l.room(20 + l.pictureHeight(p));
                    }
                    if (h.level() == 2 && !h.id().equals("summary")) {
                        if (!firstDesign || review.hasSummary()) {
                            l.newPage();
                        }
                        firstDesign = false;
                    }
                    l.heading(h);
                } else if (b instanceof Block.Para p) {
                    l.para(p);
                } else if (b instanceof Block.Table t) {
                    l.table(t);
                } else if (b instanceof Block.Picture p) {
                    l.picture(p);
                } else if (b instanceof Block.FindingItem f) {
                    l.finding(f.finding());
                }
            }
            l.close();
            l.footers(review);
            PDDocumentInformation info = doc.getDocumentInformation();
            info.setTitle(HtmlReport.title(review));
            info.setCreator("halfrail " + review.toolVersion());
            Calendar when = Calendar.getInstance(TimeZone.getTimeZone("UTC"));
            when.setTimeInMillis(review.generated().toEpochMilli());
            info.setCreationDate(when);
            ByteArrayOutputStream out = new ByteArrayOutputStream();
            doc.save(out);
            return out.toByteArray();
        } catch (IOException e) {
            throw new UncheckedIOException("could not write the PDF: " + e.getMessage(), e);
        }
    }

    /** Text flowing down A4 pages. */
    private static final class Layout {
        private final PDDocument doc;
        private final PDType1Font regular = new PDType1Font(Standard14Fonts.FontName.HELVETICA);
        private final PDType1Font bold = new PDType1Font(Standard14Fonts.FontName.HELVETICA_BOLD);
        private final PDType1Font mono = new PDType1Font(Standard14Fonts.FontName.COURIER);
        private final float width = PDRectangle.A4.getWidth() - 2 * MARGIN;
        private PDPageContentStream cs;
        private float y;

        Layout(PDDocument doc) throws IOException {
            this.doc = doc;
            newPage();
        }

        void newPage() throws IOException {
            close();
            PDPage page = new PDPage(PDRectangle.A4);
            doc.addPage(page);
            cs = new PDPageContentStream(doc, page);
            y = PDRectangle.A4.getHeight() - MARGIN;
        }

        void close() throws IOException {
            if (cs != null) {
                cs.close();
                cs = null;
            }
        }

        /** Start a new page unless {@code height} pt still fit on this one. */
        void room(float height) throws IOException {
            if (y - height < MARGIN + 14) {
                newPage();
            }
        }

        void heading(Block.Heading h) throws IOException {
            float size = h.level() == 1 ? 20 : h.level() == 2 ? 15 : 11.5f;
            float before = h.level() == 1 ? 0 : h.level() == 2 ? 6 : 10;
            List<String> lines = wrap(h.text(), bold, size, width);
            room(before + lines.size() * size * LEADING + 40);
            y -= before;
            if (h.level() == 2) {
                fillRect(MARGIN, y, width, 2.2f, Palette.INK);
                y -= 6;
            }
            Color c = h.level() == 3 ? Palette.REST : Palette.INK;
            for (String line : lines) {
                y -= size * LEADING;
                text(line, bold, size, c, MARGIN, y + size * 0.25f);
            }
            y -= 3;
        }

        void para(Block.Para p) throws IOException {
            PDType1Font f = p.kind() == Block.Para.Kind.META ? regular : regular;
            float size = p.kind() == Block.Para.Kind.META ? 8.5f : BODY;
            Color c = p.kind() == Block.Para.Kind.META ? Palette.MID : Palette.INK;
            boolean boxed = p.kind() == Block.Para.Kind.SAFETY || p.kind() == Block.Para.Kind.PROBLEM;
            float inset = boxed ? 10 : 0;
            List<String> lines = wrap(p.text(), f, size, width - inset - (boxed ? 6 : 0));
            float h = lines.size() * size * LEADING + (boxed ? 8 : 0);
            room(Math.min(h, 200));
            y -= 3;
            if (boxed) {
                Color bar = p.kind() == Block.Para.Kind.SAFETY ? Palette.SIGNAL : Palette.CLIPPED;
                fillRect(MARGIN, y - h, width, h, tint(bar));
                fillRect(MARGIN, y - h, 3.5f, h, bar);
                y -= 4;
            }
            for (String line : lines) {
                room(size * LEADING);
                y -= size * LEADING;
                text(line, f, size, c, MARGIN + inset, y + size * 0.25f);
            }
            y -= boxed ? 8 : 4;
        }

        void table(Block.Table t) throws IOException {
            float size = 8.5f;
            float line = size * LEADING;
            int cols = t.header().isEmpty() ? (t.rows().isEmpty() ? 2 : t.rows().get(0).size()) : t.header().size();
            float[] w = columnWidths(t, cols, size);
            room(line * 3 + 14);
            y -= 4;
            y -= size * 1.4f;
            text(t.caption(), bold, size + 0.5f, Palette.INK, MARGIN, y + 3);
            y -= 2;
            if (!t.header().isEmpty()) {
                row(t.header(), w, size, true, null, -1);
            }
            for (int r = 0; r < t.rows().size(); r++) {
                Verdict v = t.verdicts().isEmpty() ? null : t.verdicts().get(r);
                row(t.rows().get(r), w, size, false, v, t.verdictColumn());
            }
            y -= 8;
        }

        private void row(List<String> cells, float[] w, float size, boolean header, Verdict verdict, int verdictColumn)
                throws IOException {
            float line = size * LEADING;
            List<List<String>> wrapped = new ArrayList<>();
            int lines = 1;
            for (int c = 0; c < cells.size(); c++) {
                List<String> l = wrap(cells.get(c), header ? bold : regular, size, w[c] - 8);
                wrapped.add(l);
                lines = Math.max(lines, l.size());
            }
            float h = lines * line + 4;
            if (y - h < MARGIN + 14) {
                newPage();
            }
            if (header) {
                fillRect(MARGIN, y - h, sum(w), h, Palette.INK);
            }
            float x = MARGIN;
            for (int c = 0; c < cells.size(); c++) {
                Color color = header ? Color.WHITE : c == 0 && verdictColumn < 0 ? Palette.MID : Palette.INK;
                PDType1Font f = header ? bold : regular;
                if (verdict != null && c == verdictColumn) {
                    fillRect(x + 2, y - line - 2.5f, bold.getStringWidth(show(cells.get(c))) / 1000 * size + 8, line,
                            Palette.of(verdict));
                    color = Color.WHITE;
                    f = bold;
                }
                float ty = y - 2;
                for (String s : wrapped.get(c)) {
                    ty -= line;
                    text(s, f, size, color, x + 4, ty + size * 0.28f);
                }
                x += w[c];
            }
            y -= h;
            strokeLine(MARGIN, y, MARGIN + sum(w), y, Palette.GRID);
        }

        private float[] columnWidths(Block.Table t, int cols, float size) throws IOException {
            float[] w = new float[cols];
            if (t.header().isEmpty()) {
                w[0] = width * 0.4f;
                for (int c = 1; c < cols; c++) {
                    w[c] = (width - w[0]) / (cols - 1);
                }
                return w;
            }
            // each column gets at least its header and its longest word (up to a cap), the rest of
            // the width goes to the columns in proportion to how much more their text wants
            float[] least = new float[cols];
            for (int c = 0; c < cols; c++) {
                least[c] = bold.getStringWidth(show(t.header().get(c))) / 1000 * size + 10;
                w[c] = least[c];
            }
            for (List<String> r : t.rows()) {
                for (int c = 0; c < cols && c < r.size(); c++) {
                    String cell = show(r.get(c));
                    w[c] = Math.max(w[c], Math.min(240, regular.getStringWidth(cell) / 1000 * size + 10));
                    for (String word : cell.split(" ")) {
                        least[c] = Math.max(least[c], Math.min(MAX_WORD_PT,
                                regular.getStringWidth(word) / 1000 * size + 10));
                    }
                }
            }
            float wanted = sum(w);
            if (wanted <= width) {
                float extra = (width - wanted) / cols;
                for (int c = 0; c < cols; c++) {
                    w[c] += extra;
                }
                return w;
            }
            float floor = sum(least);
            float spare = Math.max(0, width - floor);
            float more = 0;
            for (int c = 0; c < cols; c++) {
                more += Math.max(0, w[c] - least[c]);
            }
            for (int c = 0; c < cols; c++) {
                float share = more > 0 ? Math.max(0, w[c] - least[c]) / more : 1f / cols;
                w[c] = floor <= width ? least[c] + spare * share : least[c] * width / floor;
            }
            return w;
        }

        /** Drawn size {width, height} of a picture, pt: at most the text width, 0.75 pt per pixel. */
        private float[] pictureSize(Block.Picture p) {
            float scale = Math.min(width / p.image().getWidth(), 0.75f);
            float w = p.image().getWidth() * scale;
            float h = p.image().getHeight() * scale;
            float maxH = PDRectangle.A4.getHeight() - 2 * MARGIN - 60;
            if (h > maxH) {
                w *= maxH / h;
                h = maxH;
            }
            return new float[] {w, h};
        }

        /** Height a picture takes with its caption, pt. */
        float pictureHeight(Block.Picture p) throws IOException {
            return pictureSize(p)[1] + wrap(p.caption(), regular, 8, width).size() * 8 * LEADING + 8;
        }

        void picture(Block.Picture p) throws IOException {
            PDImageXObject img = LosslessFactory.createFromImage(doc, p.image());
            float[] size = pictureSize(p);
            float w = size[0];
            float h = size[1];
            List<String> caption = wrap(p.caption(), regular, 8, width);
            room(pictureHeight(p));
            y -= h + 2;
            cs.drawImage(img, MARGIN, y, w, h);
            for (String s : caption) {
                y -= 8 * LEADING;
                text(s, regular, 8, Palette.MID, MARGIN, y + 2);
            }
            y -= 6;
        }

        void finding(Finding f) throws IOException {
            float size = BODY;
            float line = size * LEADING;
            float inset = 10;
            String head = ReviewDocument.severity(f).toUpperCase(java.util.Locale.ROOT) + "  " + f.code()
                    + f.opAmp().map(o -> "  \u00B7  " + o).orElse("");
            List<String> msg = wrap(f.message(), regular, size, width - inset);
            List<String> sug = f.suggestion().isBlank() ? List.of()
                    : wrap("Suggestion: " + f.suggestion(), regular, size, width - inset);
            List<String> parts = f.parts().isEmpty() ? List.of()
                    : wrap("parts: " + String.join(", ", f.parts()), regular, 8, width - inset);
            float h = line * (1 + msg.size() + sug.size()) + parts.size() * 8 * LEADING + 6;
            room(Math.min(h, 300));
            float top = y;
            y -= line;
            text(head, bold, size, Palette.of(f.severity()), MARGIN + inset, y + size * 0.25f);
            for (String s : msg) {
                y -= line;
                text(s, regular, size, Palette.INK, MARGIN + inset, y + size * 0.25f);
            }
            for (String s : sug) {
                y -= line;
                text(s, regular, size, Palette.REST, MARGIN + inset, y + size * 0.25f);
            }
            for (String s : parts) {
                y -= 8 * LEADING;
                text(s, regular, 8, Palette.MID, MARGIN + inset, y + 2);
            }
            y -= 4;
            if (top > y) {
                fillRect(MARGIN, y, 3.5f, top - y, Palette.of(f.severity()));
            }
            y -= 6;
        }

        void footers(Review review) throws IOException {
            int n = doc.getNumberOfPages();
            for (int i = 0; i < n; i++) {
                try (PDPageContentStream f = new PDPageContentStream(doc, doc.getPage(i),
                        PDPageContentStream.AppendMode.APPEND, true, true)) {
                    String s = "halfrail " + review.toolVersion() + " \u00B7 " + ReviewDocument.WHEN.format(
                            review.generated()) + " \u00B7 page " + (i + 1) + " of " + n;
                    f.beginText();
                    f.setFont(regular, 7.5f);
                    f.setNonStrokingColor(Palette.FAINT);
                    f.newLineAtOffset(MARGIN, MARGIN - 20);
                    f.showText(show(s));
                    f.endText();
                }
            }
        }

        private void text(String s, PDType1Font f, float size, Color c, float x, float baseline) throws IOException {
            cs.beginText();
            cs.setFont(f, size);
            cs.setNonStrokingColor(c);
            cs.newLineAtOffset(x, baseline);
            cs.showText(show(s));
            cs.endText();
        }

        private void fillRect(float x, float yy, float w, float h, Color c) throws IOException {
            cs.setNonStrokingColor(c);
            cs.addRect(x, yy, w, h);
            cs.fill();
        }

        private void strokeLine(float x0, float y0, float x1, float y1, Color c) throws IOException {
            cs.setStrokingColor(c);
            cs.setLineWidth(0.6f);
            cs.moveTo(x0, y0);
            cs.lineTo(x1, y1);
            cs.stroke();
        }

        /** Words of {@code s} in lines no wider than {@code max} pt; a word longer than a line is cut. */
        List<String> wrap(String s, PDType1Font f, float size, float max) throws IOException {
            List<String> out = new ArrayList<>();
            for (String para : show(s).split("\n")) {
                StringBuilder line = new StringBuilder();
                for (String word : para.split(" +")) {
                    String candidate = line.length() == 0 ? word : line + " " + word;
                    if (f.getStringWidth(candidate) / 1000 * size <= max) {
                        line.setLength(0);
                        line.append(candidate);
                        continue;
                    }
                    if (line.length() > 0) {
                        out.add(line.toString());
                        line.setLength(0);
                    }
                    String w = word;
                    while (f.getStringWidth(w) / 1000 * size > max && w.length() > 1) {
                        int k = w.length() - 1;
                        while (k > 1 && f.getStringWidth(w.substring(0, k)) / 1000 * size > max) {
                            k--;
                        }
                        out.add(w.substring(0, k));
                        w = w.substring(k);
                    }
                    line.append(w);
                }
                out.add(line.toString());
            }
            return out;
        }

        private String show(String s) {
            return printable(s);
        }
    }

    private static final PDType1Font ENCODING_FONT = new PDType1Font(Standard14Fonts.FontName.HELVETICA);
    private static final Map<String, Boolean> SHOWS = new java.util.concurrent.ConcurrentHashMap<>();

    /**
     * {@code s} as the PDF writes it: every character the standard fonts cannot show is written
     * out ({@link #ALTERNATIVES}) or, failing that, replaced by "?".
     */
    public static String printable(String s) {
        StringBuilder b = new StringBuilder(s.length());
        s.codePoints().forEach(cp -> {
            String ch = new String(Character.toChars(cp));
            String alt = ALTERNATIVES.get(cp);
            if (alt != null) {
                b.append(alt);
            } else if (SHOWS.computeIfAbsent(ch, PdfReport::encodable)) {
                b.append(ch);
            } else {
                b.append('?');
            }
        });
        return b.toString();
    }

    private static boolean encodable(String ch) {
        try {
            ENCODING_FONT.encode(ch);
            return true;
        } catch (IllegalArgumentException | IOException e) {
            return false;
        }
    }

    /** Written-out forms of characters outside the standard fonts' encoding. */
    static final Map<Integer, String> ALTERNATIVES = Map.ofEntries(
            Map.entry(0x03A9, "ohm"), Map.entry(0x2126, "ohm"), Map.entry(0x2212, "-"), Map.entry(0x2264, "<="),
            Map.entry(0x2265, ">="), Map.entry(0x2192, "->"), Map.entry(0x25B6, ">"), Map.entry(0x221E, "inf"),
            Map.entry(0x221A, "sqrt"), Map.entry(0x2225, "||"), Map.entry(0x2016, "||"), Map.entry(0x2248, "~"), Map.entry(0x0394, "delta "),
            Map.entry(0x03C0, "pi"), Map.entry(0x2009, " "), Map.entry(0x202F, " "), Map.entry(0x00A0, " "),
            Map.entry(0x2032, "'"));

    private static float sum(float[] w) {
        float s = 0;
        for (float v : w) {
            s += v;
        }
        return s;
    }

    private static Color tint(Color c) {
        return new Color((c.getRed() + 4 * 255) / 5, (c.getGreen() + 4 * 255) / 5, (c.getBlue() + 4 * 255) / 5);
    }
}
