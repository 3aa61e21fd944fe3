package halfrail.ui;

import halfrail.design.Design;
import javafx.geometry.Insets;
import javafx.geometry.Orientation;
import javafx.scene.control.Alert;
import javafx.scene.control.ButtonType;
import javafx.scene.control.Label;
import javafx.scene.control.Menu;
import javafx.scene.control.MenuBar;
import javafx.scene.control.MenuItem;
import javafx.scene.control.SeparatorMenuItem;
import javafx.scene.control.SplitPane;
import javafx.scene.input.KeyCombination;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;
import javafx.stage.FileChooser;
import javafx.stage.Window;

import java.io.File;
import java.util.function.Supplier;

/**
 * The main window's content: the design editor on the left; the ladders, the supply trial and
 * the readings in the middle; the findings on the right; menus on top and the status line at
 * the bottom. Every handler is one call into {@link WorkbenchModel} or a panel's view-model.
 */
public final class WorkbenchView extends BorderPane {
    private final WorkbenchModel model;
    private final EditorPanel editor;
    private final LadderPanel ladders;
    private final FindingsPanel findings;
    private final ReadingsPanel readings;
    private final SupplyTrialBar trial;
    private final ChainCanvas chain;
    // the tabs under the ladders other than the readings are built when first shown (start-up time)
    private final LazyTab<SchematicCanvas> schematic;
    private final LazyTab<HeadroomChart> headroomChart;
    private final LazyTab<MonteCarloPanel> monteCarlo;
    private final LazyTab<DividerTradeoffChart> tradeoffChart;
    private final LazyTab<PowerOnChart> powerOnChart;
    private final LazyTab<ResponseChart> responseChart;
    private final javafx.scene.control.TabPane bottomTabs;
    private final SplitPane middle;
    private final Label status = new Label();

    public WorkbenchView(WorkbenchModel model) {
        this.model = model;
        getStyleClass().add("workbench");
        editor = new EditorPanel(model.editor());
        javafx.beans.binding.ObjectBinding<Palette> palette = javafx.beans.binding.Bindings.createObjectBinding(
                () -> Palette.of(model.darkProperty().get()), model.darkProperty());
        ladders = new LadderPanel(model.ladders(), palette);
        findings = new FindingsPanel(model.findings());
        readings = new ReadingsPanel(model.readings());
        trial = new SupplyTrialBar(model);

        chain = new ChainCanvas(model.chain());
        chain.paletteProperty().bind(palette);
        String darkSheet = java.util.Objects.requireNonNull(getClass().getResource("halfrail-dark.css")).toExternalForm();
        model.darkProperty().addListener((o, was, now) -> appearance(darkSheet, now));
        appearance(darkSheet, model.darkProperty().get());
        VBox centre = new VBox(4, chain, ladders, trial);
        VBox.setVgrow(ladders, Priority.ALWAYS);
        centre.setPadding(new Insets(4));
        HBox numbers = new HBox(8, readings.stagesBox(), readings.figuresBox());
        HBox.setHgrow(readings.stagesBox(), Priority.ALWAYS);
        numbers.setPadding(new Insets(4));
        javafx.scene.control.Tab readingsTab = new javafx.scene.control.Tab("Readings", numbers);
        headroomChart = new LazyTab<>("Headroom against supply", "headroom-tab", () -> new HeadroomChart(model.headroom()));
        powerOnChart = new LazyTab<>("Power-on", "power-on-tab", () -> new PowerOnChart(model.plots()));
        responseChart = new LazyTab<>("Low-frequency response", "response-tab", () -> new ResponseChart(model.plots()));
        tradeoffChart = new LazyTab<>("Battery trade-off", "tradeoff-tab", () -> new DividerTradeoffChart(model.tradeoff()));
        // the supply sweep and the trade-off study run once their plots are shown, not before the first frame
        model.headroom().wantedProperty().bind(headroomChart.tab().selectedProperty());
        model.tradeoff().wantedProperty().bind(tradeoffChart.tab().selectedProperty());
        monteCarlo = new LazyTab<>("Monte Carlo", "monte-carlo-tab", () -> new MonteCarloPanel(model.monteCarlo(), palette));
        schematic = new LazyTab<>("Circuit", "circuit-tab", () -> {
            SchematicCanvas c = new SchematicCanvas(model.schematic());
            c.paletteProperty().bind(palette);
            return c;
        });
        bottomTabs = new javafx.scene.control.TabPane(readingsTab, headroomChart.tab(), powerOnChart.tab(),
                responseChart.tab(), tradeoffChart.tab(), monteCarlo.tab(), schematic.tab());
        bottomTabs.setTabClosingPolicy(javafx.scene.control.TabPane.TabClosingPolicy.UNAVAILABLE);
        middle = new SplitPane(centre, bottomTabs);
        middle.setOrientation(Orientation.VERTICAL);
        middle.setDividerPositions(0.68);
        SplitPane main = new SplitPane(editor, middle, findings);
        main.setDividerPositions(0.235, 0.755);
        SplitPane.setResizableWithParent(editor, false);
        editor.setMinWidth(280);
        findings.setMinWidth(300);
        model.saveFailureProperty().addListener((o, was, now) -> {
            if (now != null) {
                warn("The design was not saved", now + "\n\nThe design stays open with its edits; save it somewhere else.");
                model.saveFailureProperty().set(null);
            }
        });
        model.openFailureProperty().addListener((o, was, now) -> {
            if (now != null) {
                warn("The file could not be opened", now + "\n\nThe file has not been changed.");
                model.openFailureProperty().set(null);
            }
        });
        setTop(menus());
        setCenter(main);
        setBottom(statusLine());
    }

