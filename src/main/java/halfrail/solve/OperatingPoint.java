package halfrail.solve;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The DC operating point of a circuit: every node voltage, every source and op-amp current,
 * and each op-amp's state. Immutable; arrays are copied in and out.
 *
 * @param strategy    how the solution was reached
 * @param iterations  total Newton iterations spent, over every strategy tried
 */
public record OperatingPoint(MnaSystem system, double[] solution, Map<String, Double> nodeVolts,
                             Map<String, Double> branchAmps, List<OpAmpState> opAmps,
                             Strategy strategy, int iterations, double maxKclResidualAmps) {

    /** How Newton's method was brought to converge. */
    public enum Strategy {
        /** Newton from the linearised starting point (or from the caller's guess). */
        NEWTON,
        /**
         * Newton from the result of the DC solver's limiter active-set search: op-amps held
         * linear or clamped, one mode change at a time, until the modes are consistent.
         */
        LIMITER_ACTIVE_SET,
        /** Newton along a path of op-amp open-loop gains raised from about 1 to their real values. */
        GAIN_STEPPING,
        /** Newton with a shunt conductance on every node, stepped down to zero. */
        GMIN_STEPPING,
        /** Newton with all independent sources ramped up from zero. */
        SOURCE_STEPPING,
        /**
         * Damped Newton steps marching in pseudo-time (a pseudo-capacitance on every node and
         * op-amp state, shrinking as the residual falls), then Newton: the last resort.
         */
        PSEUDO_TRANSIENT
    }

    public OperatingPoint {
        solution = solution.clone();
        nodeVolts = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(nodeVolts));
        branchAmps = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(branchAmps));
        opAmps = List.copyOf(opAmps);
    }

    @Override
    public double[] solution() {
        return solution.clone();
    }

    /** Voltage of {@code node} in V; 0 for ground. @throws AnalysisException BAD_REQUEST for an unknown node */
    public double voltage(String node) {
        return system.voltage(solution, node);
    }

    /**
     * Branch current of a voltage source (out of its plus terminal into the circuit) or an
     * op-amp's output current, in A.
     */
    public double current(String element) {
        return solution[system.branchIndex(element)];
    }

    public Optional<OpAmpState> opAmp(String name) {
        return opAmps.stream().filter(o -> o.name().equals(name)).findFirst();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof OperatingPoint p && Arrays.equals(solution, p.solution) && system == p.system;
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(solution);
    }

    @Override
    public String toString() {
        return "OperatingPoint" + nodeVolts;
    }
}
