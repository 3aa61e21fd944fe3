package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Label;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Random cascades of inverting and non-inverting stages referenced to mid-rail, with random
 * gains (0.1 to 1000) and input offsets, so that random subsets of the stages saturate. The
 * solver must always converge (by any strategy) to a point that satisfies KCL with every output
 * inside its swing window; with a near-ideal amplifier the outputs must equal the ideal
 * closed-loop values clamped to the window (The Art of Electronics, 3rd ed., ch. 4: inverting
 * gain −Rf/Rin, non-inverting 1 + R2/R1).
 */
class OpAmpCascadePropertiesTest {
    private static final double VS = 9;
    private static final double MID = VS / 2;
    private static final double HEADROOM = TestAmps.BIPOLAR_HEADROOM;
    /** Outputs closer than this to a limit are not compared with the ideal value (the limiter's knee is 10 mV). */
    private static final double KNEE_MARGIN = 0.05;

    record Stage(boolean inverting, double gain) {}

    record Cascade(List<Stage> stages, double inputOffset, double openLoopGain, double biasAmps) {
        Circuit circuit() {
            OpAmpParams p = TestAmps.bipolarSwing().withOpenLoopGain(openLoopGain).withInputErrors(0, biasAmps, 0);
            // a stiff mid-rail reference (a buffered divider, here an ideal source) so that stage
            // resistors returned to it do not load it
            Circuit.Builder b = Circuit.builder().nodes("vcc", "mid", "o0")
                    .voltageSource("VBAT", "vcc", "0", VS)
                    .voltageSource("VMID", "mid", "0", MID)
                    .voltageSource("VIN", "o0", "0", MID + inputOffset);
            for (int k = 1; k <= stages.size(); k++) {
                Stage s = stages.get(k - 1);
                String prev = "o" + (k - 1);
                String m = "m" + k;
                String o = "o" + k;
                b.nodes(m, o);
                if (s.inverting) {
                    b.resistor("RIN" + k, prev, m, 10e3)
                            .resistor("RF" + k, o, m, 10e3 * s.gain)
                            .opAmp("U" + k, "mid", m, "vcc", "0", o, p);
                } else {
                    // gain 1 + R2/R1 with R1 = 10 kΩ to mid-rail
                    b.resistor("R1" + k, m, "mid", 10e3)
                            .resistor("R2" + k, o, m, 10e3 * s.gain)
                            .opAmp("U" + k, prev, m, "vcc", "0", o, p);
                }
            }
            return b.build();
        }
    }

    @Provide
    Arbitrary<Cascade> cascades() {
        Arbitrary<Double> logGain = Arbitraries.doubles().between(-1, 3).map(e -> Math.pow(10, e));
        Arbitrary<Stage> stage = Combinators.combine(Arbitraries.of(true, false), logGain).as(Stage::new);
        return Combinators.combine(
                stage.list().ofMinSize(1).ofMaxSize(8),
                Arbitraries.doubles().between(-1, 1),
                Arbitraries.of(1e4, 1e5, 1e6, 1e8),
                Arbitraries.of(0.0, 1e-9, 100e-9, 1e-6)).as(Cascade::new);
    }

    @Property(tries = 400, seed = "270225334869439")
    @Label("random saturating cascades converge, satisfy KCL and keep every output in its window")
    void randomCascadesConverge(@ForAll("cascades") Cascade cascade) {
        Circuit c = cascade.circuit();
        OperatingPoint op = DcSolver.operatingPoint(c);
        KclCheck.assertHolds(c, op);
        for (OpAmpState s : op.opAmps()) {
            assertTrue(s.outputVolts() >= s.swingLowVolts() - 1e-9 && s.outputVolts() <= s.swingHighVolts() + 1e-9,
                    s.name() + " at " + s.outputVolts());
        }
    }

    @Property(tries = 400, seed = "207272986574899")
    @Label("with a near-ideal amplifier every stage sits at its ideal output clamped to the window")
    void nearIdealCascadesMatchTheClampedIdealOutputs(@ForAll("cascades") Cascade cascade) {
        Cascade ideal = new Cascade(cascade.stages(), cascade.inputOffset(), TestAmps.NEAR_IDEAL_GAIN, 0);
        OperatingPoint op = DcSolver.operatingPoint(ideal.circuit());
        double vin = MID + ideal.inputOffset();
        double lo = HEADROOM;
        double hi = VS - HEADROOM;
        for (int k = 1; k <= ideal.stages().size(); k++) {
            Stage s = ideal.stages().get(k - 1);
            double target = s.inverting() ? MID - s.gain() * (vin - MID) : MID + (1 + s.gain()) * (vin - MID);
            if (Math.abs(target - lo) < KNEE_MARGIN || Math.abs(target - hi) < KNEE_MARGIN) {
                return; // inside the knee the ideal value does not apply; later stages inherit that
            }
            double expected = Math.max(lo, Math.min(hi, target));
            assertEquals(expected, op.voltage("o" + k), 1e-5 * Math.max(1, s.gain()), "stage " + k);
            vin = op.voltage("o" + k);
        }
    }
}
