package halfrail.io.report;

import halfrail.check.DesignAnalysis;
import halfrail.check.DesignReport;
import halfrail.check.StageReport;
import halfrail.design.Design;
import halfrail.design.Stage;
import halfrail.io.DesignFiles;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** What a stage's table in the review says about the signal reaching it. */
class ReviewStageRowsTest {
    @Test
    @DisplayName("behind a clipping stage the table gives the share of the linear drive that arrives and who clips "
            + "first; a stage with its whole drive has no such row")
    void driveReachingAStageBehindAClippingOne() {
        Design base = DesignFiles.read(Path.of("samples", "handheld-recorder-mic-preamp.json"));
        List<Stage> stages = new ArrayList<>();
        for (int i = 1; i <= 3; i++) {
            Stage s = base.stages().get(0);
            stages.add(new Stage(s.name() + "-" + i, s.kind(), s.opAmp(), s.feedbackOhms(), s.legOhms(),
                    s.legCapacitor(), s.inputCapacitor(), true));
        }
        Design d = base.withStages(stages);
        DesignReport r = DesignAnalysis.analyse(d, false);
        StageReport mic3 = r.stages().get(2);
        List<String> row = ReviewDocument.stage(d, r, mic3).stream()
                .filter(x -> x.get(0).equals("drive reaching this stage")).findFirst().orElseThrow();
        assertEquals(String.format(Locale.ROOT, "%.3g", 100 * mic3.driveFactor())
                + " % of the linear drive: mic-2 clips first", row.get(1));
        assertTrue(mic3.driveFactor() < 0.2, "drive " + mic3.driveFactor());
        assertTrue(ReviewDocument.stage(d, r, r.stages().get(1)).stream()
                .noneMatch(x -> x.get(0).equals("drive reaching this stage")));
    }
}
