package halfrail.design;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.Resistor;
import halfrail.circuit.VoltageSource;
import halfrail.parts.CapacitorTechnology;
import halfrail.parts.LeakageLevel;
import halfrail.parts.OpAmpArchetype;
import halfrail.parts.PartsLibrary;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The stage templates: turn a {@link Design} into a {@link DesignCircuit} at one supply voltage
 * and one leakage level. Every number a check reports comes from solving this circuit.
 *
 * <p>Names: the supply is {@code VSUP} on node {@code vcc}; the divider {@code RA}/{@code RB}
 * meets at {@code ref}, decoupled by {@code CREF}; a buffered reference adds {@code UREF},
 * {@code RISO} and {@code CREFB} at node {@code refx}. Stage i (from 1) has op-amp {@code Ui},
 * resistors {@code R1_i}, {@code R2_i}, bias resistor {@code RBIASi}, capacitors {@code CINi}
 * and {@code CLEGi}, and nodes {@code si.p}, {@code si.n}, {@code si.leg}, {@code si.x},
 * {@code si.out}. The signal source {@code VSIG} drives node {@code src} (DC 0 V, AC 1 V, with
 * the source resistance); the output capacitor {@code COUT} feeds node {@code load} with
 * {@code RL} and {@code CL}.
 *
 * <p>A {@link ReferenceKind#DIVIDER_DIRECT} reference has no bias resistors: every stage that
 * takes its bias from it connects its non-inverting input to the one divider node {@code ref}
 * (an AC-coupled non-inverting stage or follower, and every inverting stage). That node then
 * carries whatever signal any of those inputs carries. An AC-coupled non-inverting stage or
 * follower puts the signal itself on {@code ref}; if a second stage also sat on {@code ref},
 * the signal would reach it through the reference (and from a later stage back into an earlier
 * one: a feedback loop through the divider). So with a direct reference at most one stage may
 * put signal on the divider node, and then it must be the only stage tied to it; a design that
 * breaks this is rejected with a {@link DesignException} naming the later stage. Inverting
 * stages carry no signal at their non-inverting inputs, so several of them may share the node
 * (they still share its supply ripple). Designs with more stages use a decoupled or buffered
 * reference, whose bias resistors keep the stages apart.
 *
 * <p>Polarised capacitors are oriented the usual way: the positive terminal towards the side
 * that sits at the reference (the stage side of an input capacitor, the leg side of the
 * feedback-leg capacitor, the stage side of the output capacitor); the checks flag any that
 * the operating point still reverse-biases.
 */
public final class DesignCircuits {
    /** Supply element name. */
    public static final String SUPPLY = "VSUP";
    /** Signal source element name. */
    public static final String SIGNAL = "VSIG";
    /** Supply node name. */
    public static final String SUPPLY_NODE = "vcc";

    private DesignCircuits() {}

    /**
     * Build the circuit of {@code design} at {@code supplyVolts}, with capacitor leakage at
     * {@code leakage}.
     *
     * @throws DesignException when a part id is unknown or a value is invalid
     */
    public static DesignCircuit build(Design design, double supplyVolts, LeakageLevel leakage) {
        DesignException.RULES.positive("supplyVolts", supplyVolts, "V");
        return new Builder(design, supplyVolts, leakage).build();
    }

    /** The circuit at the supply's nominal voltage with typical leakage. */
    public static DesignCircuit nominal(Design design) {
        return build(design, design.supply().nominalVolts(), LeakageLevel.TYPICAL);
    }

    /** Resolve an op-amp choice to its parameters. @throws DesignException for an unknown archetype */
    public static OpAmpParams params(OpAmpChoice choice, String path) {
        if (choice.customParams().isPresent()) {
            return choice.customParams().get();
        }
        String id = choice.archetypeId().orElseThrow();
        PartsLibrary parts = PartsLibrary.builtIn();
        return parts.opAmpArchetype(id).orElseThrow(() -> new DesignException(path + ".archetype",
                "unknown op-amp archetype '" + id + "'; known: "
                        + parts.opAmpArchetypes().stream().map(OpAmpArchetype::id).toList())).typical();
    }

    /** Resolve a capacitor technology. @throws DesignException for an unknown id */
    public static CapacitorTechnology technology(CapacitorSpec spec, String path) {
        PartsLibrary parts = PartsLibrary.builtIn();
        return parts.capacitorTechnology(spec.technology()).orElseThrow(() -> new DesignException(path + ".technology",
                "unknown capacitor technology '" + spec.technology() + "'; known: "
                        + parts.capacitorTechnologies().stream().map(CapacitorTechnology::id).toList()));
    }

    private static final class Builder {
        private final Design design;
        private final double volts;
        private final LeakageLevel leakage;
        private final Circuit.Builder b = Circuit.builder().implicitNodes();
        private final Map<String, String> paths = new LinkedHashMap<>();
        private final List<StageNodes> opAmps = new ArrayList<>();
        /** With a direct reference: the design path of the first stage tied to the divider node, if any. */
        private String firstOnReference;
        /** Whether that stage (or any stage tied to the node) puts signal on the divider node. */
        private boolean signalOnReference;

        Builder(Design design, double volts, LeakageLevel leakage) {
            this.design = design;
            this.volts = volts;
            this.leakage = leakage;
        }

        DesignCircuit build() {
            b.title(design.name());
            Supply supply = design.supply();
            add(new VoltageSource(SUPPLY, SUPPLY_NODE, Circuit.GROUND, volts, 0, supply.internalOhms(),
                    design.powerOnRampSeconds()), "supply");
            String ref = reference();
            SignalSource src = design.source();
            add(new VoltageSource(SIGNAL, "src", Circuit.GROUND, 0, 1, src.sourceOhms(), 0), "source");
            String previous = "src";
            List<Stage> stages = design.stages();
            for (int i = 0; i < stages.size(); i++) {
                previous = stage(i, stages.get(i), previous, ref);
            }
            String loadNode = load(previous);
            return new DesignCircuit(b.build(), volts, SUPPLY, SIGNAL, SUPPLY_NODE, ref, loadNode, opAmps, paths);
        }

        /** Adds the reference network; returns the node stages are biased from. */
        private String reference() {
            Reference r = design.reference();
            add(new Resistor("RA", SUPPLY_NODE, "ref", r.upperOhms()), "reference.upperOhms");
            add(new Resistor("RB", "ref", Circuit.GROUND, r.lowerOhms()), "reference.lowerOhms");
            if (r.kind() == ReferenceKind.DIVIDER_DIRECT) {
                return "ref";
            }
            capacitor("CREF", "ref", Circuit.GROUND, r.decoupling(), "reference.decoupling");
            if (r.kind() == ReferenceKind.DIVIDER_DECOUPLED) {
                return "ref";
            }
            OpAmpParams p = params(r.buffer(), "reference.buffer");
            b.opAmp("UREF", "ref", "refb", SUPPLY_NODE, Circuit.GROUND, "refb", p);
            paths.put("UREF", "reference.buffer");
            opAmps.add(new StageNodes("reference buffer", "reference.buffer", "UREF", "ref", "refb", "refb", false, "ref"));
            add(new Resistor("RISO", "refb", "refx", r.isolationOhms()), "reference.isolationOhms");
            capacitor("CREFB", "refx", Circuit.GROUND, r.bufferDecoupling(), "reference.bufferDecoupling");
            return "refx";
        }

        /** Adds stage {@code i}; returns its output node. */
        private String stage(int i, Stage s, String previous, String ref) {
            int n = i + 1;
            String path = "stages[" + i + "]";
            String p = "s" + n + ".p";
            String m = "s" + n + ".n";
            String out = "s" + n + ".out";
            String u = "U" + n;
            Reference r = design.reference();
            boolean direct = r.kind() == ReferenceKind.DIVIDER_DIRECT;
            String input;
            if (direct) {
                checkSharedReference(i, s);
            }
            switch (s.kind()) {
                case NON_INVERTING, FOLLOWER -> {
                    if (s.inputCapacitor() != null) {
                        if (direct && s.biased()) {
                            p = ref;
                        } else if (s.biased()) {
                            add(new Resistor("RBIAS" + n, ref, p, r.biasOhms()), "reference.biasOhms");
                        }
                        capacitor("CIN" + n, p, previous, s.inputCapacitor(), path + ".inputCapacitor");
                    } else {
                        p = previous;
                    }
                    input = p;
                    if (s.kind() == StageKind.FOLLOWER) {
                        m = out;
                    } else {
                        add(new Resistor("R2_" + n, out, m, s.feedbackOhms()), path + ".feedbackOhms");
                        if (s.legCapacitor() != null) {
                            String leg = "s" + n + ".leg";
                            add(new Resistor("R1_" + n, m, leg, s.legOhms()), path + ".legOhms");
                            capacitor("CLEG" + n, leg, Circuit.GROUND, s.legCapacitor(), path + ".legCapacitor");
                        } else {
                            add(new Resistor("R1_" + n, m, Circuit.GROUND, s.legOhms()), path + ".legOhms");
                        }
                    }
                }
                case INVERTING -> {
                    if (direct) {
                        p = ref;
                    } else {
                        add(new Resistor("RBIAS" + n, ref, p, r.biasOhms()), "reference.biasOhms");
                    }
                    String x = previous;
                    input = previous;
                    if (s.inputCapacitor() != null) {
                        x = "s" + n + ".x";
                        capacitor("CIN" + n, x, previous, s.inputCapacitor(), path + ".inputCapacitor");
                    }
                    add(new Resistor("R1_" + n, x, m, s.legOhms()), path + ".legOhms");
                    add(new Resistor("R2_" + n, out, m, s.feedbackOhms()), path + ".feedbackOhms");
                }
                default -> throw new IllegalStateException("unhandled stage kind " + s.kind());
            }
            b.opAmp(u, p, m, SUPPLY_NODE, Circuit.GROUND, out, params(s.opAmp(), path + ".opAmp"));
            paths.put(u, path + ".opAmp");
            opAmps.add(new StageNodes(s.name(), path, u, p, m, out, true, input));
            return out;
        }

        /** Enforces the direct reference's one-signal-stage rule (see the class comment). */
        private void checkSharedReference(int i, Stage s) {
            boolean signalStage = s.kind() != StageKind.INVERTING;
            boolean onReference = signalStage ? s.inputCapacitor() != null && s.biased() : true;
            if (!onReference) {
                return;
            }
            if (firstOnReference != null && (signalOnReference || signalStage)) {
                String path = "stages[" + i + "]" + (signalStage ? ".inputCapacitor" : "");
                throw new DesignException(path, "with a direct divider reference this stage would share the divider "
                        + "node with " + firstOnReference + ", and the signal of one would reach the other through "
                        + "it; use a decoupled or buffered reference (each stage gets its own bias resistor)"
                        + (signalStage ? ", or DC-couple this stage" : ""));
            }
            if (firstOnReference == null) {
                firstOnReference = "stages[" + i + "]";
            }
            signalOnReference |= signalStage;
        }

        private String load(String previous) {
            Load l = design.load();
            String node = previous;
            if (l.outputCapacitor() != null) {
                node = "load";
                capacitor("COUT", previous, node, l.outputCapacitor(), "load.outputCapacitor");
            }
            add(new Resistor("RL", node, Circuit.GROUND, l.ohms()), "load.ohms");
            if (l.farads() > 0) {
                b.add(new Capacitor("CL", node, Circuit.GROUND, l.farads()));
                paths.put("CL", "load.farads");
            }
            return node;
        }

        private void capacitor(String name, String plus, String minus, CapacitorSpec spec, String path) {
            CapacitorTechnology tech = technology(spec, path);
            b.add(tech.toCapacitor(name, plus, minus, spec.farads(), spec.ratedVolts(), leakage));
            paths.put(name, path);
        }

        private void add(halfrail.circuit.Element e, String path) {
            b.add(e);
            paths.put(e.name(), path);
        }
    }
}
