package halfrail.ui;

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

/**
 * Designs the app can start from until design files are available. The values are invented
 * for demonstration; they are not a recommendation for any particular instrument.
 */
public final class SampleDesigns {
    private SampleDesigns() {}

    /**
     * A 9 V block instrument boost: a decoupled 100k/100k mid-rail divider, one non-inverting
     * stage of gain 1 + 39k/3.9k = 11 with a 22 µF blocking capacitor in its leg, a 220 nF input
     * capacitor and a 10 µF output capacitor into 10 kΩ, driven at 150 mV peak from 2.2 kΩ
     * over 40 Hz to 15 kHz.
     */
    public static Design instrumentBoost() {
        Stage boost = new Stage("boost", StageKind.NON_INVERTING, OpAmpChoice.archetype("single-supply-bipolar"),
                39e3, 3.9e3, film(10e-6), film(470e-9));
        return new Design("instrument boost, 9 V", "Sample design with invented values.",
                new CellPack("alkaline-9v-block", 1),
                Reference.decoupled(100e3, 100e3, electrolytic(4.7e-6, 16), 100e3), List.of(boost),
                new SignalSource(0.1, AmplitudeUnit.VOLTS_PEAK, 2.2e3, 40, 15e3),
                new Load(10e3, 0, electrolytic(10e-6, 16)), Thresholds.defaults(),
                Design.DEFAULT_POWER_ON_RAMP_SECONDS);
    }

    /** The instrument boost with its leg capacitor left out: the stage amplifies its own bias into a rail. */
    public static Design missingLegCapacitor() {
        Design d = instrumentBoost();
        return d.withStage(0, d.stages().get(0).withLegCapacitor(null));
    }

    static CapacitorSpec film(double farads) {
        return new CapacitorSpec(farads, "polyester-film", 63);
    }

    static CapacitorSpec electrolytic(double farads, double ratedVolts) {
        return new CapacitorSpec(farads, "aluminium-electrolytic", ratedVolts);
    }
}
