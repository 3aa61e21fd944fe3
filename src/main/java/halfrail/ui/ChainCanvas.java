package halfrail.ui;

import halfrail.check.Severity;
import javafx.collections.ListChangeListener;
import javafx.geometry.VPos;
import javafx.scene.canvas.Canvas;
import javafx.scene.canvas.GraphicsContext;
import javafx.scene.layout.Region;
import javafx.scene.paint.Color;
import javafx.scene.text.Font;
import javafx.scene.text.FontWeight;
import javafx.scene.text.TextAlignment;

import java.util.List;

/** Paints the chain drawing laid out by {@link ChainGeometry}; clicking a block selects the finding about it. */
public final class ChainCanvas extends Region {
    /** Height of the drawing, px. */
    public static final double HEIGHT = 118;

    private final ChainPanelModel model;
    private final Canvas canvas = new Canvas();
    private ChainGeometry geometry;
    private final javafx.beans.property.ObjectProperty<Palette> palette =
            new javafx.beans.property.SimpleObjectProperty<>(this, "palette", Palette.LIGHT);

    public ChainCanvas(ChainPanelModel model) {
        this.model = model;
        setId("chain");
        getStyleClass().add("chain");
        getChildren().add(canvas);
        setMinHeight(HEIGHT);
        setPrefHeight(HEIGHT);
        setMaxHeight(HEIGHT);
        model.blocks().addListener((ListChangeListener<ChainPanelModel.Block>) c -> repaint());
        model.spotlitProperty().addListener((o, was, now) -> repaint());
        palette.addListener((o, was, now) -> repaint());
        setOnMouseClicked(e -> {
            if (geometry != null) {
                geometry.hit(e.getX(), e.getY()).ifPresent(p -> model.pick(p.block().path()));
            }
        });
    }

    /** The colours to paint with. */
    public javafx.beans.property.ObjectProperty<Palette> paletteProperty() {
        return palette;
    }

    private Palette pal() {
        return palette.get();
    }

    /** The geometry last painted; null before the first layout. */
    public ChainGeometry geometry() {
        return geometry;
    }

    @Override
    protected void layoutChildren() {
        canvas.setWidth(getWidth());
        canvas.setHeight(getHeight());
        repaint();
    }

    private void repaint() {
        double w = getWidth();
        double h = getHeight();
        GraphicsContext g = canvas.getGraphicsContext2D();
        g.setFill(pal().paper());
        g.fillRect(0, 0, w, h);
        if (w <= 0 || h <= 0) {
            return;
        }
        ChainGeometry geo = new ChainGeometry(model.blocks(), w, h);
        geometry = geo;
        List<ChainGeometry.Placed> row = geo.row();
        g.setStroke(pal().ink());
        g.setFill(pal().ink());
        g.setLineWidth(1.4);
        for (int i = 0; i + 1 < row.size(); i++) {
            ChainGeometry.Placed a = row.get(i);
            ChainGeometry.Placed b = row.get(i + 1);
            double y = a.y() + a.height() / 2;
            double x0 = a.x() + a.width();
            double x1 = b.x();
            g.strokeLine(x0 + 2, y, x1 - 6, y);
            g.fillPolygon(new double[] {x1 - 8, x1 - 1, x1 - 8}, new double[] {y - 4, y, y + 4}, 3);
        }
        geo.reference().ifPresent(ref -> {
            g.setStroke(pal().mid());
            g.setLineDashes(10, 3, 2, 3);
            g.setLineWidth(1.2);
            for (ChainGeometry.Placed s : geo.stages()) {
                g.strokeLine(s.centreX(), ref.y(), s.centreX(), s.y() + s.height());
            }
            g.setLineDashes();
            block(g, ref);
        });
        for (ChainGeometry.Placed p : row) {
            block(g, p);
        }
    }

    private void block(GraphicsContext g, ChainGeometry.Placed p) {
        ChainPanelModel.Block b = p.block();
        boolean lit = model.isSpotlit(b.path());
        Color edge = b.worst().map(s -> s == Severity.FAIL ? pal().fail()
                : s == Severity.WARN ? pal().warn() : pal().faint()).orElse(pal().faint());
        g.setFill(lit ? pal().litBlock() : pal().block());
        g.fillRoundRect(p.x(), p.y(), p.width(), p.height(), 10, 10);
        g.setStroke(lit ? pal().warn() : edge);
        g.setLineWidth(lit || b.worst().filter(s -> s != Severity.NOTE).isPresent() ? 2.2 : 1);
        g.strokeRoundRect(p.x(), p.y(), p.width(), p.height(), 10, 10);
        g.save();
        g.beginPath();
        g.rect(p.x() + 2, p.y() + 2, p.width() - 4, p.height() - 4);
        g.clip();
        g.setTextAlign(TextAlignment.LEFT);
        g.setTextBaseline(VPos.TOP);
        g.setFill(pal().ink());
        boolean lane = b.kind() == ChainPanelModel.Kind.REFERENCE;
        g.setFont(Font.font("System", FontWeight.BOLD, 11));
        double x = p.x() + 7;
        double y = p.y() + (lane ? 3 : 5);
        if (lane) {
            g.fillText(b.title(), x, y);
            g.setFont(Font.font("System", 10.5));
            g.fillText(String.join("   ·   ", b.lines()), x + 7.2 * b.title().length() + 12, y);
            g.restore();
            return;
        }
        g.fillText(b.title(), x, y);
        g.setFont(Font.font("System", 10.5));
        for (String line : b.lines()) {
            y += 14;
            g.fillText(line, x, y);
        }
        g.restore();
    }
}
