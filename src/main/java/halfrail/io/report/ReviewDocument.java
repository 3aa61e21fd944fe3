package halfrail.io.report;

import halfrail.check.BatteryReport;
import halfrail.check.ChainReport;
import halfrail.check.DesignReport;
import halfrail.check.Finding;
import halfrail.check.PowerOnReport;
import halfrail.check.ResponseCurve;
import halfrail.check.StageReport;
import halfrail.check.SwingReport;
import halfrail.design.CapacitorSpec;
import halfrail.design.CellPack;
import halfrail.design.Design;
import halfrail.design.FixedRail;
import halfrail.design.Stage;
import halfrail.design.Supply;
import halfrail.design.UsbPort;

import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/** Builds the blocks of a review document from a {@link Review}; both writers lay out the same blocks. */
final class ReviewDocument {
    static final String TITLE = "Halfrail design review";
    static final DateTimeFormatter WHEN = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm 'UTC'", Locale.ROOT)
            .withZone(ZoneOffset.UTC);

    /** Most op-amps drawn side by side in one ladder picture (more would shrink the text on a page). */
    static final int LADDERS_PER_PICTURE = 3;

    private ReviewDocument() {}

    /** Element id of design {@code i}'s section (counted from 1). */
    static String designId(int i) {
        return "design-" + (i + 1);
    }

    static List<Block> blocks(Review review) {
        List<Block> b = new ArrayList<>();
        b.add(new Block.Heading(1, TITLE, "top"));
        b.add(new Block.Para("halfrail " + review.toolVersion() + " \u00B7 made " + WHEN.format(review.generated())
                + " \u00B7 " + count(review) + " \u00B7 overall verdict: " + review.worst().word(), Block.Para.Kind.META));
        if (review.hasSummary()) {
            List<List<String>> rows = new ArrayList<>();
            List<Verdict> verdicts = new ArrayList<>();
            List<String> links = new ArrayList<>();
            for (Review.SummaryRow r : review.summary()) {
                links.add(designId(r.entry()));
                rows.add(List.of(r.design(), r.source(), r.stage(), r.verdict().word(),
                        r.codes().isEmpty() ? Fmt.NONE : String.join(", ", r.codes())));
                verdicts.add(r.verdict());
            }
            b.add(new Block.Heading(2, "Summary", "summary"));
            b.add(new Block.Table("summary-table", "Every design and stage, worst first",
                    List.of("Design", "File", "Stage", "Verdict", "Findings"), rows, verdicts, 3, links));
        }
        for (int i = 0; i < review.entries().size(); i++) {
            design(b, review.entries().get(i), designId(i));
        }
        for (int k = 0; k < review.netlists().size(); k++) {
            netlist(b, review.netlists().get(k), designId(review.entries().size() + k));
        }
        return b;
    }

    /** "3 designs", "1 design, 2 netlists". */
    static String count(Review review) {
        int d = review.entries().size();
        int n = review.netlists().size();
        String designs = d + (d == 1 ? " design" : " designs");
        String netlists = n + (n == 1 ? " netlist" : " netlists");
        return n == 0 ? designs : d == 0 ? netlists : designs + ", " + netlists;
    }

