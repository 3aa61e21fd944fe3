package halfrail.io.report;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.time.Instant;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Writing a review's two documents: whole files, beside each other, no temporary file or backup left. */
class ReviewFilesTest {
    private static Review review;

    @TempDir
    Path folder;

    @BeforeAll
    static void review() {
        String name = "instrument-boost-9v.json";
        review = new Review(List.of(new ReviewEntry(name, SampleReports.report(name))),
                "9.9.9-test", Instant.parse("2026-03-01T10:15:00Z"));
    }

    private static List<String> names(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    @Test
    void bothDocumentsAreWrittenIntoAFolderMadeForThem() throws IOException {
        Path out = folder.resolve("new").resolve("review.pdf");
        ReviewFiles.Written w = ReviewFiles.write(review, out);
        assertEquals(folder.resolve("new").resolve("review.html"), w.html());
        assertEquals(folder.resolve("new").resolve("review.pdf"), w.pdf());
        assertEquals(List.of("review.html", "review.pdf"), names(folder.resolve("new")));
        assertArrayEquals(HtmlReport.render(review).getBytes(StandardCharsets.UTF_8), Files.readAllBytes(w.html()));
        // PDF 1.7 (ISO 32000-1 §7.5.2): a file begins with its header "%PDF-".
        assertTrue(new String(Files.readAllBytes(w.pdf()), 0, 5, StandardCharsets.US_ASCII).equals("%PDF-"));
    }

    @Test
    void writingAgainReplacesBothWholeAndKeepsNoBackup() throws IOException {
        Path html = Files.writeString(folder.resolve("review.html"), "an older and much longer document ".repeat(1000));
        ReviewFiles.write(review, folder.resolve("review"));
        assertArrayEquals(HtmlReport.render(review).getBytes(StandardCharsets.UTF_8), Files.readAllBytes(html));
        assertEquals(List.of("review.html", "review.pdf"), names(folder));
    }

    @Test
    void aNewDocumentCanBeReadByOthers() throws IOException {
        org.junit.jupiter.api.Assumptions.assumeTrue(
                FileSystems.getDefault().supportedFileAttributeViews().contains("posix"));
        ReviewFiles.Written w = ReviewFiles.write(review, folder.resolve("review"));
        // A temporary file starts private to its owner; a report is for passing on (common practice: rw-r--r--).
        assertEquals("rw-r--r--", PosixFilePermissions.toString(Files.getPosixFilePermissions(w.html())));
        assertEquals("rw-r--r--", PosixFilePermissions.toString(Files.getPosixFilePermissions(w.pdf())));
    }

    @Test
    void aFolderThatIsAFileIsReportedWithThePath() throws IOException {
        Path blocker = Files.writeString(folder.resolve("plain.txt"), "x");
        UncheckedIOException e = assertThrows(UncheckedIOException.class,
                () -> ReviewFiles.write(review, blocker.resolve("review")));
        assertTrue(e.getMessage().startsWith(blocker.resolve("review.html").toString()), e.getMessage());
        assertEquals(List.of("plain.txt"), names(folder));
    }
}
