package halfrail.ui;

import halfrail.design.AmplitudeUnit;
import halfrail.design.CapacitorSpec;
import halfrail.design.CellPack;
import halfrail.design.Design;
import halfrail.design.DesignException;
import halfrail.design.FixedRail;
import halfrail.design.Load;
import halfrail.design.OpAmpChoice;
import halfrail.design.Reference;
import halfrail.design.ReferenceKind;
import halfrail.design.SignalSource;
import halfrail.design.Thresholds;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.design.Supply;
import halfrail.design.UsbPort;
import halfrail.parts.CapacitorTechnology;
import halfrail.parts.CellChemistry;
import halfrail.parts.OpAmpArchetype;
import halfrail.parts.PartsLibrary;
import halfrail.units.EngineeringValue;
import halfrail.units.Unit;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.function.BiFunction;
import java.util.function.Function;

/**
 * The view-model of the design editor: one {@link Section} per part of the design (supply,
 * reference, each stage, source, load), each a list of fields. A text field checks its text as
 * it is typed — first as an engineering value, then by building the design it would give — and
 * shows the reason when either fails; only text that passes both reaches the design, as one
 * undoable edit, when the field is committed.
 *
 * <p>The sections are rebuilt when the design's shape changes (another supply kind, a stage
 * added); otherwise the fields only take the design's values again, so focus stays put.
 */
public final class EditorPanelModel {
    /** Capacitance given to a capacitor the user adds by choosing its technology, F (a starting value to edit). */
    static final double NEW_CAPACITOR_FARADS = 10e-6;
    /** Rated voltage given to a capacitor the user adds, V (a starting value to edit). */
    static final double NEW_CAPACITOR_RATED_VOLTS = 25;
    /** Text shown for "no capacitor here". */
    static final String LEFT_OUT = "— left out —";

    /** One field of the editor. */
    public sealed interface Field permits TextEntry, Choice {
        String label();

        /** The design path the field edits (as used by findings, for example {@code stages[0].legOhms}). */
        String path();

        String help();

        BooleanProperty highlightedProperty();

        void refresh(Design d);
    }

    /** A part of the design with its fields; {@code stageIndex} is set for a stage. */
    public record Section(String title, String path, List<Field> fields, OptionalInt stageIndex, String note) {}

    /** One entry of a choice field. */
    public record Option(String key, String text) {
        @Override
        public String toString() {
            return text;
        }
    }

    /** A typed value: text, the reason it is refused (empty when it is fine), and how to apply it. */
    public static final class TextEntry implements Field {
        private final EditorPanelModel owner;
        private final String label;
        private final String path;
        private final String unitSymbol;
        private final String help;
        private final Function<Design, String> show;
        private final BiFunction<Design, String, Design> apply;
        private final StringProperty text = new SimpleStringProperty(this, "text", "");
        private final ReadOnlyStringWrapper problem = new ReadOnlyStringWrapper(this, "problem", "");
        private final BooleanProperty highlighted = new SimpleBooleanProperty(this, "highlighted");

        TextEntry(EditorPanelModel owner, String label, String path, String unitSymbol, String help,
                  Function<Design, String> show, BiFunction<Design, String, Design> apply) {
            this.owner = owner;
            this.label = label;
            this.path = path;
            this.unitSymbol = unitSymbol;
            this.help = help;
            this.show = show;
            this.apply = apply;
            text.addListener((o, was, now) -> check(now));
        }

        private Optional<String> check(String t) {
            String reason;
            try {
                apply.apply(owner.current(), t);
                reason = "";
            } catch (IllegalArgumentException | DesignException | halfrail.circuit.CircuitException e) {
                reason = e.getMessage();
            } catch (RuntimeException e) {
                // the field's part of the design is gone (a stage removed while it had focus)
                reason = "this field no longer belongs to the design";
            }
            problem.set(reason);
            return reason.isEmpty() ? Optional.empty() : Optional.of(reason);
        }

        /**
         * Apply the text to the design when it is valid and differs from the design's value.
         *
         * @return whether the design changed
         */
        public boolean commit() {
            String t = text.get();
            if (check(t).isPresent() || t.equals(show.apply(owner.current()))) {
                return false;
            }
            Design before = owner.current();
            Optional<String> refused = owner.workbench.edit(label + " = " + t.trim(), d -> apply.apply(d, t));
            refused.ifPresent(problem::set);
            return owner.current() != before;
        }

        /** Put the design's value back into the field. */
        public void revert() {
            refresh(owner.current());
        }

        @Override
        public void refresh(Design d) {
            text.set(show.apply(d));
            problem.set("");
        }

