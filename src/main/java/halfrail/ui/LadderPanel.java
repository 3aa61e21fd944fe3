package halfrail.ui;

import javafx.collections.ListChangeListener;
import javafx.geometry.Insets;
import javafx.scene.control.Label;
import javafx.scene.control.ScrollPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;

import java.util.ArrayList;
import java.util.List;

/** The view of the ladders: one {@link LadderCanvas} per op-amp, side by side, with a key. */
public final class LadderPanel extends VBox {
    private final LadderPanelModel model;
    private final HBox row = new HBox(10);
    private final List<LadderCanvas> canvases = new ArrayList<>();

    private final javafx.beans.value.ObservableValue<Palette> palette;

    public LadderPanel(LadderPanelModel model, javafx.beans.value.ObservableValue<Palette> palette) {
        this.model = model;
        this.palette = palette;
        getStyleClass().add("ladder-panel");
        setId("ladders");
        Label title = new Label("Voltage ladders, one per op-amp (0 V at the bottom, the rail at the top)");
        title.getStyleClass().add("panel-title");
        row.setPadding(new Insets(4));
        ScrollPane scroll = new ScrollPane(row);
        scroll.setFitToHeight(true);
        scroll.getStyleClass().add("ladder-scroll");
        VBox.setVgrow(scroll, Priority.ALWAYS);
        getChildren().addAll(title, scroll, LadderKey.create(palette.getValue()));
        palette.addListener((o, was, now) -> {
            getChildren().set(2, LadderKey.create(now));
            canvases.forEach(c -> c.paletteProperty().set(now));
        });
        model.rungs().addListener((ListChangeListener<LadderPanelModel.Rung>) c -> rebuild());
        model.focusProperty().addListener((o, was, now) -> spotlight());
        rebuild();
    }

    private void rebuild() {
        List<LadderPanelModel.Rung> rungs = model.rungs();
        while (canvases.size() < rungs.size()) {
            LadderCanvas c = new LadderCanvas();
            c.setOnPick(model::pick);
            c.paletteProperty().set(palette.getValue());
            HBox.setHgrow(c, Priority.SOMETIMES);
            c.setMaxWidth(LadderGeometry.preferredWidth() * 1.4);
            canvases.add(c);
        }
        while (canvases.size() > rungs.size()) {
            canvases.remove(canvases.size() - 1);
        }
        for (int i = 0; i < rungs.size(); i++) {
            canvases.get(i).rungProperty().set(rungs.get(i));
            canvases.get(i).setId("ladder-" + i);
        }
        row.getChildren().setAll(canvases);
        spotlight();
    }

    private void spotlight() {
        LadderPanelModel.Focus f = model.focusProperty().get();
        for (LadderCanvas c : canvases) {
            boolean mine = f != null && c.rungProperty().get() != null
                    && c.rungProperty().get().ladder().opAmp().equals(f.opAmp());
            c.spotlightProperty().set(mine ? f.level() : null);
            c.getStyleClass().remove("ladder-focused");
            if (mine) {
                c.getStyleClass().add("ladder-focused");
            }
        }
    }

    /** The canvases shown, one per op-amp, in the analysis's order. */
    public List<LadderCanvas> canvases() {
        return List.copyOf(canvases);
    }
}
