package halfrail.check;

import halfrail.circuit.Capacitor;
import halfrail.design.AmplitudeUnit;
import halfrail.design.Design;
import halfrail.design.DesignCircuit;
import halfrail.design.DesignCircuits;
import halfrail.design.FixedRail;
import halfrail.design.OpAmpChoice;
import halfrail.design.SignalSource;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.design.StageNodes;
import halfrail.parts.OpAmpArchetype;
import halfrail.solve.AcAnalysis;
import halfrail.solve.DcSolver;
import halfrail.solve.MnaSystem;
import halfrail.solve.OperatingPoint;
import halfrail.units.Quantities;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

import static halfrail.check.FindingCatalogueTest.assertCarries;
import static halfrail.check.FindingCatalogueTest.preampRepeated;
import static halfrail.check.TestDesigns.film;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The signal envelope behind a clipping stage ({@link SignalEnvelope}): no node after a clipped
 * op-amp swings further than that op-amp's output can. The linear figures the envelope is
 * compared with are computed here, independently, from an AC analysis at the same operating point.
 */
class ClipAwareEnvelopeTest {

    /** The linear (small-signal) figures of a design: peaks at op-amp outputs and inputs, and across capacitors. */
    record Linear(Map<String, Double> outputs, Map<String, Double> inputs, Map<String, Double> capacitors) {
        static Linear of(Design d) {
            DesignCircuit dc = DesignCircuits.nominal(d);
            OperatingPoint op = new DcSolver(MnaSystem.of(dc.circuit())).solve();
            AcAnalysis ac = new AcAnalysis(op);
            SignalSource s = d.source();
            double lo = s.bandLowHz();
            double hi = s.bandHighHz();
            Map<String, Double> out = new LinkedHashMap<>();
            Map<String, Double> in = new LinkedHashMap<>();
            for (StageNodes sn : dc.opAmps()) {
                out.put(sn.label(), ac.peakMagnitude(dc.signalSource(), sn.out(), lo, hi) * s.voltsPeak());
                in.put(sn.label(), ac.peakMagnitude(dc.signalSource(), sn.inPlus(), lo, hi) * s.voltsPeak());
            }
            Map<String, Double> caps = new LinkedHashMap<>();
            for (Capacitor c : dc.circuit().elements(Capacitor.class)) {
                if (!c.technology().isEmpty()) {
                    caps.put(c.name(), ac.peakMagnitude(dc.signalSource(), c.plus(), c.minus(), lo, hi) * s.voltsPeak());
                }
            }
            return new Linear(out, in, caps);
        }
    }

    static StageReport stage(DesignReport r, String label) {
        return r.stages().stream().filter(s -> s.label().equals(label)).findFirst().orElseThrow();
    }

    static CapacitorReport capacitor(DesignReport r, String element) {
        return r.capacitors().stream().filter(c -> c.element().equals(element)).findFirst().orElseThrow();
    }

    /** E: the larger of the rooms above and below the rest point, V. */
    static double deliverable(SwingReport s) {
        return Math.max(s.availableLowVolts(), s.availableHighVolts());
    }

    static List<Finding> at(DesignReport r, String code, String opAmp) {
        return r.findings(code).stream().filter(f -> f.opAmp().equals(Optional.of(opAmp))).toList();
    }

    static Design withSource(Design d, double amplitude, AmplitudeUnit unit) {
        SignalSource s = d.source();
        return d.withSource(new SignalSource(amplitude, unit, s.sourceOhms(), s.bandLowHz(), s.bandHighHz()));
    }

