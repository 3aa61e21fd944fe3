package halfrail.solve;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.Element;
import halfrail.circuit.OpAmp;
import halfrail.circuit.Resistor;
import halfrail.circuit.VoltageSource;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Finds nodes with no DC path to a defined voltage, from the circuit graph alone. DC paths
 * are resistors and voltage sources; an op-amp output is driven by the op-amp and therefore
 * defined. Capacitors are open at DC; their leakage does not count as a path, because a node
 * held only by a capacitor's insulation resistance has no bias that a design can rely on.
 * Current sources and op-amp inputs are not paths. Ground is defined.
 */
public final class FloatingNodes {
    private FloatingNodes() {}

    /** Names of every node without a DC path to ground or to a driven output, in declaration order. */
    public static List<String> find(Circuit circuit) {
        Map<String, Integer> index = new HashMap<>();
        List<String> nodes = circuit.nodes();
        index.put(Circuit.GROUND, 0);
        for (int i = 0; i < nodes.size(); i++) {
            index.put(nodes.get(i), i + 1);
        }
        int[] parent = new int[nodes.size() + 1];
        for (int i = 0; i < parent.length; i++) {
            parent[i] = i;
        }
        for (Element e : circuit.elements()) {
            if (e instanceof Resistor r) {
                union(parent, index.get(r.a()), index.get(r.b()));
            } else if (e instanceof VoltageSource v) {
                union(parent, index.get(v.plus()), index.get(v.minus()));
            } else if (e instanceof OpAmp o) {
                union(parent, index.get(o.out()), 0);
            } else if (e instanceof Capacitor) {
                continue;
            }
        }
        int groundRoot = root(parent, 0);
        List<String> floating = new ArrayList<>();
        for (int i = 0; i < nodes.size(); i++) {
            if (root(parent, i + 1) != groundRoot) {
                floating.add(nodes.get(i));
            }
        }
        return floating;
    }

    private static int root(int[] parent, int i) {
        while (parent[i] != i) {
            parent[i] = parent[parent[i]];
            i = parent[i];
        }
        return i;
    }

    private static void union(int[] parent, int a, int b) {
        int ra = root(parent, a);
        int rb = root(parent, b);
        if (ra != rb) {
            parent[ra] = rb;
        }
    }
}
