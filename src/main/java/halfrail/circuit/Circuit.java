package halfrail.circuit;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.function.UnaryOperator;

/**
 * An immutable netlist: a title, the declared nodes and the elements between them. Node
 * {@value #GROUND} is ground and always exists; {@code gnd} is accepted as an alias when
 * building. Names of nodes and elements are case-sensitive as given; two element names that
 * differ only in case are rejected (netlists are case-insensitive).
 */
public final class Circuit {
    /** The name of the ground node. */
    public static final String GROUND = "0";
    /** Accepted alias of {@link #GROUND} when building. */
    public static final String GROUND_ALIAS = "gnd";

    private final String title;
    private final List<String> nodes;
    private final List<Element> elements;
    /** Elements by name, made on first use (a study's builds are made by the thousand and rarely looked up by name). */
    private volatile Map<String, Element> byName;
    /**
     * Shared by every circuit made from another by {@link #withValues} (directly or in turn): they
     * have the same nodes and the same elements' types, names and terminals in the same order.
     */
    private final Object topology;

    private Circuit(String title, List<String> nodes, List<Element> elements) {
        this(title, nodes, elements, null);
    }

    private Circuit(String title, List<String> nodes, List<Element> elements, Object topology) {
        this.title = title;
        this.nodes = List.copyOf(nodes);
        this.elements = List.copyOf(elements);
        this.topology = topology != null ? topology : new Object();
    }

    private Map<String, Element> byName() {
        Map<String, Element> m = byName;
        if (m == null) {
            Map<String, Element> map = new HashMap<>();
            for (Element e : elements) {
                map.put(e.name(), e);
            }
            m = Collections.unmodifiableMap(map);
            byName = m;
        }
        return m;
    }

    /**
     * Whether this circuit and {@code other} have the same nodes and the same elements' types,
     * names and terminals in the same order, as {@link #withValues} demands. Answered at once for
     * circuits made from one another by {@link #withValues}; otherwise compared element by element.
     */
    public boolean sameTopologyAs(Circuit other) {
        if (other == this || other.topology == topology) {
            return true;
        }
        if (!nodes.equals(other.nodes) || elements.size() != other.elements.size()) {
            return false;
        }
        for (int i = 0; i < elements.size(); i++) {
            Element a = elements.get(i);
            Element b = other.elements.get(i);
            if (a != b && (a.getClass() != b.getClass() || !a.name().equals(b.name())
                    || !a.terminals().equals(b.terminals()))) {
                return false;
            }
        }
        return true;
    }

    public static Builder builder() {
        return new Builder();
    }

    /** A free-text title, possibly empty. */
    public String title() {
        return title;
    }

    /** Every node except ground, in declaration order. */
    public List<String> nodes() {
        return nodes;
    }

    /** Every element, in the order added. */
    public List<Element> elements() {
        return elements;
    }

    /** The elements of one type, in order. */
    public <T extends Element> List<T> elements(Class<T> type) {
        List<T> out = new ArrayList<>();
        for (Element e : elements) {
            if (type.isInstance(e)) {
                out.add(type.cast(e));
            }
        }
        return out;
    }

    public Optional<Element> element(String name) {
        return Optional.ofNullable(byName().get(name));
    }

    /** Whether {@code node} is ground (or its alias) or a declared node. */
    public boolean hasNode(String node) {
        return GROUND.equals(node) || GROUND_ALIAS.equalsIgnoreCase(node) || nodes.contains(node);
    }

    /** A copy with one element replaced by the result of {@code change}; the name must stay. */
    public Circuit replace(String elementName, UnaryOperator<Element> change) {
        Element old = byName().get(elementName);
        if (old == null) {
            throw new CircuitException(CircuitException.Kind.UNKNOWN_NODE, elementName, "name",
                    "no element named " + elementName);
        }
        Builder b = builder().title(title);
        nodes.forEach(b::node);
        for (Element e : elements) {
            b.add(e == old ? change.apply(e) : e);
        }
        return b.build();
    }

    /**
     * A copy with other element values and the same topology: {@code replacements} holds one
     * element per element of this circuit, in the same order, each of the same type with the same
     * name and terminals — only values differ. Cheaper than a builder, for studies that solve
     * many variants of one circuit.
     *
     * @throws CircuitException BAD_CONNECTION when the count, or an element's type, name or
     *                          terminals, differ from this circuit's
     */
    public Circuit withValues(List<Element> replacements) {
        if (replacements.size() != elements.size()) {
            throw new CircuitException(CircuitException.Kind.BAD_CONNECTION, title, "elements",
                    "expected " + elements.size() + " elements, got " + replacements.size());
        }
        for (int i = 0; i < elements.size(); i++) {
            Element old = elements.get(i);
            Element e = replacements.get(i);
            if (e != old && (e.getClass() != old.getClass() || !e.name().equals(old.name())
                    || !e.terminals().equals(old.terminals()))) {
                throw new CircuitException(CircuitException.Kind.BAD_CONNECTION, e.name(), "terminals",
                        "element " + i + " (" + e.name() + ") does not match " + old.name()
                                + " in type, name or terminals");
            }
        }
        return new Circuit(title, nodes, replacements, topology);
    }

    /** A builder that starts from this circuit's contents. */
    public Builder toBuilder() {
        Builder b = builder().title(title);
        nodes.forEach(b::node);
        elements.forEach(b::add);
        return b;
    }

    @Override
    public String toString() {
        return "Circuit[" + title + ", " + nodes.size() + " nodes, " + elements.size() + " elements]";
    }

