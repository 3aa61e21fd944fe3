package halfrail.ui;

import halfrail.check.Ladder;
import halfrail.check.LadderLevel;
import halfrail.check.Severity;
import halfrail.check.Side;
import halfrail.check.StageReport;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.geometry.VPos;
import javafx.scene.canvas.Canvas;
import javafx.scene.canvas.GraphicsContext;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.Region;
import javafx.scene.paint.Color;
import javafx.scene.shape.StrokeLineCap;
import javafx.scene.text.Font;
import javafx.scene.text.FontWeight;
import javafx.scene.text.TextAlignment;

import java.util.Locale;
import java.util.Optional;
import java.util.function.BiConsumer;

/**
 * Paints one op-amp's voltage ladder as laid out by {@link LadderGeometry}. It holds no
 * geometry of its own: every position comes from the geometry object, rebuilt when the size or
 * the ladder changes. Pointing at a level shows what it is; clicking it selects the finding
 * about it.
 */
public final class LadderCanvas extends Region {

    private final Canvas canvas = new Canvas();
    private final ObjectProperty<LadderPanelModel.Rung> rung = new SimpleObjectProperty<>(this, "rung");
    private final ObjectProperty<LadderLevel> spotlight = new SimpleObjectProperty<>(this, "spotlight");
    private final ObjectProperty<Palette> palette = new SimpleObjectProperty<>(this, "palette", Palette.LIGHT);
    private final Tooltip tip = new Tooltip();
    private LadderGeometry geometry;
    private BiConsumer<String, LadderLevel> onPick = (a, b) -> { };

    public LadderCanvas() {
        getChildren().add(canvas);
        getStyleClass().add("ladder");
        setMinWidth(LadderGeometry.preferredWidth());
        setPrefWidth(LadderGeometry.preferredWidth());
        setMinHeight(260);
        rung.addListener((o, was, now) -> repaint());
        spotlight.addListener((o, was, now) -> repaint());
        palette.addListener((o, was, now) -> repaint());
        Tooltip.install(this, tip);
        setOnMouseMoved(e -> describe(e.getX(), e.getY()));
        setOnMouseClicked(e -> {
            if (geometry != null) {
                geometry.hit(e.getX(), e.getY()).ifPresent(l -> onPick.accept(geometry.ladder().opAmp(), l));
            }
        });
    }

    void setOnPick(BiConsumer<String, LadderLevel> pick) {
        this.onPick = pick;
    }

    public ObjectProperty<LadderPanelModel.Rung> rungProperty() {
        return rung;
    }

    /** The colours to paint with. */
    public ObjectProperty<Palette> paletteProperty() {
        return palette;
    }

    private Palette pal() {
        return palette.get();
    }

    public ObjectProperty<LadderLevel> spotlightProperty() {
        return spotlight;
    }

    /** The geometry last painted (for tests and hit-testing); null before the first layout. */
    public LadderGeometry geometry() {
        return geometry;
    }

    @Override
    protected void layoutChildren() {
        canvas.setWidth(getWidth());
        canvas.setHeight(getHeight());
        repaint();
    }

    private void describe(double x, double y) {
        if (geometry == null) {
            return;
        }
        Optional<LadderLevel> hit = geometry.hit(x, y);
        tip.setText(hit.map(this::explain).orElse(geometry.ladder().opAmp() + ": point at a level to see what it is"));
    }

