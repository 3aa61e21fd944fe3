package halfrail.design;

/** How a signal level is stated. Conversions: standard definitions (0 dBu = 0.7746 V rms, 0 dBV = 1 V rms). */
public enum AmplitudeUnit {
    /** Volts peak. */
    VOLTS_PEAK,
    /** Volts rms of a sine. */
    VOLTS_RMS,
    /** dB relative to 0.7746 V rms (√0.6 V, 1 mW in 600 Ω). */
    DBU,
    /** dB relative to 1 V rms. */
    DBV;

    /** 0 dBu in V rms: √0.6. */
    public static final double DBU_REFERENCE_VRMS = Math.sqrt(0.6);

    /** The peak voltage of a sine of {@code amount} in this unit, V. */
    public double toVoltsPeak(double amount) {
        return switch (this) {
            case VOLTS_PEAK -> amount;
            case VOLTS_RMS -> amount * Math.sqrt(2);
            case DBU -> DBU_REFERENCE_VRMS * Math.pow(10, amount / 20) * Math.sqrt(2);
            case DBV -> Math.pow(10, amount / 20) * Math.sqrt(2);
        };
    }
}
