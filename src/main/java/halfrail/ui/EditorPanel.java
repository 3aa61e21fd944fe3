package halfrail.ui;

import javafx.collections.ListChangeListener;
import javafx.geometry.Insets;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.TextField;
import javafx.scene.control.TitledPane;
import javafx.scene.control.Tooltip;
import javafx.scene.input.KeyCode;
import javafx.scene.layout.ColumnConstraints;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;

import java.util.HashMap;
import java.util.Map;

/**
 * The view of the design editor: a titled block per section, a row per field. Text fields
 * commit on Enter or when they lose focus and go back to the design's value on Escape; a
 * refused text is marked red with the reason under the field.
 */
public final class EditorPanel extends ScrollPane {
    private final EditorPanelModel model;
    private final VBox blocks = new VBox(6);
    private final Map<String, Node> controls = new HashMap<>();

    public EditorPanel(EditorPanelModel model) {
        this.model = model;
        getStyleClass().add("editor-panel");
        setId("editor");
        setFitToWidth(true);
        setHbarPolicy(ScrollBarPolicy.NEVER);
        blocks.setPadding(new Insets(6));
        setContent(blocks);
        model.sections().addListener((ListChangeListener<EditorPanelModel.Section>) c -> rebuild());
        rebuild();
    }

    /** The control for the field at {@code path} (ids are derived from the path as well). */
    public Node control(String path) {
        return controls.get(path);
    }

    /** The node id used for the field at {@code path}. */
    public static String idFor(String path) {
        return "field-" + path.replaceAll("[^A-Za-z0-9]+", "-");
    }

    private void rebuild() {
        controls.clear();
        blocks.getChildren().clear();
        Label title = new Label("Design editor");
        title.getStyleClass().add("panel-title");
        Label hint = new Label("Type values like 4k7, 100n or 2.2 µ; Enter or leaving the field applies, Esc restores.");
        hint.setWrapText(true);
        hint.getStyleClass().add("hint");
        blocks.getChildren().addAll(title, hint);
        for (EditorPanelModel.Section s : model.sections()) {
            blocks.getChildren().add(block(s));
            if (s.path().equals("stages[" + lastStage() + "]")) {
                Button add = new Button("+ add a stage after this one");
                add.setId("add-stage");
                add.setOnAction(e -> model.addStage());
                add.setMaxWidth(Double.MAX_VALUE);
                blocks.getChildren().add(add);
            }
        }
    }

    private int lastStage() {
        return (int) model.sections().stream().filter(s -> s.stageIndex().isPresent()).count() - 1;
    }

    private TitledPane block(EditorPanelModel.Section s) {
        GridPane grid = new GridPane();
        grid.setHgap(6);
        grid.setVgap(3);
        ColumnConstraints labels = new ColumnConstraints();
        labels.setMinWidth(112);
        ColumnConstraints inputs = new ColumnConstraints();
        inputs.setHgrow(Priority.ALWAYS);
        inputs.setFillWidth(true);
        grid.getColumnConstraints().addAll(labels, inputs);
        int row = 0;
        if (s.stageIndex().isPresent()) {
            int i = s.stageIndex().getAsInt();
            Button up = new Button("▲ earlier");
            up.setOnAction(e -> model.moveStage(i, -1));
            up.setDisable(i == 0);
            Button down = new Button("▼ later");
            down.setOnAction(e -> model.moveStage(i, 1));
            down.setDisable(i == lastStage());
            Button remove = new Button("remove");
            remove.setId("remove-stage-" + i);
            remove.setOnAction(e -> model.removeStage(i));
            remove.setDisable(lastStage() == 0);
            HBox tools = new HBox(4, up, down, remove);
            tools.setAlignment(Pos.CENTER_LEFT);
            tools.getStyleClass().add("stage-tools");
            grid.add(tools, 0, row++, 2, 1);
        }
        String previous = null;
        for (EditorPanelModel.Field f : s.fields()) {
            // a field that details the one above it (a capacitor's value under its technology) is shown indented
            boolean detail = previous != null && f.label().startsWith(previous + " ");
            Label name = new Label(detail ? "   " + f.label().substring(previous.length() + 1) : f.label());
            if (!detail) {
                previous = f.label();
            }
            name.getStyleClass().add("field-label");
            name.setTooltip(new Tooltip(f.help()));
            Node control;
            if (f instanceof EditorPanelModel.TextEntry t) {
                control = textField(t);
                Label problem = new Label();
                problem.getStyleClass().add("field-problem");
                problem.setWrapText(true);
                problem.setId(idFor(f.path()) + "-problem");
                problem.textProperty().bind(t.problemProperty());
                problem.visibleProperty().bind(t.problemProperty().isNotEmpty());
                problem.managedProperty().bind(problem.visibleProperty());
                grid.add(name, 0, row);
                grid.add(control, 1, row++);
                grid.add(problem, 1, row++);
            } else {
                control = comboBox((EditorPanelModel.Choice) f);
                grid.add(name, 0, row);
                grid.add(control, 1, row++);
            }
            controls.put(f.path(), control);
            f.highlightedProperty().addListener((o, was, now) -> mark(control, now));
            mark(control, f.highlightedProperty().get());
        }
        VBox body = new VBox(4, grid);
        if (!s.note().isEmpty()) {
            Label note = new Label(s.note());
            note.setWrapText(true);
            note.getStyleClass().add("safety-note");
            body.getChildren().add(note);
        }
        TitledPane pane = new TitledPane(s.title(), body);
        pane.setId("section-" + idFor(s.path()).substring("field-".length()));
        pane.setAnimated(false);
        return pane;
    }

    private static void mark(Node control, boolean lit) {
        control.getStyleClass().remove("spotlit");
        if (lit) {
            control.getStyleClass().add("spotlit");
        }
    }

    private static TextField textField(EditorPanelModel.TextEntry t) {
        TextField field = new TextField();
        field.setId(idFor(t.path()));
        field.textProperty().bindBidirectional(t.textProperty());
        field.setTooltip(new Tooltip(t.help() + (t.unitSymbol().isEmpty() ? ""
                : " Engineering notation, unit " + t.unitSymbol() + " (for example 4.7k, 4k7, 100n, 2.2 µ).")));
        field.setOnAction(e -> t.commit());
        field.focusedProperty().addListener((o, was, now) -> {
            if (!now) {
                t.commit();
            }
        });
        field.setOnKeyPressed(e -> {
            if (e.getCode() == KeyCode.ESCAPE) {
                t.revert();
            }
        });
        t.problemProperty().addListener((o, was, now) -> {
            field.getStyleClass().remove("refused");
            if (!now.isEmpty()) {
                field.getStyleClass().add("refused");
            }
        });
        return field;
    }

    private static ComboBox<EditorPanelModel.Option> comboBox(EditorPanelModel.Choice c) {
        ComboBox<EditorPanelModel.Option> box = new ComboBox<>();
        box.setId(idFor(c.path()));
        box.getItems().setAll(c.options());
        box.setMaxWidth(Double.MAX_VALUE);
        box.setTooltip(new Tooltip(c.help()));
        box.setValue(c.selectedProperty().get());
        c.selectedProperty().addListener((o, was, now) -> box.setValue(now));
        box.setOnAction(e -> {
            if (box.getValue() != null && !box.getValue().equals(c.selectedProperty().get())) {
                c.choose(box.getValue());
            }
        });
        return box;
    }
}
