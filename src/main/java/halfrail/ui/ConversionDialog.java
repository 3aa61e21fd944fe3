package halfrail.ui;

import halfrail.convert.LimitPriority;
import halfrail.design.StageKind;
import halfrail.parts.CellChemistry;
import halfrail.parts.OpAmpArchetype;
import javafx.beans.binding.Bindings;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.collections.ListChangeListener;
import javafx.geometry.Insets;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.Scene;
import javafx.scene.control.Button;
import javafx.scene.control.ChoiceBox;
import javafx.scene.control.Label;
import javafx.scene.control.ListCell;
import javafx.scene.control.ListView;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.TableColumn;
import javafx.scene.control.TableView;
import javafx.scene.control.TextField;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.ColumnConstraints;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;
import javafx.stage.Stage;
import javafx.stage.Window;
import javafx.util.StringConverter;

import java.util.List;
import java.util.function.Function;

/**
 * The conversion assistant's window. On the left, in a scrolling form: the dual-rail original
 * (± rails and a chain of stages that can be added, removed and reordered, each with its kind,
 * R1, R2 and an op-amp archetype or a custom part's figures), the new supply (cells of a
 * chemistry, a fixed rail or a USB port, with its caution), the signal, band and load, and the
 * optional limits with the one that wins. On the right: the verdict, the conflicts (which limit
 * won, by how much the other is missed), the before/after table beside the trade-off plot, and
 * every change with its reason. A refused value is marked red with the reason under its field,
 * as in the design editor. Every handler is one call into {@link ConversionModel}.
 */
public final class ConversionDialog extends HBox {
    /** The window's size when shown from the menu, px. */
    static final double WIDTH = 1240;
    static final double HEIGHT = 780;

    /** Rows of the comparison table (gain, swing and headroom at three supply points, current, corner, settle-up). */
    static final int TABLE_ROWS = 10;
    private static final double ROW_PX = 22;
    private static final double HEADER_PX = 28;

    private final ConversionModel model;
    private final VBox stageBlocks = new VBox(6);

    public ConversionDialog(ConversionModel model) {
        this.model = model;
        setId("conversion");
        setSpacing(10);
        setPadding(new Insets(8));

        VBox form = new VBox(6);
        form.setPadding(new Insets(2, 10, 6, 2));
        Label hint = new Label("Type values like 4k7, 100n or 2.2 µ. A refused value is marked red with the reason.");
        hint.getStyleClass().add("hint");
        hint.setWrapText(true);
        form.getChildren().addAll(hint, title("Dual-rail original"), grid(
                row("+ rail, V", model.positiveRail(), "conv-plus"),
                row("− rail, V (magnitude)", model.negativeRail(), "conv-minus")), stageBlocks);
        Button add = new Button("+ add a stage after the last");
        add.setId("conv-add-stage");
        add.setMaxWidth(Double.MAX_VALUE);
        add.setOnAction(e -> model.addStage());
        add.disableProperty().bind(Bindings.size(model.stages()).greaterThanOrEqualTo(halfrail.convert.DualRailChain.MAX_STAGES));
        form.getChildren().add(add);
        model.stages().addListener((ListChangeListener<ConversionModel.StageEntry>) c -> rebuildStages());
        rebuildStages();

        form.getChildren().addAll(title("New single supply"), supplyForm(),
                title("Signal, band and load"), grid(
                        row("signal, V peak", model.signal(), "conv-signal"),
                        row("source resistance", model.sourceOhms(), "conv-source"),
                        row("band from, Hz", model.bandLow(), "conv-band-low"),
                        row("band to, Hz", model.bandHigh(), "conv-band-high"),
                        row("load", model.loadOhms(), "conv-load")),
                title("Limits (blank for none)"), grid(
                        row("settle-up at most, s", model.maxSettle(), "conv-settle"),
                        row("supply current at most, A", model.maxCurrent(), "conv-current"),
                        row("runtime at least, h", model.minRuntime(), "conv-runtime"),
                        choiceRow("when band and settle-up conflict", model.priorityProperty(),
                                List.of(LimitPriority.values()),
                                p -> p == LimitPriority.BAND ? "the band wins" : "settle-up wins", "conv-priority")),
                grid(row("design title", model.name(), "conv-title")));
        ScrollPane scroll = new ScrollPane(form);
        scroll.setId("conv-form");
        scroll.setFitToWidth(true);
        scroll.setHbarPolicy(ScrollPane.ScrollBarPolicy.NEVER);
        VBox.setVgrow(scroll, Priority.ALWAYS);

        Button convert = new Button("Convert");
        convert.setId("conv-run");
        convert.setDefaultButton(true);
        convert.disableProperty().bind(model.runningProperty());
        convert.setOnAction(e -> model.convert());
        // the window opens with the focus on Convert, not inside the first field
        convert.sceneProperty().addListener((o, was, now) -> {
            if (now != null) {
                javafx.application.Platform.runLater(convert::requestFocus);
            }
        });
        Button open = new Button("Open the converted design");
        open.setId("conv-open");
        open.disableProperty().bind(model.resultProperty().isNull());
        open.setOnAction(e -> {
            if (model.openResult() && getScene() != null && getScene().getWindow() instanceof Stage s && s.getOwner() != null) {
                s.hide();
            }
        });
        HBox buttons = new HBox(8, convert, open);
        buttons.setPadding(new Insets(4, 0, 0, 0));
        VBox left = new VBox(4, scroll, buttons);
        left.setPrefWidth(445);
        left.setMinWidth(380);
        left.setMaxWidth(480);

        getChildren().addAll(left, outcome());
        HBox.setHgrow(getChildren().get(1), Priority.ALWAYS);
    }

