package halfrail.check;

import halfrail.units.FieldRules;

/**
 * The options of a study (a supply sweep, a tolerance model, a Monte Carlo run, a divider
 * trade-off) are invalid. {@link #field()} names the option, for example {@code sweep.points}
 * or {@code tolerance.resistorTolerance}, so a form can point at it.
 */
public final class StudyOptionsException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    private final String field;

    public StudyOptionsException(String field, String message) {
        super(field + ": " + message);
        this.field = field;
    }

    /** The option at fault, as a dotted path. */
    public String field() {
        return field;
    }

    /** The range rules of this layer's fields, failing with this exception. */
    static final FieldRules RULES = new FieldRules(StudyOptionsException::new);
}
