package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.CurrentSource;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.VoltageSource;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.OptionalDouble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Small-signal responses of RC networks and single-supply op-amp stages, each against a
 * published value or a closed form worked out here from the network (the closed forms are
 * independent of the solver: no matrices, just the textbook transfer functions).
 */
class AcAnalysisTest {
    private static final double R = 10e3;
    private static final double C = 100e-9;
    /** 1/(2πRC) for R = 10 kΩ, C = 100 nF: about 159.15 Hz. */
    private static final double FC = 1 / (2 * Math.PI * R * C);
    /** 20·log10(1/√2), the exact −3 dB level. */
    private static final double MINUS_3_DB = 20 * Math.log10(1 / Math.sqrt(2));

    private static VoltageSource acInput(String name, String plus, String minus, double dcVolts) {
        return new VoltageSource(name, plus, minus, dcVolts, 1, 0, 0);
    }

    private static Circuit highPass() {
        return Circuit.builder().implicitNodes()
                .add(acInput("VIN", "in", "0", 0))
                .capacitor("C1", "in", "out", C)
                .resistor("R1", "out", "0", R)
                .build();
    }

    // ---- single RC high-pass ------------------------------------------------------------------

    @Test
    @DisplayName("RC high-pass at 1/(2πRC): −3.0103 dB and +45° (Horowitz & Hill, The Art of Electronics 3rd ed., ch. 1)")
    void highPassIsThreeDecibelsDownWithFortyFiveDegreesLeadAtItsCorner() {
        AcTransfer h = AcAnalysis.of(highPass()).response("VIN", "out", FC);
        assertEquals(-3.0103, h.decibels(), 1e-4);
        assertEquals(MINUS_3_DB, h.decibels(), 1e-9);
        assertEquals(45, h.phaseDegrees(), 1e-7);
    }

    @Test
    @DisplayName("RC high-pass one decade below its corner: 0.1/√1.01 → −20.04 dB (exact)")
    void highPassOneDecadeBelowItsCornerIsTwentyDecibelsDown() {
        AcTransfer h = AcAnalysis.of(highPass()).response(null, "out", FC / 10);
        assertEquals(-20.04, h.decibels(), 0.005);
        assertEquals(20 * Math.log10(0.1 / Math.sqrt(1.01)), h.decibels(), 1e-9);
    }

    @Test
    @DisplayName("RC high-pass lower corner found by root finding equals 1/(2πRC) to 1e-6 (The Art of Electronics, ch. 1)")
    void highPassLowerCornerIsOneOverTwoPiRc() {
        // Range to 10 MHz: the peak gain there is 1 − 1.3e-10 below the ideal 1, far inside 1e-6.
        AcPassband band = AcAnalysis.of(highPass()).passband(null, "out", 1, 10e6);
        assertEquals(FC, band.lowerCornerHz().orElseThrow(), 1e-6 * FC);
        assertTrue(band.upperCornerHz().isEmpty(), "a high-pass has no upper corner");
        assertEquals(0, band.peakDb(), 1e-6);
    }

    @Test
    @DisplayName("voltage across the high-pass capacitor is the complementary low-pass: −3.0103 dB, −45° at 1/(2πRC)")
    void differentialOutputAcrossTheCapacitorIsTheComplementaryLowPass() {
        AcTransfer h = AcAnalysis.of(highPass()).response("VIN", "in", "out", FC);
        assertEquals(MINUS_3_DB, h.decibels(), 1e-9);
        assertEquals(-45, h.phaseDegrees(), 1e-7);
    }

    @Test
    @DisplayName("current into R‖C: transfer impedance R/(1 + jωRC), R/√2 at 1/(2πRC) (exact)")
    void currentInputGivesTheTransferImpedance() {
        Circuit c = Circuit.builder().implicitNodes()
                .add(new CurrentSource("IIN", "0", "n", 1e-3))
                .resistor("R1", "n", "0", R)
                .capacitor("C1", "n", "0", C)
                .build();
        AcTransfer z = AcAnalysis.of(c).response("IIN", "n", FC);
        assertEquals(R / Math.sqrt(2), z.magnitude(), 1e-9 * R);
        assertEquals(-45, z.phaseDegrees(), 1e-7);
    }

