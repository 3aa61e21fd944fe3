package halfrail.convert;

import halfrail.units.FieldRules;

/**
 * A conversion request is invalid. {@link #path()} names the field in the request's own terms
 * (for example {@code original.stages[0].r2Ohms}), so a reader or a dialog can point at it.
 */
public final class ConversionException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    private final String path;

    public ConversionException(String path, String message) {
        super(path + ": " + message);
        this.path = path;
    }

    /** Where in the request the problem lies, as a dotted path with list indices. */
    public String path() {
        return path;
    }

    /** The range rules of this layer's fields, failing with this exception. */
    static final FieldRules RULES = new FieldRules(ConversionException::new);
}
