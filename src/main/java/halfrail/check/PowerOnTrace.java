package halfrail.check;

import java.util.Arrays;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A downsampled copy of the power-on transient for plotting: every op-amp's output and the load
 * at evenly spaced times. Immutable; arrays are copied in and out.
 *
 * @param timesSeconds sample times from switch-on, s, rising
 * @param outputVolts  per op-amp label (in stage order), its output at each time, V
 * @param loadVolts    the load's voltage at each time, V
 */
public record PowerOnTrace(double[] timesSeconds, Map<String, double[]> outputVolts, double[] loadVolts) {
    /** Largest number of samples kept per trace (plots need no more). */
    public static final int MAX_SAMPLES = 600;

    public PowerOnTrace {
        timesSeconds = timesSeconds.clone();
        Map<String, double[]> copy = new LinkedHashMap<>();
        for (Map.Entry<String, double[]> e : outputVolts.entrySet()) {
            requireLength(e.getKey(), e.getValue(), timesSeconds.length);
            copy.put(e.getKey(), e.getValue().clone());
        }
        outputVolts = Collections.unmodifiableMap(copy);
        requireLength("load", loadVolts, timesSeconds.length);
        loadVolts = loadVolts.clone();
    }

    private static void requireLength(String what, double[] v, int n) {
        if (v.length != n) {
            throw new IllegalArgumentException(what + " has " + v.length + " samples for " + n + " times");
        }
    }

    @Override
    public double[] timesSeconds() {
        return timesSeconds.clone();
    }

    @Override
    public double[] loadVolts() {
        return loadVolts.clone();
    }

    /** The op-amp labels, in stage order. */
    public List<String> labels() {
        return List.copyOf(outputVolts.keySet());
    }

    /** One op-amp's output, V (a copy). @throws IllegalArgumentException for an unknown label */
    public double[] outputVolts(String label) {
        double[] v = outputVolts.get(label);
        if (v == null) {
            throw new IllegalArgumentException("no trace " + label);
        }
        return v.clone();
    }

    @Override
    public Map<String, double[]> outputVolts() {
        Map<String, double[]> copy = new LinkedHashMap<>();
        outputVolts.forEach((k, v) -> copy.put(k, v.clone()));
        return Collections.unmodifiableMap(copy);
    }

    @Override
    public boolean equals(Object o) {
        if (!(o instanceof PowerOnTrace t) || !Arrays.equals(timesSeconds, t.timesSeconds)
                || !Arrays.equals(loadVolts, t.loadVolts) || !outputVolts.keySet().equals(t.outputVolts.keySet())) {
            return false;
        }
        return outputVolts.entrySet().stream().allMatch(e -> Arrays.equals(e.getValue(), t.outputVolts.get(e.getKey())));
    }

    @Override
    public int hashCode() {
        return (Arrays.hashCode(timesSeconds) * 31 + Arrays.hashCode(loadVolts)) * 31 + outputVolts.keySet().hashCode();
    }

    @Override
    public String toString() {
        return "PowerOnTrace[" + timesSeconds.length + " samples of " + outputVolts.keySet() + " and the load]";
    }
}