    private void warn(String header, String text) {
        if (getScene() == null || getScene().getWindow() == null || !getScene().getWindow().isShowing()) {
            return;
        }
        Alert a = new Alert(Alert.AlertType.ERROR, text, ButtonType.OK);
        a.setHeaderText(header);
        a.initOwner(getScene().getWindow());
        a.show();
    }

    private void appearance(String darkSheet, boolean dark) {
        getStylesheets().remove(darkSheet);
        if (dark) {
            getStylesheets().add(darkSheet);
        }
    }

    private HBox statusLine() {
        status.setId("status");
        status.textProperty().bind(model.statusProperty());
        Label file = new Label();
        file.textProperty().bind(javafx.beans.binding.Bindings.createStringBinding(() -> {
            String name = model.fileProperty().get() == null ? model.design().name()
                    : model.fileProperty().get().getFileName().toString();
            return (model.dirtyProperty().get() ? "● " : "") + name;
        }, model.fileProperty(), model.dirtyProperty(), model.designProperty()));
        file.getStyleClass().add("status-file");
        Label busy = new Label("analysing");
        busy.getStyleClass().add("busy");
        busy.visibleProperty().bind(model.analysingProperty());
        Region gap = new Region();
        HBox.setHgrow(gap, Priority.ALWAYS);
        HBox line = new HBox(10, status, gap, busy, file);
        line.getStyleClass().add("status-line");
        line.setPadding(new Insets(3, 8, 3, 8));
        return line;
    }

