package halfrail;

import halfrail.cli.HalfrailCommand;

/**
 * Entry point. With arguments it runs the command line headless and exits with its code (the
 * UI toolkit is never loaded); with none it opens the desktop app on the bundled sample design.
 */
public final class Main {
    private Main() {}

    public static void main(String[] args) {
        if (args.length == 0) {
            openApp(args);
            return;
        }
        System.exit(HalfrailCommand.newCommandLine().execute(args));
    }

    /** Kept apart so that a command-line run never touches, and so never loads, the UI classes. */
    private static void openApp(String[] args) {
        halfrail.ui.AppLauncher.launch(args);
    }
}
