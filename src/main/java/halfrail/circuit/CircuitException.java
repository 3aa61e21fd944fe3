package halfrail.circuit;

import java.util.Objects;

/**
 * A circuit could not be built because a part or a reference in it is invalid. The
 * {@link Kind} says what went wrong; {@link #part()} and {@link #field()} say where, so that
 * callers (editor, loader, command line) can point at the offending entry without parsing
 * the message.
 */
public final class CircuitException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** What made the circuit invalid. */
    public enum Kind {
        /** An element refers to a node that was never declared. */
        UNKNOWN_NODE,
        /** Two elements or two nodes share one name. */
        DUPLICATE_NAME,
        /** A value is zero, negative, NaN or infinite where that makes no physical sense. */
        BAD_VALUE,
        /** An element connects a terminal to the same node as another where that is meaningless. */
        BAD_CONNECTION,
        /** A name is empty or otherwise unusable. */
        BAD_NAME
    }

    private final Kind kind;
    private final String part;
    private final String field;

    public CircuitException(Kind kind, String part, String field, String message) {
        super(message);
        this.kind = Objects.requireNonNull(kind, "kind");
        this.part = part == null ? "" : part;
        this.field = field == null ? "" : field;
    }

    public Kind kind() {
        return kind;
    }

    /** Name of the element or node concerned; empty when none. */
    public String part() {
        return part;
    }

    /** Field of that element (for example {@code "ohms"}); empty when none. */
    public String field() {
        return field;
    }
}
