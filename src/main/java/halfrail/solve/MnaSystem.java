package halfrail.solve;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.CurrentSource;
import halfrail.circuit.Element;
import halfrail.circuit.OpAmp;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.Resistor;
import halfrail.circuit.VoltageSource;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Modified nodal analysis of a {@link Circuit}: the circuit written as
 * {@code f(x, t) + d/dt q(x) = 0}, with the Jacobians {@code G = ∂f/∂x} and {@code C = ∂q/∂x}.
 *
 * <p>Unknowns, in order: the voltage of every non-ground node (V); the branch current of every
 * voltage source, flowing out of its plus terminal into the circuit (A); the output current of
 * every op-amp, flowing out of its output pin (A); the internal state of every op-amp, the
 * unloaded output voltage (V). Node rows are Kirchhoff's current law (sum of currents leaving
 * the node, A); branch rows are voltage equations (V).
 *
 * <p>Op-amp model: with {@code u = A·(V(in+) − V(in−) + Vos)}, the limited target is
 * {@code L(u)}: u itself inside the swing window {@code [V(vNeg)+swingLow, V(vPos)−swingHigh]}
 * and an exponential knee of width {@link #KNEE_VOLTS} towards each limit, so the output
 * approaches but never crosses them. In DC the state equals L(u); in the dynamic form it
 * follows {@code dx/dt = SR·tanh(G·(L(u) − x)/SR)}, a dominant pole at GBW/A with slew limit.
 * The rate {@code G = ωp·(1 + b)/(1 + b/A)} grows with the overdrive the limiter cuts off,
 * {@code b ≈ |u − L(u)| / |L(u) − x|} (both magnitudes smoothed over one knee width): inside the
 * window b = 0 and G is the pole's ωp; beyond a limit, while the output still has far to go,
 * {@code G·(L − x) ≈ ωp·(u − x)}, the drive a real part's integrator sees (the whole overdrive,
 * not the clipped target), so a stage driven hard into a rail slews there at SR; as it arrives,
 * G tops out at {@code A·ωp = 2π·GBW}, the unity-gain time constant. With the clipped target
 * alone the output crept into a rail at the open-loop pole (A/(2π·GBW): tens of milliseconds
 * for common parts, seconds for micropower ones), and an astable's rail-to-rail flips took
 * milliseconds ({@code PowerOnOscillatorTest}).
 * The output pin sits at {@code x − Rout·Iout}. Bias currents flow into the input pins and out
 * through V−; the quiescent current flows from V+ to V−; the output current is drawn from V+
 * when sourcing and returned to V− when sinking, so the supply's branch current is the battery
 * current.
 *
 * <p>Immutable and thread-safe; {@link #evaluate} writes only into the caller's arrays.
 */
public final class MnaSystem {
    /** Width of the exponential knee of the op-amp output limiter, V. */
    public static final double KNEE_VOLTS = 0.01;
    /**
     * Smoothing current of the split of an op-amp's output current between its supply pins, A.
     * At zero output current each pin carries half of it, in opposite directions; it vanishes
     * from the sum and keeps the split differentiable.
     */
    public static final double SPLIT_SMOOTHING_AMPS = 1e-9;

    private final Circuit circuit;
    private final Map<String, Integer> nodeIndex;
    private final List<String> unknownNames;
    private final Map<String, Integer> branchIndex;
    private final Map<String, Integer> stateIndex;
    private final int nodeCount;
    private final int size;
    private final Device[] devices;
    private final OpAmpDevice[] opAmps;
    /** Index into {@link #opAmps} by element name, for {@link #saturated} (a scan over the devices made that quadratic in the stage count); shared by variants. */
    private final Map<String, Integer> opAmpByName;

    private MnaSystem(Circuit circuit) {
        this.circuit = circuit;
        Map<String, Integer> nodes = new HashMap<>();
        List<String> names = new ArrayList<>();
        for (String n : circuit.nodes()) {
            nodes.put(n, names.size());
            names.add("V(" + n + ")");
        }
        this.nodeCount = names.size();
        Map<String, Integer> branches = new HashMap<>();
        for (VoltageSource v : circuit.elements(VoltageSource.class)) {
            branches.put(v.name(), names.size());
            names.add("I(" + v.name() + ")");
        }
        for (OpAmp o : circuit.elements(OpAmp.class)) {
            branches.put(o.name(), names.size());
            names.add("I(" + o.name() + ".out)");
        }
        Map<String, Integer> states = new HashMap<>();
        for (OpAmp o : circuit.elements(OpAmp.class)) {
            states.put(o.name(), names.size());
            names.add("X(" + o.name() + ")");
        }
        this.nodeIndex = Collections.unmodifiableMap(nodes);
        this.unknownNames = List.copyOf(names);
        this.branchIndex = Collections.unmodifiableMap(branches);
        this.stateIndex = Collections.unmodifiableMap(states);
        this.size = names.size();
        List<Device> list = new ArrayList<>();
        for (Element e : circuit.elements()) {
            list.add(device(e));
        }
        this.devices = list.toArray(new Device[0]);
        this.opAmps = opAmpDevices(devices);
        this.opAmpByName = byName(opAmps);
    }

    private static Map<String, Integer> byName(OpAmpDevice[] opAmps) {
        Map<String, Integer> byName = new HashMap<>();
        for (int j = 0; j < opAmps.length; j++) {
            byName.put(opAmps[j].part.name(), j);
        }
        return Collections.unmodifiableMap(byName);
    }

    private static OpAmpDevice[] opAmpDevices(Device[] devices) {
        List<OpAmpDevice> amps = new ArrayList<>();
        for (Device d : devices) {
            if (d instanceof OpAmpDevice o) {
                amps.add(o);
            }
        }
        return amps.toArray(new OpAmpDevice[0]);
    }

    /** The equations of {@code circuit}, sharing {@code template}'s unknowns (same topology). */
    private MnaSystem(MnaSystem template, Circuit circuit) {
        this.circuit = circuit;
        this.nodeIndex = template.nodeIndex;
        this.unknownNames = template.unknownNames;
        this.branchIndex = template.branchIndex;
        this.stateIndex = template.stateIndex;
        this.nodeCount = template.nodeCount;
        this.size = template.size;
        List<Element> list = circuit.elements();
        this.devices = new Device[list.size()];
        for (int i = 0; i < devices.length; i++) {
            devices[i] = device(list.get(i));
        }
        this.opAmps = opAmpDevices(devices);
        this.opAmpByName = template.opAmpByName; // same elements in the same order
        // The pattern and the floating-node check depend only on the topology, which is the template's.
        this.pattern = template.pattern();
        this.floating = template.floating;
    }

    /**
     * The equations of {@code circuit}, a variant of this system's circuit with the same nodes and
     * the same elements in the same order, only their values changed (see
     * {@link Circuit#withValues}): the unknowns and their order are shared, so a solution of this
     * system is a valid starting point for the new one.
     *
     * @throws AnalysisException BAD_REQUEST when the nodes or the elements' names, types or terminals differ
     */
    public MnaSystem withValuesOf(Circuit circuit) {
        if (!hasTopologyOf(circuit)) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST,
                    "the circuit's topology differs from this system's; assemble it with MnaSystem.of");
        }
        return new MnaSystem(this, circuit);
    }

    /**
     * Whether {@code circuit} has this system's nodes and the same elements (type, name,
     * terminals) in the same order, so that {@link #withValuesOf} accepts it.
     */
    public boolean hasTopologyOf(Circuit circuit) {
        return circuit.sameTopologyAs(this.circuit);
    }

    /**
     * The nodes without a DC path ({@link FloatingNodes#find}), found once per topology: the
     * answer depends only on the elements' types and terminals, so systems made by
     * {@link #withValuesOf} share it.
     */
    List<String> floatingNodes() {
        List<String> f = floating;
        if (f == null) {
            f = List.copyOf(FloatingNodes.find(circuit));
            floating = f;
        }
        return f;
    }

    /** Assemble the equations of {@code circuit}. */
    public static MnaSystem of(Circuit circuit) {
        return new MnaSystem(circuit);
    }

    public Circuit circuit() {
        return circuit;
    }

    /** Number of unknowns. */
    public int size() {
        return size;
    }

    /** Number of node-voltage unknowns; they come first. */
    public int nodeCount() {
        return nodeCount;
    }

    /** Index of a node's voltage, or −1 for ground. @throws AnalysisException BAD_REQUEST for an unknown node */
    public int nodeIndex(String node) {
        if (Circuit.GROUND.equals(node) || Circuit.GROUND_ALIAS.equalsIgnoreCase(node)) {
            return -1;
        }
        Integer i = nodeIndex.get(node);
        if (i == null) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST, "no node named " + node);
        }
        return i;
    }

    /** Index of the branch current of a voltage source, or of an op-amp's output current. */
    public int branchIndex(String element) {
        Integer i = branchIndex.get(element);
        if (i == null) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST,
                    "no voltage source or op-amp named " + element);
        }
        return i;
    }

    /** Index of an op-amp's internal state (its unloaded output voltage). */
    public int stateIndex(String opAmp) {
        Integer i = stateIndex.get(opAmp);
        if (i == null) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST, "no op-amp named " + opAmp);
        }
        return i;
    }

    /** A readable name of unknown {@code i}, for example {@code V(mid)} or {@code I(VBAT)}. */
    public String unknownName(int i) {
        return unknownNames.get(i);
    }

    /** The node name of unknown {@code i} when it is a node voltage; otherwise the unknown's name. */
    public String nodeName(int i) {
        return i < nodeCount ? circuit.nodes().get(i) : unknownNames.get(i);
    }

    /** Voltage of {@code node} in the solution vector {@code x} (0 for ground). */
    public double voltage(double[] x, String node) {
        int i = nodeIndex(node);
        return i < 0 ? 0 : x[i];
    }

    /**
     * Evaluate the equations at {@code x}.
     *
     * @param x           the unknowns (length {@link #size()})
     * @param t           time in s, for the dynamic form (source ramps); ignored in DC
     * @param mode        DC or dynamic form
     * @param sourceScale factor on every independent source, bias and offset (1 for the real circuit;
     *                    smaller values serve source stepping)
     * @param gmin        conductance in S from every node to ground (0 for the real circuit;
     *                    larger values serve gmin stepping)
     * @param f           receives f(x, t) (cleared first)
     * @param g           receives ∂f/∂x (cleared first); may be null when not needed
     * @param q           receives q(x) (cleared first); may be null when not needed
     * @param c           receives ∂q/∂x (cleared first); may be null when not needed
     */
    public void evaluate(double[] x, double t, Mode mode, double sourceScale, double gmin,
                         double[] f, double[][] g, double[] q, double[][] c) {
        evaluate(x, t, mode, sourceScale, gmin, true, f, g, q, c);
    }

    /**
     * As {@link #evaluate(double[], double, Mode, double, double, double[], double[][], double[], double[][])},
     * optionally with every op-amp's output limiter switched off (a purely linear circuit, used
     * to find a starting point for Newton's method).
     */
    void evaluate(double[] x, double t, Mode mode, double sourceScale, double gmin, boolean limit,
                  double[] f, double[][] g, double[] q, double[][] c) {
        evaluate(x, t, mode, sourceScale, gmin, limit, 1, f, g, q, c);
    }

    /**
     * As above, with every op-amp's open-loop gain multiplied by {@code gainScale} (1 for the real
     * circuit; smaller values serve the DC solver's gain stepping).
     */
    void evaluate(double[] x, double t, Mode mode, double sourceScale, double gmin, boolean limit, double gainScale,
                  double[] f, double[][] g, double[] q, double[][] c) {
        evaluate(x, t, mode, sourceScale, gmin, limit, gainScale, false, f, g, q, c);
    }

    /**
     * As above; with {@code patternOnly}, g is cleared only at the positions of {@link #pattern()}
     * (O(entries) instead of O(n²)): the caller guarantees that every other entry of g is zero,
     * as it is when g was only ever filled by this method and changed within the pattern.
     */
    void evaluate(double[] x, double t, Mode mode, double sourceScale, double gmin, boolean limit, double gainScale,
                  boolean patternOnly, double[] f, double[][] g, double[] q, double[][] c) {
        java.util.Arrays.fill(f, 0, size, 0);
        if (g != null && patternOnly) {
            Pattern p = pattern();
            for (int i = 0; i < size; i++) {
                double[] row = g[i];
                for (int k = p.rowStart[i]; k < p.rowStart[i + 1]; k++) {
                    row[p.columns[k]] = 0;
                }
            }
        } else if (g != null) {
            for (int i = 0; i < size; i++) {
                java.util.Arrays.fill(g[i], 0, size, 0);
            }
        }
        if (q != null) {
            java.util.Arrays.fill(q, 0, size, 0);
        }
        if (c != null) {
            for (int i = 0; i < size; i++) {
                java.util.Arrays.fill(c[i], 0, size, 0);
            }
        }
        Stamp s = new Stamp(x, f, g, q, c, limit, gainScale);
        for (Device d : devices) {
            d.load(s, t, mode, sourceScale);
        }
        if (gmin > 0) {
            for (int i = 0; i < nodeCount; i++) {
                s.conductance(i, -1, gmin);
            }
        }
    }

    /**
     * The positions G and C can ever fill, row by row (the union over both modes, every limiter
     * region and the gmin shunts): what a sparse solver needs to assemble and factor without
     * touching the empty part of the matrix.
     */
    static final class Pattern {
        /** Start of each row's entries in {@link #columns}; length size + 1. */
        final int[] rowStart;
        /** Column of each entry, ascending within a row. */
        final int[] columns;
        final int size;

        Pattern(int size, int[] rowStart, int[] columns) {
            this.size = size;
            this.rowStart = rowStart;
            this.columns = columns;
        }

        /** Number of entries. */
        int entries() {
            return columns.length;
        }

        private volatile int[] fillOrder;

        /**
         * A fill-reducing column order of this pattern (minimum degree on A + Aᵀ,
         * {@link SparseLuSymbolic#minimumDegree}), made once and shared by every solver factoring
         * a matrix of this pattern. The caller must not change the array.
         */
        int[] fillOrder() {
            int[] o = fillOrder;
            if (o == null) {
                int words = (size + 63) >>> 6;
                long[] bits = new long[size * words];
                for (int i = 0; i < size; i++) {
                    for (int k = rowStart[i]; k < rowStart[i + 1]; k++) {
                        int j = columns[k];
                        bits[i * words + (j >>> 6)] |= 1L << (j & 63);
                    }
                }
                o = SparseLuSymbolic.minimumDegree(bits, size, words);
                fillOrder = o;
            }
            return o;
        }

        /** Index of entry (row, col) in the value arrays. */
        int slot(int row, int col) {
            int lo = rowStart[row];
            int hi = rowStart[row + 1] - 1;
            while (lo <= hi) {
                int mid = (lo + hi) >>> 1;
                int v = columns[mid];
                if (v < col) {
                    lo = mid + 1;
                } else if (v > col) {
                    hi = mid - 1;
                } else {
                    return mid;
                }
            }
            throw new IllegalStateException("entry (" + row + ", " + col + ") lies outside the circuit's pattern");
        }
    }

    private volatile Pattern pattern;

    /** Positions (row·size + column) recorded while the pattern is made, repeats allowed. */
    static final class Positions {
        private long[] keys = new long[64];
        private int count;

        void add(long key) {
            if (count == keys.length) {
                keys = java.util.Arrays.copyOf(keys, 2 * count);
            }
            keys[count++] = key;
        }

        long[] sortedDistinct() {
            long[] k = java.util.Arrays.copyOf(keys, count);
            java.util.Arrays.sort(k);
            int m = 0;
            for (int i = 0; i < k.length; i++) {
                if (m == 0 || k[i] != k[m - 1]) {
                    k[m++] = k[i];
                }
            }
            return java.util.Arrays.copyOf(k, m);
        }
    }
    private volatile List<String> floating;

    /** The sparsity pattern of G and C (made once, on first use). */
    Pattern pattern() {
        Pattern p = pattern;
        if (p == null) {
            Positions seen = new Positions();
            double[] x = new double[size];
            double[] f = new double[size];
            double[] q = new double[size];
            for (Mode mode : Mode.values()) {
                for (boolean limit : new boolean[] {true, false}) {
                    Stamp s = new Stamp(x, f, null, q, null, limit, 1, null, null, null, seen, size);
                    for (Device d : devices) {
                        d.load(s, 0, mode, 1);
                    }
                }
            }
            for (int i = 0; i < size; i++) {
                seen.add((long) i * size + i); // gmin on node rows; a diagonal slot everywhere
            }
            long[] keys = seen.sortedDistinct();
            int[] rowStart = new int[size + 1];
            int[] columns = new int[keys.length];
            for (int k = 0; k < keys.length; k++) {
                int row = (int) (keys[k] / size);
                columns[k] = (int) (keys[k] % size);
                rowStart[row + 1]++;
            }
            for (int i = 0; i < size; i++) {
                rowStart[i + 1] += rowStart[i];
            }
            p = new Pattern(size, rowStart, columns);
            pattern = p;
        }
        return p;
    }

    /**
     * The real circuit's {@link Mode#DYNAMIC} equations at x and t, with G and C written as the
     * values of {@link #pattern()} (cleared first) instead of dense matrices.
     */
    void evaluateSparse(double[] x, double t, double[] f, double[] gValues, double[] q, double[] cValues) {
        evaluateSparse(x, t, f, gValues, q, cValues, null);
    }

    /**
     * As {@link #evaluateSparse(double[], double, double[], double[], double[], double[])}, the
     * positions of the entries taken from {@code slots} where it has them (a caller that
     * evaluates the same system many times keeps one; not thread-safe, one per caller).
     */
    void evaluateSparse(double[] x, double t, double[] f, double[] gValues, double[] q, double[] cValues,
                        SlotSequence slots) {
        Pattern p = pattern();
        java.util.Arrays.fill(f, 0, size, 0);
        java.util.Arrays.fill(q, 0, size, 0);
        java.util.Arrays.fill(gValues, 0, p.entries(), 0);
        java.util.Arrays.fill(cValues, 0, p.entries(), 0);
        Stamp s = new Stamp(x, f, null, q, null, true, 1, p, gValues, cValues, null, size);
        s.slots = slots != null && slots.pattern == p ? slots : null;
        for (Device d : devices) {
            d.load(s, t, Mode.DYNAMIC, 1);
        }
    }

    /**
     * The pattern positions of the G and C entries in the order the devices write them, kept
     * from one sparse evaluation to the next: the devices write the same entries in the same
     * order at every evaluation, so the binary search of {@link Pattern#slot} is made once per
     * write and then only checked against the kept (row, column) key. A write that differs from
     * the kept one is searched and kept in its place, so a changed order costs time, never a
     * wrong position.
     */
    static final class SlotSequence {
        final Pattern pattern;
        private final Track g = new Track();
        private final Track c = new Track();

        SlotSequence(Pattern pattern) {
            this.pattern = pattern;
        }

        /** Pattern position of the k-th G write of an evaluation, at (row, col). */
        int g(int k, int row, int col) {
            return g.slot(pattern, k, row, col);
        }

        /** Pattern position of the k-th C write of an evaluation, at (row, col). */
        int c(int k, int row, int col) {
            return c.slot(pattern, k, row, col);
        }

        /** The kept (row, column) keys and positions of one matrix's writes, in write order. */
        private static final class Track {
            private long[] keys = new long[64];
            private int[] slots = new int[64];
            private int count;

            int slot(Pattern pattern, int k, int row, int col) {
                long key = (long) row * pattern.size + col;
                if (k < count && keys[k] == key) {
                    return slots[k];
                }
                int slot = pattern.slot(row, col);
                if (k >= keys.length) {
                    keys = java.util.Arrays.copyOf(keys, 2 * k);
                    slots = java.util.Arrays.copyOf(slots, 2 * k);
                }
                keys[k] = key;
                slots[k] = slot;
                count = Math.max(count, k + 1);
                return slot;
            }
        }
    }

    /**
     * The right-hand side b of the small-signal system for a unit change of one source: for a
     * voltage source, +1 in its branch row; for a current source, the current injected at its
     * nodes. Multiply by the source's AC magnitude for the AC sweep.
     */
    public double[] sourceDirection(String sourceName) {
        double[] b = new double[size];
        Element e = circuit.element(sourceName).orElseThrow(() ->
                new AnalysisException(AnalysisException.Kind.BAD_REQUEST, "no source named " + sourceName));
        if (e instanceof VoltageSource) {
            b[branchIndex(sourceName)] = 1;
        } else if (e instanceof CurrentSource i) {
            int from = nodeIndex(i.from());
            int to = nodeIndex(i.to());
            if (from >= 0) {
                b[from] -= 1;
            }
            if (to >= 0) {
                b[to] += 1;
            }
        } else {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST, sourceName + " is not a source");
        }
        return b;
    }

    /**
     * Whether op-amp {@code name}'s open-loop target lies outside its swing window at {@code x},
     * that is whether the part has left its linear region.
     */
    public boolean saturated(double[] x, String name) {
        return opAmps[opAmpNumber(name)].saturated(x);
    }

    /** Position of op-amp {@code name} in circuit order. @throws AnalysisException BAD_REQUEST for an unknown op-amp */
    int opAmpNumber(String name) {
        Integer j = opAmpByName.get(name);
        if (j == null) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST, "no op-amp named " + name);
        }
        return j;
    }

    /** As {@link #saturated(double[], String)} for op-amp number {@code j} in circuit order. */
    boolean saturated(double[] x, int j) {
        return opAmps[j].saturated(x);
    }

    /** Number of op-amps, in circuit order (for the DC solver's limiter handling). */
    int opAmpCount() {
        return opAmps.length;
    }

    /** Index of op-amp {@code j}'s internal state unknown. */
    int opAmpStateUnknown(int j) {
        return opAmps[j].st;
    }

    /**
     * Op-amp {@code j}'s limiter at {@code x}, with its gain times {@code gainScale}: writes the open-loop target u, the window's low and
     * high edges and the knee width actually used (all V) into {@code out[0..3]}; the knee is 0
     * when the supplies leave no window.
     */
    void opAmpLimiter(int j, double[] x, double sourceScale, double gainScale, double[] out) {
        OpAmpDevice o = opAmps[j];
        OpAmpParams p = o.part.params();
        double u = o.gain * gainScale * (OpAmpDevice.val(x, o.inP) - OpAmpDevice.val(x, o.inM) + sourceScale * p.offsetVolts());
        double lo = OpAmpDevice.val(x, o.vn) + p.swingLowVolts();
        double hi = OpAmpDevice.val(x, o.vp) - p.swingHighVolts();
        double half = 0.5 * (hi - lo);
        out[0] = u;
        out[1] = lo;
        out[2] = hi;
        out[3] = half <= 0 ? 0 : Math.min(KNEE_VOLTS, 0.5 * half);
    }

    /**
     * Replace op-amp {@code j}'s DC state row in {@code f} and {@code g} (as filled by
     * {@link #evaluate} in {@link Mode#DC}) by its unlimited form {@code x − u = 0}: the row of the
     * linearised circuit, which the DC solver uses to bring a limited output back into its window.
     */
    void unlimitedStateRow(int j, double[] x, double sourceScale, double gainScale, double[] f, double[][] g) {
        OpAmpDevice o = opAmps[j];
        OpAmpParams p = o.part.params();
        int st = o.st;
        double gain = o.gain * gainScale;
        double u = gain * (OpAmpDevice.val(x, o.inP) - OpAmpDevice.val(x, o.inM) + sourceScale * p.offsetVolts());
        f[st] = x[st] - u;
        java.util.Arrays.fill(g[st], 0, size, 0);
        g[st][st] = 1;
        if (o.inP >= 0) {
            g[st][o.inP] -= gain;
        }
        if (o.inM >= 0) {
            g[st][o.inM] += gain;
        }
    }

    /**
     * The change of op-amp {@code j}'s open-loop target u, V, for a change {@code dx} of the
     * unknowns: A·(dV(in+) − dV(in−)).
     */
    double opAmpTargetChange(int j, double[] dx) {
        OpAmpDevice o = opAmps[j];
        return o.gain * (OpAmpDevice.val(dx, o.inP) - OpAmpDevice.val(dx, o.inM));
    }

    /**
     * Replace op-amp {@code j}'s DC state row by a clamp at one edge of its window:
     * {@code x − (V(vPos) − swingHigh) = 0} when {@code high}, else {@code x − (V(vNeg) + swingLow) = 0}.
     * Used by the DC solver's limiter active-set search.
     */
    void clampedStateRow(int j, double[] x, boolean high, double[] f, double[][] g) {
        OpAmpDevice o = opAmps[j];
        OpAmpParams p = o.part.params();
        int st = o.st;
        double edge = high ? OpAmpDevice.val(x, o.vp) - p.swingHighVolts() : OpAmpDevice.val(x, o.vn) + p.swingLowVolts();
        f[st] = x[st] - edge;
        java.util.Arrays.fill(g[st], 0, size, 0);
        g[st][st] = 1;
        int rail = high ? o.vp : o.vn;
        if (rail >= 0) {
            g[st][rail] -= 1;
        }
    }

    private Device device(Element e) {
        if (e instanceof Resistor r) {
            return new ResistorDevice(idx(r.a()), idx(r.b()), 1.0 / r.ohms());
        } else if (e instanceof Capacitor cap) {
            return new CapacitorDevice(idx(cap.plus()), idx(cap.minus()), cap.farads(), cap.leakageSiemens());
        } else if (e instanceof VoltageSource v) {
            return new VoltageSourceDevice(v, idx(v.plus()), idx(v.minus()), branchIndex.get(v.name()));
        } else if (e instanceof CurrentSource i) {
            return new CurrentSourceDevice(idx(i.from()), idx(i.to()), i.amps());
        } else if (e instanceof OpAmp o) {
            return new OpAmpDevice(o, idx(o.inPlus()), idx(o.inMinus()), idx(o.vPos()), idx(o.vNeg()), idx(o.out()),
                    branchIndex.get(o.name()), stateIndex.get(o.name()));
        }
        throw new IllegalStateException("unhandled element " + e);
    }

    private int idx(String node) {
        return nodeIndex(node);
    }

    /** Accumulates contributions; index −1 is ground and is skipped. */
    private static final class Stamp {
        final double[] x;
        final double[] f;
        final double[][] g;
        final double[] q;
        final double[][] c;
        final boolean limit;
        final double gainScale;
        /** Sparse targets: values of G and C in the order of {@link #pattern}; null when dense. */
        final Pattern pattern;
        final double[] gs;
        final double[] cs;
        /** When not null, the stamp only records the positions it would write (row·size + column). */
        final Positions record;
        final int size;
        /** Kept positions of the sparse writes, or null; with the count of G and C writes so far. */
        SlotSequence slots;
        int gWrites;
        int cWrites;

        Stamp(double[] x, double[] f, double[][] g, double[] q, double[][] c, boolean limit, double gainScale) {
            this(x, f, g, q, c, limit, gainScale, null, null, null, null, 0);
        }

        Stamp(double[] x, double[] f, double[][] g, double[] q, double[][] c, boolean limit, double gainScale,
              Pattern pattern, double[] gs, double[] cs, Positions record, int size) {
            this.limit = limit;
            this.gainScale = gainScale;
            this.x = x;
            this.f = f;
            this.g = g;
            this.q = q;
            this.c = c;
            this.pattern = pattern;
            this.gs = gs;
            this.cs = cs;
            this.record = record;
            this.size = size;
        }

        void c(int row, int col, double value) {
            if (c != null) {
                c[row][col] += value;
            } else if (cs != null) {
                cs[slots != null ? slots.c(cWrites++, row, col) : pattern.slot(row, col)] += value;
            } else if (record != null) {
                record.add((long) row * size + col);
            }
        }

        double v(int i) {
            return i < 0 ? 0 : x[i];
        }

        void f(int row, double value) {
            if (row >= 0) {
                f[row] += value;
            }
        }

        void g(int row, int col, double value) {
            if (row >= 0 && col >= 0) {
                if (g != null) {
                    g[row][col] += value;
                } else if (gs != null) {
                    gs[slots != null ? slots.g(gWrites++, row, col) : pattern.slot(row, col)] += value;
                } else if (record != null) {
                    record.add((long) row * size + col);
                }
            }
        }

        /** A conductance between nodes a and b: f and G. */
        void conductance(int a, int b, double gab) {
            double i = gab * (v(a) - v(b));
            f(a, i);
            f(b, -i);
            g(a, a, gab);
            g(a, b, -gab);
            g(b, a, -gab);
            g(b, b, gab);
        }

        /** A capacitance between nodes a and b: q and C. */
        void capacitance(int a, int b, double cab) {
            double charge = cab * (v(a) - v(b));
            if (q != null) {
                if (a >= 0) {
                    q[a] += charge;
                }
                if (b >= 0) {
                    q[b] -= charge;
                }
            }
            if (a >= 0) {
                c(a, a, cab);
            }
            if (b >= 0) {
                c(b, b, cab);
            }
            if (a >= 0 && b >= 0) {
                c(a, b, -cab);
                c(b, a, -cab);
            }
        }
    }

    private interface Device {
        void load(Stamp s, double t, Mode mode, double scale);
    }

    private record ResistorDevice(int a, int b, double g) implements Device {
        @Override
        public void load(Stamp s, double t, Mode mode, double scale) {
            s.conductance(a, b, g);
        }
    }

    private record CapacitorDevice(int a, int b, double farads, double leak) implements Device {
        @Override
        public void load(Stamp s, double t, Mode mode, double scale) {
            if (leak > 0) {
                s.conductance(a, b, leak);
            }
            if (mode == Mode.DYNAMIC) {
                s.capacitance(a, b, farads);
            }
        }
    }

    private record VoltageSourceDevice(VoltageSource part, int p, int m, int br) implements Device {
        @Override
        public void load(Stamp s, double t, Mode mode, double scale) {
            double current = s.x[br];
            s.f(p, -current);
            s.f(m, current);
            s.g(p, br, -1);
            s.g(m, br, 1);
            double e = scale * (mode == Mode.DC ? part.dcVolts() : part.valueAt(t));
            s.f[br] += s.v(p) - s.v(m) - e + part.seriesOhms() * current;
            s.g(br, p, 1);
            s.g(br, m, -1);
            s.g(br, br, part.seriesOhms());
        }
    }

    private record CurrentSourceDevice(int from, int to, double amps) implements Device {
        @Override
        public void load(Stamp s, double t, Mode mode, double scale) {
            s.f(from, scale * amps);
            s.f(to, -scale * amps);
        }
    }

    private static final class OpAmpDevice implements Device {
        final OpAmp part;
        final int inP;
        final int inM;
        final int vp;
        final int vn;
        final int out;
        final int br;
        final int st;
        final double gain;
        final double poleRadPerSecond;
        final double slew;

        OpAmpDevice(OpAmp part, int inP, int inM, int vp, int vn, int out, int br, int st) {
            this.part = part;
            this.inP = inP;
            this.inM = inM;
            this.vp = vp;
            this.vn = vn;
            this.out = out;
            this.br = br;
            this.st = st;
            OpAmpParams p = part.params();
            this.gain = p.openLoopGain();
            this.poleRadPerSecond = 2 * Math.PI * p.dominantPoleHz();
            this.slew = p.slewRateVoltsPerSecond();
        }

        boolean saturated(double[] x) {
            OpAmpParams p = part.params();
            double u = gain * (val(x, inP) - val(x, inM) + p.offsetVolts());
            double lo = val(x, vn) + p.swingLowVolts();
            double hi = val(x, vp) - p.swingHighVolts();
            return u >= hi || u <= lo;
        }

        private static double val(double[] x, int i) {
            return i < 0 ? 0 : x[i];
        }

        @Override
        public void load(Stamp s, double t, Mode mode, double scale) {
            OpAmpParams p = part.params();
            // Input bias currents into the pins, returned through V-.
            double ibp = scale * (p.biasAmps() + p.offsetCurrentAmps() / 2);
            double ibm = scale * (p.biasAmps() - p.offsetCurrentAmps() / 2);
            s.f(inP, ibp);
            s.f(inM, ibm);
            s.f(vn, -(ibp + ibm));
            // Quiescent current from V+ to V-.
            double iq = scale * p.quiescentAmps();
            s.f(vp, iq);
            s.f(vn, -iq);

            // Output current: out of the output pin, drawn from V+ when sourcing, returned to V- when sinking.
            double io = s.x[br];
            double root = Math.sqrt(io * io + SPLIT_SMOOTHING_AMPS * SPLIT_SMOOTHING_AMPS);
            double source = 0.5 * (io + root);
            double dSource = 0.5 * (1 + io / root);
            s.f(out, -io);
            s.g(out, br, -1);
            s.f(vp, source);
            s.g(vp, br, dSource);
            s.f(vn, -(source - io));
            s.g(vn, br, -(dSource - 1));

            // Output pin equation: V(out) = x - Rout * Io.
            double xs = s.x[st];
            s.f[br] += s.v(out) - xs + p.outputOhms() * io;
            s.g(br, out, 1);
            s.g(br, st, -1);
            s.g(br, br, p.outputOhms());

            // Limited open-loop target L(u) and its partial derivatives.
            double u = gain * s.gainScale * (s.v(inP) - s.v(inM) + scale * p.offsetVolts());
            double lo = s.v(vn) + p.swingLowVolts();
            double hi = s.v(vp) - p.swingHighVolts();
            double limited;
            double dU;
            double dLo;
            double dHi;
            double half = 0.5 * (hi - lo);
            if (!s.limit) {
                limited = u;
                dU = 1;
                dLo = 0;
                dHi = 0;
            } else if (half <= 0) {
                // Supplies too low for any window: the output rests midway between the crossed
                // limits, but never beyond a supply pin (an output stage without its supply cannot
                // drive the pin past either rail; common practice). At hi = lo both limits lie
                // between the pins, and the clamp is to the lower and the higher of the two pins
                // whichever is which, so the target stays continuous (also through V+ = V−).
                limited = 0.5 * (hi + lo);
                dU = 0;
                dLo = 0.5;
                dHi = 0.5;
                boolean vnLower = s.v(vn) <= s.v(vp);
                double pinLow = vnLower ? s.v(vn) : s.v(vp);
                double pinHigh = vnLower ? s.v(vp) : s.v(vn);
                if (limited < pinLow) {
                    limited = pinLow;
                    dLo = vnLower ? 1 : 0;
                    dHi = vnLower ? 0 : 1;
                } else if (limited > pinHigh) {
                    limited = pinHigh;
                    dLo = vnLower ? 0 : 1;
                    dHi = vnLower ? 1 : 0;
                }
            } else {
                // In a narrow window the knee is a quarter of the window, k = (hi − lo)/4, and so
                // depends on both edges: ∂k/∂hi = 1/4, ∂k/∂lo = −1/4.
                boolean narrow = 0.5 * half < KNEE_VOLTS;
                double k = narrow ? 0.5 * half : KNEE_VOLTS;
                double dkHi = narrow ? 0.25 : 0;
                if (u > hi - k) {
                    double z = (u - (hi - k)) / k;
                    double e = Math.exp(-z);
                    limited = hi - k * e;
                    dU = e;
                    double dk = -e * z; // ∂L/∂k
                    dHi = 1 - e + dk * dkHi;
                    dLo = -dk * dkHi;
                } else if (u < lo + k) {
                    double z = ((lo + k) - u) / k;
                    double e = Math.exp(-z);
                    limited = lo + k * e;
                    dU = e;
                    double dk = e * z; // ∂L/∂k
                    dLo = 1 - e - dk * dkHi;
                    dHi = dk * dkHi;
                } else {
                    limited = u;
                    dU = 1;
                    dLo = 0;
                    dHi = 0;
                }
            }
            if (mode == Mode.DC) {
                // x - L(u) = 0
                s.f[st] += xs - limited;
                s.g(st, st, 1);
                addTargetJacobian(s, -1, dU, dLo, dHi);
            } else {
                // dx/dt - SR * tanh(G * (L - x) / SR) = 0 with G = wp * r(b) (see the class comment):
                // b ~ |u - L| / |L - x| is the overdrive the limiter cuts off relative to the gap
                // still to go, both magnitudes smoothed over one knee width; r = (1 + b) / (1 + b / A)
                // makes G (L - x) ~ wp (u - x), the unclipped integrator, while the gap is large,
                // and caps G at A wp = 2 pi GBW as the output arrives at its limit.
                double a0 = gain * s.gainScale;
                double over = u - limited;
                double gap = limited - xs;
                double sOver = Math.sqrt(over * over + KNEE_VOLTS * KNEE_VOLTS);
                double sGap = Math.sqrt(gap * gap + KNEE_VOLTS * KNEE_VOLTS);
                double b = (sOver - KNEE_VOLTS) / sGap;
                double den = 1 + b / a0;
                double r = (1 + b) / den;
                double dr = (1 - 1 / a0) / (den * den);
                double g = poleRadPerSecond * r;
                double arg = g * gap / slew;
                double th = Math.tanh(arg);
                double sech2 = 1 - th * th;
                s.f[st] += -slew * th;
                // f = -SR tanh(P / SR), P = G gap: df/dv = -sech2 dP/dv, and
                // dP/dv = W d(gap)/dv + gap wp r' (db/d over) d(over)/dv, W = G + gap wp r' (db/d gap);
                // d(gap)/dx = -1; d(gap)/d(u, lo, hi) = dL; d(over)/d(u, lo, hi) = (1 - dU, -dLo, -dHi).
                double bOver = over / sOver / sGap;
                double bGap = -b * gap / (sGap * sGap);
                double w = g + gap * poleRadPerSecond * dr * bGap;
                double v = gap * poleRadPerSecond * dr * bOver;
                s.g(st, st, sech2 * w);
                addTargetJacobian(s, -sech2, w * dU + v * (1 - dU), w * dLo - v * dLo, w * dHi - v * dHi);
                if (s.q != null) {
                    s.q[st] += xs;
                }
                s.c(st, st, 1);
            }
        }

        /** Adds factor * dL/dx to row st. */
        private void addTargetJacobian(Stamp s, double factor, double dU, double dLo, double dHi) {
            double du = factor * dU * gain * s.gainScale;
            s.g(st, inP, du);
            s.g(st, inM, -du);
            s.g(st, vn, factor * dLo);
            s.g(st, vp, factor * dHi);
        }
    }
}
