package halfrail.check;

import java.util.List;
import java.util.OptionalDouble;

/**
 * The signal chain from the source to the load, at the nominal supply.
 *
 * @param bandLowHz          the design's lowest frequency of interest, Hz
 * @param bandHighHz         the design's highest frequency of interest, Hz
 * @param peakGain           largest gain from the source to the load, V/V
 * @param peakHz             where it occurs, Hz
 * @param lowerCornerHz      the chain's real lower −3 dB point (from the complex response), Hz
 * @param upperCornerHz      the chain's upper −3 dB point, Hz
 * @param rippleAtLoadVolts  supply ripple reaching the load, V peak (0 without ripple)
 * @param rippleGain         gain from the supply to the load at the ripple frequency, V/V
 * @param referenceNoiseVoltsRms thermal noise of the reference network at the load over the band, V rms (at 300 K)
 * @param responses          the gain from the source to each signal stage's output, then to the load, for plots
 */
public record ChainReport(double bandLowHz, double bandHighHz, double peakGain, double peakHz,
                          OptionalDouble lowerCornerHz, OptionalDouble upperCornerHz, double rippleAtLoadVolts,
                          double rippleGain, double referenceNoiseVoltsRms, List<ResponseCurve> responses) {
    public ChainReport {
        responses = List.copyOf(responses);
    }

    /** Without response curves. */
    public ChainReport(double bandLowHz, double bandHighHz, double peakGain, double peakHz,
                       OptionalDouble lowerCornerHz, OptionalDouble upperCornerHz, double rippleAtLoadVolts,
                       double rippleGain, double referenceNoiseVoltsRms) {
        this(bandLowHz, bandHighHz, peakGain, peakHz, lowerCornerHz, upperCornerHz, rippleAtLoadVolts, rippleGain,
                referenceNoiseVoltsRms, List.of());
    }

    /** The response curve at the output of the stage labelled {@code label}, if the chain has one. */
    public java.util.Optional<ResponseCurve> response(String label) {
        return responses.stream().filter(r -> !r.atLoad() && r.label().equals(label)).findFirst();
    }

    /** The response curve at the load, if the chain has one. */
    public java.util.Optional<ResponseCurve> loadResponse() {
        return responses.stream().filter(ResponseCurve::atLoad).findFirst();
    }
}
