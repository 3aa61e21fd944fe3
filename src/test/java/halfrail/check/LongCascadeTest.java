package halfrail.check;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import halfrail.design.Design;
import halfrail.design.Stage;
import halfrail.io.DesignFiles;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * A long cascade sharing one soft reference: the recorder preamp sample's stages repeated to
 * sixteen. Its loop gain round the shared reference is the product of the stage gains, so with
 * one coupling capacitor taken out (for that capacitor's seen resistance) the linearised circuit
 * is singular to working precision in the band. That single figure must not sink the analysis:
 * the rest of the report stands, every number finite.
 */
class LongCascadeTest {
    static Design repeated(int stages) {
        Design base = DesignFiles.read(Path.of("samples", "handheld-recorder-mic-preamp.json"));
        List<Stage> list = new ArrayList<>();
        for (int i = 0; list.size() < stages; i++) {
            Stage s = base.stages().get(i % base.stages().size());
            list.add(new Stage(s.name() + "-" + (i + 1), s.kind(), s.opAmp(), s.feedbackOhms(), s.legOhms(),
                    s.legCapacitor(), s.inputCapacitor(), s.biased()));
        }
        return new Design(base.name() + " × " + stages, base.description(), base.supply(), base.reference(), list,
                base.source(), base.load(), base.thresholds(), base.powerOnRampSeconds());
    }

    @Test
    void sixteenStagesAreAnalysedInFullEvenWhereACapacitorsSeenResistanceCannotBe() {
        DesignReport r = DesignAnalysis.analyse(repeated(16), false);
        assertEquals(16, r.stages().size());
        assertTrue(r.chain().isPresent());
        ReportAssertions.assertAllFinite(r);
        assertFalse(r.findings().stream().anyMatch(f -> f.code().equals("ANALYSIS_FAILED")), r.findings().toString());
        for (CapacitorReport c : r.capacitors()) {
            assertEquals(c.seenOhms().isPresent(), c.cornerHz().isPresent(), c.element());
            if (c.seenOhms().isPresent()) {
                // the short-circuit time-constant corner, 1/(2π·R·C) (common practice)
                assertEquals(1 / (2 * Math.PI * c.seenOhms().getAsDouble() * c.farads()), c.cornerHz().getAsDouble(),
                        1e-9 * c.cornerHz().getAsDouble(), c.element());
            }
        }
    }
}
