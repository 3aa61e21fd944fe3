package halfrail.ui;

import halfrail.convert.ChainFigures;
import halfrail.convert.Change;
import halfrail.convert.Conflict;
import halfrail.convert.ConversionLimits;
import halfrail.convert.ConversionRequest;
import halfrail.convert.ConversionResult;
import halfrail.convert.Converter;
import halfrail.convert.DualRailChain;
import halfrail.convert.DualRailStage;
import halfrail.convert.SupplyPoint;
import halfrail.design.AmplitudeUnit;
import halfrail.design.CellPack;
import halfrail.design.FixedRail;
import halfrail.design.OpAmpChoice;
import halfrail.design.SignalSource;
import halfrail.design.StageKind;
import halfrail.design.Supply;
import halfrail.parts.CellChemistry;
import halfrail.parts.OpAmpArchetype;
import halfrail.parts.PartsLibrary;
import halfrail.units.EngineeringValue;
import halfrail.units.Unit;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;
import javafx.beans.property.ReadOnlyObjectProperty;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.OptionalDouble;
import java.util.function.Consumer;

/**
 * The view-model of the conversion assistant: the fields of a dual-rail stage and of the single
 * supply it is to run from, as text typed in engineering notation; {@link #convert()} builds the
 * request, hands {@link Converter#convert} to the executor and keeps the result (the design, the
 * before/after comparison, the changes and the conflicts) until {@link #openResult()} opens the
 * design as a new unsaved one. A value that cannot be read is refused with the field's name and
 * never reaches the converter.
 */
public final class ConversionModel {
    /** How the new single supply is given. */
    public enum SupplyKind { CELLS, FIXED_RAIL }

    /** One figure of the before/after comparison. @param before the dual-rail original's @param after the conversion's */
    public record Row(String figure, String before, String after) {}

    private final AnalysisExecutor executor;
    private final PartsLibrary parts = PartsLibrary.builtIn();
    private Consumer<ConversionResult> opener = r -> { };

    private final StringProperty name = new SimpleStringProperty(this, "name", "converted stage");
    private final ObjectProperty<StageKind> kind = new SimpleObjectProperty<>(this, "kind", StageKind.NON_INVERTING);
    private final StringProperty r1 = new SimpleStringProperty(this, "r1", "10k");
    private final StringProperty r2 = new SimpleStringProperty(this, "r2", "100k");
    private final ObjectProperty<String> opAmp = new SimpleObjectProperty<>(this, "opAmp");
    private final StringProperty positiveRail = new SimpleStringProperty(this, "positiveRail", "15");
    private final StringProperty negativeRail = new SimpleStringProperty(this, "negativeRail", "15");
    private final ObjectProperty<SupplyKind> supplyKind = new SimpleObjectProperty<>(this, "supplyKind", SupplyKind.CELLS);
    private final ObjectProperty<String> chemistry = new SimpleObjectProperty<>(this, "chemistry", "alkaline-9v-block");
    private final StringProperty cells = new SimpleStringProperty(this, "cells", "1");
    private final StringProperty railVolts = new SimpleStringProperty(this, "railVolts", "5");
    private final StringProperty bandLow = new SimpleStringProperty(this, "bandLow", "20");
    private final StringProperty bandHigh = new SimpleStringProperty(this, "bandHigh", "20k");
    private final StringProperty signal = new SimpleStringProperty(this, "signal", "100m");
    private final StringProperty sourceOhms = new SimpleStringProperty(this, "sourceOhms", "1k");
    private final StringProperty loadOhms = new SimpleStringProperty(this, "loadOhms", "10k");
    private final StringProperty maxSettle = new SimpleStringProperty(this, "maxSettle", "");
    private final StringProperty maxCurrent = new SimpleStringProperty(this, "maxCurrent", "");
    private final StringProperty minRuntime = new SimpleStringProperty(this, "minRuntime", "");

    private final ReadOnlyObjectWrapper<ConversionResult> result = new ReadOnlyObjectWrapper<>(this, "result");
    private final ReadOnlyStringWrapper message = new ReadOnlyStringWrapper(this, "message",
            "Describe the dual-rail stage and the supply it should run from, then convert.");
    private final ReadOnlyBooleanWrapper running = new ReadOnlyBooleanWrapper(this, "running");
    private long generation;

    ConversionModel(AnalysisExecutor executor) {
        this.executor = Objects.requireNonNull(executor, "executor");
        opAmp.set(parts.opAmpArchetypes().get(0).id());
    }

