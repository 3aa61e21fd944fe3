package halfrail.io.report;

import halfrail.check.ChainReport;
import halfrail.check.Finding;
import halfrail.check.Ladder;
import halfrail.check.LadderLevel;
import halfrail.check.PowerOnReport;
import halfrail.check.PowerOnTrace;
import halfrail.check.ResponseCurve;

import javax.imageio.ImageIO;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.Polygon;
import java.awt.RenderingHints;
import java.awt.Shape;
import java.awt.Stroke;
import java.awt.geom.Line2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Draws the review pictures with Java2D into images, without a display: the voltage ladders of a
 * design, the power-on transient and the low-frequency response. The pictures draw only what the
 * check layer computed ({@link Ladder}, {@link PowerOnTrace}, {@link ResponseCurve}); placement
 * comes from {@link LadderGeometry}, {@link Axis} and {@link LabelStack}.
 */
public final class ReportPictures {
    /** Width of one op-amp's column in the ladder picture, px. */
    public static final int LADDER_COLUMN_PX = 330;
    /** Narrowest ladder picture (room for the key), px. */
    public static final int LADDER_MIN_WIDTH_PX = 540;
    /** Height of the ladder picture, px. */
    public static final int LADDER_HEIGHT_PX = 520;
    /** Space above the ladder's volt scale for the column titles, px. */
    public static final int LADDER_TOP_PX = 64;
    /** Space below the ladder's volt scale for the key, px. */
    public static final int LADDER_BOTTOM_PX = 100;
    /** Width of the volt axis left of the ladders, px. */
    public static final int LADDER_AXIS_PX = 58;
    /** Size of the plots, px. */
    public static final int PLOT_WIDTH_PX = 820;
    public static final int PLOT_HEIGHT_PX = 340;
    /** Smallest distance between two labels beside a ladder, px. */
    static final double LABEL_GAP_PX = 14;
    /** The plotted response spans this many dB below its peak. */
    static final double RESPONSE_SPAN_DB = 42;

    private static final Font PLAIN = new Font(Font.SANS_SERIF, Font.PLAIN, 12);
    private static final Font SMALL = new Font(Font.SANS_SERIF, Font.PLAIN, 11);
    private static final Font BOLD = new Font(Font.SANS_SERIF, Font.BOLD, 12);
    private static final Font TITLE = new Font(Font.SANS_SERIF, Font.BOLD, 14);
    private static final Stroke DASHED = new BasicStroke(1.6f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10,
            new float[] {7, 4}, 0);
    private static final Stroke DASH_DOT = new BasicStroke(1.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10,
            new float[] {8, 3, 2, 3}, 0);
    private static final Stroke DOTTED = new BasicStroke(1.6f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND, 10,
            new float[] {1.5f, 3.5f}, 0);

    private ReportPictures() {}

    /** Geometry of a ladder picture of {@code columns} op-amps: where the volt scale runs. */
    public static LadderGeometry ladderGeometry(List<Ladder> ladders) {
        return new LadderGeometry(ladders, LADDER_TOP_PX, LADDER_HEIGHT_PX - LADDER_BOTTOM_PX);
    }

    /**
     * The voltage ladders of one design side by side on one volt scale. Levels that a finding
     * points at are written in the finding's colour.
     *
     * @param ladders  the design's ladders, at least one
     * @param findings the design's findings (those naming an op-amp and a level colour that level)
     */
    public static BufferedImage ladders(List<Ladder> ladders, List<Finding> findings) {
        LadderGeometry geo = ladderGeometry(ladders);
        int width = Math.max(LADDER_MIN_WIDTH_PX, LADDER_AXIS_PX + ladders.size() * LADDER_COLUMN_PX + 12);
        BufferedImage img = canvas(width, LADDER_HEIGHT_PX);
        Graphics2D g = graphics(img);
        double top = LADDER_TOP_PX;
        double bottom = LADDER_HEIGHT_PX - LADDER_BOTTOM_PX;
        g.setFont(SMALL);
        for (double v : geo.axis().ticks(10)) {
            double y = geo.y(v);
            g.setColor(Palette.GRID);
            g.draw(new Line2D.Double(LADDER_AXIS_PX - 4, y, width - 8, y));
            g.setColor(Palette.FAINT);
            String t = Fmt.volts(v);
            g.drawString(t, LADDER_AXIS_PX - 8 - g.getFontMetrics().stringWidth(t), (float) (y + 4));
        }
        for (int i = 0; i < ladders.size(); i++) {
            Ladder l = ladders.get(i);
            List<Finding> mine = findings.stream().filter(f -> f.opAmp().filter(l.opAmp()::equals).isPresent())
                    .toList();
            drawLadder(g, geo, l, mine, LADDER_AXIS_PX + i * LADDER_COLUMN_PX, top, bottom);
        }
        drawLadderKey(g, 14, LADDER_HEIGHT_PX - LADDER_BOTTOM_PX + 26, width);
        g.dispose();
        return img;
    }

