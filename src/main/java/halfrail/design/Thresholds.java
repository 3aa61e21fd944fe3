package halfrail.design;

/**
 * The limits the checks apply, kept in the design so that a reviewer can tighten them.
 * {@link #defaults()} gives the values Halfrail starts from; the ones marked "common practice"
 * are rules of the trade with no single published source.
 *
 * @param settleBandFraction   settle-up band as a fraction of the supply voltage (default 1 %)
 * @param maxSettleSeconds     settle-up time limit, s (default 2 s)
 * @param minHeadroomDb        smallest acceptable headroom at the nominal signal, dB (default 3 dB)
 * @param offCentreDb          headroom lost to an off-centre quiescent point above which a warning is raised, dB (default 1 dB)
 * @param nearRailFraction     an output at rest within this fraction of its swing window from a limit counts as at a rail (default 5 %)
 * @param maxLeakageDriftVolts largest acceptable output drift from capacitor leakage, V (default 0.1 V)
 * @param maxRippleVolts       largest acceptable supply ripple at the output, V peak (default 1 mV)
 * @param maxBiasShiftVolts    largest acceptable shift of a bias point by input bias current, V (default 0.05 V)
 * @param maxStepVolts         largest acceptable power-on step into the load, V (default 1 V)
 * @param maxStageGain         gain above which one stage is flagged, V/V (default 50, common practice)
 * @param maxFeedbackOhms      feedback resistance above which a stage is flagged, Ω (default 100 kΩ, common practice)
 * @param minRuntimeHours      runtime target on the supply's capacity, h (0: none)
 * @param capacitorDeratingOverride if positive, replaces every technology's derating fraction
 */
public record Thresholds(double settleBandFraction, double maxSettleSeconds, double minHeadroomDb,
                         double offCentreDb, double nearRailFraction, double maxLeakageDriftVolts,
                         double maxRippleVolts, double maxBiasShiftVolts, double maxStepVolts,
                         double maxStageGain, double maxFeedbackOhms, double minRuntimeHours,
                         double capacitorDeratingOverride) {

    public Thresholds {
        DesignException.RULES.positive("thresholds.settleBandFraction", settleBandFraction, "");
        DesignException.RULES.positive("thresholds.maxSettleSeconds", maxSettleSeconds, "s");
        if (!Double.isFinite(minHeadroomDb)) {
            throw new DesignException("thresholds.minHeadroomDb", "must be finite");
        }
        DesignException.RULES.nonNegative("thresholds.offCentreDb", offCentreDb, "dB");
        DesignException.RULES.fraction("thresholds.nearRailFraction", nearRailFraction);
        DesignException.RULES.positive("thresholds.maxLeakageDriftVolts", maxLeakageDriftVolts, "V");
        DesignException.RULES.positive("thresholds.maxRippleVolts", maxRippleVolts, "V");
        DesignException.RULES.positive("thresholds.maxBiasShiftVolts", maxBiasShiftVolts, "V");
        DesignException.RULES.positive("thresholds.maxStepVolts", maxStepVolts, "V");
        DesignException.RULES.positive("thresholds.maxStageGain", maxStageGain, "V/V");
        DesignException.RULES.positive("thresholds.maxFeedbackOhms", maxFeedbackOhms, "Ω");
        DesignException.RULES.nonNegative("thresholds.minRuntimeHours", minRuntimeHours, "h");
        if (!Double.isFinite(capacitorDeratingOverride) || capacitorDeratingOverride > 1) {
            throw new DesignException("thresholds.capacitorDeratingOverride", "must be at most 1 (0 or less: use each technology's own)");
        }
    }

    public static Thresholds defaults() {
        return new Thresholds(0.01, 2.0, 3.0, 1.0, 0.05, 0.1, 1e-3, 0.05, 1.0, 50, 100e3, 0, 0);
    }
}
