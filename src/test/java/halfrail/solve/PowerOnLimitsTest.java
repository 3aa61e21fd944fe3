package halfrail.solve;

import halfrail.circuit.Circuit;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/** The run's limits and bad requests end in typed errors. */
class PowerOnLimitsTest {
    private static Circuit rc() {
        return Circuit.builder().nodes("in", "out")
                .voltageSource("V1", "in", "0", 1.0)
                .resistor("R1", "in", "out", 1e3)
                .capacitor("C1", "out", "0", 1e-6)
                .build();
    }

    @Test
    @DisplayName("a run that needs more steps than its budget ends in STEP_LIMIT")
    void tooManyStepsEndInStepLimit() {
        // 1 s at steps of at most 1 µs needs a million steps, ten times the budget
        PowerOnOptions o = PowerOnOptions.of(1).withMaxStep(1e-6).withStopWhenSettled(false);
        AnalysisException e = assertThrows(AnalysisException.class, () -> PowerOnTransient.run(rc(), o));
        assertEquals(AnalysisException.Kind.STEP_LIMIT, e.kind());
    }

    @Test
    @DisplayName("a stop time shorter than the smallest allowed step ends in STEP_TOO_SMALL")
    void stopTimeBelowTheMinimumStepEndsInStepTooSmall() {
        PowerOnOptions o = PowerOnOptions.of(TransientStepper.MIN_STEP_SECONDS / 10);
        AnalysisException e = assertThrows(AnalysisException.class, () -> PowerOnTransient.run(rc(), o));
        assertEquals(AnalysisException.Kind.STEP_TOO_SMALL, e.kind());
    }

    @Test
    @DisplayName("an unknown watched or load node is a BAD_REQUEST")
    void unknownNodesAreBadRequests() {
        AnalysisException watched = assertThrows(AnalysisException.class,
                () -> PowerOnTransient.run(rc(), PowerOnOptions.of(1e-2).withWatchedNodes("nowhere")));
        assertEquals(AnalysisException.Kind.BAD_REQUEST, watched.kind());
        AnalysisException load = assertThrows(AnalysisException.class,
                () -> PowerOnTransient.run(rc(), PowerOnOptions.of(1e-2).withLoadNodes("nowhere")));
        assertEquals(AnalysisException.Kind.BAD_REQUEST, load.kind());
    }

    @Test
    @DisplayName("options out of range are BAD_REQUESTs")
    void badOptionsAreBadRequests() {
        assertEquals(AnalysisException.Kind.BAD_REQUEST,
                assertThrows(AnalysisException.class, () -> PowerOnOptions.of(0)).kind());
        assertEquals(AnalysisException.Kind.BAD_REQUEST,
                assertThrows(AnalysisException.class, () -> PowerOnOptions.of(1).withSettleBand(-1)).kind());
        assertEquals(AnalysisException.Kind.BAD_REQUEST,
                assertThrows(AnalysisException.class, () -> PowerOnOptions.of(1).withTolerances(0, 1e-6)).kind());
        assertEquals(AnalysisException.Kind.BAD_REQUEST,
                assertThrows(AnalysisException.class, () -> PowerOnOptions.of(1).withMaxStep(0)).kind());
    }

    @Test
    @DisplayName("a node held only by capacitors has no final DC value: FLOATING_NODE")
    void capacitorOnlyNodeHasNoFinalValue() {
        Circuit c = Circuit.builder().nodes("in", "mid")
                .voltageSource("V1", "in", "0", 1.0)
                .capacitor("C1", "in", "mid", 1e-6)
                .capacitor("C2", "mid", "0", 1e-6)
                .build();
        AnalysisException e = assertThrows(AnalysisException.class,
                () -> PowerOnTransient.run(c, PowerOnOptions.of(1e-3)));
        assertEquals(AnalysisException.Kind.FLOATING_NODE, e.kind());
    }

    @Test
    @DisplayName("asking for a time outside the run is a BAD_REQUEST")
    void interpolationOutsideTheRunIsABadRequest() {
        PowerOnResult r = PowerOnTransient.run(rc(), PowerOnOptions.of(1e-3).withStopWhenSettled(false));
        assertEquals(AnalysisException.Kind.BAD_REQUEST,
                assertThrows(AnalysisException.class, () -> r.voltageAt("out", 2e-3)).kind());
    }
}
