package halfrail.io;

import java.util.Objects;

/**
 * A netlist could not be read (or a circuit could not be written as one). {@link #kind()} says
 * what went wrong, {@link #line()} and {@link #column()} where (1-based; 0 when unknown or not
 * tied to a line), and {@link #expected()} what the reader wanted to see there. The message is
 * one line meant for people: {@code "line 7, column 12: bad value '4k7' ..."}.
 */
public final class NetlistException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** What made the netlist unreadable. */
    public enum Kind {
        /** The file could not be read: missing, not a regular file, an I/O error. */
        UNREADABLE,
        /** The file is larger than {@link NetlistReader#MAX_BYTES}. */
        TOO_LARGE,
        /** The bytes are not UTF-8 text, or the text holds control characters. */
        BAD_ENCODING,
        /** The netlist holds no element at all. */
        EMPTY,
        /** A {@code +} continuation line with no line before it to continue. */
        ORPHAN_CONTINUATION,
        /** An element letter outside the subset (L, D, Q, E, …). */
        UNSUPPORTED_ELEMENT,
        /** A dot-directive outside the subset that changes the circuit (.subckt, .include, .param, …). */
        UNSUPPORTED_DIRECTIVE,
        /** A dot-directive nobody knows. */
        UNKNOWN_DIRECTIVE,
        /** A line ends before a required field. */
        MISSING_FIELD,
        /** A field that is not expected at this place on the line. */
        UNEXPECTED_TOKEN,
        /** A value that is not a number in the SPICE form (digits, exponent, scale suffix, unit letters). */
        BAD_VALUE,
        /** A node, element or model name holding characters the subset does not allow. */
        BAD_NAME,
        /** A {@code .model} whose type is not {@code opamp}. */
        UNSUPPORTED_MODEL,
        /** An op-amp names a model that no {@code .model} line defines. */
        UNKNOWN_MODEL,
        /** Two {@code .model} lines with one name, or one parameter given twice. */
        DUPLICATE_MODEL,
        /** A {@code .model} parameter that the op-amp model does not have. */
        UNKNOWN_PARAMETER,
        /** A node named by an {@code * output:} comment that no element uses, or ground. */
        UNKNOWN_NODE,
        /** Two {@code * output:} comments. */
        DUPLICATE_OUTPUT,
        /** The circuit model refused an element (duplicate name, non-positive value, shorted source, …). */
        BAD_ELEMENT,
        /** Writing only: the circuit holds something the netlist subset cannot express. */
        NOT_EXPRESSIBLE
    }

    private final Kind kind;
    private final int line;
    private final int column;
    private final String expected;
    private final String problem;

    /**
     * @param kind     what went wrong
     * @param line     1-based line number in the file, 0 when not tied to a line
     * @param column   1-based column, 0 when not useful
     * @param problem  what was found, without the position (the message adds it)
     * @param expected what the reader expected there; empty when nothing specific
     */
    public NetlistException(Kind kind, int line, int column, String problem, String expected) {
        super(message(line, column, problem, expected));
        this.kind = Objects.requireNonNull(kind, "kind");
        this.line = Math.max(0, line);
        this.column = Math.max(0, column);
        this.expected = expected == null ? "" : expected;
        this.problem = oneLine(problem);
    }

    NetlistException(Kind kind, int line, int column, String problem, String expected, Throwable cause) {
        this(kind, line, column, problem, expected);
        initCause(cause);
    }

    private static String message(int line, int column, String problem, String expected) {
        StringBuilder b = new StringBuilder();
        if (line > 0) {
            b.append("line ").append(line);
            if (column > 0) {
                b.append(", column ").append(column);
            }
            b.append(": ");
        }
        b.append(oneLine(problem));
        if (expected != null && !expected.isEmpty()) {
            b.append(" (expected ").append(oneLine(expected)).append(')');
        }
        return b.toString();
    }

    /** Text with line breaks and other control characters shown as spaces, so messages stay on one line. */
    static String oneLine(String s) {
        if (s == null) {
            return "";
        }
        StringBuilder b = new StringBuilder(s.length());
        s.codePoints().forEach(c -> b.appendCodePoint(Character.isISOControl(c) ? ' ' : c));
        return b.toString();
    }

    public Kind kind() {
        return kind;
    }

    /** 1-based line number in the file; 0 when the problem is not tied to a line. */
    public int line() {
        return line;
    }

    /** 1-based column within the line; 0 when not given. */
    public int column() {
        return column;
    }

    /** What was wrong, without the position and the expectation. */
    public String problem() {
        return problem;
    }

    /** What the reader expected at that place; empty when nothing specific. */
    public String expected() {
        return expected;
    }
}
