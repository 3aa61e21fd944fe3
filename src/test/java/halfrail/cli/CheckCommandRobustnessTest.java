package halfrail.cli;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Label;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.statistics.Statistics;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@code check} on random small netlists ends in 0, 1 or 2 — never an internal error. */
class CheckCommandRobustnessTest {
    private static final List<String> LINES = List.of("V1 vcc 0 DC 9", "V2 vcc 0 5", "VIN src 0 AC 0.1",
            "R1 vcc ref 100k", "R2 ref 0 100k", "C1 ref 0 10u", "C2 src inp 100n", "R3 ref inp 1meg",
            "X1 inp inm vcc 0 out M", "R4 out inm 100k", "R5 inm 0 10k", "R6 inm fb 10k", "C3 fb 0 10u",
            "X2 out inm2 vcc 0 out2 M", "R7 out2 inm2 1k", "I1 vcc inp 1u", "R8 out 0 1", "C4 out load 1u",
            "R9 load 0 10k", "R10 inp out 1e-3", "R11 inm ref 1t", "V3 out 0 1", "R12 vcc 0 1f");
    private static final String MODEL =
            ".model M opamp (avol=200k gbw=3meg ib=20n swing_low=1.2 swing_high=1.5 cm_high=1.5)";

    @Provide
    Arbitrary<List<String>> netlists() {
        return Arbitraries.of(LINES).list().uniqueElements().ofMinSize(1).ofMaxSize(14);
    }

    @Property(tries = 300, seed = "200508384714318")
    @Label("check ends with exit 0, 1 or 2 on random small netlists")
    void checkEndsWithAKnownExitCode(@ForAll("netlists") List<String> lines) {
        Path f;
        try {
            f = Files.createTempFile("halfrail-check", ".cir");
            Files.writeString(f, "random\n" + String.join("\n", lines) + "\n" + MODEL + "\n.end\n");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        try {
            CheckCommandTest.Run r = CheckCommandTest.run("check", "--format", "json", f.toString());
            Statistics.collect(r.code());
            assertTrue(r.code() == ExitCodes.PASS || r.code() == ExitCodes.FINDING || r.code() == ExitCodes.BAD_INPUT,
                    "exit " + r.code() + ": " + r.err() + "\n" + String.join("\n", lines));
        } finally {
            try {
                Files.deleteIfExists(f);
            } catch (IOException ignored) {
                // a left-over temporary file is harmless
            }
        }
    }
}
