package halfrail.solve;

import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

import static org.junit.jupiter.api.Assertions.assertTrue;

/** jqwik runs the solver audit around every try of every property, without an annotation. */
class SolveAuditHookTest {

    @Example
    void theHookWrapsThisVeryTry() {
        assertTrue(SolveAuditHook.TRIES.get() > 0, "SolveAuditHook was not registered with jqwik");
        assertTrue(SolveAuditor.installed());
    }

    @Property(tries = 5, seed = "20261202")
    void everyTryOfAPropertyIsWrapped(@ForAll @IntRange(min = 1, max = 3) int stages) {
        long before = SolveAuditHook.TRIES.get();
        assertTrue(before > 0);
        long[] counts = SolveAuditor.counts();
        DcSolver.operatingPoint(StageCircuits.invertingCascade(stages, new double[] {2}, 0.1, TestAmps.bipolarFiniteGain()));
        assertTrue(SolveAuditor.counts()[0] > counts[0], "the solve was audited");
    }
}
