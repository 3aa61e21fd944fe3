package halfrail.cli;

import halfrail.check.DesignAnalysis;
import halfrail.check.DesignReport;
import halfrail.design.Design;
import halfrail.design.DesignException;
import halfrail.check.CircuitAnalysis;
import halfrail.check.CircuitReport;
import halfrail.circuit.Circuit;
import halfrail.io.Netlist;
import halfrail.io.NetlistException;
import halfrail.io.NetlistReader;
import halfrail.io.report.NetlistEntry;
import halfrail.io.report.Review;
import halfrail.io.report.ReviewEntry;
import halfrail.io.report.ReviewFiles;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;

/**
 * {@code report FILE|DIR... -o OUT}: analyses design files (and netlists, with the circuit-level
 * checks at {@code check}'s defaults) and writes one review as {@code OUT.html} (self-contained)
 * and {@code OUT.pdf}. Runs without a display. Exit code per {@link ExitCodes}, as {@code check}:
 * 1 when something has a failing finding, 2 for bad input (the readable files are still reported).
 */
@Command(name = "report", mixinStandardHelpOptions = true,
        description = {"Write a review of design files (*.json): one HTML file with the pictures embedded and one PDF.",
                "Covers the job, the supply, every stage, the voltage ladders, the power-on and frequency plots",
                "and every finding; for more than one file a summary table comes first, worst first.",
                "Netlists (*.cir, *.net, *.sp) get the circuit-level checks of 'check' at its defaults."},
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {"0:no failing finding", "1:a failing finding in some file",
                "2:bad input (unreadable file, parse error, cannot write OUT)", "3:internal error"})
public final class ReportCommand implements Callable<Integer> {
    /** Held so that its level, once set, is not lost when the logger would otherwise be collected. */
    private static final java.util.logging.Logger PDF_LOG = java.util.logging.Logger.getLogger("org.apache.pdfbox");

    @Spec
    CommandSpec spec;

    @Parameters(arity = "1..*", paramLabel = "FILE|DIR", description = "Design files and netlists, or directories of them.")
    List<Path> paths = new ArrayList<>();

    @Option(names = {"-o", "--output"}, required = true, paramLabel = "OUT",
            description = "Where to write: OUT.html and OUT.pdf (an .html or .pdf ending on OUT is dropped).")
    Path output;

    /** The clock that dates the review (tests set a fixed one). */
    Clock clock = Clock.systemUTC();

    @Override
    public Integer call() {
        // The PDF library logs font substitutions as warnings; the command's error stream carries
        // one line per bad input and nothing else.
        PDF_LOG.setLevel(java.util.logging.Level.SEVERE);
        if (System.getProperty("java.awt.headless") == null) {
            System.setProperty("java.awt.headless", "true"); // the pictures are drawn off-screen
        }
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        List<String> problems = new ArrayList<>();
        List<Path> files = new ArrayList<>();
        for (Path p : paths) {
            if (Files.isDirectory(p)) {
                List<Path> found = designsIn(p, problems);
                if (found.isEmpty()) {
                    problems.add(p + ": no design files (" + CheckCommand.DESIGN_ENDING + ") or netlists ("
                            + String.join(", ", CheckCommand.NETLIST_ENDINGS) + ") in this directory");
                }
                files.addAll(found);
            } else {
                files.add(p);
            }
        }
        List<ReviewEntry> entries = new ArrayList<>();
        List<NetlistEntry> netlists = new ArrayList<>();
        for (Path f : files) {
            try {
                if (!CheckCommand.isDesignFile(f)) {
                    netlists.add(netlist(f));
                    continue;
                }
                Design d = CheckCommand.readDesign(f);
                DesignReport r;
                try {
                    r = DesignAnalysis.analyse(d);
                } catch (DesignException e) {
                    throw new BadInputException(f + ": " + e.getMessage());
                }
                entries.add(new ReviewEntry(f.toString(), r));
            } catch (BadInputException e) {
                problems.add(e.getMessage());
            }
        }
        for (String p : problems) {
            err.println(p);
        }
        err.flush();
        if (entries.isEmpty() && netlists.isEmpty()) {
            return ExitCodes.BAD_INPUT;
        }
        Review review = new Review(entries, netlists, HalfrailCommand.VERSION, clock.instant());
        ReviewFiles.Written w;
        try {
            w = ReviewFiles.write(review, output);
        } catch (UncheckedIOException e) {
            throw new BadInputException(e.getMessage());
        }
        out.println("wrote " + w.html() + " and " + w.pdf() + " (" + review.size()
                + (review.size() == 1 ? " file" : " files") + ", verdict " + review.worst().word() + ")");
        out.flush();
        boolean failing = review.worst() == halfrail.io.report.Verdict.FAIL;
        return !problems.isEmpty() ? ExitCodes.BAD_INPUT : failing ? ExitCodes.FINDING : ExitCodes.PASS;
    }

    /** Read and analyse one netlist as {@code check} does with its default options. */
    private static NetlistEntry netlist(Path file) {
        Netlist netlist;
        try {
            netlist = NetlistReader.read(file);
        } catch (NetlistException e) {
            throw new BadInputException(file + ": " + e.getMessage());
        }
        Circuit circuit = netlist.circuit();
        if (circuit.nodes().size() > CheckCommand.MAX_NODES) {
            throw new BadInputException(file + ": " + circuit.nodes().size() + " nodes, more than the "
                    + CheckCommand.MAX_NODES + " that report solves");
        }
        CircuitAnalysis.Options options = new CircuitAnalysis.Options(netlist.outputNode(), Optional.empty(),
                OptionalDouble.empty(), List.of(), true);
        CircuitReport r = CircuitAnalysis.analyse(CheckCommand.withRamp(circuit, CheckCommand.DEFAULT_RAMP_SECONDS),
                options);
        return new NetlistEntry(file.toString(), circuit.title(), netlist.outputNode(), r,
                netlist.notes().stream().map(Netlist.Note::toString).toList());
    }

    /** The design files and netlists in {@code dir}, sorted; other files there are left alone. */
    private static List<Path> designsIn(Path dir, List<String> problems) {
        List<Path> found = new ArrayList<>();
        try (DirectoryStream<Path> s = Files.newDirectoryStream(dir)) {
            for (Path p : s) {
                String name = p.getFileName().toString().toLowerCase(java.util.Locale.ROOT);
                if (Files.isRegularFile(p) && (CheckCommand.isDesignFile(p)
                        || CheckCommand.NETLIST_ENDINGS.stream().anyMatch(name::endsWith))) {
                    found.add(p);
                }
            }
        } catch (IOException | SecurityException e) {
            problems.add(dir + ": cannot list the directory (" + e.getClass().getSimpleName() + ")");
        }
        found.sort(null);
        return found;
    }
}
