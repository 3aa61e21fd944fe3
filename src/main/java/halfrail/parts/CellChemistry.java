package halfrail.parts;

import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * A cell chemistry (in one common size) as planning data: per-cell voltages, capacity,
 * internal resistance and a light-load discharge curve. A unit is what a user puts in a
 * holder: one cell, or a block of {@link #cellsPerUnit()} cells in series (a 9 V block holds
 * six). The built-in entries live in {@code halfrail/parts/cell-chemistries.json}.
 *
 * <p>Safety: these are planning values; the cell maker's data governs. Lithium cells need a
 * protection circuit and must be charged and discharged only within the cell maker's limits;
 * follow local regulations. {@link #safetyNote()} says so for each entry.
 *
 * @param id                stable id, for example {@value #LI_ION}
 * @param displayName       name to show people
 * @param cellsPerUnit      cells in series inside one unit, at least 1
 * @param freshVolts        open-circuit voltage of a fresh (or fully charged) cell, V
 * @param nominalVolts      nominal cell voltage, V
 * @param endPointVolts     end-point (cut-off) cell voltage these figures assume, V
 * @param capacityAmpHours  capacity of one unit to the end-point at low drain, in A·h
 * @param internalOhms      typical internal resistance of one cell, fresh, in Ω
 * @param dischargeCurve    cell voltage against fraction used: from (0, fresh) to (1, end-point),
 *                          fractions strictly rising, volts strictly falling; interpolated linearly
 * @param safetyNote        cautions to show wherever the chemistry is offered
 * @param basis             per field, where the figures come from
 */
public record CellChemistry(String id, String displayName, int cellsPerUnit, double freshVolts, double nominalVolts,
                            double endPointVolts, double capacityAmpHours, double internalOhms,
                            List<DischargePoint> dischargeCurve, String safetyNote, Map<String, String> basis)
        implements PartEntry {

    public static final String ALKALINE_AA = "alkaline-aa";
    public static final String ALKALINE_9V_BLOCK = "alkaline-9v-block";
    public static final String NIMH_AA = "nimh-aa";
    public static final String LI_ION = "li-ion";
    public static final String LIFEPO4 = "lifepo4";

    /** Largest difference in V allowed between a curve end and the fresh or end-point voltage. */
    public static final double CURVE_END_TOLERANCE_VOLTS = 1e-9;

    private static final Set<String> BASIS_FIELDS = Set.of("cellsPerUnit", "voltages", "capacityAmpHours",
            "internalOhms", "dischargeCurve");
    private static final Set<String> BASIS_REQUIRED = Set.of("voltages", "capacityAmpHours", "internalOhms",
            "dischargeCurve");

    public CellChemistry {
        Require.id("cell chemistry", id);
        String owner = "cell chemistry " + id;
        Require.text(owner, "displayName", displayName);
        if (cellsPerUnit < 1) {
            throw Require.bad("cellsPerUnit", owner + ": cellsPerUnit must be at least 1, got " + cellsPerUnit);
        }
        Require.positive(owner, "freshVolts", freshVolts, "V");
        Require.positive(owner, "nominalVolts", nominalVolts, "V");
        Require.positive(owner, "endPointVolts", endPointVolts, "V");
        if (!(endPointVolts < nominalVolts && nominalVolts <= freshVolts)) {
            throw Require.bad("nominalVolts", owner + ": voltages must satisfy endPointVolts < nominalVolts <= freshVolts, got "
                    + endPointVolts + ", " + nominalVolts + ", " + freshVolts);
        }
        Require.positive(owner, "capacityAmpHours", capacityAmpHours, "A·h");
        Require.nonNegative(owner, "internalOhms", internalOhms, "Ω");
        dischargeCurve = Require.nonEmpty(owner, "dischargeCurve", dischargeCurve);
        checkCurve(owner, dischargeCurve, freshVolts, endPointVolts);
        Require.text(owner, "safetyNote", safetyNote);
        basis = Require.basis(owner, basis, BASIS_FIELDS, BASIS_REQUIRED);
    }

    private static void checkCurve(String owner, List<DischargePoint> curve, double fresh, double end) {
        if (curve.size() < 2) {
            throw Require.bad("dischargeCurve", owner + ": dischargeCurve needs at least two points");
        }
        DischargePoint first = curve.get(0);
        DischargePoint last = curve.get(curve.size() - 1);
        if (first.fractionUsed() != 0 || last.fractionUsed() != 1) {
            throw Require.bad("dischargeCurve", owner + ": dischargeCurve must run from fractionUsed 0 to 1");
        }
        if (Math.abs(first.volts() - fresh) > CURVE_END_TOLERANCE_VOLTS
                || Math.abs(last.volts() - end) > CURVE_END_TOLERANCE_VOLTS) {
            throw Require.bad("dischargeCurve", owner + ": dischargeCurve must start at freshVolts (" + fresh
                    + " V) and end at endPointVolts (" + end + " V)");
        }
        for (int i = 1; i < curve.size(); i++) {
            DischargePoint a = curve.get(i - 1);
            DischargePoint b = curve.get(i);
            if (!(b.fractionUsed() > a.fractionUsed()) || !(b.volts() < a.volts())) {
                throw Require.bad("dischargeCurve[" + i + "]", owner + ": dischargeCurve point " + i
                        + " must have a larger fractionUsed and a lower voltage than the point before");
            }
        }
    }

    /**
     * Cell voltage in V after {@code fractionUsed} (0 to 1) of the capacity is delivered,
     * interpolated linearly between curve points.
     */
    public double voltsAt(double fractionUsed) {
        Require.fraction(id, "fractionUsed", fractionUsed, true);
        for (int i = 1; i < dischargeCurve.size(); i++) {
            DischargePoint a = dischargeCurve.get(i - 1);
            DischargePoint b = dischargeCurve.get(i);
            if (fractionUsed <= b.fractionUsed()) {
                double t = (fractionUsed - a.fractionUsed()) / (b.fractionUsed() - a.fractionUsed());
                return a.volts() + t * (b.volts() - a.volts());
            }
        }
        return endPointVolts;
    }

    /**
     * The fraction of capacity used (0 to 1) when a cell reads {@code volts} V on the curve: the
     * inverse of {@link #voltsAt}. Voltages above fresh give 0, below the end-point give 1.
     */
    public double fractionUsedAt(double volts) {
        Require.finite(id, "volts", volts, "V");
        if (volts >= freshVolts) {
            return 0;
        }
        if (volts <= endPointVolts) {
            return 1;
        }
        for (int i = 1; i < dischargeCurve.size(); i++) {
            DischargePoint a = dischargeCurve.get(i - 1);
            DischargePoint b = dischargeCurve.get(i);
            if (volts >= b.volts()) {
                double t = (a.volts() - volts) / (a.volts() - b.volts());
                return a.fractionUsed() + t * (b.fractionUsed() - a.fractionUsed());
            }
        }
        return 1;
    }

    /** Open-circuit-ish voltage of one unit in V after {@code fractionUsed} of its capacity. */
    public double unitVoltsAt(double fractionUsed) {
        return cellsPerUnit * voltsAt(fractionUsed);
    }

    /**
     * Terminal voltage of one unit in V after {@code fractionUsed} of its capacity while it
     * delivers {@code loadAmps} A: the curve voltage less the drop across the internal
     * resistance (fresh-cell figure; it grows towards the end-point).
     */
    public double unitVoltsUnderLoad(double fractionUsed, double loadAmps) {
        Require.nonNegative(id, "loadAmps", loadAmps, "A");
        return unitVoltsAt(fractionUsed) - loadAmps * unitInternalOhms();
    }

    /** Fresh open-circuit voltage of one unit, V. */
    public double unitFreshVolts() {
        return cellsPerUnit * freshVolts;
    }

    /** Nominal voltage of one unit, V. */
    public double unitNominalVolts() {
        return cellsPerUnit * nominalVolts;
    }

    /** End-point voltage of one unit, V. */
    public double unitEndPointVolts() {
        return cellsPerUnit * endPointVolts;
    }

    /** Internal resistance of one unit (its cells in series), Ω. */
    public double unitInternalOhms() {
        return cellsPerUnit * internalOhms;
    }
}
