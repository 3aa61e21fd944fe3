package halfrail.ui;

import halfrail.check.DesignReport;
import halfrail.check.Finding;
import halfrail.check.Severity;
import halfrail.check.StageReport;
import halfrail.design.Design;
import halfrail.design.Reference;
import halfrail.design.ReferenceKind;
import halfrail.design.SignalSource;
import halfrail.design.Stage;
import halfrail.units.EngineeringValue;
import halfrail.units.Unit;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.function.Consumer;

/**
 * The view-model of the chain drawing: a block per part of the design (source, reference, each
 * stage, load) with its DC voltages from the latest analysis, the worst finding about it, and
 * which blocks the selected finding concerns.
 */
public final class ChainPanelModel {
    /** What a block stands for. */
    public enum Kind { SOURCE, REFERENCE, STAGE, LOAD }

    /**
     * One block of the drawing.
     *
     * @param path  the design path it stands for ({@code source}, {@code reference}, {@code stages[1]}, {@code load})
     * @param lines the text under the title: what it is and its DC voltages
     * @param worst the most serious finding about it, if any
     */
    public record Block(Kind kind, String path, String title, List<String> lines, Optional<Severity> worst) {
        public Block {
            lines = List.copyOf(lines);
        }
    }

    private final ObservableList<Block> blocks = FXCollections.observableArrayList();
    /** Read-only view kept as a field: list listeners hold it only weakly. */
    private final ObservableList<Block> blocksView = FXCollections.unmodifiableObservableList(blocks);
    private final ObjectProperty<List<String>> spotlit = new SimpleObjectProperty<>(this, "spotlit", List.of());
    private Consumer<String> picker = p -> { };

    void show(DesignReport r) {
        Design d = r.design();
        List<Block> list = new ArrayList<>();
        SignalSource s = d.source();
        list.add(new Block(Kind.SOURCE, "source", "Source", List.of(
                EngineeringValue.format(s.voltsPeak(), Unit.VOLT) + " peak",
                "from " + EngineeringValue.format(s.sourceOhms(), Unit.OHM),
                EngineeringValue.format(s.bandLowHz(), Unit.HERTZ) + " – " + EngineeringValue.format(s.bandHighHz(), Unit.HERTZ)),
                worst(r, "source")));
        Reference ref = d.reference();
        Optional<StageReport> buffer = r.stages().stream().filter(x -> !x.signal()).findFirst();
        List<String> refLines = new ArrayList<>();
        refLines.add(switch (ref.kind()) {
            case DIVIDER_DIRECT -> "divider straight into stage 1";
            case DIVIDER_DECOUPLED -> "divider " + ohms(ref.upperOhms()) + " / " + ohms(ref.lowerOhms()) + ", decoupled";
            case DIVIDER_BUFFERED -> "divider " + ohms(ref.upperOhms()) + " / " + ohms(ref.lowerOhms()) + ", buffered";
        });
        if (!r.ladders().isEmpty()) {
            refLines.add("mid-rail " + ReadingsPanelModel.v(r.ladders().get(0).midRailVolts())
                    + buffer.map(b -> " · buffer out " + ReadingsPanelModel.v(b.outputVolts())).orElse(""));
        }
        list.add(new Block(Kind.REFERENCE, "reference", ref.kind() == ReferenceKind.DIVIDER_BUFFERED
                ? "Mid-rail reference (buffered)" : "Mid-rail reference", refLines, worst(r, "reference")));
        for (int i = 0; i < d.stages().size(); i++) {
            Stage st = d.stages().get(i);
            String path = "stages[" + i + "]";
            Optional<StageReport> sr = r.stages().stream().filter(x -> x.signal() && x.designPath().equals(path)).findFirst();
            List<String> lines = new ArrayList<>();
            lines.add(kind(st) + String.format(Locale.ROOT, ", gain %.3g", Math.abs(st.nominalGain())));
            sr.ifPresentOrElse(x -> {
                lines.add("in+ " + ReadingsPanelModel.v(x.inPlusVolts()) + " · in− " + ReadingsPanelModel.v(x.inMinusVolts()));
                lines.add("out at rest " + ReadingsPanelModel.v(x.outputVolts()));
            }, () -> lines.add("not solved"));
            list.add(new Block(Kind.STAGE, path, (i + 1) + " · " + st.name(), lines, worst(r, path)));
        }
        var load = d.load();
        list.add(new Block(Kind.LOAD, "load", "Load", List.of(
                ohms(load.ohms()) + (load.farads() > 0 ? " ‖ " + EngineeringValue.format(load.farads(), Unit.FARAD) : ""),
                load.outputCapacitor() == null ? "DC-coupled"
                        : "through " + EngineeringValue.format(load.outputCapacitor().farads(), Unit.FARAD)),
                worst(r, "load")));
        blocks.setAll(list);
    }

    void clear() {
        blocks.clear();
    }

    void spotlight(List<String> partPaths) {
        spotlit.set(List.copyOf(partPaths));
    }

    void setPicker(Consumer<String> picker) {
        this.picker = picker;
    }

    /** The user pointed at the block for {@code path}: select the most serious finding about it. */
    public void pick(String path) {
        picker.accept(path);
    }

    /** Whether the selected finding concerns the block for {@code blockPath}. */
    public boolean isSpotlit(String blockPath) {
        return spotlit.get().stream().anyMatch(p -> EditorPanelModel.concerns(p, blockPath) || EditorPanelModel.concerns(blockPath, p));
    }

    private static Optional<Severity> worst(DesignReport r, String path) {
        return r.findings().stream()
                .filter(f -> f.parts().stream().anyMatch(p -> EditorPanelModel.concerns(p, path) || EditorPanelModel.concerns(path, p)))
                .map(Finding::severity).min(Comparator.naturalOrder());
    }

    private static String kind(Stage s) {
        return switch (s.kind()) {
            case NON_INVERTING -> "non-inverting";
            case INVERTING -> "inverting";
            case FOLLOWER -> "follower";
        };
    }

    private static String ohms(double ohms) {
        return EngineeringValue.format(ohms, Unit.OHM);
    }

    public ObservableList<Block> blocks() {
        return blocksView;
    }

    /** Design paths of the parts the selected finding concerns. */
    public ObjectProperty<List<String>> spotlitProperty() {
        return spotlit;
    }
}
