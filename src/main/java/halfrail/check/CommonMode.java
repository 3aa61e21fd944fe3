package halfrail.check;

import java.util.List;

/** An input outside the op-amp's common-mode range, at rest or at the signal peaks. */
final class CommonMode implements DesignCheck {
    static final String CODE = "COMMON_MODE";

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        for (StageReport s : e.stages()) {
            if (s.commonModeHighVolts() < s.commonModeLowVolts()) {
                out.add(Finding.at(CODE, Severity.FAIL, s.label() + ": at " + Text.volts(s.nominal().supplyVolts())
                                + " the inputs have no usable range at all: they need " + Text.volts(s.commonModeLowVolts())
                                + " or more and at most " + Text.volts(s.commonModeHighVolts()),
                        List.of(s.designPath() + ".opAmp"),
                        "choose an op-amp whose inputs work at this supply, or a higher supply",
                        s.label(), LadderLevel.COMMON_MODE_LOW));
                continue;
            }
            if (!s.commonModeOkAtRest()) {
                out.add(Finding.at(CODE, Severity.FAIL, s.label() + ": the inputs at rest ("
                                + Text.volts(s.inPlusVolts()) + ", " + Text.volts(s.inMinusVolts())
                                + ") lie outside the common-mode range " + Text.volts(s.commonModeLowVolts()) + " to "
                                + Text.volts(s.commonModeHighVolts()),
                        List.of(s.designPath() + ".opAmp"),
                        "bias the inputs inside the range, or choose an op-amp whose inputs reach that rail",
                        s.label(), s.inPlusVolts() < s.commonModeLowVolts() ? LadderLevel.COMMON_MODE_LOW
                                : LadderLevel.COMMON_MODE_HIGH));
            } else if (!s.commonModeOkAtPeaks()) {
                boolean low = s.inPlusVolts() - s.inputSignalPeakVolts() < s.commonModeLowVolts();
                out.add(Finding.at(CODE, Severity.FAIL, s.label() + ": at the signal peaks the input reaches "
                                + Text.volts(low ? s.inPlusVolts() - s.inputSignalPeakVolts()
                                : s.inPlusVolts() + s.inputSignalPeakVolts())
                                + ", outside the common-mode range " + Text.volts(s.commonModeLowVolts()) + " to "
                                + Text.volts(s.commonModeHighVolts()),
                        List.of(s.designPath() + ".opAmp"),
                        "reduce the signal at this input, or choose an op-amp with a wider common-mode range",
                        s.label(), low ? LadderLevel.COMMON_MODE_LOW : LadderLevel.COMMON_MODE_HIGH));
            }
        }
    }
}