    private String explain(LadderLevel level) {
        Ladder l = geometry.ladder();
        return switch (level) {
            case GROUND -> "Ground, 0 V: the bottom rail.";
            case SUPPLY -> "The supply rail at " + volts(l.supplyVolts()) + ".";
            case END_POINT_SUPPLY -> "The rail when the battery reaches its end-point: "
                    + volts(geometry.endPointSupplyVolts()) + "; the output can then reach "
                    + volts(l.endPointSwingHighVolts()) + " at most.";
            case SWING_HIGH -> "Output top: the highest the output can swing, " + volts(l.swingHighVolts())
                    + ". Above it the output clips.";
            case SWING_LOW -> "Output floor: the lowest the output can swing, " + volts(l.swingLowVolts())
                    + ". Below it the output clips.";
            case COMMON_MODE_HIGH -> "Input top: the highest usable input voltage (common-mode range), "
                    + volts(l.commonModeHighVolts()) + ".";
            case COMMON_MODE_LOW -> "Input floor: the lowest usable input voltage (common-mode range), "
                    + volts(l.commonModeLowVolts()) + ".";
            case MID_RAIL -> "Mid-rail: the reference the stages are biased from, " + volts(l.midRailVolts()) + ".";
            case QUIESCENT -> "Rest point (quiescent output) with no signal: " + volts(l.quiescentVolts()) + ".";
            case SIGNAL_ENVELOPE -> "Signal envelope at the nominal level: " + volts(l.envelopeLowVolts()) + " to "
                    + volts(l.envelopeHighVolts()) + (l.clips() ? " — it runs past the swing window and clips." : ".");
            case LEAKAGE_SHIFT -> "Where the rest point moves when every capacitor leaks at its limit: "
                    + volts(l.quiescentVolts() + l.leakageShiftVolts()) + ".";
            case TOLERANCE_SPREAD -> "Spread of the rest point over part tolerances.";
        };
    }

    private static String volts(double v) {
        return String.format(Locale.ROOT, "%.3f V", v);
    }

