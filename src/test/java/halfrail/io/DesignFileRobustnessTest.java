package halfrail.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import halfrail.io.DesignFileException.Kind;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.ShrinkingMode;
import net.jqwik.api.constraints.IntRange;

import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * Fuzzing the loader: truncated files, mutated bytes, binary junk, wrong types, huge and tiny
 * numbers, unknown fields, deep nesting and very long lines either read as a design or give a
 * {@link DesignFileException} with a location — never another exception, an out-of-memory or a
 * hang. The time limit per input is a hang guard, far above the milliseconds a read takes.
 */
class DesignFileRobustnessTest {
    /** Hang guard per input; not a speed target. */
    static final Duration HANG_GUARD = Duration.ofSeconds(10);

    private static final byte[] SAMPLE = DesignFileTexts.rich().getBytes(StandardCharsets.UTF_8);

    /** Reads bytes; passes when a design comes back or a located DesignFileException is thrown. */
    static void readsOrRefuses(byte[] bytes) {
        assertTimeoutPreemptively(HANG_GUARD, () -> {
            try {
                DesignFiles.parse(bytes, "fuzz.json");
            } catch (DesignFileException e) {
                assertLocated(e);
            } catch (RuntimeException | Error e) {
                fail("not a DesignFileException: " + e, e);
            }
        });
    }

    static void readsOrRefuses(String text) {
        assertTimeoutPreemptively(HANG_GUARD, () -> {
            try {
                DesignFiles.read(text, "fuzz.json");
            } catch (DesignFileException e) {
                assertLocated(e);
            } catch (RuntimeException | Error e) {
                fail("not a DesignFileException: " + e, e);
            }
        });
    }

    /** Syntax errors carry a line, value errors a JSON path; every message is one line. */
    static void assertLocated(DesignFileException e) {
        assertTrue(e.getMessage().indexOf('\n') < 0 && e.getMessage().indexOf('\r') < 0, e.getMessage());
        assertTrue(e.getMessage().length() < 2000, "a bounded message");
        switch (e.kind()) {
            case SYNTAX, DUPLICATE_FIELD -> assertTrue(e.line() > 0, e::getMessage);
            case TOO_LARGE, IO -> { }
            default -> assertTrue(e.jsonPath().startsWith("$"), e::getMessage);
        }
    }

    @Property(tries = 200, seed = "118115985787151")
    void aTruncatedFileIsReadOrRefused(@ForAll @IntRange(min = 0, max = 100_000) int cut) {
        int at = cut % (SAMPLE.length + 1);
        byte[] head = java.util.Arrays.copyOf(SAMPLE, at);
        readsOrRefuses(head);
    }

    @Property(tries = 300, shrinking = ShrinkingMode.BOUNDED, seed = "260002392983112")
    void aFileWithMutatedBytesIsReadOrRefused(@ForAll("mutations") List<int[]> mutations) {
        byte[] bytes = SAMPLE.clone();
        for (int[] m : mutations) {
            bytes[m[0] % bytes.length] = (byte) m[1];
        }
        readsOrRefuses(bytes);
    }

    @Provide
    Arbitrary<List<int[]>> mutations() {
        Arbitrary<int[]> one = net.jqwik.api.Combinators.combine(Arbitraries.integers().between(0, 1_000_000),
                Arbitraries.integers().between(0, 255)).as((at, b) -> new int[] {at, b});
        return one.list().ofMinSize(1).ofMaxSize(8);
    }

    @Property(tries = 100, seed = "21160679795062")
    void binaryJunkIsRefused(@ForAll("junk") byte[] junk) {
        readsOrRefuses(junk);
    }

    @Provide
    Arbitrary<byte[]> junk() {
        return Arbitraries.bytes().array(byte[].class).ofMaxSize(4096);
    }

    @Property(tries = 300, shrinking = ShrinkingMode.BOUNDED, seed = "130762869278700")
    void anyValueReplacedByAnotherTypeOrAnExtremeNumberIsReadOrRefused(
            @ForAll @IntRange(min = 0, max = 10_000) int where, @ForAll("replacements") JsonNode replacement) {
        ObjectNode tree = DesignFileTexts.tree(DesignFileTexts.rich());
        List<Map.Entry<JsonNode, String>> slots = slots(tree);
        Map.Entry<JsonNode, String> slot = slots.get(where % slots.size());
        if (slot.getKey() instanceof ObjectNode o) {
            o.set(slot.getValue(), replacement);
        } else {
            ((ArrayNode) slot.getKey()).set(Integer.parseInt(slot.getValue()), replacement);
        }
        readsOrRefuses(DesignFileTexts.json(tree));
    }

