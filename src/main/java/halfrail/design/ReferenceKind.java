package halfrail.design;

/** How the mid-rail reference reaches the stages. */
public enum ReferenceKind {
    /**
     * The divider's mid point goes straight into the non-inverting input of the stage it biases.
     * Only one stage may put signal on that node; see {@link DesignCircuits} for the rule.
     */
    DIVIDER_DIRECT,
    /** The divider's mid point is decoupled by a capacitor and feeds each stage through a bias resistor. */
    DIVIDER_DECOUPLED,
    /**
     * The decoupled divider drives a follower; the follower's output, through an isolation resistor
     * and a second decoupling capacitor, feeds each stage through a bias resistor.
     */
    DIVIDER_BUFFERED
}
