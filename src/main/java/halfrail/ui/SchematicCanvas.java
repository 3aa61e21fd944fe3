package halfrail.ui;

import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.geometry.VPos;
import javafx.scene.canvas.Canvas;
import javafx.scene.canvas.GraphicsContext;
import javafx.scene.control.Label;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;
import javafx.scene.paint.Color;
import javafx.scene.shape.StrokeLineCap;
import javafx.scene.text.Font;
import javafx.scene.text.FontWeight;
import javafx.scene.text.TextAlignment;

/**
 * The circuit drawing: paints {@link SchematicGeometry} (scaled to the height it is given, scrolling
 * sideways when the chain is long) and turns a click on a part into a pick of the finding about it.
 */
public final class SchematicCanvas extends VBox {
    /** Smallest and largest scale the drawing is painted at. */
    static final double MIN_SCALE = 0.85, MAX_SCALE = 1.0;

    private final SchematicModel model;
    private final Canvas canvas = new Canvas();
    private final javafx.scene.Group holder = new javafx.scene.Group(canvas);
    private final ScrollPane scroll = new ScrollPane(holder);
    private final ObjectProperty<Palette> palette = new SimpleObjectProperty<>(this, "palette", Palette.LIGHT);
    private double scale = 1;

    public SchematicCanvas(SchematicModel model) {
        this.model = model;
        setId("schematic");
        getStyleClass().add("schematic");
        Label caption = new Label();
        caption.getStyleClass().add("hint");
        caption.textProperty().bind(model.captionProperty());
        caption.setWrapText(true);
        scroll.getStyleClass().add("schematic-scroll");
        scroll.setFitToHeight(false);
        scroll.setPannable(false);
        VBox.setVgrow(scroll, Priority.ALWAYS);
        getChildren().addAll(scroll, caption);
        setSpacing(2);
        Tooltip.install(canvas, new Tooltip("The design's circuit as Halfrail solves it; each node shows its name and its "
                + "DC voltage at rest. Click a part to see the finding about it."));
        model.geometryProperty().addListener((o, was, now) -> resize());
        model.spotlitProperty().addListener((o, was, now) -> repaint());
        palette.addListener((o, was, now) -> repaint());
        scroll.viewportBoundsProperty().addListener((o, was, now) -> resize());
        canvas.setOnMouseClicked(e -> {
            SchematicGeometry g = model.geometryProperty().get();
            if (g != null) {
                g.hit(e.getX() / scale, e.getY() / scale).ifPresent(p -> model.pick(p.designPath()));
            }
        });
    }

    /** The colours to paint with. */
    public ObjectProperty<Palette> paletteProperty() {
        return palette;
    }

    /** The scale the drawing is painted at (drawing px to screen px). */
    public double scale() {
        return scale;
    }

    /** The drawn canvas (for tests and pictures). */
    public Canvas canvas() {
        return canvas;
    }

    private void resize() {
        SchematicGeometry g = model.geometryProperty().get();
        double h = scroll.getViewportBounds().getHeight();
        double fit = h <= 0 ? 1 : (h - 2) / SchematicGeometry.HEIGHT;
        if (g != null && scroll.getViewportBounds().getWidth() > 0) {
            // the whole chain in view when that keeps the text readable, else scroll sideways
            fit = Math.min(fit, (scroll.getViewportBounds().getWidth() - 2) / g.width());
        }
        scale = Math.max(MIN_SCALE, Math.min(MAX_SCALE, fit));
        double w = g == null ? 0 : g.width() * scale;
        canvas.setWidth(Math.ceil(w));
        canvas.setHeight(Math.ceil(SchematicGeometry.HEIGHT * scale));
        repaint();
    }

    private void repaint() {
        GraphicsContext g = canvas.getGraphicsContext2D();
        Palette pal = palette.get();
        g.setFill(pal.paper());
        g.fillRect(0, 0, canvas.getWidth(), canvas.getHeight());
        SchematicGeometry geo = model.geometryProperty().get();
        if (geo == null) {
            return;
        }
        g.save();
        g.scale(scale, scale);
        g.setLineCap(StrokeLineCap.ROUND);
        for (SchematicGeometry.Part p : geo.parts()) {
            if (model.isSpotlit(p.designPath())) {
                SchematicGeometry.Box b = p.body();
                g.setFill(pal.spotlight());
                g.fillRoundRect(b.x() - 6, b.y() - 6, b.width() + 12, b.height() + 12, 8, 8);
            }
        }
        g.setLineWidth(1.3);
        for (SchematicGeometry.Wire w : geo.wires()) {
            g.setStroke(w.node().equals(busNode(geo)) ? pal.mid() : pal.ink());
            g.strokeLine(w.x1(), w.y1(), w.x2(), w.y2());
        }
        g.setFill(pal.ink());
        for (SchematicGeometry.Point d : geo.dots()) {
            g.fillOval(d.x() - 2.6, d.y() - 2.6, 5.2, 5.2);
        }
        g.setStroke(pal.ink());
        for (SchematicGeometry.Point p : geo.grounds()) {
            ground(g, p.x(), p.y());
        }
        for (SchematicGeometry.Part p : geo.parts()) {
            part(g, pal, p, model.isSpotlit(p.designPath()));
        }
        g.setTextBaseline(VPos.TOP);
        g.setTextAlign(TextAlignment.LEFT);
        Font plain = Font.font("System", SchematicGeometry.FONT_PX);
        Font bold = Font.font("System", FontWeight.BOLD, SchematicGeometry.FONT_PX);
        for (SchematicGeometry.Label l : geo.partLabels()) {
            for (int i = 0; i < l.lines().size(); i++) {
                g.setFont(i == 0 ? bold : plain);
                g.setFill(i == 0 ? pal.ink() : pal.faint());
                g.fillText(l.lines().get(i), l.box().x() + 1, l.box().y() + i * SchematicGeometry.LINE_PX);
            }
        }
        for (SchematicGeometry.Label l : geo.nodeLabels()) {
            g.setFill(pal.paper().deriveColor(0, 1, 1, 0.85));
            g.fillRect(l.box().x(), l.box().y(), l.box().width(), l.box().height());
            for (int i = 0; i < l.lines().size(); i++) {
                g.setFont(i == 0 ? plain : bold);
                g.setFill(i == 0 ? pal.mid() : pal.signal());
                g.fillText(l.lines().get(i), l.box().x() + 1, l.box().y() + i * SchematicGeometry.LINE_PX);
            }
        }
        g.restore();
    }