    private static void netlist(List<Block> b, NetlistEntry n, String id) {
        halfrail.check.CircuitReport r = n.report();
        b.add(new Block.Heading(2, n.name(), id));
        b.add(new Block.Para("netlist " + n.source() + " \u00B7 verdict: " + Verdict.of(r.findings()).word()
                + " \u00B7 circuit-level checks only (no design model: no ladders, supply or stage tables)",
                Block.Para.Kind.META));
        List<List<String>> nodes = new ArrayList<>();
        r.nodeVolts().forEach((node, v) -> nodes.add(List.of(node + (n.outputNode().filter(node::equals).isPresent()
                ? " (output)" : ""), v == null ? "floating (no DC path)" : Fmt.volts(v))));
        b.add(new Block.Table(id + "-nodes", "DC operating point", List.of("Node", "Voltage"), nodes));
        for (int k = 0; k < r.opAmps().size(); k++) {
            halfrail.solve.OpAmpState o = r.opAmps().get(k);
            List<List<String>> rows = new ArrayList<>();
            rows.add(List.of("quiescent point (output at rest)", Fmt.volts(o.outputVolts())
                    + (o.saturated() ? " \u2014 on a rail" : "")));
            rows.add(List.of("inputs at rest", "in+ " + Fmt.volts(o.inPlusVolts()) + ", in\u2212 " + Fmt.volts(o.inMinusVolts())
                    + (o.commonModeOk() ? " (in range)" : " (OUT OF RANGE)")));
            rows.add(List.of("swing window", Fmt.volts(o.swingLowVolts()) + " \u2013 " + Fmt.volts(o.swingHighVolts())));
            rows.add(List.of("common-mode range", Fmt.volts(o.commonModeLowVolts()) + " \u2013 "
                    + Fmt.volts(o.commonModeHighVolts())));
            b.add(new Block.Table(id + "-opamp-" + (k + 1), "Op-amp " + o.name(), List.of("Quantity", "Value"), rows));
        }
        List<List<String>> response = new ArrayList<>();
        response.add(List.of("output node", n.outputNode().orElse(Fmt.NONE)));
        response.add(List.of("lower corner", r.lowerCornerHz().isPresent() ? Fmt.hertz(r.lowerCornerHz().getAsDouble())
                : Fmt.NONE));
        response.add(List.of("upper corner", r.upperCornerHz().isPresent() ? Fmt.hertz(r.upperCornerHz().getAsDouble())
                : Fmt.NONE));
        response.add(List.of("settle-up time", r.settleSeconds().isPresent()
                ? Fmt.seconds(r.settleSeconds().getAsDouble()) : "not settled or not run"));
        b.add(Block.Table.pairs(id + "-response", "Response and power-on", response));
        for (String note : n.notes()) {
            b.add(new Block.Para("reader note: " + note, Block.Para.Kind.META));
        }
        b.add(new Block.Heading(3, "Findings", id + "-findings"));
        if (r.findings().isEmpty()) {
            b.add(new Block.Para("No findings.", Block.Para.Kind.TEXT));
        }
        for (Finding f : r.findings()) {
            b.add(new Block.FindingItem(f));
        }
    }

    private static void design(List<Block> b, ReviewEntry e, String id) {
        DesignReport r = e.report();
        Design d = r.design();
        b.add(new Block.Heading(2, d.name(), id));
        b.add(new Block.Para("file " + e.source() + " \u00B7 verdict: " + Verdict.of(r.findings()).word(),
                Block.Para.Kind.META));
        if (!d.description().isBlank()) {
            b.add(new Block.Para(d.description(), Block.Para.Kind.TEXT));
        }
        b.add(Block.Table.pairs(id + "-job", "The job", job(d, r)));
        b.add(Block.Table.pairs(id + "-supply", "The supply", supply(d.supply(), r.battery())));
        b.add(new Block.Para("Safety: " + d.supply().safetyNote(), Block.Para.Kind.SAFETY));
        if (r.failure().isPresent()) {
            b.add(new Block.Para("The circuit could not be solved (" + r.failure().get() + "): " + r.failureMessage()
                    + ". The figures below are missing rather than wrong; the findings say why.",
                    Block.Para.Kind.PROBLEM));
        }
        for (int s = 0; s < r.stages().size(); s++) {
            StageReport st = r.stages().get(s);
            b.add(new Block.Heading(3, "Stage " + st.label(), id + "-stage-" + (s + 1)));
            b.add(new Block.Table(id + "-stage-" + (s + 1) + "-table", "Stage " + st.label(),
                    List.of("Quantity", "Value"), stage(d, r, st)));
        }
        if (!r.ladders().isEmpty()) {
            b.add(new Block.Heading(3, "Voltage ladder", id + "-ladder"));
            int groups = (r.ladders().size() + LADDERS_PER_PICTURE - 1) / LADDERS_PER_PICTURE;
            for (int k = 0; k < groups; k++) {
                List<halfrail.check.Ladder> some = r.ladders().subList(k * LADDERS_PER_PICTURE,
                        Math.min(r.ladders().size(), (k + 1) * LADDERS_PER_PICTURE));
                b.add(new Block.Picture(id + "-ladder-picture" + (k == 0 ? "" : "-" + (k + 1)),
                        "Each op-amp from ground to the supply: where its output can go, where its inputs work, its"
                                + " rest point and the nominal signal around it.",
                        "voltage ladder of " + d.name(), ReportPictures.ladders(some, r.findings())));
            }
        }
        Optional<PowerOnReport> p = r.powerOn().filter(x -> x.trace().isPresent());
        if (p.isPresent()) {
            b.add(new Block.Heading(3, "Power-on", id + "-power-on"));
            b.add(new Block.Picture(id + "-power-on-picture",
                    "Every op-amp output and the load from switch-on, all capacitors empty at the start.",
                    "power-on transient of " + d.name(), ReportPictures.powerOn(p.get(), d.supply().nominalVolts())));
        }
        Optional<ChainReport> c = r.chain().filter(x -> !x.responses().isEmpty());
        if (c.isPresent()) {
            b.add(new Block.Heading(3, "Frequency response", id + "-response"));
            b.add(new Block.Picture(id + "-response-picture",
                    "Small-signal gain from the source at the nominal operating point.",
                    "frequency response of " + d.name(), ReportPictures.response(c.get())));
        }
        b.add(new Block.Heading(3, "Findings", id + "-findings"));
        if (r.findings().isEmpty()) {
            b.add(new Block.Para("No findings.", Block.Para.Kind.TEXT));
        }
        for (Finding f : r.findings()) {
            b.add(new Block.FindingItem(f));
        }
    }

