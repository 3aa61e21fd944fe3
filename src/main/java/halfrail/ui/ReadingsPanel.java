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
        stages.getColumns().add(column("op-amp", ReadingsPanelModel.Reading::opAmp, 90));
        stages.getColumns().add(column("rest", ReadingsPanelModel.Reading::rest, 62));
        stages.getColumns().add(column("window", ReadingsPanelModel.Reading::window, 118));
        stages.getColumns().add(column("headroom", ReadingsPanelModel.Reading::headroom, 74));
        stages.getColumns().add(column("nearer", ReadingsPanelModel.Reading::nearer, 58));
        stages.getColumns().add(column("bias ×", ReadingsPanelModel.Reading::biasGain, 54));
        stages.getColumns().add(column("leakage", ReadingsPanelModel.Reading::leakageShift, 80));
        stages.setColumnResizePolicy(TableView.CONSTRAINED_RESIZE_POLICY);
        stages.setPlaceholder(new Label("no numbers: the circuit could not be solved"));
        TableView<ReadingsPanelModel.Figure> figures = new TableView<>();
        figures.setId("figures");
        figures.setItems(model.figures());
        figures.getColumns().add(column("figure", ReadingsPanelModel.Figure::name, 150));
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

    private static <R> TableColumn<R, String> column(String name, Function<R, String> value, double width) {
        TableColumn<R, String> c = new TableColumn<>(name);
        c.setCellValueFactory(d -> new ReadOnlyStringWrapper(value.apply(d.getValue())));
        c.setPrefWidth(width);
        c.setSortable(false);
        return c;
    }
}
