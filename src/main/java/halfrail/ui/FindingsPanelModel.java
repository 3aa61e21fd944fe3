package halfrail.ui;

import halfrail.check.Finding;
import halfrail.check.LadderLevel;
import halfrail.check.Severity;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.SimpleObjectProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

import java.util.List;

/** The view-model of the findings list: the latest findings, most serious first, and the selected one. */
public final class FindingsPanelModel {
    private final ObservableList<Finding> items = FXCollections.observableArrayList();
    /** Read-only view kept as a field: list listeners hold it only weakly. */
    private final ObservableList<Finding> itemsView = FXCollections.unmodifiableObservableList(items);
    private final ObjectProperty<Finding> selected = new SimpleObjectProperty<>(this, "selected");
    private final ReadOnlyStringWrapper tally = new ReadOnlyStringWrapper(this, "tally", "");

    void show(List<Finding> findings) {
        Finding was = selected.get();
        items.setAll(findings);
        // keep the selection on the same kind of finding about the same op-amp, when it is still there
        Finding again = was == null ? null : findings.stream()
                .filter(f -> f.code().equals(was.code()) && f.opAmp().equals(was.opAmp()))
                .findFirst().orElse(null);
        selected.set(again);
        long fail = findings.stream().filter(f -> f.severity() == Severity.FAIL).count();
        long warn = findings.stream().filter(f -> f.severity() == Severity.WARN).count();
        long note = findings.size() - fail - warn;
        tally.set(findings.isEmpty() ? "nothing to report"
                : fail + " failing · " + warn + " warning · " + note + " note");
    }

    /** Select the first finding about {@code level} of {@code opAmp}, or the first about {@code opAmp}. */
    void selectFirst(String opAmp, LadderLevel level) {
        Finding exact = items.stream()
                .filter(f -> f.opAmp().filter(opAmp::equals).isPresent() && f.level().filter(level::equals).isPresent())
                .findFirst().orElse(null);
        if (exact != null) {
            selected.set(exact);
        }
    }

    /** Select the most serious finding about the design part at {@code path} (findings are sorted most serious first). */
    void selectFirstAbout(String path) {
        items.stream().filter(f -> f.parts().stream().anyMatch(p -> EditorPanelModel.concerns(p, path) || EditorPanelModel.concerns(path, p)))
                .findFirst().ifPresent(selected::set);
    }

    public ObservableList<Finding> items() {
        return itemsView;
    }

    /** The finding the user selected (null for none). */
    public ObjectProperty<Finding> selectedProperty() {
        return selected;
    }

    /** How many findings of each severity, in words. */
    public ReadOnlyStringProperty tallyProperty() {
        return tally.getReadOnlyProperty();
    }
}
