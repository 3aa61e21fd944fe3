package halfrail.check;

import java.util.List;

/**
 * Every rule the analysis applies, in the order their findings are reported. To add a finding,
 * write one small {@link DesignCheck} class in this package and list it here.
 */
final class Checks {
    static final List<DesignCheck> ALL = List.of(
            new RestsOnRail(),
            new BiasAmplified(),
            new CommonMode(),
            new Headroom(),
            new OffCentre(),
            new LeakageDrift(),
            new CapacitorVoltage(),
            new Bandwidth(),
            new Ripple(),
            new BiasShift(),
            new PowerOn(),
            new CommonPractice(),
            new SupplyAndRuntime());

    private Checks() {}
}
