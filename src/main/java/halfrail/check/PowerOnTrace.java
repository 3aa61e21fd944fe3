package halfrail.check;

import java.util.Arrays;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A downsampled copy of the power-on transient for plotting: the voltages of the watched nodes
 * at evenly spaced times. Immutable; arrays are copied in and out.
 *
 * @param timesSeconds  sample times from switch-on, s, rising
 * @param volts         per trace label (each op-amp's label, then {@link #LOAD}), its voltage at each time, V
 */
public record PowerOnTrace(double[] timesSeconds, Map<String, double[]> volts) {
    /** Label of the load's trace. */
    public static final String LOAD = "load";
    /** Largest number of samples kept per trace (plots need no more). */
    public static final int MAX_SAMPLES = 600;

    public PowerOnTrace {
        timesSeconds = timesSeconds.clone();
        Map<String, double[]> copy = new LinkedHashMap<>();
        for (Map.Entry<String, double[]> e : volts.entrySet()) {
            if (e.getValue().length != timesSeconds.length) {
                throw new IllegalArgumentException("trace " + e.getKey() + " has " + e.getValue().length
                        + " samples for " + timesSeconds.length + " times");
            }
            copy.put(e.getKey(), e.getValue().clone());
        }
        volts = Collections.unmodifiableMap(copy);
    }

    @Override
    public double[] timesSeconds() {
        return timesSeconds.clone();
    }

    /** The trace labels in drawing order. */
    public List<String> labels() {
        return List.copyOf(volts.keySet());
    }

    /** One trace's voltages, V (a copy). @throws IllegalArgumentException for an unknown label */
    public double[] volts(String label) {
        double[] v = volts.get(label);
        if (v == null) {
            throw new IllegalArgumentException("no trace " + label);
        }
        return v.clone();
    }

    @Override
    public Map<String, double[]> volts() {
        Map<String, double[]> copy = new LinkedHashMap<>();
        volts.forEach((k, v) -> copy.put(k, v.clone()));
        return Collections.unmodifiableMap(copy);
    }

    @Override
    public boolean equals(Object o) {
        if (!(o instanceof PowerOnTrace t) || !Arrays.equals(timesSeconds, t.timesSeconds)
                || !volts.keySet().equals(t.volts.keySet())) {
            return false;
        }
        return volts.entrySet().stream().allMatch(e -> Arrays.equals(e.getValue(), t.volts.get(e.getKey())));
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(timesSeconds) * 31 + volts.keySet().hashCode();
    }

    @Override
    public String toString() {
        return "PowerOnTrace[" + timesSeconds.length + " samples of " + volts.keySet() + "]";
    }
}
