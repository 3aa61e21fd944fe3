package halfrail.io.report;

import halfrail.check.Finding;
import halfrail.check.Severity;

import java.util.Collection;
import java.util.Locale;

/** The verdict of a design or a stage, worst first: a failing finding, a warning, or neither. */
public enum Verdict {
    FAIL,
    WARN,
    /** Nothing at warning level or above (notes may remain). */
    PASS;

    /** The verdict a finding of severity {@code s} gives. */
    public static Verdict of(Severity s) {
        return switch (s) {
            case FAIL -> FAIL;
            case WARN -> WARN;
            case NOTE -> PASS;
        };
    }

    /** The worst verdict among {@code findings}; {@link #PASS} for none. */
    public static Verdict of(Collection<Finding> findings) {
        Verdict v = PASS;
        for (Finding f : findings) {
            Verdict w = of(f.severity());
            if (w.ordinal() < v.ordinal()) {
                v = w;
            }
        }
        return v;
    }

    /** Lower-case word for documents ("fail", "warn", "pass"). */
    public String word() {
        return name().toLowerCase(Locale.ROOT);
    }
}
