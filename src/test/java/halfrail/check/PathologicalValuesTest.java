package halfrail.check;

import halfrail.design.CapacitorSpec;
import halfrail.design.Design;
import halfrail.design.DesignException;
import halfrail.design.FixedRail;
import halfrail.design.Reference;
import halfrail.design.Stage;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.time.Duration;
import java.util.List;
import java.util.function.UnaryOperator;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Values far outside the usual range are analysed or refused with a reason — never an exception
 * escaping to the user, never a non-finite number shown as if valid. The time limit guards
 * against a hang; it is not a speed target.
 */
class PathologicalValuesTest {
    /** Longest an analysis of one of these designs may take before it counts as a hang, s. */
    private static final Duration HANG_LIMIT = Duration.ofSeconds(60);

    record Case(String name, UnaryOperator<Design> change) {
        @Override
        public String toString() {
            return name;
        }
    }

    static Stream<Case> cases() {
        return Stream.of(
                new Case("1 mΩ feedback leg resistor", d -> d.withStage(0, d.stages().get(0).withLegOhms(1e-3))),
                new Case("1 TΩ feedback resistor", d -> d.withStage(0, d.stages().get(0).withFeedbackOhms(1e12))),
                new Case("1 mΩ divider", d -> d.withReference(d.reference().withDivider(1e-3, 1e-3))),
                new Case("1 TΩ divider", d -> d.withReference(d.reference().withDivider(1e12, 1e12))),
                new Case("1 pF input coupling", d -> d.withStage(0,
                        d.stages().get(0).withInputCapacitor(new CapacitorSpec(1e-12, "ceramic-class-1", 50)))),
                new Case("10 F reference capacitor", d -> d.withReference(Reference.decoupled(
                        d.reference().upperOhms(), d.reference().lowerOhms(),
                        new CapacitorSpec(10, "aluminium-electrolytic", 16), d.reference().biasOhms()))),
                new Case("supply below the op-amp's minimum", d -> d.withSupply(new FixedRail(1.0, 0, 0, 0, 0))),
                new Case("1 pF feedback-leg capacitor", d -> d.withStage(0,
                        d.stages().get(0).withLegCapacitor(new CapacitorSpec(1e-12, "ceramic-class-1", 50)))));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    @DisplayName("an extreme value is analysed with finite numbers or refused with a reason")
    void extremeValuesAreAnalysedOrRefused(Case c) {
        Design design;
        try {
            design = c.change().apply(TestDesigns.healthyNineVolt());
        } catch (DesignException e) {
            assertFalse(e.path().isEmpty(), "a refusal names the field");
            return;
        }
        DesignReport r = assertTimeoutPreemptively(HANG_LIMIT, () -> DesignAnalysis.analyse(design));
        ReportAssertions.assertAllFinite(r);
        if (r.failure().isPresent()) {
            assertTrue(r.stages().isEmpty(), "no numbers are shown for a circuit that could not be solved");
            assertTrue(r.has(Severity.FAIL), "the failure is a finding");
        } else {
            assertFalse(r.stages().isEmpty());
        }
        List<String> codes = r.findings().stream().map(Finding::code).toList();
        if (c.name().startsWith("supply below")) {
            assertTrue(codes.contains(SupplyAndRuntime.RANGE), codes.toString());
        }
    }
}