        public StringProperty textProperty() {
            return text;
        }

        /** Why the current text is refused; empty when it is accepted. */
        public ReadOnlyStringProperty problemProperty() {
            return problem.getReadOnlyProperty();
        }

        public String unitSymbol() {
            return unitSymbol;
        }

        @Override
        public String label() {
            return label;
        }

        @Override
        public String path() {
            return path;
        }

        @Override
        public String help() {
            return help;
        }

        @Override
        public BooleanProperty highlightedProperty() {
            return highlighted;
        }
    }

    /** A choice among fixed options; choosing applies the edit at once. */
    public static final class Choice implements Field {
        private final EditorPanelModel owner;
        private final String label;
        private final String path;
        private final String help;
        private final List<Option> options;
        private final Function<Design, String> read;
        private final BiFunction<Design, String, Design> apply;
        private final ObjectProperty<Option> selected = new SimpleObjectProperty<>(this, "selected");
        private final BooleanProperty highlighted = new SimpleBooleanProperty(this, "highlighted");

        Choice(EditorPanelModel owner, String label, String path, String help, List<Option> options,
               Function<Design, String> read, BiFunction<Design, String, Design> apply) {
            this.owner = owner;
            this.label = label;
            this.path = path;
            this.help = help;
            this.options = List.copyOf(options);
            this.read = read;
            this.apply = apply;
        }

        /** The user chose {@code option}. @return the reason when the design cannot take it */
        public Optional<String> choose(Option option) {
            if (option == null || option.equals(selected.get())) {
                return Optional.empty();
            }
            Optional<String> refused = owner.workbench.edit(label + " = " + option.text(),
                    d -> apply.apply(d, option.key()));
            if (refused.isPresent()) {
                refresh(owner.current());
                owner.workbench.tell("Not changed: " + label + " — " + refused.get());
            }
            return refused;
        }

        @Override
        public void refresh(Design d) {
            String key = read.apply(d);
            selected.set(options.stream().filter(o -> o.key().equals(key)).findFirst().orElse(null));
        }

        public List<Option> options() {
            return options;
        }

        public ObjectProperty<Option> selectedProperty() {
            return selected;
        }

        @Override
        public String label() {
            return label;
        }

        @Override
        public String path() {
            return path;
        }

        @Override
        public String help() {
            return help;
        }

        @Override
        public BooleanProperty highlightedProperty() {
            return highlighted;
        }
    }

    private final WorkbenchModel workbench;
    private final PartsLibrary parts = PartsLibrary.builtIn();
    private final ObservableList<Section> sections = FXCollections.observableArrayList();
    /** Read-only view kept as a field: list listeners hold it only weakly. */
    private final ObservableList<Section> sectionsView = FXCollections.unmodifiableObservableList(sections);
    private String shape = "";
    private Design shown;
    private List<String> highlightedParts = List.of();

    EditorPanelModel(WorkbenchModel workbench) {
        this.workbench = Objects.requireNonNull(workbench);
    }

    Design current() {
        return workbench.design();
    }

    void designChanged(Design d) {
        shown = d;
        String s = shapeOf(d);
        if (!s.equals(shape)) {
            shape = s;
            sections.setAll(build(d));
        }
        for (Section sec : sections) {
            for (Field f : sec.fields()) {
                f.refresh(d);
            }
        }
        highlight(highlightedParts);
    }

    void highlight(List<String> partPaths) {
        highlightedParts = List.copyOf(partPaths);
        for (Section sec : sections) {
            for (Field f : sec.fields()) {
                f.highlightedProperty().set(partPaths.stream().anyMatch(p -> concerns(f.path(), p)));
            }
        }
    }

    /** Whether a field at {@code fieldPath} edits (part of) the design part at {@code partPath}. */
    static boolean concerns(String fieldPath, String partPath) {
        return fieldPath.equals(partPath) || fieldPath.startsWith(partPath + ".")
                || fieldPath.startsWith(partPath + "[");
    }

    public ObservableList<Section> sections() {
        return sectionsView;
    }

    /** Every field, section by section. */
    public List<Field> fields() {
        List<Field> all = new ArrayList<>();
        sections.forEach(s -> all.addAll(s.fields()));
        return all;
    }

    /** The field editing {@code path}, if the editor shows one. */
    public Optional<Field> field(String path) {
        return fields().stream().filter(f -> f.path().equals(path)).findFirst();
    }

    // ---- stage list ------------------------------------------------------------------------

