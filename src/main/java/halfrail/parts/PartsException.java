package halfrail.parts;

import java.util.Objects;

/**
 * Parts data could not be loaded, a value handed to a part formula is out of range, or a
 * lookup named an unknown part. Callers switch on {@link #kind()}; the message is for people.
 * For loading errors {@link #resource()} names the resource and {@link #jsonPath()} the place
 * inside it (for example {@code $.entries[2].leakage.floorAmps}).
 */
public final class PartsException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** What went wrong. */
    public enum Kind {
        /** A parts resource is missing, is not valid JSON, or does not match the expected shape. */
        BAD_DATA,
        /** A value (in a record or handed to a formula) is out of its physical range. */
        BAD_VALUE,
        /** A lookup named an id that the library does not hold. */
        UNKNOWN_ID,
        /** Two entries of one kind share an id. */
        DUPLICATE_ID
    }

    private final Kind kind;
    private final String resource;
    private final String jsonPath;
    private final String field;

    public PartsException(Kind kind, String message) {
        this(kind, "", "", "", message, null);
    }

    /** An error about one field of a record, named relative to it (for example {@code "dischargeCurve[6]"}). */
    public PartsException(Kind kind, String field, String message) {
        this(kind, "", "", field, message, null);
    }

    public PartsException(Kind kind, String resource, String jsonPath, String message, Throwable cause) {
        this(kind, resource, jsonPath, "", message, cause);
    }

    private PartsException(Kind kind, String resource, String jsonPath, String field, String message, Throwable cause) {
        super(message, cause);
        this.kind = Objects.requireNonNull(kind, "kind");
        this.resource = resource == null ? "" : resource;
        this.jsonPath = jsonPath == null ? "" : jsonPath;
        this.field = field == null ? "" : field;
    }

    public Kind kind() {
        return kind;
    }

    /** Class-path name of the resource concerned; empty when the error is not about loading. */
    public String resource() {
        return resource;
    }

    /** Where in the resource, as {@code $.field[index].field}; empty when unknown or not about loading. */
    public String jsonPath() {
        return jsonPath;
    }

    /**
     * For a {@link Kind#BAD_VALUE} raised by a record, the field concerned relative to that
     * record (for example {@code "voltageDerating"} or {@code "basis.portRange"}); empty when none.
     */
    public String field() {
        return field;
    }
}
