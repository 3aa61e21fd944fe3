package halfrail.check;

import halfrail.solve.PowerOnResult;
import halfrail.units.Quantities;

import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * The first moments after switch-on, every capacitor starting empty.
 *
 * @param settled          whether every watched node came within the band before the run ended
 * @param settleSeconds    the last time a watched node left its band around the final value, s
 * @param bandVolts        the band used, V
 * @param simulatedSeconds how far the run went, s
 * @param pinnedSeconds    per op-amp label, how long its output sat on a rail during start, s
 * @param loadStepVolts    the largest excursion at the load from its final value, V
 * @param trace            the watched voltages, downsampled for plots, when kept
 * @param oscillation      a sustained oscillation seen after switch-on (the run then stops once it
 *                         is recognised, so {@code simulatedSeconds} and {@code pinnedSeconds} cover
 *                         only that far)
 */
public record PowerOnReport(boolean settled, OptionalDouble settleSeconds, double bandVolts, double simulatedSeconds,
                            Map<String, Double> pinnedSeconds, double loadStepVolts, Optional<PowerOnTrace> trace,
                            Optional<PowerOnResult.Oscillation> oscillation) {
    public PowerOnReport {
        pinnedSeconds = Map.copyOf(pinnedSeconds);
        trace = trace == null ? Optional.empty() : trace;
        oscillation = oscillation == null ? Optional.empty() : oscillation;
    }

    /** Without a trace or an oscillation. */
    public PowerOnReport(boolean settled, OptionalDouble settleSeconds, double bandVolts, double simulatedSeconds,
                         Map<String, Double> pinnedSeconds, double loadStepVolts) {
        this(settled, settleSeconds, bandVolts, simulatedSeconds, pinnedSeconds, loadStepVolts, Optional.empty(),
                Optional.empty());
    }

    /**
     * The settle-up in words: the time when the run settled, "keeps oscillating (period …)" when
     * it oscillated, otherwise "not settled within" the simulated time.
     */
    public String settleSummary() {
        if (settled && settleSeconds.isPresent()) {
            return Quantities.seconds(settleSeconds.getAsDouble());
        }
        return oscillation.map(o -> "keeps oscillating (period " + Quantities.seconds(o.periodSeconds()) + ")")
                .orElse("not settled within " + Quantities.seconds(simulatedSeconds));
    }
}
