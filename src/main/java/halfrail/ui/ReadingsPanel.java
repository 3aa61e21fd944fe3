package halfrail.ui;

import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.scene.control.Label;
import javafx.scene.control.TableColumn;
import javafx.scene.control.TableView;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;

import java.util.function.Function;

/** The views of the readings: a table of the op-amps' numbers and a table of the design's figures, placed by the window. */
public final class ReadingsPanel {
    private final TableView<ReadingsPanelModel.Reading> stages = new TableView<>();
    private final VBox stagesBox;
    private final VBox figuresBox;

    public ReadingsPanel(ReadingsPanelModel model) {
        stages.setId("readings");
        stages.setItems(model.readings());
        stages.getColumns().add(tip(column("op-amp", ReadingsPanelModel.Reading::opAmp, 70), "The stage's name, or the reference buffer."));
        stages.getColumns().add(tip(column("rest", ReadingsPanelModel.Reading::rest, 56), "Quiescent point: the output voltage with no signal, at the analysed supply."));
        stages.getColumns().add(tip(column("window", ReadingsPanelModel.Reading::window, 100), "Swing window: the lowest and highest voltage the output can reach at this supply."));
        stages.getColumns().add(tip(column("headroom", ReadingsPanelModel.Reading::headroom, 66), "Room between the signal's peaks at the nominal level and the nearer swing limit, in dB (negative: it clips)."));
        stages.getColumns().add(tip(column("nearer", ReadingsPanelModel.Reading::nearer, 50), "Which limit the signal meets first: the top (towards the supply) or the floor (towards ground)."));
        stages.getColumns().add(tip(column("bias ×", ReadingsPanelModel.Reading::biasGain, 46), "DC gain from the mid-rail reference to the output; 1 for a correctly built stage."));
        stages.getColumns().add(tip(column("leakage", ReadingsPanelModel.Reading::leakageShift, 66), "How far the rest point moves when every capacitor leaks at its limit value."));
        stages.setColumnResizePolicy(TableView.CONSTRAINED_RESIZE_POLICY);
        stages.setPlaceholder(new Label("no numbers: the circuit could not be solved"));
        TableView<ReadingsPanelModel.Figure> figures = new TableView<>();
        figures.setId("figures");
        figures.setItems(model.figures());
        figures.getColumns().add(column("figure", ReadingsPanelModel.Figure::name, 130));
        figures.getColumns().add(column("value", ReadingsPanelModel.Figure::value, 170));
        figures.setColumnResizePolicy(TableView.CONSTRAINED_RESIZE_POLICY);
        Label t1 = new Label("Op-amp readings at the analysed supply");
        t1.getStyleClass().add("panel-title");
        Label t2 = new Label("Chain and supply");
        t2.getStyleClass().add("panel-title");
        stagesBox = new VBox(2, t1, stages);
        figuresBox = new VBox(2, t2, figures);
        stagesBox.getStyleClass().add("readings-panel");
        figuresBox.getStyleClass().add("readings-panel");
        VBox.setVgrow(stages, Priority.ALWAYS);
        VBox.setVgrow(figures, Priority.ALWAYS);
        figuresBox.setPrefWidth(270);
        figuresBox.setMinWidth(250);
    }

    /** The op-amp readings table with its title. */
    public VBox stagesBox() {
        return stagesBox;
    }

    /** The design figures table with its title. */
    public VBox figuresBox() {
        return figuresBox;
    }

    public TableView<ReadingsPanelModel.Reading> stagesTable() {
        return stages;
    }

    /** Give {@code c} a header that explains the quantity when pointed at. */
    private static <R> TableColumn<R, String> tip(TableColumn<R, String> c, String text) {
        Label header = new Label(c.getText());
        header.setTooltip(new javafx.scene.control.Tooltip(text));
        c.setText(null);
        c.setGraphic(header);
        return c;
    }

    private static <R> TableColumn<R, String> column(String name, Function<R, String> value, double width) {
        TableColumn<R, String> c = new TableColumn<>(name);
        c.setCellValueFactory(d -> new ReadOnlyStringWrapper(value.apply(d.getValue())));
        c.setPrefWidth(width);
        c.setSortable(false);
        return c;
    }
}
