package halfrail.ui;

import javafx.embed.swing.SwingFXUtils;
import javafx.scene.Scene;
import javafx.scene.image.WritableImage;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledIfSystemProperty;
import org.testfx.api.FxToolkit;
import org.testfx.util.WaitForAsyncUtils;

import javax.imageio.ImageIO;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Renders the main window headlessly (Monocle) to {@code docs/images/}. Not part of the normal
 * test run; make the pictures with
 * {@code mvn -B test -Dtest='halfrail/ui/RenderScreens*' -Dhalfrail.pictures=true}.
 */
@Tag("pictures")
@EnabledIfSystemProperty(named = "halfrail.pictures", matches = "true")
class RenderScreens {
    static final Path OUT = Path.of("docs", "images");

    static {
        // Monocle's headless screen is 1280 × 800 unless told otherwise; the pictures show the full window
        System.setProperty("headless.geometry", (int) HalfrailApp.WINDOW_WIDTH + "x" + (int) HalfrailApp.WINDOW_HEIGHT + "-32");
    }

    @Test
    void rendersTheMainWindowOnTheSampleDesign() throws Exception {
        Path file = render(SampleDesigns.instrumentBoost(), v -> { }, "main-window.png");
        assertTrue(Files.size(file) > 10_000, "a real picture, not an empty one");
    }

    @Test
    void rendersTheMainWindowOnTheFaultySample() throws Exception {
        Path file = render(SampleDesigns.missingLegCapacitor(),
                v -> v.findings().list().getSelectionModel().select(0), "main-window-faulty.png");
        assertTrue(Files.size(file) > 10_000);
    }

    @Test
    void rendersTheHeadroomPlotOfTheTwoStageDesign() throws Exception {
        Path file = render(SampleDesigns.instrumentBoost(), v -> {
            v.model().editor().addStage();
            v.bottomTabs().getSelectionModel().select(1);
        }, "headroom-plot.png");
        assertTrue(Files.size(file) > 10_000);
    }

    @Test
    void rendersTheMainWindowInTheDarkAppearance() throws Exception {
        Path file = render(SampleDesigns.instrumentBoost(), v -> v.model().darkProperty().set(true), "main-window-dark.png");
        assertTrue(Files.size(file) > 10_000);
    }

    @Test
    void rendersATwoStageDesignOnTheSupplyTrialAtTheEndPoint() throws Exception {
        Path file = render(SampleDesigns.instrumentBoost(), v -> {
            v.model().editor().addStage();
            v.model().trialVoltsProperty().set(v.model().trialLowVoltsProperty().get());
            v.model().trialActiveProperty().set(true);
        }, "main-window-trial.png");
        assertTrue(Files.size(file) > 10_000);
    }

    @Test
    void rendersTheMonteCarloTabAfterATenThousandBuildStudy() throws Exception {
        Path file = render(SampleDesigns.instrumentBoost(), v -> {
            v.middleSplit().setDividerPositions(0.45);
            v.bottomTabs().getSelectionModel().select(5);
            v.model().monteCarlo().buildsProperty().set(10_000);
            v.model().monteCarlo().run();
        }, "monte-carlo.png");
        assertTrue(Files.size(file) > 10_000);
    }

    @Test
    void rendersThePowerOnPlot() throws Exception {
        Path file = render(SampleDesigns.instrumentBoost(), v -> {
            v.middleSplit().setDividerPositions(0.45);
            v.bottomTabs().getSelectionModel().select(2);
        }, "power-on-plot.png");
        assertTrue(Files.size(file) > 10_000);
    }

    @Test
    void rendersThePowerOnPlotOfAChainThatMotorboats() throws Exception {
        // three of the recorder preamp's gain-48 stages on its soft reference keep oscillating
        halfrail.design.Design base = halfrail.io.DesignFiles.read(Path.of("samples", "handheld-recorder-mic-preamp.json"));
        java.util.List<halfrail.design.Stage> stages = new java.util.ArrayList<>();
        for (int i = 1; i <= 3; i++) {
            halfrail.design.Stage st = base.stages().get(0);
            stages.add(new halfrail.design.Stage(st.name() + "-" + i, st.kind(), st.opAmp(), st.feedbackOhms(),
                    st.legOhms(), st.legCapacitor(), st.inputCapacitor(), true));
        }
        Path file = render(base.withStages(stages), v -> {
            v.middleSplit().setDividerPositions(0.45);
            v.findings().list().getSelectionModel().select(0);
            v.bottomTabs().getSelectionModel().select(2);
        }, "power-on-oscillating.png");
        assertTrue(Files.size(file) > 10_000);
    }

