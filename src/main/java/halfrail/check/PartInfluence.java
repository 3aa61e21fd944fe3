package halfrail.check;

/**
 * How much one varied parameter moves one op-amp's rest point.
 *
 * @param parameterId      the parameter's id (see {@link ToleranceParameter#id()})
 * @param designPath       where it sits in the design
 * @param kind             what it is
 * @param sensitivity      change of the rest point per unit of the parameter, V per the kind's unit:
 *                         a finite difference (secant) between two solves, the parameter at its low
 *                         and at its high value, every other at nominal
 * @param swingVolts       change of the rest point as the parameter goes from its low to its high value, V
 */
public record PartInfluence(String parameterId, String designPath, ToleranceParameter.Kind kind, double sensitivity,
                            double swingVolts) {
}
