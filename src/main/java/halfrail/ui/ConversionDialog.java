package halfrail.ui;

import halfrail.design.StageKind;
import halfrail.parts.CellChemistry;
import halfrail.parts.OpAmpArchetype;
import javafx.beans.binding.Bindings;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.StringProperty;
import javafx.geometry.Insets;
import javafx.scene.Scene;
import javafx.scene.control.Button;
import javafx.scene.control.ChoiceBox;
import javafx.scene.control.Label;
import javafx.scene.control.ListView;
import javafx.scene.control.TableColumn;
import javafx.scene.control.TableView;
import javafx.scene.control.TextField;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;
import javafx.stage.Stage;
import javafx.stage.Window;
import javafx.util.StringConverter;

import java.util.function.Function;

/**
 * The conversion assistant's window: on the left the dual-rail stage (kind, R1, R2, op-amp, ±
 * rails), the new supply, the band, the signal and the optional limits; on the right the
 * before/after comparison, the conflicts and every change with its reason; below, convert and
 * open the result as a new design. Every handler is one call into {@link ConversionModel}.
 */
public final class ConversionDialog extends HBox {
    private final ConversionModel model;
    private final GridPane form = new GridPane();
    private int row;

    public ConversionDialog(ConversionModel model) {
        this.model = model;
        setId("conversion");
        setSpacing(12);
        setPadding(new Insets(10));
        form.setHgap(8);
        form.setVgap(4);
        heading("Dual-rail original");
        choice("kind", model.kindProperty(), java.util.List.of(StageKind.values()), DesignTemplates::words);
        text("R1 (leg or input)", model.r1Property(), "conv-r1");
        text("R2 (feedback)", model.r2Property(), "conv-r2");
        choice("op-amp", model.opAmpProperty(), model.opAmps().stream().map(OpAmpArchetype::id).toList(),
                id -> model.opAmps().stream().filter(a -> a.id().equals(id)).findFirst().map(OpAmpArchetype::displayName).orElse(id));
        text("+ rail, V", model.positiveRailProperty(), "conv-plus");
        text("− rail, V (magnitude)", model.negativeRailProperty(), "conv-minus");
        heading("New single supply");
        choice("supply", model.supplyKindProperty(), java.util.List.of(ConversionModel.SupplyKind.values()),
                k -> k == ConversionModel.SupplyKind.CELLS ? "cells in series" : "fixed rail");
        choice("chemistry", model.chemistryProperty(), model.chemistries().stream().map(CellChemistry::id).toList(),
                id -> model.chemistries().stream().filter(c -> c.id().equals(id)).findFirst().map(CellChemistry::displayName).orElse(id));
        text("cells in series", model.cellsProperty(), "conv-cells");
        text("fixed rail, V", model.railVoltsProperty(), "conv-rail");
        heading("Signal and band");
        text("signal, V peak", model.signalProperty(), "conv-signal");
        text("source resistance", model.sourceOhmsProperty(), "conv-source");
        text("band from, Hz", model.bandLowProperty(), "conv-band-low");
        text("band to, Hz", model.bandHighProperty(), "conv-band-high");
        text("load", model.loadOhmsProperty(), "conv-load");
        heading("Limits (leave blank for none)");
        text("settle-up at most, s", model.maxSettleProperty(), "conv-settle");
        text("supply current at most, A", model.maxCurrentProperty(), "conv-current");
        text("runtime at least, h", model.minRuntimeProperty(), "conv-runtime");

        Button convert = new Button("Convert");
        convert.setId("conv-run");
        convert.setDefaultButton(true);
        convert.disableProperty().bind(model.runningProperty());
        convert.setOnAction(e -> model.convert());
        Button open = new Button("Open as a new design");
        open.setId("conv-open");
        open.disableProperty().bind(model.resultProperty().isNull());
        open.setOnAction(e -> {
            if (model.openResult() && getScene() != null) {
                getScene().getWindow().hide();
            }
        });
        Label message = new Label();
        message.setId("conv-message");
        message.setWrapText(true);
        message.textProperty().bind(model.messageProperty());
        VBox left = new VBox(8, form, new HBox(8, convert, open), message);
        left.setPrefWidth(360);
        left.setMinWidth(320);

        TableView<ConversionModel.Row> table = new TableView<>();
        table.setId("conv-comparison");
        table.getColumns().add(column("figure", ConversionModel.Row::figure, 190));
        table.getColumns().add(column("dual-rail", ConversionModel.Row::before, 100));
        table.getColumns().add(column("single supply", ConversionModel.Row::after, 110));
        table.setColumnResizePolicy(TableView.CONSTRAINED_RESIZE_POLICY);
        table.setPlaceholder(new Label("no conversion yet"));
        table.setPrefHeight(250);
        ListView<String> conflicts = new ListView<>();
        conflicts.setId("conv-conflicts");
        conflicts.setPrefHeight(80);
        conflicts.setPlaceholder(new Label("no conflicts: every limit given was met"));
        ListView<String> changes = new ListView<>();
        changes.setId("conv-changes");
        changes.setPlaceholder(new Label("no changes yet"));
        VBox.setVgrow(changes, Priority.ALWAYS);
        model.resultProperty().addListener((o, was, now) -> {
            table.getItems().setAll(model.comparison());
            conflicts.getItems().setAll(model.conflicts());
            changes.getItems().setAll(model.changes());
        });
        VBox right = new VBox(4, title("Before and after"), table, title("Limits that could not all be met"), conflicts,
                title("What was changed, and why"), changes);
        HBox.setHgrow(right, Priority.ALWAYS);
        getChildren().addAll(left, right);
    }

    private static Label title(String s) {
        Label l = new Label(s);
        l.getStyleClass().add("panel-title");
        return l;
    }

    private void heading(String s) {
        Label l = title(s);
        GridPane.setMargin(l, new Insets(row == 0 ? 0 : 6, 0, 0, 0));
        form.add(l, 0, row++, 2, 1);
    }

    private void text(String label, StringProperty value, String id) {
        TextField f = new TextField();
        f.setId(id);
        f.textProperty().bindBidirectional(value);
        f.setPrefColumnCount(9);
        form.add(new Label(label), 0, row);
        form.add(f, 1, row++);
    }

    private <T> void choice(String label, javafx.beans.property.ObjectProperty<T> value, java.util.List<T> options,
                            Function<T, String> words) {
        ChoiceBox<T> c = new ChoiceBox<>();
        c.getItems().setAll(options);
        c.setConverter(new StringConverter<>() {
            @Override
            public String toString(T t) {
                return t == null ? "" : words.apply(t);
            }

            @Override
            public T fromString(String s) {
                return null;
            }
        });
        c.valueProperty().bindBidirectional(value);
        c.setMaxWidth(200);
        form.add(new Label(label), 0, row);
        form.add(c, 1, row++);
    }

    private static <T> TableColumn<T, String> column(String name, Function<T, String> value, double width) {
        TableColumn<T, String> c = new TableColumn<>(name);
        c.setCellValueFactory(d -> new ReadOnlyStringWrapper(value.apply(d.getValue())));
        c.setPrefWidth(width);
        return c;
    }

    /** Show the assistant in a window of its own over {@code owner}. */
    static Stage show(ConversionModel model, Window owner, java.util.List<String> stylesheets) {
        Stage stage = new Stage();
        stage.initOwner(owner);
        stage.setTitle("Halfrail — move a dual-rail stage to one supply");
        Scene scene = new Scene(new ConversionDialog(model), 1060, 640);
        scene.getStylesheets().addAll(stylesheets);
        stage.setScene(scene);
        stage.show();
        return stage;
    }
}
