package halfrail.solve;

import org.apache.commons.math3.analysis.UnivariateFunction;
import org.apache.commons.math3.analysis.solvers.AllowedSolution;
import org.apache.commons.math3.analysis.solvers.BracketingNthOrderBrentSolver;
import org.apache.commons.math3.exception.MathIllegalArgumentException;
import org.apache.commons.math3.exception.MathIllegalStateException;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;
import org.apache.commons.math3.optim.univariate.UnivariatePointValuePair;

import java.util.OptionalDouble;
import java.util.function.DoubleUnaryOperator;

/**
 * Finds the peak of |H(f)| over a frequency range and the −3.0103 dB points either side of it,
 * working on u = log10 f. A log grid of {@link AcAnalysis#GRID_POINTS_PER_DECADE} points per
 * decade (at most {@link AcAnalysis#MAX_GRID_POINTS}) locates the peak and brackets each corner;
 * Brent's method refines the peak and a bracketing Brent solver the corners. Features narrower
 * than the grid spacing (a sharp resonance, a notch dipping below the corner level between two
 * grid points) can be missed.
 */
final class PassbandFinder {
    /** Ratio of corner to peak magnitude, 1/√2 (−3.0103 dB). */
    static final double CORNER_RATIO = 1 / Math.sqrt(2);
    /** Relative tolerance of the peak search on log10 f. */
    static final double PEAK_RELATIVE_TOLERANCE = 1e-9;
    /**
     * Absolute tolerance of the peak search on log10 f, decades. At the peak |H| is flat to first
     * order: an error Δu in its place costs a band-pass of quality factor Q about
     * 2Q²(ln 10)²Δu² of its height, 2e-8 for Q = 40 at 1e-6 decades (and Brent's closing parabolic
     * steps usually land far closer), ample for signal peaks and headroom. Tighter, the search only
     * spends solves: at 1e-10 they were about a fifth of a design's AC factorisations.
     */
    static final double PEAK_ABSOLUTE_TOLERANCE_DECADES = 1e-6;
    /** Where the probe beside a falling end of the range sits, as a fraction of one grid step. */
    static final double EDGE_PROBE_FRACTION = 1e-3;
    /** Relative accuracy of the corner solve on log10 f. */
    static final double CORNER_RELATIVE_ACCURACY = 1e-14;
    /** Absolute accuracy of the corner solve on log10 f, decades (about 2e-13 relative in f). */
    static final double CORNER_ABSOLUTE_ACCURACY_DECADES = 1e-13;
    /** Accuracy of the corner solve on |H|/peak − 1/√2. */
    static final double CORNER_FUNCTION_ACCURACY = 1e-15;
    /** Order of the bracketing Brent solver. */
    static final int CORNER_SOLVER_ORDER = 5;

    private final DoubleUnaryOperator magnitude;
    private final int maxPeakEvaluations;
    private final int maxCornerEvaluations;

    /** @param magnitude |H| as a function of frequency in Hz */
    PassbandFinder(DoubleUnaryOperator magnitude) {
        this(magnitude, AcAnalysis.MAX_PEAK_EVALUATIONS, AcAnalysis.MAX_CORNER_EVALUATIONS);
    }

    /** With other evaluation limits than {@link AcAnalysis}'s (tests reach them on purpose). */
    PassbandFinder(DoubleUnaryOperator magnitude, int maxPeakEvaluations, int maxCornerEvaluations) {
        this.magnitude = magnitude;
        this.maxPeakEvaluations = maxPeakEvaluations;
        this.maxCornerEvaluations = maxCornerEvaluations;
    }

    /** The peak of |H| over the range (grid and Brent refinement as {@link #find}), without the corners. */
    AcPassband findPeak(double fStartHz, double fStopHz) {
        return search(fStartHz, fStopHz, false, false);
    }

    AcPassband find(double fStartHz, double fStopHz) {
        return search(fStartHz, fStopHz, true, true);
    }

    /** The peak and only the corners asked for (the other is left empty, its search skipped). */
    AcPassband find(double fStartHz, double fStopHz, boolean lowerCorner, boolean upperCorner) {
        return search(fStartHz, fStopHz, lowerCorner, upperCorner);
    }

