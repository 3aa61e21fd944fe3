package halfrail.check;

import halfrail.design.Design;
import halfrail.solve.AnalysisException;

import org.apache.commons.math3.stat.descriptive.rank.Percentile;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionException;
import java.util.concurrent.Executor;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.atomic.AtomicLong;

/**
 * Monte Carlo: N builds of a design with every toleranced part drawn at random (see
 * {@link ParameterSampler} and {@link MonteCarloOptions.Distribution}), each solved for its DC
 * operating point (Newton started from the nominal solution) and its headroom at the nominal
 * signal gain (one AC analysis at nominal, reused).
 *
 * <p>Builds run in chunks of {@link #CHUNK_BUILDS} on the executor given (by default a fork-join
 * pool with one worker per processor, made for the run); results are stored by build index and summarised in index order,
 * so the numbers do not depend on the thread count. The cancel token is checked before every
 * build; a cancelled study throws {@link StudyCancelledException}. Progress is reported after
 * every chunk. A build that cannot be solved is counted in {@link MonteCarloResult#failedToConverge()}
 * (by kind), counts as not passing, and is left out of the distributions.
 */
public final class MonteCarlo {
    /** Builds per task handed to the executor. */
    public static final int CHUNK_BUILDS = 64;
    /** Lower percentile of the rest point used as the ladder's spread, % (the normal ±3σ share). */
    public static final double SPREAD_LOW_PERCENT = 0.135;
    /** Upper percentile of the rest point used as the ladder's spread, %. */
    public static final double SPREAD_HIGH_PERCENT = 99.865;

    private MonteCarlo() {}

    /**
     * Run on every core, without progress or cancellation: on a fork-join pool of one worker per
     * available processor, made for this run and shut down after it.
     */
    public static MonteCarloResult run(Design design, ToleranceOptions tolerances, MonteCarloOptions options) {
        ToleranceModel model = ToleranceModel.of(design, tolerances);
        ForkJoinPool pool = new ForkJoinPool(Runtime.getRuntime().availableProcessors());
        try {
            return run(model, options, pool, StudyProgress.NONE, CancelToken.none());
        } finally {
            pool.shutdown();
        }
    }

    /**
     * Run {@code options.builds()} builds of {@code model} on {@code executor}.
     *
     * @param progress told (done, total) after every chunk, from worker threads
     * @param cancel   checked before every build
     * @throws StudyCancelledException when {@code cancel} was cancelled before the last build finished
     * @throws AnalysisException       when the nominal build cannot be solved
     */
    public static MonteCarloResult run(ToleranceModel model, MonteCarloOptions options, Executor executor,
                                       StudyProgress progress, CancelToken cancel) {
        StudyOptionsException.RULES.required("model", model);
        StudyOptionsException.RULES.required("monteCarlo", options);
        return run(model, options, executor, progress, cancel, new BuildEvaluator(model));
    }

    /** As {@link #run(ToleranceModel, MonteCarloOptions, Executor, StudyProgress, CancelToken)}, with the solve replaceable (tests). */
    static MonteCarloResult run(ToleranceModel model, MonteCarloOptions options, Executor executor,
                                StudyProgress progress, CancelToken cancel, BuildEvaluator.DcSolve solve) {
        return run(model, options, executor, progress, cancel, new BuildEvaluator(model, solve));
    }

    private static MonteCarloResult run(ToleranceModel model, MonteCarloOptions options, Executor executor,
                                        StudyProgress progress, CancelToken cancel, BuildEvaluator ev) {
        StudyOptionsException.RULES.required("executor", executor);
        StudyOptionsException.RULES.required("progress", progress);
        StudyOptionsException.RULES.required("cancel", cancel);
        int n = options.builds();
        int m = ev.opAmpCount();
        int np = model.parameters().size();
        ParameterSampler sampler = new ParameterSampler(model.parameters(), options.distribution());
        double[][] q = new double[m][n];
        double[][] h = new double[m][n];
        boolean[][] sat = new boolean[m][n];
        boolean[] converged = new boolean[n];
        boolean[] passes = new boolean[n];
        double[] margin = new double[n];
        AnalysisException.Kind[] failure = new AnalysisException.Kind[n];
        AtomicLong done = new AtomicLong();
        int chunks = (n + CHUNK_BUILDS - 1) / CHUNK_BUILDS;
        List<CompletableFuture<Void>> tasks = new ArrayList<>(chunks);
        for (int c = 0; c < chunks; c++) {
            int from = c * CHUNK_BUILDS;
            int to = Math.min(n, from + CHUNK_BUILDS);
            tasks.add(CompletableFuture.runAsync(() -> {
                double[] values = new double[np];
                double[] qb = new double[m];
                double[] hb = new double[m];
                boolean[] sb = new boolean[m];
                BuildEvaluator.Work work = ev.work();
                int finished = 0;
                for (int i = from; i < to; i++) {
                    if (cancel.isCancelled()) {
                        break;
                    }
                    sampler.sample(options.seed(), i, values);
                    try {
                        passes[i] = ev.evaluate(values, work, qb, hb, sb);
                        converged[i] = true;
                        margin[i] = ev.worstMarginDb(hb, sb);
                        for (int k = 0; k < m; k++) {
                            q[k][i] = qb[k];
                            h[k][i] = hb[k];
                            sat[k][i] = sb[k];
                        }
                    } catch (AnalysisException e) {
                        failure[i] = e.kind();
                    }
                    finished++;
                }
                progress.progress(done.addAndGet(finished), n);
            }, executor));
        }
        try {
            CompletableFuture.allOf(tasks.toArray(new CompletableFuture[0])).join();
        } catch (CompletionException e) {
            if (e.getCause() instanceof RuntimeException r) {
                throw r;
            }
            throw e;
        }
        if (done.get() < n) {
            throw new StudyCancelledException(done.get(), n);
        }
        return summarise(model, options, ev, sampler, q, h, sat, converged, passes, margin, failure);
    }

