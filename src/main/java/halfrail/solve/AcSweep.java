package halfrail.solve;

import java.util.Arrays;

/**
 * A swept small-signal response: the transfer from {@code input} to the voltage
 * V({@code outputPlus}) − V({@code outputMinus}) at each frequency. Immutable; arrays are copied
 * in and out. The arrays all have the same length, at least 2.
 *
 * @param input           the source driven with a unit small-signal amplitude
 * @param outputPlus      the node whose voltage is the output
 * @param outputMinus     the node the output is measured against ({@code "0"} for ground)
 * @param frequenciesHz   the frequencies in Hz, ascending
 * @param re              real part of the transfer at each frequency (V/V, or Ω for a current input)
 * @param im              imaginary part of the transfer at each frequency
 * @param magnitudeDb     20·log10 |H| in dB at each frequency (negative infinity where H is zero)
 * @param phaseDegrees    arg H in degrees, unwrapped along the sweep: the first value lies in
 *                        (−180, 180] and no step between neighbours exceeds 180°
 */
public record AcSweep(String input, String outputPlus, String outputMinus, double[] frequenciesHz,
                      double[] re, double[] im, double[] magnitudeDb, double[] phaseDegrees) {

    public AcSweep {
        int n = frequenciesHz.length;
        if (n < 2 || re.length != n || im.length != n || magnitudeDb.length != n || phaseDegrees.length != n) {
            throw new IllegalArgumentException("a sweep needs at least 2 points and arrays of equal length");
        }
        frequenciesHz = frequenciesHz.clone();
        re = re.clone();
        im = im.clone();
        magnitudeDb = magnitudeDb.clone();
        phaseDegrees = phaseDegrees.clone();
    }

    /** Builds a sweep from the transfers, deriving magnitude and unwrapped phase. */
    static AcSweep of(String input, String outputPlus, String outputMinus, AcTransfer[] points) {
        int n = points.length;
        double[] f = new double[n];
        double[] r = new double[n];
        double[] i = new double[n];
        double[] db = new double[n];
        double[] ph = new double[n];
        for (int k = 0; k < n; k++) {
            AcTransfer t = points[k];
            f[k] = t.frequencyHz();
            r[k] = t.re();
            i[k] = t.im();
            db[k] = t.decibels();
            double p = t.phaseDegrees();
            if (k > 0) {
                p += 360 * Math.rint((ph[k - 1] - p) / 360);
            }
            ph[k] = p;
        }
        return new AcSweep(input, outputPlus, outputMinus, f, r, i, db, ph);
    }

    /** Number of frequencies. */
    public int size() {
        return frequenciesHz.length;
    }

    /** The transfer at index {@code k}. */
    public AcTransfer point(int k) {
        return new AcTransfer(frequenciesHz[k], re[k], im[k]);
    }

    @Override
    public double[] frequenciesHz() {
        return frequenciesHz.clone();
    }

    @Override
    public double[] re() {
        return re.clone();
    }

    @Override
    public double[] im() {
        return im.clone();
    }

    @Override
    public double[] magnitudeDb() {
        return magnitudeDb.clone();
    }

    @Override
    public double[] phaseDegrees() {
        return phaseDegrees.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof AcSweep s && input.equals(s.input) && outputPlus.equals(s.outputPlus)
                && outputMinus.equals(s.outputMinus) && Arrays.equals(frequenciesHz, s.frequenciesHz)
                && Arrays.equals(re, s.re) && Arrays.equals(im, s.im);
    }

    @Override
    public int hashCode() {
        return 31 * (31 * input.hashCode() + outputPlus.hashCode()) + Arrays.hashCode(re) + Arrays.hashCode(im);
    }

    @Override
    public String toString() {
        return "AcSweep[" + input + " -> V(" + outputPlus + ", " + outputMinus + "), " + size() + " points, "
                + frequenciesHz[0] + " to " + frequenciesHz[size() - 1] + " Hz]";
    }
}