    /** Add a stage after the last, copying it under a new name. */
    public void addStage() {
        Design d = current();
        Stage last = d.stages().get(d.stages().size() - 1);
        String name = freeName(d, "stage ");
        workbench.edit("add a stage named " + name, x -> {
            List<Stage> list = new ArrayList<>(x.stages());
            list.add(renamed(last, name));
            return x.withStages(list);
        });
    }

    /** Remove stage {@code index} (a design keeps at least one stage). */
    public Optional<String> removeStage(int index) {
        return workbench.edit("remove stage " + current().stages().get(index).name(), x -> {
            List<Stage> list = new ArrayList<>(x.stages());
            list.remove(index);
            return x.withStages(list);
        });
    }

    /** Move stage {@code index} by {@code by} places along the chain (negative: towards the source). */
    public void moveStage(int index, int by) {
        int to = index + by;
        if (to < 0 || to >= current().stages().size()) {
            return;
        }
        workbench.edit("move stage " + current().stages().get(index).name(), x -> {
            List<Stage> list = new ArrayList<>(x.stages());
            Collections.swap(list, index, to);
            return x.withStages(list);
        });
    }

    private static String freeName(Design d, String stem) {
        for (int i = d.stages().size() + 1; ; i++) {
            String n = stem + i;
            if (d.stages().stream().noneMatch(s -> s.name().equals(n))) {
                return n;
            }
        }
    }

    static Stage renamed(Stage s, String name) {
        return new Stage(name, s.kind(), s.opAmp(), s.feedbackOhms(), s.legOhms(), s.legCapacitor(),
                s.inputCapacitor(), s.biased());
    }

    // ---- building the sections ---------------------------------------------------------------

    private static String shapeOf(Design d) {
        StringBuilder b = new StringBuilder();
        b.append(d.supply().getClass().getSimpleName()).append('|').append(d.reference().kind());
        if (d.reference().buffer() != null) {
            b.append(d.reference().buffer().archetypeId().isPresent());
        }
        for (Stage s : d.stages()) {
            b.append('|').append(s.kind()).append(s.legCapacitor() != null).append(s.inputCapacitor() != null)
                    .append(s.opAmp().archetypeId().isPresent());
        }
        b.append('|').append(d.load().outputCapacitor() != null).append('|').append(d.source().unit());
        return b.toString();
    }

    private List<Section> build(Design d) {
        List<Section> list = new ArrayList<>();
        list.add(designSection());
        list.add(supplySection(d));
        list.add(referenceSection(d));
        for (int i = 0; i < d.stages().size(); i++) {
            list.add(stageSection(d, i));
        }
        list.add(sourceSection(d));
        list.add(loadSection(d));
        list.add(limitsSection());
        return list;
    }

    private Section designSection() {
        List<Field> f = new ArrayList<>();
        f.add(new TextEntry(this, "title", "name", "", "A title of your own for the design.", Design::name,
                (x, t) -> new Design(t.trim(), x.description(), x.supply(), x.reference(), x.stages(), x.source(),
                        x.load(), x.thresholds(), x.powerOnRampSeconds())));
        f.add(value("power-on ramp", "powerOnRampSeconds", Unit.SECOND,
                "How long the supply takes to rise at switch-on (0 for a step).", Design::powerOnRampSeconds,
                (x, v) -> new Design(x.name(), x.description(), x.supply(), x.reference(), x.stages(), x.source(),
                        x.load(), x.thresholds(), v)));
        return new Section("Design", "design", f, OptionalInt.empty(), "");
    }

    /** The check limits, in the order of {@link Thresholds}'s components. */
    private Section limitsSection() {
        List<Field> f = new ArrayList<>();
        f.add(limit("least headroom, dB", "thresholds.minHeadroomDb", Unit.NONE, 2,
                "Smallest acceptable room between the signal peaks and the swing limits.", 1));
        f.add(limit("settle-up limit", "thresholds.maxSettleSeconds", Unit.SECOND, 1,
                "Longest acceptable time from switch-on until every node has settled.", 1));
        f.add(limit("settle band, %", "thresholds.settleBandFraction", Unit.NONE, 0,
                "A node counts as settled within this share of the supply voltage.", 100));
        f.add(limit("off-centre loss, dB", "thresholds.offCentreDb", Unit.NONE, 3,
                "Headroom lost to an off-centre rest point above which a warning is raised.", 1));
        f.add(limit("leakage shift limit", "thresholds.maxLeakageDriftVolts", Unit.VOLT, 5,
                "Largest acceptable rest-point shift caused by capacitor leakage.", 1));
        f.add(limit("ripple at output limit", "thresholds.maxRippleVolts", Unit.VOLT, 6,
                "Largest acceptable supply ripple at the output, peak.", 1));
        f.add(limit("power-on step limit", "thresholds.maxStepVolts", Unit.VOLT, 8,
                "Largest acceptable step into the load at switch-on.", 1));
        f.add(limit("stage gain limit", "thresholds.maxStageGain", Unit.NONE, 9,
                "Gain of one stage above which it is flagged (common practice).", 1));
        f.add(limit("feedback resistor limit", "thresholds.maxFeedbackOhms", Unit.OHM, 10,
                "Feedback resistance above which a stage is flagged (common practice).", 1));
        f.add(limit("runtime target, h", "thresholds.minRuntimeHours", Unit.NONE, 11,
                "Runtime wanted from the supply's capacity (0 for none).", 1));
        return new Section("Check limits", "thresholds", f, OptionalInt.empty(), "");
    }

