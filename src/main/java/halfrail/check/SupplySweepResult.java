package halfrail.check;

import halfrail.design.Design;

import java.util.List;
import java.util.Optional;

/**
 * A design swept over its supply. Immutable: arrays are copied in and out.
 *
 * @param design              the design swept
 * @param supplyVolts         the supply voltages of the sweep, ascending, V
 * @param capacityLeftPercent for a battery, the capacity left at each supply voltage, % (from the
 *                            discharge curve at the per-cell voltage); empty for other supplies
 * @param opAmps              every op-amp, the reference buffer (if any) first, then the stages in chain order
 */
public record SupplySweepResult(Design design, double[] supplyVolts, Optional<double[]> capacityLeftPercent,
                                List<StageSupplySweep> opAmps) {
    public SupplySweepResult {
        supplyVolts = supplyVolts.clone();
        capacityLeftPercent = capacityLeftPercent.map(double[]::clone);
        opAmps = List.copyOf(opAmps);
    }

    @Override
    public double[] supplyVolts() {
        return supplyVolts.clone();
    }

    @Override
    public Optional<double[]> capacityLeftPercent() {
        return capacityLeftPercent.map(double[]::clone);
    }

    /** The op-amp with this label. */
    public Optional<StageSupplySweep> opAmp(String label) {
        return opAmps.stream().filter(s -> s.label().equals(label)).findFirst();
    }
}
