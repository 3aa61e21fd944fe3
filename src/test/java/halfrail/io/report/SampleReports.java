package halfrail.io.report;

import halfrail.check.CircuitAnalysis;
import halfrail.check.CircuitReport;
import halfrail.check.DesignAnalysis;
import halfrail.circuit.Circuit;
import halfrail.circuit.VoltageSource;
import halfrail.io.Netlist;
import halfrail.io.NetlistReader;
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

    /** The sample netlists with the circuit-level checks, every DC source ramping up over 1 ms as check does. */
    static List<NetlistEntry> netlists() {
        List<NetlistEntry> out = new ArrayList<>();
        try (DirectoryStream<Path> s = Files.newDirectoryStream(SAMPLES, "*.cir")) {
            List<Path> files = new ArrayList<>();
            s.forEach(files::add);
            files.sort(null);
            for (Path f : files) {
                Netlist n = NetlistReader.read(f);
                Circuit c = n.circuit();
                for (VoltageSource v : n.circuit().elements(VoltageSource.class)) {
                    c = c.replace(v.name(), e -> ((VoltageSource) e).withRamp(1e-3));
                }
                CircuitReport r = CircuitAnalysis.analyse(c, new CircuitAnalysis.Options(n.outputNode(),
                        java.util.Optional.empty(), java.util.OptionalDouble.empty(), List.of(), true));
                out.add(new NetlistEntry(f.toString(), c.title(), n.outputNode(), r, List.of()));
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out;
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
