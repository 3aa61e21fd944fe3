package halfrail.ui;

import javafx.application.Application;

/**
 * The bridge from the command-line launcher to the desktop app. {@code halfrail.Main} calls
 * {@link #launch(String[])} when it gets no arguments; because JavaFX sits on the class path
 * rather than the module path, the class holding {@code main} must not extend
 * {@link Application} itself, and this class keeps the JavaFX types out of it.
 */
public final class AppLauncher {
    private AppLauncher() {}

    /** Open the main window, with design files for open and save, and return when it is closed. */
    public static void launch(String[] args) {
        warmUp();
        HalfrailApp.useFileActions(new JsonDesignFiles());
        Application.launch(HalfrailApp.class, args);
    }

    /**
     * Read the built-in parts library (JSON, through Jackson: about 600 classes) on a thread of its
     * own while the toolkit starts, instead of on the FX thread when the window's view-models are
     * made; the first analysis needs it too. The library's holder class makes the load happen once,
     * whichever thread asks first; a failure is left for the first real use to report.
     */
    private static void warmUp() {
        Thread t = new Thread(() -> {
            try {
                halfrail.parts.PartsLibrary.builtIn();
            } catch (RuntimeException e) {
                // reported, with its resource and JSON path, where the library is first used for real
            }
        }, "halfrail-warm-up");
        t.setDaemon(true);
        t.start();
    }
}
