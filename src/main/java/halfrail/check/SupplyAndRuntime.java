package halfrail.check;

import halfrail.units.Quantities;
import halfrail.circuit.OpAmp;
import halfrail.circuit.OpAmpParams;
import halfrail.design.DesignCircuit;
import halfrail.design.StageNodes;
import halfrail.design.Supply;

import java.util.ArrayList;
import java.util.List;

/** The op-amps' specified supply range against the supply's whole range; runtime against the design's target. */
final class SupplyAndRuntime implements DesignCheck {
    static final String RANGE = "SUPPLY_OUT_OF_RANGE";
    static final String RUNTIME = "RUNTIME_SHORT";

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        for (StageReport s : e.stages()) {
            if (!s.supplyInRange()) {
                out.add(range(e.design().supply(), s.label(), s.designPath()));
            }
        }
        double target = e.thresholds().minRuntimeHours();
        BatteryReport b = e.battery();
        if (target > 0 && b.runtimeHours().isPresent() && b.runtimeHours().getAsDouble() < target) {
            out.add(Finding.of(RUNTIME, Severity.WARN, String.format(java.util.Locale.ROOT,
                            "runtime is %.3g h at %s, short of the %.3g h target (divider %s, op-amps %s)",
                            b.runtimeHours().getAsDouble(), Quantities.amps(b.totalAmps()), target,
                            Quantities.amps(b.dividerAmps()), Quantities.amps(b.opAmpAmps())),
                    List.of("reference", "supply"),
                    "raise the divider resistance, or choose lower-power op-amps"));
        }
    }

    /**
     * The supply-range findings from the op-amps' parameters alone, for a design whose circuit
     * could not be solved: an op-amp run outside its supply range is a common reason, and saying
     * so needs no solution.
     */
    static List<Finding> beforeSolve(Supply supply, DesignCircuit circuit) {
        List<Finding> out = new ArrayList<>();
        for (StageNodes sn : circuit.opAmps()) {
            OpAmpParams p = ((OpAmp) circuit.circuit().element(sn.opAmp()).orElseThrow()).params();
            if (!inRange(supply, p)) {
                out.add(range(supply, sn.label(), sn.designPath()));
            }
        }
        return out;
    }

    /** Whether the supply, from its lowest to its highest voltage, stays within the part's specified range. */
    static boolean inRange(Supply supply, OpAmpParams p) {
        return supply.lowVolts() >= p.supplyMinVolts() && supply.highVolts() <= p.supplyMaxVolts();
    }

    private static Finding range(Supply supply, String label, String designPath) {
        return Finding.at(RANGE, Severity.FAIL, label + ": the supply runs from " + Quantities.volts(supply.lowVolts())
                        + " to " + Quantities.volts(supply.highVolts()) + ", outside the op-amp's specified supply range",
                List.of(designPath + ".opAmp", "supply"),
                "choose an op-amp specified for the whole supply range, from fresh to end-point",
                label, LadderLevel.END_POINT_SUPPLY);
    }
}
