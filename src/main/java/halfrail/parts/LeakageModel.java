package halfrail.parts;

import com.fasterxml.jackson.annotation.JsonSubTypes;
import com.fasterxml.jackson.annotation.JsonTypeInfo;

import java.util.List;

/**
 * The limit a capacitor technology's standard sets on its DC leakage, reduced to a conductance.
 * In the resources the {@code "kind"} field picks the form: {@code "current-limit"} for
 * electrolytics (a current at rated voltage), {@code "insulation"} for ceramics and films (an
 * insulation resistance).
 *
 * <p>Linearisation: a current limit is quoted at rated voltage U_R, so it becomes the
 * conductance I_limit / U_R, and the current at another voltage U is taken as U · I_limit / U_R.
 * Real electrolytic leakage falls faster than linearly below rated voltage (from memory), so in
 * use the linear model overstates leakage — the pessimistic side, which suits checks. An
 * insulation resistance is already a conductance.
 */
@JsonTypeInfo(use = JsonTypeInfo.Id.NAME, include = JsonTypeInfo.As.PROPERTY, property = "kind")
@JsonSubTypes({
        @JsonSubTypes.Type(value = LeakageModel.CurrentLimit.class, name = "current-limit"),
        @JsonSubTypes.Type(value = LeakageModel.Insulation.class, name = "insulation")
})
public sealed interface LeakageModel permits LeakageModel.CurrentLimit, LeakageModel.Insulation {

    /**
     * Leakage conductance at the limit, in S, for a part of {@code farads} F rated
     * {@code ratedVolts} V (both positive and finite).
     */
    double limitSiemens(double farads, double ratedVolts);

    /**
     * Leakage limit as a current at rated voltage: I ≤ max(k · C · U_R, floor). With C in µF,
     * U_R in V and I in µA the usual k is 0.01; in SI units (A, F, V) it is the same number,
     * 0.01 A/(F·V).
     *
     * @param ampsPerFaradVolt k in A/(F·V), positive
     * @param floorAmps        the floor in A below which the limit never falls, not negative
     */
    record CurrentLimit(double ampsPerFaradVolt, double floorAmps) implements LeakageModel {
        public CurrentLimit {
            Require.positive("current-limit leakage", "ampsPerFaradVolt", ampsPerFaradVolt, "A/(F·V)");
            Require.nonNegative("current-limit leakage", "floorAmps", floorAmps, "A");
        }

        /** The limit current at rated voltage, in A: max(k · C · U_R, floor). */
        public double limitAmpsAtRated(double farads, double ratedVolts) {
            checkPart(farads, ratedVolts);
            return Math.max(ampsPerFaradVolt * farads * ratedVolts, floorAmps);
        }

        @Override
        public double limitSiemens(double farads, double ratedVolts) {
            return limitAmpsAtRated(farads, ratedVolts) / ratedVolts;
        }
    }

    /**
     * Minimum insulation resistance R ≥ min(smallCapacitanceOhms, τ / C), where the time
     * constant τ (1 MΩ·µF = 1 s) depends on the rated-voltage band. Large capacitances are held
     * to τ / C; small ones, where τ / C would exceed it, to {@code smallCapacitanceOhms}.
     *
     * @param bands                by rated voltage, ascending, the first starting at 0 V
     * @param smallCapacitanceOhms insulation required of small capacitances, in Ω, positive
     */
    record Insulation(List<Band> bands, double smallCapacitanceOhms) implements LeakageModel {
        public Insulation {
            bands = Require.nonEmpty("insulation leakage", "bands", bands);
            if (bands.get(0).ratedVoltsAtLeast() != 0) {
                throw Require.bad("bands[0].ratedVoltsAtLeast", "insulation leakage: the first band must start at 0 V so every rating has a band, got "
                        + bands.get(0).ratedVoltsAtLeast());
            }
            for (int i = 1; i < bands.size(); i++) {
                if (bands.get(i).ratedVoltsAtLeast() <= bands.get(i - 1).ratedVoltsAtLeast()) {
                    throw Require.bad("bands[" + i + "].ratedVoltsAtLeast", "insulation leakage: bands must be in ascending order of ratedVoltsAtLeast");
                }
            }
            Require.positive("insulation leakage", "smallCapacitanceOhms", smallCapacitanceOhms, "Ω");
        }

        /** The band that applies to a part rated {@code ratedVolts} V: the last one starting at or below it. */
        public Band bandFor(double ratedVolts) {
            Band chosen = bands.get(0);
            for (Band b : bands) {
                if (b.ratedVoltsAtLeast() <= ratedVolts) {
                    chosen = b;
                }
            }
            return chosen;
        }

        /** The minimum insulation resistance in Ω: min(smallCapacitanceOhms, τ / C). */
        public double minimumOhms(double farads, double ratedVolts) {
            checkPart(farads, ratedVolts);
            return Math.min(smallCapacitanceOhms, bandFor(ratedVolts).timeConstantSeconds() / farads);
        }

        @Override
        public double limitSiemens(double farads, double ratedVolts) {
            return 1 / minimumOhms(farads, ratedVolts);
        }

        /**
         * One rated-voltage band.
         *
         * @param ratedVoltsAtLeast   the band covers ratings from this value in V up to the next band
         * @param timeConstantSeconds minimum R·C in s (MΩ·µF), positive
         */
        public record Band(double ratedVoltsAtLeast, double timeConstantSeconds) {
            public Band {
                Require.nonNegative("insulation band", "ratedVoltsAtLeast", ratedVoltsAtLeast, "V");
                Require.positive("insulation band", "timeConstantSeconds", timeConstantSeconds, "s");
            }
        }
    }

    private static void checkPart(double farads, double ratedVolts) {
        Require.positive("capacitor", "farads", farads, "F");
        Require.positive("capacitor", "ratedVolts", ratedVolts, "V");
    }
}
