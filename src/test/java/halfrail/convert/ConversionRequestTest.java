package halfrail.convert;

import halfrail.design.AmplitudeUnit;
import halfrail.design.OpAmpChoice;
import halfrail.design.SignalSource;
import halfrail.design.StageKind;
import halfrail.design.UsbPort;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.OptionalDouble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

class ConversionRequestTest {
    private static final OpAmpChoice PART = OpAmpChoice.archetype("cmos-rrio-low-voltage");

    @Test
    void aNegativeResistorNamesItsField() {
        ConversionException e = assertThrows(ConversionException.class,
                () -> new DualRailStage("a", StageKind.NON_INVERTING, -1, 10e3, PART));
        assertEquals("r1Ohms", e.path());
    }

    @Test
    void aFollowerNeedsNoResistors() {
        assertEquals(1, new DualRailStage("f", StageKind.FOLLOWER, 0, 0, PART).gain());
    }

    @Test
    void railsMustBePositive() {
        DualRailStage s = new DualRailStage("a", StageKind.INVERTING, 10e3, 10e3, PART);
        assertEquals("original.negativeVolts",
                assertThrows(ConversionException.class, () -> new DualRailChain(List.of(s), 5, 0)).path());
        assertEquals("original.stages",
                assertThrows(ConversionException.class, () -> new DualRailChain(List.of(), 5, 5)).path());
    }

    @Test
    void stageNamesMustDiffer() {
        DualRailStage s = new DualRailStage("a", StageKind.INVERTING, 10e3, 10e3, PART);
        assertEquals("original.stages[1].name",
                assertThrows(ConversionException.class, () -> new DualRailChain(List.of(s, s), 5, 5)).path());
    }

    @Test
    void aRuntimeLimitNeedsASupplyWithACapacity() {
        DualRailChain chain = new DualRailChain(List.of(new DualRailStage("a", StageKind.INVERTING, 10e3, 10e3, PART)),
                5, 5);
        SignalSource src = new SignalSource(0.1, AmplitudeUnit.VOLTS_PEAK, 0, 20, 20e3);
        ConversionException e = assertThrows(ConversionException.class, () -> new ConversionRequest("x", chain,
                new UsbPort(0, 0), src, 10e3, 0, ConversionLimits.none().withMinRuntimeHours(10)));
        assertEquals("limits.minRuntimeHours", e.path());
        assertEquals("load.ohms", assertThrows(ConversionException.class,
                () -> new ConversionRequest("x", chain, new UsbPort(0, 0), src, 0, 0, null)).path());
    }

    @Test
    void limitsMustBePositive() {
        assertEquals("limits.maxSettleSeconds", assertThrows(ConversionException.class,
                () -> new ConversionLimits(OptionalDouble.of(-1), OptionalDouble.empty(), OptionalDouble.empty(),
                        LimitPriority.BAND)).path());
        assertEquals("limits.maxSupplyAmps", assertThrows(ConversionException.class,
                () -> ConversionLimits.none().withMaxSupplyAmps(Double.NaN)).path());
    }
}
