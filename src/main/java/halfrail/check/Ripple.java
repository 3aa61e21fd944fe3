package halfrail.check;

import halfrail.units.Quantities;
import halfrail.design.ReferenceKind;

import java.util.List;

/**
 * Supply ripple reaching the load. A divider straight into an input carries the ripple
 * unfiltered and the stage amplifies it by its full signal gain; a decoupled or buffered
 * reference with a bias resistor avoids that.
 */
final class Ripple implements DesignCheck {
    static final String CODE = "RIPPLE_AT_OUTPUT";

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        ChainReport ch = e.chain();
        double limit = e.thresholds().maxRippleVolts();
        if (ch.rippleAtLoadVolts() <= limit) {
            return;
        }
        boolean direct = e.design().reference().kind() == ReferenceKind.DIVIDER_DIRECT;
        out.add(Finding.of(CODE, Severity.WARN, "supply ripple of " + Quantities.volts(e.design().supply().rippleVoltsPeak())
                        + " at " + Quantities.hertz(e.design().supply().rippleHz()) + " reaches the load as "
                        + Quantities.volts(ch.rippleAtLoadVolts()) + " peak (gain " + String.format(java.util.Locale.ROOT,
                        "%.3g", ch.rippleGain()) + "; limit " + Quantities.volts(limit) + ")",
                List.of("reference"), direct
                        ? "decouple the divider's mid point with a capacitor and feed the stage through a bias resistor"
                        : "raise the reference decoupling capacitor, or buffer the reference"));
    }
}