    @Test
    void rendersTheResponsePlot() throws Exception {
        Path file = render(SampleDesigns.instrumentBoost(), v -> {
            v.middleSplit().setDividerPositions(0.45);
            v.bottomTabs().getSelectionModel().select(3);
        }, "response-plot.png");
        assertTrue(Files.size(file) > 10_000);
    }

    @Test
    void rendersTheBatteryTradeoff() throws Exception {
        Path file = render(SampleDesigns.instrumentBoost(), v -> {
            v.middleSplit().setDividerPositions(0.45);
            v.bottomTabs().getSelectionModel().select(4);
        }, "battery-tradeoff.png");
        assertTrue(Files.size(file) > 10_000);
    }

    @Test
    void rendersTheConversionAssistantAfterATwoStageConversionWithAConflict() throws Exception {
        Path file = renderConversion(c -> {
            c.stages().get(0).r2().textProperty().set("47k");
            c.addStage();
            c.stages().get(1).kindProperty().set(halfrail.design.StageKind.INVERTING);
            c.stages().get(1).name().textProperty().set("invert");
            c.stages().get(1).r2().textProperty().set("22k");
            c.signal().textProperty().set("30m");
            c.bandLow().textProperty().set("5");
            c.maxSettle().textProperty().set("100m");
            c.convert();
        }, "conversion.png");
        assertTrue(Files.size(file) > 10_000);
    }

    @Test
    void rendersTheConversionAssistantWithACustomPartALithiumCellAndARefusedValue() throws Exception {
        Path file = renderConversion(c -> {
            c.stages().get(0).opAmpProperty().set(ConversionModel.CUSTOM);
            c.chemistryProperty().set(halfrail.parts.CellChemistry.LI_ION);
            c.bandHigh().textProperty().set("2O k");
        }, 0.75, "conversion-form.png");
        assertTrue(Files.size(file) > 10_000);
    }

    @Test
    void rendersTheConversionAssistantInTheDarkAppearance() throws Exception {
        dark = true;
        try {
            Path file = renderConversion(c -> {
                c.addStage();
                c.stages().get(1).kindProperty().set(halfrail.design.StageKind.INVERTING);
                c.stages().get(1).r2().textProperty().set("22k");
                c.signal().textProperty().set("20m");
                c.convert();
            }, "conversion-dark.png");
            assertTrue(Files.size(file) > 10_000);
        } finally {
            dark = false;
        }
    }

    private static boolean dark;

    /** Render the conversion window at its menu size after {@code prepare} has filled it (on the FX thread). */
    static Path renderConversion(java.util.function.Consumer<ConversionModel> prepare, String name) throws Exception {
        return renderConversion(prepare, -1, name);
    }

    /** The same, with the form scrolled to {@code scroll} (0 top, 1 bottom). */
    static Path renderConversion(java.util.function.Consumer<ConversionModel> prepare, double scroll, String name)
            throws Exception {
        FxToolkit.registerPrimaryStage();
        WorkbenchModel model = new WorkbenchModel(new SynchronousAnalysisExecutor(), SampleDesigns.instrumentBoost(),
                java.util.Optional.empty());
        Scene scene = WaitForAsyncUtils.asyncFx(() -> {
            Scene s = new Scene(new ConversionDialog(model.conversion()), ConversionDialog.WIDTH, ConversionDialog.HEIGHT);
            s.getStylesheets().add(HalfrailApp.class.getResource("halfrail.css").toExternalForm());
            if (dark) {
                s.getStylesheets().add(HalfrailApp.class.getResource("halfrail-dark.css").toExternalForm());
            }
            return s;
        }).get();
        FxToolkit.setupStage(stage -> {
            stage.setScene(scene);
            stage.show();
        });
        WaitForAsyncUtils.asyncFx(() -> prepare.accept(model.conversion())).get(120, TimeUnit.SECONDS);
        WaitForAsyncUtils.waitForFxEvents();
        if (scroll >= 0) {
            WaitForAsyncUtils.asyncFx(() -> {
                scene.getRoot().applyCss();
                scene.getRoot().layout();
                ((javafx.scene.control.ScrollPane) scene.lookup("#conv-form")).setVvalue(scroll);
            }).get();
            WaitForAsyncUtils.waitForFxEvents();
        }
        WritableImage image = WaitForAsyncUtils.asyncFx(() -> scene.snapshot(null)).get(30, TimeUnit.SECONDS);
        Files.createDirectories(OUT);
        Path file = OUT.resolve(name);
        write(SwingFXUtils.fromFXImage(image, null), file);
        FxToolkit.cleanupStages();
        return file;
    }

