package halfrail.cli;

/** The exit codes of every command, in one place. */
public final class ExitCodes {
    /** Nothing at or above the {@code --fail-on} severity was found; or a command other than check succeeded. */
    public static final int PASS = 0;
    /** At least one finding at or above the {@code --fail-on} severity. */
    public static final int FINDING = 1;
    /** Bad input: an unreadable file, a parse error, an unknown or invalid option. */
    public static final int BAD_INPUT = 2;
    /** A fault inside Halfrail itself (a bug); the message says what failed. */
    public static final int INTERNAL_ERROR = 3;

    private ExitCodes() {}
}
