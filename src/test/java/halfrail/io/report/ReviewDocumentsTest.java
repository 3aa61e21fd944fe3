package halfrail.io.report;

import halfrail.check.DesignReport;
import halfrail.check.Finding;
import halfrail.check.StageReport;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.rendering.PDFRenderer;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

import javax.imageio.ImageIO;
import javax.xml.XMLConstants;
import javax.xml.parsers.DocumentBuilder;
import javax.xml.parsers.DocumentBuilderFactory;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Base64;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The review of every sample design, as HTML and as PDF. Well-formedness is checked by parsing
 * the HTML as XML (XHTML is XML: W3C XHTML 1.0 §3.1.1, "common practice" for a strict parse);
 * the PDF is read back with PDFBox's own loader and text extraction.
 */
class ReviewDocumentsTest {
    static final Instant WHEN = Instant.parse("2026-03-01T10:15:00Z");
    static final String VERSION = "9.9.9-test";
    private static Review review;
    private static String html;
    private static byte[] pdf;

    @BeforeAll
    static void render() throws Exception {
        review = new Review(SampleReports.entries(), SampleReports.netlists(), VERSION, WHEN);
        html = HtmlReport.render(review);
        pdf = PdfReport.render(review);
        Files.writeString(SampleReports.outputDir().resolve("samples-review.html"), html, StandardCharsets.UTF_8);
        Files.write(SampleReports.outputDir().resolve("samples-review.pdf"), pdf);
    }

