package halfrail.check;

import halfrail.design.Design;
import halfrail.design.DesignException;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.statistics.Statistics;

import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The clip-aware envelope over random designs ({@link RandomDesignPropertiesTest#design}): the
 * drive factors follow their recurrence on the report's own figures, no capacitor's signal
 * exceeds its linear figure or what its driving stage can swing, and a figure is marked as driven
 * by a clipped stage exactly when it was reduced.
 */
class ClipAwareEnvelopePropertiesTest {

    static double deliverable(StageReport s) {
        return Math.max(0, Math.max(s.nominal().availableLowVolts(), s.nominal().availableHighVolts()));
    }

    @Property(tries = 60, seed = "5512093417")
    void theEnvelopeFollowsItsRecurrenceAndBoundsEveryCapacitor(@ForAll long seed) {
        Design d = RandomDesignPropertiesTest.design(seed);
        DesignReport r;
        try {
            r = DesignAnalysis.analyse(d, false);
        } catch (DesignException e) {
            Statistics.collect("refused");
            return;
        }
        if (r.failure().isPresent()) {
            Statistics.collect("not solved");
            return;
        }
        List<StageReport> chain = r.stages().stream().filter(StageReport::signal).toList();
        double drive = 1;
        boolean clipped = false;
        for (StageReport s : chain) {
            assertEquals(drive, s.driveFactor(), 1e-12 * Math.max(1, drive), s.label());
            assertEquals(drive < 1, s.drivenByClipped().isPresent(), s.label());
            double p = s.nominal().signalPeakVolts();
            double e = deliverable(s);
            drive *= p > e ? e / p : 1;
            clipped |= p > e;
        }
        Statistics.collect(clipped ? "a stage clips" : "nothing clips");
        // The property means something only if some of the tries clip.
        Statistics.coverage(check -> check.check("a stage clips").count((Integer n) -> n >= 5));
        ClipAwareEnvelopeTest.Linear lin = ClipAwareEnvelopeTest.Linear.of(d);
        for (CapacitorReport c : r.capacitors()) {
            double linear = lin.capacitors().get(c.element());
            // The test's own AC solve agrees with the analysis's to rounding (1e-14 relative seen), not bit for bit.
            assertTrue(c.signalPeakVolts() <= linear * (1 + 1e-9), c.element() + " above its linear figure");
            assertEquals(c.signalPeakVolts() < linear * (1 - 1e-9), c.drivenByClipped().isPresent(), c.element());
            Optional<StageReport> driver = driver(chain, c.designPath());
            driver.ifPresent(s -> assertTrue(c.signalPeakVolts() <= deliverable(s) * (1 + 1e-12),
                    c.element() + " sees more than " + s.label() + " can swing"));
        }
    }

    /** The stage whose output drives the capacitor at {@code path}, when the envelope bounds it. */
    static Optional<StageReport> driver(List<StageReport> chain, String path) {
        if (path.equals("load.outputCapacitor")) {
            return Optional.of(chain.get(chain.size() - 1));
        }
        for (int k = 0; k < chain.size(); k++) {
            if (path.equals(chain.get(k).designPath() + ".legCapacitor")) {
                return Optional.of(chain.get(k));
            }
            if (path.equals(chain.get(k).designPath() + ".inputCapacitor")) {
                return k == 0 ? Optional.empty() : Optional.of(chain.get(k - 1));
            }
        }
        return Optional.empty();
    }
}
