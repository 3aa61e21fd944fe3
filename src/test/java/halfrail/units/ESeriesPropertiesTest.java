package halfrail.units;

import net.jqwik.api.ForAll;
import net.jqwik.api.Label;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Properties of the look-ups over random values spread evenly across many decades. Membership
 * is checked against an independent construction: the table mantissa times a power of ten,
 * converted through {@link BigDecimal}.
 */
class ESeriesPropertiesTest {

    /** Every standard value of the decades around {@code x}, built independently of the look-ups. */
    private static List<Double> membersNear(ESeries series, double x) {
        int decade = (int) Math.floor(Math.log10(x));
        List<Double> result = new ArrayList<>();
        for (int d = decade - 2; d <= decade + 2; d++) {
            for (int h : series.hundredths()) {
                result.add(BigDecimal.valueOf(h).scaleByPowerOfTen(d - 2).doubleValue());
            }
        }
        return result;
    }

    private static boolean isMember(ESeries series, double v) {
        return membersNear(series, v).contains(v);
    }

    @Property(seed = "19548893879024")
    @Label("nextLower(x) ≤ x ≤ nextHigher(x), both members, and no member lies strictly between")
    void nextLowerAndHigherBracketX(@ForAll ESeries series, @ForAll @DoubleRange(min = -20, max = 20) double exponent) {
        double x = Math.pow(10, exponent);
        double lo = series.nextLower(x);
        double hi = series.nextHigher(x);
        assertTrue(lo <= x && x <= hi, () -> lo + " ≤ " + x + " ≤ " + hi);
        assertTrue(isMember(series, lo), () -> "nextLower " + lo + " is not in " + series);
        assertTrue(isMember(series, hi), () -> "nextHigher " + hi + " is not in " + series);
        for (double m : membersNear(series, x)) {
            assertTrue(!(m > lo && m < hi), () -> m + " lies between " + lo + " and " + hi);
        }
    }

    @Property(seed = "80787800424829")
    @Label("nearest(x) is a member and no member is closer by ratio")
    void nearestIsAMemberAndNoneIsCloser(@ForAll ESeries series, @ForAll @DoubleRange(min = -20, max = 20) double exponent) {
        double x = Math.pow(10, exponent);
        double n = series.nearest(x);
        assertTrue(isMember(series, n), () -> n + " is not in " + series);
        double distance = Math.abs(Math.log(n / x));
        for (double m : membersNear(series, x)) {
            assertTrue(Math.abs(Math.log(m / x)) >= distance - 1e-12, () -> m + " is closer to " + x + " than " + n);
        }
        assertTrue(series.contains(n));
    }

    @Property(seed = "248991386137290")
    @Label("values(min, max) lists exactly the members in the range, ascending")
    void valuesListsTheMembersInTheRange(@ForAll ESeries series, @ForAll @DoubleRange(min = -20, max = 20) double exponent,
                                         @ForAll @DoubleRange(min = 0, max = 2.5) double spanDecades) {
        double min = Math.pow(10, exponent);
        double max = min * Math.pow(10, spanDecades);
        List<Double> expected = new ArrayList<>();
        for (double m : membersNear(series, min)) {
            if (m >= min && m <= max) {
                expected.add(m);
            }
        }
        for (double m : membersNear(series, min * 1e5)) {
            if (m >= min && m <= max && !expected.contains(m)) {
                expected.add(m);
            }
        }
        expected.sort(Double::compare);
        assertEquals(expected, series.values(min, max));
    }
}
