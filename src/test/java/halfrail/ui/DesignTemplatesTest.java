package halfrail.ui;

import halfrail.check.DesignAnalysis;
import halfrail.check.DesignReport;
import halfrail.check.Severity;
import halfrail.design.Design;
import halfrail.design.ReferenceKind;
import halfrail.design.StageKind;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Every template is a working starting point: it solves, and nothing in it fails. */
class DesignTemplatesTest {
    @ParameterizedTest
    @EnumSource(StageKind.class)
    void everyStageKindBehindEveryReferenceKindSolvesWithoutAFailingFinding(StageKind stage) {
        for (ReferenceKind ref : ReferenceKind.values()) {
            Design d = DesignTemplates.of(stage, ref);
            DesignReport r = DesignAnalysis.analyse(d, false);
            assertTrue(r.failure().isEmpty(), () -> stage + "/" + ref + ": " + r.failureMessage());
            assertFalse(r.has(Severity.FAIL), () -> stage + "/" + ref + ": " + r.findings());
            // every template biases its stage at mid-rail: equal divider on the nominal 9 V block gives
            // 4.5 V (voltage-divider rule); the op-amp's offset and bias currents move it only slightly
            double out = r.stages().stream().filter(s -> s.signal()).findFirst().orElseThrow().outputVolts();
            assertEquals(4.5, out, 0.15, () -> stage + "/" + ref);
        }
    }
}
