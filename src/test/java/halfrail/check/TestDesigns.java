package halfrail.check;

import halfrail.design.AmplitudeUnit;
import halfrail.design.CapacitorSpec;
import halfrail.design.CellPack;
import halfrail.design.Design;
import halfrail.design.Load;
import halfrail.design.OpAmpChoice;
import halfrail.design.Reference;
import halfrail.design.SignalSource;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.design.Thresholds;

import java.util.List;

/** Small designs of our own, built for the tests (invented values). */
final class TestDesigns {
    private TestDesigns() {}

    static CapacitorSpec film(double farads) {
        return new CapacitorSpec(farads, "polyester-film", 63);
    }

    static CapacitorSpec electrolytic(double farads, double volts) {
        return new CapacitorSpec(farads, "aluminium-electrolytic", volts);
    }

    /**
     * A healthy 9 V block design: a decoupled 150k/100k divider (10 µF) and 100 kΩ bias resistor,
     * one non-inverting stage of gain 11 (R2 47k, R1 4.7k, 10 µF film blocking capacitor) on the
     * single-supply bipolar archetype, 1 µF film input and 4.7 µF output coupling into 10 kΩ,
     * driven at 100 mV peak from 1 kΩ over 20 Hz to 20 kHz.
     *
     * <p>Why not an equal divider: this part's output swings from 0.02 V to 1.5 V below the rail,
     * so its window's centre at 9 V is 3.76 V, not 4.5 V; at 4.5 V the rest point loses 1.9 dB of
     * headroom on the high side (4.2 dB at the end-point), which OFF_CENTRE rightly reports. A
     * 0.4 ratio rests at 3.6 V, near the centre over the whole battery range. The 10 µF reference
     * capacitor (τ = 60 kΩ × 10 µF = 0.6 s) lets the output rise slowly enough that the 4.7 µF
     * output capacitor passes less than the 1 V start step limit, while settling stays under 2 s.
     */
    static Design healthyNineVolt() {
        Stage stage = new Stage("boost", StageKind.NON_INVERTING, OpAmpChoice.archetype("single-supply-bipolar"),
                47e3, 4.7e3, film(10e-6), film(1e-6));
        return new Design("healthy 9 V boost", "", new CellPack("alkaline-9v-block", 1),
                Reference.decoupled(150e3, 100e3, electrolytic(10e-6, 16), 100e3), List.of(stage),
                new SignalSource(0.1, AmplitudeUnit.VOLTS_PEAK, 1e3, 20, 20e3),
                new Load(10e3, 0, electrolytic(4.7e-6, 16)), Thresholds.defaults(), Design.DEFAULT_POWER_ON_RAMP_SECONDS);
    }

    /** A stage on the single-supply bipolar archetype. */
    static Stage stage(String name, StageKind kind, double r2, double r1, CapacitorSpec leg, CapacitorSpec in) {
        return new Stage(name, kind, OpAmpChoice.archetype("single-supply-bipolar"), r2, r1, leg, in);
    }
}