    private static void drawLadder(Graphics2D g, LadderGeometry geo, Ladder l, List<Finding> mine, int x0,
                                   double top, double bottom) {
        Verdict verdict = Verdict.of(mine);
        g.setFont(TITLE);
        g.setColor(Palette.INK);
        g.drawString(fit(g, l.opAmp(), LADDER_COLUMN_PX - 80), x0 + 12, 24);
        chip(g, verdict, x0 + 12, 32);

        double inX = x0 + 14;
        double inW = 9;
        double barX = x0 + 30;
        double barW = 74;
        double yGround = geo.y(0);
        double ySupply = geo.y(l.supplyVolts());
        double yLow = geo.y(clamp(l.swingLowVolts(), 0, l.supplyVolts()));
        double yHigh = geo.y(clamp(l.swingHighVolts(), 0, l.supplyVolts()));

        // the output column: hatched where the output cannot reach, white where it can
        hatch(g, new Rectangle2D.Double(barX, ySupply, barW, yHigh - ySupply));
        hatch(g, new Rectangle2D.Double(barX, yLow, barW, yGround - yLow));
        g.setColor(Palette.WINDOW);
        g.fill(new Rectangle2D.Double(barX, yHigh, barW, yLow - yHigh));

        // the input strip: teal where the inputs work
        hatch(g, new Rectangle2D.Double(inX, ySupply, inW, yGround - ySupply));
        double cmTop = geo.y(clamp(l.commonModeHighVolts(), 0, l.supplyVolts()));
        double cmBottom = geo.y(clamp(l.commonModeLowVolts(), 0, l.supplyVolts()));
        g.setColor(Palette.INPUT_RANGE);
        g.fill(new Rectangle2D.Double(inX, cmTop, inW, cmBottom - cmTop));

        // tolerance spread of the rest point
        geo.spread(l).ifPresent(s -> {
            g.setColor(new Color(Palette.REST.getRed(), Palette.REST.getGreen(), Palette.REST.getBlue(), 50));
            g.fill(new Rectangle2D.Double(barX, s[0], barW, Math.max(1, s[1] - s[0])));
        });

        // mid-rail
        g.setStroke(DASH_DOT);
        g.setColor(Palette.MID);
        double yMid = geo.y(l.midRailVolts());
        g.draw(new Line2D.Double(inX - 4, yMid, barX + barW, yMid));

        // the signal: a sine around the rest point, red beyond the window, violet beyond the end-point top
        drawSignal(g, geo, l, barX + 4, barW - 8);

        // rest point
        double yRest = geo.y(l.quiescentVolts());
        g.setStroke(new BasicStroke(3f));
        g.setColor(Palette.REST);
        g.draw(new Line2D.Double(barX - 2, yRest, barX + barW + 2, yRest));
        Polygon arrow = new Polygon(new int[] {(int) (barX + barW + 3), (int) (barX + barW + 11),
            (int) (barX + barW + 11)}, new int[] {(int) yRest, (int) yRest - 5, (int) yRest + 5}, 3);
        g.fill(arrow);

        // leakage shift
        double[] leak = geo.leakageShift(l);
        if (Math.abs(leak[1] - leak[0]) >= 3) {
            g.setColor(Palette.LEAK);
            g.setStroke(new BasicStroke(1.6f));
            double ax = barX + 10;
            g.draw(new Line2D.Double(ax, leak[0], ax, leak[1]));
            double dir = Math.signum(leak[1] - leak[0]);
            g.fill(new Polygon(new int[] {(int) ax - 4, (int) ax + 4, (int) ax},
                    new int[] {(int) (leak[1] - 6 * dir), (int) (leak[1] - 6 * dir), (int) leak[1]}, 3));
        }

        // end-point rail and the output's top there
        g.setStroke(DASHED);
        g.setColor(Palette.END_POINT);
        double yEnd = geo.y(l.endPointSupplyVolts());
        g.draw(new Line2D.Double(inX - 4, yEnd, barX + barW, yEnd));
        g.setStroke(DOTTED);
        double yEndTop = geo.y(clamp(l.endPointSwingHighVolts(), 0, l.supplyVolts()));
        g.draw(new Line2D.Double(barX, yEndTop, barX + barW, yEndTop));

        // rails
        g.setStroke(new BasicStroke(2.5f));
        g.setColor(Palette.INK);
        g.draw(new Line2D.Double(inX - 6, ySupply, barX + barW + 2, ySupply));
        g.draw(new Line2D.Double(inX - 6, yGround, barX + barW + 2, yGround));
        g.setStroke(new BasicStroke(1f));
        g.draw(new Rectangle2D.Double(barX, ySupply, barW, yGround - ySupply));
        g.draw(new Rectangle2D.Double(inX, ySupply, inW, yGround - ySupply));

        drawLabels(g, geo, l, mine, barX + barW + 16, x0 + LADDER_COLUMN_PX - 6, top, bottom);
    }

