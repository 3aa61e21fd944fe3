package halfrail.check;

import halfrail.design.Design;
import halfrail.solve.AnalysisException;

import java.util.ArrayList;
import java.util.Collections;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A Monte Carlo study of a design.
 *
 * @param design           the design studied
 * @param supplyVolts      the supply voltage of every build, V
 * @param options          how it ran
 * @param parameters       the varied parameters
 * @param builds           builds run
 * @param passingBuilds    builds in which every op-amp passes (not saturated, headroom ≥ minHeadroomDb)
 * @param failedToConverge builds whose operating point could not be solved; they count as not passing
 *                         and are left out of the distributions, never dropped from {@code builds}
 * @param failuresByKind   those builds by the kind of analysis failure
 * @param opAmps           every op-amp over the converged builds, the reference buffer (if any) first
 * @param worst            the converged build with the smallest margin; empty when none converged
 */
public record MonteCarloResult(Design design, double supplyVolts, MonteCarloOptions options,
                               List<ToleranceParameter> parameters, long builds, long passingBuilds,
                               long failedToConverge, Map<AnalysisException.Kind, Long> failuresByKind,
                               List<StageDistribution> opAmps, Optional<WorstBuild> worst) {
    public MonteCarloResult {
        parameters = List.copyOf(parameters);
        EnumMap<AnalysisException.Kind, Long> copy = new EnumMap<>(AnalysisException.Kind.class);
        copy.putAll(failuresByKind);
        failuresByKind = Collections.unmodifiableMap(copy);
        opAmps = List.copyOf(opAmps);
    }

    /** Share of builds with every op-amp passing, 0 to 1 (non-converged builds count as failing). */
    public double yield() {
        return (double) passingBuilds / builds;
    }

    public Optional<StageDistribution> opAmp(String label) {
        return opAmps.stream().filter(s -> s.label().equals(label)).findFirst();
    }

    /**
     * The ladders with each op-amp's rest-point spread filled in from the
     * {@link MonteCarlo#SPREAD_LOW_PERCENT} and {@link MonteCarlo#SPREAD_HIGH_PERCENT} percentiles.
     */
    public List<Ladder> withSpread(List<Ladder> ladders) {
        List<Ladder> out = new ArrayList<>();
        for (Ladder l : ladders) {
            out.add(opAmp(l.opAmp()).map(s -> l.withSpread(s.lowPercentileVolts(), s.highPercentileVolts())).orElse(l));
        }
        return out;
    }
}