    private void repaint() {
        GraphicsContext g = canvas.getGraphicsContext2D();
        double w = getWidth();
        double h = getHeight();
        g.setFill(pal().paper());
        g.fillRect(0, 0, w, h);
        LadderPanelModel.Rung r = rung.get();
        if (r == null || w <= 0 || h <= 0) {
            geometry = null;
            return;
        }
        LadderGeometry geo = new LadderGeometry(r.ladder(), w, h, r.scaleTopVolts(), r.endPointSupplyVolts());
        geometry = geo;
        Ladder l = r.ladder();

        // title and verdict chip
        g.setTextBaseline(VPos.CENTER);
        g.setTextAlign(TextAlignment.LEFT);
        g.setFont(Font.font("System", FontWeight.BOLD, 13));
        g.setFill(pal().ink());
        g.fillText(l.opAmp(), 8, 13);
        Color verdict = r.worst().map(s -> s == Severity.FAIL ? pal().fail() : s == Severity.WARN ? pal().warn() : pal().pass()).orElse(pal().pass());
        String word = r.worst().map(s -> s == Severity.FAIL ? "fails" : s == Severity.WARN ? "marginal" : "fine")
                .orElse("fine");
        g.setFont(Font.font("System", FontWeight.BOLD, 10));
        double chipX = w - 64;
        g.setFill(verdict);
        g.fillRoundRect(chipX, 5, 56, 16, 8, 8);
        g.setFill(Color.WHITE);
        g.setTextAlign(TextAlignment.CENTER);
        g.fillText(word, chipX + 28, 13);

        LadderGeometry.Column in = geo.inputs();
        LadderGeometry.Column out = geo.output();

        // shafts: usable window, then forbidden bands with hatching
        g.setFill(pal().window());
        g.fillRect(in.left(), geo.y(l.supplyVolts()), in.width(), geo.y(0) - geo.y(l.supplyVolts()));
        g.fillRect(out.left(), geo.y(l.supplyVolts()), out.width(), geo.y(0) - geo.y(l.supplyVolts()));
        band(g, in, geo.forbiddenInputHigh());
        band(g, in, geo.forbiddenInputLow());
        band(g, out, geo.forbiddenOutputHigh());
        band(g, out, geo.forbiddenOutputLow());
        g.setStroke(pal().faint());
        g.setLineWidth(0.8);
        g.strokeRect(in.left(), geo.y(l.supplyVolts()), in.width(), geo.y(0) - geo.y(l.supplyVolts()));
        g.strokeRect(out.left(), geo.y(l.supplyVolts()), out.width(), geo.y(0) - geo.y(l.supplyVolts()));

        // spotlight of the selected finding's level
        LadderLevel lit = spotlight.get();
        if (lit != null) {
            geo.mark(lit).ifPresent(m -> {
                g.setFill(pal().spotlight());
                g.fillRect(in.left() - 6, m.y() - 6, w - in.left(), 12);
            });
            if (lit == LadderLevel.SIGNAL_ENVELOPE) {
                LadderGeometry.Span e = geo.envelope();
                g.setFill(pal().spotlight());
                g.fillRect(out.left() - 4, e.top() - 4, out.width() + 8, e.height() + 8);
            }
        }

        // scale ticks
        g.setFont(Font.font("System", 10));
        g.setTextAlign(TextAlignment.RIGHT);
        for (LadderGeometry.Tick t : geo.ticks()) {
            g.setStroke(pal().faint());
            g.setLineWidth(0.6);
            g.strokeLine(in.left() - 5, t.y(), in.left() - 1, t.y());
            g.setFill(pal().faint());
            g.fillText(t.label(), in.left() - 7, t.y());
        }

        // rails, end-point rail, mid-rail
        g.setLineCap(StrokeLineCap.BUTT);
        g.setStroke(pal().ink());
        g.setLineWidth(3);
        g.strokeLine(in.left() - 4, geo.y(l.supplyVolts()), out.right() + 4, geo.y(l.supplyVolts()));
        g.strokeLine(in.left() - 4, geo.y(0), out.right() + 4, geo.y(0));
        g.setStroke(pal().endPoint());
        g.setLineWidth(1.4);
        g.setLineDashes(6, 4);
        double ep = geo.clampedY(geo.endPointSupplyVolts());
        g.strokeLine(in.left() - 4, ep, out.right() + 4, ep);
        g.setLineDashes(2, 3);
        double epTop = geo.clampedY(l.endPointSwingHighVolts());
        g.strokeLine(out.left(), epTop, out.right(), epTop);
        g.setStroke(pal().mid());
        g.setLineWidth(1.2);
        g.setLineDashes(10, 3, 2, 3);
        double mid = geo.clampedY(l.midRailVolts());
        g.strokeLine(in.left() - 4, mid, out.right() + 4, mid);
        g.setLineDashes();

        // common-mode limits: inward notches on the inputs shaft
        g.setFill(pal().commonMode());
        notch(g, in, geo.mark(LadderLevel.COMMON_MODE_HIGH).map(LadderGeometry.Mark::y).orElse(0.0), true);
        notch(g, in, geo.mark(LadderLevel.COMMON_MODE_LOW).map(LadderGeometry.Mark::y).orElse(0.0), false);

        // swing limits: firm edges of the output window
        g.setStroke(pal().ink());
        g.setLineWidth(1.6);
        g.strokeLine(out.left(), geo.y(l.swingHighVolts()), out.right(), geo.y(l.swingHighVolts()));
        g.strokeLine(out.left(), geo.y(l.swingLowVolts()), out.right(), geo.y(l.swingLowVolts()));

        // signal envelope: a capsule around the rest point, the clipped parts in the clip colour
        LadderGeometry.Span env = geo.envelope();
        double ew = 12;
        double ex = out.centre() - ew / 2;
        g.setFill(Color.color(pal().signal().getRed(), pal().signal().getGreen(), pal().signal().getBlue(), 0.28));
        g.fillRoundRect(ex, env.top(), ew, Math.max(2, env.height()), ew, ew);
        g.setStroke(pal().signal());
        g.setLineWidth(1.2);
        g.strokeRoundRect(ex, env.top(), ew, Math.max(2, env.height()), ew, ew);
        geo.clippedHigh().ifPresent(s -> {
            g.setFill(pal().clip());
            g.fillRect(ex - 3, s.top(), ew + 6, s.height());
        });
        geo.clippedLow().ifPresent(s -> {
            g.setFill(pal().clip());
            g.fillRect(ex - 3, s.top(), ew + 6, s.height());
        });

        // leakage shift: an arrow from the rest point to where leakage moves it
        double qy = geo.clampedY(l.quiescentVolts());
        double sy = geo.shiftedQuiescentY();
        if (Math.abs(sy - qy) >= 1.5) {
            double ax = out.left() + 7;
            g.setStroke(pal().leak());
            g.setFill(pal().leak());
            g.setLineWidth(1.6);
            g.strokeLine(ax, qy, ax, sy);
            double dir = Math.signum(sy - qy);
            g.fillPolygon(new double[] {ax - 4, ax + 4, ax}, new double[] {sy - dir * 6, sy - dir * 6, sy}, 3);
        }

        // tolerance spread: a bracket beside the output shaft
        geo.spread().ifPresent(s -> {
            double x = geo.spreadX();
            g.setStroke(pal().spread());
            g.setLineWidth(1.6);
            g.strokeLine(x, s.top(), x, s.bottom());
            g.strokeLine(x - 3, s.top(), x + 3, s.top());
            g.strokeLine(x - 3, s.bottom(), x + 3, s.bottom());
        });

        // rest point: a diamond
        double qx = out.centre();
        boolean stuck = r.stage().map(sr -> sr.nominal().saturated()).orElse(false);
        g.setFill(stuck ? pal().clip() : pal().signal());
        g.fillPolygon(new double[] {qx - 7, qx, qx + 7, qx}, new double[] {qy, qy - 7, qy, qy + 7}, 4);
        g.setStroke(pal().paper());
        g.setLineWidth(1.2);
        g.strokePolygon(new double[] {qx - 7, qx, qx + 7, qx}, new double[] {qy, qy - 7, qy, qy + 7}, 4);

        // clip banner on the side that clips (or will, at the battery's end-point)
        Optional<Side> clip = geo.clipSide();
        double bannerTop = geo.plotTop() - 14;
        double bannerFloor = geo.plotBottom() + 27;
        if (stuck) {
            boolean top = geo.restSide() == Side.HIGH;
            banner(g, top ? "● STUCK AT THE TOP AT REST" : "● STUCK AT THE FLOOR AT REST", pal().clip(),
                    top ? bannerTop : bannerFloor, 8, w - 16);
        } else if (clip.isPresent()) {
            Side side = clip.get();
            banner(g, side == Side.HIGH ? "▲ CLIPS AT THE TOP" : "▼ CLIPS AT THE FLOOR", pal().clip(),
                    side == Side.HIGH ? bannerTop : bannerFloor, 8, w - 16);
        } else if (flaggedSeriously(r, LadderLevel.END_POINT_SUPPLY)) {
            banner(g, "▼ CLIPS WHEN THE BATTERY IS LOW", pal().endPoint(), bannerTop, 8, w - 16);
        }

        // labels with leaders
        g.setFont(Font.font("System", 10.5));
        g.setTextAlign(TextAlignment.LEFT);
        for (LadderGeometry.Mark m : geo.marks()) {
            Color c = colour(m.level());
            boolean isLit = m.level() == lit;
            g.setStroke(Color.color(c.getRed(), c.getGreen(), c.getBlue(), 0.6));
            g.setLineWidth(isLit ? 1.6 : 0.7);
            double from = m.level() == LadderLevel.COMMON_MODE_HIGH || m.level() == LadderLevel.COMMON_MODE_LOW
                    ? in.right() : out.right();
            g.strokeLine(from + 1, m.y(), geo.labelX() - 10, m.y());
            g.strokeLine(geo.labelX() - 10, m.y(), geo.labelX() - 3, m.labelY());
            g.setFill(c);
            g.setFont(Font.font("System", isLit ? FontWeight.BOLD : FontWeight.NORMAL, 10.5));
            g.fillText(m.label(), geo.labelX(), m.labelY());
            Severity flag = r.flagged().get(m.level());
            if (flag != null && flag != Severity.NOTE && geo.mark(m.level()).filter(m::equals).isPresent()) {
                g.setFill(flag == Severity.FAIL ? pal().fail() : pal().warn());
                g.fillOval(geo.labelX() - 9, m.labelY() - 3.5, 7, 7);
            }
        }

        // caption: the swing verdict in words
        g.setTextAlign(TextAlignment.LEFT);
        g.setFont(Font.font("System", 11));
        g.setFill(pal().ink());
        double cy = h - 9;
        g.fillText(caption(r.stage(), l), 8, cy);
        g.setFont(Font.font("System", 10));
        g.setFill(pal().faint());
        g.setTextAlign(TextAlignment.CENTER);
        g.fillText("in", in.centre(), geo.plotBottom() + 12);
        g.fillText("out", out.centre(), geo.plotBottom() + 12);
    }

