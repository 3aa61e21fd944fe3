package halfrail.check;

/**
 * One quantity a tolerance study varies, with its nominal value and the range it may take.
 *
 * @param id          unique key, {@code element.quantity} (for example {@code RA.ohms}, {@code U1.offsetVolts},
 *                    {@code CREF.leakage}, {@code board.temperature})
 * @param element     circuit element name, or {@code board} for the temperature
 * @param designPath  where it sits in the design (for example {@code reference.upperOhms})
 * @param kind        what is varied; its unit is {@link Kind#unit()}
 * @param nominalValue value of the nominal build, in the kind's unit
 * @param lowValue    lowest value, in the kind's unit
 * @param highValue   highest value, in the kind's unit
 * @param distribution how a Monte Carlo build draws it
 */
public record ToleranceParameter(String id, String element, String designPath, Kind kind, double nominalValue,
                                 double lowValue, double highValue, Spread distribution) {

    /** What a parameter varies. */
    public enum Kind {
        /** A resistance at 25 °C, Ω. */
        RESISTANCE("Ω"),
        /** A resistor's temperature coefficient, ppm/K. */
        TEMPCO("ppm/K"),
        /** The board's temperature, °C. */
        TEMPERATURE("°C"),
        /** A capacitance, F. */
        CAPACITANCE("F"),
        /** A capacitor's leakage as a fraction of the way from its typical value (0) to its standard's limit (1). */
        LEAKAGE("fraction"),
        /** An op-amp's input offset voltage, V. */
        OFFSET_VOLTS("V"),
        /** An op-amp's input bias current, A. */
        BIAS_AMPS("A"),
        /** An op-amp's input offset current, A. */
        OFFSET_CURRENT_AMPS("A");

        private final String unit;

        Kind(String unit) {
            this.unit = unit;
        }

        public String unit() {
            return unit;
        }
    }

    /**
     * How a parameter is drawn in a Monte Carlo build. Which one applies is the study's choice
     * for {@link #SYMMETRIC} parameters (see {@link MonteCarloOptions.Distribution}); the others
     * are always uniform.
     */
    public enum Spread {
        /**
         * A tolerance around the nominal (resistance, capacitance, offset voltage and current):
         * uniform over the range, or normal with the half-range as 3σ, truncated at ±3σ.
         */
        SYMMETRIC,
        /**
         * A range with no distribution on record (bias current between typical and maximum,
         * leakage between typical and limit, tempco within its bound, temperature over the
         * operating range): uniform over the range.
         */
        UNIFORM
    }

    public ToleranceParameter {
        if (!(lowValue <= nominalValue && nominalValue <= highValue)) {
            throw new IllegalArgumentException(id + ": nominal " + nominalValue + " outside [" + lowValue + ", "
                    + highValue + "]");
        }
    }

    /** Half the range, in the kind's unit. */
    public double halfRange() {
        return 0.5 * (highValue - lowValue);
    }
}
