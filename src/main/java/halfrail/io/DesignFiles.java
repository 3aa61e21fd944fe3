package halfrail.io;

import com.fasterxml.jackson.core.JacksonException;
import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonStreamContext;
import com.fasterxml.jackson.core.StreamReadConstraints;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.core.exc.StreamConstraintsException;
import com.fasterxml.jackson.core.exc.StreamReadException;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.core.util.Separators;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import halfrail.design.Design;
import halfrail.io.DesignFileException.Kind;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.ArrayDeque;
import java.util.Deque;
import java.util.function.Function;

/**
 * Reads and writes Halfrail design files: JSON of our own format {@value #FORMAT_NAME}, version
 * {@value #FORMAT_VERSION}, documented in docs/design-format.md.
 *
 * <p>Reading is strict and safe: the JSON is read as a tree (no class names or types are taken
 * from the file, nothing is fetched from anywhere), a file above {@value #MAX_FILE_BYTES} bytes
 * is refused before it is parsed, nesting deeper than {@value #MAX_NESTING_DEPTH} levels and
 * texts or numbers beyond their limits are refused while parsing, and every problem is a
 * {@link DesignFileException} whose kind and JSON path say what and where. Files of an older
 * format version are migrated on reading; a newer version is refused.
 *
 * <p>Saving is atomic: the text goes to a temporary file in the target's folder, is forced to
 * the disk and then moved over the target, so the target is at every moment either the old file
 * or the complete new one. The previous file is kept as {@code <name>}{@value #BACKUP_SUFFIX}.
 *
 * <p>All methods are static and thread-safe (two saves to one path at once are not coordinated).
 */
public final class DesignFiles {
    /** The value of the {@code format} field of every design file. */
    public static final String FORMAT_NAME = "halfrail-design";
    /** The format version written, and the newest one read. */
    public static final int FORMAT_VERSION = 1;
    /** Largest file read, bytes (1 MiB); for text handed to {@link #read(String, String)}, UTF-8 bytes. */
    public static final int MAX_FILE_BYTES = 1 << 20;
    /** Deepest nesting of arrays and objects accepted (the format itself needs 4). */
    public static final int MAX_NESTING_DEPTH = 32;
    /** Longest text value accepted, characters. */
    public static final int MAX_STRING_LENGTH = 100_000;
    /** Longest number accepted, characters. */
    public static final int MAX_NUMBER_LENGTH = 100;
    /** Appended to a file's name to name the backup of its previous content. */
    public static final String BACKUP_SUFFIX = ".bak";

    private static final ObjectMapper MAPPER = JsonMapper.builder(JsonFactory.builder()
                    .streamReadConstraints(StreamReadConstraints.builder()
                            .maxNestingDepth(MAX_NESTING_DEPTH)
                            .maxStringLength(MAX_STRING_LENGTH)
                            .maxNumberLength(MAX_NUMBER_LENGTH)
                            .maxNameLength(MAX_STRING_LENGTH)
                            .maxDocumentLength(MAX_FILE_BYTES)
                            .build())
                    .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
                    .build())
            .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
            .build();

    private static final DefaultPrettyPrinter PRETTY = new DefaultPrettyPrinter()
            .withSeparators(Separators.createDefaultInstance()
                    .withObjectFieldValueSpacing(Separators.Spacing.AFTER))
            .withObjectIndenter(new DefaultIndenter("  ", "\n"))
            .withArrayIndenter(new DefaultIndenter("  ", "\n"));

    private DesignFiles() {}

    /**
     * Reads the design file at {@code file}.
     *
     * @throws DesignFileException when the file cannot be read ({@link Kind#IO}, naming the path),
     *                             is too large, or is not a valid design file
     */
    public static Design read(Path file) {
        String source = file.toString();
        return parse(readBytes(file), source);
    }

