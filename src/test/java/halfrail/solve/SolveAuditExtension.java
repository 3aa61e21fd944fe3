package halfrail.solve;

import org.junit.jupiter.api.extension.AfterEachCallback;
import org.junit.jupiter.api.extension.BeforeEachCallback;
import org.junit.jupiter.api.extension.ExtensionContext;

/**
 * Registered for every JUnit Jupiter test (META-INF/services, with extension autodetection on in
 * junit-platform.properties): installs {@link SolveAuditor} before each test and fails the test
 * when a solver result it produced broke Kirchhoff's current law or held a non-finite number.
 * A violation found on a background thread that outlives its test is reported by the next test's
 * check, with the thread's name in the message. A test method marked {@link WithoutSolveAudit} runs
 * without the audit.
 */
public final class SolveAuditExtension implements BeforeEachCallback, AfterEachCallback {

    @Override
    public void beforeEach(ExtensionContext context) {
        if (exempt(context)) {
            SolveAuditor.drain(); // what earlier tests left is theirs, reported below for none of them
            SolveAudit.listener = null;
            return;
        }
        SolveAuditor.install();
    }

    @Override
    public void afterEach(ExtensionContext context) {
        if (exempt(context)) {
            SolveAuditor.install();
            return;
        }
        AssertionError e = SolveAuditor.drain();
        if (e != null) {
            throw e;
        }
    }

    private static boolean exempt(ExtensionContext context) {
        return context.getTestMethod().map(m -> m.isAnnotationPresent(WithoutSolveAudit.class)).orElse(false);
    }
}