    private MenuBar menus() {
        Menu design = new Menu("Design");
        Menu samples = new Menu("Start from a sample");
        samples.getItems().addAll(
                sample("Instrument boost, 9 V", SampleDesigns::instrumentBoost),
                sample("Instrument boost without its leg capacitor (faulty)", SampleDesigns::missingLegCapacitor));
        Menu fresh = new Menu("New from a template");
        for (halfrail.design.StageKind sk : halfrail.design.StageKind.values()) {
            Menu byStage = new Menu(DesignTemplates.words(sk) + " stage");
            for (halfrail.design.ReferenceKind rk : halfrail.design.ReferenceKind.values()) {
                byStage.getItems().add(sample("… with a " + DesignTemplates.words(rk), () -> DesignTemplates.of(sk, rk)));
            }
            fresh.getItems().add(byStage);
        }
        MenuItem open = new MenuItem("Open…");
        open.setAccelerator(KeyCombination.keyCombination("Shortcut+O"));
        open.setOnAction(e -> openFile());
        Menu recent = new Menu("Open recent");
        recent.setDisable(!model.filesAvailable());
        Runnable fill = () -> {
            recent.getItems().clear();
            for (java.nio.file.Path p : model.recentFiles().files()) {
                MenuItem item = new MenuItem(p.getFileName() + "  —  " + p.getParent());
                item.setOnAction(e -> {
                    if (confirmDiscard()) {
                        model.open(p);
                    }
                });
                recent.getItems().add(item);
            }
            if (recent.getItems().isEmpty()) {
                MenuItem none = new MenuItem("(none yet)");
                none.setDisable(true);
                recent.getItems().add(none);
            }
        };
        recent.setOnShowing(e -> fill.run());
        fill.run();
        MenuItem save = new MenuItem("Save");
        save.setAccelerator(KeyCombination.keyCombination("Shortcut+S"));
        save.setOnAction(e -> save(false));
        MenuItem saveAs = new MenuItem("Save as…");
        saveAs.setAccelerator(KeyCombination.keyCombination("Shortcut+Shift+S"));
        saveAs.setOnAction(e -> save(true));
        boolean files = model.filesAvailable();
        open.setDisable(!files);
        save.setDisable(!files);
        saveAs.setDisable(!files);
        MenuItem quit = new MenuItem("Quit");
        quit.setAccelerator(KeyCombination.keyCombination("Shortcut+Q"));
        quit.setOnAction(e -> {
            if (confirmDiscard() && getScene() != null) {
                getScene().getWindow().hide();
            }
        });
        MenuItem csv = new MenuItem("Export the readings as CSV…");
        csv.setOnAction(e -> exportReadings());
        MenuItem picture = new MenuItem("Save a picture of the ladders…");
        picture.setOnAction(e -> savePicture(ladders, "ladders.png"));
        MenuItem plot = new MenuItem("Save a picture of the headroom plot…");
        plot.setOnAction(e -> savePicture(headroomChart, "headroom.png"));
        MenuItem mcPicture = new MenuItem("Save a picture of the Monte Carlo histograms…");
        mcPicture.setOnAction(e -> savePicture(monteCarlo, "monte-carlo.png"));
        MenuItem powerPicture = new MenuItem("Save a picture of the power-on plot…");
        powerPicture.setOnAction(e -> savePicture(powerOnChart, "power-on.png"));
        MenuItem responsePicture = new MenuItem("Save a picture of the response plot…");
        responsePicture.setOnAction(e -> savePicture(responseChart, "response.png"));
        MenuItem tradePicture = new MenuItem("Save a picture of the battery trade-off…");
        tradePicture.setOnAction(e -> savePicture(tradeoffChart, "battery-tradeoff.png"));
        MenuItem powerCsv = new MenuItem("Export the power-on trace as CSV…");
        powerCsv.setOnAction(e -> exportCsv("the power-on trace", "power-on.csv", () -> model.plots().powerOnCsv()));
        MenuItem responseCsv = new MenuItem("Export the response curves as CSV…");
        responseCsv.setOnAction(e -> exportCsv("the response curves", "response.csv", () -> model.plots().responseCsv()));
        MenuItem tradeCsv = new MenuItem("Export the battery trade-off as CSV…");
        tradeCsv.setOnAction(e -> exportCsv("the battery trade-off", "battery-tradeoff.csv", () -> model.tradeoff().csv()));
        MenuItem mcCsv = new MenuItem("Export the Monte Carlo histograms as CSV…");
        mcCsv.setOnAction(e -> exportCsv("the Monte Carlo histograms", "monte-carlo.csv", () -> model.monteCarlo().csv()));
        MenuItem review = new MenuItem("Export a review (HTML and PDF)…");
        review.setOnAction(e -> exportReview());
        MenuItem window = new MenuItem("Save a picture of the window…");
        window.setOnAction(e -> savePicture(this, "halfrail-window.png"));
        Menu tables = new Menu("Export a table as CSV");
        tables.getItems().addAll(csv, powerCsv, responseCsv, tradeCsv, mcCsv);
        Menu pictures = new Menu("Save a picture (PNG)");
        pictures.getItems().addAll(picture, plot, powerPicture, responsePicture, tradePicture, mcPicture, window);
        design.getItems().addAll(fresh, samples, new SeparatorMenuItem(), open, recent, save, saveAs, new SeparatorMenuItem(), review,
                tables, pictures, new SeparatorMenuItem(), quit);

        Menu edit = new Menu("Edit");
        MenuItem undo = new MenuItem();
        undo.setId("undo");
        undo.textProperty().bind(model.undoTextProperty());
        undo.disableProperty().bind(model.canUndoProperty().not());
        undo.setAccelerator(KeyCombination.keyCombination("Shortcut+Z"));
        undo.setOnAction(e -> model.undo());
        MenuItem redo = new MenuItem();
        redo.setId("redo");
        redo.textProperty().bind(model.redoTextProperty());
        redo.disableProperty().bind(model.canRedoProperty().not());
        redo.setAccelerator(KeyCombination.keyCombination("Shortcut+Shift+Z"));
        redo.setOnAction(e -> model.redo());
        MenuItem add = new MenuItem("Add a stage");
        add.setAccelerator(KeyCombination.keyCombination("Shortcut+Shift+N"));
        add.setOnAction(e -> model.editor().addStage());
        MenuItem convert = new MenuItem("Move a dual-rail stage or chain to one supply…");
        convert.setId("convert");
        convert.setAccelerator(KeyCombination.keyCombination("Shortcut+Shift+K"));
        convert.setOnAction(e -> ConversionDialog.show(model.conversion(), window(),
                getScene() == null ? java.util.List.of() : getScene().getStylesheets()));
        edit.getItems().addAll(undo, redo, new SeparatorMenuItem(), add, new SeparatorMenuItem(), convert);
        Menu look = new Menu("View");
        javafx.scene.control.CheckMenuItem darkItem = new javafx.scene.control.CheckMenuItem("Dark appearance");
        darkItem.setId("dark");
        darkItem.selectedProperty().bindBidirectional(model.darkProperty());
        darkItem.setAccelerator(KeyCombination.keyCombination("Shortcut+Shift+D"));
        look.getItems().addAll(darkItem, new SeparatorMenuItem());
        // the tabs under the ladders by number, in their order (Shortcut+1 … Shortcut+7)
        for (int i = 0; i < bottomTabs.getTabs().size() && i < 9; i++) {
            javafx.scene.control.Tab tab = bottomTabs.getTabs().get(i);
            MenuItem go = new MenuItem("Show " + tab.getText());
            go.setAccelerator(KeyCombination.keyCombination("Shortcut+" + (i + 1)));
            go.setOnAction(e -> bottomTabs.getSelectionModel().select(tab));
            look.getItems().add(go);
        }
        MenuItem study = new MenuItem("Run the Monte Carlo study");
        study.setId("run-study");
        study.setAccelerator(KeyCombination.keyCombination("Shortcut+R"));
        study.setOnAction(e -> {
            bottomTabs.getTabs().stream().filter(t -> "monte-carlo-tab".equals(t.getId())).findFirst()
                    .ifPresent(t -> bottomTabs.getSelectionModel().select(t));
            model.monteCarlo().run();
        });
        edit.getItems().addAll(new SeparatorMenuItem(), study);
        design.setMnemonicParsing(true);
        design.setText("_Design");
        edit.setText("_Edit");
        look.setText("_View");
        return new MenuBar(design, edit, look);
    }