    private static boolean flaggedSeriously(LadderPanelModel.Rung r, LadderLevel level) {
        Severity s = r.flagged().get(level);
        return s != null && s.atLeast(Severity.WARN);
    }

    private static void banner(GraphicsContext g, String text, Color colour, double y, double x, double width) {
        g.setFill(colour);
        g.fillRoundRect(x, y - 8, width, 16, 6, 6);
        g.setFill(Color.WHITE);
        g.setFont(Font.font("System", FontWeight.BOLD, 10));
        g.setTextAlign(TextAlignment.CENTER);
        g.fillText(text, x + width / 2, y);
    }

    private static String caption(Optional<StageReport> stage, Ladder l) {
        if (stage.isEmpty()) {
            return "";
        }
        StageReport s = stage.get();
        if (s.nominal().saturated()) {
            return "output sits on a rail at rest";
        }
        if (!s.signal()) {
            return String.format(Locale.ROOT, "holds %.2f V for the stages", l.quiescentVolts());
        }
        String side = s.nominal().clipsFirst() == Side.HIGH ? "top" : "floor";
        if (!s.nominal().hasSignal()) {
            return "no signal reaches this output";
        }
        if (s.nominal().headroomDb().isEmpty()) {
            return "no room to swing, nearer the " + side;
        }
        return String.format(Locale.ROOT, "headroom %.1f dB, nearer the %s", s.nominal().headroomDb().getAsDouble(), side);
    }

