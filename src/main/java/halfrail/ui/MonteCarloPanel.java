package halfrail.ui;

import halfrail.check.MonteCarloResult;
import halfrail.check.StageDistribution;
import halfrail.check.WorstBuild;
import halfrail.solve.AnalysisException;
import javafx.beans.binding.Bindings;
import javafx.beans.value.ObservableValue;
import javafx.geometry.Insets;
import javafx.geometry.Pos;
import javafx.scene.control.Button;
import javafx.scene.control.ChoiceBox;
import javafx.scene.control.Label;
import javafx.scene.control.ProgressBar;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;
import javafx.util.StringConverter;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;

/**
 * The view of the Monte Carlo study: the run controls with a progress bar and a stop button, a
 * summary (yield, builds that could not be solved, the worst build with a button to open it),
 * and per op-amp a histogram of its rest point and one of its headroom at the nominal signal.
 */
public final class MonteCarloPanel extends VBox {
    private final MonteCarloModel model;
    private final ObservableValue<Palette> palette;
    private final VBox rows = new VBox(6);
    private final List<HistogramCanvas> canvases = new ArrayList<>();
    private final Label summary = new Label();
    private final Button worst = new Button("Open the worst build as a new design");

    public MonteCarloPanel(MonteCarloModel model, ObservableValue<Palette> palette) {
        this.model = model;
        this.palette = palette;
        setId("monte-carlo");
        getStyleClass().add("monte-carlo");
        setSpacing(4);
        setPadding(new Insets(4));

        ChoiceBox<Integer> builds = new ChoiceBox<>();
        builds.setId("mc-builds");
        for (int n : MonteCarloModel.BUILD_CHOICES) {
            builds.getItems().add(n);
        }
        builds.setConverter(new StringConverter<>() {
            @Override
            public String toString(Integer n) {
                return n == null ? "" : String.format(Locale.ROOT, "%,d builds", n);
            }

            @Override
            public Integer fromString(String s) {
                return null;
            }
        });
        builds.setValue(model.buildsProperty().get());
        builds.valueProperty().addListener((o, was, now) -> {
            if (now != null) {
                model.buildsProperty().set(now);
            }
        });
        builds.setTooltip(new Tooltip("How many builds of the design to draw. Each build takes every toleranced part at a random value."));
        ChoiceBox<Double> resistors = new ChoiceBox<>();
        resistors.setId("mc-resistors");
        for (double t : MonteCarloModel.RESISTOR_TOLERANCE_CHOICES) {
            resistors.getItems().add(t);
        }
        resistors.setConverter(new StringConverter<>() {
            @Override
            public String toString(Double t) {
                return t == null ? "" : String.format(Locale.ROOT, "resistors ±%.0f %%", 100 * t);
            }

            @Override
            public Double fromString(String s) {
                return null;
            }
        });
        resistors.setValue(model.resistorToleranceProperty().get());
        resistors.valueProperty().addListener((o, was, now) -> {
            if (now != null) {
                model.resistorToleranceProperty().set(now);
            }
        });
        resistors.setTooltip(new Tooltip("The tolerance of every resistor of the design."));
        Button run = new Button("Run");
        run.setId("mc-run");
        run.setDefaultButton(false);
        run.setOnAction(e -> model.run());
        run.setTooltip(new Tooltip("Draw the builds in the background; the window stays usable. Each build's quiescent "
                + "points and headroom are solved at the nominal supply."));
        Button stop = new Button("Stop");
        stop.setTooltip(new Tooltip("Stop the study; the builds drawn so far are kept."));
        stop.setId("mc-cancel");
        stop.setOnAction(e -> model.cancel());
        ProgressBar bar = new ProgressBar(0);
        bar.setId("mc-progress");
        bar.setPrefWidth(160);
        bar.setTooltip(new Tooltip("Builds solved so far."));
        bar.progressProperty().bind(Bindings.createDoubleBinding(
                () -> model.totalProperty().get() == 0 ? 0 : (double) model.doneProperty().get() / model.totalProperty().get(),
                model.doneProperty(), model.totalProperty()));
        Label count = new Label();
        count.setId("mc-count");
        count.textProperty().bind(Bindings.createStringBinding(
                () -> model.totalProperty().get() == 0 ? "" : String.format(Locale.ROOT, "%,d of %,d",
                        model.doneProperty().get(), model.totalProperty().get()),
                model.doneProperty(), model.totalProperty()));
        var running = Bindings.equal(model.stateProperty(), MonteCarloModel.State.RUNNING);
        stop.disableProperty().bind(running.not());
        bar.visibleProperty().bind(model.totalProperty().greaterThan(0));
        Label what = new Label("Monte Carlo at the nominal supply:");
        what.getStyleClass().add("panel-title");
        HBox controls = new HBox(8, what, builds, resistors, run, stop);
        controls.setAlignment(Pos.CENTER_LEFT);
        for (javafx.scene.Node n : controls.getChildren()) {
            if (n instanceof javafx.scene.layout.Region r && n != bar) {
                r.setMinWidth(javafx.scene.layout.Region.USE_PREF_SIZE);
            }
        }
        bar.setMinWidth(80);

        Label message = new Label();
        message.setId("mc-message");
        message.textProperty().bind(model.messageProperty());
        Label staleNote = new Label("The design has changed since this study: run it again to see the design as it is now.");
        staleNote.getStyleClass().add("mc-stale");
        staleNote.visibleProperty().bind(model.staleProperty());
        staleNote.managedProperty().bind(model.staleProperty());
        Label assumptions = new Label(assumptionsText());
        assumptions.getStyleClass().add("mc-note");
        assumptions.setWrapText(true);
        model.resistorToleranceProperty().addListener((o, was, now) -> assumptions.setText(assumptionsText()));

        summary.setId("mc-summary");
        summary.setWrapText(true);
        summary.setTooltip(new Tooltip("Yield: the share of builds with no failing finding. Worst build: the one with the "
                + "least headroom (the signal's peak against the nearer swing limit)."));
        worst.setId("mc-worst");
        worst.setMinWidth(javafx.scene.layout.Region.USE_PREF_SIZE);
        worst.setOnAction(e -> model.openWorstBuild());
        worst.setTooltip(new Tooltip("Opens the build closest to failing (or furthest past it) with its part values written into the fields, as a new unsaved design."));
        HBox summaryLine = new HBox(10, summary, worst);
        summaryLine.setAlignment(Pos.CENTER_LEFT);
        HBox.setHgrow(summary, Priority.ALWAYS);

        ScrollPane scroll = new ScrollPane(rows);
        scroll.setFitToWidth(true);
        VBox.setVgrow(scroll, Priority.ALWAYS);
        rows.setPadding(new Insets(2));
        HBox progress = new HBox(8, bar, count, message, staleNote);
        progress.setAlignment(Pos.CENTER_LEFT);
        for (Label l : new Label[] {assumptions, summary, message, staleNote}) {
            l.setMaxWidth(Double.MAX_VALUE);
            l.setMinWidth(0);
        }
        summary.setMinHeight(javafx.scene.layout.Region.USE_PREF_SIZE);
        assumptions.setMinHeight(javafx.scene.layout.Region.USE_PREF_SIZE);
        setMinWidth(0);
        getChildren().addAll(controls, progress, assumptions, summaryLine, scroll);
        model.resultProperty().addListener((o, was, now) -> show(now));
        palette.addListener((o, was, now) -> canvases.forEach(c -> c.paletteProperty().set(now)));
        show(model.resultProperty().get());
    }

