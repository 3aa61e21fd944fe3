package halfrail.io;

import halfrail.check.DesignAnalysis;
import halfrail.check.DesignReport;
import halfrail.check.Finding;
import halfrail.check.Severity;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.api.Test;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;

/**
 * samples/README.md states, for each design file, a verdict and the finding codes Halfrail
 * finds; this test analyses each sample and holds the page to it, so the README and the code
 * stay true together.
 */
class SamplesReadmeTest {
    private static final Path README = DesignFileTexts.SAMPLES.resolve("README.md");
    private static final Pattern HEADING = Pattern.compile("^#{2,4} +(\\S+\\.json)\\b.*");
    private static final Pattern CODE = Pattern.compile("`([A-Z][A-Z0-9_]*)`");

    /** What the README states about one sample. */
    record Stated(String verdict, Set<String> codes) {}

    static Map<String, Stated> stated() {
        Map<String, Stated> out = new LinkedHashMap<>();
        String file = null;
        String verdict = null;
        for (String line : DesignFileTexts.text(README).split("\n")) {
            Matcher h = HEADING.matcher(line);
            if (h.matches()) {
                file = h.group(1);
                verdict = null;
            } else if (line.startsWith("#")) {
                file = null;
            } else if (file != null && line.startsWith("Verdict:")) {
                verdict = line.substring("Verdict:".length()).strip();
            } else if (file != null && line.startsWith("Finding codes:")) {
                Set<String> codes = new LinkedHashSet<>();
                Matcher m = CODE.matcher(line);
                while (m.find()) {
                    codes.add(m.group(1));
                }
                out.put(file, new Stated(verdict, codes));
            }
        }
        return out;
    }

    static List<Path> samples() {
        return DesignFileTexts.samples();
    }

    @Test
    void theReadmeDescribesEverySampleAndNoOther() {
        Set<String> files = samples().stream().map(p -> p.getFileName().toString()).collect(Collectors.toSet());
        assertEquals(files, stated().keySet());
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("samples")
    void eachSampleGivesTheVerdictAndCodesTheReadmeStates(Path sample) {
        Stated s = stated().get(sample.getFileName().toString());
        assertNotNull(s, "samples/README.md has no section for " + sample);
        assertNotNull(s.verdict(), "no Verdict line for " + sample);
        assertFalse(s.codes().isEmpty() && !s.verdict().equals("pass"), "a fail or warn verdict needs its codes: " + sample);
        DesignReport r = DesignAnalysis.analyse(DesignFiles.read(sample));
        Set<String> found = r.findings().stream().map(Finding::code).collect(Collectors.toSet());
        assertEquals(s.codes(), found, () -> sample + ": " + r.findings());
        String verdict = r.worst().filter(w -> w != Severity.NOTE).map(w -> w.name().toLowerCase(Locale.ROOT))
                .orElse("pass");
        assertEquals(s.verdict(), verdict, () -> sample + ": " + r.findings());
    }
}