    // ---- the form ------------------------------------------------------------------------------

    private void rebuildStages() {
        stageBlocks.getChildren().clear();
        List<ConversionModel.StageEntry> list = model.stages();
        for (int i = 0; i < list.size(); i++) {
            stageBlocks.getChildren().add(stageBlock(i, list.get(i), list.size()));
        }
    }

    private Node stageBlock(int i, ConversionModel.StageEntry s, int count) {
        Label name = new Label("Stage " + (i + 1));
        name.getStyleClass().add("field-label");
        name.setStyle("-fx-font-weight: bold;");
        Button up = new Button("▲ earlier");
        up.setId("conv-stage-up-" + i);
        up.setDisable(i == 0);
        up.setOnAction(e -> model.moveStage(i, -1));
        Button down = new Button("▼ later");
        down.setId("conv-stage-down-" + i);
        down.setDisable(i == count - 1);
        down.setOnAction(e -> model.moveStage(i, 1));
        Button remove = new Button("remove");
        remove.setId("conv-stage-remove-" + i);
        remove.setDisable(count == 1);
        remove.setOnAction(e -> model.removeStage(i));
        Region gap = new Region();
        HBox.setHgrow(gap, Priority.ALWAYS);
        HBox tools = new HBox(4, name, gap, up, down, remove);
        tools.setAlignment(Pos.CENTER_LEFT);
        tools.getStyleClass().add("stage-tools");

        String p = "conv-stage" + i + "-";
        List<String> opAmpIds = new java.util.ArrayList<>(model.opAmps().stream().map(OpAmpArchetype::id).toList());
        opAmpIds.add(ConversionModel.CUSTOM);
        GridPane main = grid(
                row("name", s.name(), p + "name"),
                choiceRow("kind", s.kindProperty(), List.of(StageKind.values()), DesignTemplates::words, p + "kind"),
                row("R1 (leg, or input)", s.r1(), p + "r1"),
                row("R2 (feedback)", s.r2(), p + "r2"),
                choiceRow("op-amp", s.opAmpProperty(), opAmpIds, id -> id.isEmpty() ? "custom part (own figures)"
                        : model.opAmps().stream().filter(a -> a.id().equals(id)).findFirst()
                        .map(OpAmpArchetype::displayName).orElse(id), p + "opamp"));
        // R1 and R2 mean nothing to a follower
        for (Node n : main.getChildren()) {
            String id = n.getId() == null ? "" : n.getId();
            if (id.startsWith(p + "r1") || id.startsWith(p + "r2") || "R1 (leg, or input)".equals(labelText(n))
                    || "R2 (feedback)".equals(labelText(n))) {
                n.disableProperty().bind(s.kindProperty().isEqualTo(StageKind.FOLLOWER));
            }
        }
        Row[] figures = new Row[s.custom().size()];
        for (int k = 0; k < figures.length; k++) {
            figures[k] = row("   " + OpAmpFigures.LABELS[k], s.custom().get(k), p + "custom" + k);
            figures[k].field().setTooltip(new Tooltip(OpAmpFigures.HELP[k]));
        }
        GridPane custom = grid(figures);
        Label customProblem = problemLabel(p + "custom-problem");
        customProblem.textProperty().bind(s.opAmpProblemProperty());
        VBox customBox = new VBox(2, custom, customProblem);
        customBox.visibleProperty().bind(s.opAmpProperty().isEqualTo(ConversionModel.CUSTOM));
        customBox.managedProperty().bind(customBox.visibleProperty());

        VBox block = new VBox(3, tools, main, customBox);
        block.setId("conv-stage-" + i);
        block.getStyleClass().add("conv-stage");
        // a border derived from the theme's base colour, so that it suits the light and the dark appearance
        block.setStyle("-fx-border-color: derive(-fx-base, -18%); -fx-border-width: 1; -fx-padding: 4 6 6 6;");
        return block;
    }

