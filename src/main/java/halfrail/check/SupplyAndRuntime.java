package halfrail.check;

import java.util.List;

/** The op-amps' specified supply range against the supply's whole range; runtime against the design's target. */
final class SupplyAndRuntime implements DesignCheck {
    static final String RANGE = "SUPPLY_OUT_OF_RANGE";
    static final String RUNTIME = "RUNTIME_SHORT";

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        for (StageReport s : e.stages()) {
            if (!s.supplyInRange()) {
                out.add(Finding.at(RANGE, Severity.FAIL, s.label() + ": the supply runs from "
                                + Text.volts(e.design().supply().lowVolts()) + " to "
                                + Text.volts(e.design().supply().highVolts())
                                + ", outside the op-amp's specified supply range",
                        List.of(s.designPath() + ".opAmp", "supply"),
                        "choose an op-amp specified for the whole supply range, from fresh to end-point",
                        s.label(), LadderLevel.END_POINT_SUPPLY));
            }
        }
        double target = e.thresholds().minRuntimeHours();
        BatteryReport b = e.battery();
        if (target > 0 && b.runtimeHours().isPresent() && b.runtimeHours().getAsDouble() < target) {
            out.add(Finding.of(RUNTIME, Severity.WARN, String.format(java.util.Locale.ROOT,
                            "runtime is %.3g h at %s, short of the %.3g h target (divider %s, op-amps %s)",
                            b.runtimeHours().getAsDouble(), Text.amps(b.totalAmps()), target,
                            Text.amps(b.dividerAmps()), Text.amps(b.opAmpAmps())),
                    List.of("reference", "supply"),
                    "raise the divider resistance, or choose lower-power op-amps"));
        }
    }
}
