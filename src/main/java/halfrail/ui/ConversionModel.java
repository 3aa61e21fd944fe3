package halfrail.ui;

import halfrail.circuit.CircuitException;
import halfrail.circuit.OpAmpParams;
import halfrail.convert.ChainFigures;
import halfrail.convert.Change;
import halfrail.convert.ChangeKind;
import halfrail.convert.Conflict;
import halfrail.convert.ConversionException;
import halfrail.convert.ConversionLimits;
import halfrail.convert.ConversionRequest;
import halfrail.convert.ConversionResult;
import halfrail.convert.Converter;
import halfrail.convert.DualRailChain;
import halfrail.convert.DualRailStage;
import halfrail.convert.LimitPriority;
import halfrail.convert.SupplyPoint;
import halfrail.convert.TradeOffPoint;
import halfrail.design.AmplitudeUnit;
import halfrail.design.CellPack;
import halfrail.design.DesignException;
import halfrail.design.FixedRail;
import halfrail.design.OpAmpChoice;
import halfrail.design.SignalSource;
import halfrail.design.StageKind;
import halfrail.design.Supply;
import halfrail.design.UsbPort;
import halfrail.parts.CellChemistry;
import halfrail.parts.OpAmpArchetype;
import halfrail.parts.PartsLibrary;
import halfrail.units.EngineeringValue;
import halfrail.units.Quantities;
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
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;
import java.util.function.Consumer;
import java.util.function.DoubleFunction;
import java.util.function.ToDoubleFunction;

/**
 * The view-model of the conversion assistant. It holds, as text typed in engineering notation,
 * the dual-rail original — a chain of stages (kind, R1, R2, an op-amp archetype or a custom
 * part's figures) on ± rails — the new single supply (cells of a chemistry, a fixed rail or a
 * USB port), the signal, band and load, and the optional limits with the one that wins when the
 * band and the settle-up limit conflict.
 *
 * <p>Every field checks its text as it is typed, as the design editor does: first as an
 * engineering value in its unit, then against its range and the fields it depends on (the
 * band's top above its low end, a runtime only for cells, stage names unique); the reason is
 * kept in the field's {@link Entry#problemProperty()}. {@link #convert()} refuses while any
 * field has a problem, naming the first; otherwise it builds the request, hands
 * {@link Converter#convert} to the executor (never the FX thread) and keeps the result until
 * {@link #openResult()} hands the design to the workbench as a new unsaved design.
 */
public final class ConversionModel {
    /** How the new single supply is given. */
    public enum SupplyKind { CELLS, FIXED_RAIL, USB_PORT }

    /** The op-amp choice that stands for "a custom part with its own figures". */
    public static final String CUSTOM = "";
    /** Ripple frequency given to a USB port when its ripple is set but its frequency left blank, Hz (a starting value). */
    static final double USB_RIPPLE_HZ = 1e3;

    /** One figure of the before/after comparison. @param before the dual-rail original's @param after the conversion's */
    public record Row(String figure, String before, String after) {}

    /**
     * One conflict between limits, in words.
     *
     * @param winner      the requirement that was met
     * @param loser       the one that was missed
     * @param missedBy    by how much, with its unit
     * @param statement   the one-line statement: which won, which is missed and by how much
     * @param explanation the converter's numbers and rule
     */
    public record ConflictLine(String winner, String loser, String missedBy, String statement, String explanation) {}

    /** One change of the conversion. @param what the kind in words @param where the design path ("design" for the whole) */
    public record ChangeLine(String what, String where, String before, String after, String why) {
        /** The change on one line, as a list shows it. */
        public String line() {
            return what + " — " + where + ": " + before + " → " + after;
        }
    }

    /**
     * A typed value with the reason it is refused. Its own check (unit and range) runs on every
     * keystroke; a check across fields sets {@link #crossProblem}.
     */
    public static final class Entry {
        private final String label;
        private final Unit unit;
        private final boolean optional;
        private final DoubleFunction<String> range;
        private final ToDoubleFunction<String> reader;
        private final StringProperty text;
        private final ReadOnlyStringWrapper problem = new ReadOnlyStringWrapper(this, "problem", "");
        private String own = "";
        private String cross = "";

