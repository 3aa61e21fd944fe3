package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.CurrentSource;
import halfrail.circuit.Element;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The adjoint transimpedance (one solve with the transposed matrix) against the direct one: the
 * same circuit with a current source between the two nodes, whose response at the output is
 * the transfer by definition.
 */
class AcTransimpedanceTest {
    /** A non-inverting stage of gain 11 with an RC at its input: eight unknowns, the dense path, and not reciprocal. */
    static Circuit smallStage() {
        halfrail.circuit.OpAmpParams part = halfrail.circuit.OpAmpParams.defaults().withSwing(0.5, 0.5)
                .withCommonMode(0, 0).withOutputOhms(100);
        return Circuit.builder().nodes("vcc", "in", "inp", "inn", "out")
                .add(new halfrail.circuit.VoltageSource("VCC", "vcc", "0", 9))
                .add(new halfrail.circuit.VoltageSource("VIN", "in", "0", 4.5, 1, 0, 0))
                .resistor("R", "in", "inp", 10e3)
                .capacitor("C", "inp", "0", 10e-9)
                .resistor("R2", "out", "inn", 100e3)
                .resistor("R1", "inn", "0", 10e3)
                .resistor("RL", "out", "0", 2e3)
                .opAmp("U1", "inp", "inn", "vcc", "0", "out", part)
                .build();
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"small stage", "1 stages", "4 stages"})
    @DisplayName("a current injected between any two nodes gives the output the same complex voltage as a current "
            + "source placed there (dense below 12 unknowns, sparse above)")
    void adjointEqualsTheDirectSource(String which) {
        Circuit base = which.equals("small stage") ? smallStage() : OpAmpChains.chain(which.charAt(0) - '0');
        List<String> nodes = base.nodes();
        String out = which.equals("small stage") ? "out" : nodes.get(nodes.size() - 1);
        AcAnalysis adjoint = AcAnalysis.of(base);
        for (String into : nodes) {
            String outOf = nodes.get((nodes.indexOf(into) * 7 + 3) % nodes.size());
            if (outOf.equals(into)) {
                continue;
            }
            // the direct way: a zero-valued current source from outOf to into (it injects into `into`)
            Circuit.Builder b = base.toBuilder();
            b.add(new CurrentSource("IPROBE", outOf, into, 0));
            AcAnalysis direct = AcAnalysis.of(b.build());
            for (double hz : new double[] {0.3, 20, 1e3, 50e3}) {
                AcTransfer d = direct.response("IPROBE", out, hz);
                AcTransfer a = adjoint.transimpedance(into, outOf, out, hz);
                double scale = Math.max(1e-12, d.magnitude());
                assertEquals(d.re(), a.re(), 1e-9 * scale, into + "→" + outOf + " at " + hz + " Hz, re");
                assertEquals(d.im(), a.im(), 1e-9 * scale, into + "→" + outOf + " at " + hz + " Hz, im");
            }
        }
        // ground as either end, and the output itself
        AcTransfer self = adjoint.transimpedance(out, Circuit.GROUND, out, 1e3);
        AcTransfer reversed = adjoint.transimpedance(Circuit.GROUND, out, out, 1e3);
        assertEquals(-self.re(), reversed.re(), 0.0);
        assertEquals(-self.im(), reversed.im(), 0.0);
    }
}
