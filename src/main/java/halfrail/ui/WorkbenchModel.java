package halfrail.ui;

import halfrail.check.DesignAnalysis;
import halfrail.check.DesignReport;
import halfrail.check.Finding;
import halfrail.check.Severity;
import halfrail.design.Design;
import halfrail.design.DesignException;
import halfrail.design.FixedRail;
import halfrail.design.Supply;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.DoubleProperty;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;
import javafx.beans.property.ReadOnlyDoubleProperty;
import javafx.beans.property.ReadOnlyDoubleWrapper;
import javafx.beans.property.ReadOnlyObjectProperty;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.beans.property.SimpleDoubleProperty;
import javafx.beans.property.SimpleObjectProperty;

import java.nio.file.Path;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.function.UnaryOperator;

/**
 * The view-model of the main window: the design being edited, its latest analysis, the edit
 * history, the supply trial and the status line. It owns the panels' view-models and wires
 * them together (a selected finding highlights its ladder level and its editor fields).
 *
 * <p>Every change of the design, and every move of the supply trial, starts a new analysis
 * through the injected {@link AnalysisExecutor}; each analysis carries a generation number and
 * a result whose generation is no longer the latest is dropped, so a stale analysis never
 * overwrites a newer one. The running job is cancelled when a newer one starts.
 */
public final class WorkbenchModel {
    /** Code of the finding shown when the analysis itself failed (the app's own; not from the checks catalogue). */
    public static final String NOT_ANALYSED = "NOT_ANALYSED";

    private final AnalysisExecutor executor;
    private final Optional<DesignFileActions> files;
    private final EditHistory history = new EditHistory();

    private final ReadOnlyObjectWrapper<Design> design = new ReadOnlyObjectWrapper<>(this, "design");
    private final ReadOnlyObjectWrapper<DesignReport> report = new ReadOnlyObjectWrapper<>(this, "report");
    private final ReadOnlyStringWrapper status = new ReadOnlyStringWrapper(this, "status", "");
    private final ReadOnlyBooleanWrapper analysing = new ReadOnlyBooleanWrapper(this, "analysing");
    private final ReadOnlyBooleanWrapper canUndo = new ReadOnlyBooleanWrapper(this, "canUndo");
    private final ReadOnlyBooleanWrapper canRedo = new ReadOnlyBooleanWrapper(this, "canRedo");
    private final ReadOnlyStringWrapper undoText = new ReadOnlyStringWrapper(this, "undoText", "Undo");
    private final ReadOnlyStringWrapper redoText = new ReadOnlyStringWrapper(this, "redoText", "Redo");
    private final ReadOnlyBooleanWrapper dirty = new ReadOnlyBooleanWrapper(this, "dirty");
    private final ObjectProperty<Path> file = new SimpleObjectProperty<>(this, "file");
    /** The reason the latest save failed (the view shows it in a dialog); set anew on every failure. */
    private final ObjectProperty<String> saveFailure = new SimpleObjectProperty<>(this, "saveFailure");
    /** The reason the latest open failed. */
    private final ObjectProperty<String> openFailure = new SimpleObjectProperty<>(this, "openFailure");

    private final BooleanProperty dark = new SimpleBooleanProperty(this, "dark");
    private final BooleanProperty trialActive = new SimpleBooleanProperty(this, "trialActive");
    private final DoubleProperty trialVolts = new SimpleDoubleProperty(this, "trialVolts");
    private final ReadOnlyDoubleWrapper trialLowVolts = new ReadOnlyDoubleWrapper(this, "trialLowVolts");
    private final ReadOnlyDoubleWrapper trialHighVolts = new ReadOnlyDoubleWrapper(this, "trialHighVolts");
    /** The supply of the design as edited, before any trial (for the end-point mark and the scale). */
    private final ReadOnlyObjectWrapper<Supply> designSupply = new ReadOnlyObjectWrapper<>(this, "designSupply");