    private Color colour(LadderLevel level) {
        return switch (level) {
            case COMMON_MODE_HIGH, COMMON_MODE_LOW -> pal().commonMode();
            case END_POINT_SUPPLY -> pal().endPoint();
            case MID_RAIL -> pal().mid();
            case QUIESCENT, SIGNAL_ENVELOPE -> pal().signal();
            case LEAKAGE_SHIFT -> pal().leak();
            case TOLERANCE_SPREAD -> pal().spread();
            default -> pal().ink();
        };
    }

    private void band(GraphicsContext g, LadderGeometry.Column c, LadderGeometry.Span s) {
        if (s.height() <= 0.5) {
            return;
        }
        g.setFill(pal().forbidden());
        g.fillRect(c.left(), s.top(), c.width(), s.height());
        g.save();
        g.beginPath();
        g.rect(c.left(), s.top(), c.width(), s.height());
        g.clip();
        g.setStroke(pal().hatch());
        g.setLineWidth(1);
        for (double x = c.left() - s.height(); x < c.right(); x += 6) {
            g.strokeLine(x, s.bottom(), x + s.height(), s.top());
        }
        g.restore();
    }

    private void notch(GraphicsContext g, LadderGeometry.Column c, double y, boolean pointsDown) {
        double d = pointsDown ? 5 : -5;
        g.fillPolygon(new double[] {c.left(), c.left() + 6, c.left()}, new double[] {y - d, y, y + d}, 3);
        g.fillPolygon(new double[] {c.right(), c.right() - 6, c.right()}, new double[] {y - d, y, y + d}, 3);
        g.fillRect(c.left(), y - 0.75, c.width(), 1.5);
    }
}
