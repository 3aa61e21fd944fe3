package halfrail.io;

import halfrail.circuit.OpAmpParams;
import halfrail.design.AmplitudeUnit;
import halfrail.design.CapacitorSpec;
import halfrail.design.CellPack;
import halfrail.design.Design;
import halfrail.design.FixedRail;
import halfrail.design.Load;
import halfrail.design.OpAmpChoice;
import halfrail.design.Reference;
import halfrail.design.ReferenceKind;
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
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;

import java.util.ArrayList;
import java.util.List;

/**
 * Random valid designs for property tests: E-series part values (IEC 60063) over wide decades,
 * every supply kind, reference kind, stage kind and amplitude unit, archetype and custom
 * op-amps, and some values off any series so the writer's shortest text is exercised too.
 * The designs are valid for the model; they need not be sensible circuits.
 */
final class RandomDesigns {
    private static final PartsLibrary PARTS = PartsLibrary.builtIn();

    private RandomDesigns() {}

    /** An E-series value (E6 to E96) between {@code min} and {@code max}, or now and then any double in that range. */
    static Arbitrary<Double> value(double min, double max) {
        Arbitrary<Double> series = Arbitraries.of(ESeries.E6, ESeries.E12, ESeries.E24, ESeries.E96)
                .flatMap(s -> Arbitraries.of(s.values(min, max)));
        return Arbitraries.frequencyOf(
                net.jqwik.api.Tuple.of(9, series),
                net.jqwik.api.Tuple.of(1, Arbitraries.doubles().between(0, 1).ofScale(12)
                        .map(f -> Math.min(max, Math.max(min, min * Math.pow(max / min, f))))));
    }

    static Arbitrary<Double> orZero(Arbitrary<Double> a) {
        return Arbitraries.frequencyOf(net.jqwik.api.Tuple.of(1, Arbitraries.just(0.0)), net.jqwik.api.Tuple.of(2, a));
    }

    static Arbitrary<String> text() {
        return Arbitraries.strings().withCharRange(' ', '\u024F').withChars("\"\\\n\t/µΩ€")
                .ofMaxLength(40);
    }

    static Arbitrary<CapacitorSpec> capacitor() {
        return Combinators.combine(value(1e-12, 1e-2),
                        Arbitraries.of(PARTS.capacitorTechnologies().stream().map(CapacitorTechnology::id).toList()),
                        value(2.5, 500))
                .as(CapacitorSpec::new);
    }

    static Arbitrary<CapacitorSpec> capacitorOrNone() {
        return capacitor().injectNull(0.3);
    }

    static Arbitrary<OpAmpParams> customParams() {
        Arbitrary<Double> signed = Arbitraries.doubles().between(-0.5, 0.5);
        Arbitrary<double[]> head = Combinators.combine(value(1e3, 1e7), value(1e3, 1e9), value(1e3, 1e9),
                        signed.map(v -> v * 1e-2), signed.map(v -> v * 1e-6), signed.map(v -> v * 1e-8))
                .as((a, g, s, vos, ib, ios) -> new double[] {a, g, s, vos, ib, ios});
        Arbitrary<double[]> tail = Combinators.combine(signed, signed, orZero(value(1e-3, 2)), orZero(value(1e-3, 2)),
                        orZero(value(1, 1e4)), orZero(value(1e-7, 1e-2)), orZero(value(1, 10)),
                        Arbitraries.of(Double.POSITIVE_INFINITY, 36.0, 40.0))
                .as((cml, cmh, sl, sh, ro, iq, min, max) -> new double[] {cml, cmh, sl, sh, ro, iq, min, max});
        return Combinators.combine(head, tail).as((h, t) -> new OpAmpParams(h[0], h[1], h[2], h[3], h[4], h[5],
                t[0], t[1], t[2], t[3], t[4], t[5], t[6], t[7]));
    }

    static Arbitrary<OpAmpChoice> opAmp() {
        return Arbitraries.oneOf(
                Arbitraries.of(PARTS.opAmpArchetypes().stream().map(OpAmpArchetype::id).toList()).map(OpAmpChoice::archetype),
                customParams().map(OpAmpChoice::custom));
    }

    static Arbitrary<Supply> supply() {
        Arbitrary<Supply> cells = Combinators.combine(
                        Arbitraries.of(PARTS.cellChemistries().stream().map(CellChemistry::id).toList()),
                        Arbitraries.integers().between(1, 12))
                .as(CellPack::new);
        Arbitrary<Supply> fixed = Combinators.combine(value(1, 48), Arbitraries.of(0.0, 0.01, 0.05, 0.1, 0.2),
                        orZero(value(1e-4, 1)), value(50, 1e6), orZero(value(1e-3, 10)))
                .as(FixedRail::new);
        Arbitrary<Supply> usb = Combinators.combine(orZero(value(1e-4, 0.5)), value(50, 1e6)).as(UsbPort::new);
        return Arbitraries.oneOf(cells, fixed, usb);
    }