    private final LadderPanelModel ladders = new LadderPanelModel();
    private final FindingsPanelModel findings = new FindingsPanelModel();
    private final ReadingsPanelModel readings = new ReadingsPanelModel();
    private final ChainPanelModel chain = new ChainPanelModel();
    private final SchematicModel schematic = new SchematicModel();
    private final HeadroomSweepModel headroom;
    private final MonteCarloModel monteCarlo;
    private final DividerTradeoffModel tradeoff;
    private final ReportPlotsModel plots = new ReportPlotsModel();
    private final ConversionModel conversion;
    private final EditorPanelModel editor;
    /** The latest Monte Carlo result, whose spread the ladders show while it is of the design shown. */
    private halfrail.check.MonteCarloResult spreadFrom;

    private RecentFiles recent = new RecentFiles(List.of(), l -> { });
    private Optional<RecoveryStore> recovery = Optional.empty();
    private long generation;
    /** The user's latest action, in words, put before the analysis summary in the status line. */
    private String lastAction = "";
    private AnalysisExecutor.Job running;
    private Design saved;

    public WorkbenchModel(AnalysisExecutor executor, Design initial, Optional<DesignFileActions> files) {
        this(executor, executor, initial, files);
    }

    /**
     * @param executor the analyses run after every edit
     * @param studies  long studies (Monte Carlo), so that they never hold up the analysis of an edit
     */
    public WorkbenchModel(AnalysisExecutor executor, AnalysisExecutor studies, Design initial,
                          Optional<DesignFileActions> files) {
        this.executor = Objects.requireNonNull(executor, "executor");
        this.monteCarlo = new MonteCarloModel(Objects.requireNonNull(studies, "studies"), design::get);
        this.tradeoff = new DividerTradeoffModel(studies);
        this.conversion = new ConversionModel(studies);
        conversion.setOpener(r -> openUnsaved(r.design(), "Opened the conversion of the dual-rail circuit as a new design"));
        monteCarlo.setOnResult(r -> {
            spreadFrom = r;
            DesignReport shown = report.get();
            if (shown != null) {
                showLadders(shown);
            }
        });
        monteCarlo.setOpener(d -> openUnsaved(d, "Opened the worst build of the Monte Carlo study as a new design"));
        this.files = Objects.requireNonNull(files, "files");
        this.editor = new EditorPanelModel(this);
        this.headroom = new HeadroomSweepModel(executor);
        findings.selectedProperty().addListener((o, was, now) -> focusOn(now));
        ladders.setLevelPicker((opAmp, level) -> findings.selectFirst(opAmp, level));
        chain.setPicker(findings::selectFirstAbout);
        schematic.setPicker(findings::selectFirstAbout);
        trialActive.addListener((o, was, now) -> analyse());
        trialVolts.addListener((o, was, now) -> {
            if (trialActive.get()) {
                analyse();
            }
        });
        replace(initial, null);
    }

    // ---- editing ---------------------------------------------------------------------------

    /**
     * Apply one edit to the design and record it for undo.
     *
     * @return the reason when the edit makes an invalid design (the design is then unchanged)
     */
    public Optional<String> edit(String description, UnaryOperator<Design> change) {
        Design before = design.get();
        Design after;
        try {
            after = change.apply(before);
        } catch (DesignException | IllegalArgumentException e) {
            return Optional.of(e.getMessage());
        }
        if (after == null || after.equals(before)) {
            return Optional.empty();
        }
        history.record(new EditHistory.DesignEdit(description, before, after));
        lastAction = "Edited " + description;
        show(after);
        return Optional.empty();
    }

    /** Put a message in the status line. */
    public void tellUser(String message) {
        status.set(message);
    }

    /** Put a message of the editor's in the status line (a refused choice, for example). */
    void tell(String message) {
        status.set(message);
    }

    /** Take back the latest edit. */
    public void undo() {
        history.undo().ifPresent(e -> {
            lastAction = "Undone " + e.description();
            show(e.before());
        });
    }

    /** Apply again the latest undone edit. */
    public void redo() {
        history.redo().ifPresent(e -> {
            lastAction = "Redone " + e.description();
            show(e.after());
        });
    }

    /** Start over on another design (a sample, or a file just read), forgetting the edit history. */
    public void replace(Design d, Path from) {
        monteCarlo.reset();
        spreadFrom = null;
        history.clear();
        lastAction = "";
        saved = d;
        file.set(from);
        trialActive.set(false);
        show(d);
    }

