package halfrail.ui;

import halfrail.convert.ConversionResult;
import javafx.scene.Scene;
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

import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The conversion assistant's window driven through its controls (TestFX, headless), synchronous executor. */
@ExtendWith(ApplicationExtension.class)
class ConversionDialogTest {
    private WorkbenchModel model;

    @Start
    void start(Stage stage) {
        model = new WorkbenchModel(new SynchronousAnalysisExecutor(), SampleDesigns.instrumentBoost(), Optional.empty());
        stage.setScene(new Scene(new ConversionDialog(model.conversion()), 1060, 640));
        stage.show();
    }

    @Test
    void aTypedStageIsConvertedShownAndOpenedAsANewDesign(FxRobot robot) {
        TextField r2 = robot.lookup("#conv-r2").queryAs(TextField.class);
        robot.interact(() -> r2.setText("47k"));
        robot.interact(() -> robot.lookup("#conv-run").queryButton().fire());
        ConversionResult r = model.conversion().resultProperty().get();
        assertTrue(r != null, robot.lookup("#conv-message").queryAs(Label.class).getText());
        // non-inverting gain 1 + 47k/10k = 5.7 (standard op-amp result), carried over to the conversion
        assertEquals(5.7, r.comparison().after().gain(), 0.1);
        assertFalse(robot.lookup("#conv-comparison").queryAs(TableView.class).getItems().isEmpty());
        assertFalse(robot.lookup("#conv-changes").queryAs(ListView.class).getItems().isEmpty());
        robot.interact(() -> robot.lookup("#conv-open").queryButton().fire());
        assertEquals(r.design(), model.design());
        assertTrue(model.dirtyProperty().get());
    }

    @Test
    void anUnreadableValueIsRefusedInTheWindowWithItsFieldName(FxRobot robot) {
        robot.interact(() -> robot.lookup("#conv-band-low").queryAs(TextField.class).setText("twenty"));
        robot.interact(() -> robot.lookup("#conv-run").queryButton().fire());
        assertTrue(robot.lookup("#conv-message").queryAs(Label.class).getText().startsWith("Not converted — band low:"),
                robot.lookup("#conv-message").queryAs(Label.class).getText());
        assertTrue(robot.lookup("#conv-open").query().isDisabled());
    }
}