    // ---- two poles ----------------------------------------------------------------------------

    /** RC high-pass, op-amp follower, RC high-pass; single 10 V supply with a stiff 5 V reference. */
    private static Circuit bufferedTwoPoleHighPass() {
        // A fast part (1 GHz GBW, gain 1e6) so that the follower's own roll-off is far away.
        OpAmpParams fast = OpAmpParams.defaults().withOpenLoopGain(1e6).withGainBandwidth(1e9);
        return Circuit.builder().implicitNodes()
                .voltageSource("VCC", "vcc", "0", 10)
                .voltageSource("VREF", "ref", "0", 5)
                .add(acInput("VIN", "in", "ref", 0))
                .capacitor("C1", "in", "a", C)
                .resistor("R1", "a", "ref", R)
                .opAmp("U1", "a", "b", "vcc", "0", "b", fast)
                .capacitor("C2", "b", "out", C)
                .resistor("R2", "out", "ref", R)
                .build();
    }

    @Test
    @DisplayName("two identical buffered high-pass poles: −6.02 dB at the single-pole corner (exact)")
    void twoBufferedPolesAreSixDecibelsDownAtTheSingleCorner() {
        AcTransfer h = AcAnalysis.of(bufferedTwoPoleHighPass()).response(null, "out", FC);
        assertEquals(-6.02, h.decibels(), 0.005);
        assertEquals(20 * Math.log10(0.5), h.decibels(), 1e-4);
        assertEquals(90, h.phaseDegrees(), 0.01);
    }

    @Test
    @DisplayName("two identical buffered high-pass poles: combined −3 dB point at f/0.6436 (exact: f/√(√2 − 1))")
    void twoBufferedPolesHaveTheirCombinedCornerAtFOver0_6436() {
        double corner = AcAnalysis.of(bufferedTwoPoleHighPass()).lowerCornerHz(null, "out", 1, 10e6).orElseThrow();
        assertEquals(FC / 0.6436, corner, 1e-4 * corner);
        // |H| = x²/(1 + x²) = 1/√2 with x = f/fc gives x² = 1/(√2 − 1).
        assertEquals(FC / Math.sqrt(Math.sqrt(2) - 1), corner, 1e-5 * corner);
    }

    @Test
    @DisplayName("two equal unbuffered RC low-pass sections: gain 1/3 (−9.54 dB), −90° at 1/(2πRC) (exact)")
    void twoUnbufferedLowPassSectionsGiveOneThirdAtTheCorner() {
        Circuit c = Circuit.builder().implicitNodes()
                .add(acInput("VIN", "in", "0", 0))
                .resistor("R1", "in", "a", R)
                .capacitor("C1", "a", "0", C)
                .resistor("R2", "a", "out", R)
                .capacitor("C2", "out", "0", C)
                .build();
        AcAnalysis ac = AcAnalysis.of(c);
        AcTransfer h = ac.response(null, "out", FC);
        assertEquals(-9.54, h.decibels(), 0.005);
        assertEquals(1.0 / 3, h.magnitude(), 1e-12);
        assertEquals(-90, h.phaseDegrees(), 1e-7);

        // H = 1/(1 − x² + 3jx): |H|² = 1/2 where x⁴ + 7x² − 1 = 0, x² = (√53 − 7)/2 (about 0.3742·fc).
        AcPassband band = ac.passband(null, "out", 1e-3, 1e6);
        double x = Math.sqrt((Math.sqrt(53) - 7) / 2);
        assertEquals(x * FC, band.upperCornerHz().orElseThrow(), 1e-6 * x * FC);
        assertTrue(band.lowerCornerHz().isEmpty(), "a DC-coupled chain has no lower corner");
    }

    // ---- op-amp stages on a single supply ------------------------------------------------------

    private static final double VCC = 9;