    private static String labelText(Node n) {
        return n instanceof Label l ? l.getText() : null;
    }

    private Node supplyForm() {
        List<String> chems = model.chemistries().stream().map(CellChemistry::id).toList();
        GridPane kind = grid(choiceRow("supply", model.supplyKindProperty(), List.of(ConversionModel.SupplyKind.values()),
                k -> switch (k) {
                    case CELLS -> "cells in series";
                    case FIXED_RAIL -> "fixed rail";
                    case USB_PORT -> "USB port";
                }, "conv-supply"));
        GridPane cells = grid(
                choiceRow("chemistry", model.chemistryProperty(), chems, id -> model.chemistries().stream()
                        .filter(c -> c.id().equals(id)).findFirst().map(CellChemistry::displayName).orElse(id), "conv-chemistry"),
                row("cells in series", model.cells(), "conv-cells"));
        GridPane rail = grid(
                row("fixed rail, V", model.railVolts(), "conv-rail"),
                row("tolerance, ± %", model.railTolerance(), "conv-rail-tolerance"));
        GridPane usb = grid(
                row("ripple, V peak (blank: none)", model.usbRipple(), "conv-usb-ripple"),
                row("ripple frequency, Hz", model.usbRippleHz(), "conv-usb-ripple-hz"));
        showWhen(cells, ConversionModel.SupplyKind.CELLS);
        showWhen(rail, ConversionModel.SupplyKind.FIXED_RAIL);
        showWhen(usb, ConversionModel.SupplyKind.USB_PORT);
        Label summary = new Label();
        summary.setId("conv-supply-summary");
        summary.getStyleClass().add("hint");
        summary.textProperty().bind(model.supplySummaryProperty());
        Label note = new Label();
        note.setId("conv-safety-note");
        note.getStyleClass().add("safety-note");
        note.setWrapText(true);
        note.setMinHeight(Region.USE_PREF_SIZE);
        note.textProperty().bind(model.safetyNoteProperty());
        return new VBox(2, kind, cells, rail, usb, summary, note);
    }

    private void showWhen(Node n, ConversionModel.SupplyKind k) {
        n.visibleProperty().bind(model.supplyKindProperty().isEqualTo(k));
        n.managedProperty().bind(n.visibleProperty());
    }

    /** One row of a form: its label, its field and the line for the reason it is refused. */
    private record Row(Label label, Node control, Label problem) {
        TextField field() {
            return (TextField) control;
        }
    }

    private static Row row(String label, ConversionModel.Entry entry, String id) {
        TextField f = new TextField();
        f.setId(id);
        f.textProperty().bindBidirectional(entry.textProperty());
        f.setPrefColumnCount(9);
        if (!entry.unitSymbol().isEmpty()) {
            f.setTooltip(new Tooltip("Engineering notation, unit " + entry.unitSymbol() + " (for example 4.7k, 4k7, 100n, 2.2 µ)."));
        }
        Label problem = problemLabel(id + "-problem");
        problem.textProperty().bind(entry.problemProperty());
        mark(f, problem.getText());
        // listen to the row's own label (bound weakly to the entry), so a rebuilt form leaves nothing behind
        problem.textProperty().addListener((o, was, now) -> mark(f, now));
        return new Row(fieldLabel(label), f, problem);
    }

