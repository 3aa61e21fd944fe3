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
        HalfrailApp.useFileActions(new JsonDesignFiles());
        Application.launch(HalfrailApp.class, args);
    }
}
