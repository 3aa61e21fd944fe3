package halfrail.io;

import com.fasterxml.jackson.core.JsonPointer;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

/** The sample design files and small edits of their JSON, for the tests. */
final class DesignFileTexts {
    /** The folder of sample designs, relative to the project (the tests' working folder). */
    static final Path SAMPLES = Path.of("samples");
    /** A sample with every part of the format: two stage kinds, a buffered reference, a custom op-amp, thresholds. */
    static final Path RICH_SAMPLE = SAMPLES.resolve("li-ion-sensor-front-end.json");

    private static final ObjectMapper JSON = new ObjectMapper();

    private DesignFileTexts() {}

    static List<Path> samples() {
        try (Stream<Path> files = Files.list(SAMPLES)) {
            return files.filter(p -> p.getFileName().toString().endsWith(".json")).sorted().toList();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static String text(Path file) {
        try {
            return Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static ObjectNode tree(String json) {
        try {
            return (ObjectNode) JSON.readTree(json);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static String rich() {
        return text(RICH_SAMPLE);
    }

    static String json(JsonNode tree) {
        try {
            return JSON.writeValueAsString(tree);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** {@code json} with the value at the JSON pointer {@code at} (for example /stages/0/legOhms) replaced or added. */
    static String with(String json, String at, JsonNode value) {
        ObjectNode root = tree(json);
        JsonPointer p = JsonPointer.compile(at);
        JsonNode parent = root.at(p.head());
        String last = p.last().getMatchingProperty();
        if (parent instanceof ArrayNode a) {
            a.set(p.last().getMatchingIndex(), value);
        } else {
            ((ObjectNode) parent).set(last, value);
        }
        return json(root);
    }

    static String with(String json, String at, String text) {
        return with(json, at, JSON.getNodeFactory().textNode(text));
    }

    static String with(String json, String at, int number) {
        return with(json, at, JSON.getNodeFactory().numberNode(number));
    }

    static String with(String json, String at, double number) {
        return with(json, at, JSON.getNodeFactory().numberNode(number));
    }

    /** {@code json} without the field at the JSON pointer {@code at}. */
    static String without(String json, String at) {
        ObjectNode root = tree(json);
        JsonPointer p = JsonPointer.compile(at);
        ((ObjectNode) root.at(p.head())).remove(p.last().getMatchingProperty());
        return json(root);
    }

    static JsonNode parse(String json) {
        try {
            return JSON.readTree(json);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