    private static void mark(TextField f, String problem) {
        f.getStyleClass().remove("refused");
        if (!problem.isEmpty()) {
            f.getStyleClass().add("refused");
        }
    }

    private static Label problemLabel(String id) {
        Label problem = new Label();
        problem.setId(id);
        problem.getStyleClass().add("field-problem");
        problem.setWrapText(true);
        problem.setMinHeight(Region.USE_PREF_SIZE);
        problem.visibleProperty().bind(problem.textProperty().isNotEmpty());
        problem.managedProperty().bind(problem.visibleProperty());
        return problem;
    }

    private static Label fieldLabel(String s) {
        Label l = new Label(s);
        l.getStyleClass().add("field-label");
        l.setMinWidth(Region.USE_PREF_SIZE);
        return l;
    }

    private static <T> Row choiceRow(String label, ObjectProperty<T> value, List<T> options, Function<T, String> words,
                                     String id) {
        ChoiceBox<T> c = new ChoiceBox<>();
        c.setId(id);
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
        c.setMaxWidth(Double.MAX_VALUE);
        return new Row(fieldLabel(label), c, null);
    }

    private static GridPane grid(Row... rows) {
        GridPane g = new GridPane();
        g.setHgap(8);
        g.setVgap(3);
        ColumnConstraints labels = new ColumnConstraints();
        labels.setMinWidth(150);
        ColumnConstraints inputs = new ColumnConstraints();
        inputs.setHgrow(Priority.ALWAYS);
        inputs.setFillWidth(true);
        g.getColumnConstraints().addAll(labels, inputs);
        int r = 0;
        for (Row row : rows) {
            g.add(row.label(), 0, r);
            g.add(row.control(), 1, r++);
            if (row.problem() != null) {
                g.add(row.problem(), 1, r++);
            }
        }
        return g;
    }

    private static Label title(String s) {
        Label l = new Label(s);
        l.getStyleClass().add("panel-title");
        VBox.setMargin(l, new Insets(6, 0, 0, 0));
        return l;
    }

    // ---- the outcome ---------------------------------------------------------------------------

    private Node outcome() {
        Label message = new Label();
        message.setId("conv-message");
        message.setWrapText(true);
        message.setMinHeight(Region.USE_PREF_SIZE);
        message.setStyle("-fx-font-weight: bold;");
        message.textProperty().bind(model.messageProperty());

        VBox conflicts = new VBox(4);
        conflicts.setId("conv-conflicts");

        TableView<ConversionModel.Row> table = new TableView<>();
        table.setId("conv-comparison");
        table.getColumns().add(column("figure", ConversionModel.Row::figure, 160));
        table.getColumns().add(column("dual-rail", ConversionModel.Row::before, 120));
        table.getColumns().add(column("single supply", ConversionModel.Row::after, 100));
        table.setColumnResizePolicy(TableView.CONSTRAINED_RESIZE_POLICY);
        table.setPlaceholder(new Label("no conversion yet"));
        table.setFixedCellSize(ROW_PX);
        table.setPrefHeight(ROW_PX * TABLE_ROWS + HEADER_PX);
        table.setMinHeight(ROW_PX * TABLE_ROWS + HEADER_PX);
        table.setPrefWidth(400);
        table.setMinWidth(400);
        Label tableNote = hint("The original runs from fixed ± rails, so its figures hold at every supply point.");
        tableNote.setMaxWidth(400);
        VBox tableBox = new VBox(2, title("Before and after"), table, tableNote);

        TradeOffChart chart = new TradeOffChart();
        VBox chartBox = new VBox(2, title("Trade-off: lower corner against settle-up"), chart);
        VBox.setVgrow(chart, Priority.ALWAYS);
        HBox.setHgrow(chartBox, Priority.ALWAYS);
        HBox middle = new HBox(10, tableBox, chartBox);

        ListView<ConversionModel.ChangeLine> changes = new ListView<>();
        changes.setId("conv-changes");
        changes.setPlaceholder(new Label("no changes yet"));
        changes.setCellFactory(v -> new ChangeCell());
        changes.setMinHeight(120);
        VBox.setVgrow(changes, Priority.ALWAYS);

        model.resultProperty().addListener((o, was, now) -> {
            table.getItems().setAll(model.comparison());
            changes.getItems().setAll(model.changes());
            showConflicts(conflicts);
            chart.show(now);
        });
        showConflicts(conflicts);
        VBox right = new VBox(4, message, title("Limits"), conflicts, middle, title("What was changed, and why"), changes);
        right.setMinWidth(600);
        // a modest preferred width: the form keeps its own, the outcome takes what is left
        right.setPrefWidth(600);
        return right;
    }

