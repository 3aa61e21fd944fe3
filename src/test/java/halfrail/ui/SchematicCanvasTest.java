package halfrail.ui;

import halfrail.check.Finding;
import javafx.scene.input.MouseButton;
import javafx.scene.input.MouseEvent;
import javafx.stage.Stage;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;

import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The circuit tab in a real window (TestFX, headless Monocle) on the sample design. */
@ExtendWith(ApplicationExtension.class)
class SchematicCanvasTest {
    private WorkbenchView view;

    @Start
    void start(Stage stage) {
        view = new WorkbenchView(new WorkbenchModel(new SynchronousAnalysisExecutor(), new SynchronousAnalysisExecutor(),
                SampleDesigns.instrumentBoost(), Optional.empty()));
        stage.setScene(HalfrailApp.scene(view));
        stage.show();
        view.bottomTabs().getSelectionModel().select(view.bottomTabs().getTabs().stream()
                .filter(t -> "circuit-tab".equals(t.getId())).findFirst().orElseThrow());
    }

    /** A click on the canvas at a point of the drawing (drawing px, before the canvas's scale). */
    private void clickAt(FxRobot robot, double x, double y) {
        robot.interact(() -> {
            double s = view.schematic().scale();
            // an event's point is given in the scene; the canvas gets it in its own coordinates
            javafx.geometry.Point2D at = view.schematic().canvas().localToScene(x * s, y * s);
            view.schematic().canvas().fireEvent(new MouseEvent(MouseEvent.MOUSE_CLICKED, at.getX(), at.getY(), 0, 0,
                    MouseButton.PRIMARY, 1, false, false, false, false, true, false, false, true, false, false, null));
        });
    }

    @Test
    void clickingThePartAFindingNamesSelectsThatFinding(FxRobot robot) {
        SchematicGeometry g = view.model().schematic().geometryProperty().get();
        assertNotNull(g, "the sample is drawn");
        assertTrue(view.schematic().scale() >= SchematicCanvas.MIN_SCALE && view.schematic().scale() <= SchematicCanvas.MAX_SCALE);
        SchematicGeometry.Box cout = g.part("COUT").orElseThrow().body();
        clickAt(robot, cout.x() + cout.width() / 2, cout.y() + cout.height() / 2);
        Finding f = view.model().findings().selectedProperty().get();
        assertNotNull(f, "a finding is selected");
        assertTrue(f.parts().contains("load.outputCapacitor"), "the finding about the output capacitor: " + f);
        assertTrue(view.model().schematic().isSpotlit("load.outputCapacitor"), "and the capacitor is lit");
        assertFalse(view.model().schematic().isSpotlit("reference.upperOhms"), "nothing else of it");
    }

    @Test
    void clickingPaperSelectsNothing(FxRobot robot) {
        clickAt(robot, 2, 2);
        assertEquals(null, view.model().findings().selectedProperty().get());
    }

    @Test
    void anEditRedrawsTheCircuitWithTheNewVoltages(FxRobot robot) {
        SchematicGeometry before = view.model().schematic().geometryProperty().get();
        // a 150k / 100k divider on the 9 V block: 9 · 100/(150 + 100) = 3.60 V at the reference (voltage-divider rule)
        robot.interact(() -> view.model().edit("upper resistor 150k",
                d -> d.withReference(d.reference().withDivider(150e3, 100e3))));
        SchematicGeometry after = view.model().schematic().geometryProperty().get();
        assertFalse(before == after, "laid out again");
        String ref = after.nodeLabels().stream().filter(l -> l.owner().equals("ref")).findFirst().orElseThrow().lines().get(1);
        // the op-amp's bias current through the 60 kΩ Thevenin resistance moves it by millivolts only
        assertEquals(3.60, Double.parseDouble(ref.replace(" V", "")), 0.03, "the reference label follows the edit: " + ref);
    }
}