        /**
         * @param unit     the value's unit, or null for plain text (a name)
         * @param optional whether a blank field means "none"
         * @param range    the reason a readable value is refused, or "" when it is fine
         */
        Entry(String label, Unit unit, boolean optional, String initial, DoubleFunction<String> range) {
            this(label, unit, optional, initial, range, t -> EngineeringValue.parse(t, unit));
        }

        /** @param reader reads a trimmed, non-blank text as a value in SI units, or throws IllegalArgumentException */
        Entry(String label, Unit unit, boolean optional, String initial, DoubleFunction<String> range,
              ToDoubleFunction<String> reader) {
            this.label = label;
            this.unit = unit;
            this.optional = optional;
            this.range = range;
            this.reader = reader;
            this.text = new SimpleStringProperty(this, "text", initial);
            text.addListener((o, was, now) -> check());
            check();
        }

        private void check() {
            String t = text.get() == null ? "" : text.get().trim();
            String reason = "";
            if (t.isEmpty()) {
                reason = optional ? "" : "is required";
            } else if (unit != null) {
                try {
                    reason = range.apply(parse(t));
                } catch (IllegalArgumentException e) {
                    reason = e.getMessage();
                }
            }
            own = reason;
            show();
        }

        /** The value of a trimmed text in SI units (a custom figure also reads "no limit"). */
        double parse(String t) {
            return reader.applyAsDouble(t);
        }

        void crossProblem(String reason) {
            cross = reason == null ? "" : reason;
            show();
        }

        private void show() {
            problem.set(!own.isEmpty() ? own : cross);
        }

        /** The value, or empty for a blank optional field. @throws FieldException when refused */
        OptionalDouble value() {
            if (!problem.get().isEmpty()) {
                throw new FieldException(label, problem.get());
            }
            String t = text.get() == null ? "" : text.get().trim();
            return t.isEmpty() ? OptionalDouble.empty() : OptionalDouble.of(parse(t));
        }

        double required() {
            return value().orElseThrow(() -> new FieldException(label, "is required"));
        }

        /** Whether the readable value passes its own check (cross-field checks aside). */
        boolean readable() {
            return own.isEmpty();
        }

        public String label() {
            return label;
        }

        /** The unit symbol the field is typed in (empty for a bare number or text). */
        public String unitSymbol() {
            return unit == null ? "" : unit.symbol();
        }

        public StringProperty textProperty() {
            return text;
        }

        /** Why the text is refused; empty when it is accepted. */
        public ReadOnlyStringProperty problemProperty() {
            return problem.getReadOnlyProperty();
        }
    }

    /** A custom op-amp figure: reads "no limit" for the highest supply and V/µs for the slew rate. */
    private static Entry figure(int i, String initial) {
        return new Entry(OpAmpFigures.LABELS[i], OpAmpFigures.UNITS[i], false, initial, v -> "",
                t -> OpAmpFigures.value(i, t));
    }

    /** One stage of the dual-rail original as typed. */
    public final class StageEntry {
        private final Entry name;
        private final ObjectProperty<StageKind> kind = new SimpleObjectProperty<>(this, "kind", StageKind.NON_INVERTING);
        private final Entry r1;
        private final Entry r2;
        private final ObjectProperty<String> opAmp = new SimpleObjectProperty<>(this, "opAmp");
        private final List<Entry> custom = new ArrayList<>();
        private final ReadOnlyStringWrapper opAmpProblem = new ReadOnlyStringWrapper(this, "opAmpProblem", "");

        StageEntry(String stageName, StageKind k, String r1Text, String r2Text, String opAmpId) {
            name = new Entry("name", null, false, stageName, v -> "");
            r1 = new Entry("R1", Unit.OHM, false, r1Text, ConversionModel::positive);
            r2 = new Entry("R2", Unit.OHM, false, r2Text, ConversionModel::positive);
            kind.set(k);
            OpAmpParams start = parts.requireOpAmpArchetype(parts.opAmpArchetypes().get(0).id()).typical();
            double[] figures = OpAmpFigures.of(start);
            for (int i = 0; i < figures.length; i++) {
                Entry e = figure(i, OpAmpFigures.text(i, figures[i]));
                e.textProperty().addListener((o, was, now) -> checkCustom());
                custom.add(e);
            }
            opAmp.addListener((o, was, now) -> {
                if (CUSTOM.equals(now) && was != null && !CUSTOM.equals(was)) {
                    fillCustom(parts.requireOpAmpArchetype(was).typical());
                }
                checkCustom();
            });
            opAmp.set(opAmpId);
            name.textProperty().addListener((o, was, now) -> checkNames());
        }

