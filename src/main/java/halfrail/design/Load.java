package halfrail.design;

/**
 * What the last stage drives.
 *
 * @param ohms           load resistance to ground, Ω
 * @param farads         load capacitance to ground, F (0 for none)
 * @param outputCapacitor coupling capacitor between the last stage and the load; null for a
 *                       DC-coupled load (the load then draws the quiescent output's current)
 */
public record Load(double ohms, double farads, CapacitorSpec outputCapacitor) {
    public Load {
        DesignException.RULES.positive("load.ohms", ohms, "Ω");
        DesignException.RULES.nonNegative("load.farads", farads, "F");
    }
}
