package halfrail.ui;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.Element;
import halfrail.circuit.OpAmp;
import halfrail.circuit.Resistor;
import halfrail.circuit.VoltageSource;
import halfrail.design.Design;
import halfrail.design.DesignCircuit;
import halfrail.design.ReferenceKind;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.design.StageNodes;
import halfrail.units.EngineeringValue;
import halfrail.units.Unit;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * Where every part, wire and label of the circuit drawing goes: the supply, the mid-rail
 * network (divider, decoupling capacitor, buffer), the signal source, each stage and the load,
 * left to right, drawn from the circuit that {@code DesignCircuits} builds (so that the names
 * match the netlist). The reference runs as a bus along the top, feeding each stage's bias
 * resistor; each stage's feedback runs under its op-amp. Every circuit node but ground gets one
 * label with its DC voltage. Plain arithmetic in drawing pixels at scale 1, unit-tested without a
 * toolkit; {@link SchematicCanvas} only paints it.
 */
public final class SchematicGeometry {
    /** The symbols drawn. Two-terminal parts run from their first to their second point. */
    public enum Symbol { RESISTOR, CAPACITOR, POLARISED_CAPACITOR, OPAMP, SUPPLY, SIGNAL_SOURCE }

    /** A rectangle, px. */
    public record Box(double x, double y, double width, double height) {
        public boolean contains(double px, double py) {
            return px >= x && px <= x + width && py >= y && py <= y + height;
        }

        /** Whether the two rectangles share any area (touching edges do not count). */
        public boolean overlaps(Box o) {
            return x < o.x + o.width && o.x < x + width && y < o.y + o.height && o.y < y + height;
        }

        Box grow(double d) {
            return new Box(x - d, y - d, width + 2 * d, height + 2 * d);
        }
    }

    /**
     * One part as placed.
     *
     * @param id         the circuit element's name ({@code R2_1}, {@code CREF}, {@code U1})
     * @param designPath the design path it comes from ({@code stages[0].feedbackOhms}), for findings
     * @param x1         first terminal (a capacitor's positive one; an op-amp's non-inverting input)
     * @param x2         second terminal (an op-amp's output)
     * @param body       the symbol's body, which a click hits
     * @param minusOnTop for an op-amp: whether the inverting input is the upper one
     */
    public record Part(String id, String designPath, Symbol symbol, double x1, double y1, double x2, double y2,
                       Box body, boolean minusOnTop) {
        public boolean vertical() {
            return x1 == x2;
        }
    }

    /** A straight wire of one circuit node. */
    public record Wire(String node, double x1, double y1, double x2, double y2) {
        Box box() {
            return new Box(Math.min(x1, x2) - 1, Math.min(y1, y2) - 1, Math.abs(x2 - x1) + 2, Math.abs(y2 - y1) + 2);
        }
    }

    /** A point: a junction dot or where a ground symbol hangs. */
    public record Point(double x, double y) { }

    /**
     * Text in a box: a node's name and DC voltage, or a part's name and value.
     *
     * @param owner the node name (node labels) or the part id (part labels)
     * @param lines the lines, top first
     */
    public record Label(String owner, List<String> lines, Box box) {
        public Label {
            lines = List.copyOf(lines);
        }
    }

    /** Height of the label font, px (the canvas paints with it). */
    public static final double FONT_PX = 10;
    /** Width allowed per character of label text, px: a digit of a common sans face at {@link #FONT_PX} is about 6.4 px. */
    public static final double CHAR_PX = 6.6;
    /** Height of one label line, px. */
    public static final double LINE_PX = 12;
    /** Length of a resistor body along its axis, px. */
    public static final double RESISTOR_LENGTH = 30;
    /** Width of a resistor body across its axis, px. */
    public static final double RESISTOR_WIDTH = 10;
    /** Gap between a capacitor's plates, px. */
    public static final double PLATE_GAP = 6;
    /** Length of a capacitor's plates, px. */
    public static final double PLATE_LENGTH = 20;
    /** Width and height of an op-amp triangle, px. */
    public static final double OPAMP_WIDTH = 56, OPAMP_HEIGHT = 64;
    /** Diameter of a source's circle, px. */
    public static final double SOURCE_DIAMETER = 26;
    /** How far a click may miss a part's body and still hit it, px. */
    public static final double HIT_SLACK = 4;

