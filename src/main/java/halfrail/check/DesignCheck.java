package halfrail.check;

import java.util.List;

/**
 * One rule over an analysed design. Implementations are small, stateless and package-private;
 * each owns its finding codes. Register a new one in {@link Checks#ALL}.
 */
interface DesignCheck {
    /** Append the findings of this rule to {@code out}. */
    void inspect(Evidence evidence, List<Finding> out);
}
