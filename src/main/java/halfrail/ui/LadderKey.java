package halfrail.ui;

import javafx.geometry.Insets;
import javafx.scene.Node;
import javafx.scene.control.Label;
import javafx.scene.layout.FlowPane;
import javafx.scene.paint.Color;
import javafx.scene.shape.Line;
import javafx.scene.shape.Polygon;
import javafx.scene.shape.Rectangle;

/** The key under the ladders: what each colour and shape stands for. */
final class LadderKey {
    private LadderKey() {}

    static FlowPane create(Palette p) {
        FlowPane key = new FlowPane(14, 4);
        key.setPadding(new Insets(4, 6, 2, 6));
        key.getStyleClass().add("ladder-key");
        Rectangle window = new Rectangle(14, 10, p.window());
        window.setStroke(p.faint());
        Rectangle forbidden = new Rectangle(14, 10, p.hatch());
        Polygon rest = new Polygon(0, 5, 5, 0, 10, 5, 5, 10);
        rest.setFill(p.signal());
        Rectangle envelope = new Rectangle(8, 14, p.signal().deriveColor(0, 1, 1, 0.3));
        envelope.setArcWidth(8);
        envelope.setArcHeight(8);
        envelope.setStroke(p.signal());
        Rectangle clip = new Rectangle(10, 10, p.clip());
        Polygon notch = new Polygon(0, 0, 8, 5, 0, 10);
        notch.setFill(p.commonMode());
        Line endPoint = dashed(p.endPoint(), 6, 4);
        Line mid = dashed(p.mid(), 10, 3, 2, 3);
        Line leak = new Line(0, 0, 0, 12);
        leak.setStroke(p.leak());
        leak.setStrokeWidth(2);
        key.getChildren().addAll(
                item(window, "usable"), item(forbidden, "out of reach"), item(rest, "rest point"),
                item(envelope, "signal at nominal level"), item(clip, "clipped part"),
                item(notch, "input range limit"), item(mid, "mid-rail"), item(endPoint, "end-point rail"),
                item(leak, "leakage shift"));
        return key;
    }

    private static Line dashed(Color c, double... dashes) {
        Line l = new Line(0, 0, 22, 0);
        l.setStroke(c);
        l.setStrokeWidth(1.6);
        for (double d : dashes) {
            l.getStrokeDashArray().add(d);
        }
        return l;
    }

    private static Node item(Node glyph, String text) {
        Label l = new Label(text, glyph);
        l.getStyleClass().add("key-item");
        return l;
    }
}
