package halfrail.solve;

import java.util.OptionalDouble;

/**
 * The passband of a response over a frequency range: where |H| peaks and where it has fallen to
 * 1/√2 of the peak (−3.0103 dB) on either side.
 *
 * @param peakHz          frequency of the largest |H| in the range, Hz
 * @param peakMagnitude   that largest |H| (V/V, or Ω for a current input); the reference gain
 * @param lowerCornerHz   the highest frequency below the peak, inside the range, where |H| has
 *                        fallen to peak/√2, in Hz; empty when it does not fall that far within
 *                        the range (for example a DC-coupled stage)
 * @param upperCornerHz   the lowest frequency above the peak, inside the range, where |H| has
 *                        fallen to peak/√2, in Hz; empty when it does not fall that far within
 *                        the range
 */
public record AcPassband(double peakHz, double peakMagnitude, OptionalDouble lowerCornerHz,
                         OptionalDouble upperCornerHz) {

    /** 20·log10 of the peak magnitude, dB; negative infinity when the response is zero. */
    public double peakDb() {
        return 20 * Math.log10(peakMagnitude);
    }
}
