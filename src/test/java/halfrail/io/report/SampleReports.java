package halfrail.io.report;

import halfrail.check.DesignAnalysis;
import halfrail.check.DesignReport;
import halfrail.io.DesignFiles;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/** The sample design files, analysed once per test run (the analysis is the costly part). */
final class SampleReports {
    static final Path SAMPLES = Path.of("samples");
    private static final Map<Path, DesignReport> CACHE = new ConcurrentHashMap<>();

    private SampleReports() {}

    static List<Path> designFiles() {
        List<Path> out = new ArrayList<>();
        try (DirectoryStream<Path> s = Files.newDirectoryStream(SAMPLES, "*.json")) {
            s.forEach(out::add);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        out.sort(null);
        return out;
    }

    static DesignReport report(Path file) {
        return CACHE.computeIfAbsent(file, f -> DesignAnalysis.analyse(DesignFiles.read(f)));
    }

    static DesignReport report(String name) {
        return report(SAMPLES.resolve(name));
    }

    static List<ReviewEntry> entries() {
        return designFiles().stream().map(f -> new ReviewEntry(f.toString(), report(f))).toList();
    }

    /** Where tests leave pictures and documents for a person to look at. */
    static Path outputDir() {
        Path dir = Path.of("target", "report-samples");
        try {
            Files.createDirectories(dir);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return dir;
    }
}
