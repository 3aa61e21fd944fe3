package halfrail.ui;

import halfrail.check.Finding;
import halfrail.check.LadderLevel;
import halfrail.check.Severity;
import halfrail.design.Design;
import javafx.scene.Node;
import javafx.scene.control.Label;
import javafx.scene.control.TextField;
import javafx.scene.input.KeyCode;
import javafx.stage.Stage;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;
import org.testfx.util.WaitForAsyncUtils;

import java.util.Optional;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The main window driven through its controls (TestFX, headless Monocle), on the sample design
 * with a synchronous executor so that every keystroke's analysis is done when the robot returns.
 */
@ExtendWith(ApplicationExtension.class)
class WorkbenchViewTest {
    private WorkbenchView view;

    @Start
    void start(Stage stage) {
        view = HalfrailApp.workbench(new SynchronousAnalysisExecutor(), SampleDesigns.instrumentBoost());
        stage.setScene(HalfrailApp.scene(view));
        stage.show();
    }

    private TextField field(FxRobot robot, String path) {
        return robot.lookup("#" + EditorPanel.idFor(path)).queryAs(TextField.class);
    }

    /** Put the keyboard focus in {@code f}, select its text and type {@code text} over it. */
    private void typeInto(FxRobot robot, TextField f, String text) {
        robot.interact(() -> {
            f.requestFocus();
            f.selectAll();
        });
        robot.write(text);
    }

    @Test
    void theReadingsShowTheSamplesQuiescentVoltage(FxRobot robot) {
        // equal 100k/100k divider on the nominal 9 V block: 4.5 V (voltage-divider rule); unity bias gain keeps it
        Set<Node> cells = robot.lookup("#readings .table-cell").queryAll();
        assertTrue(cells.stream().anyMatch(c -> c instanceof javafx.scene.control.Labeled l && "4.50 V".equals(l.getText())),
                "rest point shown in the readings");
        LadderCanvas ladder = view.ladders().canvases().get(0);
        assertEquals(4.5, ladder.geometry().ladder().quiescentVolts(), 0.05);
        assertTrue(ladder.geometry().mark(LadderLevel.QUIESCENT).orElseThrow().label().startsWith("rest 4.5"));
    }

    @Test
    void typingANewR2RedrawsTheLadderAndBringsTheClippingFinding(FxRobot robot) {
        LadderCanvas ladder = view.ladders().canvases().get(0);
        assertTrue(ladder.geometry().clipSide().isEmpty());
        typeInto(robot, field(robot, "stages[0].feedbackOhms"), "150k");
        robot.type(KeyCode.ENTER);
        WaitForAsyncUtils.waitForFxEvents();
        // gain 1 + 150k/3.9k ≈ 39.5: 3.9 V peak around 4.5 V runs past the 7.5 V output top
        assertEquals(150e3, view.model().design().stages().get(0).feedbackOhms(), 1e-9);
        assertTrue(ladder.geometry().clipSide().isPresent(), "the redrawn ladder clips");
        assertTrue(view.findings().list().getItems().stream().anyMatch(f -> f.severity() == Severity.FAIL));
        assertTrue(robot.lookup("#findings .tag-fail").tryQuery().isPresent(), "a failing finding is listed");
    }

    @Test
    void aBadValueIsMarkedAtTheFieldWithTheReasonAndTheDesignIsKept(FxRobot robot) {
        Design before = view.model().design();
        TextField r2 = field(robot, "stages[0].feedbackOhms");
        typeInto(robot, r2, "39 kq");
        robot.type(KeyCode.ENTER);
        WaitForAsyncUtils.waitForFxEvents();
        assertTrue(r2.getStyleClass().contains("refused"));
        Label problem = robot.lookup("#" + EditorPanel.idFor("stages[0].feedbackOhms") + "-problem").queryAs(Label.class);
        assertTrue(problem.isVisible());
        assertFalse(problem.getText().isBlank());
        assertSame(before, view.model().design());
        // Escape puts the design's value back and clears the mark
        robot.type(KeyCode.ESCAPE);
        WaitForAsyncUtils.waitForFxEvents();
        assertEquals("39 kΩ", r2.getText());
        assertFalse(r2.getStyleClass().contains("refused"));
    }

    @Test
    void undoAndRedoFromTheKeyboardRestoreTheValues(FxRobot robot) {
        Design original = view.model().design();
        TextField r1 = field(robot, "stages[0].legOhms");
        typeInto(robot, r1, "2k2");
        robot.type(KeyCode.ENTER);
        WaitForAsyncUtils.waitForFxEvents();
        Design edited = view.model().design();
        assertEquals(2.2e3, edited.stages().get(0).legOhms(), 1e-9);
        // leave the text field, whose own undo would otherwise take the keystroke
        robot.interact(() -> view.findings().list().requestFocus());
        robot.press(KeyCode.CONTROL).type(KeyCode.Z).release(KeyCode.CONTROL);
        WaitForAsyncUtils.waitForFxEvents();
        assertSame(original, view.model().design());
        assertEquals("3.9 kΩ", r1.getText());
        robot.press(KeyCode.CONTROL, KeyCode.SHIFT).type(KeyCode.Z).release(KeyCode.SHIFT, KeyCode.CONTROL);
        WaitForAsyncUtils.waitForFxEvents();
        assertSame(edited, view.model().design());
        assertEquals("2.2 kΩ", r1.getText());
    }

