package halfrail.check;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.Element;
import halfrail.circuit.OpAmp;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.Resistor;
import halfrail.design.CapacitorSpec;
import halfrail.design.Design;
import halfrail.design.DesignCircuit;
import halfrail.design.DesignCircuits;
import halfrail.design.Load;
import halfrail.design.OpAmpChoice;
import halfrail.design.Reference;
import halfrail.design.Stage;
import halfrail.parts.CapacitorTechnology;
import halfrail.parts.LeakageLevel;
import halfrail.parts.OpAmpArchetype;
import halfrail.parts.OpAmpSpread;
import halfrail.parts.PartsLibrary;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The parts of a design that may stray from their nominal values, and how to build the
 * circuit of one set of values. Built on the circuit of {@link DesignCircuits} at one supply
 * voltage with typical leakage; a build changes element values only, never the topology.
 *
 * <p>Varied: every resistor of the design except the load (tolerance from
 * {@link ToleranceOptions#resistorTolerance()}, and, when a temperature coefficient and a
 * temperature range other than 25 °C alone are given, each resistor's own coefficient within
 * ±the bound and one board temperature); every capacitor of a technology (its technology's
 * {@code typicalTolerance}, and, when asked, its leakage between typical and the standard's
 * limit, the limit taken at the varied capacitance); every op-amp's offset voltage (±the
 * maximum), offset current (±the maximum) and bias current (between typical and the maximum of
 * the same sign, or ±the maximum when typical is zero), from its archetype's
 * {@link OpAmpSpread} or, for a custom op-amp, from the options (none when not given).
 * Parameters whose range is empty are left out. The load resistance and capacitance and the
 * source are the designer's givens and are not varied.
 *
 * <p>A resistor at temperature T has R·(1 + α·(T − 25 °C)) with α its coefficient.
 *
 * <p>Immutable and thread-safe.
 */
public final class ToleranceModel {
    private static final Pattern STAGE_PATH = Pattern.compile("stages\\[(\\d+)]\\.(\\w+)");

    private final Design design;
    private final DesignCircuit nominal;
    private final ToleranceOptions options;
    private final List<ToleranceParameter> parameters;
    private final Element[] elements;
    private final ResistorRecipe[] resistors;
    private final CapacitorRecipe[] capacitors;
    private final OpAmpRecipe[] opAmps;
    private final int temperature;

    private record ResistorRecipe(int element, int ohms, int tempco) {}

    private record CapacitorRecipe(int element, int farads, int leakage, CapacitorTechnology technology) {}

    private record OpAmpRecipe(int element, int offset, int bias, int offsetCurrent) {}