    /** Collects nodes and elements; {@link #build()} validates them. Not thread-safe. */
    public static final class Builder {
        private String title = "";
        private final Set<String> nodes = new LinkedHashSet<>();
        private final Map<String, Element> elements = new LinkedHashMap<>();
        private final Map<String, String> foldedNames = new HashMap<>();
        private boolean implicitNodes;

        private Builder() {}

        public Builder title(String t) {
            this.title = t == null ? "" : t;
            return this;
        }

        /**
         * Declare nodes as elements mention them (netlist style) instead of requiring a
         * {@link #node(String)} call for each.
         */
        public Builder implicitNodes() {
            this.implicitNodes = true;
            return this;
        }

        /** Declare a node. Ground ({@code 0} or {@code gnd}) needs no declaration. */
        public Builder node(String name) {
            if (name == null || name.isBlank()) {
                throw new CircuitException(CircuitException.Kind.BAD_NAME, "", "node", "a node needs a non-empty name");
            }
            if (!isGround(name)) {
                nodes.add(name);
            }
            return this;
        }

        public Builder nodes(String... names) {
            for (String n : names) {
                node(n);
            }
            return this;
        }

        /** Add an element; its name must be unique (ignoring case). */
        public Builder add(Element e) {
            String folded = e.name().toLowerCase(Locale.ROOT);
            if (foldedNames.containsKey(folded)) {
                throw new CircuitException(CircuitException.Kind.DUPLICATE_NAME, e.name(), "name",
                        "two elements named " + e.name());
            }
            foldedNames.put(folded, e.name());
            elements.put(e.name(), e);
            if (implicitNodes) {
                for (String t : e.terminals()) {
                    node(t);
                }
            }
            return this;
        }

        public Builder resistor(String name, String a, String b, double ohms) {
            return add(new Resistor(name, a, b, ohms));
        }

        public Builder capacitor(String name, String plus, String minus, double farads) {
            return add(new Capacitor(name, plus, minus, farads));
        }

        public Builder voltageSource(String name, String plus, String minus, double volts) {
            return add(new VoltageSource(name, plus, minus, volts));
        }

        public Builder currentSource(String name, String from, String to, double amps) {
            return add(new CurrentSource(name, from, to, amps));
        }

        public Builder opAmp(String name, String inPlus, String inMinus, String vPos, String vNeg, String out,
                             OpAmpParams p) {
            return add(new OpAmp(name, inPlus, inMinus, vPos, vNeg, out, p));
        }

        /**
         * Validate and build. Ground aliases in element terminals are rewritten to
         * {@link Circuit#GROUND}.
         *
         * @throws CircuitException with kind UNKNOWN_NODE when an element uses an undeclared node
         *                          (part: the element, field: the terminal, for example {@code "b"});
         *                          BAD_CONNECTION when ground aliases put both terminals of a
         *                          source, or both supply pins of an op-amp, on ground
         */
        public Circuit build() {
            List<Element> list = new ArrayList<>(elements.size());
            for (Element e : elements.values()) {
                List<String> terminals = e.terminals();
                List<String> fields = terminalFields(e);
                for (int i = 0; i < terminals.size(); i++) {
                    String t = terminals.get(i);
                    if (!isGround(t) && !nodes.contains(t)) {
                        throw new CircuitException(CircuitException.Kind.UNKNOWN_NODE, e.name(), fields.get(i),
                                e.name() + "." + fields.get(i) + " refers to node '" + t + "', which is not declared");
                    }
                }
                list.add(groundAliasesRewritten(e));
            }
            return new Circuit(title, new ArrayList<>(nodes), list);
        }

        /** The record component names of {@code e}'s terminals, in {@link Element#terminals()} order. */
        private static List<String> terminalFields(Element e) {
            if (e instanceof Resistor) {
                return List.of("a", "b");
            } else if (e instanceof Capacitor || e instanceof VoltageSource) {
                return List.of("plus", "minus");
            } else if (e instanceof CurrentSource) {
                return List.of("from", "to");
            } else if (e instanceof OpAmp) {
                return List.of("inPlus", "inMinus", "vPos", "vNeg", "out");
            }
            throw new IllegalStateException("unhandled element type " + e.getClass());
        }

        private static boolean isGround(String n) {
            return GROUND.equals(n) || GROUND_ALIAS.equalsIgnoreCase(n);
        }

        private static String g(String n) {
            return isGround(n) ? GROUND : n;
        }

        private static Element groundAliasesRewritten(Element e) {
            if (e instanceof Resistor r) {
                return new Resistor(r.name(), g(r.a()), g(r.b()), r.ohms(), r.tolerance(), r.tempcoPpmPerKelvin());
            } else if (e instanceof Capacitor c) {
                return new Capacitor(c.name(), g(c.plus()), g(c.minus()), c.farads(), c.tolerance(), c.technology(),
                        c.ratedVolts(), c.polarised(), c.leakageSiemens());
            } else if (e instanceof VoltageSource v) {
                return new VoltageSource(v.name(), g(v.plus()), g(v.minus()), v.dcVolts(), v.acMagnitude(),
                        v.seriesOhms(), v.rampSeconds());
            } else if (e instanceof CurrentSource i) {
                return new CurrentSource(i.name(), g(i.from()), g(i.to()), i.amps());
            } else if (e instanceof OpAmp o) {
                return new OpAmp(o.name(), g(o.inPlus()), g(o.inMinus()), g(o.vPos()), g(o.vNeg()), g(o.out()),
                        o.params());
            }
            throw new IllegalStateException("unhandled element type " + e.getClass());
        }
    }
}
