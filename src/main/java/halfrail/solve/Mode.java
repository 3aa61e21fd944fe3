package halfrail.solve;

/** Which form of the circuit equations {@link MnaSystem#evaluate} produces. */
public enum Mode {
    /**
     * The DC operating point: sources at their DC values, capacitors open except for their
     * leakage, each op-amp's internal state equal to its limited open-loop target.
     */
    DC,
    /**
     * The time-domain form: sources at their value at time t, charges q(x) whose time derivative
     * enters the equations, op-amp internal states following a dominant pole with slew limit.
     * The AC sweep linearises this form.
     */
    DYNAMIC
}