    private ToleranceModel(Design design, double supplyVolts, ToleranceOptions options) {
        this.design = design;
        this.options = options;
        this.nominal = DesignCircuits.build(design, supplyVolts, LeakageLevel.TYPICAL);
        Circuit c = nominal.circuit();
        this.elements = c.elements().toArray(new Element[0]);
        PartsLibrary parts = PartsLibrary.builtIn();
        List<ToleranceParameter> list = new ArrayList<>();
        List<ResistorRecipe> rs = new ArrayList<>();
        List<CapacitorRecipe> cs = new ArrayList<>();
        List<OpAmpRecipe> os = new ArrayList<>();
        double tMin = options.minTemperatureCelsius();
        double tMax = options.maxTemperatureCelsius();
        boolean drift = options.resistorTempcoPpmPerKelvin() > 0
                && (tMin != ToleranceOptions.REFERENCE_CELSIUS || tMax != ToleranceOptions.REFERENCE_CELSIUS);
        int temp = -1;
        if (drift) {
            double tNom = Math.min(tMax, Math.max(tMin, ToleranceOptions.REFERENCE_CELSIUS));
            temp = list.size();
            list.add(new ToleranceParameter("board.temperature", "board", "tolerance.temperature",
                    ToleranceParameter.Kind.TEMPERATURE, tNom, tMin, tMax, ToleranceParameter.Spread.UNIFORM));
        }
        this.temperature = temp;
        for (int i = 0; i < elements.length; i++) {
            Element e = elements[i];
            String path = nominal.designPath(e.name());
            if (e instanceof Resistor r && !path.startsWith("load.")) {
                double tol = options.resistorTolerance();
                int ohms = -1;
                if (tol > 0) {
                    ohms = add(list, new ToleranceParameter(r.name() + ".ohms", r.name(), path,
                            ToleranceParameter.Kind.RESISTANCE, r.ohms(), r.ohms() * (1 - tol), r.ohms() * (1 + tol),
                            ToleranceParameter.Spread.SYMMETRIC));
                }
                int tc = -1;
                if (drift) {
                    double a = options.resistorTempcoPpmPerKelvin();
                    tc = add(list, new ToleranceParameter(r.name() + ".tempco", r.name(), path,
                            ToleranceParameter.Kind.TEMPCO, 0, -a, a, ToleranceParameter.Spread.UNIFORM));
                }
                if (ohms >= 0 || tc >= 0) {
                    rs.add(new ResistorRecipe(i, ohms, tc));
                }
            } else if (e instanceof Capacitor cap && !cap.technology().isEmpty()) {
                CapacitorTechnology tech = parts.requireCapacitorTechnology(cap.technology());
                double tol = tech.typicalTolerance();
                int farads = -1;
                if (tol > 0) {
                    farads = add(list, new ToleranceParameter(cap.name() + ".farads", cap.name(), path,
                            ToleranceParameter.Kind.CAPACITANCE, cap.farads(), cap.farads() * (1 - tol),
                            cap.farads() * (1 + tol), ToleranceParameter.Spread.SYMMETRIC));
                }
                int leak = -1;
                if (options.capacitorLeakage()) {
                    leak = add(list, new ToleranceParameter(cap.name() + ".leakage", cap.name(), path,
                            ToleranceParameter.Kind.LEAKAGE, 0, 0, 1, ToleranceParameter.Spread.UNIFORM));
                }
                if (farads >= 0 || leak >= 0) {
                    cs.add(new CapacitorRecipe(i, farads, leak, tech));
                }
            } else if (e instanceof OpAmp o && options.opAmpInputErrors()) {
                Optional<OpAmpSpread> spread = spread(path, parts);
                if (spread.isPresent()) {
                    OpAmpSpread s = spread.get();
                    OpAmpParams p = o.params();
                    int vos = range(list, o.name() + ".offsetVolts", o.name(), path,
                            ToleranceParameter.Kind.OFFSET_VOLTS, p.offsetVolts(), -s.offsetVoltsMax(),
                            s.offsetVoltsMax(), ToleranceParameter.Spread.SYMMETRIC);
                    double ib = p.biasAmps();
                    double ibLow = ib > 0 ? ib : ib < 0 ? -s.biasAmpsMax() : -s.biasAmpsMax();
                    double ibHigh = ib > 0 ? s.biasAmpsMax() : ib < 0 ? ib : s.biasAmpsMax();
                    int bias = range(list, o.name() + ".biasAmps", o.name(), path, ToleranceParameter.Kind.BIAS_AMPS,
                            ib, ibLow, ibHigh, ToleranceParameter.Spread.UNIFORM);
                    int ios = range(list, o.name() + ".offsetCurrentAmps", o.name(), path,
                            ToleranceParameter.Kind.OFFSET_CURRENT_AMPS, p.offsetCurrentAmps(),
                            -s.offsetCurrentAmpsMax(), s.offsetCurrentAmpsMax(), ToleranceParameter.Spread.SYMMETRIC);
                    if (vos >= 0 || bias >= 0 || ios >= 0) {
                        os.add(new OpAmpRecipe(i, vos, bias, ios));
                    }
                }
            }
        }
        this.parameters = List.copyOf(list);
        this.resistors = rs.toArray(new ResistorRecipe[0]);
        this.capacitors = cs.toArray(new CapacitorRecipe[0]);
        this.opAmps = os.toArray(new OpAmpRecipe[0]);
    }

    /**
     * The tolerance model of {@code design} at its nominal supply.
     *
     * @throws StudyOptionsException when a custom spread names a design path with no custom op-amp
     * @throws halfrail.design.DesignException when the design is invalid
     */
    public static ToleranceModel of(Design design, ToleranceOptions options) {
        return of(design, design.supply().nominalVolts(), options);
    }

    /** The tolerance model of {@code design} at {@code supplyVolts} V. */
    public static ToleranceModel of(Design design, double supplyVolts, ToleranceOptions options) {
        StudyOptionsException.RULES.required("design", design);
        StudyOptionsException.RULES.required("tolerance", options);
        StudyOptionsException.RULES.positive("supplyVolts", supplyVolts, "V");
        ToleranceModel m = new ToleranceModel(design, supplyVolts, options);
        for (String path : options.customOpAmpSpreads().keySet()) {
            OpAmpChoice choice = choiceAt(design, path);
            if (choice == null || choice.customParams().isEmpty()) {
                throw new StudyOptionsException("tolerance.customOpAmpSpreads",
                        "'" + path + "' is not a custom op-amp of the design");
            }
        }
        return m;
    }

    private static int add(List<ToleranceParameter> list, ToleranceParameter p) {
        list.add(p);
        return list.size() - 1;
    }

