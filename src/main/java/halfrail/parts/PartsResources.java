package halfrail.parts;

import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonStreamContext;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.core.exc.StreamReadException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JavaType;
import com.fasterxml.jackson.databind.JsonMappingException;
import com.fasterxml.jackson.databind.MapperFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.json.JsonMapper;
import halfrail.circuit.CircuitException;

import java.io.IOException;
import java.io.InputStream;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Reads parts resources strictly: unknown or missing fields, nulls, strings where numbers
 * belong, duplicate keys and trailing content all fail, and every failure is a
 * {@link PartsException.Kind#BAD_DATA} naming the resource and the JSON path.
 *
 * <p>Each resource is an object {@code {"formatVersion": 1, "about": "…", "entries": […]}}.
 */
final class PartsResources {
    /** The resource format version this code reads. */
    static final int FORMAT_VERSION = 1;

    static final String CAPACITOR_TECHNOLOGIES = "halfrail/parts/capacitor-technologies.json";
    static final String OPAMP_ARCHETYPES = "halfrail/parts/opamp-archetypes.json";
    static final String CELL_CHEMISTRIES = "halfrail/parts/cell-chemistries.json";
    static final String SUPPLY_STANDARDS = "halfrail/parts/supply-standards.json";

    private static final ObjectMapper MAPPER = JsonMapper.builder()
            .enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES)
            .enable(DeserializationFeature.FAIL_ON_MISSING_CREATOR_PROPERTIES)
            .enable(DeserializationFeature.FAIL_ON_NULL_CREATOR_PROPERTIES)
            .enable(DeserializationFeature.FAIL_ON_NULL_FOR_PRIMITIVES)
            .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
            .enable(DeserializationFeature.FAIL_ON_READING_DUP_TREE_KEY)
            .disable(DeserializationFeature.ACCEPT_FLOAT_AS_INT)
            .disable(MapperFeature.ALLOW_COERCION_OF_SCALARS)
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
            .build();

    private PartsResources() {}

    /** The file shape shared by all parts resources. */
    record PartsFile<T>(int formatVersion, String about, List<T> entries) {}

    /** Loads the four built-in resources. */
    static PartsLibrary loadBuiltIn() {
        return new PartsLibrary(
                load(CAPACITOR_TECHNOLOGIES, CapacitorTechnology.class),
                load(OPAMP_ARCHETYPES, OpAmpArchetype.class),
                load(CELL_CHEMISTRIES, CellChemistry.class),
                load(SUPPLY_STANDARDS, SupplyStandard.class));
    }

    /**
     * Reads the entries of the class-path resource {@code resource}, each of type {@code type}.
     *
     * @throws PartsException of kind BAD_DATA naming the resource and the JSON path
     */
    static <T extends PartEntry> List<T> load(String resource, Class<T> type) {
        JavaType fileType = MAPPER.getTypeFactory().constructParametricType(PartsFile.class, type);
        PartsFile<T> file;
        try (InputStream in = PartsResources.class.getClassLoader().getResourceAsStream(resource)) {
            if (in == null) {
                throw new PartsException(PartsException.Kind.BAD_DATA, resource, "",
                        "parts resource " + resource + " is not on the class path", null);
            }
            file = MAPPER.readValue(in, fileType);
        } catch (JsonMappingException e) {
            throw badData(resource, withField(pathOf(e.getPath()), fieldOf(e.getCause())), e);
        } catch (StreamReadException e) {
            throw badData(resource, pathOf(e.getProcessor()), e);
        } catch (IOException e) {
            throw new PartsException(PartsException.Kind.BAD_DATA, resource, "",
                    resource + ": could not be read: " + e.getMessage(), e);
        }
        return checkFile(resource, file);
    }

    private static <T extends PartEntry> List<T> checkFile(String resource, PartsFile<T> file) {
        if (file == null) {
            throw badData(resource, "$", "the resource is empty (JSON null)");
        }
        if (file.formatVersion() != FORMAT_VERSION) {
            throw badData(resource, "$.formatVersion",
                    "formatVersion " + file.formatVersion() + " is not supported; expected " + FORMAT_VERSION);
        }
        if (file.about() == null || file.about().isBlank()) {
            throw badData(resource, "$.about", "about must say what the figures are and where they come from");
        }
        List<T> entries = file.entries();
        if (entries == null || entries.isEmpty()) {
            throw badData(resource, "$.entries", "entries must list at least one entry");
        }
        Map<String, Integer> seen = new HashMap<>();
        for (int i = 0; i < entries.size(); i++) {
            T entry = entries.get(i);
            if (entry == null) {
                throw badData(resource, "$.entries[" + i + "]", "an entry is null");
            }
            Integer before = seen.putIfAbsent(entry.id(), i);
            if (before != null) {
                throw badData(resource, "$.entries[" + i + "].id",
                        "id \"" + entry.id() + "\" is already used by $.entries[" + before + "]");
            }
        }
        return List.copyOf(entries);
    }

    private static PartsException badData(String resource, String path, String what) {
        return new PartsException(PartsException.Kind.BAD_DATA, resource, path,
                resource + " at " + path + ": " + what, null);
    }

    private static PartsException badData(String resource, String path, JsonProcessingException e) {
        Throwable cause = e.getCause();
        // A record constructor's own complaint is the clearest explanation; Jackson's wrapper adds noise.
        String what = cause instanceof PartsException || cause instanceof CircuitException
                ? cause.getMessage()
                : e.getOriginalMessage();
        JsonLocation at = e.getLocation();
        String where = at == null || at.getLineNr() < 0 ? "" : " (line " + at.getLineNr() + ", column " + at.getColumnNr() + ")";
        return new PartsException(PartsException.Kind.BAD_DATA, resource, path,
                resource + " at " + path + where + ": " + what, e);
    }

    /** The field a record's own complaint names, relative to the record; empty when none. */
    private static String fieldOf(Throwable cause) {
        if (cause instanceof PartsException p) {
            return p.field();
        }
        if (cause instanceof CircuitException c) {
            return c.field();
        }
        return "";
    }

    /** Appends a relative field ({@code "a.b"} or {@code "c[2]"}) to a JSON path. */
    static String withField(String path, String field) {
        if (field == null || field.isEmpty()) {
            return path;
        }
        return path + (field.startsWith("[") ? "" : ".") + field;
    }

    /** Formats Jackson's reference chain as {@code $.entries[2].leakage.kind}. */
    static String pathOf(List<JsonMappingException.Reference> references) {
        StringBuilder sb = new StringBuilder("$");
        for (JsonMappingException.Reference r : references) {
            if (r.getFieldName() != null) {
                sb.append('.').append(r.getFieldName());
            } else if (r.getIndex() >= 0) {
                sb.append('[').append(r.getIndex()).append(']');
            }
        }
        return sb.toString();
    }

    /** The path of a parser's current position, as {@code $.entries[2].id}; "$" when unknown. */
    static String pathOf(Object processor) {
        if (!(processor instanceof JsonParser parser)) {
            return "$";
        }
        StringBuilder sb = new StringBuilder();
        for (JsonStreamContext c = parser.getParsingContext(); c != null && !c.inRoot(); c = c.getParent()) {
            if (c.inArray()) {
                sb.insert(0, "[" + Math.max(c.getCurrentIndex(), 0) + "]");
            } else if (c.inObject() && c.getCurrentName() != null) {
                sb.insert(0, "." + c.getCurrentName());
            }
        }
        return "$" + sb;
    }
}