    /**
     * Reads a design file's text; {@code sourceName} names it in error messages (a file name, "clipboard").
     *
     * @throws DesignFileException when the text is too large or not a valid design file
     */
    public static Design read(String json, String sourceName) {
        String source = sourceName == null ? "" : sourceName;
        if (json == null) {
            throw DesignFileException.at(Kind.SYNTAX, source, "", "a JSON object", "no text");
        }
        if (json.length() > MAX_FILE_BYTES || utf8Length(json) > MAX_FILE_BYTES) {
            throw tooLarge(source, utf8Length(json));
        }
        JsonNode root;
        try {
            root = MAPPER.readTree(json);
        } catch (JacksonException e) {
            throw parseError(source, e);
        }
        return fromTree(root, source);
    }

    /** The design file text of {@code design}: UTF-8 JSON, two-space indents, ending in a newline. */
    public static String write(Design design) {
        ObjectNode tree = new DesignFileWriter().write(design);
        try {
            return MAPPER.writer(PRETTY).writeValueAsString(tree) + "\n";
        } catch (JacksonException e) {
            throw new IllegalStateException("a JSON tree of our own could not be written", e);
        }
    }

    /**
     * Saves {@code design} to {@code file} atomically, keeping the previous file (if any) as
     * {@code file + }{@value #BACKUP_SUFFIX}. On failure the previous file is left as it was and
     * no temporary file remains.
     *
     * @throws DesignFileException of kind {@link Kind#IO} naming the path when the folder is
     *                             missing or read-only, or the disk refuses the write
     */
    public static void save(Design design, Path file) {
        AtomicFiles.replace(file, write(design).getBytes(StandardCharsets.UTF_8), AtomicWrite.WHOLE);
    }

    /** The path of the backup kept by {@link #save} for {@code file}. */
    public static Path backupOf(Path file) {
        return file.resolveSibling(file.getFileName() + BACKUP_SUFFIX);
    }

    static Design parse(byte[] bytes, String source) {
        JsonNode root;
        try {
            root = MAPPER.readTree(bytes);
        } catch (JacksonException e) {
            throw parseError(source, e);
        } catch (IOException e) {
            throw new DesignFileException(Kind.IO, source, "", "", 0, 0, "could not be read: " + e.getMessage(), e);
        }
        return fromTree(root, source);
    }

    private static Design fromTree(JsonNode root, String source) {
        FieldReader.Context plain = new FieldReader.Context(source, Function.identity(), "");
        if (root == null || root.isMissingNode()) {
            throw new DesignFileException(Kind.SYNTAX, source, "", "a JSON object", 1, 1,
                    "the file holds no JSON; expected a design object", null);
        }
        FieldReader top = FieldReader.of(root, "$", plain);
        if (!top.has("format")) {
            throw plain.error(Kind.NOT_A_DESIGN, "$", "a field format: \"" + FORMAT_NAME + "\"",
                    "not a Halfrail design file: it has no field 'format'");
        }
        String format = top.string("format");
        if (!format.equals(FORMAT_NAME)) {
            throw plain.error(Kind.NOT_A_DESIGN, "$.format", FORMAT_NAME,
                    "not a Halfrail design file: format is '" + FieldReader.shorten(format) + "', expected '"
                            + FORMAT_NAME + "'");
        }
        int version = top.integer("formatVersion");
        if (version > FORMAT_VERSION) {
            throw plain.error(Kind.NEWER_VERSION, "$.formatVersion", "at most " + FORMAT_VERSION,
                    "the file is format version " + version + ", written by a newer Halfrail; this one reads versions "
                            + DesignFileMigration.OLDEST_VERSION + " to " + FORMAT_VERSION);
        }
        if (version < DesignFileMigration.OLDEST_VERSION) {
            throw plain.error(Kind.BAD_VALUE, "$.formatVersion",
                    DesignFileMigration.OLDEST_VERSION + " to " + FORMAT_VERSION, "there is no format version " + version);
        }
        if (version == FORMAT_VERSION) {
            return new DesignFileReader().read(top);
        }
        FieldReader.Context migrated = new FieldReader.Context(source, DesignFileMigration.originalPaths(version),
                "(format version " + version + ", read after migration to version " + FORMAT_VERSION + ")");
        ObjectNode current = DesignFileMigration.toCurrent((ObjectNode) root, version, migrated);
        current.put("formatVersion", FORMAT_VERSION);
        return new DesignFileReader().read(FieldReader.of(current, "$", migrated));
    }

