package halfrail.units;

import java.util.Objects;

/**
 * Text could not be read as an engineering value. Callers (and tests) use {@link #text()},
 * {@link #position()} and {@link #expected()}; the message is for people and reads like
 * {@code "4k7k": expected a number with at most one SI prefix or an IEC 60062 code such as 4k7
 * (at position 3)}.
 */
public final class ValueFormatException extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;

    private final String text;
    private final int position;
    private final String expected;

    /**
     * @param text     the whole text that was being read, never null
     * @param position zero-based index into {@code text} where reading failed
     * @param expected what would have been accepted at that position, in words
     */
    public ValueFormatException(String text, int position, String expected) {
        super(message(text, position, expected));
        this.text = Objects.requireNonNull(text, "text");
        this.position = position;
        this.expected = Objects.requireNonNull(expected, "expected");
    }

    private static String message(String text, int position, String expected) {
        return "\"" + text + "\": expected " + expected + " (at position " + position + ")";
    }

    /** The whole text that was being read. */
    public String text() {
        return text;
    }

    /** Zero-based index into {@link #text()} where reading failed. */
    public int position() {
        return position;
    }

    /** What would have been accepted at {@link #position()}, in words. */
    public String expected() {
        return expected;
    }
}
