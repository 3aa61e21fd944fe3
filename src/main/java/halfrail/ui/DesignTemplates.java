package halfrail.ui;

import halfrail.design.AmplitudeUnit;
import halfrail.design.CapacitorSpec;
import halfrail.design.CellPack;
import halfrail.design.Design;
import halfrail.design.Load;
import halfrail.design.OpAmpChoice;
import halfrail.design.Reference;
import halfrail.design.ReferenceKind;
import halfrail.design.SignalSource;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.design.Thresholds;

import java.util.List;

/**
 * Starting points for a new design: one stage of a chosen kind behind a reference of a chosen
 * kind, on a 9 V block. The values are invented round numbers to edit, not a recommendation.
 */
public final class DesignTemplates {
    /** Op-amp archetype the templates start with. */
    static final String STARTING_OP_AMP = "single-supply-bipolar";

    private DesignTemplates() {}

    /** A one-stage design of {@code stage} kind with a reference of {@code reference} kind. */
    public static Design of(StageKind stage, ReferenceKind reference) {
        OpAmpChoice opAmp = OpAmpChoice.archetype(STARTING_OP_AMP);
        CapacitorSpec film = new CapacitorSpec(470e-9, "polyester-film", 63);
        CapacitorSpec legCap = new CapacitorSpec(10e-6, "polyester-film", 63);
        CapacitorSpec decoupling = new CapacitorSpec(4.7e-6, "aluminium-electrolytic", 16);
        Stage s = switch (stage) {
            case NON_INVERTING -> new Stage("stage 1", stage, opAmp, 22e3, 4.7e3, legCap, film);
            case INVERTING -> new Stage("stage 1", stage, opAmp, 47e3, 10e3, null, film);
            case FOLLOWER -> new Stage("stage 1", stage, opAmp, 0, 0, null, film);
        };
        Reference r = switch (reference) {
            case DIVIDER_DIRECT -> Reference.direct(100e3, 100e3);
            case DIVIDER_DECOUPLED -> Reference.decoupled(100e3, 100e3, decoupling, 100e3);
            case DIVIDER_BUFFERED -> Reference.buffered(100e3, 100e3, decoupling, 100e3, opAmp, 100, decoupling);
        };
        return new Design("new " + words(stage) + " design", "Started from a template; values invented.",
                new CellPack("alkaline-9v-block", 1), r, List.of(s),
                new SignalSource(0.1, AmplitudeUnit.VOLTS_PEAK, 1e3, 20, 20e3),
                new Load(10e3, 0, new CapacitorSpec(10e-6, "aluminium-electrolytic", 16)), Thresholds.defaults(),
                Design.DEFAULT_POWER_ON_RAMP_SECONDS);
    }

    /** The stage kind in words, for menus. */
    public static String words(StageKind kind) {
        return switch (kind) {
            case NON_INVERTING -> "non-inverting";
            case INVERTING -> "inverting";
            case FOLLOWER -> "follower";
        };
    }

    /** The reference kind in words, for menus. */
    public static String words(ReferenceKind kind) {
        return switch (kind) {
            case DIVIDER_DIRECT -> "divider straight in";
            case DIVIDER_DECOUPLED -> "decoupled divider";
            case DIVIDER_BUFFERED -> "buffered divider";
        };
    }
}