    /** A field for component {@code index} of the thresholds, shown multiplied by {@code scale}. */
    private TextEntry limit(String label, String path, Unit unit, int index, String help, double scale) {
        return value(label, path, unit, help, x -> limits(x.thresholds())[index] * scale, (x, v) -> {
            double[] all = limits(x.thresholds());
            all[index] = v / scale;
            return x.withThresholds(new Thresholds(all[0], all[1], all[2], all[3], all[4], all[5], all[6], all[7],
                    all[8], all[9], all[10], all[11], all[12]));
        });
    }

    private static double[] limits(Thresholds t) {
        return new double[] {t.settleBandFraction(), t.maxSettleSeconds(), t.minHeadroomDb(), t.offCentreDb(),
                t.nearRailFraction(), t.maxLeakageDriftVolts(), t.maxRippleVolts(), t.maxBiasShiftVolts(),
                t.maxStepVolts(), t.maxStageGain(), t.maxFeedbackOhms(), t.minRuntimeHours(),
                t.capacitorDeratingOverride()};
    }

    private Section supplySection(Design d) {
        List<Field> f = new ArrayList<>();
        f.add(new Choice(this, "kind", "supply", "Where the single rail comes from.",
                List.of(new Option("cells", "cells in series"), new Option("fixed", "fixed rail"),
                        new Option("usb", "USB port")),
                x -> x.supply() instanceof CellPack ? "cells" : x.supply() instanceof FixedRail ? "fixed" : "usb",
                (x, k) -> x.withSupply(otherSupply(x.supply(), k))));
        Supply s = d.supply();
        if (s instanceof CellPack) {
            List<Option> chem = new ArrayList<>();
            for (CellChemistry c : parts.cellChemistries()) {
                chem.add(new Option(c.id(), c.displayName()));
            }
            f.add(new Choice(this, "chemistry", "supply.chemistry",
                    "Cell chemistry; it sets the fresh, nominal and end-point voltages.", chem,
                    x -> ((CellPack) x.supply()).chemistry(),
                    (x, k) -> x.withSupply(new CellPack(k, ((CellPack) x.supply()).cellsInSeries()))));
            f.add(new TextEntry(this, "cells in series", "supply.cellsInSeries", "",
                    "How many cells (or blocks) in series.",
                    x -> Integer.toString(((CellPack) x.supply()).cellsInSeries()),
                    (x, t) -> x.withSupply(new CellPack(((CellPack) x.supply()).chemistry(), wholeNumber(t)))));
        } else if (s instanceof FixedRail) {
            f.add(value("rail voltage", "supply.volts", Unit.VOLT, "Nominal voltage of the rail.",
                    x -> fixed(x).volts(), (x, v) -> x.withSupply(fixed(x, v, null, null, null, null))));
            f.add(value("tolerance, %", "supply.tolerance", Unit.NONE, "± tolerance of the rail, in per cent.",
                    x -> fixed(x).tolerance() * 100, (x, v) -> x.withSupply(fixed(x, null, v / 100, null, null, null))));
            f.add(value("ripple, peak", "supply.rippleVoltsPeak", Unit.VOLT, "Ripple amplitude on the rail (0 for none).",
                    x -> fixed(x).rippleVoltsPeak(), (x, v) -> x.withSupply(fixed(x, null, null, v, null, null))));
            f.add(value("ripple frequency", "supply.rippleHz", Unit.HERTZ, "Frequency of the ripple.",
                    x -> fixed(x).rippleHz(), (x, v) -> x.withSupply(fixed(x, null, null, null, v, null))));
            f.add(value("source resistance", "supply.sourceOhms", Unit.OHM, "Output resistance of the rail.",
                    x -> fixed(x).sourceOhms(), (x, v) -> x.withSupply(fixed(x, null, null, null, null, v))));
        } else {
            f.add(value("ripple, peak", "supply.rippleVoltsPeak", Unit.VOLT, "Ripple and noise on the port (0 for none).",
                    x -> x.supply().rippleVoltsPeak(), (x, v) -> x.withSupply(new UsbPort(v, usbHz(x)))));
            f.add(value("ripple frequency", "supply.rippleHz", Unit.HERTZ, "Frequency of the port's ripple.",
                    x -> x.supply().rippleHz(), (x, v) -> x.withSupply(new UsbPort(x.supply().rippleVoltsPeak(), v))));
        }
        return new Section("Supply", "supply", f, OptionalInt.empty(), s.safetyNote());
    }