    private String assumptionsText() {
        return String.format(Locale.ROOT, "Each build draws: resistors ±%.0f %% and ±100 ppm/K over 0–50 °C; capacitors within "
                + "their technology's tolerance and leakage from typical to limit; op-amp offset and bias currents within "
                + "their part's spread. Tolerances are taken as 3σ of a normal spread; the seed is fixed, so a run repeats exactly.",
                100 * model.resistorToleranceProperty().get());
    }

    private void show(MonteCarloResult r) {
        rows.getChildren().clear();
        canvases.clear();
        worst.setDisable(r == null || r.worst().isEmpty());
        if (r == null) {
            summary.setText("");
            return;
        }
        summary.setText(summaryText(r));
        double limit = r.design().thresholds().minHeadroomDb();
        for (StageDistribution s : r.opAmps()) {
            Label name = new Label(s.label());
            name.getStyleClass().add("panel-title");
            Label stats = new Label(String.format(Locale.ROOT,
                    "rest point %.3f V ± %.3f V (1σ)%n99.7 %% of builds: %.3f to %.3f V%nnot passing: %,d build%s%s",
                    s.meanQuiescentVolts(), s.sdQuiescentVolts(), s.lowPercentileVolts(), s.highPercentileVolts(),
                    s.failingBuilds(), s.failingBuilds() == 1 ? "" : "s",
                    s.saturatedBuilds() == 0 ? "" : String.format(Locale.ROOT, "%n(%,d stuck at a rail)", s.saturatedBuilds())));
            stats.getStyleClass().add("mc-stats");
            VBox label = new VBox(2, name, stats);
            label.setMinWidth(210);
            label.setPrefWidth(210);
            HistogramCanvas q = canvas(new HistogramCanvas.Content("Rest point (quiescent output)", "V", s.quiescentVolts(),
                    OptionalDouble.of(s.meanQuiescentVolts()), "mean"));
            HBox row = new HBox(10, label, q);
            if (s.signal()) {
                String excluded = s.headroomDb().excluded() == 0 ? ""
                        : String.format(Locale.ROOT, " — %,d with no room left out", s.headroomDb().excluded());
                HistogramCanvas h = canvas(new HistogramCanvas.Content(String.format(Locale.ROOT,
                        "Headroom at the nominal signal, limit %.1f dB", limit) + excluded, "dB",
                        s.headroomDb(), OptionalDouble.of(limit), String.format(Locale.ROOT, "limit %.1f dB", limit)));
                row.getChildren().add(h);
                HBox.setHgrow(h, Priority.ALWAYS);
            } else {
                Label none = new Label("No signal passes this op-amp: no headroom to show.");
                none.getStyleClass().add("mc-note");
                row.getChildren().add(none);
            }
            HBox.setHgrow(q, Priority.ALWAYS);
            rows.getChildren().add(row);
        }
    }

