package halfrail.convert;

import halfrail.design.AmplitudeUnit;
import halfrail.design.CellPack;
import halfrail.design.OpAmpChoice;
import halfrail.design.SignalSource;
import halfrail.design.StageKind;
import halfrail.design.UsbPort;

import java.util.List;

/** Dual-rail originals and conversion requests of our own for the tests (invented values). */
final class ConversionRequests {
    private ConversionRequests() {}

    /** A non-inverting stage of gain 11 (R1 10k, R2 100k) with the classic bipolar part on ±15 V. */
    static DualRailChain nonInvertingOnFifteenVolts() {
        return new DualRailChain(List.of(new DualRailStage("gain", StageKind.NON_INVERTING, 10e3, 100e3,
                OpAmpChoice.archetype("classic-bipolar-dual-supply"))), 15, 15);
    }

    /** An inverting stage of gain −4.7 (R1 10k, R2 47k) with the JFET-input part on ±12 V. */
    static DualRailChain invertingOnTwelveVolts() {
        return new DualRailChain(List.of(new DualRailStage("invert", StageKind.INVERTING, 10e3, 47e3,
                OpAmpChoice.archetype("jfet-input-audio"))), 12, 12);
    }

    /** The non-inverting stage moved to one alkaline 9 V block: 100 mV peak from 1 kΩ, 20 Hz–20 kHz, 10 kΩ load. */
    static ConversionRequest nonInvertingToNineVolts() {
        return new ConversionRequest("boost on 9 V", nonInvertingOnFifteenVolts(), new CellPack("alkaline-9v-block", 1),
                new SignalSource(0.1, AmplitudeUnit.VOLTS_PEAK, 1e3, 20, 20e3), 10e3, 0, ConversionLimits.none());
    }

    /** The inverting stage moved to a USB port: 300 mV peak from 600 Ω into a 600 Ω load, 20 Hz–20 kHz. */
    static ConversionRequest invertingToUsb() {
        return new ConversionRequest("line stage on USB", invertingOnTwelveVolts(), new UsbPort(0, 0),
                new SignalSource(0.3, AmplitudeUnit.VOLTS_PEAK, 600, 20, 20e3), 600, 0, ConversionLimits.none());
    }

    /**
     * A two-stage chain on ±12 V (non-inverting gain 11, then inverting −2.2, JFET-input parts)
     * moved to three AA cells: 30 mV peak from 10 kΩ, 20 Hz–20 kHz, 47 kΩ load, settle-up within
     * 1 s and at most 1 mA.
     */
    static ConversionRequest twoStageChainToThreeAaCells() {
        DualRailChain chain = new DualRailChain(List.of(
                new DualRailStage("gain", StageKind.NON_INVERTING, 10e3, 100e3, OpAmpChoice.archetype("jfet-input-audio")),
                new DualRailStage("invert", StageKind.INVERTING, 10e3, 22e3, OpAmpChoice.archetype("jfet-input-audio"))),
                12, 12);
        return new ConversionRequest("two stages on AA cells", chain, new CellPack("alkaline-aa", 3),
                new SignalSource(0.03, AmplitudeUnit.VOLTS_PEAK, 10e3, 20, 20e3), 47e3, 0,
                ConversionLimits.none().withMaxSettleSeconds(1).withMaxSupplyAmps(1e-3));
    }

    /** A deliberately impossible request: a 1 Hz low end with a 10 ms settle-up limit. */
    static ConversionRequest oneHertzInTenMilliseconds() {
        SignalSource s = new SignalSource(0.1, AmplitudeUnit.VOLTS_PEAK, 1e3, 1, 20e3);
        return nonInvertingToNineVolts().withSignal(s).withLimits(ConversionLimits.none().withMaxSettleSeconds(0.01));
    }
}
