package halfrail.check;

import halfrail.design.Design;
import halfrail.io.DesignFiles;
import org.junit.jupiter.api.Test;

import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The build-level solve (reused solver work, answers read from the solution vector) against the
 * per-build reference path ({@link NominalStudy#solve}: a fresh solver and a full operating
 * point per build), build by build. Both solve the same equations to the DC solver's tolerance.
 */
class BuildEvaluatorTest {
    @Test
    void reusedWorkGivesTheSameRestPointsHeadroomsAndVerdictsAsFreshSolves() {
        for (String sample : new String[] {"li-ion-sensor-front-end", "handheld-recorder-mic-preamp"}) {
            Design d = DesignFiles.read(Path.of("samples", sample + ".json"));
            ToleranceModel model = ToleranceModel.of(d, ToleranceOptions.defaults());
            BuildEvaluator ev = new BuildEvaluator(model);
            ParameterSampler sampler = new ParameterSampler(model.parameters(), MonteCarloOptions.Distribution.NORMAL_3_SIGMA);
            int m = ev.opAmpCount();
            double[] values = new double[model.parameters().size()];
            double[] q1 = new double[m];
            double[] h1 = new double[m];
            boolean[] s1 = new boolean[m];
            double[] q2 = new double[m];
            double[] h2 = new double[m];
            boolean[] s2 = new boolean[m];
            BuildEvaluator.Work work = ev.work();
            for (int i = 0; i < 300; i++) {
                sampler.sample(42, i, values);
                boolean fast = ev.evaluate(values, work, q1, h1, s1);
                boolean reference = ev.evaluate(values, q2, h2, s2);
                assertEquals(reference, fast, sample + " build " + i);
                for (int k = 0; k < m; k++) {
                    // DcSolver.VOLTAGE_TOLERANCE is 1e-9 V on each Newton update.
                    assertEquals(q2[k], q1[k], 1e-8, sample + " build " + i + ", op-amp " + k);
                    assertEquals(h2[k], h1[k], 1e-6, sample + " build " + i + ", op-amp " + k);
                    assertEquals(s2[k], s1[k], sample + " build " + i + ", op-amp " + k);
                }
            }
        }
    }
}