    // the rows of the drawing, px from the top
    static final double Y_SUPPLY = 22;
    static final double Y_BUS = 46;
    static final double Y_PLUS = 94;
    static final double Y_OUT = 110;
    static final double Y_MINUS = 126;
    static final double Y_FEEDBACK = 166;
    static final double Y_LEG = 218;
    static final double Y_GROUND = 270;
    /** Natural height of the drawing, px. */
    public static final double HEIGHT = 294;
    /** Horizontal room taken by one stage, px. */
    static final double STAGE_PITCH = 330;

    private final List<Part> parts = new ArrayList<>();
    private final List<Wire> wires = new ArrayList<>();
    private final List<Point> dots = new ArrayList<>();
    private final List<Point> grounds = new ArrayList<>();
    private final List<Label> nodeLabels = new ArrayList<>();
    private final List<Label> partLabels = new ArrayList<>();
    private final List<String> unplaced = new ArrayList<>();
    private final Map<String, String> stageOf = new LinkedHashMap<>();
    private double width;

    private final DesignCircuit dc;
    private final Circuit circuit;
    private final Map<String, Double> volts;
    private final List<String> floating;

    /**
     * Lay out {@code dc}, the circuit of {@code design}, labelling each node with its voltage
     * from {@code nodeVolts} (V; a node missing from it is shown as not solved, one in
     * {@code floating} as floating).
     */
    public SchematicGeometry(Design design, DesignCircuit dc, Map<String, Double> nodeVolts, List<String> floating) {
        this.dc = dc;
        this.circuit = dc.circuit();
        this.volts = Map.copyOf(nodeVolts);
        this.floating = List.copyOf(floating);
        double x = supplyAndReference(design, dc);
        x = source(x);
        List<StageNodes> stages = dc.stages();
        String previous = "src";
        for (int i = 0; i < stages.size(); i++) {
            StageNodes sn = stages.get(i);
            StageKind kind = i < design.stages().size() ? design.stages().get(i).kind() : StageKind.NON_INVERTING;
            x = stage(x, i + 1, sn, kind, previous, dc.referenceNode());
            previous = sn.out();
        }
        width = load(x, previous);
        // the bus ends over the last stage that takes bias from it
        labelNodes();
        labelParts();
    }

    // ---- layout ----------------------------------------------------------------------------

    /** Supply, divider, decoupling and buffer; returns where the source goes. */
    private double supplyAndReference(Design design, DesignCircuit dc) {
        double xs = 40;
        VoltageSource sup = (VoltageSource) circuit.element(dc.supplySource()).orElseThrow();
        twoTerminal(sup, Symbol.SUPPLY, xs, Y_SUPPLY, xs, Y_GROUND, sup.plus(), sup.minus());
        double xd = 150;
        wire(dc.supplyNode(), xs, Y_SUPPLY, xd, Y_SUPPLY);
        Resistor ra = resistor("RA");
        Resistor rb = resistor("RB");
        twoTerminal(ra, Symbol.RESISTOR, xd, Y_SUPPLY, xd, Y_PLUS, ra.a(), ra.b());
        twoTerminal(rb, Symbol.RESISTOR, xd, Y_PLUS, xd, Y_GROUND, rb.a(), rb.b());
        String mid = ra.b();
        double xc = xd + 90;
        Optional<Element> cref = circuit.element("CREF");
        wire(mid, xd, Y_PLUS, xc, Y_PLUS);
        dot(xd, Y_PLUS);
        cref.ifPresent(c -> {
            Capacitor cap = (Capacitor) c;
            capacitor(cap, xc, Y_PLUS, xc, Y_GROUND);
        });
        ReferenceKind kind = design.reference().kind();
        if (kind != ReferenceKind.DIVIDER_BUFFERED) {
            wire(mid, xc, Y_PLUS, xc, Y_BUS);
            if (cref.isPresent()) {
                dot(xc, Y_PLUS);
            }
            busStart = xc;
            busNode = mid;
            return xc + 90;
        }
        StageNodes buf = dc.buffer().orElseThrow();
        double x0 = xc + 24;
        // the buffer: a follower with its + input on the divider's mid point
        wire(mid, xc, Y_PLUS, x0 + 40, Y_PLUS);
        if (cref.isPresent()) {
            dot(xc, Y_PLUS);
        }
        double xo = follower(x0, buf);
        Resistor riso = resistor("RISO");
        double xr = xo + 62;
        twoTerminal(riso, Symbol.RESISTOR, xo, Y_OUT, xr, Y_OUT, riso.a(), riso.b());
        double xb = xr + 24;
        String refx = riso.b();
        wire(refx, xr, Y_OUT, xb, Y_OUT);
        circuit.element("CREFB").ifPresent(c -> capacitor((Capacitor) c, xb, Y_OUT, xb, Y_GROUND));
        wire(refx, xb, Y_OUT, xb, Y_BUS);
        dot(xb, Y_OUT);
        busStart = xb;
        busNode = refx;
        return xb + 90;
    }