    /** One label beside a ladder: where it points, what it says, how it looks. */
    private record Label(double wantedY, String text, Color color, boolean bold) {}

    private static void drawLabels(Graphics2D g, LadderGeometry geo, Ladder l, List<Finding> mine, double x,
                                   double right, double top, double bottom) {
        Map<LadderLevel, Finding> flagged = new EnumMap<>(LadderLevel.class);
        for (Finding f : mine) {
            f.level().ifPresent(lv -> flagged.putIfAbsent(lv, f));
        }
        List<Label> labels = new ArrayList<>();
        add(labels, flagged, LadderLevel.SUPPLY, geo.y(l.supplyVolts()), "supply " + Fmt.volts(l.supplyVolts()),
                Palette.INK, true);
        add(labels, flagged, LadderLevel.SWING_HIGH, geo.y(l.swingHighVolts()),
                "output top " + Fmt.volts(l.swingHighVolts()), Palette.INK, false);
        add(labels, flagged, LadderLevel.END_POINT_SUPPLY, geo.y(l.endPointSupplyVolts()),
                "end-point rail " + Fmt.volts(l.endPointSupplyVolts()), Palette.END_POINT, false);
        labels.add(new Label(geo.y(l.endPointSwingHighVolts()), "top at end-point " + Fmt.volts(
                l.endPointSwingHighVolts()), Palette.END_POINT, false));
        add(labels, flagged, LadderLevel.SIGNAL_ENVELOPE, geo.y(l.envelopeHighVolts()),
                "signal \u00B1" + Fmt.volts((l.envelopeHighVolts() - l.envelopeLowVolts()) / 2),
                l.clips() ? Palette.CLIPPED : Palette.SIGNAL, l.clips());
        add(labels, flagged, LadderLevel.QUIESCENT, geo.y(l.quiescentVolts()), "rest " + Fmt.volts(l.quiescentVolts()),
                Palette.REST, true);
        add(labels, flagged, LadderLevel.MID_RAIL, geo.y(l.midRailVolts()), "mid-rail " + Fmt.volts(l.midRailVolts()),
                Palette.MID, false);
        if (Math.abs(l.leakageShiftVolts()) >= 1e-3) {
            add(labels, flagged, LadderLevel.LEAKAGE_SHIFT, geo.y(l.quiescentVolts() + l.leakageShiftVolts()),
                    "leakage moves rest " + Fmt.signedVolts(l.leakageShiftVolts()), Palette.LEAK, false);
        } else if (flagged.containsKey(LadderLevel.LEAKAGE_SHIFT)) {
            add(labels, flagged, LadderLevel.LEAKAGE_SHIFT, geo.y(l.quiescentVolts()),
                    "leakage moves rest " + Fmt.signedVolts(l.leakageShiftVolts()), Palette.LEAK, false);
        }
        if (l.spreadLowVolts().isPresent() && l.spreadHighVolts().isPresent()) {
            add(labels, flagged, LadderLevel.TOLERANCE_SPREAD, geo.y(l.spreadLowVolts().getAsDouble()),
                    "spread " + Fmt.volts(l.spreadLowVolts().getAsDouble()) + " \u2013 "
                            + Fmt.volts(l.spreadHighVolts().getAsDouble()), Palette.REST, false);
        }
        if (l.commonModeHighVolts() < l.supplyVolts()) {
            add(labels, flagged, LadderLevel.COMMON_MODE_HIGH, geo.y(l.commonModeHighVolts()),
                    "inputs up to " + Fmt.volts(l.commonModeHighVolts()), Palette.INPUT_RANGE, false);
        } else if (flagged.containsKey(LadderLevel.COMMON_MODE_HIGH)) {
            add(labels, flagged, LadderLevel.COMMON_MODE_HIGH, geo.y(l.supplyVolts()),
                    "inputs up to " + Fmt.volts(l.commonModeHighVolts()), Palette.INPUT_RANGE, false);
        }
        if (l.commonModeLowVolts() > 0) {
            add(labels, flagged, LadderLevel.COMMON_MODE_LOW, geo.y(l.commonModeLowVolts()),
                    "inputs down to " + Fmt.volts(l.commonModeLowVolts()), Palette.INPUT_RANGE, false);
        } else if (flagged.containsKey(LadderLevel.COMMON_MODE_LOW)) {
            add(labels, flagged, LadderLevel.COMMON_MODE_LOW, geo.y(0),
                    "inputs down to " + Fmt.volts(l.commonModeLowVolts()), Palette.INPUT_RANGE, false);
        }
        add(labels, flagged, LadderLevel.SWING_LOW, geo.y(l.swingLowVolts()),
                "output floor " + Fmt.volts(l.swingLowVolts()), Palette.INK, false);
        add(labels, flagged, LadderLevel.GROUND, geo.y(0), "ground 0 V", Palette.INK, true);

        double[] wanted = labels.stream().mapToDouble(Label::wantedY).toArray();
        double[] placed = LabelStack.spread(wanted, LABEL_GAP_PX, top - 6, bottom + 14);
        for (int k = 0; k < labels.size(); k++) {
            Label lb = labels.get(k);
            g.setStroke(new BasicStroke(0.8f));
            g.setColor(Palette.FAINT);
            g.draw(new Line2D.Double(x - 12, lb.wantedY(), x - 3, placed[k]));
            g.setFont(lb.bold() ? BOLD : PLAIN);
            g.setColor(lb.color());
            g.drawString(fit(g, lb.text(), right - x), (float) x, (float) (placed[k] + 4));
        }
    }