    /** The single-pole op-amp model A(jω) = A0/(1 + jω/ωp), ωp = 2π·GBW/A0. */
    private static Complex openLoop(OpAmpParams p, double hz) {
        return new Complex(p.openLoopGain()).divide(new Complex(1, hz / p.dominantPoleHz()));
    }

    /** Ideal-op-amp gain −Zf/Zi corrected for finite loop gain: −(Zf/Zi)/(1 + (1 + Zf/Zi)/A). */
    private static Complex inverting(Complex zfOverZi, Complex a) {
        return zfOverZi.negate().divide(Complex.ONE.add(Complex.ONE.add(zfOverZi).divide(a)));
    }

    /** Ideal gain 1 + Zf/Zi corrected for finite loop gain: (1 + Zf/Zi)/(1 + (1 + Zf/Zi)/A). */
    private static Complex nonInverting(Complex zfOverZi, Complex a) {
        Complex ideal = Complex.ONE.add(zfOverZi);
        return ideal.divide(Complex.ONE.add(ideal.divide(a)));
    }

    /** R1 in series with C, as an impedance at {@code hz}. */
    private static Complex seriesRc(double r, double c, double hz) {
        return new Complex(r, -1 / (2 * Math.PI * hz * c));
    }

    /**
     * Inverting stage on one 9 V rail: in+ on a decoupled 100 k/100 k mid-rail divider, the
     * input through a blocking capacitor and R1 into in−, R2 from the output.
     */
    private static Circuit invertingStage(OpAmpParams p, double r1, double r2, double cBlock) {
        return Circuit.builder().implicitNodes()
                .voltageSource("VCC", "vcc", "0", VCC)
                .resistor("RA", "vcc", "ref", 100e3)
                .resistor("RB", "ref", "0", 100e3)
                .capacitor("CREF", "ref", "0", 10e-6)
                .add(acInput("VIN", "in", "0", 0))
                .capacitor("CIN", "in", "x", cBlock)
                .resistor("R1", "x", "inm", r1)
                .resistor("R2", "out", "inm", r2)
                .opAmp("U1", "ref", "inm", "vcc", "0", "out", p)
                .build();
    }

    /**
     * Non-inverting stage on one 9 V rail: in+ at a decoupled mid-rail divider plus the signal,
     * R2 from the output to in−, and the feedback leg R1 in series with a blocking capacitor to
     * ground, so that the stage has gain 1 for its bias.
     */
    private static Circuit nonInvertingStage(OpAmpParams p, double r1, double r2, double cBlock) {
        return Circuit.builder().implicitNodes()
                .voltageSource("VCC", "vcc", "0", VCC)
                .resistor("RA", "vcc", "ref", 100e3)
                .resistor("RB", "ref", "0", 100e3)
                .capacitor("CREF", "ref", "0", 10e-6)
                .add(acInput("VIN", "inp", "ref", 0))
                .resistor("R2", "out", "inm", r2)
                .resistor("R1", "inm", "fb", r1)
                .capacitor("C1", "fb", "0", cBlock)
                .opAmp("U1", "inp", "inm", "vcc", "0", "out", p)
                .build();
    }

    @Test
    @DisplayName("inverting stage: midband gain −R2/R1 (any op-amp text, e.g. The Art of Electronics ch. 4)")
    void invertingStageHasGainMinusR2OverR1InMidband() {
        OpAmpParams p = OpAmpParams.defaults().withSwing(1.5, 1.5);
        double r1 = 10e3;
        double r2 = 100e3;
        double cBlock = 10e-6;
        AcAnalysis ac = AcAnalysis.of(invertingStage(p, r1, r2, cBlock));
        assertFalse(ac.operatingPoint().opAmp("U1").orElseThrow().saturated());
        double hz = 1e3;
        AcTransfer h = ac.response(null, "out", hz);
        assertEquals(r2 / r1, h.magnitude(), 2e-3 * r2 / r1);
        assertEquals(180, Math.abs(h.phaseDegrees()), 1);
        Complex expected = inverting(new Complex(r2).divide(seriesRc(r1, cBlock, hz)), openLoop(p, hz));
        assertEquals(expected.getReal(), h.re(), 1e-9 * expected.abs());
        assertEquals(expected.getImaginary(), h.im(), 1e-9 * expected.abs());
    }

