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
     * A healthy 9 V block design: decoupled 100k/100k divider, one non-inverting stage of gain 11
     * (R2 47k, R1 4.7k, 10 µF film blocking capacitor), 1 µF input and 10 µF output coupling into 10 kΩ,
     * driven at 100 mV peak from 1 kΩ over 20 Hz to 20 kHz.
     */
    static Design healthyNineVolt() {
        Stage stage = new Stage("boost", StageKind.NON_INVERTING, OpAmpChoice.archetype("single-supply-bipolar"),
                47e3, 4.7e3, film(10e-6), film(1e-6));
        return new Design("healthy 9 V boost", "", new CellPack("alkaline-9v-block", 1),
                Reference.decoupled(100e3, 100e3, electrolytic(4.7e-6, 16), 100e3), List.of(stage),
                new SignalSource(0.1, AmplitudeUnit.VOLTS_PEAK, 1e3, 20, 20e3),
                new Load(10e3, 0, electrolytic(10e-6, 16)), Thresholds.defaults(), Design.DEFAULT_POWER_ON_RAMP_SECONDS);
    }
}
