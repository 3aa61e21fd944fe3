package halfrail.solve;

import java.lang.annotation.ElementType;
import java.lang.annotation.Retention;
import java.lang.annotation.RetentionPolicy;
import java.lang.annotation.Target;

/**
 * Switches the global solver audit ({@link SolveAuditor}) off for one JUnit Jupiter test method.
 * Only for a test that measures time on the test machine (the FX thread's latency during a
 * 10 000-build study), whose figure the audit's own work would distort; say why beside each use.
 * The solves such a test makes are audited in the tests of the same code without timing.
 */
@Retention(RetentionPolicy.RUNTIME)
@Target(ElementType.METHOD)
public @interface WithoutSolveAudit {
    /** Why this test cannot run under the audit. */
    String value();
}
