package halfrail.solve;

import net.jqwik.api.ForAll;
import net.jqwik.api.Label;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.Scale;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The backward-difference formulas: exact on polynomials up to their order, classical
 * constant-step coefficients, and error factors equal to the Taylor-series remainder
 * (Hairer &amp; Wanner, Solving ODEs II, §III.1 and §III.5 — from memory; Gear, Numerical Initial
 * Value Problems in ODEs, 1971 — from memory).
 */
class IntegrationMethodTest {
    private static final IntegrationMethod[] METHODS = {BackwardEuler.INSTANCE, Bdf2.INSTANCE};

    @Test
    @DisplayName("BDF2 at equal steps is (3/2·q_{n+1} − 2·q_n + 1/2·q_{n−1}) / h (Gear 1971)")
    void bdf2AtEqualStepsHasTheClassicalCoefficients() {
        double[] alpha = new double[3];
        Bdf2.INSTANCE.coefficients(new double[] {0.1, 0.1}, alpha);
        assertArrayEquals(new double[] {1.5, -2, 0.5}, alpha, 1e-15);
        // local error 2/9·h³·x''' = E · x'''/3!, so E = 4/3·h³
        assertEquals(4.0 / 3 * 1e-3, Bdf2.INSTANCE.errorFactor(new double[] {0.1, 0.1}), 1e-18);
    }

    @Test
    @DisplayName("backward Euler's local error is h²/2·x'' = h²·(x''/2!)")
    void backwardEulerErrorFactorIsHSquared() {
        assertEquals(0.25, BackwardEuler.INSTANCE.errorFactor(new double[] {0.5}), 0);
    }

    @Property(seed = "74710211256964")
    @Label("each formula differentiates polynomials up to its order exactly, for any step ratio up to 2.4")
    void formulasAreExactOnPolynomialsUpToTheirOrder(@ForAll @DoubleRange(min = 1e-6, max = 1) @Scale(9) double h,
                                                     @ForAll @DoubleRange(min = 0.1, max = 2.4) double ratio,
                                                     @ForAll @DoubleRange(min = -3, max = 3) double a,
                                                     @ForAll @DoubleRange(min = -3, max = 3) double b,
                                                     @ForAll @DoubleRange(min = -3, max = 3) double c) {
        for (IntegrationMethod m : METHODS) {
            double[] steps = {h, h / ratio};
            double[] alpha = new double[3];
            m.coefficients(steps, alpha);
            double[] times = {0, -steps[0], -steps[0] - steps[1]};
            // p(t) = a + b·t + c·t², truncated to the method's order
            double cc = m.order() >= 2 ? c : 0;
            double sum = 0;
            for (int i = 0; i <= m.pastPoints(); i++) {
                double t = times[i];
                sum += alpha[i] * (a + b * t + cc * t * t);
            }
            double derivative = sum / h;
            // rounding of the sum, divided by h
            assertEquals(b, derivative, 1e-13 * (Math.abs(a) + Math.abs(b) + Math.abs(cc) + 1) / h,
                    m.name() + " derivative at t = 0");
        }
    }

    @Property(seed = "201872345481677")
    @Label("each error factor equals Σ αi·s_i^(p+1) / α0 from the Taylor expansion about the new point")
    void errorFactorsMatchTheTaylorRemainder(@ForAll @DoubleRange(min = 1e-6, max = 1) @Scale(9) double h,
                                             @ForAll @DoubleRange(min = 0.1, max = 2.4) double ratio) {
        for (IntegrationMethod m : METHODS) {
            double[] steps = {h, h / ratio};
            double[] alpha = new double[3];
            m.coefficients(steps, alpha);
            double[] s = {0, -steps[0], -steps[0] - steps[1]};
            int p = m.order();
            double sum = 0;
            for (int i = 0; i <= m.pastPoints(); i++) {
                sum += alpha[i] * Math.pow(s[i], p + 1);
            }
            double taylor = Math.abs(sum / alpha[0]);
            assertEquals(taylor, m.errorFactor(steps), 1e-12 * taylor, m.name());
        }
    }
}