    private MenuItem sample(String name, Supplier<Design> make) {
        MenuItem item = new MenuItem(name);
        item.setOnAction(e -> {
            if (confirmDiscard()) {
                model.replace(make.get(), null);
            }
        });
        return item;
    }

    /** Ask before unsaved edits are lost; true when it is fine to go on. */
    boolean confirmDiscard() {
        if (!model.dirtyProperty().get()) {
            return true;
        }
        Alert ask = new Alert(Alert.AlertType.CONFIRMATION, "The design has edits that are not saved. Discard them?",
                ButtonType.YES, ButtonType.NO);
        ask.setHeaderText("Unsaved edits");
        return ask.showAndWait().filter(ButtonType.YES::equals).isPresent();
    }

    private void openFile() {
        if (!confirmDiscard()) {
            return;
        }
        FileChooser chooser = chooser("Open a design");
        File f = chooser.showOpenDialog(window());
        if (f != null) {
            model.open(f.toPath());
        }
    }

    private void save(boolean askName) {
        if (!askName && model.fileProperty().get() != null) {
            model.saveAs(model.fileProperty().get());
            return;
        }
        File f = chooser("Save the design").showSaveDialog(window());
        if (f != null) {
            model.saveAs(f.toPath());
        }
    }

    private void exportReview() {
        FileChooser c = new FileChooser();
        c.setTitle("Export a review");
        c.setInitialFileName("review.html");
        c.getExtensionFilters().add(new FileChooser.ExtensionFilter("HTML and PDF", "*.html", "*.pdf"));
        File f = c.showSaveDialog(window());
        if (f != null) {
            model.exportReview(f.toPath(), HalfrailApp.VERSION);
        }
    }

