package halfrail.io;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Label;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.StringLength;
import net.jqwik.api.statistics.Statistics;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.fail;

/**
 * The reader's contract: whatever the text, it returns a netlist or throws a NetlistException —
 * never another unchecked exception. Random text and mutated netlist lines probe it.
 */
class NetlistReaderRobustnessTest {

    private static final List<String> POOL = List.of(
            "Title line", "* comment", "* output: out", "*output:", "+ 10k", "+", "V1 vcc 0 DC 9 AC 1",
            "VIN src 0 AC 0.1", "I1 a 0 DC 1u", "R1 vcc ref 100k", "R2 ref 0 100k", "C1 ref 0 10uF",
            "X1 inp inm vcc 0 out GP", ".model GP opamp (avol=200k gbw=3meg sr=1meg vos=2m ib=20n",
            "+ swing_low=1.2 swing_high=1.5 cm_low=0 cm_high=1.5 rout=50 iq=500u)", ".model gp opamp",
            ".op", ".tran 1u 1m", ".end", ".subckt x a b", "L1 a 0 1u", "R3 out inm 1meg", "C2 inp src 100n",
            "V2 a a 1", "R4 a 0 0", "X2 a b c c d GP", "", "   ", "\t+ 1k", "R5 a", "V3 b 0 DC", "gnd 0 0");

    private static final char[] NOISE = "+*.=(),-0123456789emgkunpfµμ \t\r\nRCVIXrcvix_;:'\"\u0000\u00a0\u2028"
            .toCharArray();

    private static void parseOrNetlistException(String text) {
        try {
            NetlistReader.parse(text);
            Statistics.collect("read");
        } catch (NetlistException expected) {
            Statistics.collect(expected.kind());
        } catch (RuntimeException e) {
            fail("the reader threw " + e + " for:\n" + text, e);
        }
    }

    @Property(tries = 1500, seed = "211372717643349")
    @Label("arbitrary text gives a netlist or a NetlistException")
    void arbitraryTextGivesANetlistOrANetlistException(@ForAll @StringLength(max = 300) String text) {
        parseOrNetlistException(text);
    }

    @Property(tries = 1500, seed = "127391190081994")
    @Label("text of netlist characters gives a netlist or a NetlistException")
    void netlistCharactersGiveANetlistOrANetlistException(@ForAll("netlistCharacters") String text) {
        parseOrNetlistException(text);
    }

    @Property(tries = 3000, seed = "45694023444902")
    @Label("mutated netlist lines give a netlist or a NetlistException")
    void mutatedLinesGiveANetlistOrANetlistException(@ForAll("mutatedNetlists") String text) {
        parseOrNetlistException(text);
    }

    @Provide
    Arbitrary<String> netlistCharacters() {
        return Arbitraries.strings().withChars(NOISE).ofMaxLength(300);
    }

    @Provide
    Arbitrary<String> mutatedNetlists() {
        Arbitrary<List<String>> lines = Arbitraries.of(POOL).list().ofMaxSize(16);
        Arbitrary<List<int[]>> edits = Combinators.combine(
                        Arbitraries.integers().between(0, 2),
                        Arbitraries.integers().between(0, 2000),
                        Arbitraries.integers().between(0, NOISE.length - 1))
                .as((op, pos, ch) -> new int[] {op, pos, ch}).list().ofMaxSize(6);
        return Combinators.combine(lines, edits).as((ls, es) -> {
            StringBuilder b = new StringBuilder(String.join("\n", new ArrayList<>(ls)));
            for (int[] e : es) {
                if (b.length() == 0) {
                    b.append(NOISE[e[2]]);
                    continue;
                }
                int at = e[1] % b.length();
                switch (e[0]) {
                    case 0 -> b.deleteCharAt(at);
                    case 1 -> b.insert(at, NOISE[e[2]]);
                    default -> b.setCharAt(at, NOISE[e[2]]);
                }
            }
            return b.toString();
        });
    }
}
