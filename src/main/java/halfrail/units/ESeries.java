package halfrail.units;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The IEC 60063 preferred number series for resistors and capacitors. Each series has a fixed
 * set of mantissas in one decade, 1 ≤ m &lt; 10, repeated in every decade: the standard values
 * of E24 include 4.7 Ω, 470 Ω, 4.7 kΩ and 0.47 Ω alike. The methods here work over every decade
 * from {@link #SMALLEST_ARGUMENT} to {@link #LARGEST_ARGUMENT}, in any unit.
 *
 * <p>E6, E12 and E24 hold the values of the standard's table, which for E24 differ from the
 * rounded 10^(n/24) at 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7 and 8.2. E48, E96 and E192 hold
 * 10^(n/N) rounded to three significant figures, except the published E192 value 9.20 where the
 * formula gives 9.19.
 *
 * <p>Standard values are the doubles nearest to the decimal values (4.7 kΩ is exactly the double
 * that {@link EngineeringValue#parse(String) parse("4k7")} gives), so {@link #nextHigher} and
 * {@link #nextLower} compare exactly; use {@link #contains} or {@link #nearest} for computed
 * values that may carry rounding noise.
 */
public enum ESeries {
    /** Six values per decade, for ±20 % parts. */
    E6(20.0, 100, 150, 220, 330, 470, 680),
    /** Twelve values per decade, for ±10 % parts. */
    E12(10.0, 100, 120, 150, 180, 220, 270, 330, 390, 470, 560, 680, 820),
    /** Twenty-four values per decade, for ±5 % parts. */
    E24(5.0, 100, 110, 120, 130, 150, 160, 180, 200, 220, 240, 270, 300,
            330, 360, 390, 430, 470, 510, 560, 620, 680, 750, 820, 910),
    /** Forty-eight values per decade, for ±2 % parts. */
    E48(2.0,
            100, 105, 110, 115, 121, 127, 133, 140, 147, 154, 162, 169, 178, 187, 196, 205,
            215, 226, 237, 249, 261, 274, 287, 301, 316, 332, 348, 365, 383, 402, 422, 442,
            464, 487, 511, 536, 562, 590, 619, 649, 681, 715, 750, 787, 825, 866, 909, 953),
    /** Ninety-six values per decade, for ±1 % parts. */
    E96(1.0,
            100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130, 133, 137, 140, 143,
            147, 150, 154, 158, 162, 165, 169, 174, 178, 182, 187, 191, 196, 200, 205, 210,
            215, 221, 226, 232, 237, 243, 249, 255, 261, 267, 274, 280, 287, 294, 301, 309,
            316, 324, 332, 340, 348, 357, 365, 374, 383, 392, 402, 412, 422, 432, 442, 453,
            464, 475, 487, 499, 511, 523, 536, 549, 562, 576, 590, 604, 619, 634, 649, 665,
            681, 698, 715, 732, 750, 768, 787, 806, 825, 845, 866, 887, 909, 931, 953, 976),
    /** 192 values per decade, for ±0.5 % parts (and tighter). Index 185 is the published 9.20. */
    E192(0.5,
            100, 101, 102, 104, 105, 106, 107, 109, 110, 111, 113, 114, 115, 117, 118, 120,
            121, 123, 124, 126, 127, 129, 130, 132, 133, 135, 137, 138, 140, 142, 143, 145,
            147, 149, 150, 152, 154, 156, 158, 160, 162, 164, 165, 167, 169, 172, 174, 176,
            178, 180, 182, 184, 187, 189, 191, 193, 196, 198, 200, 203, 205, 208, 210, 213,
            215, 218, 221, 223, 226, 229, 232, 234, 237, 240, 243, 246, 249, 252, 255, 258,
            261, 264, 267, 271, 274, 277, 280, 284, 287, 291, 294, 298, 301, 305, 309, 312,
            316, 320, 324, 328, 332, 336, 340, 344, 348, 352, 357, 361, 365, 370, 374, 379,
            383, 388, 392, 397, 402, 407, 412, 417, 422, 427, 432, 437, 442, 448, 453, 459,
            464, 470, 475, 481, 487, 493, 499, 505, 511, 517, 523, 530, 536, 542, 549, 556,
            562, 569, 576, 583, 590, 597, 604, 612, 619, 626, 634, 642, 649, 657, 665, 673,
            681, 690, 698, 706, 715, 723, 732, 741, 750, 759, 768, 777, 787, 796, 806, 816,
            825, 835, 845, 856, 866, 876, 887, 898, 909, 920, 931, 942, 953, 965, 976, 988);

    /** The smallest argument accepted by the lookup methods. */
    public static final double SMALLEST_ARGUMENT = 1e-300;
    /** The largest argument accepted by the lookup methods. */
    public static final double LARGEST_ARGUMENT = 1e300;
    /**
     * Relative tolerance of {@link #contains}: a value within this fraction of a standard value
     * counts as that value (absorbs rounding noise of computed values, not component tolerance).
     */
    public static final double CONTAINS_RELATIVE_TOLERANCE = 1e-9;

    /** Exact powers of ten as doubles: 1e0 to 1e22 are all exactly representable. */
    private static final double[] EXACT_POWERS_OF_TEN = {
            1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11,
            1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22};

    private final double tolerancePercent;
    /** The mantissas in hundredths (100 = 1.00), ascending. */
    private final int[] hundredths;

    ESeries(double tolerancePercent, int... hundredths) {
        this.tolerancePercent = tolerancePercent;
        this.hundredths = hundredths;
    }

    /** How many standard values the series has in each decade (6, 12, 24, 48, 96, 192). */
    public int valuesPerDecade() {
        return hundredths.length;
    }

    /** The component tolerance the series is meant for, in percent (± 5.0 for E24). */
    public double tolerancePercent() {
        return tolerancePercent;
    }

    /** The mantissas of one decade, ascending, from 1.0 to below 10 (E6: 1.0, 1.5, 2.2, 3.3, 4.7, 6.8). */
    public List<Double> mantissas() {
        List<Double> result = new ArrayList<>(hundredths.length);
        for (int h : hundredths) {
            result.add(scaled(h, -2));
        }
        return List.copyOf(result);
    }

    /**
     * The smallest standard value ≥ {@code x}; {@code x} itself if it is one.
     *
     * @param x a positive value, in any unit, from {@link #SMALLEST_ARGUMENT} to {@link #LARGEST_ARGUMENT}
     * @throws IllegalArgumentException if {@code x} is not positive, NaN or out of range
     */
    public double nextHigher(double x) {
        int decade = decadeOf(checked(x, "x"));
        for (int h : hundredths) {
            double v = scaled(h, decade - 2);
            if (v >= x) {
                return v;
            }
        }
        return scaled(hundredths[0], decade - 1);
    }

    /**
     * The largest standard value ≤ {@code x}; {@code x} itself if it is one.
     *
     * @param x a positive value, in any unit, from {@link #SMALLEST_ARGUMENT} to {@link #LARGEST_ARGUMENT}
     * @throws IllegalArgumentException if {@code x} is not positive, NaN or out of range
     */
    public double nextLower(double x) {
        int decade = decadeOf(checked(x, "x"));
        double best = scaled(hundredths[0], decade - 2);
        for (int h : hundredths) {
            double v = scaled(h, decade - 2);
            if (v > x) {
                break;
            }
            best = v;
        }
        return best;
    }

    /**
     * The standard value nearest to {@code x} <em>by ratio</em> (geometrically): of the two
     * neighbours {@link #nextLower(double) lo} ≤ x ≤ {@link #nextHigher(double) hi}, the one with
     * the smaller ratio, lo if x/lo &lt; hi/x, else hi. The dividing line is the geometric mean
     * √(lo·hi), not the arithmetic mean: in E6, 1.23 is nearer to 1.5 than to 1.0, since
     * 1.5/1.23 &lt; 1.23/1.0. A value exactly at the geometric mean goes to hi.
     *
     * @param x a positive value, in any unit, from {@link #SMALLEST_ARGUMENT} to {@link #LARGEST_ARGUMENT}
     * @throws IllegalArgumentException if {@code x} is not positive, NaN or out of range
     */
    public double nearest(double x) {
        double lo = nextLower(x);
        double hi = nextHigher(x);
        return x / lo < hi / x ? lo : hi;
    }

    /**
     * Whether {@code x} is a standard value of this series, within
     * {@link #CONTAINS_RELATIVE_TOLERANCE} of it.
     *
     * @param x a positive value, in any unit, from {@link #SMALLEST_ARGUMENT} to {@link #LARGEST_ARGUMENT}
     * @throws IllegalArgumentException if {@code x} is not positive, NaN or out of range
     */
    public boolean contains(double x) {
        double n = nearest(x);
        return Math.abs(n - x) <= CONTAINS_RELATIVE_TOLERANCE * x;
    }

    /**
     * Every standard value v with {@code min} ≤ v ≤ {@code max}, ascending; empty if there is none.
     * The list is bounded by the range: at most {@link #valuesPerDecade()} values per decade.
     *
     * @param min the lower end, positive, from {@link #SMALLEST_ARGUMENT}
     * @param max the upper end, ≥ {@code min}, up to {@link #LARGEST_ARGUMENT}
     * @throws IllegalArgumentException if either end is out of range or {@code min > max}
     */
    public List<Double> values(double min, double max) {
        checked(min, "min");
        checked(max, "max");
        if (min > max) {
            throw new IllegalArgumentException("min " + min + " is above max " + max);
        }
        List<Double> result = new ArrayList<>();
        int lastDecade = decadeOf(max);
        for (int decade = decadeOf(min); decade <= lastDecade; decade++) {
            for (int h : hundredths) {
                double v = scaled(h, decade - 2);
                if (v >= min && v <= max) {
                    result.add(v);
                }
            }
        }
        return List.copyOf(result);
    }

    /** The mantissa hundredths, for tests of the tables. */
    int[] hundredths() {
        return Arrays.copyOf(hundredths, hundredths.length);
    }

    /** The decade d with 10^d ≤ x &lt; 10^(d+1), comparing against the doubles nearest to 10^d. */
    private static int decadeOf(double x) {
        int decade = (int) Math.floor(Math.log10(x));
        if (x < scaled(1, decade)) {
            decade--;
        } else if (x >= scaled(1, decade + 1)) {
            decade++;
        }
        return decade;
    }

    /** The double nearest to {@code mantissa × 10^power10} (one correctly rounded operation). */
    private static double scaled(int mantissa, int power10) {
        if (power10 >= 0 && power10 < EXACT_POWERS_OF_TEN.length) {
            return mantissa * EXACT_POWERS_OF_TEN[power10];
        }
        if (power10 < 0 && -power10 < EXACT_POWERS_OF_TEN.length) {
            return mantissa / EXACT_POWERS_OF_TEN[-power10];
        }
        return new BigDecimal(BigInteger.valueOf(mantissa), -power10).doubleValue();
    }

    private static double checked(double x, String name) {
        if (Double.isNaN(x)) {
            throw new IllegalArgumentException(name + " is NaN; expected a positive value");
        }
        if (x <= 0.0) {
            throw new IllegalArgumentException(name + " must be positive, got " + x);
        }
        if (x < SMALLEST_ARGUMENT || x > LARGEST_ARGUMENT) {
            throw new IllegalArgumentException(name + " = " + x + " is outside the supported range "
                    + SMALLEST_ARGUMENT + " to " + LARGEST_ARGUMENT);
        }
        return x;
    }
}