    @Provide
    Arbitrary<JsonNode> replacements() {
        JsonNodeFactory f = JsonNodeFactory.instance;
        return Arbitraries.oneOf(
                Arbitraries.of(f.nullNode(), f.booleanNode(true), f.arrayNode(), f.objectNode(), f.textNode(""),
                        f.textNode("NaN"), f.textNode("Infinity"), f.textNode("1e400"), f.textNode("-0"),
                        f.textNode("4k7k"), f.textNode("10 µF"), f.textNode("\u0000"), f.textNode("9".repeat(400))),
                Arbitraries.of(0.0, -0.0, 1e-320, Double.MIN_VALUE, -1e-300, 1e308, -1e308, Double.MAX_VALUE, 1.0, -1.0,
                        0.5, 2.0, 3e9).map(v -> (JsonNode) f.numberNode(v)),
                Arbitraries.of(0L, -1L, 1L, 2L, Long.MAX_VALUE, Long.MIN_VALUE, (long) Integer.MAX_VALUE + 1)
                        .map(v -> (JsonNode) f.numberNode(v)),
                Arbitraries.of(new java.math.BigDecimal("1e999999"), new java.math.BigDecimal("-1e-999999"))
                        .map(v -> (JsonNode) f.numberNode(v)),
                Arbitraries.strings().ofMaxLength(30).map(f::textNode));
    }

    /** Every place in the tree a value sits: (container, field name or index). */
    private static List<Map.Entry<JsonNode, String>> slots(JsonNode node) {
        List<Map.Entry<JsonNode, String>> out = new ArrayList<>();
        if (node instanceof ObjectNode o) {
            o.fieldNames().forEachRemaining(name -> {
                out.add(Map.entry(o, name));
                out.addAll(slots(o.get(name)));
            });
        } else if (node instanceof ArrayNode a) {
            for (int i = 0; i < a.size(); i++) {
                out.add(Map.entry(a, Integer.toString(i)));
                out.addAll(slots(a.get(i)));
            }
        }
        return out;
    }

    @Property(tries = 100, seed = "95967389198369")
    void anUnknownFieldAnywhereIsRefusedAtItsPath(@ForAll @IntRange(min = 0, max = 10_000) int where,
                                                 @ForAll("fieldNames") String name) {
        ObjectNode tree = DesignFileTexts.tree(DesignFileTexts.rich());
        List<ObjectNode> objects = new ArrayList<>();
        collectObjects(tree, objects);
        ObjectNode target = objects.get(where % objects.size());
        if (target.has(name)) {
            return;
        }
        target.put(name, 1);
        try {
            DesignFiles.read(DesignFileTexts.json(tree), "fuzz.json");
            fail("an unknown field '" + name + "' was accepted");
        } catch (DesignFileException e) {
            assertEquals(Kind.UNKNOWN_FIELD, e.kind(), e::getMessage);
            assertTrue(e.jsonPath().endsWith(FieldReader.child("", FieldReader.shorten(name))), e::getMessage);
        }
    }

    @Provide
    Arbitrary<String> fieldNames() {
        return Arbitraries.oneOf(Arbitraries.strings().alpha().ofMinLength(1).ofMaxLength(12),
                Arbitraries.strings().ofMinLength(1).ofMaxLength(80));
    }

    private static void collectObjects(JsonNode node, List<ObjectNode> out) {
        if (node instanceof ObjectNode o) {
            out.add(o);
        }
        node.elements().forEachRemaining(child -> collectObjects(child, out));
    }

    @Property(tries = 30, seed = "241452353792499")
    void deeplyNestedJsonIsRefused(@ForAll @IntRange(min = 1, max = 200_000) int depth,
                                   @ForAll boolean objects) {
        String open = objects ? "{\"a\":" : "[";
        String close = objects ? "}" : "]";
        int n = Math.min(depth, DesignFiles.MAX_FILE_BYTES / open.length() - 1);
        String json = open.repeat(n) + (objects ? "1" : "") + close.repeat(n);
        readsOrRefuses(json);
        if (n > DesignFiles.MAX_NESTING_DEPTH) {
            try {
                DesignFiles.read(json, "deep.json");
            } catch (DesignFileException e) {
                assertTrue(e.kind() == Kind.TOO_LARGE, e::getMessage);
            }
        }
    }

    @Property(tries = 20, seed = "258462478146464")
    void veryLongLinesAreReadOrRefused(@ForAll @IntRange(min = 1, max = 2_000_000) int length,
                                       @ForAll boolean inAString) {
        String pad = inAString ? "x".repeat(length) : " ".repeat(length);
        String json = inAString
                ? DesignFileTexts.with(DesignFileTexts.rich(), "/description", pad)
                : DesignFileTexts.rich().replaceFirst("\\{", "{" + pad);
        readsOrRefuses(json);
        boolean tooLong = (inAString && length > DesignFiles.MAX_STRING_LENGTH)
                || json.getBytes(StandardCharsets.UTF_8).length > DesignFiles.MAX_FILE_BYTES;
        try {
            DesignFiles.read(json, "long.json");
            assertFalse(tooLong, "a text beyond the limits was accepted");
        } catch (DesignFileException e) {
            assertEquals(Kind.TOO_LARGE, e.kind(), e::getMessage);
        }
    }
}
