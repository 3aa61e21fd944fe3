package halfrail.io;

import java.util.Objects;

/**
 * A design file could not be read or saved. {@link #kind()} says what went wrong,
 * {@link #jsonPath()} where in the file (for example {@code $.stages[1].legCapacitor.farads};
 * empty when the problem is not tied to one value), {@link #line()} and {@link #column()} where
 * in the text for syntax errors (1-based; 0 when unknown), and {@link #expected()} what would
 * have been accepted. The message is one line for people and starts with the file's name.
 * Tests and callers switch on the kind, never on the message.
 */
public final class DesignFileException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** What made the file unusable. */
    public enum Kind {
        /** The text is not JSON: a stray character, an unclosed string, trailing content, empty text. */
        SYNTAX,
        /** An object holds the same field twice. */
        DUPLICATE_FIELD,
        /** An object holds a field the format does not define (or the format version does not). */
        UNKNOWN_FIELD,
        /** A required field is absent. */
        MISSING_FIELD,
        /** A field holds the wrong kind of JSON value (text where an object belongs, null, …). */
        WRONG_TYPE,
        /** A value has the right type but is refused: not a value in the expected unit, out of range, an unknown id. */
        BAD_VALUE,
        /** The file is not a Halfrail design file (its {@code format} field says something else). */
        NOT_A_DESIGN,
        /** The file was written by a newer Halfrail: its {@code formatVersion} is above the one known. */
        NEWER_VERSION,
        /** The file exceeds a documented limit: its size, nesting depth, or the length of a text or number. */
        TOO_LARGE,
        /** The file or its folder could not be read or written (missing, read-only, a folder, a disk error). */
        IO
    }

    private final Kind kind;
    private final String source;
    private final String jsonPath;
    private final String expected;
    private final int line;
    private final int column;

    DesignFileException(Kind kind, String source, String jsonPath, String expected, int line, int column,
                        String detail, Throwable cause) {
        super(oneLine(message(source, jsonPath, line, column, detail)), cause);
        this.kind = Objects.requireNonNull(kind, "kind");
        this.source = source == null ? "" : source;
        this.jsonPath = jsonPath == null ? "" : jsonPath;
        this.expected = expected == null ? "" : expected;
        this.line = line;
        this.column = column;
    }

    /** A problem at one value of the file. */
    static DesignFileException at(Kind kind, String source, String jsonPath, String expected, String detail) {
        return new DesignFileException(kind, source, jsonPath, expected, 0, 0, detail, null);
    }

    private static String message(String source, String jsonPath, int line, int column, String detail) {
        StringBuilder b = new StringBuilder();
        if (source != null && !source.isEmpty()) {
            b.append(source).append(": ");
        }
        if (line > 0) {
            b.append("line ").append(line);
            if (column > 0) {
                b.append(", column ").append(column);
            }
            b.append(": ");
        }
        if (jsonPath != null && !jsonPath.isEmpty()) {
            b.append(jsonPath).append(": ");
        }
        b.append(detail);
        return b.toString();
    }

    /** The message with control characters (line breaks from a hostile file, say) written as escapes. */
    private static String oneLine(String s) {
        StringBuilder b = new StringBuilder(s.length());
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c < 0x20 || c == 0x7F || c == '\u2028' || c == '\u2029') {
                b.append(String.format("\\u%04X", (int) c));
            } else {
                b.append(c);
            }
        }
        return b.toString();
    }

    public Kind kind() {
        return kind;
    }

    /** The file's name as the caller gave it (a path, or the source name passed with text). */
    public String source() {
        return source;
    }

    /** Where in the file, as a JSON path from the root {@code $}; empty when not tied to one value. */
    public String jsonPath() {
        return jsonPath;
    }

    /** What would have been accepted, in words; empty when nothing more can be said. */
    public String expected() {
        return expected;
    }

    /** 1-based line of a syntax error; 0 when unknown or not a syntax error. */
    public int line() {
        return line;
    }

    /** 1-based column of a syntax error; 0 when unknown or not a syntax error. */
    public int column() {
        return column;
    }
}