    private static double usbHz(Design x) {
        return x.supply().rippleHz() > 0 ? x.supply().rippleHz() : 1e3;
    }

    private static FixedRail fixed(Design x) {
        return (FixedRail) x.supply();
    }

    private static FixedRail fixed(Design x, Double volts, Double tol, Double ripple, Double hz, Double ohms) {
        FixedRail r = fixed(x);
        return new FixedRail(volts != null ? volts : r.volts(), tol != null ? tol : r.tolerance(),
                ripple != null ? ripple : r.rippleVoltsPeak(), hz != null ? hz : r.rippleHz(),
                ohms != null ? ohms : r.sourceOhms());
    }

    /** A supply of another kind that keeps what it can of {@code s}; invented starting values otherwise. */
    private static Supply otherSupply(Supply s, String kind) {
        return switch (kind) {
            case "cells" -> s instanceof CellPack ? s : new CellPack("alkaline-9v-block", 1);
            case "fixed" -> s instanceof FixedRail ? s
                    : new FixedRail(Math.round(s.nominalVolts() * 10) / 10.0, 0.05, s.rippleVoltsPeak(),
                            s.rippleVoltsPeak() > 0 ? s.rippleHz() : 100, Math.max(0, s.internalOhms()));
            default -> s instanceof UsbPort ? s : new UsbPort(0, 1e3);
        };
    }

    private static int wholeNumber(String t) {
        double v = EngineeringValue.parse(t, Unit.NONE);
        if (v != Math.rint(v)) {
            throw new IllegalArgumentException("must be a whole number of cells, got " + t.trim());
        }
        if (v < 1 || v > 100) {
            throw new IllegalArgumentException("must be between 1 and 100 cells");
        }
        return (int) v;
    }

    private Section referenceSection(Design d) {
        List<Field> f = new ArrayList<>();
        f.add(new Choice(this, "kind", "reference.kind", "How the mid-rail reference reaches the stages.",
                List.of(new Option(ReferenceKind.DIVIDER_DIRECT.name(), "divider, straight in"),
                        new Option(ReferenceKind.DIVIDER_DECOUPLED.name(), "divider, decoupled"),
                        new Option(ReferenceKind.DIVIDER_BUFFERED.name(), "divider, decoupled and buffered")),
                x -> x.reference().kind().name(),
                (x, k) -> x.withReference(otherReference(x, ReferenceKind.valueOf(k)))));
        f.add(value("upper resistor", "reference.upperOhms", Unit.OHM, "Divider resistor from the supply to the mid point.",
                x -> x.reference().upperOhms(), (x, v) -> x.withReference(x.reference().withDivider(v, x.reference().lowerOhms()))));
        f.add(value("lower resistor", "reference.lowerOhms", Unit.OHM, "Divider resistor from the mid point to ground.",
                x -> x.reference().lowerOhms(), (x, v) -> x.withReference(x.reference().withDivider(x.reference().upperOhms(), v))));
        Reference r = d.reference();
        if (r.kind() != ReferenceKind.DIVIDER_DIRECT) {
            capacitorFields(f, "decoupling", "reference.decoupling", false, x -> x.reference().decoupling(),
                    (x, c) -> x.withReference(ref(x.reference(), c, null, null, null, null)));
            f.add(value("bias resistor", "reference.biasOhms", Unit.OHM,
                    "Resistor from the reference to each stage's non-inverting input.",
                    x -> x.reference().biasOhms(), (x, v) -> x.withReference(ref(x.reference(), null, v, null, null, null))));
        }
        if (r.kind() == ReferenceKind.DIVIDER_BUFFERED) {
            f.add(archetypeChoice("buffer op-amp", "reference.buffer", x -> x.reference().buffer(),
                    (x, o) -> x.withReference(ref(x.reference(), null, null, o, null, null))));
            if (r.buffer().customParams().isPresent()) {
                customOpAmpFields(f, "reference.buffer", x -> x.reference().buffer(),
                        (x, o) -> x.withReference(ref(x.reference(), null, null, o, null, null)));
            }
            f.add(value("isolation resistor", "reference.isolationOhms", Unit.OHM,
                    "Resistor between the buffer's output and its decoupling capacitor.",
                    x -> x.reference().isolationOhms(), (x, v) -> x.withReference(ref(x.reference(), null, null, null, v, null))));
            capacitorFields(f, "buffer decoupling", "reference.bufferDecoupling", false,
                    x -> x.reference().bufferDecoupling(),
                    (x, c) -> x.withReference(ref(x.reference(), null, null, null, null, c)));
        }
        return new Section("Mid-rail reference", "reference", f, OptionalInt.empty(), "");
    }

