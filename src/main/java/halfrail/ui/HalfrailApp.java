package halfrail.ui;

import halfrail.design.Design;
import javafx.application.Application;
import javafx.scene.Scene;
import javafx.stage.Stage;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * The desktop application: one main window on the built-in sample design (or on the design
 * file given as the only argument), analysed in the background. Started through {@link AppLauncher#launch(String[])} so that the launcher class
 * needs no JavaFX on its own class path.
 */
public class HalfrailApp extends Application {
    /** The version written into exported reviews (the command line's {@code --version} says the same). */
    public static final String VERSION = "0.1.0-SNAPSHOT";

    /** Width of the main window when it opens, px. */
    public static final double WINDOW_WIDTH = 1440;
    /** Height of the main window when it opens, px. */
    public static final double WINDOW_HEIGHT = 900;

    private static volatile Optional<DesignFileActions> fileActions = Optional.empty();
    private static volatile Optional<java.nio.file.Path> stateFolder = Optional.empty();

    private AnalysisExecutor executor;
    private AnalysisExecutor studies;
    private WorkbenchModel model;

    /** Give the app its design-file support before it starts (null for none). */
    public static void useFileActions(DesignFileActions actions) {
        fileActions = Optional.ofNullable(actions);
    }

    /** When {@link #start} was called, ns ({@link System#nanoTime}). */
    private long startedNanos;

    /**
     * Keep the recovery files and instance locks in {@code folder} instead of the user's cache
     * folder, and the recent-files list only for the run (null for the usual places). For tests
     * and for a run that must leave the user's own state alone.
     */
    public static void useStateFolder(java.nio.file.Path folder) {
        stateFolder = Optional.ofNullable(folder);
    }

    @Override
    public void start(Stage stage) {
        startedNanos = System.nanoTime();
        executor = new BackgroundAnalysisExecutor();
        studies = new BackgroundAnalysisExecutor();
        model = new WorkbenchModel(executor, studies, SampleDesigns.instrumentBoost(), fileActions);
        model.darkProperty().set(systemPrefersDark(System.getenv("GTK_THEME")));
        RecoveryStore recovery = null;
        String instanceNote = null;
        if (fileActions.isPresent()) {
            model.useRecentFiles(stateFolder.isPresent() ? new RecentFiles(List.of(), l -> { }) : storedRecentFiles());
            java.nio.file.Path folder = stateFolder.orElseGet(() ->
                    RecoveryStore.defaultFolder(System.getenv(), System.getProperty("user.home")));
            try {
                instance = InstanceLock.acquire(folder).orElse(null);
            } catch (java.io.IOException e) {
                instance = null;
            }
            if (instance != null) {
                recovery = new RecoveryStore(folder, fileActions.get(), instance.slot());
                model.useRecovery(recovery);
                if (!instance.first()) {
                    instanceNote = "Another Halfrail window is open: this one keeps its unsaved work in a recovery file"
                            + " of its own (" + recovery.file().getFileName() + ")";
                }
            } else {
                instanceNote = "Unsaved work of this window is not kept against a crash: the state folder " + folder
                        + " could not be claimed (too many Halfrail windows, or not writable)";
            }
        }
        WorkbenchView view = new WorkbenchView(model);
        if (Boolean.getBoolean(EXIT_AFTER_FIRST_ANALYSIS)) {
            exitOnceAnalysed(view);
        }
        stage.setTitle("Halfrail — single-supply stage checker");
        stage.setScene(scene(view));
        stage.setOnCloseRequest(e -> {
            if (!view.confirmDiscard()) {
                e.consume();
            }
        });
        stage.show();
        List<String> raw = getParameters().getRaw();
        if (raw.size() == 1 && fileActions.isPresent()) {
            model.open(java.nio.file.Path.of(raw.get(0)));
        }
        if (instanceNote != null) {
            model.tellUser(instanceNote);
        }
        if (recovery != null) {
            // Asked after start() returns, so that the window is up and painted behind the question.
            RecoveryStore kept = recovery;
            javafx.application.Platform.runLater(() -> offerRecovery(kept));
            autosave = new javafx.animation.Timeline(new javafx.animation.KeyFrame(
                    javafx.util.Duration.seconds(RecoveryStore.AUTOSAVE_SECONDS), e -> model.autosave()));
            autosave.setCycleCount(javafx.animation.Animation.INDEFINITE);
            autosave.play();
        }
    }

    private javafx.animation.Timeline autosave;
    private InstanceLock instance;

    /**
     * System property: when {@code true} the app quits as soon as the first analysis is on screen,
     * after printing the time since {@link #start} was called ({@code bench/startup.sh} times start-up with it).
     */
    public static final String EXIT_AFTER_FIRST_ANALYSIS = "halfrail.exitAfterFirstAnalysis";

    /** Quit once the first report has been laid out and drawn (the pulse after it arrived). */
    private void exitOnceAnalysed(WorkbenchView view) {
        javafx.beans.value.ChangeListener<halfrail.check.DesignReport> once = new javafx.beans.value.ChangeListener<>() {
            @Override
            public void changed(javafx.beans.value.ObservableValue<? extends halfrail.check.DesignReport> o,
                                halfrail.check.DesignReport was, halfrail.check.DesignReport now) {
                if (now == null || view.getScene() == null) {
                    return;
                }
                o.removeListener(this);
                javafx.scene.Scene scene = view.getScene();
                Runnable[] drawn = new Runnable[1];
                drawn[0] = () -> {
                    scene.removePostLayoutPulseListener(drawn[0]);
                    long ms = (System.nanoTime() - startedNanos) / 1_000_000;
                    System.out.println("first analysis shown " + ms + " ms after the toolkit started the app");
                    javafx.application.Platform.exit();
                };
                scene.addPostLayoutPulseListener(drawn[0]);
                javafx.application.Platform.requestNextPulse();
            }
        };
        view.model().reportProperty().addListener(once);
    }

    /** A recovery file from a session that did not close normally: offer to restore it. */
    private void offerRecovery(RecoveryStore recovery) {
        Optional<RecoveryPrompt> prompt = RecoveryPrompt.atStart(recovery, model);
        if (prompt.isEmpty()) {
            return;
        }
        javafx.scene.control.Alert ask = new javafx.scene.control.Alert(javafx.scene.control.Alert.AlertType.CONFIRMATION,
                prompt.get().message(), javafx.scene.control.ButtonType.YES, javafx.scene.control.ButtonType.NO);
        ask.setHeaderText(prompt.get().header());
        ask.getDialogPane().setId(RECOVERY_DIALOG_ID);
        if (ask.showAndWait().filter(javafx.scene.control.ButtonType.YES::equals).isPresent()) {
            prompt.get().accept();
        } else {
            prompt.get().decline();
        }
    }

    /** Id of the restore question's dialog pane (tests look it up). */
    static final String RECOVERY_DIALOG_ID = "recovery-prompt";

    /** Preferences key of the recent-files list (one path a line). */
    static final String RECENT_KEY = "recentDesignFiles";

    /**
     * The recent files, kept in the user's preferences for this package; read again before each
     * change, so that two app windows merge their additions instead of overwriting each other's.
     */
    private static RecentFiles storedRecentFiles() {
        java.util.prefs.Preferences prefs = java.util.prefs.Preferences.userNodeForPackage(HalfrailApp.class);
        return new RecentFiles(() -> {
            try {
                prefs.sync();
            } catch (java.util.prefs.BackingStoreException | IllegalStateException e) {
                // the cached list is used
            }
            return List.of(prefs.get(RECENT_KEY, "").split("\n"));
        }, list -> prefs.put(RECENT_KEY, String.join("\n", list)));
    }

    /**
     * Whether the desktop asks for a dark appearance. JavaFX 17 does not report the system's
     * choice, so this reads the GTK theme variable, whose {@code :dark} suffix selects a theme's
     * dark variant (GTK 3 documentation, "Running and debugging GTK applications").
     */
    static boolean systemPrefersDark(String gtkTheme) {
        return gtkTheme != null && gtkTheme.toLowerCase(java.util.Locale.ROOT).endsWith(":dark");
    }

    @Override
    public void stop() {
        if (autosave != null) {
            autosave.stop();
        }
        if (model != null) {
            model.monteCarlo().shutdown();
            model.closing();
        }
        if (instance != null) {
            try {
                instance.close();
            } catch (java.io.IOException e) {
                // the lock goes with the process anyway
            }
            instance = null;
        }
        if (executor != null) {
            executor.shutdown();
        }
        if (studies != null) {
            studies.shutdown();
        }
    }

    /** The main window's view-model (null before {@link #start}). */
    public WorkbenchModel model() {
        return model;
    }

    /** A scene with the app's stylesheet around {@code view}. */
    public static Scene scene(WorkbenchView view) {
        javafx.geometry.Rectangle2D screen = javafx.stage.Screen.getPrimary().getVisualBounds();
        Scene scene = new Scene(view, Math.min(WINDOW_WIDTH, screen.getWidth()),
                Math.min(WINDOW_HEIGHT, screen.getHeight()));
        scene.getStylesheets().add(Objects.requireNonNull(
                HalfrailApp.class.getResource("halfrail.css"), "halfrail.css").toExternalForm());
        return scene;
    }

    /** A main window's view and view-model on {@code design}, analysed through {@code executor}. */
    public static WorkbenchView workbench(AnalysisExecutor executor, Design design) {
        return new WorkbenchView(new WorkbenchModel(executor, design, fileActions));
    }
}