    /** Op-amp archetypes to choose from, by id. */
    public List<OpAmpArchetype> opAmps() {
        return parts.opAmpArchetypes();
    }

    /** Cell chemistries to choose from, by id. */
    public List<CellChemistry> chemistries() {
        return parts.cellChemistries();
    }

    /** A field's text could not be read. */
    static final class FieldException extends RuntimeException {
        private static final long serialVersionUID = 1L;

        FieldException(String field, String why) {
            super(field + ": " + why);
        }
    }

    private static double value(String field, StringProperty text, Unit unit) {
        try {
            return EngineeringValue.parse(text.get().trim(), unit);
        } catch (IllegalArgumentException e) {
            throw new FieldException(field, e.getMessage());
        }
    }

    private static OptionalDouble optional(String field, StringProperty text, Unit unit) {
        return text.get() == null || text.get().isBlank() ? OptionalDouble.empty() : OptionalDouble.of(value(field, text, unit));
    }

    /** The request the fields describe. @throws RuntimeException naming the field when one cannot be read or is refused */
    public ConversionRequest request() {
        DualRailStage stage = new DualRailStage("stage1", kind.get(), value("R1", r1, Unit.OHM), value("R2", r2, Unit.OHM),
                OpAmpChoice.archetype(opAmp.get()));
        DualRailChain chain = new DualRailChain(List.of(stage), value("+ rail", positiveRail, Unit.VOLT),
                value("− rail", negativeRail, Unit.VOLT));
        Supply supply;
        if (supplyKind.get() == SupplyKind.CELLS) {
            int n;
            try {
                n = Integer.parseInt(cells.get().trim());
            } catch (NumberFormatException e) {
                throw new FieldException("cells in series", "a whole number, got '" + cells.get() + "'");
            }
            supply = new CellPack(chemistry.get(), n);
        } else {
            supply = new FixedRail(value("rail", railVolts, Unit.VOLT), 0.05, 0, 100, 0.1);
        }
        SignalSource source = new SignalSource(value("signal", signal, Unit.VOLT), AmplitudeUnit.VOLTS_PEAK,
                value("source resistance", sourceOhms, Unit.OHM), value("band low", bandLow, Unit.HERTZ),
                value("band high", bandHigh, Unit.HERTZ));
        ConversionLimits limits = ConversionLimits.none();
        OptionalDouble s = optional("settle-up limit", maxSettle, Unit.SECOND);
        if (s.isPresent()) {
            limits = limits.withMaxSettleSeconds(s.getAsDouble());
        }
        OptionalDouble a = optional("current limit", maxCurrent, Unit.AMPERE);
        if (a.isPresent()) {
            limits = limits.withMaxSupplyAmps(a.getAsDouble());
        }
        OptionalDouble h = optional("runtime wanted", minRuntime, Unit.NONE);
        if (h.isPresent()) {
            limits = limits.withMinRuntimeHours(h.getAsDouble());
        }
        return new ConversionRequest(name.get(), chain, supply, source, value("load", loadOhms, Unit.OHM), 0, limits);
    }

    /** Convert in the background; the result (or the reason it was refused) arrives in {@link #resultProperty()} / {@link #messageProperty()}. */
    public void convert() {
        ConversionRequest req;
        try {
            req = request();
        } catch (RuntimeException e) {
            result.set(null);
            message.set("Not converted — " + e.getMessage());
            return;
        }
        long mine = ++generation;
        running.set(true);
        message.set("Converting…");
        executor.submit(() -> Converter.convert(req), r -> {
            if (mine == generation) {
                running.set(false);
                result.set(r);
                message.set(String.format(Locale.ROOT, "Converted: %d change%s, %d conflict%s.", r.changes().size(),
                        r.changes().size() == 1 ? "" : "s", r.conflicts().size(), r.conflicts().size() == 1 ? "" : "s"));
            }
        }, e -> {
            if (mine == generation) {
                running.set(false);
                result.set(null);
                message.set("Not converted — " + e.getMessage());
            }
        });
    }

    /** Open the converted design as a new, unsaved design; false when there is none. */
    public boolean openResult() {
        ConversionResult r = result.get();
        if (r == null) {
            return false;
        }
        opener.accept(r);
        return true;
    }

    void setOpener(Consumer<ConversionResult> c) {
        this.opener = Objects.requireNonNull(c);
    }

