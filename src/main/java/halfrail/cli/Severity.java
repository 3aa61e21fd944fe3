package halfrail.cli;

import java.util.Locale;

/** How bad a finding is; later constants are worse. Written in lower case on the command line and in reports. */
public enum Severity {
    /** Works, but with little margin; worth a look. */
    WARN,
    /** The stage does not work as intended. */
    FAIL;

    /** The lower-case form used by {@code --fail-on} and in reports. */
    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }
}