    private AcPassband search(double fStartHz, double fStopHz, boolean lowerCorner, boolean upperCorner) {
        double u0 = Math.log10(fStartHz);
        double u1 = Math.log10(fStopHz);
        int m = (int) Math.min(AcAnalysis.MAX_GRID_POINTS,
                Math.max(3, Math.ceil((u1 - u0) * AcAnalysis.GRID_POINTS_PER_DECADE) + 1));
        double[] u = new double[m];
        double[] mag = new double[m];
        int best = 0;
        for (int k = 0; k < m; k++) {
            u[k] = k == m - 1 ? u1 : u0 + (u1 - u0) * k / (m - 1);
            mag[k] = at(u[k]);
            if (mag[k] > mag[best]) {
                best = k;
            }
        }
        double uPeak = u[best];
        double peak = mag[best];
        if (peak == 0) {
            return new AcPassband(Math.pow(10, uPeak), 0, OptionalDouble.empty(), OptionalDouble.empty());
        }
        if (!atFallingEdge(u, mag, best)) {
            UnivariatePointValuePair refined = refinePeak(u[Math.max(0, best - 1)], u[Math.min(m - 1, best + 1)], uPeak);
            if (refined.getValue() > peak) {
                uPeak = refined.getPoint();
                peak = refined.getValue();
            }
        }
        if (!lowerCorner && !upperCorner) {
            return new AcPassband(Math.pow(10, uPeak), peak, OptionalDouble.empty(), OptionalDouble.empty());
        }
        double ref = peak;
        UnivariateFunction below = x -> at(x) / ref - CORNER_RATIO;
        OptionalDouble lower = OptionalDouble.empty();
        double last = uPeak;
        for (int k = m - 1; lowerCorner && k >= 0; k--) {
            if (u[k] >= uPeak) {
                continue;
            }
            if (mag[k] / ref - CORNER_RATIO < 0) {
                lower = OptionalDouble.of(Math.pow(10, corner(below, u[k], last, "lower")));
                break;
            }
            last = u[k];
        }
        OptionalDouble upper = OptionalDouble.empty();
        last = uPeak;
        for (int k = 0; upperCorner && k < m; k++) {
            if (u[k] <= uPeak) {
                continue;
            }
            if (mag[k] / ref - CORNER_RATIO < 0) {
                upper = OptionalDouble.of(Math.pow(10, corner(below, last, u[k], "upper")));
                break;
            }
            last = u[k];
        }
        return new AcPassband(Math.pow(10, uPeak), peak, lower, upper);
    }

    /**
     * Whether the grid's largest value lies at an end of the range with |H| falling away from it
     * into the range, both to the next grid point and just inside the end (a probe
     * {@link #EDGE_PROBE_FRACTION} of a grid step in): then that end is the peak over the range
     * itself, exactly, and Brent's search, which creeps towards a bound of its interval in a dozen
     * evaluations, is spared. A high-pass seen across its capacitor or a low-pass at its output
     * peaks at an end of the band this way.
     */
    private boolean atFallingEdge(double[] u, double[] mag, int best) {
        int m = u.length;
        if (best == 0 && mag[1] < mag[0]) {
            return at(u[0] + EDGE_PROBE_FRACTION * (u[1] - u[0])) <= mag[0];
        }
        if (best == m - 1 && mag[m - 2] < mag[m - 1]) {
            return at(u[m - 1] - EDGE_PROBE_FRACTION * (u[m - 1] - u[m - 2])) <= mag[m - 1];
        }
        return false;
    }

    private double at(double log10Hz) {
        return magnitude.applyAsDouble(Math.pow(10, log10Hz));
    }

    private UnivariatePointValuePair refinePeak(double lo, double hi, double start) {
        BrentOptimizer optimizer = new BrentOptimizer(PEAK_RELATIVE_TOLERANCE, PEAK_ABSOLUTE_TOLERANCE_DECADES);
        try {
            return optimizer.optimize(new MaxEval(maxPeakEvaluations),
                    new UnivariateObjectiveFunction(this::at), GoalType.MAXIMIZE,
                    new SearchInterval(lo, hi, start));
        } catch (MathIllegalStateException e) {
            throw new AnalysisException(AnalysisException.Kind.NO_CONVERGENCE,
                    "the search for the peak gain did not converge within " + maxPeakEvaluations
                            + " evaluations between " + Math.pow(10, lo) + " and " + Math.pow(10, hi) + " Hz");
        }
    }

    private double corner(UnivariateFunction below, double lo, double hi, String which) {
        BracketingNthOrderBrentSolver solver = new BracketingNthOrderBrentSolver(CORNER_RELATIVE_ACCURACY,
                CORNER_ABSOLUTE_ACCURACY_DECADES, CORNER_FUNCTION_ACCURACY, CORNER_SOLVER_ORDER);
        try {
            return solver.solve(maxCornerEvaluations, below, lo, hi, AllowedSolution.ANY_SIDE);
        } catch (MathIllegalStateException | MathIllegalArgumentException e) {
            throw new AnalysisException(AnalysisException.Kind.NO_CONVERGENCE,
                    "the search for the " + which + " −3 dB point did not converge within "
                            + maxCornerEvaluations + " evaluations between " + Math.pow(10, lo)
                            + " and " + Math.pow(10, hi) + " Hz");
        }
    }
}