    @Test
    @DisplayName("non-inverting stage: midband gain 1 + R2/R1 (any op-amp text, e.g. The Art of Electronics ch. 4)")
    void nonInvertingStageHasGainOnePlusR2OverR1InMidband() {
        OpAmpParams p = OpAmpParams.defaults().withSwing(1.5, 1.5);
        double r1 = 10e3;
        double r2 = 100e3;
        double cBlock = 10e-6;
        AcAnalysis ac = AcAnalysis.of(nonInvertingStage(p, r1, r2, cBlock));
        OpAmpState u1 = ac.operatingPoint().opAmp("U1").orElseThrow();
        assertFalse(u1.saturated());
        // The blocking capacitor gives the bias a gain of 1 (a follower's A0/(1 + A0)).
        assertEquals(VCC / 2 * p.openLoopGain() / (1 + p.openLoopGain()), u1.outputVolts(), 1e-7);
        double hz = 1e3;
        AcTransfer h = ac.response(null, "out", hz);
        assertEquals(1 + r2 / r1, h.magnitude(), 2e-3 * (1 + r2 / r1));
        assertEquals(0, h.phaseDegrees(), 1);
        Complex expected = nonInverting(new Complex(r2).divide(seriesRc(r1, cBlock, hz)), openLoop(p, hz));
        assertEquals(expected.getReal(), h.re(), 1e-9 * expected.abs());
        assertEquals(expected.getImaginary(), h.im(), 1e-9 * expected.abs());
    }

    @Test
    @DisplayName("non-inverting stage: feedback-leg capacitor sets the lower corner ≈ 1/(2π·R1·C) when R2 ≫ R1 (closed form of the network)")
    void feedbackLegCapacitorSetsTheLowerCorner() {
        // A near-ideal part (gain 1e8, GBW 10 GHz) so that its finite loop gain (error about G/A0)
        // and roll-off leave the response to the network alone.
        OpAmpParams p = OpAmpParams.defaults().withOpenLoopGain(1e8).withGainBandwidth(1e10).withSwing(1.5, 1.5);
        double r1 = 1e3;
        double r2 = 100e3;
        double cBlock = 10e-6;
        AcAnalysis ac = AcAnalysis.of(nonInvertingStage(p, r1, r2, cBlock));
        double corner = ac.lowerCornerHz(null, "out", 0.01, 1e6).orElseThrow();
        // H = (1 + jωC(R1 + R2))/(1 + jωCR1). With G = 1 + R2/R1, |H|² = G²/2 at
        // ω = √(G² − 2)/(C·(R1 + R2)).
        double g = 1 + r2 / r1;
        double exact = Math.sqrt(g * g - 2) / (2 * Math.PI * cBlock * (r1 + r2));
        assertEquals(exact, corner, 1e-5 * exact);
        double approx = 1 / (2 * Math.PI * r1 * cBlock);
        assertEquals(approx, corner, 0.01 * approx);
    }