    /** Start over on a design that has no file yet (a worst build, a conversion): it opens as unsaved. */
    public void openUnsaved(Design d, String action) {
        monteCarlo.reset();
        spreadFrom = null;
        history.clear();
        lastAction = action;
        saved = null;
        file.set(null);
        trialActive.set(false);
        show(d);
    }

    private void show(Design d) {
        design.set(d);
        Supply s = d.supply();
        designSupply.set(s);
        trialLowVolts.set(s.lowVolts());
        trialHighVolts.set(s.highVolts());
        if (trialVolts.get() < s.lowVolts() || trialVolts.get() > s.highVolts() || !trialActive.get()) {
            trialVolts.set(s.nominalVolts());
        }
        canUndo.set(history.nextUndo().isPresent());
        canRedo.set(history.nextRedo().isPresent());
        undoText.set(history.nextUndo().map(e -> "Undo " + e.description()).orElse("Undo"));
        redoText.set(history.nextRedo().map(e -> "Redo " + e.description()).orElse("Redo"));
        dirty.set(d != saved);
        editor.designChanged(d);
        monteCarlo.designChanged(d);
        tradeoff.designChanged(d);
        analyse();
        headroom.request(d);
    }

    // ---- analysis --------------------------------------------------------------------------

    /** The design that is analysed: the edited one, or a copy on a fixed rail at the trial voltage. */
    Design analysedDesign() {
        Design d = design.get();
        if (!trialActive.get()) {
            return d;
        }
        Supply s = d.supply();
        return d.withSupply(new FixedRail(trialVolts.get(), 0, s.rippleVoltsPeak(), s.rippleHz(), s.internalOhms()));
    }

    private void analyse() {
        if (design.get() == null) {
            return;
        }
        if (running != null) {
            running.cancel();
        }
        long mine = ++generation;
        Design target = analysedDesign();
        analysing.set(true);
        status.set(trialActive.get()
                ? String.format("Analysing at a trial supply of %.2f V…", trialVolts.get())
                : "Analysing…");
        running = executor.submit(() -> DesignAnalysis.analyse(target),
                r -> {
                    if (mine == generation) {
                        running = null;
                        accept(r);
                    }
                },
                e -> {
                    if (mine == generation) {
                        running = null;
                        refuse(e);
                    }
                });
    }

    private void accept(DesignReport r) {
        report.set(r);
        analysing.set(false);
        showLadders(r);
        plots.show(r);
        findings.show(r.findings());
        readings.show(r);
        chain.show(r);
        schematic.show(r);
        long fails = r.findings().stream().filter(f -> f.severity() == Severity.FAIL).count();
        long warns = r.findings().stream().filter(f -> f.severity() == Severity.WARN).count();
        String where = trialActive.get() ? String.format(" at a trial supply of %.2f V", trialVolts.get()) : "";
        status.set((lastAction.isEmpty() ? "" : lastAction + " · ") + String.format("Analysed%s: %d op-amp%s, %d failing, %d warning%s, %d finding%s in all",
                where, r.ladders().size(), r.ladders().size() == 1 ? "" : "s", fails, warns,
                warns == 1 ? "" : "s", r.findings().size(), r.findings().size() == 1 ? "" : "s"));
    }

    /** The report's ladders, with the Monte Carlo spread when the latest study was of this very design at its own supply. */
    private void showLadders(DesignReport r) {
        Supply s = designSupply.get();
        List<halfrail.check.Ladder> ls = r.ladders();
        if (spreadFrom != null && !trialActive.get() && spreadFrom.design().equals(design.get())) {
            ls = spreadFrom.withSpread(ls);
        }
        ladders.show(r, ls, s.highVolts(), s.lowVolts());
    }

    /**
     * The analysis threw instead of reporting (a design the check layer refuses, such as an
     * unknown part id): clear the ladders and list the reason as a failing finding, pointing at
     * the field when the error names one, so that nothing stale stays on screen.
     */
    private void refuse(Throwable e) {
        analysing.set(false);
        report.set(null);
        List<String> parts = e instanceof DesignException de ? List.of(de.path()) : List.of();
        Finding f = new Finding(NOT_ANALYSED, Severity.FAIL, "the design could not be analysed: " + e.getMessage(),
                parts, "correct the value named here", Optional.empty(), Optional.empty());
        ladders.clear();
        plots.clear();
        chain.clear();
        schematic.clear("Not drawn: the design could not be analysed.");
        findings.show(List.of(f));
        readings.clear();
        status.set("Not analysed: " + e.getMessage());
    }

