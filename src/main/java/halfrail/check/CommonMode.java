package halfrail.check;

import halfrail.units.Quantities;
import java.util.List;

/** An input outside the op-amp's common-mode range, at rest or at the signal peaks. */
final class CommonMode implements DesignCheck {
    static final String CODE = "COMMON_MODE";

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        for (StageReport s : e.stages()) {
            if (s.commonModeHighVolts() < s.commonModeLowVolts()) {
                out.add(Finding.at(CODE, Severity.FAIL, s.label() + ": at " + Quantities.volts(s.nominal().supplyVolts())
                                + " the inputs have no usable range at all: they need " + Quantities.volts(s.commonModeLowVolts())
                                + " or more and at most " + Quantities.volts(s.commonModeHighVolts()),
                        List.of(s.designPath() + ".opAmp"),
                        "choose an op-amp whose inputs work at this supply, or a higher supply",
                        s.label(), LadderLevel.COMMON_MODE_LOW));
                continue;
            }
            if (!s.commonModeOkAtRest()) {
                out.add(Finding.at(CODE, Severity.FAIL, s.label() + ": the inputs at rest ("
                                + Quantities.volts(s.inPlusVolts()) + ", " + Quantities.volts(s.inMinusVolts())
                                + ") lie outside the common-mode range " + Quantities.volts(s.commonModeLowVolts()) + " to "
                                + Quantities.volts(s.commonModeHighVolts()),
                        List.of(s.designPath() + ".opAmp"),
                        "bias the inputs inside the range, or choose an op-amp whose inputs reach that rail",
                        s.label(), s.inPlusVolts() < s.commonModeLowVolts() ? LadderLevel.COMMON_MODE_LOW
                                : LadderLevel.COMMON_MODE_HIGH));
            } else if (!s.commonModeOkAtPeaks()) {
                boolean low = s.inPlusVolts() - s.inputSignalPeakVolts() < s.commonModeLowVolts();
                out.add(Finding.at(CODE, Severity.FAIL, s.label() + ": at the signal peaks the input reaches "
                                + Quantities.volts(low ? s.inPlusVolts() - s.inputSignalPeakVolts()
                                : s.inPlusVolts() + s.inputSignalPeakVolts())
                                + ", outside the common-mode range " + Quantities.volts(s.commonModeLowVolts()) + " to "
                                + Quantities.volts(s.commonModeHighVolts()) + SignalEnvelope.drivenNote(s.drivenByClipped()),
                        List.of(s.designPath() + ".opAmp"),
                        "reduce the signal at this input, or choose an op-amp with a wider common-mode range",
                        s.label(), low ? LadderLevel.COMMON_MODE_LOW : LadderLevel.COMMON_MODE_HIGH));
            }
        }
    }
}
