package halfrail.ui;

import halfrail.check.Finding;
import halfrail.check.Severity;
import javafx.scene.control.Label;
import javafx.scene.control.ListCell;
import javafx.scene.control.ListView;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;

/** The view of the findings: severity, what is wrong, and what to do, one finding a row. */
public final class FindingsPanel extends VBox {
    private final ListView<Finding> list = new ListView<>();

    public FindingsPanel(FindingsPanelModel model) {
        getStyleClass().add("findings-panel");
        Label title = new Label("Findings");
        title.getStyleClass().add("panel-title");
        Label tally = new Label();
        tally.textProperty().bind(model.tallyProperty());
        tally.getStyleClass().add("tally");
        HBox head = new HBox(10, title, tally);
        list.setId("findings");
        list.setItems(model.items());
        list.setCellFactory(v -> new FindingCell());
        list.setPlaceholder(new Label("No findings: every check passed."));
        VBox.setVgrow(list, Priority.ALWAYS);
        list.getSelectionModel().selectedItemProperty().addListener((o, was, now) -> model.selectedProperty().set(now));
        model.selectedProperty().addListener((o, was, now) -> {
            if (now == null) {
                list.getSelectionModel().clearSelection();
            } else if (list.getSelectionModel().getSelectedItem() != now) {
                list.getSelectionModel().select(now);
                list.scrollTo(now);
            }
        });
        getChildren().addAll(head, list);
    }

    public ListView<Finding> list() {
        return list;
    }

    /** One finding: a severity tag, the message, and the suggestion under it. */
    private static final class FindingCell extends ListCell<Finding> {
        private final Label tag = new Label();
        private final Label message = new Label();
        private final Label suggestion = new Label();
        private final Label where = new Label();
        private final BorderPane box = new BorderPane();

        FindingCell() {
            tag.getStyleClass().add("severity-tag");
            tag.setMinWidth(64);
            message.setWrapText(true);
            message.getStyleClass().add("finding-message");
            suggestion.setWrapText(true);
            suggestion.getStyleClass().add("finding-suggestion");
            where.getStyleClass().add("finding-where");
            VBox text = new VBox(2, message, suggestion, where);
            box.setLeft(tag);
            box.setCenter(text);
            BorderPane.setMargin(text, new javafx.geometry.Insets(0, 0, 0, 8));
            setPrefWidth(0);
        }

        @Override
        protected void updateItem(Finding f, boolean empty) {
            super.updateItem(f, empty);
            if (empty || f == null) {
                setGraphic(null);
                setText(null);
                return;
            }
            tag.setText(word(f.severity()));
            tag.getStyleClass().removeAll("tag-fail", "tag-warn", "tag-note");
            tag.getStyleClass().add(switch (f.severity()) {
                case FAIL -> "tag-fail";
                case WARN -> "tag-warn";
                case NOTE -> "tag-note";
            });
            message.setText(f.message());
            suggestion.setText(f.suggestion().isEmpty() ? "" : "→ " + f.suggestion());
            suggestion.setManaged(!f.suggestion().isEmpty());
            suggestion.setVisible(!f.suggestion().isEmpty());
            where.setText(f.code() + f.opAmp().map(o -> " · " + o).orElse("")
                    + (f.parts().isEmpty() ? "" : " · " + String.join(", ", f.parts())));
            setText(null);
            setGraphic(box);
        }

        private static String word(Severity s) {
            return switch (s) {
                case FAIL -> "FAILS";
                case WARN -> "MARGINAL";
                case NOTE -> "NOTE";
            };
        }
    }
}
