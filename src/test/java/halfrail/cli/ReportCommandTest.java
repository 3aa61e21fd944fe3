package halfrail.cli;

import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import static halfrail.cli.CheckCommandTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code report} through picocli, headless. Expected verdicts are the ones samples/README.md
 * states for each sample (checked there by SamplesReadmeTest).
 */
class ReportCommandTest {
    static final String USB = "samples/usb-line-driver.json";
    static final String BOOST = "samples/instrument-boost-9v.json";

    @Test
    void aPassingDesignWritesBothDocumentsAndExitsZero(@TempDir Path dir) throws IOException {
        CheckCommandTest.Run r = run("report", USB, "-o", dir.resolve("usb").toString());
        assertEquals(ExitCodes.PASS, r.code(), r.err());
        Path html = dir.resolve("usb.html");
        Path pdf = dir.resolve("usb.pdf");
        assertTrue(Files.size(html) > 10_000 && Files.size(pdf) > 10_000);
        assertTrue(r.out().contains("usb.html") && r.out().contains("usb.pdf"), r.out());
        String text = Files.readString(html);
        assertTrue(text.contains("Line driver on a USB port") && text.contains("halfrail " + HalfrailCommand.VERSION));
        try (PDDocument doc = Loader.loadPDF(Files.readAllBytes(pdf))) {
            PDFTextStripper strip = new PDFTextStripper();
            strip.setEndPage(1);
            String first = strip.getText(doc);
            assertTrue(first.contains("Line driver on a USB port"), "one design: it starts on the first page");
            assertFalse(first.contains("Summary"), "no summary for one design");
        }
    }

    @Test
    void aFailingDesignExitsOneAndAnEndingOnOutIsDropped(@TempDir Path dir) {
        CheckCommandTest.Run r = run("report", BOOST, "-o", dir.resolve("boost.pdf").toString());
        assertEquals(ExitCodes.FINDING, r.code(), "the boost clips at the end point (samples/README.md)");
        assertTrue(Files.exists(dir.resolve("boost.html")) && Files.exists(dir.resolve("boost.pdf")));
        assertFalse(Files.exists(dir.resolve("boost.pdf.html")));
    }

    @Test
    void aNetlistGetsTheCircuitLevelReviewAndTheExitCodeCheckGives(@TempDir Path dir) throws IOException {
        for (String file : new String[] {"samples/nine-volt-boost.cir", "samples/faulty-review.cir"}) {
            CheckCommandTest.Run r = run("report", file, "-o", dir.resolve("net").toString());
            assertEquals(run("check", file).code(), r.code(), file + ": " + r.err());
            assertTrue(Files.readString(dir.resolve("net.html")).contains("DC operating point"), file);
        }
    }

    @Test
    void anUnreadableNetlistIsBadInputAndNothingIsWritten(@TempDir Path dir) throws IOException {
        Path bad = Files.writeString(dir.resolve("bad.cir"), "* title\nR1 a\n.end\n");
        CheckCommandTest.Run r = run("report", bad.toString(), "-o", dir.resolve("x").toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertTrue(r.err().contains("bad.cir"), r.err());
        assertFalse(Files.exists(dir.resolve("x.html")), "nothing to report, nothing written");
    }

    @Test
    void withoutAnOutputTheCommandRefusesWithOneLine() {
        CheckCommandTest.Run r = run("report", USB);
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertTrue(r.err().contains("--output") || r.err().contains("-o"), r.err());
        assertFalse(r.err().contains("\tat "), "no stack trace");
    }

    @Test
    void aBrokenFileBesideAGoodOneIsBadInputButTheGoodOneIsReported(@TempDir Path dir) throws IOException {
        Path folder = Files.createDirectory(dir.resolve("designs"));
        Files.copy(Path.of(USB), folder.resolve("usb-line-driver.json"));
        Files.writeString(folder.resolve("broken.json"), "{ \"format\": \"halfrail-design\", ");
        Files.writeString(folder.resolve("notes.txt"), "not a design");
        CheckCommandTest.Run r = run("report", folder.toString(), "-o", dir.resolve("review").toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertTrue(r.err().contains("broken.json"), r.err());
        assertFalse(r.err().contains("notes.txt"), "other files in a folder are left alone");
        String html = Files.readString(dir.resolve("review.html"));
        assertTrue(html.contains("Line driver on a USB port"));
    }

    @Test
    void aMissingFileIsBadInput(@TempDir Path dir) {
        CheckCommandTest.Run r = run("report", dir.resolve("nowhere.json").toString(), "-o",
                dir.resolve("x").toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertTrue(r.err().contains("nowhere.json"), r.err());
    }
}