    private double busStart;
    private String busNode;

    /** A follower whose inputs start at {@code x0}; returns the x of its output column. */
    private double follower(double x0, StageNodes sn) {
        OpAmp u = (OpAmp) circuit.element(sn.opAmp()).orElseThrow();
        double tx = x0 + 40;
        opAmp(u, tx, false);
        double xout = tx + OPAMP_WIDTH + 28;
        double xn = tx - 14;
        wire(u.out(), tx + OPAMP_WIDTH, Y_OUT, xout, Y_OUT);
        wire(u.out(), tx, Y_MINUS, xn, Y_MINUS);
        wire(u.out(), xn, Y_MINUS, xn, Y_FEEDBACK);
        wire(u.out(), xn, Y_FEEDBACK, xout, Y_FEEDBACK);
        wire(u.out(), xout, Y_FEEDBACK, xout, Y_OUT);
        dot(xout, Y_OUT);
        return xout;
    }

    /** The signal source, its output arriving at the first stage; returns where the stage goes. */
    private double source(double x) {
        VoltageSource sig = (VoltageSource) circuit.element(dc.signalSource()).orElseThrow();
        double xs = x + 20;
        twoTerminal(sig, Symbol.SIGNAL_SOURCE, xs, Y_OUT, xs, Y_GROUND, sig.plus(), sig.minus());
        double next = xs + 64;
        wire(sig.plus(), xs, Y_OUT, next, Y_OUT);
        return next;
    }