    private void exportReadings() {
        FileChooser c = new FileChooser();
        c.setTitle("Export the readings");
        c.setInitialFileName("readings.csv");
        c.getExtensionFilters().add(new FileChooser.ExtensionFilter("CSV", "*.csv"));
        File f = c.showSaveDialog(window());
        if (f != null) {
            model.exportReadings(f.toPath());
        }
    }

    private void exportCsv(String what, String name, Supplier<String> text) {
        FileChooser c = new FileChooser();
        c.setTitle("Export " + what);
        c.setInitialFileName(name);
        c.getExtensionFilters().add(new FileChooser.ExtensionFilter("CSV", "*.csv"));
        File f = c.showSaveDialog(window());
        if (f != null) {
            String body = text.get();
            model.export(what, f.toPath(), p -> java.nio.file.Files.writeString(p, body, java.nio.charset.StandardCharsets.UTF_8));
        }
    }

    private void savePicture(javafx.scene.Node node, String name) {
        FileChooser c = new FileChooser();
        c.setTitle("Save a picture");
        c.setInitialFileName(name);
        c.getExtensionFilters().add(new FileChooser.ExtensionFilter("PNG", "*.png"));
        File f = c.showSaveDialog(window());
        if (f != null) {
            java.awt.image.BufferedImage image = javafx.embed.swing.SwingFXUtils.fromFXImage(node.snapshot(null, null), null);
            model.export("the picture", f.toPath(), p -> javax.imageio.ImageIO.write(image, "png", p.toFile()));
        }
    }

    /**
     * Save a picture of a tab's content: the tab is shown first, so that it is built and laid out
     * and a study that waits for its plot (the supply sweep, the trade-off) runs while the file
     * chooser is open.
     */
    private void savePicture(LazyTab<?> tab, String name) {
        bottomTabs.getSelectionModel().select(tab.tab());
        savePicture(tab.content(), name);
    }

    private FileChooser chooser(String title) {
        FileChooser c = new FileChooser();
        c.setTitle(title);
        model.files().ifPresent(fa -> c.getExtensionFilters().add(
                new FileChooser.ExtensionFilter("Halfrail designs", "*." + fa.extension())));
        return c;
    }

    private Window window() {
        return getScene() == null ? null : getScene().getWindow();
    }

    public WorkbenchModel model() {
        return model;
    }

    public EditorPanel editor() {
        return editor;
    }

    public LadderPanel ladders() {
        return ladders;
    }

    public FindingsPanel findings() {
        return findings;
    }

    public ReadingsPanel readings() {
        return readings;
    }

    public HeadroomChart headroomChart() {
        return headroomChart.content();
    }

    /** The split between the ladders (top) and the tabs of readings and plots (bottom). */
    public SplitPane middleSplit() {
        return middle;
    }

    /** The tabs under the ladders: the readings and the plots. */
    public javafx.scene.control.TabPane bottomTabs() {
        return bottomTabs;
    }

    public DividerTradeoffChart tradeoffChart() {
        return tradeoffChart.content();
    }

    public PowerOnChart powerOnChart() {
        return powerOnChart.content();
    }

    public ResponseChart responseChart() {
        return responseChart.content();
    }

    public MonteCarloPanel monteCarlo() {
        return monteCarlo.content();
    }

    /** The circuit drawing (in the last tab). */
    public SchematicCanvas schematic() {
        return schematic.content();
    }

    /**
     * Whether the content of the tab with {@code tabId} under the ladders has been built: the
     * readings always are, the others once first shown (or asked for through their accessor).
     */
    public boolean tabBuilt(String tabId) {
        for (LazyTab<?> t : java.util.List.of(headroomChart, powerOnChart, responseChart, tradeoffChart, monteCarlo, schematic)) {
            if (t.tab().getId().equals(tabId)) {
                return t.isBuilt();
            }
        }
        return bottomTabs.getTabs().stream().anyMatch(t -> tabId.equals(t.getId()) && t.getContent() != null);
    }

    public ChainCanvas chain() {
        return chain;
    }

    public SupplyTrialBar trial() {
        return trial;
    }
}