        /** Put {@code p}'s figures into the custom fields. */
        void fillCustom(OpAmpParams p) {
            double[] f = OpAmpFigures.of(p);
            for (int i = 0; i < f.length; i++) {
                custom.get(i).textProperty().set(OpAmpFigures.text(i, f[i]));
            }
        }

        private void checkCustom() {
            String reason = "";
            if (CUSTOM.equals(opAmp.get())) {
                try {
                    customParams();
                } catch (FieldException e) {
                    reason = "";
                } catch (CircuitException e) {
                    reason = e.getMessage();
                    for (int i = 0; i < OpAmpFigures.FIELDS.length; i++) {
                        if (OpAmpFigures.FIELDS[i].equals(e.field())) {
                            reason = OpAmpFigures.LABELS[i] + ": " + e.getMessage();
                        }
                    }
                }
            }
            opAmpProblem.set(reason);
        }

        private OpAmpParams customParams() {
            double[] v = new double[custom.size()];
            for (int i = 0; i < v.length; i++) {
                v[i] = custom.get(i).required();
            }
            return OpAmpFigures.params(v);
        }

        /** The first problem of this stage's fields, with the field's label; empty when there is none. */
        Optional<String> problem() {
            List<Entry> fields = new ArrayList<>(List.of(name));
            if (kind.get() != StageKind.FOLLOWER) {
                fields.add(r1);
                fields.add(r2);
            }
            if (CUSTOM.equals(opAmp.get())) {
                fields.addAll(custom);
            }
            for (Entry e : fields) {
                if (!e.problemProperty().get().isEmpty()) {
                    return Optional.of(e.label() + ": " + e.problemProperty().get());
                }
            }
            return opAmpProblem.get().isEmpty() ? Optional.empty() : Optional.of("op-amp: " + opAmpProblem.get());
        }

        DualRailStage stage() {
            OpAmpChoice choice = CUSTOM.equals(opAmp.get()) ? OpAmpChoice.custom(customParams())
                    : OpAmpChoice.archetype(opAmp.get());
            boolean follower = kind.get() == StageKind.FOLLOWER;
            return new DualRailStage(name.textProperty().get().trim(), kind.get(), follower ? 0 : r1.required(),
                    follower ? 0 : r2.required(), choice);
        }

        public Entry name() { return name; }
        public ObjectProperty<StageKind> kindProperty() { return kind; }
        public Entry r1() { return r1; }
        public Entry r2() { return r2; }
        /** An archetype id, or {@link #CUSTOM} for a part given by its figures. */
        public ObjectProperty<String> opAmpProperty() { return opAmp; }
        /** The custom part's figures, in the order of {@link OpAmpFigures#LABELS}. */
        public List<Entry> custom() { return Collections.unmodifiableList(custom); }
        /** Why the custom figures do not make a part (empty when they do, or for an archetype). */
        public ReadOnlyStringProperty opAmpProblemProperty() { return opAmpProblem.getReadOnlyProperty(); }
    }

    /** A field's text could not be read or is refused. */
    static final class FieldException extends RuntimeException {
        private static final long serialVersionUID = 1L;

        FieldException(String field, String why) {
            super(field + ": " + why);
        }
    }

    private final AnalysisExecutor executor;
    private final PartsLibrary parts = PartsLibrary.builtIn();
    private Consumer<ConversionResult> opener = r -> { };