    @Test
    void theFaultySampleListsItsFailingFindingsAndSelectingOneSpotlightsTheLadder(FxRobot robot) {
        robot.interact(() -> view.model().replace(SampleDesigns.missingLegCapacitor(), null));
        WaitForAsyncUtils.waitForFxEvents();
        assertTrue(robot.lookup("#findings .tag-fail").queryAll().size() >= 2, "bias amplified and rest on rail");
        Finding first = view.findings().list().getItems().get(0);
        assertEquals(Severity.FAIL, first.severity());
        robot.interact(() -> view.findings().list().getSelectionModel().select(0));
        LadderCanvas ladder = view.ladders().canvases().get(0);
        assertEquals(first.level().orElse(null), ladder.spotlightProperty().get());
        assertTrue(ladder.getStyleClass().contains("ladder-focused"));
        // the finding's parts are spotlit in the editor too
        String part = first.parts().get(0);
        assertTrue(view.model().editor().fields().stream()
                .filter(f -> EditorPanelModel.concerns(f.path(), part))
                .allMatch(f -> f.highlightedProperty().get()));
    }

    @Test
    void addingAStageFromTheEditorAddsALadder(FxRobot robot) {
        robot.interact(() -> robot.lookup("#add-stage").queryButton().fire());
        WaitForAsyncUtils.waitForFxEvents();
        assertEquals(2, view.ladders().canvases().size());
        assertTrue(robot.lookup("#" + EditorPanel.idFor("stages[1].feedbackOhms")).tryQuery().isPresent());
    }

    @Test
    void theDarkAppearanceRepaintsTheLaddersAndRestylesTheWindow(FxRobot robot) {
        robot.interact(() -> view.model().darkProperty().set(true));
        WaitForAsyncUtils.waitForFxEvents();
        assertSame(Palette.DARK, view.ladders().canvases().get(0).paletteProperty().get());
        assertSame(Palette.DARK, view.chain().paletteProperty().get());
        assertTrue(view.getStylesheets().stream().anyMatch(u -> u.endsWith("halfrail-dark.css")));
        robot.interact(() -> view.model().darkProperty().set(false));
        assertSame(Palette.LIGHT, view.ladders().canvases().get(0).paletteProperty().get());
        assertTrue(view.getStylesheets().isEmpty());
    }

    @Test
    void theSystemsDarkThemeIsReadFromTheGtkThemeVariable() {
        // GTK 3 reads GTK_THEME as "name" or "name:variant", the dark variant being ":dark"
        assertTrue(HalfrailApp.systemPrefersDark("Adwaita:dark"));
        assertFalse(HalfrailApp.systemPrefersDark("Adwaita"));
        assertFalse(HalfrailApp.systemPrefersDark(null));
    }

    @Test
    void draggingTheSupplyTrialToTheEndPointLowersTheRailOnTheLadder(FxRobot robot) {
        double endPoint = view.model().design().supply().lowVolts();
        robot.interact(() -> {
            view.trial().slider().setValue(endPoint);
            robot.lookup("#trial-on").queryAs(javafx.scene.control.CheckBox.class).setSelected(true);
        });
        WaitForAsyncUtils.waitForFxEvents();
        LadderCanvas ladder = view.ladders().canvases().get(0);
        assertEquals(endPoint, ladder.geometry().ladder().supplyVolts(), 1e-9);
        // the equal divider follows the rail: mid-rail at half the end-point voltage (voltage-divider rule)
        assertEquals(endPoint / 2, ladder.geometry().ladder().midRailVolts(), 0.05);
        assertTrue(robot.lookup("#status").queryLabeled().getText().contains("trial supply"));
    }

    @Test
    void clickingTheRestPointOfAStuckStageSelectsTheFindingAboutIt(FxRobot robot) {
        robot.interact(() -> view.model().replace(SampleDesigns.missingLegCapacitor(), null));
        WaitForAsyncUtils.waitForFxEvents();
        LadderCanvas ladder = view.ladders().canvases().get(0);
        LadderGeometry g = ladder.geometry();
        // pick a level on the output shaft that a finding points at, and click where it is drawn
        Finding aimed = view.findings().list().getItems().stream()
                .filter(f -> f.level().filter(l -> l == LadderLevel.QUIESCENT).isPresent()).findFirst().orElseThrow();
        LadderGeometry.Mark rest = g.mark(LadderLevel.QUIESCENT).orElseThrow();
        javafx.geometry.Point2D screen = ladder.localToScreen(g.labelX() + 10, rest.labelY());
        robot.clickOn(screen);
        WaitForAsyncUtils.waitForFxEvents();
        Finding selected = view.findings().list().getSelectionModel().getSelectedItem();
        assertEquals(aimed.opAmp(), selected.opAmp());
        assertEquals(Optional.of(LadderLevel.QUIESCENT), selected.level());
    }
}
