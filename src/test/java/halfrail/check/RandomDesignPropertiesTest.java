package halfrail.check;

import halfrail.design.AmplitudeUnit;
import halfrail.design.CapacitorSpec;
import halfrail.design.CellPack;
import halfrail.design.Design;
import halfrail.design.DesignException;
import halfrail.design.FixedRail;
import halfrail.design.Load;
import halfrail.design.OpAmpChoice;
import halfrail.design.Reference;
import halfrail.design.SignalSource;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.design.Supply;
import halfrail.design.Thresholds;
import halfrail.design.UsbPort;
import halfrail.parts.CapacitorTechnology;
import halfrail.parts.CellChemistry;
import halfrail.parts.OpAmpArchetype;
import halfrail.parts.PartsLibrary;
import halfrail.units.ESeries;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Random designs of valid parts and values (E12 values over several decades; invented test data):
 * the analysis either refuses the design with a {@link DesignException} or reports, and a report
 * never holds a non-finite number, never shows numbers beside a failure, and only uses known codes.
 */
class RandomDesignPropertiesTest {
    static <T> T pick(Random r, List<T> from) {
        return from.get(r.nextInt(from.size()));
    }

    static double value(Random r, double lowDecade, int decades) {
        double base = pick(r, ESeries.E12.mantissas());
        return base * lowDecade * Math.pow(10, r.nextInt(decades));
    }

    static CapacitorSpec capacitor(Random r, double lowDecade) {
        List<String> techs = PartsLibrary.builtIn().capacitorTechnologies().stream().map(CapacitorTechnology::id).toList();
        return new CapacitorSpec(value(r, lowDecade, 3), pick(r, techs), pick(r, List.of(6.3, 16.0, 25.0, 63.0)));
    }

    static Design design(long seed) {
        Random r = new Random(seed);
        List<String> parts = PartsLibrary.builtIn().opAmpArchetypes().stream().map(OpAmpArchetype::id).toList();
        List<String> cells = PartsLibrary.builtIn().cellChemistries().stream().map(CellChemistry::id).toList();
        Supply supply = switch (r.nextInt(3)) {
            case 0 -> new CellPack(pick(r, cells), 1 + r.nextInt(4));
            case 1 -> new FixedRail(pick(r, List.of(3.3, 5.0, 9.0, 12.0, 15.0, 24.0)), 0.05,
                    r.nextBoolean() ? 0.02 : 0, 100, 0.1);
            default -> new UsbPort(r.nextBoolean() ? 0.01 : 0, 1e3);
        };
        double ra = value(r, 1e3, 3);
        double rb = r.nextBoolean() ? ra : value(r, 1e3, 3);
        Reference ref = switch (r.nextInt(3)) {
            case 0 -> Reference.direct(ra, rb);
            case 1 -> Reference.decoupled(ra, rb, capacitor(r, 1e-6), value(r, 1e3, 3));
            default -> Reference.buffered(ra, rb, capacitor(r, 1e-6), value(r, 1e3, 3),
                    OpAmpChoice.archetype(pick(r, parts)), value(r, 10, 3), capacitor(r, 1e-6));
        };
        List<Stage> stages = new ArrayList<>();
        int n = 1 + r.nextInt(3);
        for (int i = 0; i < n; i++) {
            StageKind kind = pick(r, List.of(StageKind.values()));
            CapacitorSpec in = i == 0 || r.nextBoolean() ? capacitor(r, 1e-8) : null;
            CapacitorSpec leg = r.nextInt(4) == 0 ? null : capacitor(r, 1e-6);
            stages.add(new Stage("s" + i, kind, OpAmpChoice.archetype(pick(r, parts)), value(r, 1e3, 3),
                    value(r, 1e2, 3), leg, in, r.nextInt(8) != 0));
        }
        SignalSource src = new SignalSource(value(r, 1e-3, 3), AmplitudeUnit.VOLTS_PEAK, value(r, 10, 3), 20, 20e3);
        Load load = new Load(value(r, 1e2, 3), r.nextBoolean() ? 0 : value(r, 1e-10, 2),
                r.nextInt(4) == 0 ? null : capacitor(r, 1e-6));
        return new Design("random " + seed, "", supply, ref, stages, src, load, Thresholds.defaults(), 1e-3);
    }

    @Property(tries = 60, seed = "117650423633100")
    void aValidRandomDesignIsRefusedByFieldOrReportedWithFiniteNumbers(@ForAll long seed) {
        Design d = design(seed);
        DesignReport report;
        try {
            report = DesignAnalysis.analyse(d, false);
        } catch (DesignException e) {
            assertFalse(e.path().isBlank());
            return;
        }
        ReportAssertions.assertAllFinite(report);
        if (report.failure().isPresent()) {
            assertTrue(report.stages().isEmpty() && report.capacitors().isEmpty() && report.chain().isEmpty());
            assertTrue(report.has(Severity.FAIL));
        } else {
            assertTrue(report.stages().size() >= d.stages().size());
        }
        for (Finding f : report.findings()) {
            assertTrue(FindingCatalogueTest.ALL_CODES.contains(f.code()) || f.code().equals(DesignAnalysis.ANALYSIS_FAILED)
                    || f.code().equals(DesignAnalysis.POWER_ON_FAILED), f.code());
            assertFalse(f.message().contains("NaN") || f.message().contains("Infinity"), f.message());
        }
    }

    @Property(tries = 8, seed = "34935563821737")
    void withPowerOnTooTheReportHoldsOnlyFiniteNumbers(@ForAll long seed) {
        Design d = design(seed);
        try {
            ReportAssertions.assertAllFinite(DesignAnalysis.analyse(d, true));
        } catch (DesignException e) {
            assertFalse(e.path().isBlank());
        }
    }
}
