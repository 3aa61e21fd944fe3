package halfrail.ui;

import halfrail.check.Histogram;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.geometry.VPos;
import javafx.scene.canvas.Canvas;
import javafx.scene.canvas.GraphicsContext;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.Region;
import javafx.scene.text.Font;
import javafx.scene.text.FontWeight;
import javafx.scene.text.TextAlignment;

import java.util.Locale;
import java.util.OptionalDouble;

/**
 * Paints one histogram as laid out by {@link HistogramGeometry}: bars, a value axis with its
 * unit, the fullest bin's count, and a dashed marker line (a limit or the nominal value).
 * Pointing at a bar tells its range and count.
 */
public final class HistogramCanvas extends Region {
    /** Preferred width, px. */
    public static final double PREF_WIDTH = 330;
    /** Preferred height, px. */
    public static final double PREF_HEIGHT = 150;

    /** What to draw. @param markerLabel words beside the marker line */
    public record Content(String title, String unit, Histogram histogram, OptionalDouble marker, String markerLabel) {}

    private final Canvas canvas = new Canvas();
    private final ObjectProperty<Content> content = new SimpleObjectProperty<>(this, "content");
    private final ObjectProperty<Palette> palette = new SimpleObjectProperty<>(this, "palette", Palette.LIGHT);
    private final Tooltip tip = new Tooltip();
    private HistogramGeometry geometry;

    public HistogramCanvas() {
        getChildren().add(canvas);
        getStyleClass().add("histogram");
        setPrefSize(PREF_WIDTH, PREF_HEIGHT);
        setMinSize(200, 110);
        content.addListener((o, was, now) -> repaint());
        palette.addListener((o, was, now) -> repaint());
        Tooltip.install(this, tip);
        setOnMouseMoved(e -> describe(e.getX(), e.getY()));
    }

    public ObjectProperty<Content> contentProperty() {
        return content;
    }

    public ObjectProperty<Palette> paletteProperty() {
        return palette;
    }

    /** The geometry last painted; null before the first layout or without content. */
    public HistogramGeometry geometry() {
        return geometry;
    }

    @Override
    protected void layoutChildren() {
        canvas.setWidth(getWidth());
        canvas.setHeight(getHeight());
        repaint();
    }

    private void describe(double x, double y) {
        Content c = content.get();
        if (geometry == null || c == null) {
            return;
        }
        java.util.OptionalInt bin = geometry.binAt(x, y);
        tip.setText((bin.isPresent() ? geometry.bar(bin.getAsInt()) : java.util.Optional.<HistogramGeometry.Bar>empty()).map(b -> String.format(Locale.ROOT,
                "%s from %.4g to %.4g %s: %d build%s", c.title(), b.fromValue(), b.toValue(), c.unit(), b.count(),
                b.count() == 1 ? "" : "s")).orElse(c.title() + ": point at a bar to read it"));
    }

    private void repaint() {
        GraphicsContext g = canvas.getGraphicsContext2D();
        Palette p = palette.get();
        double w = getWidth();
        double h = getHeight();
        g.setFill(p.paper());
        g.fillRect(0, 0, w, h);
        Content c = content.get();
        if (c == null || w < 10 || h < 10) {
            geometry = null;
            return;
        }
        geometry = new HistogramGeometry(c.histogram(), w, h, c.marker());
        Font titleFont = Font.font("System", FontWeight.BOLD, 10.5);
        g.setFont(titleFont);
        g.setFill(p.ink());
        g.setTextAlign(TextAlignment.LEFT);
        g.setTextBaseline(VPos.TOP);
        g.fillText(fitted(c.title(), titleFont, w - HistogramGeometry.LEFT - 4), HistogramGeometry.LEFT, 3);
        g.setFont(Font.font("System", 10));
        g.setFill(p.signal());
        for (HistogramGeometry.Bar b : geometry.bars()) {
            if (b.count() > 0) {
                g.fillRect(b.x() + 0.5, b.y(), Math.max(1, b.width() - 1), b.height());
            }
        }
        g.setStroke(p.faint());
        g.setLineWidth(1);
        g.strokeLine(geometry.plotLeft(), geometry.baseY() + 0.5, geometry.plotRight(), geometry.baseY() + 0.5);
        g.strokeLine(geometry.plotLeft() - 0.5, geometry.topY(), geometry.plotLeft() - 0.5, geometry.baseY());
        g.setFill(p.faint());
        g.setTextAlign(TextAlignment.CENTER);
        for (HistogramGeometry.Tick t : geometry.ticks()) {
            g.strokeLine(t.x(), geometry.baseY(), t.x(), geometry.baseY() + 4);
            g.fillText(t.label(), t.x(), geometry.baseY() + 5);
        }
        g.setTextAlign(TextAlignment.RIGHT);
        g.fillText(c.unit(), geometry.plotRight(), geometry.baseY() + 18);
        g.fillText(Long.toString(geometry.maxCount()), geometry.plotLeft() - 4, geometry.topY() - 2);
        g.fillText("0", geometry.plotLeft() - 4, geometry.baseY() - 10);
        g.save();
        g.translate(10, (geometry.topY() + geometry.baseY()) / 2);
        g.rotate(-90);
        g.setTextAlign(TextAlignment.CENTER);
        g.fillText("builds", 0, -6);
        g.restore();
        geometry.markerX().ifPresent(x -> {
            g.setStroke(p.clip());
            g.setLineDashes(5, 4);
            g.setLineWidth(1.5);
            g.strokeLine(x, geometry.topY(), x, geometry.baseY());
            g.setLineDashes();
            g.setFill(p.clip());
            boolean right = x < (geometry.plotLeft() + geometry.plotRight()) / 2;
            g.setTextAlign(right ? TextAlignment.LEFT : TextAlignment.RIGHT);
            g.fillText(c.markerLabel(), right ? x + 3 : x - 3, geometry.topY());
        });
    }

    /**
     * {@code text} as it fits in {@code widthPx}: whole, else without its last clauses (after ", "
     * or " — "; the tooltip keeps the whole title), else cut with an ellipsis.
     */
    static String fitted(String text, Font font, double widthPx) {
        String t = text;
        while (width(t, font) > widthPx) {
            int cut = Math.max(t.lastIndexOf(", "), t.lastIndexOf(" — "));
            if (cut <= 0) {
                while (t.length() > 1 && width(t + "…", font) > widthPx) {
                    t = t.substring(0, t.length() - 1);
                }
                return t + "…";
            }
            t = t.substring(0, cut);
        }
        return t;
    }

    private static double width(String s, Font font) {
        javafx.scene.text.Text probe = new javafx.scene.text.Text(s);
        probe.setFont(font);
        return probe.getLayoutBounds().getWidth();
    }

}