    @Test
    void threeRepeatedPreampStagesOnThreeVoltsAreBoundedByTheClippedSecondStage() {
        Design d = preampRepeated(3);
        DesignReport r = DesignAnalysis.analyse(d, false);
        ReportAssertions.assertAllFinite(r);
        Linear lin = Linear.of(d);
        StageReport s1 = stage(r, "mic-1");
        StageReport s2 = stage(r, "mic-2");
        StageReport s3 = stage(r, "mic-3");

        // Hand numbers. Two alkaline AA cells: 3.0 V nominal (1.5 V a cell, common practice); the
        // 100k/100k divider rests every stage at 1.5 V; the low-voltage CMOS archetype swings to
        // 20 mV of each rail at light load (its stated typical figure). E = max(2.98 − 1.5, 1.5 − 0.02) = 1.48 V.
        for (StageReport s : List.of(s1, s2, s3)) {
            assertEquals(1.5, s.outputVolts(), 0.01, s.label());
            assertEquals(1.48, deliverable(s.nominal()), 0.005, s.label());
        }
        // mic-1 passes its 0.21 V on whole (−50 dBV = 4.47 mV peak × 48 — the gain 1 + 47k/1k — less the
        // 2k2 source into the 220k bias: ≈ 0.21 V); mic-2 is asked for 48 × that, about 10 V, and clips.
        assertEquals(1.0, s2.driveFactor(), 0.0);
        assertEquals(lin.outputs().get("mic-2"), s2.nominal().signalPeakVolts(), 1e-9);
        double c2 = deliverable(s2.nominal()) / s2.nominal().signalPeakVolts();
        assertTrue(c2 < 0.2, "mic-2 passes on " + c2);
        // mic-3 gets only what mic-2 delivers: its drive is c2, its input swings no more than E of mic-2 ...
        assertEquals(c2, s3.driveFactor(), 1e-12);
        assertEquals(lin.inputs().get("mic-3") * c2, s3.inputSignalPeakVolts(), 1e-9);
        assertEquals(1.48, s3.inputSignalPeakVolts(), 0.01);
        assertTrue(s3.inPlusVolts() - s3.inputSignalPeakVolts() >= s3.commonModeLowVolts());
        assertTrue(s3.inPlusVolts() + s3.inputSignalPeakVolts() <= s3.commonModeHighVolts());
        // ... and is asked for 48 × 1.48 V: still over its window, by the demand, not by the linear 488 V.
        assertEquals(lin.outputs().get("mic-3") * c2, s3.nominal().signalPeakVolts(), 1e-6);
        assertEquals(48 * 1.48, s3.nominal().signalPeakVolts(), 0.05 * 48 * 1.48);
        assertEquals(Optional.of("mic-2"), s3.drivenByClipped());
        assertEquals(Optional.empty(), s2.drivenByClipped());

        // The linear figures would have failed mic-3's common-mode range and COUT's 6.3 V rating:
        assertTrue(s3.inPlusVolts() - lin.inputs().get("mic-3") < s3.commonModeLowVolts());
        CapacitorReport cout = capacitor(r, "COUT");
        assertTrue(Math.abs(cout.dcVolts()) + lin.capacitors().get("COUT") > cout.deratedVolts());
        // Now: COUT carries the drive after mic-3, E3/P3 of mic-3's demand ...
        double c3 = deliverable(s3.nominal()) / s3.nominal().signalPeakVolts();
        assertEquals(lin.capacitors().get("COUT") * c2 * c3, cout.signalPeakVolts(), 1e-9);
        // ... at most the clipped output's 1.48 V through the 10 µF / 10 kΩ high-pass at the band's 50 Hz
        // low end, 1/√(1 + (2π·50·10k·10µ)²) = 0.0318 of it: 47 mV (first-order RC divider, any circuit text).
        double wrc = 2 * Math.PI * 50 * 10e3 * 10e-6;
        assertTrue(cout.signalPeakVolts() <= 1.48 / Math.sqrt(1 + wrc * wrc), "COUT " + cout.signalPeakVolts());
        assertTrue(cout.worstVolts() < cout.deratedVolts());
        assertEquals(Optional.of("mic-2"), cout.drivenByClipped());
        // mic-3's leg and input capacitors: by the drive reaching mic-3
        assertEquals(lin.capacitors().get("CIN3") * c2, capacitor(r, "CIN3").signalPeakVolts(), 1e-9);
        assertEquals(lin.capacitors().get("CLEG3") * c2, capacitor(r, "CLEG3").signalPeakVolts(), 1e-9);
        // the reference keeps its linear figure
        assertEquals(lin.capacitors().get("CREF"), capacitor(r, "CREF").signalPeakVolts(), 0.0);

        // Findings: both over-driven stages clip; nothing downstream of the clipped stage is failed
        // for a swing it cannot have.
        assertTrue(at(r, Headroom.CLIPS, "mic-1").isEmpty());
        assertEquals(1, at(r, Headroom.CLIPS, "mic-2").size());
        List<Finding> clips3 = at(r, Headroom.CLIPS, "mic-3");
        assertEquals(1, clips3.size());
        assertCarries(clips3.get(0), Quantities.volts(s3.nominal().signalPeakVolts()),
                Quantities.db(s3.nominal().headroomDb().getAsDouble()), "driven by the clipped output of mic-2");
        // mic-2's shortfall is the honest linear one: 20·log10(1.479 V / 10.2 V) ≈ −16.8 dB
        assertEquals(20 * Math.log10(Math.min(s2.nominal().availableLowVolts(), s2.nominal().availableHighVolts())
                / lin.outputs().get("mic-2")), s2.nominal().headroomDb().getAsDouble(), 1e-9);
        // the largest source level that fits mic-3 stays the linear chain's: window / linear gain
        double worse3 = Math.min(s3.nominal().availableLowVolts(), s3.nominal().availableHighVolts());
        assertEquals(worse3 / lin.outputs().get("mic-3") * d.source().voltsPeak(),
                s3.nominal().largestSourcePeakVolts().getAsDouble(), 1e-12);
        assertTrue(r.findings(CommonMode.CODE).isEmpty(), r.findings()::toString);
        assertTrue(r.findings(CapacitorVoltage.OVER).isEmpty(), r.findings()::toString);

        // The ladder draws the demand around the rest point.
        Ladder l3 = r.ladders().stream().filter(l -> l.opAmp().equals("mic-3")).findFirst().orElseThrow();
        assertEquals(s3.nominal().signalPeakVolts(), l3.envelopeHighVolts() - l3.quiescentVolts(), 1e-12);

        // The slew rate follows the swing the output makes: SR/(2π·Vpeak) (full-power bandwidth, any
        // op-amp text) with mic-1's whole 0.21 V but the clipped stages' 1.48 V, not their demand.
        assertEquals(s1.nominal().signalPeakVolts(), s1.nominal().deliveredPeakVolts(), 0.0);
        assertEquals(deliverable(s3.nominal()), s3.nominal().deliveredPeakVolts(), 0.0);
        double sr1 = 2 * Math.PI * s1.fullPowerHz().getAsDouble() * s1.nominal().deliveredPeakVolts();
        for (StageReport s : List.of(s2, s3)) {
            assertEquals(sr1, 2 * Math.PI * s.fullPowerHz().getAsDouble() * 1.48, 0.01 * sr1, s.label());
        }
        for (Finding f : r.findings(Bandwidth.SLEW)) {
            assertCarries(f, Quantities.volts(1.48));
        }
    }

