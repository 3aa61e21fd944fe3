package halfrail.io;

import com.fasterxml.jackson.databind.JsonNode;
import halfrail.io.DesignFileException.Kind;
import halfrail.units.ValueFormatException;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.function.Function;
import java.util.regex.Pattern;

/**
 * Strict reading of one JSON object of a design file: every field it may hold is declared up
 * front, so a misspelt field is reported as unknown rather than as a missing one; every value
 * is checked for its JSON type and, for quantities, read with its unit. Errors name the JSON path.
 */
final class FieldReader {
    /** Names longer than this are cut short in messages, so a hostile file cannot flood them. */
    static final int MAX_NAME_IN_MESSAGE = 60;
    private static final Pattern PLAIN_NAME = Pattern.compile("[A-Za-z_][A-Za-z0-9_]*");

    private final JsonNode node;
    private final String path;
    private final Context context;

    /** What every reader of one file shares: the source name and the path rewriting of a migrated file. */
    record Context(String source, Function<String, String> originalPath, String note) {
        DesignFileException error(Kind kind, String jsonPath, String expected, String detail) {
            String shown = originalPath.apply(jsonPath);
            return DesignFileException.at(kind, source, shown, expected, note.isEmpty() ? detail : detail + " " + note);
        }
    }

    private FieldReader(JsonNode node, String path, Context context) {
        this.node = node;
        this.path = path;
        this.context = context;
    }

    /** The object at {@code path}. @throws DesignFileException WRONG_TYPE when it is not an object */
    static FieldReader of(JsonNode node, String path, Context context) {
        if (node == null || !node.isObject()) {
            throw context.error(Kind.WRONG_TYPE, path, "a JSON object", "expected a JSON object, got " + describe(node));
        }
        return new FieldReader(node, path, context);
    }

    String path() {
        return path;
    }

    Context context() {
        return context;
    }

    /** The path of a field of this object. */
    String pathOf(String field) {
        return child(path, field);
    }

    static String child(String parent, String field) {
        if (PLAIN_NAME.matcher(field).matches()) {
            return parent + "." + field;
        }
        return parent + "['" + shorten(field).replace("\\", "\\\\").replace("'", "\\'") + "']";
    }

    /** Refuses any field not among {@code allowed}. */
    FieldReader allowOnly(List<String> allowed) {
        Iterator<String> names = node.fieldNames();
        while (names.hasNext()) {
            String name = names.next();
            if (!allowed.contains(name)) {
                String expected = "one of the fields " + String.join(", ", allowed);
                throw context.error(Kind.UNKNOWN_FIELD, pathOf(name), expected,
                        "unknown field '" + shorten(name) + "'; expected " + expected);
            }
        }
        return this;
    }

    boolean has(String field) {
        return node.has(field);
    }

    /** The raw value of a required field. */
    JsonNode required(String field) {
        JsonNode v = node.get(field);
        if (v == null) {
            throw context.error(Kind.MISSING_FIELD, pathOf(field), "the field " + field, "required field '" + field + "' is missing");
        }
        if (v.isNull()) {
            throw context.error(Kind.WRONG_TYPE, pathOf(field), "a value", "null is not accepted here");
        }
        return v;
    }

    /** The raw value of an optional field; an explicit null is refused like any wrong type. */
    Optional<JsonNode> optional(String field) {
        return has(field) ? Optional.of(required(field)) : Optional.empty();
    }

    String string(String field) {
        JsonNode v = required(field);
        if (!v.isTextual()) {
            throw context.error(Kind.WRONG_TYPE, pathOf(field), "text", "expected text, got " + describe(v));
        }
        return v.textValue();
    }

    String string(String field, String absent) {
        return has(field) ? string(field) : absent;
    }

    /** A required text field whose value must be one of {@code choices}. */
    String choice(String field, List<String> choices) {
        String v = string(field);
        if (!choices.contains(v)) {
            String expected = "one of " + String.join(", ", choices);
            throw context.error(Kind.BAD_VALUE, pathOf(field), expected,
                    "'" + shorten(v) + "' is not known; expected " + expected);
        }
        return v;
    }

    /** A required integer field. */
    int integer(String field) {
        JsonNode v = required(field);
        if (!v.isIntegralNumber()) {
            throw context.error(Kind.WRONG_TYPE, pathOf(field), "a whole number", "expected a whole number, got " + describe(v));
        }
        if (!v.canConvertToInt()) {
            throw context.error(Kind.BAD_VALUE, pathOf(field), "a whole number", "the number " + shorten(v.asText()) + " is out of range");
        }
        return v.intValue();
    }

    boolean bool(String field, boolean absent) {
        if (!has(field)) {
            return absent;
        }
        JsonNode v = required(field);
        if (!v.isBoolean()) {
            throw context.error(Kind.WRONG_TYPE, pathOf(field), "true or false", "expected true or false, got " + describe(v));
        }
        return v.booleanValue();
    }

    /** A required quantity: a JSON number in SI units or engineering text. */
    double quantity(String field, Quantity q) {
        return quantityValue(required(field), pathOf(field), q, context);
    }

    double quantity(String field, Quantity q, double absent) {
        return has(field) ? quantity(field, q) : absent;
    }

    FieldReader object(String field) {
        return of(required(field), pathOf(field), context);
    }

    Optional<FieldReader> optionalObject(String field) {
        return optional(field).map(v -> of(v, pathOf(field), context));
    }

    /** The elements of a required array field. */
    List<JsonNode> array(String field) {
        JsonNode v = required(field);
        if (!v.isArray()) {
            throw context.error(Kind.WRONG_TYPE, pathOf(field), "a JSON array", "expected a JSON array, got " + describe(v));
        }
        List<JsonNode> list = new ArrayList<>();
        v.elements().forEachRemaining(list::add);
        return list;
    }

    /** Reads one quantity from a JSON value at {@code path}. */
    static double quantityValue(JsonNode v, String path, Quantity q, Context context) {
        double value;
        if (v.isNumber()) {
            value = v.doubleValue();
        } else if (v.isTextual()) {
            try {
                value = q.parse(v.textValue());
            } catch (ValueFormatException e) {
                throw context.error(Kind.BAD_VALUE, path, q.expected(), "expected " + q.expected() + ", got \""
                        + shorten(v.textValue()) + "\" (" + e.expected() + " at position " + e.position() + ")");
            }
        } else {
            throw context.error(Kind.WRONG_TYPE, path, q.expected(), "expected " + q.expected() + ", got " + describe(v));
        }
        if (!Double.isFinite(value)) {
            throw context.error(Kind.BAD_VALUE, path, q.expected(),
                    "expected " + q.expected() + ", got a number beyond the range of a double");
        }
        return value;
    }

    /** A JSON value's type in words, for messages. */
    static String describe(JsonNode v) {
        if (v == null || v.isMissingNode()) {
            return "nothing";
        }
        if (v.isNull()) {
            return "null";
        }
        if (v.isObject()) {
            return "an object";
        }
        if (v.isArray()) {
            return "an array";
        }
        if (v.isBoolean()) {
            return v.booleanValue() ? "true" : "false";
        }
        if (v.isNumber()) {
            return "the number " + shorten(v.asText());
        }
        if (v.isTextual()) {
            return "the text \"" + shorten(v.textValue()) + "\"";
        }
        return v.getNodeType().toString().toLowerCase(Locale.ROOT);
    }

    static String shorten(String s) {
        return s.length() <= MAX_NAME_IN_MESSAGE ? s : s.substring(0, MAX_NAME_IN_MESSAGE) + "…";
    }
}