    /**
     * Stage {@code n}: its signal arrives on {@code previous} at ({@code x}, {@link #Y_OUT}).
     * Returns where the next part goes.
     */
    private double stage(double x, int n, StageNodes sn, StageKind kind, String previous, String bus) {
        OpAmp u = (OpAmp) circuit.element(sn.opAmp()).orElseThrow();
        stageOf.put(u.name(), sn.label());
        double tx = x + 180;
        double xout = tx + OPAMP_WIDTH + 30;
        double xn = x + 156;
        double xb = x + 120;
        Optional<Capacitor> cin = circuit.element("CIN" + n).map(Capacitor.class::cast);
        Optional<Resistor> rbias = circuit.element("RBIAS" + n).map(Resistor.class::cast);
        Optional<Resistor> r1 = circuit.element("R1_" + n).map(Resistor.class::cast);
        Optional<Resistor> r2 = circuit.element("R2_" + n).map(Resistor.class::cast);
        Optional<Capacitor> cleg = circuit.element("CLEG" + n).map(Capacitor.class::cast);
        opAmp(u, tx, false);
        String p = u.inPlus();
        // the + input: from the bias resistor or the reference bus above, or from the signal
        boolean biased = rbias.isPresent() || p.equals(bus);
        if (rbias.isPresent()) {
            twoTerminal(rbias.get(), Symbol.RESISTOR, xb, Y_BUS, xb, Y_PLUS, rbias.get().a(), rbias.get().b());
            bus(xb);
        } else if (p.equals(bus)) {
            wire(p, xb, Y_BUS, xb, Y_PLUS);
            bus(xb);
        }
        double xj = x + 16;
        if (kind == StageKind.INVERTING) {
            wire(previous, x, Y_OUT, xj, Y_OUT);
            wire(previous, xj, Y_OUT, xj, Y_MINUS);
            double xr = xj;
            if (cin.isPresent()) {
                capacitor(cin.get(), x + 60, Y_MINUS, xj, Y_MINUS);
                xr = x + 60;
            }
            Resistor r = r1.orElseThrow();
            twoTerminal(r, Symbol.RESISTOR, xr, Y_MINUS, xn, Y_MINUS, r.a(), r.b());
            if (biased) {
                wire(p, xb, Y_PLUS, tx, Y_PLUS);
            }
            wire(u.inMinus(), xn, Y_MINUS, tx, Y_MINUS);
        } else {
            wire(previous, x, Y_OUT, xj, Y_OUT);
            wire(previous, xj, Y_OUT, xj, Y_PLUS);
            if (cin.isPresent()) {
                capacitor(cin.get(), x + 64, Y_PLUS, xj, Y_PLUS);
                wire(p, x + 64, Y_PLUS, tx, Y_PLUS);
                if (biased) {
                    dot(xb, Y_PLUS);
                }
            } else {
                wire(previous, xj, Y_PLUS, tx, Y_PLUS);
            }
            if (kind != StageKind.FOLLOWER) {
                wire(u.inMinus(), tx, Y_MINUS, xn, Y_MINUS);
            }
        }
        wire(u.out(), tx + OPAMP_WIDTH, Y_OUT, xout, Y_OUT);
        if (kind == StageKind.FOLLOWER) {
            wire(u.out(), tx, Y_MINUS, xn, Y_MINUS);
            wire(u.out(), xn, Y_MINUS, xn, Y_FEEDBACK);
            wire(u.out(), xn, Y_FEEDBACK, xout, Y_FEEDBACK);
        } else {
            wire(u.inMinus(), xn, Y_MINUS, xn, Y_FEEDBACK);
            Resistor f = r2.orElseThrow();
            twoTerminal(f, Symbol.RESISTOR, xout, Y_FEEDBACK, xn, Y_FEEDBACK, f.a(), f.b());
            if (kind == StageKind.INVERTING) {
                dot(xn, Y_MINUS);
            } else {
                dot(xn, Y_FEEDBACK);
                Resistor leg = r1.orElseThrow();
                if (cleg.isPresent()) {
                    twoTerminal(leg, Symbol.RESISTOR, xn, Y_FEEDBACK, xn, Y_LEG, leg.a(), leg.b());
                    capacitor(cleg.get(), xn, Y_LEG, xn, Y_GROUND);
                } else {
                    twoTerminal(leg, Symbol.RESISTOR, xn, Y_FEEDBACK, xn, Y_GROUND, leg.a(), leg.b());
                }
            }
        }
        wire(u.out(), xout, Y_FEEDBACK, xout, Y_OUT);
        dot(xout, Y_OUT);
        wire(u.out(), xout, Y_OUT, x + STAGE_PITCH, Y_OUT);
        return x + STAGE_PITCH;
    }