    /**
     * Equal to the test's own linear figure: to rounding (1e-12 relative), since the test repeats
     * the solve and the AC analysis rather than sharing the analysis's objects.
     */
    static void assertLinear(double linear, double actual, String what) {
        assertEquals(linear, actual, 1e-12 * Math.abs(linear), what);
    }

    @Test
    void whenNothingClipsEveryFigureIsTheLinearOne() {
        // Two repeated preamp stages at −70 dBV: 0.447 mV peak × 48 × 48 ≈ 1.0 V at mic-2, inside its 1.48 V.
        for (Design d : List.of(withSource(preampRepeated(2), -70, AmplitudeUnit.DBV), TestDesigns.healthyNineVolt())) {
            DesignReport r = DesignAnalysis.analyse(d, false);
            Linear lin = Linear.of(d);
            assertTrue(r.findings(Headroom.CLIPS).isEmpty(), r.findings()::toString);
            for (StageReport s : r.stages()) {
                assertEquals(1.0, s.driveFactor(), 0.0, s.label());
                assertEquals(Optional.empty(), s.drivenByClipped());
                assertLinear(lin.outputs().get(s.label()), s.nominal().signalPeakVolts(), s.label());
                assertLinear(lin.outputs().get(s.label()), s.endPoint().signalPeakVolts(), s.label());
                assertLinear(lin.outputs().get(s.label()), s.fresh().signalPeakVolts(), s.label());
                assertLinear(lin.inputs().get(s.label()), s.inputSignalPeakVolts(), s.label());
            }
            for (CapacitorReport c : r.capacitors()) {
                assertLinear(lin.capacitors().get(c.element()), c.signalPeakVolts(), c.element());
                assertEquals(Optional.empty(), c.drivenByClipped());
            }
        }
    }

