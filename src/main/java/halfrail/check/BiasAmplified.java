package halfrail.check;

import halfrail.units.Quantities;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.units.ESeries;

import java.util.List;

/**
 * A stage whose DC gain from the reference is well above 1 amplifies its own bias and drives
 * its output towards a rail: the non-inverting stage without a blocking capacitor in its
 * feedback leg is the usual case.
 */
final class BiasAmplified implements DesignCheck {
    static final String CODE = "BIAS_AMPLIFIED";
    /** DC gain from the reference above which the bias counts as amplified, V/V. */
    static final double LIMIT = 1.5;
    /** The suggested blocking capacitor puts the leg's corner this factor below the band's low end. */
    static final double CORNER_MARGIN = 5;

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        List<Stage> stages = e.design().stages();
        int i = 0;
        for (StageReport s : e.stages()) {
            if (!s.signal()) {
                continue;
            }
            Stage stage = stages.get(i++);
            if (Math.abs(s.biasGain()) > LIMIT) {
                String suggestion;
                List<String> parts;
                if (stage.kind() == StageKind.NON_INVERTING && stage.legCapacitor() == null) {
                    parts = List.of(s.designPath() + ".legCapacitor", s.designPath() + ".legOhms");
                    double c = ESeries.E6.nextHigher(CORNER_MARGIN
                            / (2 * Math.PI * stage.legOhms() * e.design().source().bandLowHz()));
                    suggestion = "put a blocking capacitor of " + Quantities.farads(c) + " (film or ceramic) in series with R1 "
                            + "to ground, so the stage has gain 1 for its bias and " + String.format(java.util.Locale.ROOT,
                            "%.3g", stage.nominalGain()) + " for the signal";
                } else {
                    // An inverting stage DC-coupled from a source at 0 V, or a chain DC-coupled after such a stage.
                    parts = List.of(s.designPath() + ".inputCapacitor");
                    suggestion = "make the stage's DC gain from the reference 1: a capacitor in series with the "
                            + "resistor to ground, or AC coupling between stages";
                }
                out.add(Finding.at(CODE, Severity.FAIL, s.label() + ": the stage multiplies its bias by "
                                + String.format(java.util.Locale.ROOT, "%.3g", s.biasGain())
                                + ", so the reference of " + Quantities.volts(s.inPlusVolts()) + " would become "
                                + Quantities.volts(s.biasGain() * s.inPlusVolts()) + "; the output sits at "
                                + Quantities.volts(s.outputVolts()),
                        parts, suggestion,
                        s.label(), LadderLevel.QUIESCENT));
            }
        }
    }
}