    private HistogramCanvas canvas(HistogramCanvas.Content c) {
        HistogramCanvas h = new HistogramCanvas();
        h.paletteProperty().set(palette.getValue());
        h.contentProperty().set(c);
        canvases.add(h);
        return h;
    }

    /** The summary sentence of a result (yield, builds not solved, the worst build). */
    static String summaryText(MonteCarloResult r) {
        StringBuilder b = new StringBuilder(String.format(Locale.ROOT, "Yield %.2f %%: %,d of %,d builds pass every check.",
                100 * r.yield(), r.passingBuilds(), r.builds()));
        if (r.failedToConverge() > 0) {
            b.append(String.format(Locale.ROOT, " %,d could not be solved (", r.failedToConverge()));
            String sep = "";
            for (Map.Entry<AnalysisException.Kind, Long> e : r.failuresByKind().entrySet()) {
                b.append(sep).append(String.format(Locale.ROOT, "%,d %s", e.getValue(),
                        e.getKey().name().toLowerCase(Locale.ROOT).replace('_', ' ')));
                sep = ", ";
            }
            b.append(") and count as failing.");
        } else {
            b.append(" Every build could be solved.");
        }
        r.worst().ifPresent(w -> b.append(' ').append(worstText(w)));
        return b.toString();
    }

    private static String worstText(WorstBuild w) {
        String margin = Double.isInfinite(w.marginDb()) ? "stuck at a rail"
                : String.format(Locale.ROOT, "%+.1f dB over the headroom limit", w.marginDb());
        return String.format(Locale.ROOT, "Worst build: no. %,d, %s %s.", w.buildIndex() + 1, w.opAmp(), margin);
    }

    /** The histogram canvases shown, rest point and headroom per op-amp in order (for tests). */
    public List<HistogramCanvas> canvases() {
        return List.copyOf(canvases);
    }

    public Label summary() {
        return summary;
    }
}
