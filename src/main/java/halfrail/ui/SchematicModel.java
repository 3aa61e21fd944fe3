package halfrail.ui;

import halfrail.check.DesignReport;
import halfrail.design.DesignCircuit;
import halfrail.design.DesignCircuits;
import halfrail.design.DesignException;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.ReadOnlyObjectProperty;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.SimpleObjectProperty;

import java.util.List;
import java.util.function.Consumer;

/**
 * The view-model of the circuit drawing: the layout of the analysed design's circuit with each
 * node's DC voltage, and which parts the selected finding concerns.
 */
public final class SchematicModel {
    private final ReadOnlyObjectWrapper<SchematicGeometry> geometry = new ReadOnlyObjectWrapper<>(this, "geometry");
    private final ReadOnlyStringWrapper caption = new ReadOnlyStringWrapper(this, "caption", "");
    private final ObjectProperty<List<String>> spotlit = new SimpleObjectProperty<>(this, "spotlit", List.of());
    private Consumer<String> picker = p -> { };

    /** Lay out the circuit of the analysed design with the report's node voltages. */
    void show(DesignReport r) {
        DesignCircuit dc;
        try {
            dc = DesignCircuits.nominal(r.design());
        } catch (DesignException e) {
            clear("The circuit cannot be drawn: " + e.getMessage());
            return;
        }
        geometry.set(new SchematicGeometry(r.design(), dc, r.nodeVolts(), r.floatingNodes()));
        caption.set(String.format(java.util.Locale.ROOT,
                "DC voltage of every node at %.2f V supply, typical leakage; op-amps are powered from vcc and ground (pins not drawn)",
                dc.supplyVolts()));
    }

    void clear(String why) {
        geometry.set(null);
        caption.set(why);
    }

    void spotlight(List<String> partPaths) {
        spotlit.set(List.copyOf(partPaths));
    }

    void setPicker(Consumer<String> picker) {
        this.picker = picker;
    }

    /** The user clicked the part with design path {@code path}: select the most serious finding about it. */
    public void pick(String path) {
        picker.accept(path);
    }

    /** Whether the selected finding concerns the part with design path {@code partPath}. */
    public boolean isSpotlit(String partPath) {
        return !partPath.isEmpty() && spotlit.get().stream()
                .anyMatch(p -> EditorPanelModel.concerns(partPath, p) || EditorPanelModel.concerns(p, partPath));
    }

    /** The drawing; null when the design could not be drawn (see {@link #captionProperty()}). */
    public ReadOnlyObjectProperty<SchematicGeometry> geometryProperty() {
        return geometry.getReadOnlyProperty();
    }

    /** One line under the drawing: at what supply the voltages hold, or why nothing is drawn. */
    public ReadOnlyStringProperty captionProperty() {
        return caption.getReadOnlyProperty();
    }

    /** Design paths of the parts the selected finding concerns. */
    public ObjectProperty<List<String>> spotlitProperty() {
        return spotlit;
    }
}
