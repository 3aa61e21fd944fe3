package halfrail.ui;

import halfrail.check.DesignReport;
import halfrail.check.Finding;
import halfrail.check.Ladder;
import halfrail.check.LadderLevel;
import halfrail.check.Severity;
import halfrail.check.StageReport;
import javafx.beans.property.ReadOnlyObjectProperty;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.BiConsumer;

/**
 * The view-model of the ladder panel: one {@link Rung} per op-amp of the latest analysis, all on
 * one voltage scale, and the level a selected finding points at.
 */
public final class LadderPanelModel {
    /** Head-room above the highest supply left at the top of the shared scale (fraction of it). */
    static final double SCALE_MARGIN = 0.06;

    /** A finding's place on the ladders: which op-amp, and which level (null: the op-amp as a whole). */
    public record Focus(String opAmp, LadderLevel level) {}

    /**
     * One op-amp's ladder with what the panel draws beside it.
     *
     * @param ladder            the ladder from the analysis
     * @param stage             the op-amp's readings, when the analysis has them
     * @param worst             the most serious finding about this op-amp, if any
     * @param scaleTopVolts     top of the shared scale, V
     * @param endPointSupplyVolts the design supply's end-point, V
     * @param flagged           the levels findings point at, with the most serious severity at each
     */
    public record Rung(Ladder ladder, Optional<StageReport> stage, Optional<Severity> worst, double scaleTopVolts,
                       double endPointSupplyVolts, Map<LadderLevel, Severity> flagged) {
        public Rung {
            flagged = Map.copyOf(flagged);
        }
    }

    private final ObservableList<Rung> rungs = FXCollections.observableArrayList();
    /** Read-only view kept as a field: list listeners hold it only weakly. */
    private final ObservableList<Rung> rungsView = FXCollections.unmodifiableObservableList(rungs);
    private final ReadOnlyObjectWrapper<Focus> focus = new ReadOnlyObjectWrapper<>(this, "focus");
    private BiConsumer<String, LadderLevel> levelPicker = (a, b) -> { };

    void show(DesignReport report, double highestSupplyVolts, double endPointSupplyVolts) {
        show(report, report.ladders(), highestSupplyVolts, endPointSupplyVolts);
    }

    /** Show {@code ladders} (the report's, possibly with a tolerance spread filled in) with the report's findings. */
    void show(DesignReport report, List<Ladder> ladders, double highestSupplyVolts, double endPointSupplyVolts) {
        double top = highestSupplyVolts;
        for (Ladder l : ladders) {
            top = Math.max(top, l.supplyVolts());
        }
        top *= 1 + SCALE_MARGIN;
        List<Rung> list = new ArrayList<>();
        for (Ladder l : ladders) {
            Optional<Severity> worst = report.findings().stream()
                    .filter(f -> f.opAmp().filter(l.opAmp()::equals).isPresent())
                    .map(Finding::severity).min(Comparator.naturalOrder());
            Map<LadderLevel, Severity> flagged = new EnumMap<>(LadderLevel.class);
            for (Finding f : report.findings()) {
                if (f.opAmp().filter(l.opAmp()::equals).isPresent() && f.level().isPresent()) {
                    flagged.merge(f.level().get(), f.severity(), (a, b) -> a.atLeast(b) ? a : b);
                }
            }
            list.add(new Rung(l, report.stage(l.opAmp()), worst, top, endPointSupplyVolts, flagged));
        }
        rungs.setAll(list);
    }

    void clear() {
        rungs.clear();
    }

    void highlight(Focus f) {
        focus.set(f);
    }

    void setLevelPicker(BiConsumer<String, LadderLevel> picker) {
        this.levelPicker = picker;
    }

    /** The user pointed at {@code level} of {@code opAmp}'s ladder: select the finding about it, if any. */
    public void pick(String opAmp, LadderLevel level) {
        levelPicker.accept(opAmp, level);
    }

    public ObservableList<Rung> rungs() {
        return rungsView;
    }

    public ReadOnlyObjectProperty<Focus> focusProperty() {
        return focus.getReadOnlyProperty();
    }
}
