package halfrail.check;

import halfrail.design.Design;
import halfrail.design.FixedRail;
import halfrail.solve.AnalysisException;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.atomic.AtomicLong;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class MonteCarloTest {
    private static final double VS = 10;
    private static final double R = 10e3;
    private static final double T = 0.05;
    private static final int N = MonteCarloOptions.DEFAULT_BUILDS;

    /**
     * Analytic spread of an equal divider with independent relative errors a, b of variance σ²:
     * V = Vs·(1 + b)/(2 + a + b) ≈ Vs/2·(1 + (b − a)/2) to first order (delta method), so
     * E[V] = Vs/2 (the second-order term E[(b² − a²)/4] vanishes) and Var[V] = Vs²·σ²/8.
     * Bound: 4 standard errors (central limit theorem, two-sided p ≈ 6e-5) — for the mean σ_V/√N,
     * for the variance σ_V²·√((κ − 1)/N) with κ the kurtosis of (b − a); a 0.5 % allowance covers the
     * neglected second-order terms of the variance (order t²).
     */
    private static void assertDividerSpread(MonteCarloResult r, double sigma2, double kurtosis) {
        StageDistribution f = r.opAmp("follower").orElseThrow();
        double var = VS * VS * sigma2 / 8;
        double sd = Math.sqrt(var);
        assertEquals(VS / 2, f.meanQuiescentVolts(), 4 * sd / Math.sqrt(N));
        double sampleVar = f.sdQuiescentVolts() * f.sdQuiescentVolts();
        assertEquals(1.0, sampleVar / var, 4 * Math.sqrt((kurtosis - 1) / N) + 0.005);
    }

    @Test
    void uniformDividerMeanAndSpreadMatchTheAnalyticVariance() {
        // Uniform on ±t: σ² = t²/3; the difference of two uniforms is triangular, kurtosis 2.4.
        Design d = StudyDesigns.divider(StudyDesigns.tenVolts(0), R, R);
        MonteCarloResult r = MonteCarlo.run(d, ToleranceOptions.resistorsOnly(T),
                MonteCarloOptions.defaults().withDistribution(MonteCarloOptions.Distribution.UNIFORM));
        assertEquals(N, r.builds());
        assertEquals(0, r.failedToConverge());
        assertDividerSpread(r, T * T / 3, 2.4);
        // Every build lies inside the closed-form corners Vs·Rb/(Ra + Rb) at ±t.
        StageDistribution f = r.opAmp("follower").orElseThrow();
        assertTrue(f.maxQuiescentVolts() <= VS * (1 + T) / 2 + 1e-3);
        assertTrue(f.minQuiescentVolts() >= VS * (1 - T) / 2 - 1e-3);
        assertEquals(N, f.quiescentVolts().total());
    }

    @Test
    void truncatedNormalDividerMeanAndSpreadMatchTheAnalyticVariance() {
        // Normal with t = 3σ cut at ±3σ: variance (t/3)²·(1 − 6φ(3)/(2Φ(3) − 1)) = (t/3)²·0.97334
        // (truncated normal moments, e.g. Johnson, Kotz & Balakrishnan, Continuous Univariate
        // Distributions vol. 1, ch. 13); the difference of two such is near normal, kurtosis ≤ 3.
        double phi3 = Math.exp(-4.5) / Math.sqrt(2 * Math.PI);
        double mass = 0.99730020393674;
        double sigma2 = (T / 3) * (T / 3) * (1 - 6 * phi3 / mass);
        Design d = StudyDesigns.divider(StudyDesigns.tenVolts(0), R, R);
        MonteCarloResult r = MonteCarlo.run(d, ToleranceOptions.resistorsOnly(T), MonteCarloOptions.defaults());
        assertDividerSpread(r, sigma2, 3.0);
    }

    private static MonteCarloResult onThreads(int threads, Design d, MonteCarloOptions o) {
        ExecutorService pool = Executors.newFixedThreadPool(threads);
        try {
            return MonteCarlo.run(ToleranceModel.of(d, ToleranceOptions.defaults()), o, pool, StudyProgress.NONE,
                    CancelToken.none());
        } finally {
            pool.shutdownNow();
        }
    }

    @Test
    void theSameSeedGivesTheSameNumbersOnOneTwoAndFourThreads() {
        Design d = TestDesigns.healthyNineVolt();
        MonteCarloOptions o = MonteCarloOptions.defaults().withBuilds(600).withSeed(42);
        MonteCarloResult one = onThreads(1, d, o);
        for (int threads : new int[] {2, 4}) {
            MonteCarloResult r = onThreads(threads, d, o);
            assertEquals(one.passingBuilds(), r.passingBuilds());
            for (int k = 0; k < one.opAmps().size(); k++) {
                StageDistribution a = one.opAmps().get(k);
                StageDistribution b = r.opAmps().get(k);
                assertEquals(a.meanQuiescentVolts(), b.meanQuiescentVolts(), 0.0);
                assertEquals(a.sdQuiescentVolts(), b.sdQuiescentVolts(), 0.0);
                assertArrayEquals(a.quiescentVolts().counts(), b.quiescentVolts().counts());
                assertArrayEquals(a.headroomDb().counts(), b.headroomDb().counts());
            }
            assertEquals(one.worst().orElseThrow().buildIndex(), r.worst().orElseThrow().buildIndex());
            assertEquals(one.worst().orElseThrow().build().values(), r.worst().orElseThrow().build().values());
        }
        MonteCarloResult other = onThreads(2, d, o.withSeed(43));
        assertNotEquals(one.opAmps().get(0).meanQuiescentVolts(), other.opAmps().get(0).meanQuiescentVolts());
    }

    @Test
    void cancellingStopsTheStudyEarlyWithATypedException() {
        Design d = TestDesigns.healthyNineVolt();
        CancelToken token = new CancelToken();
        AtomicLong seen = new AtomicLong();
        StudyProgress cancelEarly = (done, total) -> {
            seen.set(done);
            if (done >= 2L * MonteCarlo.CHUNK_BUILDS) {
                token.cancel();
            }
        };
        ExecutorService pool = Executors.newSingleThreadExecutor();
        try {
            StudyCancelledException e = assertThrows(StudyCancelledException.class,
                    () -> MonteCarlo.run(ToleranceModel.of(d, ToleranceOptions.defaults()),
                            MonteCarloOptions.defaults(), pool, cancelEarly, token));
            assertEquals(N, e.total());
            assertTrue(e.done() >= 2L * MonteCarlo.CHUNK_BUILDS && e.done() < N, () -> "done " + e.done());
            assertEquals(e.done(), seen.get());
        } finally {
            pool.shutdownNow();
        }
    }

    @Test
    void buildsThatFailToConvergeAreCountedAndLeftOutOfTheDistributions() {
        // Failure injected through the solve: every build with RA above its nominal value fails.
        Design d = StudyDesigns.divider(StudyDesigns.tenVolts(0), R, R);
        ToleranceModel model = ToleranceModel.of(d, ToleranceOptions.resistorsOnly(T));
        int ra = model.indexOf("RA.ohms").orElseThrow();
        MonteCarloOptions o = MonteCarloOptions.defaults().withBuilds(1000);
        ExecutorService pool = Executors.newFixedThreadPool(2);
        MonteCarloResult r;
        try {
            r = MonteCarlo.run(model, o, pool, StudyProgress.NONE, CancelToken.none(), (circuit, from) -> {
                double ohms = ((halfrail.circuit.Resistor) circuit.element("RA").orElseThrow()).ohms();
                if (ohms > R) {
                    throw new AnalysisException(AnalysisException.Kind.NO_CONVERGENCE, "injected");
                }
                return NominalStudy.solve(circuit, from);
            });
        } finally {
            pool.shutdownNow();
        }
        ParameterSampler sampler = new ParameterSampler(model.parameters(), o.distribution());
        double[] v = new double[model.parameters().size()];
        long expected = 0;
        for (int i = 0; i < o.builds(); i++) {
            sampler.sample(o.seed(), i, v);
            if (v[ra] > R) {
                expected++;
            }
        }
        assertTrue(expected > 300 && expected < 700);
        assertEquals(expected, r.failedToConverge());
        assertEquals(expected, r.failuresByKind().get(AnalysisException.Kind.NO_CONVERGENCE));
        assertEquals(1000, r.builds());
        assertEquals(1000 - expected, r.opAmp("follower").orElseThrow().quiescentVolts().total());
        assertTrue(r.passingBuilds() <= 1000 - expected);
        // With Ra never above nominal the divider only rises: every converged build sits at or above Vs/2 − Rb tolerance effect.
        assertTrue(r.opAmp("follower").orElseThrow().minQuiescentVolts() >= VS * (1 - T) / (2 - T) - 1e-3);
    }

    @Test
    void yieldCountsBuildsWithEveryStagePassingAndTheWorstBuildOpensAsADesign() {
        // A stage near its headroom limit: 4.9 V of room at 10 V, 0.312 V in × 11 = 3.432 V peak:
        // 3 dB needs 3.432·1.4125 = 4.848 V, 0.052 V less than there is; ±5 % divider resistors
        // (3σ) move the rest point with σ ≈ 10 V·(0.0165/√8) ≈ 0.058 V, so roughly 40 % of builds fail.
        Design d = StudyDesigns.gainOfEleven(new FixedRail(10, 0, 0, 0, 0), 0.312);
        MonteCarloResult r = MonteCarlo.run(d, ToleranceOptions.resistorsOnly(T),
                MonteCarloOptions.defaults().withBuilds(2000));
        assertTrue(r.yield() > 0.05 && r.yield() < 0.95, () -> "yield " + r.yield());
        StageDistribution amp = r.opAmp("amp").orElseThrow();
        assertEquals(r.builds() - r.passingBuilds(), amp.failingBuilds());
        WorstBuild worst = r.worst().orElseThrow();
        assertTrue(worst.marginDb() < 0);
        assertEquals("amp", worst.opAmp());
        DesignReport opened = DesignAnalysis.analyse(worst.build().design(), false);
        assertEquals(worst.quiescentVolts()[0], opened.stage("amp").orElseThrow().outputVolts(), 1e-9);
        List<Ladder> ladders = r.withSpread(opened.ladders());
        assertTrue(ladders.get(0).spreadLowVolts().getAsDouble() < ladders.get(0).spreadHighVolts().getAsDouble());
    }

    @Test
    void badBuildCountsAreRejectedNamingTheField() {
        assertEquals("monteCarlo.builds", assertThrows(StudyOptionsException.class,
                () -> MonteCarloOptions.defaults().withBuilds(0)).field());
        assertEquals("monteCarlo.builds", assertThrows(StudyOptionsException.class,
                () -> MonteCarloOptions.defaults().withBuilds(-5)).field());
        assertEquals("monteCarlo.histogramBins", assertThrows(StudyOptionsException.class,
                () -> MonteCarloOptions.defaults().withHistogramBins(0)).field());
    }
}