    private static Reference ref(Reference r, CapacitorSpec decoupling, Double bias, OpAmpChoice buffer,
                                 Double isolation, CapacitorSpec bufferDecoupling) {
        return new Reference(r.kind(), r.upperOhms(), r.lowerOhms(), decoupling != null ? decoupling : r.decoupling(),
                bias != null ? bias : r.biasOhms(), buffer != null ? buffer : r.buffer(),
                isolation != null ? isolation : r.isolationOhms(),
                bufferDecoupling != null ? bufferDecoupling : r.bufferDecoupling());
    }

    /** A reference of another kind keeping what it can; invented starting values for what it lacks. */
    private static Reference otherReference(Design x, ReferenceKind kind) {
        Reference r = x.reference();
        CapacitorSpec dec = r.decoupling() != null ? r.decoupling()
                : new CapacitorSpec(NEW_CAPACITOR_FARADS, "aluminium-electrolytic", NEW_CAPACITOR_RATED_VOLTS);
        double bias = r.biasOhms() > 0 ? r.biasOhms() : 100e3;
        return switch (kind) {
            case DIVIDER_DIRECT -> Reference.direct(r.upperOhms(), r.lowerOhms());
            case DIVIDER_DECOUPLED -> Reference.decoupled(r.upperOhms(), r.lowerOhms(), dec, bias);
            case DIVIDER_BUFFERED -> Reference.buffered(r.upperOhms(), r.lowerOhms(), dec, bias,
                    r.buffer() != null ? r.buffer() : x.stages().get(0).opAmp(),
                    r.isolationOhms() > 0 ? r.isolationOhms() : 100,
                    r.bufferDecoupling() != null ? r.bufferDecoupling() : dec);
        };
    }

    private Section stageSection(Design d, int i) {
        Stage s = d.stages().get(i);
        String p = "stages[" + i + "]";
        List<Field> f = new ArrayList<>();
        f.add(new TextEntry(this, "name", p + ".name", "", "A short name of your own, unique in the design.",
                x -> x.stages().get(i).name(), (x, t) -> {
                    if (t.isBlank()) {
                        throw new IllegalArgumentException("a stage needs a name");
                    }
                    return x.withStage(i, renamed(x.stages().get(i), t.trim()));
                }));
        f.add(new Choice(this, "kind", p + ".kind", "The stage's topology.",
                List.of(new Option(StageKind.NON_INVERTING.name(), "non-inverting"),
                        new Option(StageKind.INVERTING.name(), "inverting"),
                        new Option(StageKind.FOLLOWER.name(), "follower")),
                x -> x.stages().get(i).kind().name(), (x, k) -> x.withStage(i, otherKind(x.stages().get(i),
                        StageKind.valueOf(k)))));
        f.add(archetypeChoice("op-amp", p + ".opAmp", x -> x.stages().get(i).opAmp(),
                (x, o) -> x.withStage(i, x.stages().get(i).withOpAmp(o))));
        if (s.opAmp().customParams().isPresent()) {
            customOpAmpFields(f, p + ".opAmp", x -> x.stages().get(i).opAmp(),
                    (x, o) -> x.withStage(i, x.stages().get(i).withOpAmp(o)));
        }
        if (s.kind() != StageKind.FOLLOWER) {
            f.add(value("R2 feedback", p + ".feedbackOhms", Unit.OHM, "From the output to the inverting input.",
                    x -> x.stages().get(i).feedbackOhms(), (x, v) -> x.withStage(i, x.stages().get(i).withFeedbackOhms(v))));
            f.add(value("R1 leg", p + ".legOhms", Unit.OHM, s.kind() == StageKind.NON_INVERTING
                            ? "From the inverting input towards ground, through the leg capacitor."
                            : "From the stage's input to the inverting input.",
                    x -> x.stages().get(i).legOhms(), (x, v) -> x.withStage(i, x.stages().get(i).withLegOhms(v))));
        }
        if (s.kind() == StageKind.NON_INVERTING) {
            capacitorFields(f, "leg capacitor", p + ".legCapacitor", true, x -> x.stages().get(i).legCapacitor(),
                    (x, c) -> x.withStage(i, x.stages().get(i).withLegCapacitor(c)));
        }
        capacitorFields(f, "input capacitor", p + ".inputCapacitor", true, x -> x.stages().get(i).inputCapacitor(),
                (x, c) -> x.withStage(i, x.stages().get(i).withInputCapacitor(c)));
        return new Section("Stage " + (i + 1) + " · " + s.name(), p, f, OptionalInt.of(i), "");
    }