    static Arbitrary<Reference> reference() {
        Arbitrary<Double> r = value(1e2, 1e7);
        return Arbitraries.of(ReferenceKind.values()).flatMap(kind -> switch (kind) {
            case DIVIDER_DIRECT -> Combinators.combine(r, r).as(Reference::direct);
            case DIVIDER_DECOUPLED -> Combinators.combine(r, r, capacitor(), r).as(Reference::decoupled);
            case DIVIDER_BUFFERED -> Combinators.combine(r, r, capacitor(), r, opAmp(), value(1, 1e4), capacitor())
                    .as(Reference::buffered);
        });
    }

    static Arbitrary<Stage> stage(int index) {
        Arbitrary<Double> r = value(10, 1e7);
        return Combinators.combine(text().map(t -> "s" + index + t), Arbitraries.of(StageKind.values()), opAmp(),
                        r, r, capacitorOrNone(), capacitorOrNone(), Arbitraries.of(true, false))
                .as((name, kind, op, r2, r1, leg, in, biased) -> kind == StageKind.FOLLOWER
                        ? new Stage(name, kind, op, 0, 0, null, in, biased)
                        : new Stage(name, kind, op, r2, r1, leg, in, biased));
    }

    static Arbitrary<List<Stage>> stages() {
        return Arbitraries.integers().between(1, 4).flatMap(n -> {
            List<Arbitrary<Stage>> each = new ArrayList<>();
            for (int i = 0; i < n; i++) {
                each.add(stage(i));
            }
            return Combinators.combine(each).as(list -> list);
        });
    }

    static Arbitrary<SignalSource> source() {
        Arbitrary<AmplitudeUnit> unit = Arbitraries.of(AmplitudeUnit.values());
        return unit.flatMap(u -> {
            Arbitrary<Double> amplitude = switch (u) {
                case VOLTS_PEAK, VOLTS_RMS -> value(1e-6, 10);
                case DBU, DBV -> Arbitraries.doubles().between(-120, 30);
            };
            return Combinators.combine(amplitude, orZero(value(1, 1e6)), value(1e-2, 1e3), value(2e3, 1e6))
                    .as((a, ohms, low, high) -> new SignalSource(a, u, ohms, low, high));
        });
    }

    static Arbitrary<Load> load() {
        return Combinators.combine(value(1, 1e7), orZero(value(1e-12, 1e-6)), capacitorOrNone()).as(Load::new);
    }

    static Arbitrary<Thresholds> thresholds() {
        Arbitrary<Thresholds> changed = Combinators.combine(value(1e-3, 0.1), value(0.1, 100),
                        Arbitraries.doubles().between(-3, 20), Arbitraries.doubles().between(0, 6),
                        Arbitraries.doubles().between(0, 0.5), value(1e-3, 1), value(1e-5, 0.1), value(1e-3, 1))
                .as((band, settle, headroom, offCentre, nearRail, drift, ripple, bias) -> new double[] {band, settle,
                        headroom, offCentre, nearRail, drift, ripple, bias})
                .flatMap(h -> Combinators.combine(value(0.1, 10), value(2, 1000), value(1e3, 1e7),
                                orZero(value(1, 1e4)), Arbitraries.of(0.0, -1.0, 0.5, 0.8, 1.0))
                        .as((step, gain, feedback, hours, derating) -> new Thresholds(h[0], h[1], h[2], h[3], h[4],
                                h[5], h[6], h[7], step, gain, feedback, hours, derating)));
        return Arbitraries.oneOf(Arbitraries.just(Thresholds.defaults()), changed);
    }

    /** The parts of a design but its power-on ramp (jqwik combines at most eight values at once). */
    private record Body(String name, String description, Supply supply, Reference reference, List<Stage> stages,
                        SignalSource source, Load load, Thresholds thresholds) {}

    static Arbitrary<Design> designs() {
        return Combinators.combine(text(), text(), supply(), reference(), stages(), source(), load(), thresholds())
                .as(Body::new)
                .flatMap(b -> orZero(value(1e-6, 1)).map(ramp -> new Design(b.name(), b.description(), b.supply(),
                        b.reference(), b.stages(), b.source(), b.load(), b.thresholds(), ramp)));
    }
}
