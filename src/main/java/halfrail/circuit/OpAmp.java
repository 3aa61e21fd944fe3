package halfrail.circuit;

import java.util.List;
import java.util.Objects;

/**
 * An operational amplifier with five terminals. Its output is limited to the swing window
 * set by {@link OpAmpParams} relative to the voltages actually present on {@code vPos} and
 * {@code vNeg}; the solver honours the limit, the offset voltage and the bias currents.
 */
public record OpAmp(String name, String inPlus, String inMinus, String vPos, String vNeg, String out,
                    OpAmpParams params) implements Element {

    public OpAmp {
        Check.name(name);
        Check.node(name, "inPlus", inPlus);
        Check.node(name, "inMinus", inMinus);
        Check.node(name, "vPos", vPos);
        Check.node(name, "vNeg", vNeg);
        Check.node(name, "out", out);
        Objects.requireNonNull(params, "params");
        if (vPos.equals(vNeg)) {
            throw new CircuitException(CircuitException.Kind.BAD_CONNECTION, name, "vNeg",
                    name + ": both supply pins on node " + vPos);
        }
    }

    @Override
    public List<String> terminals() {
        return List.of(inPlus, inMinus, vPos, vNeg, out);
    }

    public OpAmp withParams(OpAmpParams p) {
        return new OpAmp(name, inPlus, inMinus, vPos, vNeg, out, p);
    }
}
