package halfrail;

import halfrail.cli.HalfrailCommand;

/**
 * Entry point. With arguments it runs the command line headless and exits with its code (the
 * UI toolkit is never loaded); with none it opens the desktop app on the bundled sample design,
 * and with one design file and nothing else it opens the app on that file.
 */
public final class Main {
    private Main() {}

    public static void main(String[] args) {
        if (args.length == 0 || opensADesign(args)) {
            openApp(args);
            return;
        }
        System.exit(HalfrailCommand.newCommandLine().execute(args));
    }

    /**
     * Whether the arguments are one existing design file and nothing else (how a file manager
     * opens a design): the app opens it. Anything else is a command line.
     */
    static boolean opensADesign(String[] args) {
        if (args.length != 1 || !args[0].toLowerCase(java.util.Locale.ROOT).endsWith(".json")) {
            return false;
        }
        return java.nio.file.Files.isRegularFile(java.nio.file.Path.of(args[0]));
    }

    /** Kept apart so that a command-line run never touches, and so never loads, the UI classes. */
    private static void openApp(String[] args) {
        halfrail.ui.AppLauncher.launch(args);
    }
}
