package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.CurrentSource;
import halfrail.circuit.VoltageSource;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/**
 * The impedance a capacitor sees with itself taken out ({@link AcAnalysis#impedanceWithout}),
 * against closed forms of the networks, and the peak-only and one-corner searches against the
 * full passband search.
 */
class AcImpedanceWithoutTest {
    private static final double R = 10e3;
    private static final double C = 100e-9;

    private static Circuit coupledIntoRc() {
        // VIN (held: an AC short) – C1 – node a – R1 ∥ C2 to ground.
        return Circuit.builder().implicitNodes()
                .add(new VoltageSource("VIN", "in", "0", 0, 1, 0, 0))
                .capacitor("C1", "in", "a", C)
                .resistor("R1", "a", "0", R)
                .capacitor("C2", "a", "0", 2 * C)
                .build();
    }

    @Test
    void theCouplingCapacitorSeesTheResistorInParallelWithTheOtherCapacitor() {
        // Closed form: with C1 out and VIN held at 0, the terminals see R1 ∥ 1/(jωC2):
        // Z = R/(1 + jωRC2), |Z| = R/√(1 + (ωRC2)²).
        AcAnalysis ac = AcAnalysis.of(coupledIntoRc());
        for (double hz : new double[] {1, 79.577, 1e3, 1e5}) {
            double w = 2 * Math.PI * hz;
            double expected = R / Math.sqrt(1 + Math.pow(w * R * 2 * C, 2));
            assertEquals(expected, ac.impedanceWithout("C1", hz).magnitude(), 1e-9 * expected, hz + " Hz");
        }
    }

    @Test
    void itAgreesWithACircuitWhereTheCapacitorIsReplacedByAProbeSource() {
        // The same impedance from a circuit built without C1, driven by a probe current source that
        // pushes its current from node a into node in (into C1's plus terminal).
        Circuit probe = coupledIntoRc().replace("C1", e -> new CurrentSource("IP", "a", "in", 0));
        AcAnalysis direct = AcAnalysis.of(probe);
        AcAnalysis ac = AcAnalysis.of(coupledIntoRc());
        AcTransfer a = ac.impedanceWithout("C1", 300);
        AcTransfer b = direct.response("IP", "in", "a", 300);
        assertEquals(b.magnitude(), a.magnitude(), 1e-12 * b.magnitude());
        assertEquals(b.phaseDegrees(), a.phaseDegrees(), 1e-9);
    }

    @Test
    void largerCircuitsOnTheSparseSolverGiveTheSameAsTheDenseOne() {
        OperatingPoint op = DcSolver.operatingPoint(OpAmpChains.chain(3));
        AcAnalysis sparse = AcAnalysis.sparse(op);
        AcAnalysis dense = new AcAnalysis(op, new DenseComplexLu());
        for (String cap : new String[] {"CREF", "CIN2", "CLEG3", "COUT"}) {
            double a = sparse.impedanceWithout(cap, 500).magnitude();
            double b = dense.impedanceWithout(cap, 500).magnitude();
            assertEquals(b, a, 1e-9 * b, cap);
        }
        // The analysis still answers ordinary responses correctly afterwards.
        assertEquals(dense.response("VSIG", "load", 500).magnitude(), sparse.response("VSIG", "load", 500).magnitude(),
                1e-9 * dense.response("VSIG", "load", 500).magnitude());
    }

    @Test
    void thePeakOnlySearchFindsThePassbandSearchesPeak() {
        OperatingPoint op = DcSolver.operatingPoint(OpAmpChains.chain(2));
        AcAnalysis ac = new AcAnalysis(op);
        assertEquals(ac.passband("VSIG", "s2out", 20, 20e3).peakMagnitude(), ac.peakMagnitude("VSIG", "s2out", 20, 20e3));
        assertEquals(ac.passband("VSIG", "s2p", "s1out", 20, 20e3).peakMagnitude(),
                ac.peakMagnitude("VSIG", "s2p", "s1out", 20, 20e3));
    }

    @Test
    void oneCornerSearchesFindThePassbandSearchesCorners() {
        OperatingPoint op = DcSolver.operatingPoint(OpAmpChains.chain(2));
        AcPassband band = new AcAnalysis(op).passband("VSIG", "load", 0.1, 1e6);
        double lower = new AcAnalysis(op).lowerCornerHz("VSIG", "load", 0.1, 1e6).orElseThrow();
        double upper = new AcAnalysis(op).upperCornerHz("VSIG", "load", 0.1, 1e6).orElseThrow();
        assertEquals(band.lowerCornerHz().orElseThrow(), lower, 1e-12 * lower);
        assertEquals(band.upperCornerHz().orElseThrow(), upper, 1e-12 * upper);
    }

    @Test
    void aNameThatIsNotACapacitorIsABadRequest() {
        AcAnalysis ac = AcAnalysis.of(coupledIntoRc());
        assertEquals(AnalysisException.Kind.BAD_REQUEST,
                assertThrows(AnalysisException.class, () -> ac.impedanceWithout("R1", 100)).kind());
        assertEquals(AnalysisException.Kind.BAD_REQUEST,
                assertThrows(AnalysisException.class, () -> ac.impedanceWithout("C1", Double.NaN)).kind());
    }
}
