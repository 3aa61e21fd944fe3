package halfrail.parts;

import halfrail.circuit.Capacitor;

import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.Set;

/**
 * A capacitor technology (dielectric family) with the figures the checks need: polarity,
 * usual tolerance, the voltage derating used in checks, the leakage limit of its standard and
 * the series of rated voltages it is sold in. The built-in entries live in
 * {@code halfrail/parts/capacitor-technologies.json}; {@link #basis()} says where each figure
 * comes from.
 *
 * @param id                     stable id, for example {@value #ALUMINIUM_ELECTROLYTIC}
 * @param displayName            name to show people
 * @param polarised              whether reverse DC voltage harms the part
 * @param typicalTolerance       usual capacitance tolerance as a fraction (0.2 is ±20 %)
 * @param voltageDerating        fraction of the rated voltage the checks allow in use (DC plus signal peak)
 * @param leakage                the leakage limit of the technology's standard
 * @param typicalFractionOfLimit typical leakage as a fraction of the limit, in (0, 1]
 * @param standardRatedVolts     rated voltages the technology is commonly sold in, V, ascending
 * @param basis                  per field, where the figure comes from (standard, common practice, memory)
 */
public record CapacitorTechnology(String id, String displayName, boolean polarised, double typicalTolerance,
                                  double voltageDerating, LeakageModel leakage, double typicalFractionOfLimit,
                                  List<Double> standardRatedVolts, Map<String, String> basis) implements PartEntry {

    public static final String ALUMINIUM_ELECTROLYTIC = "aluminium-electrolytic";
    public static final String TANTALUM = "tantalum";
    public static final String CERAMIC_CLASS_1 = "ceramic-class-1";
    public static final String CERAMIC_CLASS_2 = "ceramic-class-2";
    public static final String POLYESTER_FILM = "polyester-film";
    public static final String POLYPROPYLENE_FILM = "polypropylene-film";

    private static final Set<String> BASIS_FIELDS = Set.of("polarised", "typicalTolerance", "voltageDerating",
            "leakage", "typicalFractionOfLimit", "standardRatedVolts");
    private static final Set<String> BASIS_REQUIRED = Set.of("typicalTolerance", "voltageDerating", "leakage",
            "typicalFractionOfLimit", "standardRatedVolts");

    public CapacitorTechnology {
        Require.id("capacitor technology", id);
        String owner = "capacitor technology " + id;
        Require.text(owner, "displayName", displayName);
        Require.fraction(owner, "typicalTolerance", typicalTolerance, true);
        Require.fraction(owner, "voltageDerating", voltageDerating, false);
        if (leakage == null) {
            throw Require.bad("leakage", owner + ": leakage is missing");
        }
        Require.fraction(owner, "typicalFractionOfLimit", typicalFractionOfLimit, false);
        standardRatedVolts = Require.nonEmpty(owner, "standardRatedVolts", standardRatedVolts);
        double previous = 0;
        for (double v : standardRatedVolts) {
            Require.positive(owner, "standardRatedVolts", v, "V");
            if (v <= previous) {
                throw Require.bad("standardRatedVolts", owner + ": standardRatedVolts must be strictly ascending, got " + standardRatedVolts);
            }
            previous = v;
        }
        basis = Require.basis(owner, basis, BASIS_FIELDS, BASIS_REQUIRED);
    }

    /**
     * The leakage conductance in S to put on a {@link Capacitor} of {@code farads} F rated
     * {@code ratedVolts} V: zero for {@link LeakageLevel#NONE}, the standard's limit for
     * {@link LeakageLevel#LIMIT} (a current limit quoted at rated voltage becomes I / U_R, see
     * {@link LeakageModel}), and {@link #typicalFractionOfLimit()} of that for
     * {@link LeakageLevel#TYPICAL}.
     */
    public double leakageSiemens(double farads, double ratedVolts, LeakageLevel level) {
        if (level == null) {
            throw Require.bad(id + ": leakage level is missing");
        }
        double limit = leakage.limitSiemens(farads, ratedVolts);
        return switch (level) {
            case NONE -> 0;
            case TYPICAL -> typicalFractionOfLimit * limit;
            case LIMIT -> limit;
        };
    }

    /**
     * Leakage current in A (a magnitude) through a part of {@code farads} F rated
     * {@code ratedVolts} V with {@code appliedVolts} V across it: the conductance of
     * {@link #leakageSiemens} times |appliedVolts|. At rated voltage and {@link LeakageLevel#LIMIT}
     * this is the standard's limit current. Reverse voltage on a polarised part is a fault the
     * checks report; this model does not describe it.
     */
    public double leakageAmps(double farads, double ratedVolts, double appliedVolts, LeakageLevel level) {
        Require.finite(id, "appliedVolts", appliedVolts, "V");
        return leakageSiemens(farads, ratedVolts, level) * Math.abs(appliedVolts);
    }

    /** The highest voltage in V the checks allow across a part rated {@code ratedVolts} V. */
    public double deratedVolts(double ratedVolts) {
        Require.positive(id, "ratedVolts", ratedVolts, "V");
        return voltageDerating * ratedVolts;
    }

    /**
     * The lowest standard rated voltage, in V, whose derated voltage covers {@code workingVolts}
     * (DC plus signal peak, in V); empty when even the highest standard rating is too low.
     */
    public OptionalDouble smallestRatingFor(double workingVolts) {
        Require.nonNegative(id, "workingVolts", workingVolts, "V");
        for (double rated : standardRatedVolts) {
            if (voltageDerating * rated >= workingVolts) {
                return OptionalDouble.of(rated);
            }
        }
        return OptionalDouble.empty();
    }

    /**
     * A circuit capacitor of this technology: its id as the technology, its polarity and
     * typical tolerance, the given rating, and the leakage conductance of {@code level}.
     *
     * @param plus the positive terminal for a polarised part
     */
    public Capacitor toCapacitor(String name, String plus, String minus, double farads, double ratedVolts,
                                 LeakageLevel level) {
        return new Capacitor(name, plus, minus, farads, typicalTolerance, id, ratedVolts, polarised,
                leakageSiemens(farads, ratedVolts, level));
    }
}
