package halfrail.convert;

import halfrail.check.DesignReport;
import halfrail.check.Severity;
import halfrail.design.Design;

import java.util.List;

/**
 * What a conversion produced.
 *
 * @param request          what was asked
 * @param design           the single-supply design, ready to open and edit
 * @param report           the engine's full analysis of that design (power-on included)
 * @param comparison       the original and the conversion side by side
 * @param changes          every change made, and why, in the order made
 * @param conflicts        every limit that could not be met, with the one that won
 * @param tradeOff         lower corner against settle-up time over a range of capacitor choices,
 *                         lowest target corner first, each point analysed by the engine
 * @param cornerIterations how many design–analyse rounds the corner took (at most {@link Converter#MAX_CORNER_ITERATIONS})
 */
public record ConversionResult(ConversionRequest request, Design design, DesignReport report, Comparison comparison,
                               List<Change> changes, List<Conflict> conflicts, List<TradeOffPoint> tradeOff,
                               int cornerIterations) {
    public ConversionResult {
        changes = List.copyOf(changes);
        conflicts = List.copyOf(conflicts);
        tradeOff = List.copyOf(tradeOff);
    }

    /** Whether the converted design's analysis has a failing finding. */
    public boolean hasFailingFinding() {
        return report.has(Severity.FAIL);
    }

    /** Whether every limit was met (no conflicts). */
    public boolean limitsMet() {
        return conflicts.isEmpty();
    }

    /** Whether the conversion is clean: no failing finding and every limit met. */
    public boolean succeeded() {
        return !hasFailingFinding() && limitsMet();
    }
}