    private final Entry name = new Entry("design title", null, false, "converted chain", v -> "");
    private final ObservableList<StageEntry> stages = FXCollections.observableArrayList();
    private final ObservableList<StageEntry> stagesView = FXCollections.unmodifiableObservableList(stages);
    private final Entry positiveRail = new Entry("+ rail", Unit.VOLT, false, "15", ConversionModel::positive);
    private final Entry negativeRail = new Entry("− rail", Unit.VOLT, false, "15", ConversionModel::positive);
    private final ObjectProperty<SupplyKind> supplyKind = new SimpleObjectProperty<>(this, "supplyKind", SupplyKind.CELLS);
    private final ObjectProperty<String> chemistry = new SimpleObjectProperty<>(this, "chemistry", CellChemistry.ALKALINE_9V_BLOCK);
    private final Entry cells = new Entry("cells in series", Unit.NONE, false, "1", ConversionModel::wholeCells);
    private final Entry railVolts = new Entry("fixed rail", Unit.VOLT, false, "5", ConversionModel::positive);
    private final Entry railTolerance = new Entry("tolerance", Unit.NONE, false, "5",
            v -> v >= 0 && v < 100 ? "" : "must lie from 0 to below 100 %, got " + v);
    private final Entry usbRipple = new Entry("ripple", Unit.VOLT, true, "", ConversionModel::nonNegative);
    private final Entry usbRippleHz = new Entry("ripple frequency", Unit.HERTZ, true, "", ConversionModel::positive);
    private final Entry signal = new Entry("signal", Unit.VOLT, false, "100m", ConversionModel::positive);
    private final Entry sourceOhms = new Entry("source resistance", Unit.OHM, false, "1k", ConversionModel::nonNegative);
    private final Entry bandLow = new Entry("band from", Unit.HERTZ, false, "20", ConversionModel::positive);
    private final Entry bandHigh = new Entry("band to", Unit.HERTZ, false, "20k", ConversionModel::positive);
    private final Entry loadOhms = new Entry("load", Unit.OHM, false, "10k", ConversionModel::positive);
    private final Entry maxSettle = new Entry("settle-up at most", Unit.SECOND, true, "", ConversionModel::positive);
    private final Entry maxCurrent = new Entry("supply current at most", Unit.AMPERE, true, "", ConversionModel::positive);
    private final Entry minRuntime = new Entry("runtime at least", Unit.NONE, true, "", ConversionModel::positive);
    private final ObjectProperty<LimitPriority> priority = new SimpleObjectProperty<>(this, "priority", LimitPriority.BAND);

    private final ReadOnlyStringWrapper supplySummary = new ReadOnlyStringWrapper(this, "supplySummary", "");
    private final ReadOnlyStringWrapper safetyNote = new ReadOnlyStringWrapper(this, "safetyNote", "");
    private final ReadOnlyObjectWrapper<ConversionResult> result = new ReadOnlyObjectWrapper<>(this, "result");
    private final ReadOnlyStringWrapper message = new ReadOnlyStringWrapper(this, "message",
            "Describe the dual-rail chain and the supply it should run from, then convert.");
    private final ReadOnlyBooleanWrapper running = new ReadOnlyBooleanWrapper(this, "running");
    private long generation;

    ConversionModel(AnalysisExecutor executor) {
        this.executor = Objects.requireNonNull(executor, "executor");
        stages.add(new StageEntry("stage 1", StageKind.NON_INVERTING, "10k", "100k", parts.opAmpArchetypes().get(0).id()));
        bandLow.textProperty().addListener((o, was, now) -> crossCheck());
        bandHigh.textProperty().addListener((o, was, now) -> crossCheck());
        minRuntime.textProperty().addListener((o, was, now) -> crossCheck());
        usbRipple.textProperty().addListener((o, was, now) -> crossCheck());
        usbRippleHz.textProperty().addListener((o, was, now) -> crossCheck());
        for (Entry e : List.of(cells, railVolts, railTolerance)) {
            e.textProperty().addListener((o, was, now) -> describeSupply());
        }
        supplyKind.addListener((o, was, now) -> {
            crossCheck();
            describeSupply();
        });
        chemistry.addListener((o, was, now) -> describeSupply());
        crossCheck();
        describeSupply();
    }

    // ---- choices -------------------------------------------------------------------------------

    /** Op-amp archetypes to choose from. */
    public List<OpAmpArchetype> opAmps() {
        return parts.opAmpArchetypes();
    }

    /** Cell chemistries to choose from. */
    public List<CellChemistry> chemistries() {
        return parts.cellChemistries();
    }

