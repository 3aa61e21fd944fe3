package halfrail.check;

import org.junit.jupiter.api.Test;
import org.opentest4j.AssertionFailedError;

import java.util.List;
import java.util.Map;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class SwingReportTest {
    @Test
    void headroomIsTwentyLogOfRoomOverPeakOnTheWorseSide() {
        // Window 0.02–7.5 V, rest 3.6 V, 1.1 V peak: room 3.58 V below, 3.9 V above → 20·log10(3.58/1.1) dB.
        SwingReport r = SwingReport.of(9, 3.6, 0.02, 7.5, 1.1, 0.1, false);
        assertEquals(20 * Math.log10(3.58 / 1.1), r.headroomDb().getAsDouble(), 1e-12);
        assertEquals(Side.LOW, r.clipsFirst());
        assertEquals(3.58 / 1.1 * 0.1, r.largestSourcePeakVolts().getAsDouble(), 1e-12);
        assertTrue(r.fits(3));
        assertFalse(r.clips());
    }

    @Test
    void anOutputWithoutSignalHasNoHeadroomFigureRatherThanAnInfiniteOne() {
        SwingReport r = SwingReport.of(9, 4.5, 0.02, 7.5, 0, 0.1, false);
        assertFalse(r.hasSignal());
        assertTrue(r.headroomDb().isEmpty());
        assertTrue(r.largestSourcePeakVolts().isEmpty());
        assertFalse(r.clips());
        assertTrue(r.fits(3));
    }

    @Test
    void aRestPointWithNoRoomClipsAtAnyLevel() {
        SwingReport r = SwingReport.of(9, 7.5, 0.02, 7.5, 0.5, 0.1, false);
        assertTrue(r.headroomDb().isEmpty());
        assertEquals(0, r.largestSourcePeakVolts().getAsDouble());
        assertTrue(r.clips());
        assertFalse(r.fits(0));
    }

    @Test
    void aSaturatedStageClipsAndNeverFits() {
        SwingReport r = SwingReport.of(9, 4.5, 0.02, 7.5, 0.1, 0.1, true);
        assertTrue(r.clips());
        assertFalse(r.fits(-100));
    }

    @Test
    void theFiniteNumberCheckFindsANonFiniteNumberAnywhereInAReport() {
        DesignReport healthy = DesignAnalysis.analyse(TestDesigns.healthyNineVolt(), false);
        ReportAssertions.assertAllFinite(healthy);
        DesignReport nanVolts = new DesignReport(healthy.design(), Optional.empty(), "", List.of(),
                Map.of("x", Double.NaN), List.of(), List.of(), Optional.empty(), Optional.empty(), Optional.empty(),
                List.of(), List.of());
        assertThrows(AssertionFailedError.class, () -> ReportAssertions.assertAllFinite(nanVolts));
        CapacitorReport c = healthy.capacitors().get(0);
        CapacitorReport infinite = new CapacitorReport(c.element(), c.designPath(), c.technology(), c.farads(),
                c.dcVolts(), c.signalPeakVolts(), c.worstVolts(), c.ratedVolts(), c.deratedVolts(), c.polarised(),
                c.seenOhms(), java.util.OptionalDouble.of(Double.POSITIVE_INFINITY), c.limitLeakageAmps(),
                c.drivenByClipped());
        DesignReport deep = new DesignReport(healthy.design(), Optional.empty(), "", List.of(), healthy.nodeVolts(),
                healthy.stages(), List.of(infinite), healthy.chain(), healthy.powerOn(), healthy.battery(),
                healthy.ladders(), healthy.findings());
        AssertionFailedError e = assertThrows(AssertionFailedError.class, () -> ReportAssertions.assertAllFinite(deep));
        assertTrue(e.getMessage().contains("capacitors[0].cornerHz"), e.getMessage());
    }
}
