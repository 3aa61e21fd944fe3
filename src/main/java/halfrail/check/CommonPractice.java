package halfrail.check;

import halfrail.units.Quantities;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.units.ESeries;

import java.util.List;

/**
 * Rules of the trade with no single published source (common practice): keep the feedback
 * resistor at or below about 100 kΩ; keep one stage's gain at or below about 50.
 */
final class CommonPractice implements DesignCheck {
    static final String FEEDBACK = "FEEDBACK_RESISTANCE_HIGH";
    static final String GAIN = "STAGE_GAIN_HIGH";

    @Override
    public void inspect(Evidence e, List<Finding> out) {
        List<Stage> stages = e.design().stages();
        List<StageReport> reports = e.stages().stream().filter(StageReport::signal).toList();
        for (int i = 0; i < stages.size(); i++) {
            Stage st = stages.get(i);
            StageReport r = reports.get(i);
            if (st.kind() != StageKind.FOLLOWER && st.feedbackOhms() > e.thresholds().maxFeedbackOhms()) {
                double scale = e.thresholds().maxFeedbackOhms() / st.feedbackOhms();
                out.add(Finding.at(FEEDBACK, Severity.WARN, r.label() + ": the feedback resistor R2 is "
                                + Quantities.ohms(st.feedbackOhms()) + ", above the usual ceiling of "
                                + Quantities.ohms(e.thresholds().maxFeedbackOhms()) + " (common practice): bias current, "
                                + "leakage and noise all grow with it",
                        List.of(r.designPath() + ".feedbackOhms"),
                        "scale R2 and R1 down together: R2 = " + Quantities.ohms(ESeries.E24.nearest(st.feedbackOhms() * scale))
                                + ", R1 = " + Quantities.ohms(ESeries.E24.nearest(st.legOhms() * scale))
                                + " keeps the gain; raise the leg capacitor in proportion",
                        r.label(), null));
            }
            if (r.stageGain() > e.thresholds().maxStageGain()) {
                out.add(Finding.at(GAIN, Severity.WARN, r.label() + ": one stage has a gain of "
                                + String.format(java.util.Locale.ROOT, "%.3g", r.stageGain()) + ", above "
                                + String.format(java.util.Locale.ROOT, "%.3g", e.thresholds().maxStageGain())
                                + " (common practice: 10–20 is comfortable, about 50 a ceiling)",
                        List.of(r.designPath()), "split the gain over two stages", r.label(), null));
            }
        }
    }
}
