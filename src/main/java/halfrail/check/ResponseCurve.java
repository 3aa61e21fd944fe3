package halfrail.check;

import java.util.Arrays;
import java.util.OptionalDouble;

/**
 * The small-signal gain from the source to one node over a logarithmic frequency sweep, at the
 * nominal operating point, for plotting. Immutable; arrays are copied in and out.
 *
 * @param label          what the curve shows: a stage's label, or {@link #LOAD_LABEL} for the load
 * @param node           the circuit node it was taken at
 * @param atLoad         whether it was taken at the load (rather than at a stage's output)
 * @param frequenciesHz  sweep frequencies, Hz, rising
 * @param gainDb         gain from the source at each frequency, dB (20·log10 of V/V)
 * @param lowerCornerHz  the lower −3 dB point of this curve, Hz, when it has one in the searched range
 */
public record ResponseCurve(String label, String node, boolean atLoad, double[] frequenciesHz, double[] gainDb,
                            OptionalDouble lowerCornerHz) {
    /** Label of the load's curve. */
    public static final String LOAD_LABEL = "load";
    /** Sweep points per decade. */
    public static final int POINTS_PER_DECADE = 20;

    public ResponseCurve {
        if (frequenciesHz.length != gainDb.length) {
            throw new IllegalArgumentException(frequenciesHz.length + " frequencies for " + gainDb.length + " gains");
        }
        frequenciesHz = frequenciesHz.clone();
        gainDb = gainDb.clone();
    }

    @Override
    public double[] frequenciesHz() {
        return frequenciesHz.clone();
    }

    @Override
    public double[] gainDb() {
        return gainDb.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ResponseCurve c && label.equals(c.label) && node.equals(c.node) && atLoad == c.atLoad
                && Arrays.equals(frequenciesHz, c.frequenciesHz) && Arrays.equals(gainDb, c.gainDb)
                && lowerCornerHz.equals(c.lowerCornerHz);
    }

    @Override
    public int hashCode() {
        return (label.hashCode() * 31 + node.hashCode()) * 31 + Arrays.hashCode(gainDb);
    }

    @Override
    public String toString() {
        return "ResponseCurve[" + label + " at " + node + ", " + frequenciesHz.length + " points]";
    }
}
