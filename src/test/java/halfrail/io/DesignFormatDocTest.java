package halfrail.io;

import halfrail.design.Design;
import org.junit.jupiter.api.Test;

import java.nio.file.Path;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** docs/design-format.md stays true: its example reads, and its tables name every field the reader knows. */
class DesignFormatDocTest {
    private static final String DOC = DesignFileTexts.text(Path.of("docs", "design-format.md"));

    @Test
    void theDocumentedExampleIsAValidDesignFile() {
        Matcher m = Pattern.compile("```json\n(.*?)\n```", Pattern.DOTALL).matcher(DOC);
        assertTrue(m.find(), "the page has a JSON example");
        Design example = DesignFiles.read(m.group(1), "docs/design-format.md");
        assertEquals(DesignFiles.read(DesignFileTexts.RICH_SAMPLE), example, "the example is the sample it names");
    }

    @Test
    void theFieldTablesNameEveryFieldOfTheFormat() {
        Set<String> documented = new TreeSet<>();
        Matcher m = Pattern.compile("(?m)^\\| (?:\\*[a-z]+:\\* )?`([A-Za-z]+)` \\|").matcher(DOC);
        while (m.find()) {
            documented.add(m.group(1));
        }
        Set<String> known = new TreeSet<>();
        Stream.of(DesignFormat.TOP, DesignFormat.CELLS_FIELDS, DesignFormat.FIXED_FIELDS, DesignFormat.USB_FIELDS,
                DesignFormat.REFERENCE_FIELDS, DesignFormat.STAGE_FIELDS, DesignFormat.CAPACITOR_FIELDS,
                DesignFormat.SOURCE_FIELDS, DesignFormat.LOAD_FIELDS).forEach(known::addAll);
        DesignFormat.OPAMP_FIELDS.stream().map(Map.Entry::getKey).forEach(known::add);
        DesignFormat.THRESHOLD_FIELDS.stream().map(Map.Entry::getKey).forEach(known::add);
        // The kinds table lists error kinds in the same layout; they are not fields.
        Set<String> kinds = new TreeSet<>();
        for (DesignFileException.Kind k : DesignFileException.Kind.values()) {
            kinds.add(k.name());
        }
        documented.removeAll(kinds);
        assertEquals(known, documented);
    }

    @Test
    void theErrorKindTableNamesEveryKind() {
        for (DesignFileException.Kind k : DesignFileException.Kind.values()) {
            assertTrue(DOC.contains("| `" + k.name() + "` |"), k.name());
        }
    }
}
