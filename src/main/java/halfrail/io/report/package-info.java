/**
 * Review documents: one self-contained HTML file and one PDF for one or many analysed designs,
 * with the voltage ladders, the power-on transient and the frequency response drawn by Java2D
 * without a display.
 *
 * <p>The front: build a {@link halfrail.io.report.Review} from
 * {@link halfrail.io.report.ReviewEntry ReviewEntry(source, DesignReport)} values, then
 * {@link halfrail.io.report.ReviewFiles#write ReviewFiles.write(review, out)} writes
 * {@code out.html} and {@code out.pdf}; {@link halfrail.io.report.HtmlReport#render} and
 * {@link halfrail.io.report.PdfReport#render} give the documents in memory. The pictures alone
 * come from {@link halfrail.io.report.ReportPictures} as {@code BufferedImage}s; their placement
 * lives in plain geometry classes ({@link halfrail.io.report.LadderGeometry},
 * {@link halfrail.io.report.Axis}, {@link halfrail.io.report.LabelStack}) that a custom-drawn
 * view can reuse. Nothing here uses JavaFX or prints.
 */
package halfrail.io.report;
