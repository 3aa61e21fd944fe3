package halfrail.solve;

/**
 * Backward Euler, the one-step backward differentiation formula: dq/dt ≈ (q_{n+1} − q_n)/h.
 * First order, L-stable; the stepping loop uses it for the first step and after every
 * discontinuity of the sources, where no smooth history exists. Local error h²/2·x''.
 */
final class BackwardEuler implements IntegrationMethod {
    static final BackwardEuler INSTANCE = new BackwardEuler();

    private BackwardEuler() {}

    @Override
    public int order() {
        return 1;
    }

    @Override
    public int pastPoints() {
        return 1;
    }

    @Override
    public void coefficients(double[] steps, double[] alpha) {
        alpha[0] = 1;
        alpha[1] = -1;
    }

    @Override
    public double errorFactor(double[] steps) {
        double h = steps[0];
        return h * h;
    }

    @Override
    public String name() {
        return "backward Euler";
    }
}