    private static Document parse(String xml) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setNamespaceAware(true);
        f.setFeature(XMLConstants.FEATURE_SECURE_PROCESSING, true);
        f.setFeature("http://apache.org/xml/features/nonvalidating/load-external-dtd", false);
        DocumentBuilder b = f.newDocumentBuilder();
        b.setErrorHandler(null);
        return b.parse(new ByteArrayInputStream(xml.getBytes(StandardCharsets.UTF_8)));
    }

    private static List<Element> elements(Element root, String tag) {
        NodeList n = root.getElementsByTagNameNS("http://www.w3.org/1999/xhtml", tag);
        List<Element> out = new ArrayList<>();
        for (int i = 0; i < n.getLength(); i++) {
            out.add((Element) n.item(i));
        }
        return out;
    }

    private static Element byId(Document d, String tag, String id) {
        return elements(d.getDocumentElement(), tag).stream().filter(e -> e.getAttribute("id").equals(id)).findFirst()
                .orElseThrow(() -> new AssertionError("no <" + tag + " id=" + id + ">"));
    }

    private static String squash(String s) {
        return s.replaceAll("\\s+", " ").strip();
    }

    @Test
    void theHtmlIsWellFormedXhtmlWithEverythingEmbedded() throws Exception {
        Document d = parse(html);
        assertEquals("html", d.getDocumentElement().getLocalName());
        assertEquals("http://www.w3.org/1999/xhtml", d.getDocumentElement().getNamespaceURI());
        List<Element> imgs = elements(d.getDocumentElement(), "img");
        assertFalse(imgs.isEmpty());
        for (Element img : imgs) {
            String src = img.getAttribute("src");
            assertTrue(src.startsWith("data:image/png;base64,"), "embedded, not fetched: " + src.substring(0, 30));
            BufferedImage back = ImageIO.read(new ByteArrayInputStream(Base64.getDecoder().decode(
                    src.substring("data:image/png;base64,".length()))));
            assertNotNull(back, "the data URI holds a PNG");
        }
        String outside = html.replace("http://www.w3.org/1999/xhtml", "");
        assertFalse(outside.contains("http://") || outside.contains("https://"), "nothing refers outside the file");
        assertFalse(html.contains("<script"), "no scripts");
        assertTrue(html.contains(VERSION) && html.contains("2026-03-01 10:15 UTC"), "tool version and date");
    }

    @Test
    void everyStageOfEverySampleHasItsTableInItsDesignsSection() throws Exception {
        Document d = parse(html);
        for (int i = 0; i < review.entries().size(); i++) {
            DesignReport r = review.entries().get(i).report();
            Element section = byId(d, "section", ReviewDocument.designId(i));
            assertTrue(squash(section.getTextContent()).contains(r.design().name()));
            List<String> tables = elements(section, "table").stream()
                    .map(t -> t.getAttribute(HtmlReport.STAGE_ATTRIBUTE)).filter(s -> !s.isEmpty()).toList();
            assertEquals(r.stages().stream().map(StageReport::label).toList(), tables, r.design().name());
            for (StageReport s : r.stages()) {
                Element t = elements(section, "table").stream()
                        .filter(e -> e.getAttribute(HtmlReport.STAGE_ATTRIBUTE).equals(s.label())).findFirst().get();
                String text = squash(t.getTextContent());
                assertTrue(text.contains("quiescent point") && text.contains(Fmt.volts(s.outputVolts())),
                        s.label() + " quiescent point: " + text);
                assertTrue(text.contains(Fmt.volts(s.nominal().swingLowVolts()) + " \u2013 "
                        + Fmt.volts(s.nominal().swingHighVolts())), "swing window of " + s.label());
                if (s.signal()) {
                    assertTrue(text.contains("headroom, fresh supply") && text.contains("headroom, end-point supply")
                            && text.contains("lower corner"), s.label());
                }
                assertTrue(text.contains("settle-up time") && text.contains("leakage drift")
                        && text.contains("battery current") && text.contains("runtime"), s.label());
            }
            boolean hasLadder = !r.ladders().isEmpty();
            assertEquals(hasLadder, elements(section, "figure").stream()
                    .anyMatch(f -> f.getAttribute("id").endsWith("-ladder-picture")), "ladder picture");
            assertTrue(squash(section.getTextContent()).contains(r.design().supply().safetyNote()),
                    "the supply's safety note");
        }
    }

    @Test
    void everyFindingOfEverySampleIsListedWithItsSuggestion() throws Exception {
        Document d = parse(html);
        int total = 0;
        for (int i = 0; i < review.entries().size(); i++) {
            DesignReport r = review.entries().get(i).report();
            Element section = byId(d, "section", ReviewDocument.designId(i));
            List<Element> items = elements(section, "li").stream()
                    .filter(e -> !e.getAttribute(HtmlReport.CODE_ATTRIBUTE).isEmpty()).toList();
            assertEquals(r.findings().size(), items.size(), r.design().name());
            for (int k = 0; k < items.size(); k++) {
                Finding f = r.findings().get(k);
                String text = squash(items.get(k).getTextContent());
                assertEquals(f.code(), items.get(k).getAttribute(HtmlReport.CODE_ATTRIBUTE));
                assertTrue(text.contains(squash(f.message())), f.code());
                assertTrue(text.contains(squash(f.suggestion())), f.code() + " suggestion");
            }
            total += items.size();
        }
        assertTrue(total > 0, "the samples have findings");
    }

    @Test
    void theSummaryHasOneRowPerDesignAndStageWorstFirst() throws Exception {
        Document d = parse(html);
        Element table = byId(d, "table", "summary-table");
        List<Element> rows = elements(elements(table, "tbody").get(0), "tr");
        int expected = 0;
        for (ReviewEntry e : review.entries()) {
            expected += e.report().stages().size();
            boolean whole = e.report().findings().stream().anyMatch(f -> f.opAmp().isEmpty())
                    || e.report().stages().isEmpty();
            expected += whole ? 1 : 0;
        }
        for (NetlistEntry n : review.netlists()) {
            expected += n.report().opAmps().size();
            boolean whole = n.report().findings().stream().anyMatch(f -> f.opAmp().isEmpty())
                    || n.report().opAmps().isEmpty();
            expected += whole ? 1 : 0;
        }
        assertEquals(expected, rows.size());
        int previous = -1;
        for (Element row : rows) {
            Element link = elements(elements(row, "td").get(0), "a").get(0);
            String target = link.getAttribute("href").substring(1);
            Element section = byId(d, "section", target);
            assertTrue(squash(section.getTextContent()).contains(squash(link.getTextContent())),
                    "the design name leads to its section");
            String word = squash(elements(row, "td").get(3).getTextContent());
            int rank = Verdict.valueOf(word.toUpperCase(java.util.Locale.ROOT)).ordinal();
            assertTrue(rank >= previous, "worst first");
            previous = rank;
        }
        assertEquals("fail", squash(elements(rows.get(0), "td").get(3).getTextContent()),
                "the samples include a failing design (samples/README.md)");
    }

    @Test
    void everyNetlistHasItsOperatingPointItsOpAmpsAndItsFindings() throws Exception {
        Document d = parse(html);
        assertFalse(review.netlists().isEmpty(), "the samples hold netlists");
        for (int k = 0; k < review.netlists().size(); k++) {
            NetlistEntry n = review.netlists().get(k);
            Element section = byId(d, "section", ReviewDocument.designId(review.entries().size() + k));
            String text = squash(section.getTextContent());
            assertTrue(text.contains(n.name()) && text.contains("DC operating point"), n.source());
            for (halfrail.solve.OpAmpState o : n.report().opAmps()) {
                assertTrue(text.contains("Op-amp " + o.name()) && text.contains(Fmt.volts(o.outputVolts())), o.name());
            }
            List<Element> items = elements(section, "li").stream()
                    .filter(e -> !e.getAttribute(HtmlReport.CODE_ATTRIBUTE).isEmpty()).toList();
            assertEquals(n.report().findings().size(), items.size(), n.source());
            for (int i = 0; i < items.size(); i++) {
                assertTrue(squash(items.get(i).getTextContent()).contains(squash(n.report().findings().get(i).message())));
            }
        }
    }

    @Test
    void thePdfOpensWithTheSummaryFirstAndEachDesignOnItsOwnPages() throws Exception {
        try (PDDocument doc = Loader.loadPDF(pdf)) {
            int designs = review.entries().size();
            assertTrue(doc.getNumberOfPages() >= review.size() + 1, "a summary page and at least a page per file");
            PDFTextStripper strip = new PDFTextStripper();
            strip.setStartPage(1);
            strip.setEndPage(1);
            String first = squash(strip.getText(doc));
            assertTrue(first.contains("Summary") && first.contains(ReviewDocument.TITLE), first);
            int previous = 1;
            for (int i = 0; i < designs; i++) {
                String name = squash(PdfReport.printable(review.entries().get(i).report().design().name()));
                int start = -1;
                for (int p = previous + 1; p <= doc.getNumberOfPages() && start < 0; p++) {
                    strip.setStartPage(p);
                    strip.setEndPage(p);
                    if (squash(strip.getText(doc)).startsWith(name)) {
                        start = p;
                    }
                }
                assertTrue(start > previous, name + " starts a page after the previous design's");
                previous = start;
            }
            for (NetlistEntry n : review.netlists()) {
                String name = squash(PdfReport.printable(n.name()));
                int start = -1;
                for (int p = previous + 1; p <= doc.getNumberOfPages() && start < 0; p++) {
                    strip.setStartPage(p);
                    strip.setEndPage(p);
                    if (squash(strip.getText(doc)).startsWith(name)) {
                        start = p;
                    }
                }
                assertTrue(start > previous, name + " starts a page after the previous file's");
                previous = start;
            }
            assertTrue(first.contains("page 1 of " + doc.getNumberOfPages()), "page footer");
        }
    }

    @Test
    void thePdfTextHoldsEveryStageAndFinding() throws Exception {
        try (PDDocument doc = Loader.loadPDF(pdf)) {
            String text = squash(new PDFTextStripper().getText(doc));
            assertTrue(text.contains(VERSION) && text.contains("2026-03-01 10:15 UTC"));
            for (ReviewEntry e : review.entries()) {
                for (StageReport s : e.report().stages()) {
                    assertTrue(text.contains("Stage " + PdfReport.printable(s.label())), s.label());
                }
                for (Finding f : e.report().findings()) {
                    assertTrue(text.contains(squash(PdfReport.printable(f.message()))), f.code() + ": " + f.message());
                    assertTrue(text.contains(squash(PdfReport.printable(f.suggestion()))), f.code() + " suggestion");
                }
            }
            for (NetlistEntry n : review.netlists()) {
                for (Finding f : n.report().findings()) {
                    assertTrue(text.contains(squash(PdfReport.printable(f.message()))), f.code() + ": " + f.message());
                }
            }
            PDFRenderer renderer = new PDFRenderer(doc);
            for (int p = 0; p < doc.getNumberOfPages(); p++) {
                ImageIO.write(renderer.renderImageWithDPI(p, 60), "png",
                        SampleReports.outputDir().resolve("samples-review-page-" + (p + 1) + ".png").toFile());
            }
        }
    }
}
