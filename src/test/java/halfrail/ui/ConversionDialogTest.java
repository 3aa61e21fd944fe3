package halfrail.ui;

import halfrail.convert.ConversionResult;
import halfrail.design.StageKind;
import javafx.scene.Scene;
import javafx.scene.chart.XYChart;
import javafx.scene.control.Button;
import javafx.scene.control.ChoiceBox;
import javafx.scene.control.Label;
import javafx.scene.control.ListView;
import javafx.scene.control.TableView;
import javafx.scene.control.TextField;
import javafx.stage.Stage;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;

import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The conversion assistant's window driven through its controls (TestFX, headless Monocle), synchronous executor. */
@ExtendWith(ApplicationExtension.class)
class ConversionDialogTest {
    private WorkbenchModel model;
    private Stage primary;

    @Start
    void start(Stage stage) {
        primary = stage;
        model = new WorkbenchModel(new SynchronousAnalysisExecutor(), SampleDesigns.instrumentBoost(), Optional.empty());
        stage.setScene(new Scene(new ConversionDialog(model.conversion()), ConversionDialog.WIDTH, ConversionDialog.HEIGHT));
        stage.show();
    }

    private static void type(FxRobot robot, String id, String text) {
        TextField f = robot.lookup("#" + id).queryAs(TextField.class);
        robot.interact(() -> f.setText(text));
    }

    @SuppressWarnings("unchecked")
    private static <T> void choose(FxRobot robot, String id, T value) {
        ChoiceBox<T> c = robot.lookup("#" + id).queryAs(ChoiceBox.class);
        robot.interact(() -> c.setValue(value));
    }

    /** Whether the node and every parent of it are visible. */
    private static boolean shown(FxRobot robot, String id) {
        for (javafx.scene.Node n = robot.lookup("#" + id).query(); n != null; n = n.getParent()) {
            if (!n.isVisible()) {
                return false;
            }
        }
        return true;
    }

    @Test
    void aTwoStageChainIsFilledInConvertedShownWithItsConflictAndOpenedInTheWorkbench(FxRobot robot) {
        type(robot, "conv-stage0-r2", "47k");
        robot.interact(() -> robot.lookup("#conv-add-stage").queryButton().fire());
        choose(robot, "conv-stage1-kind", StageKind.INVERTING);
        type(robot, "conv-stage1-name", "invert");
        type(robot, "conv-stage1-r1", "10k");
        type(robot, "conv-stage1-r2", "22k");
        type(robot, "conv-signal", "30m");
        // the impossible pair of the conversion brief: a 1 Hz band with a 10 ms settle-up limit
        type(robot, "conv-band-low", "1");
        type(robot, "conv-settle", "10m");
        robot.interact(() -> robot.lookup("#conv-run").queryButton().fire());

        ConversionResult r = model.conversion().resultProperty().get();
        assertTrue(r != null, robot.lookup("#conv-message").queryAs(Label.class).getText());
        assertEquals(2, r.design().stages().size());
        assertEquals("invert", r.design().stages().get(1).name());
        // cascade gain (1 + 47k/10k)·(22k/10k) = 5.7·2.2 = 12.54 (non-inverting and inverting gain rules)
        assertEquals(12.54, r.comparison().after().gain(), 12.54 * 0.02);

        Label conflict = robot.lookup("#conv-conflict-0").queryAs(Label.class);
        assertTrue(conflict.getText().startsWith("Won: band low end 1 Hz"), conflict.getText());
        assertTrue(conflict.getText().contains("Missed: settle-up limit 10 ms, by "), conflict.getText());
        TableView<?> table = robot.lookup("#conv-comparison").queryAs(TableView.class);
        assertEquals(model.conversion().comparison().size(), table.getItems().size());
        assertEquals(ConversionDialog.TABLE_ROWS, table.getItems().size(), "the table is sized for every row");
        assertTrue(table.getItems().stream().anyMatch(x -> ((ConversionModel.Row) x).figure().equals("headroom, end-point")));
        ListView<?> changes = robot.lookup("#conv-changes").queryAs(ListView.class);
        assertEquals(r.changes().size(), changes.getItems().size());
        TradeOffChart chart = robot.lookup("#conv-tradeoff").queryAs(TradeOffChart.class);
        assertTrue(chart.getData().stream().map(XYChart.Series::getName).anyMatch(TradeOffChart.CHOSEN::equals),
                "the converted design is marked on the curve");
        int plotted = chart.getData().stream().filter(s -> s.getName().equals(TradeOffChart.CURVE)
                || s.getName().equals(TradeOffChart.UNSETTLED)).mapToInt(s -> s.getData().size()).sum();
        assertEquals(r.tradeOff().stream().filter(p -> p.lowerCornerHz().isPresent()).count(), plotted);

        Button open = robot.lookup("#conv-open").queryButton();
        assertFalse(open.isDisabled());
        robot.interact(open::fire);
        assertEquals(r.design(), model.design());
        assertTrue(model.dirtyProperty().get(), "the converted design opens as new and unsaved");
    }