    private static int range(List<ToleranceParameter> list, String id, String element, String path,
                             ToleranceParameter.Kind kind, double nominal, double low, double high,
                             ToleranceParameter.Spread spread) {
        double lo = Math.min(low, nominal);
        double hi = Math.max(high, nominal);
        if (!(hi > lo)) {
            return -1;
        }
        return add(list, new ToleranceParameter(id, element, path, kind, nominal, lo, hi, spread));
    }

    private Optional<OpAmpSpread> spread(String path, PartsLibrary parts) {
        OpAmpChoice choice = choiceAt(design, path);
        if (choice == null) {
            return Optional.empty();
        }
        if (choice.archetypeId().isPresent()) {
            return parts.opAmpArchetype(choice.archetypeId().get()).map(OpAmpArchetype::spread);
        }
        return Optional.ofNullable(options.customOpAmpSpreads().get(path));
    }

    /** The op-amp choice at a design path ({@code stages[i].opAmp} or {@code reference.buffer}), or null. */
    private static OpAmpChoice choiceAt(Design design, String path) {
        if (path.equals("reference.buffer")) {
            return design.reference().buffer();
        }
        Matcher m = STAGE_PATH.matcher(path);
        if (m.matches() && m.group(2).equals("opAmp")) {
            int i = Integer.parseInt(m.group(1));
            return i < design.stages().size() ? design.stages().get(i).opAmp() : null;
        }
        return null;
    }

    public Design design() {
        return design;
    }

    /** The nominal circuit the builds vary. */
    public DesignCircuit nominalCircuit() {
        return nominal;
    }

    public ToleranceOptions options() {
        return options;
    }

    /** Every varied quantity, in a fixed order; value arrays follow it. */
    public List<ToleranceParameter> parameters() {
        return parameters;
    }

    /** The nominal value of every parameter, in {@link #parameters()} order. */
    public double[] nominalValues() {
        double[] v = new double[parameters.size()];
        for (int i = 0; i < v.length; i++) {
            v[i] = parameters.get(i).nominalValue();
        }
        return v;
    }

    /** The index of the parameter with this id. */
    public Optional<Integer> indexOf(String id) {
        for (int i = 0; i < parameters.size(); i++) {
            if (parameters.get(i).id().equals(id)) {
                return Optional.of(i);
            }
        }
        return Optional.empty();
    }

    /** The resistance of recipe r at these values, Ω, temperature drift included. */
    private double ohms(ResistorRecipe r, double[] values) {
        Resistor nominalR = (Resistor) elements[r.element()];
        double ohms = r.ohms() >= 0 ? values[r.ohms()] : nominalR.ohms();
        if (r.tempco() >= 0) {
            ohms *= 1 + values[r.tempco()] * 1e-6 * (values[temperature] - ToleranceOptions.REFERENCE_CELSIUS);
        }
        return ohms;
    }

    /**
     * The circuit of one build.
     *
     * @param values one value per parameter, in {@link #parameters()} order
     */
    public Circuit circuit(double[] values) {
        if (values.length != parameters.size()) {
            throw new IllegalArgumentException("expected " + parameters.size() + " values, got " + values.length);
        }
        Element[] es = elements.clone();
        for (ResistorRecipe r : resistors) {
            es[r.element()] = ((Resistor) elements[r.element()]).withOhms(ohms(r, values));
        }
        for (CapacitorRecipe c : capacitors) {
            Capacitor cap = (Capacitor) elements[c.element()];
            double farads = c.farads() >= 0 ? values[c.farads()] : cap.farads();
            double typical = c.technology().leakageSiemens(farads, cap.ratedVolts(), LeakageLevel.TYPICAL);
            double g = typical;
            if (c.leakage() >= 0) {
                double limit = c.technology().leakageSiemens(farads, cap.ratedVolts(), LeakageLevel.LIMIT);
                g = typical + values[c.leakage()] * (limit - typical);
            }
            es[c.element()] = cap.withFarads(farads).withLeakage(g);
        }
        for (OpAmpRecipe o : opAmps) {
            OpAmp op = (OpAmp) elements[o.element()];
            OpAmpParams p = op.params();
            double vos = o.offset() >= 0 ? values[o.offset()] : p.offsetVolts();
            double ib = o.bias() >= 0 ? values[o.bias()] : p.biasAmps();
            double ios = o.offsetCurrent() >= 0 ? values[o.offsetCurrent()] : p.offsetCurrentAmps();
            es[o.element()] = op.withParams(p.withInputErrors(vos, ib, ios));
        }
        return nominal.circuit().withValues(java.util.Arrays.asList(es));
    }

