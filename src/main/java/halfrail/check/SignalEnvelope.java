package halfrail.check;

import halfrail.design.DesignCircuit;
import halfrail.design.SignalSource;
import halfrail.design.StageNodes;
import halfrail.solve.AcAnalysis;
import halfrail.solve.OpAmpState;
import halfrail.solve.OperatingPoint;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The nominal signal's peaks along the chain, with the clipping of earlier stages taken into
 * account: the one place where the check layer turns small-signal responses into signal peaks,
 * shared by {@link DesignAnalysis} and the studies ({@link NominalStudy}).
 *
 * <p>The linear figure of a node is the peak of the passband response from the source to it over
 * the design's band ({@link AcAnalysis#peakMagnitude}) times the source peak. Behind a stage that
 * clips, that figure is not physical: no node after a clipped op-amp can swing further than that
 * op-amp's output can. So the signal stages are walked in chain order
 * ({@link DesignCircuit#opAmps()}, the reference buffer skipped — it is not in the chain):
 * <ul>
 *   <li>the <em>drive factor</em> D<sub>k</sub> is the fraction of the linear drive that reaches
 *       stage k (D<sub>1</sub> = 1);</li>
 *   <li>its <em>demanded</em> output peak is P<sub>k</sub> = linear peak × D<sub>k</sub>;</li>
 *   <li>it can deliver at most E<sub>k</sub> = the larger of (window top − rest point) and (rest
 *       point − window bottom) at the supply of the operating point;</li>
 *   <li>its clip factor is c<sub>k</sub> = min(1, E<sub>k</sub>/P<sub>k</sub>), and
 *       D<sub>k+1</sub> = D<sub>k</sub>·c<sub>k</sub>.</li>
 * </ul>
 * Figures on a stage's input side (the non-inverting input's peak, its input and leg capacitors)
 * scale by D<sub>k</sub>; its output figures use the demand P<sub>k</sub>, so that a clip finding
 * still says how far over its window the stage is asked to go (for the first clipping stage that
 * is the linear figure itself). The output coupling capacitor scales by the drive after the last
 * stage, D<sub>last</sub>·c<sub>last</sub>. A capacitor's signal peak is further bounded by the
 * most the stage that drives it can deliver (E of that stage; for an input capacitor, of the stage
 * before). The reference's capacitors keep their linear figures.
 *
 * <p>This is an approximation, a describing-function-like bound rather than a waveform
 * simulation: clipping is treated as a drop in the drive (the waveform's peak cannot pass the
 * window, so everything after it sees at most the window's peak, scaled by the later linear
 * gains), which is the usual hand reasoning about an overdriven cascade (common practice). It
 * ignores what clipping adds and takes away: the harmonics of the flattened wave (where a later
 * stage passes the fundamental but not the harmonics, the fundamental of a hard-clipped sine
 * reaches up to 4/π of the clip level — the describing function of an ideal limiter, Gelb and
 * Vander Velde, Multiple-Input Describing Functions and Nonlinear System Design, 1968, from
 * memory — so a figure there can be up to 27 % low), the shift of the mean of an asymmetric clip,
 * and the op-amp's recovery from saturation. With nothing clipping every figure is the linear one.
 */
final class SignalEnvelope {
    private final List<StageNodes> opAmps;
    private final double[] linearOutputVolts;
    private final double[] linearInputVolts;
    private final double[] drive;
    private final double[] clip;
    private final double[] deliverableVolts;
    /** Label of the first stage before op-amp k that clips (c &lt; 1), or null. */
    private final String[] clippedBefore;
    /** Index in {@link #opAmps} of the signal stage before each op-amp, or -1. */
    private final int[] previousSignal;
    private final Map<String, Integer> byDesignPath = new HashMap<>();
    private final double sourcePeakVolts;
    private final int lastSignal;
    private final double outputDrive;
    private final String clippedInChain;

    private SignalEnvelope(DesignCircuit circuit, OperatingPoint op, AcAnalysis ac, SignalSource source) {
        opAmps = circuit.opAmps();
        int n = opAmps.size();
        linearOutputVolts = new double[n];
        linearInputVolts = new double[n];
        drive = new double[n];
        clip = new double[n];
        deliverableVolts = new double[n];
        clippedBefore = new String[n];
        previousSignal = new int[n];
        double peak = source.voltsPeak();
        sourcePeakVolts = peak;
        double lo = source.bandLowHz();
        double hi = source.bandHighHz();
        String sig = circuit.signalSource();
        double d = 1;
        String firstClipped = null;
        int previous = -1;
        for (int k = 0; k < n; k++) {
            StageNodes sn = opAmps.get(k);
            byDesignPath.put(sn.designPath(), k);
            linearOutputVolts[k] = ac.peakMagnitude(sig, sn.out(), lo, hi) * peak;
            linearInputVolts[k] = ac.peakMagnitude(sig, sn.inPlus(), lo, hi) * peak;
            OpAmpState st = op.opAmp(sn.opAmp()).orElseThrow();
            double e = Math.max(0, Math.max(st.swingHighVolts() - st.outputVolts(),
                    st.outputVolts() - st.swingLowVolts()));
            deliverableVolts[k] = e;
            if (!sn.signal()) {
                drive[k] = 1;
                clip[k] = 1;
                previousSignal[k] = -1;
                continue;
            }
            drive[k] = d;
            clippedBefore[k] = firstClipped;
            previousSignal[k] = previous;
            double demand = linearOutputVolts[k] * d;
            clip[k] = demand > e ? e / demand : 1;
            if (clip[k] < 1 && firstClipped == null) {
                firstClipped = sn.label();
            }
            d *= clip[k];
            previous = k;
        }
        lastSignal = previous;
        outputDrive = d;
        clippedInChain = firstClipped;
    }

    /**
     * The envelope of the design's nominal signal ({@code source}) in {@code circuit}, linearised
     * at {@code op} (whose op-amp windows and rest points bound the swings) by {@code ac}.
     */
    static SignalEnvelope of(DesignCircuit circuit, OperatingPoint op, AcAnalysis ac, SignalSource source) {
        return new SignalEnvelope(circuit, op, ac, source);
    }

    /** The linear (unclipped) peak at op-amp {@code k}'s output, V; {@code k} in {@link DesignCircuit#opAmps()} order. */
    double linearOutputPeakVolts(int k) {
        return linearOutputVolts[k];
    }

    /** The demanded peak at op-amp {@code k}'s output, P = linear peak × drive factor, V. */
    double outputPeakVolts(int k) {
        return linearOutputVolts[k] * drive[k];
    }

    /** The peak at op-amp {@code k}'s non-inverting input, linear peak × drive factor, V. */
    double inputPeakVolts(int k) {
        return linearInputVolts[k] * drive[k];
    }

    /** D: the fraction of the linear drive that reaches op-amp {@code k} (1 when nothing before it clips). */
    double driveFactor(int k) {
        return drive[k];
    }

    /** c = min(1, E/P): the fraction of its demanded peak that op-amp {@code k} passes on. */
    double clipFactor(int k) {
        return clip[k];
    }

    /** E: the largest peak op-amp {@code k}'s output can deliver around its rest point, V. */
    double deliverableVolts(int k) {
        return deliverableVolts[k];
    }

    /** The first stage before op-amp {@code k} that clips, whose clipped output reduces its figures. */
    Optional<String> clippedBefore(int k) {
        return Optional.ofNullable(clippedBefore[k]);
    }

    /**
     * The drive after signal stage {@code k} when it gets {@code driveIn} and rests at
     * {@code quiescent} in the window {@code low} to {@code high}: driveIn·min(1, E/P) with this
     * window's E (the same rule as at the nominal operating point); {@code driveIn} unchanged for
     * the reference buffer. Walking the stages in order with it gives the drives at another supply
     * or in another build, whose windows differ, without allocating.
     */
    double passOn(int k, double driveIn, double quiescent, double low, double high) {
        if (!opAmps.get(k).signal()) {
            return driveIn;
        }
        double demand = linearOutputVolts[k] * driveIn;
        double e = Math.max(0, Math.max(high - quiescent, quiescent - low));
        return demand > e ? driveIn * e / demand : driveIn;
    }

    /** The drive reaching op-amp {@code k} with the windows of operating point {@code p}: {@link #passOn} from the first stage. */
    double driveAt(OperatingPoint p, int k) {
        double d = 1;
        for (int j = 0; j < k; j++) {
            OpAmpState st = p.opAmp(opAmps.get(j).opAmp()).orElseThrow();
            d = passOn(j, d, st.outputVolts(), st.swingLowVolts(), st.swingHighVolts());
        }
        return opAmps.get(k).signal() ? d : 1;
    }

    /**
     * As {@link #swing(int, double, double, double, double, boolean)}, with the drive reaching the
     * stage given ({@link #passOn}, {@link #driveAt}) instead of the nominal one.
     */
    SwingReport swing(int k, double drive, double supplyVolts, double quiescent, double low, double high,
                      boolean saturated) {
        return SwingReport.of(supplyVolts, quiescent, low, high, linearOutputVolts[k] * drive, sourcePeakVolts * drive,
                saturated);
    }

    /**
     * Op-amp {@code k}'s swing with rest point {@code quiescent} and window {@code low} to
     * {@code high} at {@code supplyVolts}, at its demanded peak. Its largest fitting source level
     * stays the linear chain's (the source level at which this stage itself reaches its window,
     * window / linear peak × source peak): the demand is scaled by the drive factor, so the
     * source level is too.
     */
    SwingReport swing(int k, double supplyVolts, double quiescent, double low, double high, boolean saturated) {
        return SwingReport.of(supplyVolts, quiescent, low, high, outputPeakVolts(k), sourcePeakVolts * drive[k],
                saturated);
    }

    /**
     * The signal peak across a capacitor with linear figure {@code linearPeakVolts}, scaled and
     * bounded as the class comment says by the stage its design path ({@link DesignCircuit#designPath})
     * ties it to: {@code stages[i].inputCapacitor}, {@code stages[i].legCapacitor},
     * {@code load.outputCapacitor}; any other path keeps the linear figure.
     */
    CapacitorSignal capacitor(String designPath, double linearPeakVolts) {
        int dot = designPath.lastIndexOf('.');
        String owner = dot < 0 ? designPath : designPath.substring(0, dot);
        String role = dot < 0 ? "" : designPath.substring(dot + 1);
        double factor;
        int driver;
        String clipped;
        if (designPath.equals("load.outputCapacitor") && lastSignal >= 0) {
            factor = outputDrive;
            driver = lastSignal;
            clipped = clippedInChain;
        } else if (byDesignPath.containsKey(owner) && opAmps.get(byDesignPath.get(owner)).signal()
                && (role.equals("inputCapacitor") || role.equals("legCapacitor"))) {
            int k = byDesignPath.get(owner);
            factor = drive[k];
            driver = role.equals("inputCapacitor") ? previousSignal[k] : k;
            clipped = clippedBefore[k];
        } else {
            return new CapacitorSignal(linearPeakVolts, Optional.empty());
        }
        double peak = linearPeakVolts * factor;
        boolean reduced = factor < 1;
        if (driver >= 0 && peak > deliverableVolts[driver]) {
            // A capacitor cannot see more signal than the stage driving it can swing.
            peak = deliverableVolts[driver];
            reduced = true;
            if (clipped == null) {
                clipped = opAmps.get(driver).label();
            }
        }
        return new CapacitorSignal(peak, reduced ? Optional.ofNullable(clipped) : Optional.empty());
    }

    /**
     * A capacitor's signal peak.
     *
     * @param peakVolts       the peak across it, V
     * @param drivenByClipped the clipping stage that reduced it from its linear figure, if any
     */
    record CapacitorSignal(double peakVolts, Optional<String> drivenByClipped) {
    }

    /** The clause a finding adds when its figure comes from a clipped stage's output; empty otherwise. */
    static String drivenNote(Optional<String> clippedStage) {
        return clippedStage.map(s -> "; driven by the clipped output of " + s).orElse("");
    }
}