    private static byte[] readBytes(Path file) {
        String source = file.toString();
        try {
            BasicFileAttributes attributes = Files.readAttributes(file, BasicFileAttributes.class);
            if (attributes.isDirectory()) {
                throw io(source, "is a folder, not a design file", null);
            }
            if (attributes.size() > MAX_FILE_BYTES) {
                throw tooLarge(source, attributes.size());
            }
            try (InputStream in = Files.newInputStream(file)) {
                byte[] bytes = in.readNBytes(MAX_FILE_BYTES + 1);
                if (bytes.length > MAX_FILE_BYTES) {
                    throw tooLarge(source, bytes.length);
                }
                return bytes;
            }
        } catch (NoSuchFileException e) {
            throw io(source, "no such file (or its folder is gone)", e);
        } catch (AccessDeniedException e) {
            throw io(source, "not allowed to read it", e);
        } catch (IOException e) {
            throw io(source, "could not be read: " + e.getMessage(), e);
        }
    }

    static DesignFileException io(String source, String detail, Throwable cause) {
        return new DesignFileException(Kind.IO, source, "", "", 0, 0, detail, cause);
    }

    private static DesignFileException tooLarge(String source, long bytes) {
        return new DesignFileException(Kind.TOO_LARGE, source, "", "at most " + MAX_FILE_BYTES + " bytes", 0, 0,
                "the file is " + bytes + " bytes; design files are limited to " + MAX_FILE_BYTES + " bytes (1 MiB)", null);
    }

    private static DesignFileException parseError(String source, JacksonException e) {
        JsonLocation at = e.getLocation();
        int line = at == null ? 0 : Math.max(0, at.getLineNr());
        int column = at == null ? 0 : Math.max(0, at.getColumnNr());
        String detail = firstLine(e.getOriginalMessage());
        if (e instanceof StreamConstraintsException) {
            return new DesignFileException(Kind.TOO_LARGE, source, "", "nesting at most " + MAX_NESTING_DEPTH
                    + " deep, texts at most " + MAX_STRING_LENGTH + " and numbers at most " + MAX_NUMBER_LENGTH
                    + " characters", line, column, "beyond a limit of the format: " + detail, e);
        }
        if (e instanceof StreamReadException read && detail.startsWith("Duplicate field")) {
            String path = read.getProcessor() == null ? "" : pathOf(read.getProcessor().getParsingContext());
            return new DesignFileException(Kind.DUPLICATE_FIELD, source, path, "each field once", line, column, detail, e);
        }
        return new DesignFileException(Kind.SYNTAX, source, "", "JSON text", line, column,
                "not valid JSON: " + detail, e);
    }

    /** The JSON path of the value a parser was reading, for example {@code $.load.ohms}. */
    private static String pathOf(JsonStreamContext context) {
        Deque<String> parts = new ArrayDeque<>();
        for (JsonStreamContext c = context; c != null && !c.inRoot(); c = c.getParent()) {
            if (c.inArray()) {
                parts.push("[" + Math.max(0, c.getCurrentIndex()) + "]");
            } else if (c.getCurrentName() != null) {
                parts.push(FieldReader.child("", c.getCurrentName()));
            }
        }
        return "$" + String.join("", parts);
    }

    private static String firstLine(String s) {
        if (s == null) {
            return "";
        }
        int nl = s.indexOf('\n');
        String first = nl < 0 ? s : s.substring(0, nl);
        return first.length() > 200 ? first.substring(0, 200) + "…" : first;
    }

    /** UTF-8 length of {@code s} in bytes, without encoding it. */
    private static long utf8Length(String s) {
        long n = 0;
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c < 0x80) {
                n++;
            } else if (c < 0x800) {
                n += 2;
            } else if (Character.isHighSurrogate(c) && i + 1 < s.length() && Character.isLowSurrogate(s.charAt(i + 1))) {
                n += 4;
                i++;
            } else {
                n += 3;
            }
        }
        return n;
    }
}
