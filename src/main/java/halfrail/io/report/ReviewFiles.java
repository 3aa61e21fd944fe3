package halfrail.io.report;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.charset.StandardCharsets;
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
     * Render {@code review} and write both documents (each replaced whole: written to a temporary
     * file beside it, then moved over it).
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
        Path dir = target.toAbsolutePath().getParent();
        Path tmp = null;
        try {
            Files.createDirectories(dir);
            tmp = Files.createTempFile(dir, "." + target.getFileName(), ".tmp");
            Files.write(tmp, bytes);
            if (Files.getFileStore(tmp).supportsFileAttributeView(java.nio.file.attribute.PosixFileAttributeView.class)) {
                // A temporary file is private to its owner; a report is for passing on.
                Files.setPosixFilePermissions(tmp, java.nio.file.attribute.PosixFilePermissions.fromString("rw-r--r--"));
            }
            try {
                Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } catch (java.nio.file.AtomicMoveNotSupportedException e) {
                Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
            }
        } catch (IOException e) {
            if (tmp != null) {
                try {
                    Files.deleteIfExists(tmp);
                } catch (IOException ignored) {
                    // the write already failed; that failure is reported
                }
            }
            throw new UncheckedIOException(target + ": cannot write (" + e.getClass().getSimpleName() + ")", e);
        }
    }
}
