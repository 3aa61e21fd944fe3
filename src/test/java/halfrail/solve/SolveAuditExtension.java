package halfrail.solve;

import org.junit.jupiter.api.extension.AfterEachCallback;
import org.junit.jupiter.api.extension.BeforeEachCallback;
import org.junit.jupiter.api.extension.ExtensionContext;

/**
 * Registered for every JUnit Jupiter test (META-INF/services, with extension autodetection on in
 * junit-platform.properties): installs {@link SolveAuditor} before each test and fails the test
 * when a solver result it produced broke Kirchhoff's current law or held a non-finite number.
 * A violation found on a background thread that outlives its test is reported by the next test's
 * check, with the thread's name in the message.
 */
public final class SolveAuditExtension implements BeforeEachCallback, AfterEachCallback {

    @Override
    public void beforeEach(ExtensionContext context) {
        SolveAuditor.install();
    }

    @Override
    public void afterEach(ExtensionContext context) {
        AssertionError e = SolveAuditor.drain();
        if (e != null) {
            throw e;
        }
    }
}
