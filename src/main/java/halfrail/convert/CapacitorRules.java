package halfrail.convert;

import halfrail.units.Quantities;
import halfrail.design.CapacitorSpec;
import halfrail.design.Supply;
import halfrail.parts.CapacitorTechnology;
import halfrail.parts.LeakageLevel;
import halfrail.parts.PartsLibrary;
import halfrail.units.ESeries;

/**
 * How the conversion picks a capacitor's technology, value and rating.
 *
 * <p>The technology rule, in order: up to {@link #CERAMIC_CLASS_1_MAX_FARADS} a class 1 ceramic
 * (C0G: stable, no DC-bias loss, tiny leakage); up to {@link #FILM_MAX_FARADS} a polyester
 * film part; above that, where a large value is unavoidable, an aluminium electrolytic if its
 * leakage at the standard's limit, flowing through the resistance it meets at DC, moves the
 * bias by no more than {@link #LEAKAGE_SHARE} of the design's leakage-drift limit, else a
 * tantalum part by the same test, else a (large) film part. The feedback leg is a low-leakage
 * spot whatever the value: its leakage flows through R2 and appears at the output, so it gets
 * film or class 1 ceramic only. Ceramic class 2 is never chosen: it loses capacitance under DC
 * bias (EIA-198 class 2 behaviour).
 *
 * <p>Values: E12 for film and ceramic parts, E6 for electrolytic and tantalum parts (their
 * ±20 % tolerance), rounded up so the corner lands at or below its target (IEC 60063).
 * Rating: every part is rated for the supply's highest voltage after the technology's own
 * derating (the smallest standard rating with derating × rating ≥ highest supply): at rest a
 * coupling capacitor holds half the rail and the signal peak adds at most the other half.
 */
final class CapacitorRules {
    /** Largest value given to a class 1 ceramic part, F (common practice: C0G parts are small). */
    static final double CERAMIC_CLASS_1_MAX_FARADS = 10e-9;
    /** Largest value given to a film part by choice, F (common practice: film grows bulky above a few µF). */
    static final double FILM_MAX_FARADS = 4.7e-6;
    /** Share of the design's leakage-drift limit one capacitor's leakage may use. */
    static final double LEAKAGE_SHARE = 0.5;

    /** Where a capacitor sits, which decides whether electrolytics are allowed there. */
    enum Position {
        INPUT(false), LEG(true), OUTPUT(false), REFERENCE(false), BUFFER_OUTPUT(false);

        final boolean lowLeakageOnly;

        Position(boolean lowLeakageOnly) {
            this.lowLeakageOnly = lowLeakageOnly;
        }
    }

    /** A chosen capacitor and the rule that chose it, in words. */
    record Choice(CapacitorSpec spec, String rule) {}

    private CapacitorRules() {}

    /**
     * Choose a capacitor of at least {@code faradsNeeded} F.
     *
     * @param leakOhms         the resistance its leakage current flows through at DC, Ω
     * @param maxDriftVolts    the design's leakage-drift limit, V
     */
    static Choice choose(double faradsNeeded, Position position, double leakOhms, Supply supply,
                         double maxDriftVolts) {
        PartsLibrary parts = PartsLibrary.builtIn();
        double high = supply.highVolts();
        double dc = high / 2;
        if (faradsNeeded <= CERAMIC_CLASS_1_MAX_FARADS) {
            return pick(parts, CapacitorTechnology.CERAMIC_CLASS_1, ESeries.E12, faradsNeeded, high,
                    "class 1 ceramic: at most " + Quantities.farads(CERAMIC_CLASS_1_MAX_FARADS) + ", stable and low-leakage");
        }
        if (faradsNeeded <= FILM_MAX_FARADS) {
            return pick(parts, CapacitorTechnology.POLYESTER_FILM, ESeries.E12, faradsNeeded, high,
                    "film: up to " + Quantities.farads(FILM_MAX_FARADS) + ", negligible leakage");
        }
        if (position.lowLeakageOnly) {
            return pick(parts, CapacitorTechnology.POLYESTER_FILM, ESeries.E12, faradsNeeded, high,
                    "film although large: the feedback leg's leakage would flow through R2 to the output,"
                            + " so it gets film or class 1 ceramic only");
        }
        double allowed = LEAKAGE_SHARE * maxDriftVolts;
        for (String tech : new String[] {CapacitorTechnology.ALUMINIUM_ELECTROLYTIC, CapacitorTechnology.TANTALUM}) {
            CapacitorTechnology t = parts.requireCapacitorTechnology(tech);
            double f = ESeries.E6.nextHigher(faradsNeeded);
            double rated = rating(t, high);
            double shift = t.leakageAmps(f, rated, dc, LeakageLevel.LIMIT) * leakOhms;
            if (shift <= allowed) {
                return new Choice(new CapacitorSpec(f, tech, rated), t.displayName().toLowerCase(java.util.Locale.ROOT)
                        + ": above " + Quantities.farads(FILM_MAX_FARADS) + " a large value is unavoidable, and its limit"
                        + " leakage through " + Quantities.ohms(leakOhms) + " moves the bias by only " + Quantities.volts(shift)
                        + " (allowed " + Quantities.volts(allowed) + ")");
            }
        }
        return pick(parts, CapacitorTechnology.POLYESTER_FILM, ESeries.E12, faradsNeeded, high,
                "film although large: an electrolytic's or tantalum part's limit leakage through "
                        + Quantities.ohms(leakOhms) + " would move the bias by more than " + Quantities.volts(allowed));
    }

    private static Choice pick(PartsLibrary parts, String tech, ESeries series, double farads, double high,
                               String rule) {
        CapacitorTechnology t = parts.requireCapacitorTechnology(tech);
        return new Choice(new CapacitorSpec(series.nextHigher(farads), tech, rating(t, high)), rule);
    }

    /** The smallest standard rating whose derated voltage covers {@code workingVolts}; the highest one if none does. */
    static double rating(CapacitorTechnology t, double workingVolts) {
        return t.smallestRatingFor(workingVolts)
                .orElse(t.standardRatedVolts().get(t.standardRatedVolts().size() - 1));
    }
}
