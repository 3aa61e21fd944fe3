package halfrail.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import halfrail.io.DesignFileException.Kind;

import java.util.Map;
import java.util.function.Function;

/**
 * Brings the JSON tree of an older design file up to the current layout before it is read, and
 * maps the current layout's JSON paths back to the file's own so errors point at what the file
 * says. See docs/design-format.md, "Older versions".
 *
 * <p>Version 0 (the draft layout) differs from version 1 in two names only: the list of stages
 * was called {@code chain}, and a cell supply's {@code cellsInSeries} was called {@code count}.
 */
final class DesignFileMigration {
    /** The oldest format version still read. */
    static final int OLDEST_VERSION = 0;

    private DesignFileMigration() {}

    /** A copy of {@code root} (a file of {@code version}) in the current layout; the tree itself is left alone. */
    static ObjectNode toCurrent(ObjectNode root, int version, FieldReader.Context context) {
        // Errors found while migrating name the file's own fields already: no path rewriting.
        FieldReader.Context asWritten = new FieldReader.Context(context.source(), Function.identity(), context.note());
        ObjectNode tree = root.deepCopy();
        if (version == 0) {
            tree = fromVersion0(tree, asWritten);
        }
        return tree;
    }

    /** Maps a JSON path of the current layout to the path of the same value in a file of {@code version}. */
    static Function<String, String> originalPaths(int version) {
        if (version != 0) {
            return Function.identity();
        }
        return path -> replacePrefix(replacePrefix(path, "$.stages", "$.chain"), "$.supply.cellsInSeries", "$.supply.count");
    }

    private static ObjectNode fromVersion0(ObjectNode tree, FieldReader.Context context) {
        if (tree.has("stages")) {
            throw context.error(Kind.UNKNOWN_FIELD, "$.stages", "chain",
                    "format version 0 has no field 'stages'; its stages are listed under 'chain'");
        }
        ObjectNode out = renamed(tree, "chain", "stages");
        JsonNode supply = out.get("supply");
        if (supply instanceof ObjectNode s && s.path("kind").asText("").equals(DesignFormat.CELLS)) {
            if (s.has("cellsInSeries")) {
                throw context.error(Kind.UNKNOWN_FIELD, "$.supply.cellsInSeries", "count",
                        "format version 0 has no field 'cellsInSeries'; the number of cells is called 'count'");
            }
            out.set("supply", renamed(s, "count", "cellsInSeries"));
        }
        return out;
    }

    /** A copy of {@code node} with field {@code from} renamed {@code to}, in the same place. */
    private static ObjectNode renamed(ObjectNode node, String from, String to) {
        ObjectNode out = node.objectNode();
        for (Map.Entry<String, JsonNode> f : node.properties()) {
            out.set(f.getKey().equals(from) ? to : f.getKey(), f.getValue());
        }
        return out;
    }

    private static String replacePrefix(String path, String prefix, String replacement) {
        if (path.startsWith(prefix) && (path.length() == prefix.length()
                || path.charAt(prefix.length()) == '.' || path.charAt(prefix.length()) == '[')) {
            return replacement + path.substring(prefix.length());
        }
        return path;
    }
}