    /** The load behind the last stage's output at ({@code x}, {@link #Y_OUT}); returns the drawing's width. */
    private double load(double x, String previous) {
        Optional<Capacitor> cout = circuit.element("COUT").map(Capacitor.class::cast);
        Resistor rl = resistor("RL");
        double xl = x + 20;
        if (cout.isPresent()) {
            wire(previous, x, Y_OUT, x + 16, Y_OUT);
            capacitor(cout.get(), x + 16, Y_OUT, x + 70, Y_OUT);
            xl = x + 96;
            wire(rl.a(), x + 70, Y_OUT, xl, Y_OUT);
        } else {
            wire(previous, x, Y_OUT, xl, Y_OUT);
        }
        twoTerminal(rl, Symbol.RESISTOR, xl, Y_OUT, xl, Y_GROUND, rl.a(), rl.b());
        double right = xl;
        Optional<Capacitor> cl = circuit.element("CL").map(Capacitor.class::cast);
        if (cl.isPresent()) {
            right = xl + 66;
            wire(rl.a(), xl, Y_OUT, right, Y_OUT);
            dot(xl, Y_OUT);
            capacitor(cl.get(), right, Y_OUT, right, Y_GROUND);
        }
        return right + 16;
    }

    /** The bus reaches over to {@code x}. */
    private void bus(double x) {
        if (x > busStart) {
            wire(busNode, busStart, Y_BUS, x, Y_BUS);
            if (busDropped) {
                dot(busStart, Y_BUS);
            }
            busDropped = true;
            busStart = x;
        }
    }

    /** Whether the bus's current end is a stage's drop (rather than its start at the reference). */
    private boolean busDropped;

    private Resistor resistor(String name) {
        return (Resistor) circuit.element(name).orElseThrow(() -> new IllegalArgumentException("no " + name));
    }

    private void opAmp(OpAmp u, double tx, boolean minusOnTop) {
        Box body = new Box(tx, Y_OUT - OPAMP_HEIGHT / 2, OPAMP_WIDTH, OPAMP_HEIGHT);
        parts.add(new Part(u.name(), dc.designPath(u.name()), Symbol.OPAMP, tx, Y_PLUS, tx + OPAMP_WIDTH, Y_OUT, body, minusOnTop));
    }

    /** A capacitor from ({@code xa},{@code ya}) to ({@code xb},{@code yb}), its positive terminal at the first. */
    private void capacitor(Capacitor c, double xa, double ya, double xb, double yb) {
        twoTerminal(c, c.polarised() ? Symbol.POLARISED_CAPACITOR : Symbol.CAPACITOR, xa, ya, xb, yb, c.plus(), c.minus());
    }

    /**
     * A two-terminal part from point 1 (node {@code n1}) to point 2 (node {@code n2}): the body
     * in the middle, the leads as wires of the two nodes, a ground symbol at an end on ground.
     */
    private void twoTerminal(Element e, Symbol s, double x1, double y1, double x2, double y2, String n1, String n2) {
        boolean vertical = x1 == x2;
        double along = switch (s) {
            case RESISTOR -> RESISTOR_LENGTH;
            case CAPACITOR, POLARISED_CAPACITOR -> PLATE_GAP + 4;
            case SUPPLY -> 14;
            case SIGNAL_SOURCE, OPAMP -> SOURCE_DIAMETER;
        };
        double across = switch (s) {
            case RESISTOR -> RESISTOR_WIDTH;
            case CAPACITOR, POLARISED_CAPACITOR -> PLATE_LENGTH;
            case SUPPLY -> 28;
            case SIGNAL_SOURCE, OPAMP -> SOURCE_DIAMETER;
        };
        double cx = (x1 + x2) / 2;
        double cy = (y1 + y2) / 2;
        Box body = vertical ? new Box(cx - across / 2, cy - along / 2, across, along)
                : new Box(cx - along / 2, cy - across / 2, along, across);
        parts.add(new Part(e.name(), dc.designPath(e.name()), s, x1, y1, x2, y2, body, false));
        double dir = vertical ? Math.signum(y2 - y1) : Math.signum(x2 - x1);
        if (vertical) {
            wire(n1, x1, y1, x1, cy - dir * along / 2);
            wire(n2, x2, cy + dir * along / 2, x2, y2);
        } else {
            wire(n1, x1, y1, cx - dir * along / 2, y1);
            wire(n2, cx + dir * along / 2, y2, x2, y2);
        }
        if (Circuit.GROUND.equals(n2)) {
            grounds.add(new Point(x2, y2));
        }
        if (Circuit.GROUND.equals(n1)) {
            grounds.add(new Point(x1, y1));
        }
    }

