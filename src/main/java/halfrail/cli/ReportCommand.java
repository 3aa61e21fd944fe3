package halfrail.cli;

import halfrail.check.DesignAnalysis;
import halfrail.check.DesignReport;
import halfrail.design.Design;
import halfrail.design.DesignException;
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
import java.util.concurrent.Callable;

/**
 * {@code report FILE|DIR... -o OUT}: analyses design files and writes one review as
 * {@code OUT.html} (self-contained) and {@code OUT.pdf}. Runs without a display. Exit code per
 * {@link ExitCodes}, as {@code check}: 1 when a design has a failing finding, 2 for bad input
 * (the readable designs are still reported).
 */
@Command(name = "report", mixinStandardHelpOptions = true,
        description = {"Write a review of design files (*.json): one HTML file with the pictures embedded and one PDF.",
                "Covers the job, the supply, every stage, the voltage ladders, the power-on and frequency plots",
                "and every finding; for more than one design a summary table comes first, worst first."},
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {"0:no failing finding", "1:a failing finding in some design",
                "2:bad input (unreadable file, not a design file, cannot write OUT)", "3:internal error"})
public final class ReportCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Parameters(arity = "1..*", paramLabel = "FILE|DIR", description = "Design files, or directories of them.")
    List<Path> paths = new ArrayList<>();

    @Option(names = {"-o", "--output"}, required = true, paramLabel = "OUT",
            description = "Where to write: OUT.html and OUT.pdf (an .html or .pdf ending on OUT is dropped).")
    Path output;

    /** The clock that dates the review (tests set a fixed one). */
    Clock clock = Clock.systemUTC();

    @Override
    public Integer call() {
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
                    problems.add(p + ": no design files (" + CheckCommand.DESIGN_ENDING + ") in this directory");
                }
                files.addAll(found);
            } else if (!CheckCommand.isDesignFile(p)) {
                problems.add(p + ": report reads design files (" + CheckCommand.DESIGN_ENDING
                        + "); check netlists with 'halfrail check'");
            } else {
                files.add(p);
            }
        }
        List<ReviewEntry> entries = new ArrayList<>();
        for (Path f : files) {
            try {
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
        if (entries.isEmpty()) {
            return ExitCodes.BAD_INPUT;
        }
        Review review = new Review(entries, HalfrailCommand.VERSION, clock.instant());
        ReviewFiles.Written w;
        try {
            w = ReviewFiles.write(review, output);
        } catch (UncheckedIOException e) {
            throw new BadInputException(e.getMessage());
        }
        out.println("wrote " + w.html() + " and " + w.pdf() + " (" + entries.size()
                + (entries.size() == 1 ? " design" : " designs") + ", verdict " + review.worst().word() + ")");
        out.flush();
        boolean failing = entries.stream().anyMatch(e -> e.report().has(halfrail.check.Severity.FAIL));
        return !problems.isEmpty() ? ExitCodes.BAD_INPUT : failing ? ExitCodes.FINDING : ExitCodes.PASS;
    }

    /** The design files in {@code dir}, sorted; other files there are left alone. */
    private static List<Path> designsIn(Path dir, List<String> problems) {
        // a directory of mixed files is normal: only the design files are reviewed
        List<Path> found = new ArrayList<>();
        try (DirectoryStream<Path> s = Files.newDirectoryStream(dir)) {
            for (Path p : s) {
                if (Files.isRegularFile(p) && CheckCommand.isDesignFile(p)) {
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
