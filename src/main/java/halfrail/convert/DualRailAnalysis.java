package halfrail.convert;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.Resistor;
import halfrail.circuit.VoltageSource;
import halfrail.design.DesignCircuits;
import halfrail.design.SignalSource;
import halfrail.solve.AcAnalysis;
import halfrail.solve.AcPassband;
import halfrail.solve.DcSolver;
import halfrail.solve.MnaSystem;
import halfrail.solve.OpAmpState;
import halfrail.solve.OperatingPoint;
import halfrail.solve.PowerOnOptions;
import halfrail.solve.PowerOnResult;
import halfrail.solve.PowerOnTransient;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;

/**
 * The dual-rail original as the engine sees it: a circuit with a positive and a negative supply
 * source, DC-coupled stages referred to ground, the signal source and the load, solved for its
 * operating point, its response and its power-on transient.
 *
 * <p>Names: supplies {@code VPOS} (node {@code vp}) and {@code VNEG} (node {@code vn}); the
 * signal source {@code VSIG} on node {@code src}; stage i (from 1) has {@code Ui}, {@code R1_i},
 * {@code R2_i} and nodes {@code si.n}, {@code si.out}; the load {@code RL} (and {@code CL}).
 */
public final class DualRailAnalysis {
    /** Positive supply element name. */
    public static final String POSITIVE = "VPOS";
    /** Negative supply element name. */
    public static final String NEGATIVE = "VNEG";
    /** Signal source element name. */
    public static final String SIGNAL = "VSIG";
    /** The original's power-on run lasts this long, s: a DC-coupled chain settles within the supply's ramp and a few op-amp time constants. */
    public static final double POWER_ON_RUN_SECONDS = 0.05;
    /** Supply ramp of the original at switch-on, s (the same default the design model uses). */
    public static final double POWER_ON_RAMP_SECONDS = 1e-3;
    /** Settle band of the original, as a fraction of its total supply (the design model's default 1 %). */
    public static final double SETTLE_BAND_FRACTION = 0.01;

    private DualRailAnalysis() {}

    /**
     * The original's circuit. Its last stage's output is node {@code s<n>.out}.
     *
     * @throws halfrail.design.DesignException for an unknown op-amp archetype
     */
    public static Circuit circuit(DualRailChain chain, SignalSource source, double loadOhms, double loadFarads) {
        Circuit.Builder b = Circuit.builder().implicitNodes().title("dual-rail original");
        b.add(new VoltageSource(POSITIVE, "vp", Circuit.GROUND, chain.positiveVolts(), 0, 0, POWER_ON_RAMP_SECONDS));
        b.add(new VoltageSource(NEGATIVE, Circuit.GROUND, "vn", chain.negativeVolts(), 0, 0, POWER_ON_RAMP_SECONDS));
        b.add(new VoltageSource(SIGNAL, "src", Circuit.GROUND, 0, 1, source.sourceOhms(), 0));
        String previous = "src";
        for (int i = 0; i < chain.stages().size(); i++) {
            DualRailStage s = chain.stages().get(i);
            int n = i + 1;
            String m = "s" + n + ".n";
            String out = "s" + n + ".out";
            OpAmpParams p = DesignCircuits.params(s.opAmp(), "original.stages[" + i + "].opAmp");
            String plus;
            switch (s.kind()) {
                case NON_INVERTING -> {
                    plus = previous;
                    b.add(new Resistor("R2_" + n, out, m, s.r2Ohms()));
                    b.add(new Resistor("R1_" + n, m, Circuit.GROUND, s.r1Ohms()));
                }
                case INVERTING -> {
                    plus = Circuit.GROUND;
                    b.add(new Resistor("R1_" + n, previous, m, s.r1Ohms()));
                    b.add(new Resistor("R2_" + n, out, m, s.r2Ohms()));
                }
                case FOLLOWER -> {
                    plus = previous;
                    m = out;
                }
                default -> throw new IllegalStateException("unhandled stage kind " + s.kind());
            }
            b.opAmp("U" + n, plus, m, "vp", "vn", out, p);
            previous = out;
        }
        b.add(new Resistor("RL", previous, Circuit.GROUND, loadOhms));
        if (loadFarads > 0) {
            b.add(new Capacitor("CL", previous, Circuit.GROUND, loadFarads));
        }
        return b.build();
    }

    /** The last stage's output node in {@link #circuit}. */
    public static String outputNode(DualRailChain chain) {
        return "s" + chain.stages().size() + ".out";
    }

    /**
     * Solve the original: its operating point, the chain's response over the band and below it,
     * and its power-on transient.
     */
    public static ChainFigures analyse(DualRailChain chain, SignalSource source, double loadOhms, double loadFarads) {
        Circuit c = circuit(chain, source, loadOhms, loadFarads);
        OperatingPoint op = new DcSolver(MnaSystem.of(c)).solve();
        AcAnalysis ac = new AcAnalysis(op);
        String out = outputNode(chain);
        double lo = source.bandLowHz();
        double hi = source.bandHighHz();
        AcPassband pb = ac.passband(SIGNAL, out, lo / 1000, hi * 1000);
        double peak = ac.passband(SIGNAL, out, lo, hi).peakMagnitude() * source.voltsPeak();
        OpAmpState last = op.opAmp("U" + chain.stages().size()).orElseThrow();
        List<SupplyPoint> points = new ArrayList<>();
        points.add(SupplyPoint.of("nominal", chain.totalVolts(), last.outputVolts(), last.swingLowVolts(),
                last.swingHighVolts(), peak));
        double gain = ac.response(SIGNAL, out, Math.sqrt(lo * hi)).magnitude();
        double positiveAmps = op.current(POSITIVE);
        double negativeAmps = op.current(NEGATIVE);
        List<String> watched = new ArrayList<>();
        for (int i = 1; i <= chain.stages().size(); i++) {
            watched.add("s" + i + ".out");
        }
        PowerOnOptions options = PowerOnOptions.of(POWER_ON_RUN_SECONDS)
                .withSettleBand(SETTLE_BAND_FRACTION * chain.totalVolts())
                .withWatchedNodes(watched.toArray(new String[0])).withLoadNodes(out);
        PowerOnResult r = PowerOnTransient.run(c, options);
        OptionalDouble settle = r.settleTimeSeconds().map(OptionalDouble::of).orElse(OptionalDouble.empty());
        return new ChainFigures("dual-rail original", points, gain, positiveAmps, negativeAmps, pb.lowerCornerHz(),
                settle);
    }
}