    @Test
    void rendersTheCircuitDrawing() throws Exception {
        Path file = render(SampleDesigns.instrumentBoost(), v -> {
            // the editor and the findings narrowed by hand, so that the whole one-stage circuit is in view
            ((javafx.scene.control.SplitPane) v.getCenter()).setDividerPositions(0.2, 0.8);
            v.middleSplit().setDividerPositions(0.45);
            v.bottomTabs().getSelectionModel().select(6);
        }, "circuit.png");
        assertTrue(Files.size(file) > 10_000);
    }

    @Test
    void rendersTheCircuitDrawingOfATwoStageDesignWithAFindingSelected() throws Exception {
        Path file = render(SampleDesigns.missingLegCapacitor(), v -> {
            v.model().editor().addStage();
            v.middleSplit().setDividerPositions(0.45);
            v.bottomTabs().getSelectionModel().select(6);
            v.findings().list().getSelectionModel().select(0);
        }, "circuit-faulty.png");
        assertTrue(Files.size(file) > 10_000);
    }

    @Test
    void rendersThePlotsInTheDarkAppearance() throws Exception {
        for (int tab : new int[] {1, 2, 3, 4, 5, 6}) {
            String name = new String[] {"", "headroom", "power-on", "response", "battery-tradeoff", "monte-carlo", "circuit"}[tab];
            Path file = render(SampleDesigns.instrumentBoost(), v -> {
                v.model().darkProperty().set(true);
                if (tab == 1) {
                    v.model().editor().addStage();
                }
                v.middleSplit().setDividerPositions(0.45);
                v.bottomTabs().getSelectionModel().select(tab);
                if (tab == 5) {
                    v.model().monteCarlo().buildsProperty().set(10_000);
                    v.model().monteCarlo().run();
                }
            }, name + "-dark.png");
            assertTrue(Files.size(file) > 10_000);
        }
    }

    /** Render a window on {@code design} after {@code prepare} has acted on it (on the FX thread). */
    static Path render(halfrail.design.Design design, java.util.function.Consumer<WorkbenchView> prepare, String name)
            throws Exception {
        FxToolkit.registerPrimaryStage();
        WorkbenchView view = WaitForAsyncUtils.asyncFx(
                () -> HalfrailApp.workbench(new SynchronousAnalysisExecutor(), design)).get(30, TimeUnit.SECONDS);
        Scene scene = WaitForAsyncUtils.asyncFx(() -> HalfrailApp.scene(view)).get();
        FxToolkit.setupStage(stage -> {
            stage.setScene(scene);
            stage.show();
        });
        WaitForAsyncUtils.asyncFx(() -> prepare.accept(view)).get(60, TimeUnit.SECONDS);
        WaitForAsyncUtils.waitForFxEvents();
        WritableImage image = WaitForAsyncUtils.asyncFx(() -> scene.snapshot(null)).get(30, TimeUnit.SECONDS);
        BufferedImage png = SwingFXUtils.fromFXImage(image, null);
        Files.createDirectories(OUT);
        Path file = OUT.resolve(name);
        write(png, file);
        FxToolkit.cleanupStages();
        return file;
    }

    private static void write(BufferedImage png, Path file) throws IOException {
        if (!ImageIO.write(png, "png", file.toFile())) {
            throw new IOException("no PNG writer");
        }
    }
}
