package halfrail.bench;

import halfrail.check.DesignAnalysis;
import halfrail.check.DesignReport;
import halfrail.check.Ladder;
import halfrail.design.Design;
import halfrail.design.DesignCircuits;
import halfrail.design.Stage;
import halfrail.ui.LadderGeometry;
import halfrail.ui.SchematicGeometry;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.Blackhole;

import java.util.concurrent.TimeUnit;

/**
 * One edit in the app, up to the redrawn window, without the toolkit: the design changes (the first
 * stage's feedback resistor, alternating between two values so that every call is a real change),
 * the full analysis runs as the app runs it after an edit (with the power-on transient), and the
 * geometry of every ladder (at the size the window gives a ladder) and of the circuit drawing is
 * laid out again. The painting itself is left out: a JavaFX canvas needs the toolkit's thread, which
 * JMH's forked benchmark JVM does not start (the headless Monocle platform is a test dependency);
 * drawing the laid-out commands is a few hundred canvas calls. Target (issue 6): p95 at most 100 ms.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class EditRedrawBench {
    /** Size of one ladder in the window, px (the main window at its opening size). */
    static final double LADDER_WIDTH = 280, LADDER_HEIGHT = 330;
    /** Head room above the highest supply on the ladders' shared scale (as the ladder panel does). */
    static final double SCALE_MARGIN = 0.1;

    @Param({"instrument-boost-9v", "handheld-recorder-mic-preamp", "li-ion-sensor-front-end", "usb-line-driver"})
    public String design;

    private Design base;
    private DesignReport analysed;
    private boolean flip;

    @Setup
    public void setUp() {
        base = BenchCircuits.named(design).design();
        analysed = DesignAnalysis.analyse(base);
    }

    /** The layout part alone (ladders and circuit drawing) on a report made in the set-up. */
    @Benchmark
    public void layOutOnly(Blackhole bh) {
        layOut(base, analysed, bh);
    }

    @Benchmark
    public void editAnalyseAndLayOut(Blackhole bh) {
        flip = !flip;
        Stage s = base.stages().get(0);
        Design edited = base.withStage(0, s.withFeedbackOhms(s.feedbackOhms() * (flip ? 1.1 : 1 / 1.1)));
        layOut(edited, DesignAnalysis.analyse(edited), bh);
    }

    private static void layOut(Design edited, DesignReport r, Blackhole bh) {
        double top = edited.supply().highVolts();
        for (Ladder l : r.ladders()) {
            top = Math.max(top, l.supplyVolts());
        }
        top *= 1 + SCALE_MARGIN;
        for (Ladder l : r.ladders()) {
            bh.consume(new LadderGeometry(l, LADDER_WIDTH, LADDER_HEIGHT, top, edited.supply().lowVolts()));
        }
        bh.consume(new SchematicGeometry(edited, DesignCircuits.nominal(edited), r.nodeVolts(), r.floatingNodes()));
    }
}
