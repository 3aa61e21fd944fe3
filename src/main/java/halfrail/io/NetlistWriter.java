package halfrail.io;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.CurrentSource;
import halfrail.circuit.Element;
import halfrail.circuit.OpAmp;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.Resistor;
import halfrail.circuit.VoltageSource;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * Writes a {@link Circuit} as netlist text in the subset that {@link NetlistReader} reads.
 *
 * <p>A circuit made only of what the subset expresses reads back equal: same title, same
 * elements in the same order, same nodes (the reader declares nodes in order of first use, so a
 * circuit whose nodes were declared in another order, or that declares unused nodes, reads back
 * with its nodes in order of first use; unused nodes are listed in a comment). Values are written with SPICE scale suffixes
 * ({@code 4.7k}, {@code 1meg}, {@code 100n}) or in exponent form, exactly. Op-amps with equal
 * parameters share one {@code .model}; model names come from the netlist's
 * {@link Netlist#opAmpModels()} where given, otherwise {@code opamp1}, {@code opamp2}, ….
 *
 * <p>What the subset cannot say is handled so that the DC and power-on behaviour stays the
 * same where possible: a voltage source's series resistance becomes a resistor
 * {@code R<source>_series} to an internal node {@code <source>_int}; a capacitor's leakage
 * becomes a resistor {@code R<capacitor>_leak} in parallel (a real DC path to a netlist reader,
 * so the floating-node check then counts it). Attributes with no electrical meaning at DC
 * (tolerances, temperature coefficients, ratings, technology, polarity, power-on ramps, an
 * op-amp's supply range) are written as {@code *} comments beside the element and are not read
 * back. An element whose name does not start with its type letter gets the letter put in front.
 */
public final class NetlistWriter {
    private static final int PARAMETERS_PER_LINE = 4;

    private NetlistWriter() {}

    /** The circuit alone, with generated model names and no output comment. */
    public static String write(Circuit circuit) {
        return write(Netlist.of(circuit));
    }

    /**
     * The netlist's circuit, with its output comment and model names.
     *
     * @throws NetlistException NOT_EXPRESSIBLE when a name cannot be written in the subset
     *                          (characters outside the name alphabet, two nodes or two elements
     *                          whose names differ only in case)
     */
    public static String write(Netlist netlist) {
        return new Writing(netlist).run();
    }

    private static final class Writing {
        private final Netlist netlist;
        private final Circuit circuit;
        private final StringBuilder out = new StringBuilder();
        private final Set<String> usedNodes = new HashSet<>();
        private final Set<String> usedElements = new HashSet<>();
        private final Map<OpAmpParams, String> modelNames = new LinkedHashMap<>();
        private final Set<String> usedModelNames = new HashSet<>();

        Writing(Netlist netlist) {
            this.netlist = netlist;
            this.circuit = netlist.circuit();
        }

        String run() {
            line(NetlistException.oneLine(circuit.title()).strip());
            line("* netlist subset of Halfrail (docs/netlist.md)");
            Map<String, String> folded = new HashMap<>();
            for (String node : circuit.nodes()) {
                String lower = node.toLowerCase(Locale.ROOT);
                if (!NetlistReader.isValidName(node) || NetlistReader.isGround(node)) {
                    throw notExpressible("node name '" + node + "' cannot be written in the netlist subset");
                }
                String other = folded.put(lower, node);
                if (other != null) {
                    throw notExpressible("nodes '" + other + "' and '" + node
                            + "' differ only in case, and netlist names are case-insensitive");
                }
                usedNodes.add(lower);
            }
            Set<String> connected = new HashSet<>();
            for (Element e : circuit.elements()) {
                connected.addAll(e.terminals());
            }
            for (String node : circuit.nodes()) {
                if (!connected.contains(node)) {
                    line("* node " + node + " has no element and is not written");
                }
            }
            netlist.outputNode().ifPresent(n -> line("* output: " + n));
            for (Element e : circuit.elements()) {
                usedElements.add(e.name().toLowerCase(Locale.ROOT));
            }
            Set<String> written = new HashSet<>();
            for (Element e : circuit.elements()) {
                String name = elementName(e, written);
                if (e instanceof Resistor r) {
                    List<String> dropped = new ArrayList<>();
                    if (r.tolerance() != 0) {
                        dropped.add("tolerance " + r.tolerance());
                    }
                    if (r.tempcoPpmPerKelvin() != 0) {
                        dropped.add("tempco " + r.tempcoPpmPerKelvin() + " ppm/K");
                    }
                    dropped(name, dropped);
                    line(name + " " + r.a() + " " + r.b() + " " + SpiceValues.format(r.ohms()));
                } else if (e instanceof Capacitor c) {
                    capacitor(name, c, written);
                } else if (e instanceof VoltageSource v) {
                    voltageSource(name, v, written);
                } else if (e instanceof CurrentSource i) {
                    line(name + " " + i.from() + " " + i.to() + " DC " + SpiceValues.format(i.amps()));
                } else if (e instanceof OpAmp o) {
                    String model = modelName(o);
                    OpAmpParams p = o.params();
                    OpAmpParams d = OpAmpParams.defaults();
                    if (p.supplyMinVolts() != d.supplyMinVolts() || p.supplyMaxVolts() != d.supplyMaxVolts()) {
                        dropped(name, List.of("supply range " + p.supplyMinVolts() + " V to "
                                + p.supplyMaxVolts() + " V"));
                    }
                    line(name + " " + o.inPlus() + " " + o.inMinus() + " " + o.vPos() + " " + o.vNeg() + " "
                            + o.out() + " " + model);
                }
            }
            for (Map.Entry<OpAmpParams, String> m : modelNames.entrySet()) {
                model(m.getValue(), m.getKey());
            }
            line(".end");
            return out.toString();
        }

        private void capacitor(String name, Capacitor c, Set<String> written) {
            List<String> dropped = new ArrayList<>();
            if (c.tolerance() != 0) {
                dropped.add("tolerance " + c.tolerance());
            }
            if (!c.technology().isEmpty()) {
                dropped.add("technology " + NetlistException.oneLine(c.technology()));
            }
            if (c.ratedVolts() != Double.POSITIVE_INFINITY) {
                dropped.add("rated " + c.ratedVolts() + " V");
            }
            if (c.polarised()) {
                dropped.add("polarised, + on " + c.plus());
            }
            dropped(name, dropped);
            line(name + " " + c.plus() + " " + c.minus() + " " + SpiceValues.format(c.farads()));
            if (c.leakageSiemens() > 0) {
                String leak = freshElement("R" + name + "_leak", written);
                line("* " + leak + ": leakage of " + name + " (" + c.leakageSiemens() + " S)");
                line(leak + " " + c.plus() + " " + c.minus() + " " + SpiceValues.format(1 / c.leakageSiemens()));
            }
        }

        private void voltageSource(String name, VoltageSource v, Set<String> written) {
            if (v.rampSeconds() > 0) {
                dropped(name, List.of("power-on ramp " + v.rampSeconds() + " s (a netlist's ramp is set by --ramp)"));
            }
            String ac = v.acMagnitude() > 0 ? " AC " + SpiceValues.format(v.acMagnitude()) : "";
            String value = " DC " + SpiceValues.format(v.dcVolts()) + ac;
            if (v.seriesOhms() > 0) {
                String inner = freshNode(v.name() + "_int");
                String series = freshElement("R" + name + "_series", written);
                line("* " + series + ": internal resistance of " + name);
                line(name + " " + inner + " " + v.minus() + value);
                line(series + " " + inner + " " + v.plus() + " " + SpiceValues.format(v.seriesOhms()));
            } else {
                line(name + " " + v.plus() + " " + v.minus() + value);
            }
        }

        private void model(String name, OpAmpParams p) {
            OpAmpParams d = OpAmpParams.defaults();
            double[] values = values(p);
            double[] defaults = values(d);
            List<String> items = new ArrayList<>();
            for (int i = 0; i < values.length; i++) {
                if (i < 2 || Double.compare(values[i], defaults[i]) != 0) {
                    items.add(NetlistReader.MODEL_PARAMETERS.get(i) + "=" + SpiceValues.format(values[i]));
                }
            }
            StringBuilder b = new StringBuilder(".model " + name + " opamp (");
            for (int i = 0; i < items.size(); i++) {
                if (i > 0 && i % PARAMETERS_PER_LINE == 0) {
                    line(b.toString());
                    b.setLength(0);
                    b.append("+ ");
                } else if (i > 0) {
                    b.append(' ');
                }
                b.append(items.get(i));
            }
            b.append(')');
            line(b.toString());
        }

        /** Parameter values in the order of {@link NetlistReader#MODEL_PARAMETERS}. */
        private static double[] values(OpAmpParams p) {
            return new double[] {p.openLoopGain(), p.gainBandwidthHz(), p.slewRateVoltsPerSecond(), p.offsetVolts(),
                    p.biasAmps(), p.offsetCurrentAmps(), p.swingLowVolts(), p.swingHighVolts(),
                    p.commonModeLowVolts(), p.commonModeHighVolts(), p.outputOhms(), p.quiescentAmps()};
        }

        private String modelName(OpAmp o) {
            String known = modelNames.get(o.params());
            if (known != null) {
                return known;
            }
            String hint = netlist.opAmpModels().get(o.name());
            String name;
            if (hint != null && NetlistReader.isValidName(hint)
                    && !usedModelNames.contains(hint.toLowerCase(Locale.ROOT))) {
                name = hint;
            } else {
                int i = 1;
                while (usedModelNames.contains("opamp" + i)
                        || netlist.opAmpModels().containsValue("opamp" + i)) {
                    i++;
                }
                name = "opamp" + i;
            }
            usedModelNames.add(name.toLowerCase(Locale.ROOT));
            modelNames.put(o.params(), name);
            return name;
        }

        private String elementName(Element e, Set<String> written) {
            char letter = e instanceof Resistor ? 'R' : e instanceof Capacitor ? 'C' : e instanceof VoltageSource ? 'V'
                    : e instanceof CurrentSource ? 'I' : 'X';
            String name = e.name();
            if (name.isEmpty() || Character.toUpperCase(name.charAt(0)) != letter) {
                name = letter + name;
            }
            if (!NetlistReader.isValidName(name)) {
                throw notExpressible("element name '" + e.name() + "' cannot be written in the netlist subset");
            }
            if (!written.add(name.toLowerCase(Locale.ROOT))) {
                throw notExpressible("element name '" + name + "' would be written twice");
            }
            return name;
        }

        private String freshElement(String base, Set<String> written) {
            String name = base;
            int i = 2;
            while (usedElements.contains(name.toLowerCase(Locale.ROOT))
                    || written.contains(name.toLowerCase(Locale.ROOT))) {
                name = base + i++;
            }
            if (!NetlistReader.isValidName(name)) {
                throw notExpressible("element name '" + name + "' cannot be written in the netlist subset");
            }
            written.add(name.toLowerCase(Locale.ROOT));
            return name;
        }

        private String freshNode(String base) {
            String name = base;
            int i = 2;
            while (usedNodes.contains(name.toLowerCase(Locale.ROOT))) {
                name = base + i++;
            }
            usedNodes.add(name.toLowerCase(Locale.ROOT));
            return name;
        }

        private void dropped(String name, List<String> what) {
            if (!what.isEmpty()) {
                line("* " + name + ": " + String.join(", ", what) + " (not part of the netlist subset)");
            }
        }

        private void line(String s) {
            out.append(s).append('\n');
        }

        private static NetlistException notExpressible(String problem) {
            return new NetlistException(NetlistException.Kind.NOT_EXPRESSIBLE, 0, 0, problem,
                    "names of letters, digits and _ . : - + / # [ ] < > $ & ! ? ~ ^ @ % |, unique ignoring case");
        }
    }
}