    private void wire(String node, double x1, double y1, double x2, double y2) {
        if (x1 == x2 && y1 == y2) {
            return;
        }
        if (x1 != x2 && y1 != y2) {
            throw new IllegalStateException("wires run straight: " + node);
        }
        wires.add(new Wire(node, x1, y1, x2, y2));
    }

    private void dot(double x, double y) {
        dots.add(new Point(x, y));
    }

    // ---- labels ----------------------------------------------------------------------------

    /** Box of a ground symbol hanging at {@code p}. */
    static Box groundBox(Point p) {
        return new Box(p.x() - 9, p.y(), 18, 12);
    }

    private List<Box> obstacles() {
        List<Box> o = new ArrayList<>();
        parts.forEach(p -> o.add(p.body()));
        wires.forEach(w -> o.add(w.box()));
        grounds.forEach(g -> o.add(groundBox(g)));
        partLabels.forEach(l -> o.add(l.box()));
        nodeLabels.forEach(l -> o.add(l.box()));
        return o;
    }

    private void labelParts() {
        for (Part p : parts) {
            Element e = circuit.element(p.id()).orElseThrow();
            List<String> lines = partText(e);
            List<Box> candidates = new ArrayList<>();
            Box b = p.body();
            double w = textWidth(lines);
            double h = lines.size() * LINE_PX;
            if (p.symbol() == Symbol.OPAMP) {
                for (double dx = 0; dx <= 60; dx += 10) {
                    candidates.add(new Box(b.x() - dx, b.y() - h - 2, w, h));
                    candidates.add(new Box(b.x() + 10 - dx, b.y() + b.height() + 2, w, h));
                }
            } else {
                for (double gap : new double[] {4, 12}) {
                    for (double d = 0; d <= 48; d += 6) {
                        for (double sign : new double[] {1, -1}) {
                            if (p.vertical()) {
                                double y0 = b.y() + b.height() / 2 - h / 2 + sign * d;
                                candidates.add(new Box(b.x() + b.width() + gap, y0, w, h));
                                candidates.add(new Box(b.x() - w - gap, y0, w, h));
                            } else {
                                double x0 = b.x() + b.width() / 2 - w / 2 + sign * d;
                                candidates.add(new Box(x0, b.y() - h - gap, w, h));
                                candidates.add(new Box(x0, b.y() + b.height() + gap, w, h));
                            }
                        }
                    }
                }
            }
            place(p.id(), lines, candidates, partLabels);
        }
    }

    private void labelNodes() {
        for (String node : circuit.nodes()) {
            if (Circuit.GROUND.equals(node)) {
                continue;
            }
            List<String> lines = List.of(node, voltsText(node));
            double w = textWidth(lines);
            double h = lines.size() * LINE_PX;
            List<Box> candidates = new ArrayList<>();
            for (Wire wr : wires) {
                if (!wr.node().equals(node)) {
                    continue;
                }
                boolean horizontal = wr.y1() == wr.y2();
                double len = horizontal ? Math.abs(wr.x2() - wr.x1()) : Math.abs(wr.y2() - wr.y1());
                for (double t : new double[] {0.5, 0.3, 0.7, 0.15, 0.85, 0, 1}) {
                    double ax = wr.x1() + (wr.x2() - wr.x1()) * t;
                    double ay = wr.y1() + (wr.y2() - wr.y1()) * t;
                    for (double gap : new double[] {3, 12}) {
                        if (horizontal) {
                            candidates.add(new Box(ax - w / 2, ay - h - gap, w, h));
                            candidates.add(new Box(ax - w / 2, ay + gap, w, h));
                        } else {
                            candidates.add(new Box(ax + gap + 1, ay - h / 2, w, h));
                            candidates.add(new Box(ax - w - gap - 1, ay - h / 2, w, h));
                        }
                    }
                    if (len < 1) {
                        break;
                    }
                }
            }
            place(node, lines, candidates, nodeLabels);
        }
    }

