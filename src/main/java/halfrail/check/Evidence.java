package halfrail.check;

import halfrail.design.Design;
import halfrail.design.DesignCircuit;
import halfrail.design.Thresholds;

import java.util.List;
import java.util.Optional;

/**
 * What the checks look at: the design, its circuit, and the computed reports. Every number
 * here was produced by the engine; the checks only compare and explain.
 */
record Evidence(Design design, DesignCircuit circuit, List<StageReport> stages, List<CapacitorReport> capacitors,
                ChainReport chain, Optional<PowerOnReport> powerOn, BatteryReport battery) {

    Thresholds thresholds() {
        return design.thresholds();
    }

    double sourcePeakVolts() {
        return design.source().voltsPeak();
    }
}