    // ---- the chain -----------------------------------------------------------------------------

    /** The stages of the original, in signal order. */
    public ObservableList<StageEntry> stages() {
        return stagesView;
    }

    /** Add a stage after the last, copying it under a new name; false when the chain is full ({@link DualRailChain#MAX_STAGES}). */
    public boolean addStage() {
        if (stages.size() >= DualRailChain.MAX_STAGES) {
            return false;
        }
        StageEntry last = stages.get(stages.size() - 1);
        StageEntry s = new StageEntry(freeName(), last.kind.get(), last.r1.textProperty().get(),
                last.r2.textProperty().get(), last.opAmp.get());
        if (CUSTOM.equals(last.opAmp.get())) {
            for (int i = 0; i < last.custom.size(); i++) {
                s.custom.get(i).textProperty().set(last.custom.get(i).textProperty().get());
            }
        }
        stages.add(s);
        checkNames();
        return true;
    }

    /** Remove stage {@code index}; false when it is the only one (a chain keeps at least one stage). */
    public boolean removeStage(int index) {
        if (stages.size() <= 1 || index < 0 || index >= stages.size()) {
            return false;
        }
        stages.remove(index);
        checkNames();
        return true;
    }

    /** Move stage {@code index} by {@code by} places (negative: towards the source); false when it cannot go there. */
    public boolean moveStage(int index, int by) {
        int to = index + by;
        if (index < 0 || index >= stages.size() || to < 0 || to >= stages.size() || by == 0) {
            return false;
        }
        List<StageEntry> list = new ArrayList<>(stages);
        Collections.swap(list, index, to);
        stages.setAll(list);
        return true;
    }

    private String freeName() {
        for (int i = stages.size() + 1; ; i++) {
            String n = "stage " + i;
            if (stages.stream().noneMatch(s -> s.name.textProperty().get().trim().equals(n))) {
                return n;
            }
        }
    }

    private void checkNames() {
        Set<String> seen = new HashSet<>();
        for (StageEntry s : stages) {
            String n = s.name.textProperty().get() == null ? "" : s.name.textProperty().get().trim();
            s.name.crossProblem(!n.isEmpty() && !seen.add(n) ? "'" + n + "' is used by another stage" : "");
        }
    }

    // ---- checks across fields ------------------------------------------------------------------

    private void crossCheck() {
        bandHigh.crossProblem("");
        if (bandLow.readable() && bandHigh.readable() && !blank(bandLow) && !blank(bandHigh)) {
            double lo = bandLow.parse(bandLow.textProperty().get().trim());
            double hi = bandHigh.parse(bandHigh.textProperty().get().trim());
            if (hi <= lo) {
                bandHigh.crossProblem("must lie above the band's low end, " + Quantities.hertz(lo));
            }
        }
        minRuntime.crossProblem(supplyKind.get() != SupplyKind.CELLS && !blank(minRuntime)
                ? "a runtime needs a supply with a capacity: choose cells, or leave it blank" : "");
        usbRippleHz.crossProblem("");
        if (usbRipple.readable() && !blank(usbRipple) && usbRipple.parse(usbRipple.textProperty().get().trim()) > 0
                && blank(usbRippleHz)) {
            usbRippleHz.crossProblem("is required with a ripple");
        }
    }

    private static boolean blank(Entry e) {
        return e.textProperty().get() == null || e.textProperty().get().isBlank();
    }

    private void describeSupply() {
        Supply s;
        try {
            s = supply();
        } catch (RuntimeException e) {
            supplySummary.set("");
            safetyNote.set(kindNote());
            return;
        }
        supplySummary.set(Quantities.volts(s.nominalVolts()) + " nominal, " + Quantities.volts(s.lowVolts())
                + " (end-point) to " + Quantities.volts(s.highVolts()) + " (fresh)");
        safetyNote.set(s.safetyNote());
    }

    /** The caution of the chosen supply kind when its values cannot be read yet. */
    private String kindNote() {
        return switch (supplyKind.get()) {
            case CELLS -> new CellPack(chemistry.get(), 1).safetyNote();
            case FIXED_RAIL -> new FixedRail(5, 0, 0, 0, 0).safetyNote();
            case USB_PORT -> new UsbPort(0, 0).safetyNote();
        };
    }

