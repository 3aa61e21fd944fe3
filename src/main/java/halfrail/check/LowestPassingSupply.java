package halfrail.check;

import java.util.OptionalDouble;

/**
 * The lowest supply at which one op-amp still passes at the nominal signal (not saturated at
 * rest, headroom at least the design's {@code minHeadroomDb}), passing everywhere above it up to
 * the top of the sweep.
 *
 * @param verdict             how the stage fared over the sweep
 * @param volts               the lowest passing supply, V: the refined crossing for
 *                            {@link Verdict#FAILS_BELOW}, the bottom of the sweep for
 *                            {@link Verdict#PASSES_THROUGHOUT}; empty for {@link Verdict#FAILS_AT_TOP}
 * @param capacityLeftPercent for a battery, the share of its capacity still left when its voltage
 *                            has fallen to {@code volts}, % (from the chemistry's discharge curve
 *                            at the per-cell voltage); empty for other supplies or without {@code volts}
 */
public record LowestPassingSupply(Verdict verdict, OptionalDouble volts, OptionalDouble capacityLeftPercent) {
    /** How an op-amp fared over a supply sweep. */
    public enum Verdict {
        /** It passes at every supply of the sweep. */
        PASSES_THROUGHOUT,
        /** It passes at the top of the sweep and stops passing below {@link #volts()}. */
        FAILS_BELOW,
        /** It does not pass even at the highest supply of the sweep. */
        FAILS_AT_TOP
    }
}