    @Test
    @DisplayName("closed-loop upper −3 dB ≈ GBW / noise gain: 1 MHz at gain 10 → ~100 kHz (any op-amp text); exact for one pole: GBW/10 + GBW/A0")
    void closedLoopBandwidthIsGainBandwidthOverNoiseGain() {
        OpAmpParams p = OpAmpParams.defaults().withSwing(1.5, 1.5);
        // DC-coupled gain-10 stage around a stiff mid-rail reference.
        Circuit c = Circuit.builder().implicitNodes()
                .voltageSource("VCC", "vcc", "0", VCC)
                .voltageSource("VREF", "ref", "0", VCC / 2)
                .add(acInput("VIN", "inp", "ref", 0))
                .resistor("R2", "out", "inm", 9e3)
                .resistor("R1", "inm", "ref", 1e3)
                .opAmp("U1", "inp", "inm", "vcc", "0", "out", p)
                .build();
        AcPassband band = AcAnalysis.of(c).passband(null, "out", 1, 10e6);
        // Single pole: A/(1 + βA) = [A0/(1 + βA0)] / (1 + jf/(fp·(1 + βA0))), fp = GBW/A0, β = 1/10.
        double beta = 0.1;
        double exact = p.dominantPoleHz() * (1 + beta * p.openLoopGain());
        double upper = band.upperCornerHz().orElseThrow();
        assertEquals(exact, upper, 1e-6 * exact);
        assertEquals(100e3, upper, 0.01 * 100e3);
        assertTrue(band.lowerCornerHz().isEmpty(), "a DC-coupled stage has no lower corner");
        assertEquals(20 * Math.log10(p.openLoopGain() / (1 + beta * p.openLoopGain())), band.peakDb(), 1e-6);
    }

    @Test
    @DisplayName("a stage whose op-amp sits on a rail at DC has almost no gain (design brief: without the blocking capacitor the bias is multiplied by the gain)")
    void saturatedStageHasAlmostNoGain() {
        OpAmpParams p = OpAmpParams.defaults().withSwing(1.5, 1.5);
        // Feedback leg straight to ground: DC gain 11 on a 4.5 V bias wants 49.5 V.
        Circuit railed = Circuit.builder().implicitNodes()
                .voltageSource("VCC", "vcc", "0", VCC)
                .resistor("RA", "vcc", "ref", 100e3)
                .resistor("RB", "ref", "0", 100e3)
                .capacitor("CREF", "ref", "0", 10e-6)
                .add(acInput("VIN", "inp", "ref", 0))
                .resistor("R2", "out", "inm", 100e3)
                .resistor("R1", "inm", "0", 10e3)
                .opAmp("U1", "inp", "inm", "vcc", "0", "out", p)
                .build();
        AcAnalysis ac = AcAnalysis.of(railed);
        assertTrue(ac.operatingPoint().opAmp("U1").orElseThrow().saturated(), "precondition: the output sits on a rail");
        assertTrue(ac.response(null, "out", 1e3).decibels() < -40);
        AcPassband band = ac.passband(null, "out", 1, 1e5);
        assertTrue(band.peakDb() < -40);

        // The same stage with its blocking capacitor is linear and has its gain of 11 (20.8 dB).
        AcAnalysis working = AcAnalysis.of(nonInvertingStage(p, 10e3, 100e3, 10e-6));
        assertEquals(20 * Math.log10(11), working.response(null, "out", 1e3).decibels(), 0.02);
    }

    // ---- sweeps and requests ------------------------------------------------------------------

    @Test
    void sweepIsLogSpacedAndAgreesWithSinglePointResponses() {
        AcAnalysis ac = AcAnalysis.of(highPass());
        AcSweep s = ac.sweep(null, "out", 10, 10e3, 31);
        double[] f = s.frequenciesHz();
        assertEquals(31, s.size());
        assertEquals(10, f[0], 0);
        assertEquals(10e3, f[30], 0);
        for (int k = 1; k < f.length; k++) {
            assertEquals(Math.pow(10, 0.1), f[k] / f[k - 1], 1e-12);
            AcTransfer h = ac.response("VIN", "out", f[k]);
            assertEquals(h.decibels(), s.magnitudeDb()[k], 1e-12);
            assertEquals(h.phaseDegrees(), s.phaseDegrees()[k], 1e-12);
        }
        assertEquals("VIN", s.input());
    }

    @Test
    void sweepArraysAreCopiesSoTheResultCannotBeChanged() {
        AcSweep s = AcAnalysis.of(highPass()).sweep(null, "out", 10, 10e3, 5);
        double first = s.magnitudeDb()[0];
        s.magnitudeDb()[0] = 99;
        s.frequenciesHz()[0] = 99;
        assertEquals(first, s.magnitudeDb()[0]);
        assertEquals(10, s.frequenciesHz()[0]);
    }

