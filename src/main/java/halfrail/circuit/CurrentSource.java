package halfrail.circuit;

import java.util.List;

/**
 * An independent DC current source. As in SPICE, a positive value flows from {@code from}
 * through the source to {@code to}: it draws current out of node {@code from} and pushes it
 * into node {@code to}.
 *
 * @param amps current in A
 */
public record CurrentSource(String name, String from, String to, double amps) implements Element {

    public CurrentSource {
        Check.name(name);
        Check.node(name, "from", from);
        Check.node(name, "to", to);
        Check.finite(name, "amps", amps, "A");
    }

    @Override
    public List<String> terminals() {
        return List.of(from, to);
    }
}