    /** The stage as another kind; resistors a follower lacked get invented starting values (gain 2). */
    private static Stage otherKind(Stage s, StageKind kind) {
        double r2 = s.feedbackOhms() > 0 ? s.feedbackOhms() : 10e3;
        double r1 = s.legOhms() > 0 ? s.legOhms() : 10e3;
        return new Stage(s.name(), kind, s.opAmp(), r2, r1, s.legCapacitor(), s.inputCapacitor(), s.biased());
    }

    private Section sourceSection(Design d) {
        List<Field> f = new ArrayList<>();
        AmplitudeUnit unit = d.source().unit();
        boolean volts = unit == AmplitudeUnit.VOLTS_PEAK || unit == AmplitudeUnit.VOLTS_RMS;
        f.add(value(volts ? "level" : "level, dB", "source.amplitude", volts ? Unit.VOLT : Unit.NONE,
                "The nominal signal level the chain must carry.",
                x -> x.source().amplitude(), (x, v) -> x.withSource(src(x.source(), v, null, null, null, null))));
        List<Option> units = List.of(new Option(AmplitudeUnit.VOLTS_PEAK.name(), "V peak"),
                new Option(AmplitudeUnit.VOLTS_RMS.name(), "V rms"), new Option(AmplitudeUnit.DBU.name(), "dBu"),
                new Option(AmplitudeUnit.DBV.name(), "dBV"));
        f.add(new Choice(this, "level stated as", "source.unit", "How the level is stated.", units,
                x -> x.source().unit().name(), (x, k) -> x.withSource(src(x.source(), null, AmplitudeUnit.valueOf(k),
                        null, null, null))));
        f.add(value("source resistance", "source.sourceOhms", Unit.OHM, "Output resistance of what drives the chain.",
                x -> x.source().sourceOhms(), (x, v) -> x.withSource(src(x.source(), null, null, v, null, null))));
        f.add(value("band, lowest", "source.bandLowHz", Unit.HERTZ, "Lowest frequency the chain must pass.",
                x -> x.source().bandLowHz(), (x, v) -> x.withSource(src(x.source(), null, null, null, v, null))));
        f.add(value("band, highest", "source.bandHighHz", Unit.HERTZ, "Highest frequency the chain must pass.",
                x -> x.source().bandHighHz(), (x, v) -> x.withSource(src(x.source(), null, null, null, null, v))));
        return new Section("Source", "source", f, OptionalInt.empty(), "");
    }

    private static SignalSource src(SignalSource s, Double amp, AmplitudeUnit unit, Double ohms, Double lo, Double hi) {
        return new SignalSource(amp != null ? amp : s.amplitude(), unit != null ? unit : s.unit(),
                ohms != null ? ohms : s.sourceOhms(), lo != null ? lo : s.bandLowHz(), hi != null ? hi : s.bandHighHz());
    }

    private Section loadSection(Design d) {
        List<Field> f = new ArrayList<>();
        f.add(value("load resistance", "load.ohms", Unit.OHM, "Resistance the last stage drives, to ground.",
                x -> x.load().ohms(), (x, v) -> x.withLoad(new Load(v, x.load().farads(), x.load().outputCapacitor()))));
        f.add(value("load capacitance", "load.farads", Unit.FARAD, "Capacitance at the load, to ground (0 for none).",
                x -> x.load().farads(), (x, v) -> x.withLoad(new Load(x.load().ohms(), v, x.load().outputCapacitor()))));
        capacitorFields(f, "output capacitor", "load.outputCapacitor", true, x -> x.load().outputCapacitor(),
                (x, c) -> x.withLoad(new Load(x.load().ohms(), x.load().farads(), c)));
        return new Section("Load", "load", f, OptionalInt.empty(), "");
    }

