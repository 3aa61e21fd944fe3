package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.VoltageSource;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * AC analysis of larger circuits on the sparse complex solver: against a closed form, against
 * the dense solver on the same linearisation, and the reuse of one pivot order over a sweep.
 */
class AcSparseSolveTest {
    private static final double R = 10e3;
    private static final double C = 100e-9;
    private static final double FC = 1 / (2 * Math.PI * R * C);

    /** {@code sections} RC high-pass sections, each followed by a fast follower; 10 V supply, 5 V reference. */
    private static Circuit bufferedHighPassChain(int sections) {
        OpAmpParams fast = OpAmpParams.defaults().withOpenLoopGain(1e6).withGainBandwidth(1e9);
        Circuit.Builder b = Circuit.builder().implicitNodes()
                .voltageSource("VCC", "vcc", "0", 10)
                .voltageSource("VREF", "ref", "0", 5)
                .add(new VoltageSource("VIN", "in", "ref", 0, 1, 0, 0));
        String prev = "in";
        for (int k = 1; k <= sections; k++) {
            b.capacitor("C" + k, prev, "a" + k, C).resistor("R" + k, "a" + k, "ref", R)
                    .opAmp("U" + k, "a" + k, "b" + k, "vcc", "0", "b" + k, fast);
            prev = "b" + k;
        }
        return b.build();
    }

    @Test
    void fiveBufferedHighPassSectionsAreFifteenDecibelsDownAtTheirCommonCorner() {
        // Each section gives |H| = 1/√2 at 1/(2πRC) and the followers isolate them, so five give
        // (1/√2)⁵ = −15.05 dB and +450° of lead (exact; Horowitz & Hill, The Art of Electronics,
        // 3rd ed., ch. 1, for the single section).
        OperatingPoint op = DcSolver.operatingPoint(bufferedHighPassChain(5));
        AcAnalysis ac = new AcAnalysis(op);
        assertTrue(ac.usesSparse(), "a system of " + op.system().size() + " unknowns is solved sparse");
        AcTransfer h = ac.response(null, "b5", FC);
        assertEquals(5 * 20 * Math.log10(1 / Math.sqrt(2)), h.decibels(), 1e-4);
    }

    @Test
    void sparseAndDenseSolversGiveTheSameSweepPassbandAndCorners() {
        for (int stages : new int[] {2, 6}) {
            OperatingPoint op = DcSolver.operatingPoint(OpAmpChains.chain(stages));
            AcAnalysis sparse = AcAnalysis.sparse(op);
            AcAnalysis dense = new AcAnalysis(op, new DenseComplexLu());
            String out = "s" + stages + "out";
            AcSweep a = sparse.sweep("VSIG", out, 0.1, 1e6, 120);
            AcSweep b = dense.sweep("VSIG", out, 0.1, 1e6, 120);
            for (int k = 0; k < a.size(); k++) {
                double ma = a.magnitudeDb()[k];
                double mb = b.magnitudeDb()[k];
                assertEquals(mb, ma, 1e-9 * Math.max(1, Math.abs(mb)), stages + " stages, point " + k);
                assertEquals(b.phaseDegrees()[k], a.phaseDegrees()[k], 1e-7, stages + " stages, point " + k);
            }
            AcPassband pa = sparse.passband("VSIG", "load", 0.1, 1e6);
            AcPassband pb = dense.passband("VSIG", "load", 0.1, 1e6);
            assertEquals(pb.peakMagnitude(), pa.peakMagnitude(), 1e-9 * pb.peakMagnitude());
            assertEquals(pb.lowerCornerHz().orElseThrow(), pa.lowerCornerHz().orElseThrow(),
                    1e-7 * pb.lowerCornerHz().orElseThrow());
            assertEquals(pb.upperCornerHz().orElseThrow(), pa.upperCornerHz().orElseThrow(),
                    1e-7 * pb.upperCornerHz().orElseThrow());
            // The kept pivot order serves most frequencies; pivots are searched for again only where
            // the balance between conductances and susceptances has moved far (a few times a sweep).
            assertTrue(sparse.pivotSearches() * 10 <= sparse.solves(),
                    stages + " stages: " + sparse.pivotSearches() + " pivot searches in " + sparse.solves() + " solves");
        }
    }

    @Test
    void aFrequencyAskedForAgainIsNotSolvedAgain() {
        OperatingPoint op = DcSolver.operatingPoint(OpAmpChains.chain(3));
        AcAnalysis ac = new AcAnalysis(op);
        AcTransfer first = ac.response("VSIG", "s1out", 1e3);
        int solves = ac.solves();
        AcTransfer again = ac.response("VSIG", "s3out", 1e3);
        AcTransfer same = ac.response("VSIG", "s1out", 1e3);
        assertEquals(solves, ac.solves());
        assertEquals(first.re(), same.re());
        assertEquals(first.im(), same.im());
        // The other output at the same frequency agrees with a fresh analysis.
        AcTransfer fresh = new AcAnalysis(op).response("VSIG", "s3out", 1e3);
        assertEquals(fresh.re(), again.re());
        assertEquals(fresh.im(), again.im());
        // Another input at the frequency last factored is another right-hand side on the same factors.
        AcTransfer supply = ac.response("VSUP", "s3out", 1e3);
        assertEquals(solves, ac.solves());
        AcTransfer freshSupply = new AcAnalysis(op).response("VSUP", "s3out", 1e3);
        assertEquals(freshSupply.re(), supply.re());
        assertEquals(freshSupply.im(), supply.im());
        ac.response("VSUP", "s3out", 2e3);
        assertEquals(solves + 1, ac.solves());
    }
}
