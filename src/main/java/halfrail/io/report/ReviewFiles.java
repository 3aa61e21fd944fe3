package halfrail.io.report;

import halfrail.io.AtomicWrite;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

/**
 * Writes a review's two documents beside each other: {@code OUT.html} and {@code OUT.pdf}. The
 * one call the command line and the app make.
 */
public final class ReviewFiles {
    /** File name endings of the two documents. */
    public static final String HTML_ENDING = ".html";
    public static final String PDF_ENDING = ".pdf";

    private ReviewFiles() {}

    /**
     * The two files written.
     *
     * @param html the HTML document
     * @param pdf  the PDF document
     */
    public record Written(Path html, Path pdf) {}

    /**
     * The document paths for {@code out}: {@code out} with ".html" and ".pdf" appended, after
     * dropping either ending if {@code out} already carries one.
     */
    public static Written paths(Path out) {
        String name = out.getFileName().toString();
        String lower = name.toLowerCase(Locale.ROOT);
        String base = lower.endsWith(HTML_ENDING) ? name.substring(0, name.length() - HTML_ENDING.length())
                : lower.endsWith(PDF_ENDING) ? name.substring(0, name.length() - PDF_ENDING.length()) : name;
        return new Written(out.resolveSibling(base + HTML_ENDING), out.resolveSibling(base + PDF_ENDING));
    }

    /**
     * Render {@code review} and write both documents, creating the folder if need be; each is
     * replaced whole by {@link AtomicWrite} (written to a temporary file beside it, forced to the
     * disk, then moved over it; no backup).
     *
     * @throws UncheckedIOException when a file cannot be written
     */
    public static Written write(Review review, Path out) {
        Written w = paths(out);
        byte[] html = HtmlReport.render(review).getBytes(StandardCharsets.UTF_8);
        byte[] pdf = PdfReport.render(review);
        replace(w.html(), html);
        replace(w.pdf(), pdf);
        return w;
    }

    private static void replace(Path target, byte[] bytes) {
        try {
            Files.createDirectories(target.toAbsolutePath().getParent());
            AtomicWrite.replace(target, bytes, null, AtomicWrite.WHOLE);
        } catch (IOException e) {
            throw new UncheckedIOException(target + ": cannot write (" + e.getClass().getSimpleName() + ")", e);
        }
    }
}