    /** The before/after comparison of the latest result as rows. */
    public List<Row> comparison() {
        ConversionResult r = result.get();
        List<Row> rows = new ArrayList<>();
        if (r == null) {
            return rows;
        }
        ChainFigures b = r.comparison().before();
        ChainFigures a = r.comparison().after();
        rows.add(new Row("gain in the band", String.format(Locale.ROOT, "%.3g", b.gain()), String.format(Locale.ROOT, "%.3g", a.gain())));
        for (SupplyPoint p : a.points()) {
            SupplyPoint before = b.points().isEmpty() ? null : b.points().get(0);
            rows.add(new Row("headroom, " + p.label() + String.format(Locale.ROOT, " (%.2f V)", p.supplyVolts()),
                    before == null ? "—" : String.format(Locale.ROOT, "%.1f dB", before.headroomDb()),
                    String.format(Locale.ROOT, "%.1f dB", p.headroomDb())));
            rows.add(new Row("swing, " + p.label(), before == null ? "—" : volts(before.symmetricSwingVolts()), volts(p.symmetricSwingVolts())));
        }
        rows.add(new Row("supply current", DecadeAxis.engineering(b.supplyAmps(), "A"), DecadeAxis.engineering(a.supplyAmps(), "A")));
        rows.add(new Row("lower corner", hz(b.lowerCornerHz()), hz(a.lowerCornerHz())));
        rows.add(new Row("settle-up", b.settleSeconds().isPresent() ? DecadeAxis.engineering(b.settleSeconds().getAsDouble(), "s") : "—",
                a.settleSeconds().isPresent() ? DecadeAxis.engineering(a.settleSeconds().getAsDouble(), "s") : "not settled"));
        return rows;
    }

    private static String volts(double v) {
        return String.format(Locale.ROOT, "±%.2f V", v);
    }

    private static String hz(OptionalDouble f) {
        return f.isPresent() ? DecadeAxis.engineering(f.getAsDouble(), "Hz") : "passes DC";
    }

    /** The latest result's changes, one line each. */
    public List<String> changes() {
        ConversionResult r = result.get();
        List<String> out = new ArrayList<>();
        if (r != null) {
            for (Change c : r.changes()) {
                out.add(c.designPath() + ": " + c.before() + " → " + c.after() + " — " + c.reason());
            }
        }
        return out;
    }

    /** The latest result's conflicts, one line each (empty when every limit was met). */
    public List<String> conflicts() {
        ConversionResult r = result.get();
        List<String> out = new ArrayList<>();
        if (r != null) {
            for (Conflict c : r.conflicts()) {
                out.add(c.winner() + " wins over " + c.loser() + " — " + c.explanation());
            }
        }
        return out;
    }

    public StringProperty nameProperty() { return name; }
    public ObjectProperty<StageKind> kindProperty() { return kind; }
    public StringProperty r1Property() { return r1; }
    public StringProperty r2Property() { return r2; }
    public ObjectProperty<String> opAmpProperty() { return opAmp; }
    public StringProperty positiveRailProperty() { return positiveRail; }
    public StringProperty negativeRailProperty() { return negativeRail; }
    public ObjectProperty<SupplyKind> supplyKindProperty() { return supplyKind; }
    public ObjectProperty<String> chemistryProperty() { return chemistry; }
    public StringProperty cellsProperty() { return cells; }
    public StringProperty railVoltsProperty() { return railVolts; }
    public StringProperty bandLowProperty() { return bandLow; }
    public StringProperty bandHighProperty() { return bandHigh; }
    public StringProperty signalProperty() { return signal; }
    public StringProperty sourceOhmsProperty() { return sourceOhms; }
    public StringProperty loadOhmsProperty() { return loadOhms; }
    /** Settle-up limit, s (blank: none). */
    public StringProperty maxSettleProperty() { return maxSettle; }
    /** Supply current limit, A (blank: none). */
    public StringProperty maxCurrentProperty() { return maxCurrent; }
    /** Runtime wanted, h (blank: none; cells only). */
    public StringProperty minRuntimeProperty() { return minRuntime; }
    public ReadOnlyObjectProperty<ConversionResult> resultProperty() { return result.getReadOnlyProperty(); }
    public ReadOnlyStringProperty messageProperty() { return message.getReadOnlyProperty(); }
    public ReadOnlyBooleanProperty runningProperty() { return running.getReadOnlyProperty(); }
}
