package halfrail.solve;

/**
 * The two-step backward differentiation formula for variable steps. With the step ratio
 * ρ = h_n / h_{n−1}:
 * <pre>
 *   dq/dt ≈ ( (1+2ρ)/(1+ρ)·q_{n+1} − (1+ρ)·q_n + ρ²/(1+ρ)·q_{n−1} ) / h_n
 * </pre>
 * (3/2, −2, 1/2 at equal steps). Second order and A-stable at constant step; zero-stable for
 * step ratios below 1 + √2, so the loop caps the growth per step below that. Error factor
 * |E| = h_n³·(1+ρ)²/(ρ·(1+2ρ)), which is 4/3·h³ at equal steps, the classical constant 2/9·h³·x'''.
 */
final class Bdf2 implements IntegrationMethod {
    static final Bdf2 INSTANCE = new Bdf2();

    private Bdf2() {}

    @Override
    public int order() {
        return 2;
    }

    @Override
    public int pastPoints() {
        return 2;
    }

    @Override
    public void coefficients(double[] steps, double[] alpha) {
        double rho = steps[0] / steps[1];
        alpha[0] = (1 + 2 * rho) / (1 + rho);
        alpha[1] = -(1 + rho);
        alpha[2] = rho * rho / (1 + rho);
    }

    @Override
    public double errorFactor(double[] steps) {
        double h = steps[0];
        double rho = h / steps[1];
        return h * h * h * (1 + rho) * (1 + rho) / (rho * (1 + 2 * rho));
    }

    @Override
    public String name() {
        return "BDF2";
    }
}
