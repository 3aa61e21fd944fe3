package halfrail.design;

/**
 * A regulated or adapter rail of fixed nominal voltage.
 *
 * @param volts            nominal voltage, V
 * @param tolerance        relative tolerance as a fraction (0.05 = ±5 %)
 * @param rippleVoltsPeak  supply ripple amplitude, V peak (0 for none)
 * @param rippleHz         ripple frequency, Hz (ignored when there is no ripple)
 * @param sourceOhms       the rail's output resistance, Ω
 */
public record FixedRail(double volts, double tolerance, double rippleVoltsPeak, double rippleHz, double sourceOhms)
        implements Supply {
    public FixedRail {
        DesignException.RULES.positive("supply.volts", volts, "V");
        DesignException.RULES.fraction("supply.tolerance", tolerance);
        DesignException.RULES.nonNegative("supply.rippleVoltsPeak", rippleVoltsPeak, "V");
        if (rippleVoltsPeak > 0) {
            DesignException.RULES.positive("supply.rippleHz", rippleHz, "Hz");
        }
        DesignException.RULES.nonNegative("supply.sourceOhms", sourceOhms, "Ω");
    }

    @Override
    public double nominalVolts() {
        return volts;
    }

    @Override
    public double highVolts() {
        return volts * (1 + tolerance);
    }

    @Override
    public double lowVolts() {
        return volts * (1 - tolerance);
    }

    @Override
    public double internalOhms() {
        return sourceOhms;
    }

    @Override
    public String safetyNote() {
        return "If this rail comes from a mains adapter, use a certified adapter rated for the load; "
                + "mains wiring is for licensed practice under local codes.";
    }
}