    /** The generation number of the latest analysis started (grows by one per analysis). */
    public long generation() {
        return generation;
    }

    private void focusOn(Finding f) {
        if (f == null) {
            ladders.highlight(null);
            editor.highlight(java.util.List.of());
            chain.spotlight(java.util.List.of());
            schematic.spotlight(java.util.List.of());
            return;
        }
        ladders.highlight(f.opAmp().map(op -> new LadderPanelModel.Focus(op, f.level().orElse(null))).orElse(null));
        editor.highlight(f.parts());
        chain.spotlight(f.parts());
        schematic.spotlight(f.parts());
    }

    // ---- files -----------------------------------------------------------------------------

    /** Whether design files can be read and written (a {@link DesignFileActions} was given). */
    public boolean filesAvailable() {
        return files.isPresent();
    }

    /** Keep unsaved work in {@code store} (see {@link #autosave()}). */
    public void useRecovery(RecoveryStore store) {
        this.recovery = Optional.of(store);
    }

    /**
     * Write the design to the recovery file in the background when it has unsaved edits (called
     * every {@link RecoveryStore#AUTOSAVE_SECONDS} s by the app); a failure is told in the status line.
     */
    public void autosave() {
        if (recovery.isEmpty() || !dirty.get()) {
            return;
        }
        RecoveryStore store = recovery.get();
        Design d = design.get();
        executor.submit(() -> store.save(d), written -> { },
                e -> status.set("Could not keep a recovery copy: " + e.getMessage()));
    }

    /** The app closes normally: the recovery file is no longer needed. */
    public void closing() {
        recovery.ifPresent(r -> {
            try {
                r.clear();
            } catch (java.io.IOException e) {
                // nothing to tell at exit; a stale recovery file is offered, and can be declined, at the next start
            }
        });
    }

    /** Use {@code r} to remember the files opened and saved. */
    public void useRecentFiles(RecentFiles r) {
        this.recent = Objects.requireNonNull(r);
    }

    public RecentFiles recentFiles() {
        return recent;
    }

    public Optional<DesignFileActions> files() {
        return files;
    }

    /** Read {@code path} in the background and start over on it. */
    public void open(Path path) {
        DesignFileActions f = files.orElseThrow(() -> new IllegalStateException("no design file support"));
        status.set("Opening " + path.getFileName() + "…");
        executor.submit(() -> f.read(path), d -> {
            replace(d, path);
            recent.add(path);
            status.set("Opened " + path.getFileName());
        }, e -> {
            String why = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
            status.set("Could not open " + path.getFileName() + " (the file is left as it is): " + why);
            openFailure.set(why);
        });
    }

    /** Write the design to {@code path} in the background. */
    public void saveAs(Path path) {
        DesignFileActions f = files.orElseThrow(() -> new IllegalStateException("no design file support"));
        Design d = design.get();
        executor.submit(() -> {
            f.write(d, path);
            return d;
        }, written -> {
            saved = written;
            file.set(path);
            recent.add(path);
            dirty.set(design.get() != saved);
            status.set("Saved " + path.getFileName());
            if (!dirty.get()) {
                closing();
            }
        }, e -> {
            String why = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
            status.set("Could not save " + path.getFileName() + " (the design stays open, unsaved): " + why);
            saveFailure.set(why);
        });
    }

    /** Something written to a file off the FX thread. */
    @FunctionalInterface
    public interface FileWriting {
        void write(Path file) throws java.io.IOException;
    }

    /** Write {@code what} (named in the status line) to {@code path} in the background. */
    public void export(String what, Path path, FileWriting writing) {
        executor.submit(() -> {
            writing.write(path);
            return path;
        }, p -> status.set("Wrote " + what + " to " + p.getFileName()),
                e -> status.set("Could not write " + what + ": " + e.getMessage()));
    }

