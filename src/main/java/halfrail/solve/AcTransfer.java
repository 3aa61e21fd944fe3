package halfrail.solve;

/**
 * A small-signal transfer at one frequency: the complex output per unit of input, H = re + j·im.
 * For a voltage-source input H is in V/V; for a current-source input it is in V/A (Ω).
 *
 * @param frequencyHz the frequency in Hz
 * @param re          real part of H
 * @param im          imaginary part of H
 */
public record AcTransfer(double frequencyHz, double re, double im) {

    /** |H|, in V/V (or Ω for a current input). */
    public double magnitude() {
        return Math.hypot(re, im);
    }

    /** 20·log10 |H| in dB; negative infinity when H is zero. */
    public double decibels() {
        return 20 * Math.log10(magnitude());
    }

    /** arg H in degrees, in (−180, 180]; 0 when H is zero. */
    public double phaseDegrees() {
        double deg = Math.toDegrees(Math.atan2(im, re));
        return deg == -180 ? 180 : deg;
    }
}