    // ---- the request ---------------------------------------------------------------------------

    /** The first field problem of the form, named; empty when every field is accepted. */
    public Optional<String> firstProblem() {
        checkNames();
        crossCheck();
        for (Entry e : List.of(name, positiveRail, negativeRail)) {
            if (!e.problemProperty().get().isEmpty()) {
                return Optional.of(e.label() + ": " + e.problemProperty().get());
            }
        }
        for (int i = 0; i < stages.size(); i++) {
            Optional<String> p = stages.get(i).problem();
            if (p.isPresent()) {
                return Optional.of("stage " + (i + 1) + ", " + p.get());
            }
        }
        for (Entry e : supplyEntries()) {
            if (!e.problemProperty().get().isEmpty()) {
                return Optional.of(e.label() + ": " + e.problemProperty().get());
            }
        }
        for (Entry e : List.of(signal, sourceOhms, bandLow, bandHigh, loadOhms, maxSettle, maxCurrent, minRuntime)) {
            if (!e.problemProperty().get().isEmpty()) {
                return Optional.of(e.label() + ": " + e.problemProperty().get());
            }
        }
        return Optional.empty();
    }

    private List<Entry> supplyEntries() {
        return switch (supplyKind.get()) {
            case CELLS -> List.of(cells);
            case FIXED_RAIL -> List.of(railVolts, railTolerance);
            case USB_PORT -> List.of(usbRipple, usbRippleHz);
        };
    }

    /** The new supply the fields describe. @throws RuntimeException naming the field when one is refused */
    Supply supply() {
        return switch (supplyKind.get()) {
            case CELLS -> {
                CellPack p = new CellPack(chemistry.get(), (int) cells.required());
                p.data();
                yield p;
            }
            case FIXED_RAIL -> new FixedRail(railVolts.required(), railTolerance.required() / 100, 0, 0, 0.1);
            case USB_PORT -> {
                double ripple = usbRipple.value().orElse(0);
                yield new UsbPort(ripple, ripple > 0 ? usbRippleHz.value().orElse(USB_RIPPLE_HZ) : 0);
            }
        };
    }

    /** The request the fields describe. @throws RuntimeException naming the field when one cannot be read or is refused */
    public ConversionRequest request() {
        Optional<String> problem = firstProblem();
        if (problem.isPresent()) {
            throw new IllegalArgumentException(problem.get());
        }
        List<DualRailStage> chain = new ArrayList<>();
        for (int i = 0; i < stages.size(); i++) {
            try {
                chain.add(stages.get(i).stage());
            } catch (ConversionException | DesignException | CircuitException e) {
                throw new IllegalArgumentException("stage " + (i + 1) + ", " + e.getMessage(), e);
            }
        }
        DualRailChain original = new DualRailChain(chain, positiveRail.required(), negativeRail.required());
        SignalSource source = new SignalSource(signal.required(), AmplitudeUnit.VOLTS_PEAK, sourceOhms.required(),
                bandLow.required(), bandHigh.required());
        ConversionLimits limits = ConversionLimits.none().withPriority(priority.get());
        OptionalDouble s = maxSettle.value();
        if (s.isPresent()) {
            limits = limits.withMaxSettleSeconds(s.getAsDouble());
        }
        OptionalDouble a = maxCurrent.value();
        if (a.isPresent()) {
            limits = limits.withMaxSupplyAmps(a.getAsDouble());
        }
        OptionalDouble h = minRuntime.value();
        if (h.isPresent()) {
            limits = limits.withMinRuntimeHours(h.getAsDouble());
        }
        return new ConversionRequest(name.textProperty().get().trim(), original, supply(), source,
                loadOhms.required(), 0, limits);
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
        result.set(null);
        message.set("Converting " + req.original().stages().size() + " stage"
                + (req.original().stages().size() == 1 ? "" : "s") + " in the background…");
        executor.submit(() -> Converter.convert(req), r -> {
            if (mine == generation) {
                running.set(false);
                result.set(r);
                message.set(verdict(r));
            }
        }, e -> {
            if (mine == generation) {
                running.set(false);
                result.set(null);
                message.set("Not converted — " + e.getMessage());
            }
        });
    }