    /** The recorder preamp's mic stage (gain 48) into an inverting pad of 22k/47k (0.47), at a 1 V peak source. */
    static Design micIntoPad() {
        Design base = preampRepeated(1);
        Stage pad = new Stage("pad", StageKind.INVERTING, OpAmpChoice.archetype(OpAmpArchetype.CMOS_RRIO_LOW_VOLTAGE),
                22e3, 47e3, null, film(1e-6));
        return withSource(base.withStages(List.of(base.stages().get(0), pad)), 1, AmplitudeUnit.VOLTS_PEAK);
    }

    /** {@link #micIntoPad()} with the source set so that mic's linear output peak is {@code micVolts} (figures scale with the source). */
    static Design micIntoPadAsking(double micVolts) {
        Design unit = micIntoPad();
        return withSource(unit, micVolts / Linear.of(unit).outputs().get("mic-1"), AmplitudeUnit.VOLTS_PEAK);
    }

    @Test
    void aFirstStageTwentyPercentOverScalesEverythingAfterItByItsClipFactor() {
        // mic (gain 48) into an inverting pad of 22k/47k (0.47): the pad never clips, so every
        // figure after mic is the linear one times E1/P1 = 1/1.2.
        // Choose the source so that mic's demand is 1.2 × its E.
        double e1 = deliverable(stage(DesignAnalysis.analyse(micIntoPad(), false), "mic-1").nominal());
        Design d = micIntoPadAsking(1.2 * e1);
        DesignReport r = DesignAnalysis.analyse(d, false);
        Linear lin = Linear.of(d);
        StageReport mic = stage(r, "mic-1");
        StageReport p = stage(r, "pad");

        assertEquals(1.2 * e1, mic.nominal().signalPeakVolts(), 1e-9);
        assertEquals(1 / 1.2, p.driveFactor(), 1e-9);
        assertEquals(1 / 1.2, p.nominal().signalPeakVolts() / lin.outputs().get("pad"), 1e-9);
        assertEquals(1 / 1.2, p.inputSignalPeakVolts() / lin.inputs().get("pad"), 1e-9);
        for (String c : List.of("CIN2", "COUT")) {
            assertEquals(1 / 1.2, capacitor(r, c).signalPeakVolts() / lin.capacitors().get(c), 1e-9, c);
            assertEquals(Optional.of("mic-1"), capacitor(r, c).drivenByClipped());
        }
        for (String c : List.of("CIN1", "CLEG1")) {
            assertEquals(lin.capacitors().get(c), capacitor(r, c).signalPeakVolts(), 0.0, c);
        }
        // mic-1 clips by 20·log10(room/(1.2·E1)): 20·log10(1/1.2) = −1.58 dB, its low and high rooms differing by
        // a few mV
        double worse = Math.min(mic.nominal().availableLowVolts(), mic.nominal().availableHighVolts());
        assertEquals(20 * Math.log10(worse / (1.2 * e1)), mic.nominal().headroomDb().getAsDouble(), 1e-9);
        assertEquals(-1.6, mic.nominal().headroomDb().getAsDouble(), 0.05);
        assertEquals(1, at(r, Headroom.CLIPS, "mic-1").size());
        assertTrue(at(r, Headroom.CLIPS, "pad").isEmpty(), r.findings()::toString);
        assertEquals(Optional.of("mic-1"), p.drivenByClipped());
    }

