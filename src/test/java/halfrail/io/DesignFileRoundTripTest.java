package halfrail.io;

import halfrail.design.Design;
import halfrail.design.ReferenceKind;
import halfrail.design.StageKind;
import net.jqwik.api.statistics.Statistics;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ShrinkingMode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Design → JSON → design gives an equal design (record equality, so every double exactly). */
class DesignFileRoundTripTest {

    static List<Path> samples() {
        return DesignFileTexts.samples();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("samples")
    void everySampleReadsBackEqualAfterWriting(Path sample) {
        Design d = DesignFiles.read(sample);
        String written = DesignFiles.write(d);
        assertEquals(d, DesignFiles.read(written, "written"), written);
        // Writing is a fixed point: the second text is the first.
        assertEquals(written, DesignFiles.write(DesignFiles.read(written, "written")));
    }

    @Property(tries = 150, shrinking = ShrinkingMode.BOUNDED, seed = "267721921181918")
    void everyRandomValidDesignReadsBackEqual(@ForAll("designs") Design d) {
        String written = DesignFiles.write(d);
        assertEquals(d, DesignFiles.read(written, "random"), written);
        Statistics.label("reference").collect(d.reference().kind());
        Statistics.label("supply").collect(d.supply().getClass().getSimpleName());
        Statistics.label("custom op-amp").collect(d.stages().stream().anyMatch(s -> s.opAmp().customParams().isPresent()));
        for (StageKind k : StageKind.values()) {
            Statistics.label(k.name()).collect(d.stages().stream().anyMatch(s -> s.kind() == k));
        }
        Statistics.label("reference").coverage(c -> {
            for (ReferenceKind k : ReferenceKind.values()) {
                c.check(k).count(n -> n > 0);
            }
        });
        Statistics.label("supply").coverage(c -> {
            c.check("CellPack").count(n -> n > 0);
            c.check("FixedRail").count(n -> n > 0);
            c.check("UsbPort").count(n -> n > 0);
        });
        Statistics.label("custom op-amp").coverage(c -> c.check(true).count(n -> n > 0));
        for (StageKind k : StageKind.values()) {
            Statistics.label(k.name()).coverage(c -> c.check(true).count(n -> n > 0));
        }
    }

    @Provide
    Arbitrary<Design> designs() {
        return RandomDesigns.designs();
    }

    @Test
    void theWrittenTextStatesTheFormatAndWritesQuantitiesAsEngineeringText() {
        String written = DesignFiles.write(DesignFiles.read(DesignFileTexts.RICH_SAMPLE));
        assertTrue(written.startsWith("{\n  \"format\": \"halfrail-design\",\n  \"formatVersion\": 1,\n"), written);
        assertTrue(written.contains("\"upperOhms\": \"1 MΩ\""), written);
        assertTrue(written.contains("\"farads\": \"22 µF\""), written);
        assertTrue(written.contains("\"slewRateVoltsPerSecond\": 200000.0"), written);
        assertTrue(written.endsWith("}\n"));
        assertFalse(written.contains("\r"));
    }

    @Test
    void engineeringTextAndPlainNumbersGiveTheSameDesign() {
        String r = DesignFileTexts.rich();
        Design fromText = DesignFiles.read(r, "text");
        String numbers = DesignFileTexts.with(DesignFileTexts.with(DesignFileTexts.with(DesignFileTexts.with(r,
                "/reference/upperOhms", 1e6), "/stages/0/legCapacitor/farads", 22e-6),
                "/stages/1/opAmp/slewRateVoltsPerSecond", 2e5), "/thresholds/minRuntimeHours", 200);
        assertEquals(fromText, DesignFiles.read(numbers, "numbers"));
    }

    @Test
    void valuesMayBeWrittenInEveryAcceptedSpelling() {
        String r = DesignFileTexts.rich();
        Design d = DesignFiles.read(DesignFileTexts.with(DesignFileTexts.with(DesignFileTexts.with(
                DesignFileTexts.with(r, "/stages/0/feedbackOhms", "100 kohm"), "/stages/0/legOhms", "10kΩ"),
                "/stages/1/opAmp/slewRateVoltsPerSecond", "200000 V/s"), "/thresholds/settleBandFraction", "2 %"), "t");
        assertEquals(100e3, d.stages().get(0).feedbackOhms());
        assertEquals(10e3, d.stages().get(0).legOhms());
        assertEquals(2e5, d.stages().get(1).opAmp().customParams().orElseThrow().slewRateVoltsPerSecond());
        assertEquals(0.02, d.thresholds().settleBandFraction());
        // IEC 60062 codes (4k7, 2µ2, R47) and SI prefixes, as halfrail.units reads them.
        Design codes = DesignFiles.read(DesignFileTexts.with(DesignFileTexts.with(r, "/load/ohms", "R47"),
                "/stages/0/inputCapacitor/farads", "2µ2"), "t");
        assertEquals(0.47, codes.load().ohms());
        assertEquals(2.2e-6, codes.stages().get(0).inputCapacitor().farads(), 1e-21);
    }

    @Test
    void aDbLevelMayCarryItsUnitOrBeABareNumber() {
        String r = DesignFileTexts.with(DesignFileTexts.rich(), "/source/amplitudeUnit", "dBu");
        assertEquals(-10.0, DesignFiles.read(DesignFileTexts.with(r, "/source/amplitude", "-10 dBu"), "t").source().amplitude());
        assertEquals(-10.0, DesignFiles.read(DesignFileTexts.with(r, "/source/amplitude", -10), "t").source().amplitude());
        assertEquals(-10.0, DesignFiles.read(DesignFileTexts.with(r, "/source/amplitude", "-10"), "t").source().amplitude());
    }

    @Test
    void optionalPartsTakeTheirDocumentedDefaults() {
        String r = DesignFileTexts.without(DesignFileTexts.without(DesignFileTexts.without(DesignFileTexts.rich(),
                "/thresholds"), "/stages/0/legCapacitor"), "/source/sourceOhms");
        Design d = DesignFiles.read(r, "t");
        assertEquals(halfrail.design.Thresholds.defaults(), d.thresholds());
        assertEquals(Design.DEFAULT_POWER_ON_RAMP_SECONDS, d.powerOnRampSeconds());
        assertEquals(null, d.stages().get(0).legCapacitor());
        assertTrue(d.stages().get(0).biased());
        assertEquals(0.0, d.source().sourceOhms());
    }
}