    private static String verdict(ConversionResult r) {
        String counts = String.format(Locale.ROOT, "%d change%s, %d conflict%s", r.changes().size(),
                r.changes().size() == 1 ? "" : "s", r.conflicts().size(), r.conflicts().size() == 1 ? "" : "s");
        if (r.succeeded()) {
            return "Converted: no failing finding and every limit met (" + counts + ").";
        }
        return "Converted with " + (r.hasFailingFinding() ? "a failing finding" : "a limit missed")
                + " (" + counts + "); see below before building it.";
    }

    /** Open the converted design in the workbench as a new, unsaved design; false when there is none. */
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

    // ---- the result in words -------------------------------------------------------------------

    /** The before/after comparison of the latest result as rows. */
    public List<Row> comparison() {
        ConversionResult r = result.get();
        List<Row> rows = new ArrayList<>();
        if (r == null) {
            return rows;
        }
        ChainFigures b = r.comparison().before();
        ChainFigures a = r.comparison().after();
        SupplyPoint bp = b.points().get(0);
        rows.add(new Row("gain in the band", String.format(Locale.ROOT, "%.3g", b.gain()),
                String.format(Locale.ROOT, "%.3g", a.gain())));
        for (SupplyPoint p : a.points()) {
            rows.add(new Row("swing, " + p.label() + " " + Quantities.volts(p.supplyVolts()), swing(bp), swing(p)));
        }
        for (SupplyPoint p : a.points()) {
            rows.add(new Row("headroom, " + p.label(), db(bp.headroomDb()), db(p.headroomDb())));
        }
        rows.add(new Row("supply current", Quantities.amps(b.supplyAmps()) + " + / " + Quantities.amps(b.negativeRailAmps())
                + " −", Quantities.amps(a.supplyAmps())));
        rows.add(new Row("lower corner", hz(b.lowerCornerHz()), hz(a.lowerCornerHz())));
        rows.add(new Row("settle-up", b.settleSeconds().isPresent() ? Quantities.seconds(b.settleSeconds().getAsDouble()) : "—",
                a.settleSeconds().isPresent() ? Quantities.seconds(a.settleSeconds().getAsDouble()) : "not settled"));
        return rows;
    }

    private static String swing(SupplyPoint p) {
        return Quantities.volts(p.symmetricSwingVolts()) + " p-p";
    }

    private static String db(double v) {
        if (v == Double.POSITIVE_INFINITY) {
            return "no signal";
        }
        return v == Double.NEGATIVE_INFINITY ? "clips" : String.format(Locale.ROOT, "%.1f dB", v);
    }

    private static String hz(OptionalDouble f) {
        return f.isPresent() ? Quantities.hertz(f.getAsDouble()) : "passes DC";
    }

    /** The latest result's changes, in the order made. */
    public List<ChangeLine> changes() {
        ConversionResult r = result.get();
        List<ChangeLine> out = new ArrayList<>();
        if (r != null) {
            for (Change c : r.changes()) {
                out.add(new ChangeLine(words(c.kind()), c.designPath().isEmpty() ? "design" : c.designPath(),
                        c.before().isEmpty() ? "—" : c.before(), c.after().isEmpty() ? "—" : c.after(), c.reason()));
            }
        }
        return out;
    }

    static String words(ChangeKind k) {
        return switch (k) {
            case SUPPLY_REPLACED -> "supply replaced";
            case REFERENCE_ADDED -> "mid-rail reference added";
            case REFERENCE_BUFFERED -> "reference buffered";
            case BIAS_RESISTOR_ADDED -> "bias resistor added";
            case INPUT_CAPACITOR_ADDED -> "input capacitor added";
            case LEG_CAPACITOR_ADDED -> "leg capacitor added";
            case OUTPUT_CAPACITOR_ADDED -> "output capacitor added";
            case OP_AMP_REPLACED -> "op-amp replaced";
            case RESISTORS_SCALED -> "R1 and R2 scaled";
            case KEPT_AGAINST_PRACTICE -> "kept against common practice";
            case CAPACITORS_ENLARGED -> "capacitors enlarged";
            case CAPACITORS_REDUCED_FOR_SETTLE -> "capacitors reduced for settle-up";
        };
    }

