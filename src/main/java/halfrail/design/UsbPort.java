package halfrail.design;

/**
 * A USB 2.0 port: 4.75–5.25 V at the port (USB 2.0 specification §7.2, via secondary sources);
 * a low-power device should still work at about 4.4 V after cable and connector drop, which is
 * the low end used here.
 *
 * @param rippleVoltsPeak  ripple and noise on the port, V peak (0 for none)
 * @param rippleHz         its frequency, Hz
 */
public record UsbPort(double rippleVoltsPeak, double rippleHz) implements Supply {
    /** Nominal port voltage, V. */
    public static final double NOMINAL_VOLTS = 5.0;
    /** Highest voltage at the port, V. */
    public static final double HIGH_VOLTS = 5.25;
    /** Lowest voltage a low-power device should work down to, V. */
    public static final double LOW_VOLTS = 4.4;
    /** Port and cable resistance assumed, Ω (common practice: a few hundred mΩ). */
    public static final double SOURCE_OHMS = 0.3;

    public UsbPort {
        DesignException.RULES.nonNegative("supply.rippleVoltsPeak", rippleVoltsPeak, "V");
        if (rippleVoltsPeak > 0) {
            DesignException.RULES.positive("supply.rippleHz", rippleHz, "Hz");
        }
    }

    @Override
    public double nominalVolts() {
        return NOMINAL_VOLTS;
    }

    @Override
    public double highVolts() {
        return HIGH_VOLTS;
    }

    @Override
    public double lowVolts() {
        return LOW_VOLTS;
    }

    @Override
    public double internalOhms() {
        return SOURCE_OHMS;
    }

    @Override
    public String safetyNote() {
        return "A USB port limits current; a device that charges cells from it needs a proper charge controller.";
    }
}
