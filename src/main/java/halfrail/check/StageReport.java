package halfrail.check;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * One op-amp of a design, analysed. Voltages in V, gains in V/V, frequencies in Hz.
 *
 * @param label              the stage's name (or "reference buffer")
 * @param designPath         the stage's design path
 * @param opAmp              the op-amp's element name in the circuit
 * @param signal             whether it carries the signal (false for the reference buffer)
 * @param inPlusVolts        non-inverting input at rest (nominal supply)
 * @param inMinusVolts       inverting input at rest
 * @param commonModeLowVolts lowest usable input voltage at the nominal supply
 * @param commonModeHighVolts highest usable input voltage at the nominal supply
 * @param commonModeOkAtRest whether both inputs lie in the common-mode range at rest
 * @param inputSignalPeakVolts peak of the nominal signal at the non-inverting input: the linear figure times
 *                           {@code driveFactor} (see {@link DesignAnalysis}: behind a clipping stage the input
 *                           cannot swing further than that stage's output)
 * @param commonModeOkAtPeaks whether the non-inverting input stays in range at the signal peaks
 * @param nominal            swing at the nominal supply; its signal peak is the demanded peak, the linear figure
 *                           times {@code driveFactor} (unclipped by this stage's own window, so that the headroom
 *                           says how far over it the stage is asked to go)
 * @param endPoint           swing at the lowest supply (battery end-point, low tolerance)
 * @param fresh              swing at the highest supply (fresh battery, high tolerance)
 * @param stageGain          the stage's own signal gain in the band (output over its input node), V/V magnitude
 * @param biasGain           DC gain from the reference to the output with the op-amp taken as linear;
 *                           1 for a correctly built stage, 1 + R2/R1 when the bias is amplified
 * @param leakageDriftVolts  output shift between leak-free capacitors and every capacitor at its limit leakage
 * @param leakageDriftByCapacitor the same shift with only one capacitor leaking at its limit, by element name
 * @param biasCurrentShiftVolts shift of the non-inverting input caused by the op-amps' input bias currents
 * @param fullPowerHz        frequency at which the slew rate limits the nominal output swing: SR/(2π·Vpeak), Vpeak the
 *                           swing the output makes ({@link SwingReport#deliveredPeakVolts()}), Hz;
 *                           empty when the output carries no signal (nothing to slew)
 * @param supplyInRange      whether the supply, over its whole range, stays within the op-amp's specified range
 * @param driveFactor        the fraction of the linear drive that reaches this stage, 0 to 1: the product of the
 *                           clip factors min(1, E/P) of the signal stages before it (1 when none clips; 1 for the
 *                           reference buffer). See {@link DesignAnalysis}
 * @param drivenByClipped    the label of the first stage before this one that clips, when its figures are
 *                           reduced for that reason (empty: they are the linear figures)
 * @param findingsCodes      codes of the findings that concern this op-amp
 */
public record StageReport(String label, String designPath, String opAmp, boolean signal,
                          double inPlusVolts, double inMinusVolts,
                          double commonModeLowVolts, double commonModeHighVolts, boolean commonModeOkAtRest,
                          double inputSignalPeakVolts, boolean commonModeOkAtPeaks,
                          SwingReport nominal, SwingReport endPoint, SwingReport fresh,
                          double stageGain, double biasGain, double leakageDriftVolts,
                          Map<String, Double> leakageDriftByCapacitor, double biasCurrentShiftVolts,
                          OptionalDouble fullPowerHz, boolean supplyInRange, double driveFactor,
                          Optional<String> drivenByClipped, List<String> findingsCodes) {
    public StageReport {
        leakageDriftByCapacitor = Map.copyOf(leakageDriftByCapacitor);
        findingsCodes = List.copyOf(findingsCodes);
    }

    /** The output at rest at the nominal supply, V. */
    public double outputVolts() {
        return nominal.quiescentVolts();
    }

    StageReport withFindings(List<String> codes) {
        return new StageReport(label, designPath, opAmp, signal, inPlusVolts, inMinusVolts, commonModeLowVolts,
                commonModeHighVolts, commonModeOkAtRest, inputSignalPeakVolts, commonModeOkAtPeaks, nominal, endPoint,
                fresh, stageGain, biasGain, leakageDriftVolts, leakageDriftByCapacitor, biasCurrentShiftVolts,
                fullPowerHz, supplyInRange, driveFactor, drivenByClipped, codes);
    }
}
