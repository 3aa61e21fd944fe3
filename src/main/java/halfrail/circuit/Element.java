package halfrail.circuit;

import java.util.List;

/** A circuit element: a named part whose terminals connect to named nodes. */
public sealed interface Element permits Resistor, Capacitor, VoltageSource, CurrentSource, OpAmp {
    /** The element's unique name within its circuit, for example {@code "R2"}. */
    String name();

    /** The nodes the element's terminals connect to, in the element's own terminal order. */
    List<String> terminals();
}
