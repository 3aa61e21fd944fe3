package halfrail.check;

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
 */
public record PowerOnReport(boolean settled, OptionalDouble settleSeconds, double bandVolts, double simulatedSeconds,
                            Map<String, Double> pinnedSeconds, double loadStepVolts, Optional<PowerOnTrace> trace) {
    public PowerOnReport {
        pinnedSeconds = Map.copyOf(pinnedSeconds);
        trace = trace == null ? Optional.empty() : trace;
    }

    /** Without a trace. */
    public PowerOnReport(boolean settled, OptionalDouble settleSeconds, double bandVolts, double simulatedSeconds,
                         Map<String, Double> pinnedSeconds, double loadStepVolts) {
        this(settled, settleSeconds, bandVolts, simulatedSeconds, pinnedSeconds, loadStepVolts, Optional.empty());
    }
}