    private static List<List<String>> job(Design d, DesignReport r) {
        List<List<String>> rows = new ArrayList<>();
        rows.add(List.of("signal source", Fmt.volts(d.source().voltsPeak()) + " peak from "
                + Fmt.ohms(d.source().sourceOhms())));
        rows.add(List.of("band of interest", Fmt.hertz(d.source().bandLowHz()) + " \u2013 "
                + Fmt.hertz(d.source().bandHighHz())));
        String load = Fmt.ohms(d.load().ohms());
        if (d.load().farads() > 0) {
            load += " \u2225 " + Fmt.farads(d.load().farads());
        }
        load += d.load().outputCapacitor() == null ? ", DC-coupled"
                : ", through " + capacitor(d.load().outputCapacitor());
        rows.add(List.of("load", load));
        List<String> stages = new ArrayList<>();
        for (Stage s : d.stages()) {
            String kind = s.kind().name().toLowerCase(Locale.ROOT).replace('_', '-');
            stages.add(s.name() + " (" + kind + ", gain " + Fmt.gain(s.nominalGain()) + ")");
        }
        rows.add(List.of("stages", String.join("; ", stages)));
        rows.add(List.of("mid-rail reference", d.reference().kind().name().toLowerCase(Locale.ROOT).replace('_', ' ')
                + ", " + Fmt.ohms(d.reference().upperOhms()) + " over " + Fmt.ohms(d.reference().lowerOhms())));
        r.chain().ifPresent(c -> {
            rows.add(List.of("chain gain", Fmt.gain(c.peakGain()) + " V/V at " + Fmt.hertz(c.peakHz())));
            rows.add(List.of("chain lower corner", c.lowerCornerHz().isPresent()
                    ? Fmt.hertz(c.lowerCornerHz().getAsDouble()) : Fmt.NONE));
            if (c.rippleAtLoadVolts() > 0) {
                rows.add(List.of("supply ripple at the load", Fmt.volts(c.rippleAtLoadVolts()) + " peak"));
            }
            rows.add(List.of("reference noise at the load", Fmt.volts(c.referenceNoiseVoltsRms()) + " rms (300 K)"));
        });
        return rows;
    }

    private static String capacitor(CapacitorSpec c) {
        return Fmt.farads(c.farads()) + " " + c.technology() + " " + Fmt.volts(c.ratedVolts());
    }

    private static List<List<String>> supply(Supply s, Optional<BatteryReport> battery) {
        List<List<String>> rows = new ArrayList<>();
        String kind;
        if (s instanceof CellPack c) {
            kind = c.cellsInSeries() + " \u00D7 " + c.data().displayName() + " in series";
        } else if (s instanceof FixedRail f) {
            kind = "fixed rail " + Fmt.volts(f.volts()) + String.format(Locale.ROOT, " \u00B1%.3g %%", 100 * f.tolerance());
        } else if (s instanceof UsbPort) {
            kind = "USB port";
        } else {
            kind = s.getClass().getSimpleName();
        }
        rows.add(List.of("kind", kind));
        rows.add(List.of("nominal", Fmt.volts(s.nominalVolts())));
        rows.add(List.of("fresh (highest)", Fmt.volts(s.highVolts())));
        rows.add(List.of("end-point (lowest)", Fmt.volts(s.lowVolts())));
        rows.add(List.of("internal resistance", Fmt.ohms(s.internalOhms())));
        if (s.rippleVoltsPeak() > 0) {
            rows.add(List.of("ripple", Fmt.volts(s.rippleVoltsPeak()) + " peak at " + Fmt.hertz(s.rippleHz())));
        }
        battery.ifPresent(bt -> {
            rows.add(List.of("current drawn (whole design)", Fmt.amps(bt.totalAmps()) + ": divider "
                    + Fmt.amps(bt.dividerAmps()) + ", op-amps " + Fmt.amps(bt.opAmpAmps()) + ", leakage "
                    + Fmt.amps(bt.leakageAmps())));
            if (bt.capacityAmpHours().isPresent()) {
                rows.add(List.of("capacity", String.format(Locale.ROOT, "%.3g A\u00B7h", bt.capacityAmpHours().getAsDouble())));
            }
            rows.add(List.of("runtime", bt.runtimeHours().isPresent() ? Fmt.hours(bt.runtimeHours().getAsDouble())
                    : Fmt.NONE + " (no capacity)"));
        });
        return rows;
    }