    // ---- field helpers -----------------------------------------------------------------------

    private TextEntry value(String label, String path, Unit unit, String help, Function<Design, Double> get,
                            BiFunction<Design, Double, Design> set) {
        return new TextEntry(this, label, path, unit.symbol(), help,
                x -> EngineeringValue.format(get.apply(x), unit),
                (x, t) -> set.apply(x, EngineeringValue.parse(t, unit)));
    }

    private Choice archetypeChoice(String label, String path, Function<Design, OpAmpChoice> get,
                                   BiFunction<Design, OpAmpChoice, Design> set) {
        List<Option> opts = new ArrayList<>();
        for (OpAmpArchetype a : parts.opAmpArchetypes()) {
            opts.add(new Option(a.id(), a.displayName()));
        }
        opts.add(new Option("", "custom part (own data-sheet figures)"));
        return new Choice(this, label, path, "The op-amp, described by its kind rather than by a part number; "
                + "a custom part starts from the chosen kind's typical figures.", opts,
                x -> get.apply(x).archetypeId().orElse(""),
                (x, k) -> {
                    OpAmpChoice now = get.apply(x);
                    if (!k.isEmpty()) {
                        return set.apply(x, OpAmpChoice.archetype(k));
                    }
                    if (now.customParams().isPresent()) {
                        return x;
                    }
                    return set.apply(x, OpAmpChoice.custom(parts.requireOpAmpArchetype(now.archetype()).typical()));
                });
    }

    /** The figures of a custom op-amp, in the order of {@link halfrail.circuit.OpAmpParams}'s components. */
    private void customOpAmpFields(List<Field> f, String path, Function<Design, OpAmpChoice> get,
                                   BiFunction<Design, OpAmpChoice, Design> set) {
        for (int i = 0; i < OpAmpFigures.LABELS.length; i++) {
            int index = i;
            f.add(new TextEntry(this, OpAmpFigures.LABELS[i], path + ".custom." + i, OpAmpFigures.UNITS[i].symbol(),
                    OpAmpFigures.HELP[i],
                    x -> OpAmpFigures.text(index, OpAmpFigures.of(custom(get.apply(x)))[index]),
                    (x, t) -> {
                        double[] all = OpAmpFigures.of(custom(get.apply(x)));
                        all[index] = OpAmpFigures.value(index, t);
                        return set.apply(x, OpAmpChoice.custom(OpAmpFigures.params(all)));
                    }));
        }
    }

    private static halfrail.circuit.OpAmpParams custom(OpAmpChoice c) {
        return c.customParams().orElseThrow(() -> new IllegalArgumentException("the op-amp is not a custom part"));
    }

    /** Technology, value and rating of one capacitor; an optional one can be left out through its technology. */
    private void capacitorFields(List<Field> f, String label, String path, boolean optional,
                                 Function<Design, CapacitorSpec> get, BiFunction<Design, CapacitorSpec, Design> set) {
        List<Option> techs = new ArrayList<>();
        if (optional) {
            techs.add(new Option("", LEFT_OUT));
        }
        for (CapacitorTechnology t : parts.capacitorTechnologies()) {
            techs.add(new Option(t.id(), t.displayName()));
        }
        f.add(new Choice(this, label, path + ".technology", "Technology of the " + label
                + "; it sets polarity, tolerance, leakage and derating.", techs,
                x -> get.apply(x) == null ? "" : get.apply(x).technology(),
                (x, k) -> {
                    CapacitorSpec c = get.apply(x);
                    if (k.isEmpty()) {
                        return set.apply(x, null);
                    }
                    return set.apply(x, c == null
                            ? new CapacitorSpec(NEW_CAPACITOR_FARADS, k, NEW_CAPACITOR_RATED_VOLTS)
                            : c.withTechnology(k));
                }));
        if (!optional || get.apply(shownOr()) != null) {
            f.add(value(label + " value", path, Unit.FARAD, "Capacitance of the " + label + ".",
                    x -> get.apply(x).farads(), (x, v) -> set.apply(x, get.apply(x).withFarads(v))));
            f.add(value(label + " rating", path + ".ratedVolts", Unit.VOLT, "Rated DC voltage of the " + label + ".",
                    x -> get.apply(x).ratedVolts(),
                    (x, v) -> set.apply(x, new CapacitorSpec(get.apply(x).farads(), get.apply(x).technology(), v))));
        }
    }

    private Design shownOr() {
        return shown != null ? shown : current();
    }
}
