package halfrail.check;

import halfrail.circuit.OpAmpParams;
import halfrail.design.AmplitudeUnit;
import halfrail.design.CapacitorSpec;
import halfrail.design.CellPack;
import halfrail.design.Design;
import halfrail.design.FixedRail;
import halfrail.design.Load;
import halfrail.design.OpAmpChoice;
import halfrail.design.Reference;
import halfrail.design.SignalSource;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.design.Supply;
import halfrail.design.Thresholds;

import java.util.List;

/** Small designs of our own for the study tests (invented values). */
final class StudyDesigns {
    private StudyDesigns() {}

    /** Swing limit of the near-rail test op-amp on each side, V. */
    static final double SWING_VOLTS = 0.1;

    /**
     * A near-rail op-amp with no input errors and no supply current: gain 1e5, 1 MHz, output
     * within 0.1 V of either rail, inputs reaching both rails.
     */
    static OpAmpParams cleanOpAmp() {
        return OpAmpParams.defaults().withSwing(SWING_VOLTS, SWING_VOLTS).withSlewRate(1e6);
    }

    static CapacitorSpec film(double farads) {
        return new CapacitorSpec(farads, "polyester-film", 63);
    }

    /**
     * One non-inverting stage of gain 1 + 100k/10k = 11 behind a decoupled 100k/100k divider, AC
     * coupled in and out, driven at {@code sourcePeakVolts} V peak from an ideal source over
     * 100 Hz–1 kHz, with {@link #cleanOpAmp()}.
     */
    static Design gainOfEleven(Supply supply, double sourcePeakVolts) {
        Stage stage = new Stage("amp", StageKind.NON_INVERTING, OpAmpChoice.custom(cleanOpAmp()), 100e3, 10e3,
                film(10e-6), film(1e-6));
        return new Design("gain of eleven", "", supply,
                Reference.decoupled(100e3, 100e3, film(10e-6), 100e3), List.of(stage),
                new SignalSource(sourcePeakVolts, AmplitudeUnit.VOLTS_PEAK, 0, 100, 1e3),
                new Load(10e3, 0, film(10e-6)), Thresholds.defaults(), Design.DEFAULT_POWER_ON_RAMP_SECONDS);
    }

    /** Four alkaline AA cells in series (3.6–6.4 V). */
    static Supply fourAa() {
        return new CellPack("alkaline-aa", 4);
    }

    /** An ideal 10 V rail with the given tolerance. */
    static Supply tenVolts(double tolerance) {
        return new FixedRail(10, tolerance, 0, 0, 0);
    }

    /**
     * A bare divider Ra/Rb from an ideal rail straight into a unity follower (input capacitor from
     * the source), the follower's output AC coupled into the load: the follower's rest point is
     * the divider's output.
     */
    static Design divider(Supply supply, double upperOhms, double lowerOhms) {
        Stage follower = new Stage("follower", StageKind.FOLLOWER, OpAmpChoice.custom(cleanOpAmp()), 0, 0, null,
                new CapacitorSpec(1e-6, "ceramic-class-1", 50));
        return new Design("divider", "", supply, Reference.direct(upperOhms, lowerOhms), List.of(follower),
                new SignalSource(0.1, AmplitudeUnit.VOLTS_PEAK, 0, 100, 1e3),
                new Load(10e3, 0, new CapacitorSpec(1e-6, "ceramic-class-1", 50)), Thresholds.defaults(),
                Design.DEFAULT_POWER_ON_RAMP_SECONDS);
    }
}
