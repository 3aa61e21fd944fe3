package halfrail.ui;

import javafx.geometry.Insets;
import javafx.geometry.Pos;
import javafx.scene.control.CheckBox;
import javafx.scene.control.Label;
import javafx.scene.control.Slider;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;

import java.util.Locale;

/**
 * The view of the supply trial: a slider from the supply's end-point to its fresh voltage. While
 * the trial is on, the ladders and findings show the design on a fixed rail at the slider's
 * voltage; the design itself is not changed.
 */
public final class SupplyTrialBar extends HBox {
    private final Slider slider = new Slider();
    private final CheckBox on = new CheckBox("Supply _trial");

    public SupplyTrialBar(WorkbenchModel model) {
        super(8);
        getStyleClass().add("trial-bar");
        setAlignment(Pos.CENTER_LEFT);
        setPadding(new Insets(4, 8, 4, 8));
        on.setId("trial-on");
        on.selectedProperty().bindBidirectional(model.trialActiveProperty());
        on.setTooltip(new Tooltip("Re-analyse on a fixed rail at the chosen voltage, between the battery's "
                + "end-point and fresh. The design is not changed."));
        slider.setId("trial-slider");
        slider.minProperty().bind(model.trialLowVoltsProperty());
        slider.maxProperty().bind(model.trialHighVoltsProperty());
        slider.valueProperty().bindBidirectional(model.trialVoltsProperty());
        slider.disableProperty().bind(on.selectedProperty().not());
        slider.setBlockIncrement(0.1);
        slider.setFocusTraversable(true);
        slider.setTooltip(new Tooltip("Supply voltage to try, from the battery's end-point to fresh; arrow keys move it by 0.1 V."));
        HBox.setHgrow(slider, Priority.ALWAYS);
        Label low = new Label();
        low.textProperty().bind(model.trialLowVoltsProperty().asString(Locale.ROOT, "end-point %.2f V"));
        Label high = new Label();
        high.textProperty().bind(model.trialHighVoltsProperty().asString(Locale.ROOT, "%.2f V fresh"));
        Label now = new Label();
        now.setId("trial-volts");
        now.getStyleClass().add("trial-volts");
        now.textProperty().bind(model.trialVoltsProperty().asString(Locale.ROOT, "%.2f V"));
        low.getStyleClass().add("trial-end");
        high.getStyleClass().add("trial-end");
        for (javafx.scene.control.Control c : new javafx.scene.control.Control[] {on, low, high, now}) {
            c.setMinWidth(javafx.scene.layout.Region.USE_PREF_SIZE);
        }
        getChildren().addAll(on, low, slider, high, now);
    }

    public Slider slider() {
        return slider;
    }
}