    /**
     * Write a review of the analysed design (HTML and PDF, see halfrail.io.report) next to
     * {@code path} in the background: {@code path} with its ending replaced by .html and .pdf.
     * Nothing is written before the first analysis has come back.
     */
    public void exportReview(Path path, String toolVersion) {
        DesignReport r = report.get();
        if (r == null) {
            status.set("Nothing to report yet: the analysis is still running");
            return;
        }
        String source = file.get() == null ? r.design().name() : file.get().toString();
        halfrail.io.report.Review review = new halfrail.io.report.Review(
                java.util.List.of(new halfrail.io.report.ReviewEntry(source, r)), toolVersion, java.time.Instant.now());
        executor.submit(() -> halfrail.io.report.ReviewFiles.write(review, path),
                w -> status.set("Wrote the review to " + w.html().getFileName() + " and " + w.pdf().getFileName()),
                e -> status.set("Could not write the review: " + e.getMessage()));
    }

    /** Write the readings and figures as CSV to {@code path} in the background. */
    public void exportReadings(Path path) {
        String text = readings.csv();
        export("the readings", path, p -> java.nio.file.Files.writeString(p, text, java.nio.charset.StandardCharsets.UTF_8));
    }

    // ---- properties ------------------------------------------------------------------------

    public ReadOnlyObjectProperty<Design> designProperty() {
        return design.getReadOnlyProperty();
    }

    public Design design() {
        return design.get();
    }

    public ReadOnlyObjectProperty<DesignReport> reportProperty() {
        return report.getReadOnlyProperty();
    }

    public ReadOnlyStringProperty statusProperty() {
        return status.getReadOnlyProperty();
    }

    public ReadOnlyBooleanProperty analysingProperty() {
        return analysing.getReadOnlyProperty();
    }

    public ReadOnlyBooleanProperty canUndoProperty() {
        return canUndo.getReadOnlyProperty();
    }

    public ReadOnlyBooleanProperty canRedoProperty() {
        return canRedo.getReadOnlyProperty();
    }

    public ReadOnlyStringProperty undoTextProperty() {
        return undoText.getReadOnlyProperty();
    }

    public ReadOnlyStringProperty redoTextProperty() {
        return redoText.getReadOnlyProperty();
    }

    public ReadOnlyBooleanProperty dirtyProperty() {
        return dirty.getReadOnlyProperty();
    }

    /** Why the latest save failed; null before any failure. The view resets it after telling the user. */
    public ObjectProperty<String> saveFailureProperty() {
        return saveFailure;
    }

    /** Why the latest open failed; null before any failure. */
    public ObjectProperty<String> openFailureProperty() {
        return openFailure;
    }

    public ObjectProperty<Path> fileProperty() {
        return file;
    }

    /** Whether the window uses the dark appearance. */
    public BooleanProperty darkProperty() {
        return dark;
    }

    /** Whether the analysis runs at the trial supply instead of the design's own. */
    public BooleanProperty trialActiveProperty() {
        return trialActive;
    }

    /** The trial supply voltage, V (between the supply's end-point and its fresh voltage). */
    public DoubleProperty trialVoltsProperty() {
        return trialVolts;
    }

    /** The lowest trial supply: the supply's end-point, V. */
    public ReadOnlyDoubleProperty trialLowVoltsProperty() {
        return trialLowVolts.getReadOnlyProperty();
    }

    /** The highest trial supply: the supply fresh, V. */
    public ReadOnlyDoubleProperty trialHighVoltsProperty() {
        return trialHighVolts.getReadOnlyProperty();
    }

    public ReadOnlyObjectProperty<Supply> designSupplyProperty() {
        return designSupply.getReadOnlyProperty();
    }

    public LadderPanelModel ladders() {
        return ladders;
    }

    public FindingsPanelModel findings() {
        return findings;
    }

    public ReadingsPanelModel readings() {
        return readings;
    }

    public HeadroomSweepModel headroom() {
        return headroom;
    }

    public DividerTradeoffModel tradeoff() {
        return tradeoff;
    }

    public ConversionModel conversion() {
        return conversion;
    }

    public ReportPlotsModel plots() {
        return plots;
    }

    public MonteCarloModel monteCarlo() {
        return monteCarlo;
    }

    /** The circuit drawing's view-model. */
    public SchematicModel schematic() {
        return schematic;
    }

    public ChainPanelModel chain() {
        return chain;
    }

    public EditorPanelModel editor() {
        return editor;
    }
}