    @Test
    void anUnreadableValueIsMarkedOnItsFieldAndTheConversionIsRefusedWithItsName(FxRobot robot) {
        type(robot, "conv-band-low", "twenty");
        TextField band = robot.lookup("#conv-band-low").queryAs(TextField.class);
        assertTrue(band.getStyleClass().contains("refused"));
        Label problem = robot.lookup("#conv-band-low-problem").queryAs(Label.class);
        assertTrue(problem.isVisible() && !problem.getText().isEmpty());
        robot.interact(() -> robot.lookup("#conv-run").queryButton().fire());
        String message = robot.lookup("#conv-message").queryAs(Label.class).getText();
        assertTrue(message.startsWith("Not converted — band from:"), message);
        assertTrue(robot.lookup("#conv-open").query().isDisabled());
        type(robot, "conv-band-low", "20");
        assertFalse(band.getStyleClass().contains("refused"));
        assertFalse(problem.isVisible());
    }

    @Test
    void theSupplyFieldsFollowTheSupplyKindAndALithiumCellShowsItsCaution(FxRobot robot) {
        choose(robot, "conv-chemistry", halfrail.parts.CellChemistry.LI_ION);
        Label note = robot.lookup("#conv-safety-note").queryAs(Label.class);
        assertTrue(note.getText().contains("protection circuit"), note.getText());
        assertTrue(shown(robot, "conv-cells"));
        assertFalse(shown(robot, "conv-usb-ripple"));
        choose(robot, "conv-supply", ConversionModel.SupplyKind.USB_PORT);
        assertTrue(shown(robot, "conv-usb-ripple"));
        assertFalse(shown(robot, "conv-cells"));
        assertTrue(note.getText().contains("USB"), note.getText());
        assertTrue(robot.lookup("#conv-supply-summary").queryAs(Label.class).getText().startsWith("5 V nominal"));
    }

    @Test
    void aStageIsRemovedAndReorderedFromItsOwnButtons(FxRobot robot) {
        robot.interact(() -> robot.lookup("#conv-add-stage").queryButton().fire());
        type(robot, "conv-stage1-name", "second");
        robot.interact(() -> robot.lookup("#conv-stage-up-1").queryButton().fire());
        assertEquals("second", model.conversion().stages().get(0).name().textProperty().get());
        assertEquals("second", robot.lookup("#conv-stage0-name").queryAs(TextField.class).getText());
        robot.interact(() -> robot.lookup("#conv-stage-remove-0").queryButton().fire());
        assertEquals(1, model.conversion().stages().size());
        assertTrue(robot.lookup("#conv-stage-remove-0").queryButton().isDisabled(), "the last stage stays");
        choose(robot, "conv-stage0-kind", StageKind.FOLLOWER);
        assertTrue(robot.lookup("#conv-stage0-r1").query().isDisabled(), "a follower has no R1");
        robot.interact(() -> robot.lookup("#conv-stage0-r1").queryAs(TextField.class).setText(""));
        assertEquals(StageKind.FOLLOWER, model.conversion().request().original().stages().get(0).kind(),
                "a blank R1 does not stop a follower");
    }

    @Test
    void theMenusWindowIsBroughtBackRatherThanStackedAndClosesWhenTheDesignIsOpened(FxRobot robot) {
        Stage[] shown = new Stage[2];
        robot.interact(() -> {
            shown[0] = ConversionDialog.show(model.conversion(), primary, java.util.List.of());
            shown[0].hide();
            shown[1] = ConversionDialog.show(model.conversion(), primary, java.util.List.of());
        });
        org.junit.jupiter.api.Assertions.assertSame(shown[0], shown[1]);
        assertTrue(shown[1].isShowing());
        javafx.collections.ObservableList<String> sheets = javafx.collections.FXCollections.observableArrayList("a.css");
        robot.interact(() -> ConversionDialog.show(model.conversion(), primary, sheets));
        robot.interact(() -> sheets.add("b.css"));
        assertEquals(List.of("a.css", "b.css"), shown[1].getScene().getStylesheets(),
                "the window follows the main window's sheets (the dark appearance) while open");
        robot.interact(() -> ((Button) shown[1].getScene().lookup("#conv-run")).fire());
        assertTrue(model.conversion().resultProperty().get() != null, model.conversion().messageProperty().get());
        robot.interact(() -> ((Button) shown[1].getScene().lookup("#conv-open")).fire());
        assertFalse(shown[1].isShowing(), "the window closes once the design is in the workbench");
        assertEquals(model.conversion().resultProperty().get().design(), model.design());
    }
}