    private static void add(List<Label> labels, Map<LadderLevel, Finding> flagged, LadderLevel level, double y,
                            String text, Color color, boolean bold) {
        Finding f = flagged.get(level);
        if (f != null) {
            labels.add(new Label(y, "\u25B6 " + text, Palette.of(f.severity()), true));
        } else {
            labels.add(new Label(y, text, color, bold));
        }
    }

    private static void drawSignal(Graphics2D g, LadderGeometry geo, Ladder l, double x, double w) {
        double centre = l.quiescentVolts();
        double amp = (l.envelopeHighVolts() - l.envelopeLowVolts()) / 2;
        int n = 160;
        g.setStroke(new BasicStroke(2.2f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
        double px = x;
        double pv = centre;
        for (int i = 1; i <= n; i++) {
            double t = i / (double) n;
            double v = centre + amp * Math.sin(2 * Math.PI * 1.5 * t);
            double cx = x + w * t;
            double mid = (v + pv) / 2;
            Color c = mid > l.swingHighVolts() || mid < l.swingLowVolts() ? Palette.CLIPPED : Palette.SIGNAL;
            g.setColor(c);
            g.draw(new Line2D.Double(px, geo.y(pv), cx, geo.y(v)));
            px = cx;
            pv = v;
        }
    }

    /** Height of one row of the ladder key, px. */
    static final int KEY_ROW_PX = 18;

    /** The ladder key, laid out left to right, wrapping at the picture's edge. */
    private static final class Key {
        private final Graphics2D g;
        private final int left;
        private final int width;
        private int x;
        private int y;

        Key(Graphics2D g, int left, int y, int width) {
            this.g = g;
            this.left = left;
            this.x = left;
            this.y = y;
            this.width = width;
        }

        void item(String text, Swatch swatch) {
            g.setFont(SMALL);
            int needed = 28 + g.getFontMetrics().stringWidth(text);
            if (x + needed > width - 6 && x > left) {
                x = left;
                y += KEY_ROW_PX;
            }
            Graphics2D gg = (Graphics2D) g.create();
            swatch.draw(gg, x, y);
            gg.dispose();
            g.setFont(SMALL);
            g.setColor(Palette.INK);
            g.drawString(text, x + 28, y);
            x += needed + 18;
        }
    }

    private static void drawLadderKey(Graphics2D g, int x, int y, int width) {
        Key key = new Key(g, x, y, width);
        key.item("output cannot reach", (gg, bx, by) -> hatch(gg, new Rectangle2D.Double(bx, by - 9, 22, 11)));
        key.item("inputs work", (gg, bx, by) -> {
            gg.setColor(Palette.INPUT_RANGE);
            gg.fill(new Rectangle2D.Double(bx + 6, by - 9, 9, 11));
        });
        key.item("rest point", (gg, bx, by) -> {
            gg.setColor(Palette.REST);
            gg.setStroke(new BasicStroke(3f));
            gg.draw(new Line2D.Double(bx, by - 4, bx + 22, by - 4));
        });
        key.item("signal at nominal level", (gg, bx, by) -> {
            gg.setColor(Palette.SIGNAL);
            gg.setStroke(new BasicStroke(2.2f));
            gg.draw(wave(bx, by - 4, 22, 4));
        });
        key.item("clipped", (gg, bx, by) -> {
            gg.setColor(Palette.CLIPPED);
            gg.setStroke(new BasicStroke(2.2f));
            gg.draw(wave(bx, by - 4, 22, 4));
        });
        key.item("end-point rail", (gg, bx, by) -> {
            gg.setColor(Palette.END_POINT);
            gg.setStroke(DASHED);
            gg.draw(new Line2D.Double(bx, by - 4, bx + 22, by - 4));
        });
        key.item("output top at end-point", (gg, bx, by) -> {
            gg.setColor(Palette.END_POINT);
            gg.setStroke(DOTTED);
            gg.draw(new Line2D.Double(bx, by - 4, bx + 22, by - 4));
        });
        key.item("mid-rail", (gg, bx, by) -> {
            gg.setColor(Palette.MID);
            gg.setStroke(DASH_DOT);
            gg.draw(new Line2D.Double(bx, by - 4, bx + 22, by - 4));
        });
        key.item("named by a finding", (gg, bx, by) -> {
            gg.setColor(Palette.CLIPPED);
            gg.setFont(BOLD);
            gg.drawString("\u25B6", (float) bx + 6, (float) by);
        });
    }

    private interface Swatch {
        void draw(Graphics2D g, double x, double y);
    }

    private static Shape wave(double x, double y, double w, double a) {
        Path2D p = new Path2D.Double();
        p.moveTo(x, y);
        for (int i = 1; i <= 24; i++) {
            double t = i / 24.0;
            p.lineTo(x + w * t, y - a * Math.sin(2 * Math.PI * t));
        }
        return p;
    }

    /**
     * The power-on transient: every op-amp output and the load from switch-on, with the supply,
     * the settle band around the load's final value and the settle-up time.
     *
     * @param p           the power-on report; its trace must be present
     * @param supplyVolts the nominal supply, V
     * @throws IllegalArgumentException when the report carries no trace
     */
    public static BufferedImage powerOn(PowerOnReport p, double supplyVolts) {
        PowerOnTrace tr = p.trace().orElseThrow(() -> new IllegalArgumentException("the power-on report has no trace"));
        double[] t = tr.timesSeconds();
        double end = t[t.length - 1];
        double shown = end;
        if (p.settleSeconds().isPresent()) {
            shown = Math.min(end, Math.max(1.6 * p.settleSeconds().getAsDouble(), end / 20));
        }
        List<String> labels = tr.labels();
        List<Series> series = new ArrayList<>();
        for (int i = 0; i < labels.size(); i++) {
            series.add(new Series(labels.get(i), labels.get(i) + " output", tr.outputVolts(labels.get(i)), false, i));
        }
        series.add(new Series("", "load", tr.loadVolts(), true, labels.size()));
        double vmax = supplyVolts;
        double vmin = 0;
        for (Series se : series) {
            for (double v : se.values()) {
                vmax = Math.max(vmax, v);
                vmin = Math.min(vmin, v);
            }
        }
        Frame f = new Frame(PLOT_WIDTH_PX, PLOT_HEIGHT_PX, 190);
        Axis x = Axis.linear(0, shown, f.left, f.right);
        Axis y = Axis.linear(vmin, vmax * 1.06, f.bottom, f.top);
        BufferedImage img = canvas(PLOT_WIDTH_PX, PLOT_HEIGHT_PX);
        Graphics2D g = graphics(img);
        g.setFont(TITLE);
        g.setColor(Palette.INK);
        g.drawString("Power-on: from switch-on, every capacitor empty", f.left, 22);

        // settle band around the load's final value
        double[] load = tr.loadVolts();
        double fin = load[load.length - 1];
        g.setColor(Palette.BAND);
        g.fill(new Rectangle2D.Double(f.left, y.toPixel(fin + p.bandVolts()), f.right - f.left,
                Math.max(2, y.toPixel(fin - p.bandVolts()) - y.toPixel(fin + p.bandVolts()))));
        grid(g, f, x, y, Fmt::seconds, Fmt::volts, 8, 6);

        g.setStroke(DASHED);
        g.setColor(Palette.INK);
        double ys = y.toPixel(supplyVolts);
        g.draw(new Line2D.Double(f.left, ys, f.right, ys));
        g.setFont(SMALL);
        g.drawString("supply " + Fmt.volts(supplyVolts), (float) f.left + 6, (float) ys - 4);

        for (Series se : loadFirst(series)) {
            double[] v = se.values();
            Path2D path = new Path2D.Double();
            boolean started = false;
            for (int k = 0; k < t.length; k++) {
                if (t[k] > shown * 1.0001) {
                    break;
                }
                double px = x.toPixel(t[k]);
                double py = y.toPixel(v[k]);
                if (!started) {
                    path.moveTo(px, py);
                    started = true;
                } else {
                    path.lineTo(px, py);
                }
            }
            se.style(g);
            g.draw(path);
        }
        if (p.settleSeconds().isPresent()) {
            double ts = p.settleSeconds().getAsDouble();
            double xs = x.toPixel(ts);
            g.setStroke(DASHED);
            g.setColor(Palette.PASS);
            g.draw(new Line2D.Double(xs, f.top, xs, f.bottom));
            g.setFont(BOLD);
            String s = "settled " + Fmt.seconds(ts);
            int sw = g.getFontMetrics().stringWidth(s);
            g.drawString(s, (float) Math.min(xs + 5, f.right - sw - 2), (float) f.top + 30);
        } else {
            g.setFont(BOLD);
            g.setColor(Palette.CLIPPED);
            g.drawString(Fmt.notSettled(p), (float) f.left + 8,
                    (float) f.top + 30);
        }

        // key
        g.setFont(PLAIN);
        int ky = f.top + 10;
        for (Series se : series) {
            se.style(g);
            g.draw(new Line2D.Double(f.right + 14, ky - 4, f.right + 36, ky - 4));
            g.setColor(Palette.INK);
            g.drawString(fit(g, se.name(), 140), f.right + 42, ky);
            ky += 17;
            Double pinned = se.load() ? null : p.pinnedSeconds().get(se.label());
            if (pinned != null && pinned > 0) {
                g.setFont(SMALL);
                g.setColor(Palette.FAINT);
                g.drawString("on a rail " + Fmt.seconds(pinned), f.right + 42, ky - 3);
                g.setFont(PLAIN);
                ky += 15;
            }
        }
        ky += 6;
        g.setColor(Palette.BAND);
        g.fill(new Rectangle2D.Double(f.right + 14, ky - 10, 22, 11));
        g.setColor(Palette.INK);
        g.setFont(SMALL);
        g.drawString("settle band \u00B1" + Fmt.volts(p.bandVolts()), f.right + 42, ky);
        ky += 16;
        g.drawString("largest step at load " + Fmt.volts(p.loadStepVolts()), f.right + 14, ky);
        axisTitles(g, f, "time from switch-on", "volts");
        g.dispose();
        return img;
    }

    /**
     * The low-frequency response: the gain from the source to every signal stage's output and to
     * the load, with the band of interest shaded and the load's lower −3 dB point marked.
     *
     * @throws IllegalArgumentException when the chain carries no response curve
     */
    public static BufferedImage response(ChainReport c) {
        if (c.responses().isEmpty()) {
            throw new IllegalArgumentException("the chain report has no response curves");
        }
        double fmin = Double.POSITIVE_INFINITY;
        double fmax = 0;
        double peak = Double.NEGATIVE_INFINITY;
        for (ResponseCurve r : c.responses()) {
            double[] hz = r.frequenciesHz();
            fmin = Math.min(fmin, hz[0]);
            fmax = Math.max(fmax, hz[hz.length - 1]);
            for (double d : r.gainDb()) {
                if (Double.isFinite(d)) {
                    peak = Math.max(peak, d);
                }
            }
        }
        if (!Double.isFinite(peak)) {
            peak = 0;
        }
        double yTop = Math.ceil((peak + 6) / 6) * 6;
        Frame f = new Frame(PLOT_WIDTH_PX, PLOT_HEIGHT_PX, 190);
        Axis x = Axis.log(fmin, fmax, f.left, f.right);
        Axis y = Axis.linear(yTop - RESPONSE_SPAN_DB - 6, yTop, f.bottom, f.top);
        BufferedImage img = canvas(PLOT_WIDTH_PX, PLOT_HEIGHT_PX);
        Graphics2D g = graphics(img);
        g.setFont(TITLE);
        g.setColor(Palette.INK);
        g.drawString("Frequency response: gain from the source", f.left, 22);
        double bx0 = x.toPixel(c.bandLowHz());
        double bx1 = x.toPixel(c.bandHighHz());
        g.setColor(Palette.BAND);
        g.fill(new Rectangle2D.Double(bx0, f.top, bx1 - bx0, f.bottom - f.top));
        grid(g, f, x, y, Fmt::hertz, ReportPictures::dbTick, 12, 8);
        g.setFont(SMALL);
        g.setColor(Palette.PASS);
        g.drawString("band of interest", (float) bx0 + 4, (float) f.bottom - 6);

        Shape clip = g.getClip();
        g.setClip(new Rectangle2D.Double(f.left, f.top, f.right - f.left, f.bottom - f.top));
        List<ResponseCurve> curves = c.responses();
        List<Series> series = new ArrayList<>();
        for (int i = 0; i < curves.size(); i++) {
            ResponseCurve r = curves.get(i);
            series.add(new Series(r.label(), r.atLoad() ? "load" : r.label() + " output", r.gainDb(), r.atLoad(), i));
        }
        for (Series se : loadFirst(series)) {
            ResponseCurve r = curves.get(se.index());
            double[] hz = r.frequenciesHz();
            double[] db = r.gainDb();
            Path2D path = new Path2D.Double();
            boolean started = false;
            for (int k = 0; k < hz.length; k++) {
                double d = Double.isFinite(db[k]) ? db[k] : y.min() - 20;
                double px = x.toPixel(hz[k]);
                double py = y.toPixel(Math.max(d, y.min() - 20));
                if (!started) {
                    path.moveTo(px, py);
                    started = true;
                } else {
                    path.lineTo(px, py);
                }
            }
            se.style(g);
            g.draw(path);
        }
        g.setClip(clip);
        Optional<ResponseCurve> load = c.loadResponse();
        if (load.isPresent() && load.get().lowerCornerHz().isPresent()) {
            double fc = load.get().lowerCornerHz().getAsDouble();
            double peakLoad = 20 * Math.log10(c.peakGain());
            double px = x.toPixel(fc);
            double py = y.toPixel(peakLoad - 3);
            g.setColor(Palette.CLIPPED);
            g.fill(new java.awt.geom.Ellipse2D.Double(px - 4.5, py - 4.5, 9, 9));
            g.setFont(BOLD);
            String s = "\u22123 dB at " + Fmt.hertz(fc);
            g.drawString(s, (float) px + 8, (float) py + 16);
        }
        g.setFont(PLAIN);
        int ky = f.top + 10;
        for (Series se : series) {
            ResponseCurve r = curves.get(se.index());
            se.style(g);
            g.draw(new Line2D.Double(f.right + 14, ky - 4, f.right + 36, ky - 4));
            g.setColor(Palette.INK);
            g.drawString(fit(g, se.name(), 140), f.right + 42, ky);
            ky += 17;
            if (r.lowerCornerHz().isPresent()) {
                g.setFont(SMALL);
                g.setColor(Palette.FAINT);
                g.drawString("lower corner " + Fmt.hertz(r.lowerCornerHz().getAsDouble()), f.right + 42, ky - 3);
                g.setFont(PLAIN);
                ky += 15;
            }
        }
        ky += 6;
        g.setColor(Palette.BAND);
        g.fill(new Rectangle2D.Double(f.right + 14, ky - 10, 22, 11));
        g.setColor(Palette.INK);
        g.setFont(SMALL);
        g.drawString(Fmt.hertz(c.bandLowHz()) + " \u2013 " + Fmt.hertz(c.bandHighHz()), f.right + 42, ky);
        axisTitles(g, f, "frequency", "gain");
        g.dispose();
        return img;
    }

    /** Trace {@code i}'s line: the load wide, every other stage dashed so traces lying on each other both show. */
    private static Stroke traceStroke(int i, boolean isLoad) {
        if (isLoad) {
            return new BasicStroke(4f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND);
        }
        if (i % 2 == 1) {
            return new BasicStroke(2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10, new float[] {9, 5}, 0);
        }
        return new BasicStroke(2f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND);
    }

    /**
     * One plotted line.
     *
     * @param label  the op-amp label it belongs to (empty for the load)
     * @param name   its name in the key
     * @param values its values (volts or dB)
     * @param load   whether it is the load's
     * @param index  its place among the plot's lines (picks colour and dash)
     */
    private record Series(String label, String name, double[] values, boolean load, int index) {
        void style(Graphics2D g) {
            g.setColor(load ? Palette.LOAD : Palette.trace(index));
            g.setStroke(traceStroke(index, load));
        }
    }

    /** {@code series} with the load's first, so the stages draw over it. */
    private static List<Series> loadFirst(List<Series> series) {
        List<Series> order = new ArrayList<>();
        for (Series se : series) {
            if (se.load()) {
                order.add(0, se);
            } else {
                order.add(se);
            }
        }
        return order;
    }

    /** Tick label in dB: whole numbers without decimals. */
    private static String dbTick(double v) {
        return Math.rint(v) == v ? String.format(java.util.Locale.ROOT, "%.0f dB", v).replace('-', '\u2212')
                : Fmt.db(v);
    }

    /** PNG bytes of {@code image}. */
    public static byte[] png(BufferedImage image) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try {
            if (!ImageIO.write(image, "png", out)) {
                throw new IllegalStateException("no PNG writer in this Java runtime");
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out.toByteArray();
    }

    /** The plot area inside a picture, px. */
    private static final class Frame {
        final int left;
        final int right;
        final int top;
        final int bottom;

        Frame(int width, int height, int keyWidth) {
            left = 70;
            right = width - keyWidth;
            top = 36;
            bottom = height - 46;
        }
    }

    private interface Format {
        String of(double v);
    }

    private static void grid(Graphics2D g, Frame f, Axis x, Axis y, Format fx, Format fy, int nx, int ny) {
        g.setStroke(new BasicStroke(1f));
        g.setFont(SMALL);
        FontMetrics fm = g.getFontMetrics();
        for (double v : x.ticks(nx)) {
            double px = x.toPixel(v);
            g.setColor(Palette.GRID);
            g.draw(new Line2D.Double(px, f.top, px, f.bottom));
            g.setColor(Palette.FAINT);
            String s = fx.of(v);
            g.drawString(s, (float) (px - fm.stringWidth(s) / 2.0), f.bottom + 15);
        }
        for (double v : y.ticks(ny)) {
            double py = y.toPixel(v);
            g.setColor(Palette.GRID);
            g.draw(new Line2D.Double(f.left, py, f.right, py));
            g.setColor(Palette.FAINT);
            String s = fy.of(v);
            g.drawString(s, f.left - 6 - fm.stringWidth(s), (float) py + 4);
        }
        g.setColor(Palette.INK);
        g.draw(new Line2D.Double(f.left, f.bottom, f.right, f.bottom));
        g.draw(new Line2D.Double(f.left, f.top, f.left, f.bottom));
    }

    private static void axisTitles(Graphics2D g, Frame f, String xTitle, String yTitle) {
        g.setFont(SMALL);
        g.setColor(Palette.FAINT);
        FontMetrics fm = g.getFontMetrics();
        g.drawString(xTitle, (f.left + f.right - fm.stringWidth(xTitle)) / 2f, f.bottom + 32);
        Graphics2D r = (Graphics2D) g.create();
        r.rotate(-Math.PI / 2);
        r.drawString(yTitle, -(f.top + f.bottom + fm.stringWidth(yTitle)) / 2f, 14);
        r.dispose();
    }

    private static void chip(Graphics2D g, Verdict v, int x, int y) {
        g.setFont(BOLD);
        String s = v.word();
        int w = g.getFontMetrics().stringWidth(s) + 14;
        g.setColor(Palette.of(v));
        g.fill(new java.awt.geom.RoundRectangle2D.Double(x, y, w, 18, 9, 9));
        g.setColor(Color.WHITE);
        g.drawString(s, x + 7, y + 13);
    }

    private static void hatch(Graphics2D g, Rectangle2D r) {
        if (r.getHeight() <= 0 || r.getWidth() <= 0) {
            return;
        }
        Graphics2D h = (Graphics2D) g.create();
        h.setColor(Palette.FORBIDDEN);
        h.fill(r);
        h.clip(r);
        h.setColor(Palette.HATCH);
        h.setStroke(new BasicStroke(1f));
        for (double d = -r.getHeight(); d < r.getWidth(); d += 6) {
            h.draw(new Line2D.Double(r.getX() + d, r.getMaxY(), r.getX() + d + r.getHeight(), r.getY()));
        }
        h.dispose();
    }

    private static String fit(Graphics2D g, String s, double width) {
        FontMetrics fm = g.getFontMetrics();
        if (fm.stringWidth(s) <= width) {
            return s;
        }
        String t = s;
        while (t.length() > 1 && fm.stringWidth(t + "\u2026") > width) {
            t = t.substring(0, t.length() - 1);
        }
        return t + "\u2026";
    }

    private static double clamp(double v, double lo, double hi) {
        return Math.max(lo, Math.min(hi, v));
    }

    private static BufferedImage canvas(int w, int h) {
        BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        g.setColor(Palette.PAPER);
        g.fillRect(0, 0, w, h);
        g.dispose();
        return img;
    }

    private static Graphics2D graphics(BufferedImage img) {
        Graphics2D g = img.createGraphics();
        g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
        g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
        g.setRenderingHint(RenderingHints.KEY_STROKE_CONTROL, RenderingHints.VALUE_STROKE_PURE);
        return g;
    }
}
