package halfrail.design;

/**
 * Where one op-amp of a design sits in its circuit: element and node names.
 *
 * @param label      the stage's name in the design, or {@code "reference buffer"}
 * @param designPath the design path of the stage (for example {@code stages[0]}) or of the buffer
 * @param opAmp      the op-amp's element name
 * @param inPlus     node of the non-inverting input
 * @param inMinus    node of the inverting input
 * @param out        node of the output
 * @param signal     whether the stage carries the signal (false for the reference buffer)
 * @param input      node where the stage's signal arrives: the non-inverting input of a
 *                   non-inverting stage or follower, the far end of R1 of an inverting stage
 */
public record StageNodes(String label, String designPath, String opAmp, String inPlus, String inMinus, String out,
                         boolean signal, String input) {
}
