package halfrail.design;

import halfrail.units.FieldRules;

/**
 * A design cannot be turned into a circuit because a value or a choice in it is invalid.
 * {@link #path()} names the part and field in the design's own terms (for example
 * {@code stages[1].legCapacitor.farads}), so the editor and the loader can point at it.
 */
public final class DesignException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    private final String path;

    public DesignException(String path, String message) {
        super(path + ": " + message);
        this.path = path;
    }

    /** Where in the design the problem lies, as a dotted path with list indices. */
    public String path() {
        return path;
    }

    /** The range rules of this layer's fields, failing with this exception. */
    static final FieldRules RULES = new FieldRules(DesignException::new);
}
