package halfrail.check;

import halfrail.solve.PowerOnResult;
import halfrail.units.Quantities;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** The settle-up in words, as the readings, the review and the plots show it. */
class PowerOnReportTest {
    @Test
    @DisplayName("settled: the time; oscillating: the period; otherwise: how far the run went")
    void settleSummary() {
        PowerOnReport settled = new PowerOnReport(true, OptionalDouble.of(1.48), 0.03, 2.2, Map.of(), 0.1);
        assertEquals(Quantities.seconds(1.48), settled.settleSummary());

        PowerOnResult.Oscillation o = new PowerOnResult.Oscillation("s3.out", 0.459, 2.95, 0.598, 1.98);
        PowerOnReport oscillating = new PowerOnReport(false, OptionalDouble.empty(), 0.03, 1.98, Map.of(), 2.1,
                Optional.empty(), Optional.of(o));
        assertEquals("keeps oscillating (period " + Quantities.seconds(0.459) + ")", oscillating.settleSummary());
        assertEquals(1 / 0.459, o.frequencyHz(), 1e-12);

        PowerOnReport slow = new PowerOnReport(false, OptionalDouble.empty(), 0.03, 10, Map.of(), 0.1);
        assertEquals("not settled within " + Quantities.seconds(10), slow.settleSummary());
    }
}