    @Test
    @DisplayName("phase of three RC low-pass sections runs continuously past −180° (unwrapped)")
    void sweepPhaseIsUnwrapped() {
        Circuit c = Circuit.builder().implicitNodes()
                .add(acInput("VIN", "in", "0", 0))
                .resistor("R1", "in", "a", R).capacitor("C1", "a", "0", C)
                .resistor("R2", "a", "b", R).capacitor("C2", "b", "0", C)
                .resistor("R3", "b", "out", R).capacitor("C3", "out", "0", C)
                .build();
        double[] phase = AcAnalysis.of(c).sweep(null, "out", 1, 1e6, 61).phaseDegrees();
        for (int k = 1; k < phase.length; k++) {
            assertTrue(phase[k] <= phase[k - 1] + 1e-9, "phase only falls");
        }
        assertTrue(phase[phase.length - 1] < -260, "three poles approach −270°");
    }

    @Test
    void theInputMustBeNamedWhenNoSourceOrSeveralSourcesCarryAnAcMagnitude() {
        Circuit none = Circuit.builder().implicitNodes()
                .voltageSource("V1", "in", "0", 1)
                .resistor("R1", "in", "0", R)
                .build();
        AnalysisException e = assertThrows(AnalysisException.class,
                () -> AcAnalysis.of(none).response(null, "in", 1e3));
        assertEquals(AnalysisException.Kind.BAD_REQUEST, e.kind());
        // Named explicitly, a source with no AC magnitude still gives its transfer.
        assertEquals(1, AcAnalysis.of(none).response("V1", "in", 1e3).magnitude(), 1e-12);

        Circuit two = Circuit.builder().implicitNodes()
                .add(acInput("V1", "a", "0", 0))
                .add(acInput("V2", "b", "0", 0))
                .resistor("R1", "a", "b", R)
                .build();
        AcAnalysis ac = AcAnalysis.of(two);
        assertEquals(AnalysisException.Kind.BAD_REQUEST,
                assertThrows(AnalysisException.class, () -> ac.sweep(null, "a", 1, 10, 3)).kind());
        assertEquals(1, ac.response("V2", "b", 50).magnitude(), 1e-12);
    }

    @Test
    void badRequestsEndInBadRequest() {
        AcAnalysis ac = AcAnalysis.of(highPass());
        assertBadRequest(() -> ac.response("VX", "out", 1e3));
        assertBadRequest(() -> ac.response("R1", "out", 1e3));
        assertBadRequest(() -> ac.response(null, "nowhere", 1e3));
        assertBadRequest(() -> ac.response(null, "out", -1));
        assertBadRequest(() -> ac.response(null, "out", Double.NaN));
        assertBadRequest(() -> ac.sweep(null, "out", 0, 1e3, 10));
        assertBadRequest(() -> ac.sweep(null, "out", 1e3, 1e2, 10));
        assertBadRequest(() -> ac.sweep(null, "out", 1, 1e3, 1));
        assertBadRequest(() -> ac.sweep(null, "out", 1, 1e3, AcAnalysis.MAX_SWEEP_POINTS + 1));
        assertBadRequest(() -> ac.passband(null, "out", 1, Double.POSITIVE_INFINITY));
        assertBadRequest(() -> ac.lowerCornerHz(null, "nowhere", 1, 1e3));
    }

    @Test
    void noCornerInsideTheRangeGivesAnEmptyResult() {
        // 1 kHz to 1 MHz lies wholly above the 159 Hz corner: the gain never falls 3 dB.
        OptionalDouble corner = AcAnalysis.of(highPass()).lowerCornerHz(null, "out", 1e3, 1e6);
        assertTrue(corner.isEmpty());
    }

    private static void assertBadRequest(org.junit.jupiter.api.function.Executable call) {
        assertEquals(AnalysisException.Kind.BAD_REQUEST, assertThrows(AnalysisException.class, call).kind());
    }
}
