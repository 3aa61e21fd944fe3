package halfrail.parts;

/**
 * One point of a cell's discharge curve.
 *
 * @param fractionUsed fraction of the rated capacity delivered so far, 0 (fresh) to 1 (end-point)
 * @param volts        open-circuit-ish cell voltage at light load, in V
 */
public record DischargePoint(double fractionUsed, double volts) {
    public DischargePoint {
        Require.fraction("discharge point", "fractionUsed", fractionUsed, true);
        Require.positive("discharge point", "volts", volts, "V");
    }
}
