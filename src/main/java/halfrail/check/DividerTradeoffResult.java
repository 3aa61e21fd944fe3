package halfrail.check;

import halfrail.design.Design;

import java.util.List;
import java.util.OptionalDouble;

/**
 * The battery trade-off of a design's bias divider.
 *
 * @param design           the design studied
 * @param supplyVolts      the supply voltage of every row, V (the nominal)
 * @param capacityAmpHours the supply's capacity, A·h, when it has one
 * @param settleBandVolts  half-width of the settle band for the transients, V
 * @param choices          the rows by rising Thévenin resistance; exactly one is {@link DividerChoice#current()}
 */
public record DividerTradeoffResult(Design design, double supplyVolts, OptionalDouble capacityAmpHours,
                                    double settleBandVolts, List<DividerChoice> choices) {
    public DividerTradeoffResult {
        choices = List.copyOf(choices);
    }

    /** The design's own divider. */
    public DividerChoice current() {
        return choices.stream().filter(DividerChoice::current).findFirst().orElseThrow();
    }
}
