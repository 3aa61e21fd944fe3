package halfrail.io;

import halfrail.circuit.Circuit;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * A netlist as read: the circuit, the output node named by an {@code * output: NODE} comment,
 * the reader's notes (directives it accepted and ignored and the like), the names of the
 * {@code .model} lines in file order, and which model each op-amp uses.
 *
 * @param circuit     the circuit; never null
 * @param outputNode  the node named by {@code * output:}, as spelt in the circuit; empty when none
 * @param notes       things the reader accepted but did not act on, in line order
 * @param modelNames  every {@code .model} name, in file order, as spelt in the file
 * @param opAmpModels op-amp element name → the model name it uses, in element order
 */
public record Netlist(Circuit circuit, Optional<String> outputNode, List<Note> notes, List<String> modelNames,
                      Map<String, String> opAmpModels) {

    /** Something the reader accepted without acting on it, for example an analysis directive. */
    public record Note(int line, String text) {
        public Note {
            Objects.requireNonNull(text, "text");
        }

        @Override
        public String toString() {
            return line > 0 ? "line " + line + ": " + text : text;
        }
    }

    public Netlist {
        Objects.requireNonNull(circuit, "circuit");
        Objects.requireNonNull(outputNode, "outputNode");
        notes = List.copyOf(notes);
        modelNames = List.copyOf(modelNames);
        opAmpModels = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(opAmpModels));
    }

    /** A netlist of {@code circuit} alone: no output node, notes or model names. */
    public static Netlist of(Circuit circuit) {
        return new Netlist(circuit, Optional.empty(), List.of(), List.of(), Map.of());
    }
}
