package halfrail.check;

import halfrail.units.Quantities;
import halfrail.design.ReferenceKind;

import java.util.List;

/** Input bias current flowing through a large bias resistance moves the operating point (shift ≈ Ib·R). */
final class BiasShift implements DesignCheck {
    static final String CODE = "BIAS_CURRENT_SHIFT";

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        double limit = e.thresholds().maxBiasShiftVolts();
        // The bias current flows through the bias resistor, or straight through the divider when there is none.
        List<String> through = e.design().reference().kind() == ReferenceKind.DIVIDER_DIRECT
                ? List.of("reference.upperOhms", "reference.lowerOhms") : List.of("reference.biasOhms");
        for (StageReport s : e.stages()) {
            if (Math.abs(s.biasCurrentShiftVolts()) > limit) {
                out.add(Finding.at(CODE, Severity.WARN, s.label() + ": the op-amps' input bias currents move the "
                                + "non-inverting input by " + Quantities.volts(s.biasCurrentShiftVolts()) + " (limit "
                                + Quantities.volts(limit) + ")",
                        java.util.stream.Stream.concat(through.stream(), java.util.stream.Stream.of(s.designPath() + ".opAmp"))
                                .toList(),
                        "lower the bias resistance (and the divider) or choose an op-amp with lower bias current",
                        s.label(), LadderLevel.MID_RAIL));
            }
        }
    }
}
