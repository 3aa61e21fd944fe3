package halfrail.check;

import halfrail.units.Quantities;
import java.util.List;
import java.util.Map;

/**
 * Capacitor leakage drags the operating point: leakage through the feedback-leg capacitor must
 * be supplied through R2, moving the output by about I_leak·R2. Measured here as the output
 * shift between leak-free capacitors and every capacitor at its limit leakage.
 */
final class LeakageDrift implements DesignCheck {
    static final String CODE = "LEAKAGE_DRIFT";

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        double limit = e.thresholds().maxLeakageDriftVolts();
        for (StageReport s : e.stages()) {
            if (Math.abs(s.leakageDriftVolts()) <= limit) {
                continue;
            }
            String worst = null;
            double worstShift = 0;
            for (Map.Entry<String, Double> en : s.leakageDriftByCapacitor().entrySet()) {
                if (Math.abs(en.getValue()) > Math.abs(worstShift)) {
                    worst = en.getKey();
                    worstShift = en.getValue();
                }
            }
            String path = worst == null ? s.designPath() : e.circuit().designPath(worst);
            out.add(Finding.at(CODE, Severity.WARN, s.label() + ": capacitor leakage at its limit moves the output by "
                            + Quantities.volts(s.leakageDriftVolts()) + " (limit " + Quantities.volts(limit) + ")"
                            + (worst == null ? "" : "; " + worst + " alone accounts for " + Quantities.volts(worstShift)),
                    worst == null ? List.of(s.designPath()) : List.of(path),
                    "use a low-leakage dielectric there (polyester or polypropylene film, C0G ceramic) instead of an "
                            + "electrolytic, or lower the feedback resistance that the leakage current flows through",
                    s.label(), LadderLevel.LEAKAGE_SHIFT));
        }
    }
}