    /** Put the label in the first candidate box that is clear of everything placed so far. */
    private void place(String owner, List<String> lines, List<Box> candidates, List<Label> into) {
        List<Box> taken = obstacles();
        for (Box c : candidates) {
            if (c.x() < 2 || c.y() < 2 || c.x() + c.width() > width + 60 || c.y() + c.height() > HEIGHT - 2) {
                continue;
            }
            if (taken.stream().noneMatch(c::overlaps)) {
                into.add(new Label(owner, lines, c));
                return;
            }
        }
        unplaced.add(owner);
        if (!candidates.isEmpty()) {
            into.add(new Label(owner, lines, candidates.get(0)));
        }
    }

    private List<String> partText(Element e) {
        if (e instanceof Resistor r) {
            return List.of(r.name(), EngineeringValue.format(r.ohms(), Unit.OHM));
        }
        if (e instanceof Capacitor c) {
            return List.of(c.name(), EngineeringValue.format(c.farads(), Unit.FARAD)
                    + (Double.isFinite(c.ratedVolts()) ? " " + EngineeringValue.format(c.ratedVolts(), Unit.VOLT) : ""));
        }
        if (e instanceof VoltageSource v) {
            return v.acMagnitude() > 0
                    ? List.of(v.name(), "from " + EngineeringValue.format(v.seriesOhms(), Unit.OHM))
                    : List.of(v.name(), EngineeringValue.format(v.dcVolts(), Unit.VOLT) + " supply");
        }
        if (e instanceof OpAmp u) {
            return List.of(u.name() + " · " + stageOf.getOrDefault(u.name(), "buffer"));
        }
        return List.of(e.name());
    }

    static double textWidth(List<String> lines) {
        return lines.stream().mapToInt(String::length).max().orElse(0) * CHAR_PX + 2;
    }

    private String voltsText(String node) {
        if (floating.contains(node)) {
            return "floating";
        }
        Double v = volts.get(node);
        return v == null ? "not solved" : String.format(Locale.ROOT, "%.2f V", v);
    }

    // ---- queries ---------------------------------------------------------------------------

    public List<Part> parts() {
        return List.copyOf(parts);
    }

    public List<Wire> wires() {
        return List.copyOf(wires);
    }

    /** Junctions of three or more wires. */
    public List<Point> dots() {
        return List.copyOf(dots);
    }

    /** Where a ground symbol hangs (pointing down). */
    public List<Point> grounds() {
        return List.copyOf(grounds);
    }

    /** One label per circuit node but ground: the node's name and its DC voltage. */
    public List<Label> nodeLabels() {
        return List.copyOf(nodeLabels);
    }

    /** One label per part: its name and value. */
    public List<Label> partLabels() {
        return List.copyOf(partLabels);
    }

    /** Labels that found no clear spot (drawn at their first choice); empty when the layout worked. */
    public List<String> unplaced() {
        return List.copyOf(unplaced);
    }

    /** Natural width of the drawing, px. */
    public double width() {
        double right = width;
        for (Label l : nodeLabels) {
            right = Math.max(right, l.box().x() + l.box().width() + 8);
        }
        for (Label l : partLabels) {
            right = Math.max(right, l.box().x() + l.box().width() + 8);
        }
        return right;
    }

    /** Natural height of the drawing, px. */
    public double height() {
        return HEIGHT;
    }

    /** The part whose body (give or take {@link #HIT_SLACK}) is under the point, if any. */
    public Optional<Part> hit(double x, double y) {
        for (Part p : parts) {
            if (p.body().grow(HIT_SLACK).contains(x, y)) {
                return Optional.of(p);
            }
        }
        return Optional.empty();
    }

    /** The node the stages take their bias from (drawn as the bus along the top). */
    public String busNode() {
        return busNode;
    }

    /** The part called {@code id}, if drawn. */
    public Optional<Part> part(String id) {
        return parts.stream().filter(p -> p.id().equals(id)).findFirst();
    }
}
