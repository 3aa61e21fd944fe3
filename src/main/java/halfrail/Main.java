package halfrail;

import halfrail.cli.HalfrailCommand;

/**
 * Entry point. With arguments it runs the command line and exits with its code; with none it
 * prints the usage and exits with code 2 until the desktop app exists.
 */
public final class Main {
    private Main() {}

    public static void main(String[] args) {
        System.exit(HalfrailCommand.newCommandLine().execute(args));
    }
}