    @Test
    void aStageThatClipsOnlyOnAFlatBatteryReducesWhatTheNextIsAskedForThere() {
        // mic (gain 48) into the 22k/47k pad again, the source set so that mic's demand lies midway
        // between what it can deliver on the flat pack (two AA cells at their end point) and on the
        // nominal 3 V: at nominal nothing clips, at the end point mic clips and the pad gets E1/P1 of
        // its linear drive there.
        StageReport probe = stage(DesignAnalysis.analyse(micIntoPad(), false), "mic-1");
        double eNominal = deliverable(probe.nominal());
        double eEnd = deliverable(probe.endPoint());
        assertTrue(eEnd < eNominal, "the flat pack's window is narrower: " + eEnd + " vs " + eNominal);
        double demand = 0.5 * (eNominal + eEnd);
        Design d = micIntoPadAsking(demand);
        DesignReport r = DesignAnalysis.analyse(d, false);
        Linear lin = Linear.of(d);
        StageReport mic = stage(r, "mic-1");
        StageReport p = stage(r, "pad");

        assertEquals(demand, mic.nominal().signalPeakVolts(), 1e-9);
        assertEquals(demand, mic.endPoint().signalPeakVolts(), 1e-9);
        assertEquals(1.0, p.driveFactor(), 0.0);
        assertLinear(lin.outputs().get("pad"), p.nominal().signalPeakVolts(), "pad nominal");
        assertLinear(lin.outputs().get("pad"), p.fresh().signalPeakVolts(), "pad fresh");
        double cEnd = deliverable(mic.endPoint()) / demand;
        assertTrue(cEnd < 1);
        assertEquals(lin.outputs().get("pad") * cEnd, p.endPoint().signalPeakVolts(), 1e-9 * lin.outputs().get("pad"));
        // the largest source level that fits the pad stays the linear chain's, at the end point too
        double worseEnd = Math.min(p.endPoint().availableLowVolts(), p.endPoint().availableHighVolts());
        assertEquals(worseEnd / lin.outputs().get("pad") * d.source().voltsPeak(),
                p.endPoint().largestSourcePeakVolts().getAsDouble(), 1e-12);
    }

    @Test
    void aCommonModeFailureBehindAClippedStageNamesThatStage() {
        // On 5 V a CMOS stage overdriven to its 20 mV-from-the-rails window (E = 2.48 V round 2.5 V)
        // drives a DC-coupled follower on the single-supply bipolar part, whose inputs end 1.5 V below
        // the positive rail (3.5 V; its stated typical figure): 2.5 + 2.48 V is over that in earnest.
        Design base = preampRepeated(1);
        Stage follower = new Stage("buffer", StageKind.FOLLOWER,
                OpAmpChoice.archetype(OpAmpArchetype.SINGLE_SUPPLY_BIPOLAR), 0, 0, null, null);
        Design d = withSource(base.withSupply(new FixedRail(5, 0, 0, 0, 0))
                .withStages(List.of(base.stages().get(0), follower)), 0.1, AmplitudeUnit.VOLTS_PEAK);
        DesignReport r = DesignAnalysis.analyse(d, false);
        StageReport b = stage(r, "buffer");
        StageReport mic = stage(r, "mic-1");
        assertEquals(2.48, deliverable(mic.nominal()), 0.01);
        assertEquals(2.48, b.inputSignalPeakVolts(), 0.02);
        assertEquals(Optional.of("mic-1"), b.drivenByClipped());
        List<Finding> cm = at(r, CommonMode.CODE, "buffer");
        assertEquals(1, cm.size(), r.findings()::toString);
        assertCarries(cm.get(0), Quantities.volts(b.inPlusVolts() + b.inputSignalPeakVolts()),
                "driven by the clipped output of mic-1");
    }

    @Test
    void theStudiesUseTheSameClipAwarePeaks() {
        Design d = preampRepeated(3);
        DesignReport r = DesignAnalysis.analyse(d, false);
        NominalStudy study = NominalStudy.of(d, d.supply().nominalVolts());
        List<Double> fromReport = new ArrayList<>();
        r.stages().forEach(s -> fromReport.add(s.nominal().signalPeakVolts()));
        List<Double> fromStudy = new ArrayList<>();
        for (double v : study.signalPeakVolts) {
            fromStudy.add(v);
        }
        assertEquals(fromReport, fromStudy);
        SupplySweepResult sweep = SupplySweep.run(d);
        for (int k = 0; k < r.stages().size(); k++) {
            assertEquals(r.stages().get(k).nominal().signalPeakVolts(), sweep.opAmps().get(k).signalPeakVolts(), 0.0);
        }
    }
}