    /** The latest result's conflicts (empty when every limit was met). */
    public List<ConflictLine> conflicts() {
        ConversionResult r = result.get();
        List<ConflictLine> out = new ArrayList<>();
        if (r != null) {
            for (Conflict c : r.conflicts()) {
                String by = amount(c.missedBy(), c.unit());
                out.add(new ConflictLine(c.winner(), c.loser(), by, "Won: " + c.winner() + ". Missed: " + c.loser()
                        + ", by " + by + " (achieved " + amount(c.achieved(), c.unit()) + " against "
                        + amount(c.limit(), c.unit()) + ").", c.explanation()));
            }
        }
        return out;
    }

    /** {@code v} in {@code unit} (s, Hz, A, V, h) in engineering notation. */
    static String amount(double v, String unit) {
        return switch (unit) {
            case "s" -> Quantities.seconds(v);
            case "Hz" -> Quantities.hertz(v);
            case "A" -> Quantities.amps(v);
            case "V" -> Quantities.volts(v);
            default -> String.format(Locale.ROOT, "%.3g %s", v, unit);
        };
    }

    /** The latest result's trade-off curve, lowest target corner first (empty without a result). */
    public List<TradeOffPoint> tradeOff() {
        ConversionResult r = result.get();
        return r == null ? List.of() : r.tradeOff();
    }

    // ---- checks of single values ---------------------------------------------------------------

    private static String positive(double v) {
        return v > 0 && Double.isFinite(v) ? "" : "must be positive, got " + v;
    }

    private static String nonNegative(double v) {
        return v >= 0 && Double.isFinite(v) ? "" : "must be zero or positive, got " + v;
    }

    private static String wholeCells(double v) {
        if (v != Math.rint(v)) {
            return "must be a whole number of cells, got " + v;
        }
        return v >= 1 && v <= 100 ? "" : "must be between 1 and 100 cells";
    }

    // ---- properties ----------------------------------------------------------------------------

    public Entry name() { return name; }
    public Entry positiveRail() { return positiveRail; }
    public Entry negativeRail() { return negativeRail; }
    public ObjectProperty<SupplyKind> supplyKindProperty() { return supplyKind; }
    public ObjectProperty<String> chemistryProperty() { return chemistry; }
    public Entry cells() { return cells; }
    public Entry railVolts() { return railVolts; }
    /** The fixed rail's ± tolerance, %. */
    public Entry railTolerance() { return railTolerance; }
    /** Ripple on the USB port, V peak (blank: none). */
    public Entry usbRipple() { return usbRipple; }
    public Entry usbRippleHz() { return usbRippleHz; }
    public Entry signal() { return signal; }
    public Entry sourceOhms() { return sourceOhms; }
    public Entry bandLow() { return bandLow; }
    public Entry bandHigh() { return bandHigh; }
    public Entry loadOhms() { return loadOhms; }
    /** Settle-up limit, s (blank: none). */
    public Entry maxSettle() { return maxSettle; }
    /** Supply current limit, A (blank: none). */
    public Entry maxCurrent() { return maxCurrent; }
    /** Runtime wanted, h (blank: none; cells only). */
    public Entry minRuntime() { return minRuntime; }
    /** Which wins when the band's low end and the settle-up limit cannot both be met. */
    public ObjectProperty<LimitPriority> priorityProperty() { return priority; }
    /** The new supply's voltages in words (empty while a supply field is refused). */
    public ReadOnlyStringProperty supplySummaryProperty() { return supplySummary.getReadOnlyProperty(); }
    /** The caution that goes with the chosen supply (the chemistry's own for cells). */
    public ReadOnlyStringProperty safetyNoteProperty() { return safetyNote.getReadOnlyProperty(); }
    public ReadOnlyObjectProperty<ConversionResult> resultProperty() { return result.getReadOnlyProperty(); }
    public ReadOnlyStringProperty messageProperty() { return message.getReadOnlyProperty(); }
    public ReadOnlyBooleanProperty runningProperty() { return running.getReadOnlyProperty(); }
}
