package halfrail.solve;

/**
 * Small changes around a DC operating point: the DC equations linearised at the solution
 * (G·δx = b), factored once. Gives how every unknown responds to a current injected between two
 * nodes or to a change of a source — from which the checks read incremental gains (for example
 * from the reference to a stage output) and the resistance a capacitor sees.
 *
 * <p>Not thread-safe; one instance per operating point.
 */
public final class DcSensitivity {
    private final MnaSystem system;
    private final double[][] g;
    private final LinearSolver lu;

    /** Linearise at {@code op}. @throws AnalysisException SINGULAR when the linearised system is singular */
    public DcSensitivity(OperatingPoint op) {
        this(op, true);
    }

    private DcSensitivity(OperatingPoint op, boolean limit) {
        this.system = op.system();
        int n = system.size();
        double[] f = new double[n];
        this.g = new double[n][n];
        this.lu = LinearSolvers.forSize(n);
        system.evaluate(op.solution(), 0, Mode.DC, 1, 0, limit, f, g, null, null);
        lu.factor(g, n);
    }

    /**
     * Linearise at {@code op} with every op-amp treated as linear, whether or not it sits on a
     * limit: the gains the circuit would apply if no output were clipped. This is how a stage
     * that amplifies its own bias is recognised even when that bias has driven it into a rail.
     */
    public static DcSensitivity ignoringLimits(OperatingPoint op) {
        return new DcSensitivity(op, false);
    }

    /**
     * Response of every unknown to a unit current (1 A) pushed into node {@code into} and drawn
     * out of node {@code outOf} (either may be ground): V per A for node voltages.
     */
    public double[] currentInjection(String into, String outOf) {
        double[] b = new double[system.size()];
        int a = system.nodeIndex(into);
        int c = system.nodeIndex(outOf);
        // f holds currents leaving a node; an injected current enters with the opposite sign.
        if (a >= 0) {
            b[a] += 1;
        }
        if (c >= 0) {
            b[c] -= 1;
        }
        lu.solve(b);
        return b;
    }

    /** Response of every unknown to a unit change of source {@code name} (1 V or 1 A). */
    public double[] sourceChange(String name) {
        double[] b = system.sourceDirection(name);
        lu.solve(b);
        return b;
    }

    /**
     * The small-signal DC resistance between two nodes with every independent source held, Ω:
     * the voltage across them per ampere injected. Op-amps act at their operating point (a
     * saturated op-amp has no gain).
     */
    public double resistanceBetween(String a, String b) {
        double[] dx = currentInjection(a, b);
        return system.voltage(dx, a) - system.voltage(dx, b);
    }

    /**
     * How much node {@code out} moves per volt that node {@code driven} is moved by a current
     * injected there (dV(out)/dV(driven)), V/V.
     */
    public double gainFromNode(String driven, String out) {
        double[] dx = currentInjection(driven, halfrail.circuit.Circuit.GROUND);
        double dv = system.voltage(dx, driven);
        if (dv == 0) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST,
                    "node " + driven + " is held by a source; its voltage cannot be moved by a current");
        }
        return system.voltage(dx, out) / dv;
    }
}