    /** The rows of one stage's table (package-private for tests). */
    static List<List<String>> stage(Design d, DesignReport r, StageReport st) {
        List<List<String>> rows = new ArrayList<>();
        SwingReport n = st.nominal();
        rows.add(List.of("role", st.signal() ? "signal stage" : "reference buffer"));
        rows.add(List.of("quiescent point (output at rest)", Fmt.volts(n.quiescentVolts()) + " at "
                + Fmt.volts(n.supplyVolts()) + (n.saturated() ? " \u2014 on a rail" : "")));
        rows.add(List.of("inputs at rest", "in+ " + Fmt.volts(st.inPlusVolts()) + ", in\u2212 " + Fmt.volts(st.inMinusVolts())
                + (st.commonModeOkAtRest() ? " (in range)" : " (OUT OF RANGE)")));
        rows.add(List.of("swing window", Fmt.volts(n.swingLowVolts()) + " \u2013 " + Fmt.volts(n.swingHighVolts())));
        if (st.signal()) {
            rows.add(List.of("signal peak at the output", Fmt.volts(n.signalPeakVolts())));
            st.drivenByClipped().ifPresent(first -> rows.add(List.of("drive reaching this stage",
                    String.format(java.util.Locale.ROOT, "%.3g", 100 * st.driveFactor())
                            + " % of the linear drive: " + first + " clips first")));
            rows.add(List.of("headroom, nominal supply", headroom(n)));
            rows.add(List.of("headroom, fresh supply " + Fmt.volts(st.fresh().supplyVolts()), headroom(st.fresh())));
            rows.add(List.of("headroom, end-point supply " + Fmt.volts(st.endPoint().supplyVolts()),
                    headroom(st.endPoint())));
            rows.add(List.of("stage gain", Fmt.gain(st.stageGain()) + " V/V"));
            Optional<ResponseCurve> curve = r.chain().flatMap(c -> c.response(st.label()));
            rows.add(List.of("lower corner (source to this output)", curve.isPresent()
                    && curve.get().lowerCornerHz().isPresent() ? Fmt.hertz(curve.get().lowerCornerHz().getAsDouble())
                    : Fmt.NONE));
        } else {
            rows.add(List.of("rest point at fresh / end-point supply", Fmt.volts(st.fresh().quiescentVolts()) + " / "
                    + Fmt.volts(st.endPoint().quiescentVolts())));
        }
        rows.add(List.of("bias gain (reference to output)", Fmt.gain(st.biasGain()) + " V/V"));
        rows.add(List.of("settle-up time (whole design)", r.powerOn().map(p -> p.settleSeconds().isPresent()
                ? Fmt.seconds(p.settleSeconds().getAsDouble())
                : Fmt.notSettled(p)).orElse(Fmt.NONE)));
        rows.add(List.of("time on a rail at switch-on", r.powerOn().map(p -> p.pinnedSeconds().containsKey(st.label())
                ? Fmt.seconds(p.pinnedSeconds().get(st.label())) : "0 s").orElse(Fmt.NONE)));
        rows.add(List.of("leakage drift (limit leakage)", Fmt.signedVolts(st.leakageDriftVolts())));
        rows.add(List.of("bias-current shift at + input", Fmt.signedVolts(st.biasCurrentShiftVolts())));
        rows.add(List.of("supply within the part's range", st.supplyInRange() ? "yes" : "NO"));
        r.battery().ifPresent(bt -> {
            rows.add(List.of("battery current (whole design)", Fmt.amps(bt.totalAmps())));
            rows.add(List.of("runtime (whole design)", bt.runtimeHours().isPresent()
                    ? Fmt.hours(bt.runtimeHours().getAsDouble()) : Fmt.NONE));
        });
        rows.add(List.of("findings", st.findingsCodes().isEmpty() ? Fmt.NONE : String.join(", ", st.findingsCodes())));
        return rows;
    }

    private static String headroom(SwingReport s) {
        String room = Fmt.db(s.headroomDbOrInfinite());
        if (s.headroomDb().isPresent()) {
            room += ", " + (s.clipsFirst() == halfrail.check.Side.LOW ? "low" : "high") + " side first";
        }
        return room + (s.saturated() ? " (on a rail)" : "");
    }

    /** Severity word of a finding for documents. */
    static String severity(Finding f) {
        return f.severity().name().toLowerCase(Locale.ROOT);
    }
}