    private static String busNode(SchematicGeometry geo) {
        return geo.busNode();
    }

    private static void ground(GraphicsContext g, double x, double y) {
        g.setLineWidth(1.4);
        g.strokeLine(x - 8, y, x + 8, y);
        g.strokeLine(x - 5, y + 4, x + 5, y + 4);
        g.strokeLine(x - 2, y + 8, x + 2, y + 8);
    }

    private static void part(GraphicsContext g, Palette pal, SchematicGeometry.Part p, boolean lit) {
        SchematicGeometry.Box b = p.body();
        Color stroke = lit ? pal.clip() : pal.ink();
        g.setStroke(stroke);
        g.setFill(stroke);
        g.setLineWidth(lit ? 2 : 1.4);
        double cx = b.x() + b.width() / 2;
        double cy = b.y() + b.height() / 2;
        boolean v = p.vertical();
        switch (p.symbol()) {
            case RESISTOR -> {
                g.setFill(pal.paper());
                g.fillRect(b.x(), b.y(), b.width(), b.height());
                g.strokeRect(b.x(), b.y(), b.width(), b.height());
            }
            case CAPACITOR, POLARISED_CAPACITOR -> {
                double half = SchematicGeometry.PLATE_LENGTH / 2;
                double gap = SchematicGeometry.PLATE_GAP / 2;
                // which side the positive terminal (the part's first point) is on
                double sign = v ? Math.signum(p.y1() - cy) : Math.signum(p.x1() - cx);
                g.setLineWidth(lit ? 2.6 : 2);
                if (v) {
                    g.strokeLine(cx - half, cy + sign * gap, cx + half, cy + sign * gap);
                } else {
                    g.strokeLine(cx + sign * gap, cy - half, cx + sign * gap, cy + half);
                }
                if (p.symbol() == SchematicGeometry.Symbol.POLARISED_CAPACITOR) {
                    // the negative plate solid, a plus sign beside the positive one
                    double m0 = v ? cy - sign * gap : cx - sign * gap;
                    double m1 = m0 - sign * 3;
                    if (v) {
                        g.fillRect(cx - half, Math.min(m0, m1), 2 * half, 3);
                        plus(g, cx - half - 3, cy + sign * (gap + 6));
                    } else {
                        g.fillRect(Math.min(m0, m1), cy - half, 3, 2 * half);
                        plus(g, cx + sign * (gap + 6), cy - half - 3);
                    }
                } else if (v) {
                    g.strokeLine(cx - half, cy - sign * gap, cx + half, cy - sign * gap);
                } else {
                    g.strokeLine(cx - sign * gap, cy - half, cx - sign * gap, cy + half);
                }
            }
            case SUPPLY -> {
                // a cell: the long plate is positive (towards the first point, at the top)
                g.setLineWidth(lit ? 2.4 : 1.8);
                g.strokeLine(cx - 14, cy - 4, cx + 14, cy - 4);
                g.setLineWidth(4);
                g.strokeLine(cx - 7, cy + 4, cx + 7, cy + 4);
                g.setLineWidth(1.2);
                plus(g, cx - 19, cy - 10);
            }
            case SIGNAL_SOURCE -> {
                double r = SchematicGeometry.SOURCE_DIAMETER / 2;
                g.setFill(pal.paper());
                g.fillOval(cx - r, cy - r, 2 * r, 2 * r);
                g.strokeOval(cx - r, cy - r, 2 * r, 2 * r);
                g.setLineWidth(1.3);
                g.beginPath();
                g.moveTo(cx - 8, cy);
                g.bezierCurveTo(cx - 5, cy - 9, cx - 1, cy - 9, cx, cy);
                g.bezierCurveTo(cx + 1, cy + 9, cx + 5, cy + 9, cx + 8, cy);
                g.stroke();
            }
            case OPAMP -> {
                double[] xs = {b.x(), b.x(), b.x() + b.width()};
                double[] ys = {b.y(), b.y() + b.height(), b.y() + b.height() / 2};
                g.setFill(lit ? pal.litBlock() : pal.block());
                g.fillPolygon(xs, ys, 3);
                g.strokeLine(xs[0], ys[0], xs[1], ys[1]);
                g.strokeLine(xs[1], ys[1], xs[2], ys[2]);
                g.strokeLine(xs[2], ys[2], xs[0], ys[0]);
                g.setLineWidth(1.3);
                double top = b.y() + b.height() / 4;
                double bottom = b.y() + 3 * b.height() / 4;
                plus(g, b.x() + 9, p.minusOnTop() ? bottom : top);
                double ym = p.minusOnTop() ? top : bottom;
                g.strokeLine(b.x() + 5, ym, b.x() + 13, ym);
            }
            default -> { }
        }
    }

    private static void plus(GraphicsContext g, double x, double y) {
        g.setLineWidth(1.3);
        g.strokeLine(x - 4, y, x + 4, y);
        g.strokeLine(x, y - 4, x, y + 4);
    }
}
