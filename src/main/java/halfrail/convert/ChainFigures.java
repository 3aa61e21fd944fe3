package halfrail.convert;

import java.util.List;
import java.util.OptionalDouble;

/**
 * The figures of one version of the circuit (the dual-rail original or the conversion), every
 * one from the engine.
 *
 * @param version       "dual-rail original" or "single-supply conversion"
 * @param points        the last stage's swing at each supply point (the original has only its nominal one)
 * @param gain          the chain's gain at the band's geometric centre, V/V magnitude
 * @param supplyAmps    total current from the supply (the positive rail for the original), A
 * @param negativeRailAmps current into the negative rail (original only; 0 for the conversion), A
 * @param lowerCornerHz the chain's lower −3 dB point, Hz (empty: passes DC)
 * @param settleSeconds settle-up time after switch-on, s (empty: not settled within the run)
 */
public record ChainFigures(String version, List<SupplyPoint> points, double gain, double supplyAmps,
                           double negativeRailAmps, OptionalDouble lowerCornerHz, OptionalDouble settleSeconds) {
    public ChainFigures {
        points = List.copyOf(points);
    }

    /** The point with {@code label}, or the first one when there is none so named. */
    public SupplyPoint point(String label) {
        return points.stream().filter(p -> p.label().equals(label)).findFirst().orElse(points.get(0));
    }
}