    private void showConflicts(VBox box) {
        box.getChildren().clear();
        if (model.resultProperty().get() == null) {
            box.getChildren().add(hint("Conflicts between the limits appear here after converting."));
            return;
        }
        List<ConversionModel.ConflictLine> list = model.conflicts();
        if (list.isEmpty()) {
            Label ok = hint("No conflict: every limit given was met.");
            ok.setId("conv-no-conflict");
            box.getChildren().add(ok);
        }
        for (int i = 0; i < list.size(); i++) {
            ConversionModel.ConflictLine c = list.get(i);
            Label statement = new Label(c.statement());
            statement.setId("conv-conflict-" + i);
            statement.setWrapText(true);
            statement.setMinHeight(Region.USE_PREF_SIZE);
            statement.getStyleClass().add("conv-conflict");
            statement.setStyle("-fx-font-weight: bold;");
            Label why = hint(c.explanation());
            box.getChildren().addAll(statement, why);
        }
    }

    private static Label hint(String s) {
        Label l = new Label(s);
        l.getStyleClass().add("hint");
        l.setWrapText(true);
        l.setMinHeight(Region.USE_PREF_SIZE);
        return l;
    }

    /** A change: what and where on the first line, the reason wrapped below. */
    private static final class ChangeCell extends ListCell<ConversionModel.ChangeLine> {
        private final Label head = new Label();
        private final Label why = new Label();
        private final VBox box = new VBox(1, head, why);

        ChangeCell() {
            head.setStyle("-fx-font-weight: bold;");
            head.setWrapText(true);
            why.setWrapText(true);
            why.getStyleClass().add("hint");
            head.setMinHeight(Region.USE_PREF_SIZE);
            why.setMinHeight(Region.USE_PREF_SIZE);
        }

        @Override
        protected void updateItem(ConversionModel.ChangeLine c, boolean empty) {
            super.updateItem(c, empty);
            if (empty || c == null) {
                setGraphic(null);
                setText(null);
                return;
            }
            head.setText(c.line());
            why.setText(c.why());
            if (getListView() != null) {
                box.maxWidthProperty().bind(getListView().widthProperty().subtract(30));
                box.prefWidthProperty().bind(box.maxWidthProperty());
            }
            setText(null);
            setGraphic(box);
        }
    }

    private static <T> TableColumn<T, String> column(String name, Function<T, String> value, double width) {
        TableColumn<T, String> c = new TableColumn<>(name);
        c.setCellValueFactory(d -> new ReadOnlyStringWrapper(value.apply(d.getValue())));
        c.setPrefWidth(width);
        c.setSortable(false);
        return c;
    }

    /**
     * The window of each assistant already shown, so that the menu brings it back (with what was typed)
     * instead of stacking new windows whose listeners the model would keep. One per workbench; the
     * window refers to its model, so an entry lasts as long as the app.
     */
    private static final java.util.Map<ConversionModel, Stage> SHOWN = new java.util.WeakHashMap<>();

    /** Show the assistant in a window of its own over {@code owner}; the same window again when it was shown before. */
    static Stage show(ConversionModel model, Window owner, List<String> stylesheets) {
        Stage stage = SHOWN.get(model);
        if (stage == null || stage.getOwner() != owner) {
            stage = new Stage();
            stage.initOwner(owner);
            stage.setTitle("Halfrail — move a dual-rail circuit to one supply");
            stage.setScene(new Scene(new ConversionDialog(model), WIDTH, HEIGHT));
            SHOWN.put(model, stage);
        }
        // follow the main window's sheets while open (the dark appearance switched on or off)
        if (stylesheets instanceof javafx.collections.ObservableList<String> live) {
            Bindings.unbindContent(stage.getScene().getStylesheets(), live);
            Bindings.bindContent(stage.getScene().getStylesheets(), live);
        } else {
            stage.getScene().getStylesheets().setAll(stylesheets);
        }
        stage.show();
        stage.toFront();
        return stage;
    }
}
