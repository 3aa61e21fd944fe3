package halfrail.bench;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;
import halfrail.design.Design;
import halfrail.design.DesignCircuit;
import halfrail.design.DesignCircuits;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.io.DesignFiles;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Generated circuits for the benchmarks: chains of single-supply non-inverting stages, each
 * with input coupling, bias resistor, feedback-leg blocking capacitor, sharing one decoupled
 * mid-rail divider. Invented values, for timing only.
 */
final class BenchCircuits {
    private BenchCircuits() {}

    /** Folder of the sample designs, relative to the working directory (system property {@code halfrail.samples}). */
    static final String SAMPLES = System.getProperty("halfrail.samples", "samples");

    /** A circuit with its signal input and output, for the benchmarks. */
    record Case(String name, Circuit circuit, String input, String output, Design design) {
    }

    /**
     * A benchmark case by name: {@code chain-N} ({@link #chain}), {@code scaling-N}
     * ({@link #scalingChain}), a sample design's file name without {@code .json} (its nominal
     * circuit), {@code generated-N}: the recorder preamp sample with its stages repeated up
     * to N stages (gain 48 each, all on the sample's soft reference: from three stages on the
     * chain motorboats, and the power-on run ends on the recognised oscillation), or
     * {@code alternating-N}: N stages alternating the sample's gain-48 stage and an inverting
     * pad of gain −1/48 (47 kΩ in, 1 kΩ feedback), a chain that does real work at every stage
     * and settles like the sample.
     */
    static Case named(String name) {
        if (name.startsWith("chain-")) {
            return new Case(name, chain(Integer.parseInt(name.substring(6))), "VSIG", "load", null);
        }
        if (name.startsWith("scaling-")) {
            return new Case(name, scalingChain(Integer.parseInt(name.substring(8))), "VSIG", "load", null);
        }
        Design d = name.startsWith("generated-") ? generated(Integer.parseInt(name.substring(10)))
                : name.startsWith("alternating-") ? alternating(Integer.parseInt(name.substring(12))) : sample(name);
        DesignCircuit dc = DesignCircuits.nominal(d);
        return new Case(name, dc.circuit(), dc.signalSource(), dc.loadNode(), d);
    }

    /** A sample design read from {@link #SAMPLES}. */
    static Design sample(String name) {
        return DesignFiles.read(Path.of(SAMPLES, name + ".json"));
    }

    /** The recorder preamp sample with its stages repeated (names numbered) up to {@code stages} stages. */
    static Design generated(int stages) {
        Design base = sample("handheld-recorder-mic-preamp");
        List<Stage> list = new ArrayList<>();
        for (int i = 0; list.size() < stages; i++) {
            Stage s = base.stages().get(i % base.stages().size());
            list.add(new Stage(s.name() + "-" + (i + 1), s.kind(), s.opAmp(), s.feedbackOhms(), s.legOhms(),
                    s.legCapacitor(), s.inputCapacitor(), s.biased()));
        }
        return new Design(base.name() + " × " + stages, base.description(), base.supply(), base.reference(), list,
                base.source(), base.load(), base.thresholds(), base.powerOnRampSeconds());
    }

    /** The recorder preamp's stage alternated with an inverting pad of gain −1/48, up to {@code stages} stages. */
    static Design alternating(int stages) {
        Design base = sample("handheld-recorder-mic-preamp");
        Stage s = base.stages().get(0);
        List<Stage> list = new ArrayList<>();
        for (int i = 0; i < stages; i++) {
            list.add(i % 2 == 0
                    ? new Stage(s.name() + "-" + (i + 1), s.kind(), s.opAmp(), s.feedbackOhms(), s.legOhms(),
                    s.legCapacitor(), s.inputCapacitor(), true)
                    : new Stage("pad-" + (i + 1), StageKind.INVERTING, s.opAmp(), 1e3, 47e3, null,
                    s.inputCapacitor(), true));
        }
        return base.withStages(list);
    }

    /** Op-amp used in every generated stage: a representative single-supply part. */
    static final OpAmpParams PART = OpAmpParams.defaults().withSwing(0.02, 1.5).withCommonMode(0, 1.5)
            .withInputErrors(2e-3, 50e-9, 5e-9).withOutputOhms(50).withQuiescent(0.5e-3).withSlewRate(0.5e6);

    /**
     * A chain of {@code stages} stages on a 9 V supply. The reference is stiff (10 kΩ Thevenin, 200 µF)
     * because a soft reference shared through bias resistors closes a low-frequency feedback loop
     * around the chain that can oscillate (seen with 100 kΩ and 20 µF at three stages). With three stages the circuit has
     * about 20 nodes. Time constants span from the 1 µs input filter to the 2 s reference.
     */
    static Circuit chain(int stages) {
        return chain(stages, false);
    }

    /**
     * The scaling chain: as {@link #chain(int)}, but each stage after the first is fed through a
     * 10 kΩ / 1 kΩ divider (1/11, so every stage has a net gain of 1) and has its own decoupled
     * mid-rail divider (20 kΩ / 20 kΩ, 200 µF). In {@link #chain(int)} the gains of 11 multiply:
     * from four stages on, the power-on step of the first stage drives the later ones rail to
     * rail for seconds (each stage's two 1.5 Hz high-pass corners make it ring), and the time
     * steps measure that ringing, not the solver. Here every stage does the same work, so the
     * cost per stage can be compared.
     */
    static Circuit scalingChain(int stages) {
        return chain(stages, true);
    }

    private static Circuit chain(int stages, boolean ownReference) {
        Circuit.Builder b = Circuit.builder().implicitNodes().title(stages + "-stage chain");
        b.add(new halfrail.circuit.VoltageSource("VSUP", "vcc", "0", 9, 0, 1, 1e-3));
        b.resistor("RA", "vcc", "ref", 20e3).resistor("RB", "ref", "0", 20e3);
        b.capacitor("CREF", "ref", "0", 200e-6);
        b.add(new halfrail.circuit.VoltageSource("VSIG", "src", "0", 0, 1, 1e3, 0));
        b.resistor("RF", "src", "flt", 100).capacitor("CF", "flt", "0", 10e-9);
        String prev = "flt";
        for (int i = 1; i <= stages; i++) {
            String p = "s" + i + "p";
            String n = "s" + i + "n";
            String leg = "s" + i + "leg";
            String out = "s" + i + "out";
            String ref = "ref";
            String in = prev;
            if (ownReference && i > 1) {
                ref = "s" + i + "ref";
                b.resistor("RA" + i, "vcc", ref, 20e3).resistor("RB" + i, ref, "0", 20e3);
                b.capacitor("CREF" + i, ref, "0", 200e-6);
                in = "s" + i + "att";
                b.resistor("RT" + i, prev, in, 10e3).resistor("RD" + i, in, ref, 1e3);
            }
            b.add(new Capacitor("CIN" + i, p, in, 1e-6, 0.1, "polyester-film", 50, false, 1e-11));
            b.resistor("RBIAS" + i, ref, p, 100e3);
            b.resistor("R2_" + i, out, n, 47e3);
            b.resistor("R1_" + i, n, leg, 4.7e3);
            b.add(new Capacitor("CLEG" + i, leg, "0", 22e-6, 0.1, "tantalum", 16, true, 1e-10));
            b.opAmp("U" + i, p, n, "vcc", "0", out, PART);
            prev = out;
        }
        b.add(new Capacitor("COUT", prev, "load", 10e-6, 0.2, "aluminium-electrolytic", 25, true, 1e-9));
        b.resistor("RL", "load", "0", 10e3);
        return b.build();
    }
}