    /**
     * The design of one build, so that it can be opened and analysed on its own: resistances
     * (temperature drift included) and capacitances written into their fields, op-amps with
     * varied input errors turned into custom parts with those errors. What the design model cannot
     * hold is listed in {@link BuildDesign#notCarried()}: capacitor leakage (the design takes
     * leakage from the technology), and the bias resistors of the second and later stages, which
     * share the one field {@code reference.biasOhms} (the first stage's value is written).
     */
    public BuildDesign buildDesign(double[] values, String name) {
        Reference ref = design.reference();
        double upper = ref.upperOhms();
        double lower = ref.lowerOhms();
        double bias = ref.biasOhms();
        double iso = ref.isolationOhms();
        CapacitorSpec decoupling = ref.decoupling();
        CapacitorSpec bufferDecoupling = ref.bufferDecoupling();
        OpAmpChoice buffer = ref.buffer();
        Load load = design.load();
        CapacitorSpec outCap = load.outputCapacitor();
        List<Stage> stages = new ArrayList<>(design.stages());
        List<String> notCarried = new ArrayList<>();
        boolean biasWritten = false;
        for (ResistorRecipe r : resistors) {
            Resistor res = (Resistor) elements[r.element()];
            double ohms = ohms(r, values);
            String path = nominal.designPath(res.name());
            switch (path) {
                case "reference.upperOhms" -> upper = ohms;
                case "reference.lowerOhms" -> lower = ohms;
                case "reference.isolationOhms" -> iso = ohms;
                case "reference.biasOhms" -> {
                    if (!biasWritten) {
                        bias = ohms;
                        biasWritten = true;
                    } else if (ohms != bias) {
                        notCarried.add(res.name() + ".ohms");
                    }
                }
                default -> {
                    Matcher m = STAGE_PATH.matcher(path);
                    if (m.matches()) {
                        int i = Integer.parseInt(m.group(1));
                        Stage s = stages.get(i);
                        stages.set(i, m.group(2).equals("feedbackOhms") ? s.withFeedbackOhms(ohms) : s.withLegOhms(ohms));
                    } else {
                        notCarried.add(res.name() + ".ohms");
                    }
                }
            }
        }
        for (CapacitorRecipe c : capacitors) {
            Capacitor cap = (Capacitor) elements[c.element()];
            if (c.leakage() >= 0 && values[c.leakage()] != parameters.get(c.leakage()).nominalValue()) {
                notCarried.add(cap.name() + ".leakage");
            }
            if (c.farads() < 0) {
                continue;
            }
            double farads = values[c.farads()];
            String path = nominal.designPath(cap.name());
            switch (path) {
                case "reference.decoupling" -> decoupling = decoupling.withFarads(farads);
                case "reference.bufferDecoupling" -> bufferDecoupling = bufferDecoupling.withFarads(farads);
                case "load.outputCapacitor" -> outCap = outCap.withFarads(farads);
                default -> {
                    Matcher m = STAGE_PATH.matcher(path);
                    if (m.matches()) {
                        int i = Integer.parseInt(m.group(1));
                        Stage s = stages.get(i);
                        stages.set(i, m.group(2).equals("inputCapacitor")
                                ? s.withInputCapacitor(s.inputCapacitor().withFarads(farads))
                                : s.withLegCapacitor(s.legCapacitor().withFarads(farads)));
                    } else {
                        notCarried.add(cap.name() + ".farads");
                    }
                }
            }
        }
        for (OpAmpRecipe o : opAmps) {
            OpAmp op = (OpAmp) elements[o.element()];
            OpAmpParams p = op.params();
            double vos = o.offset() >= 0 ? values[o.offset()] : p.offsetVolts();
            double ib = o.bias() >= 0 ? values[o.bias()] : p.biasAmps();
            double ios = o.offsetCurrent() >= 0 ? values[o.offsetCurrent()] : p.offsetCurrentAmps();
            OpAmpChoice custom = OpAmpChoice.custom(p.withInputErrors(vos, ib, ios));
            String path = nominal.designPath(op.name());
            if (path.equals("reference.buffer")) {
                buffer = custom;
            } else {
                Matcher m = STAGE_PATH.matcher(path);
                if (m.matches()) {
                    int i = Integer.parseInt(m.group(1));
                    stages.set(i, stages.get(i).withOpAmp(custom));
                }
            }
        }
        Reference newRef = new Reference(ref.kind(), upper, lower, decoupling, bias, buffer, iso, bufferDecoupling);
        Design d = new Design(name, design.description(), design.supply(), newRef, stages, design.source(),
                new Load(load.ohms(), load.farads(), outCap), design.thresholds(), design.powerOnRampSeconds());
        Map<String, Double> byId = new LinkedHashMap<>();
        for (int i = 0; i < parameters.size(); i++) {
            byId.put(parameters.get(i).id(), values[i]);
        }
        return new BuildDesign(d, byId, notCarried);
    }
}