    private static MonteCarloResult summarise(ToleranceModel model, MonteCarloOptions options, BuildEvaluator ev,
                                              ParameterSampler sampler, double[][] q, double[][] h, boolean[][] sat,
                                              boolean[] converged, boolean[] passes, double[] margin,
                                              AnalysisException.Kind[] failure) {
        int n = converged.length;
        int m = q.length;
        long passing = 0;
        long failed = 0;
        Map<AnalysisException.Kind, Long> byKind = new EnumMap<>(AnalysisException.Kind.class);
        int worst = -1;
        for (int i = 0; i < n; i++) {
            if (!converged[i]) {
                failed++;
                byKind.merge(failure[i], 1L, Long::sum);
                continue;
            }
            if (passes[i]) {
                passing++;
            }
            if (worst < 0 || margin[i] < margin[worst]) {
                worst = i;
            }
        }
        List<StageDistribution> stages = new ArrayList<>();
        for (int k = 0; k < m; k++) {
            stages.add(distribution(ev, k, q[k], h[k], sat[k], converged, options.histogramBins()));
        }
        Optional<WorstBuild> worstBuild = Optional.empty();
        if (worst >= 0) {
            double[] values = new double[model.parameters().size()];
            sampler.sample(options.seed(), worst, values);
            String label = ev.nominal.opAmps.get(0).label();
            double smallest = Double.POSITIVE_INFINITY;
            for (int k = 0; k < m; k++) {
                double mk = sat[k][worst] ? Double.NEGATIVE_INFINITY
                        : ev.nominal.opAmps.get(k).signal() ? h[k][worst] - ev.nominal.minHeadroomDb
                        : Double.POSITIVE_INFINITY;
                if (mk < smallest) {
                    smallest = mk;
                    label = ev.nominal.opAmps.get(k).label();
                }
            }
            double[] rest = new double[m];
            for (int k = 0; k < m; k++) {
                rest[k] = q[k][worst];
            }
            worstBuild = Optional.of(new WorstBuild(worst, margin[worst], label, rest,
                    model.buildDesign(values, model.design().name() + " (Monte Carlo build " + worst + ")")));
        }
        return new MonteCarloResult(model.design(), ev.nominal.supplyVolts, options, model.parameters(), n, passing,
                failed, byKind, stages, worstBuild);
    }

    private static StageDistribution distribution(BuildEvaluator ev, int k, double[] q, double[] h, boolean[] sat,
                                                  boolean[] converged, int bins) {
        int count = 0;
        double sum = 0;
        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        long failing = 0;
        long saturated = 0;
        for (int i = 0; i < q.length; i++) {
            if (!converged[i]) {
                continue;
            }
            count++;
            sum += q[i];
            min = Math.min(min, q[i]);
            max = Math.max(max, q[i]);
            if (!ev.passes(k, h[i], sat[i])) {
                failing++;
            }
            if (sat[i]) {
                saturated++;
            }
        }
        double mean = count > 0 ? sum / count : Double.NaN;
        double ss = 0;
        double[] used = new double[count];
        int u = 0;
        for (int i = 0; i < q.length; i++) {
            if (converged[i]) {
                ss += (q[i] - mean) * (q[i] - mean);
                used[u++] = q[i];
            }
        }
        double sd = count > 1 ? Math.sqrt(ss / (count - 1)) : 0;
        double lowP = Double.NaN;
        double highP = Double.NaN;
        if (count > 0) {
            Percentile p = new Percentile();
            p.setData(used);
            lowP = p.evaluate(SPREAD_LOW_PERCENT);
            highP = p.evaluate(SPREAD_HIGH_PERCENT);
        }
        var sn = ev.nominal.opAmps.get(k);
        return new StageDistribution(sn.label(), sn.designPath(), sn.signal(), mean, sd, min, max, lowP, highP,
                Histogram.of(q, converged, bins), Histogram.of(h, converged, bins), failing, saturated);
    }
}
