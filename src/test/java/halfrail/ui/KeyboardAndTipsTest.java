package halfrail.ui;

import javafx.scene.control.Menu;
import javafx.scene.control.MenuBar;
import javafx.scene.control.MenuItem;
import javafx.scene.control.Tooltip;
import javafx.scene.input.KeyCode;
import javafx.stage.Stage;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Keyboard access to the common actions and the plots' tooltips, in a real window (TestFX, headless Monocle). */
@ExtendWith(ApplicationExtension.class)
class KeyboardAndTipsTest {
    private WorkbenchView view;

    @Start
    void start(Stage stage) {
        view = new WorkbenchView(new WorkbenchModel(new SynchronousAnalysisExecutor(), new SynchronousAnalysisExecutor(),
                SampleDesigns.instrumentBoost(), Optional.empty()));
        stage.setScene(HalfrailApp.scene(view));
        stage.show();
    }

    private List<MenuItem> items() {
        List<MenuItem> all = new ArrayList<>();
        for (Menu m : ((MenuBar) view.getTop()).getMenus()) {
            all.addAll(m.getItems());
        }
        return all;
    }

    @Test
    void theCommonActionsHaveKeysAndNoTwoShareOne() {
        List<String> keys = new ArrayList<>();
        for (MenuItem i : items()) {
            if (i.getAccelerator() != null) {
                keys.add(i.getAccelerator().getName());
            }
        }
        for (String wanted : List.of("Open…", "Save", "Save as…", "Quit", "Add a stage", "Run the Monte Carlo study", "Dark appearance")) {
            MenuItem item = items().stream().filter(i -> wanted.equals(i.getText())).findFirst().orElseThrow(() -> new AssertionError(wanted));
            assertNotNull(item.getAccelerator(), wanted + " has a key");
        }
        assertEquals(keys.size(), keys.stream().distinct().count(), "every key does one thing: " + keys);
        assertTrue(view.getTop() instanceof MenuBar bar && bar.getMenus().stream().allMatch(m -> m.getText().startsWith("_")),
                "each menu opens with Alt and its underlined letter");
    }

    @Test
    void numberKeysSwitchTheTabsUnderTheLadders(FxRobot robot) {
        int n = view.bottomTabs().getTabs().size();
        robot.press(KeyCode.CONTROL).type(KeyCode.DIGIT7).release(KeyCode.CONTROL);
        assertEquals(6, view.bottomTabs().getSelectionModel().getSelectedIndex(), "Ctrl+7: the seventh tab");
        assertEquals("circuit-tab", view.bottomTabs().getSelectionModel().getSelectedItem().getId());
        robot.press(KeyCode.CONTROL).type(KeyCode.DIGIT2).release(KeyCode.CONTROL);
        assertEquals(1, view.bottomTabs().getSelectionModel().getSelectedIndex());
        assertTrue(n >= 7);
    }

    @Test
    void theSupplySliderTakesTheKeyboardOnceTheTrialIsOn(FxRobot robot) {
        robot.interact(() -> view.model().trialActiveProperty().set(true));
        double before = view.model().trialVoltsProperty().get();
        robot.interact(() -> view.trial().slider().requestFocus());
        assertTrue(view.trial().slider().isFocused(), "the slider can hold the focus");
        robot.type(KeyCode.LEFT);
        assertEquals(before - 0.1, view.model().trialVoltsProperty().get(), 1e-9, "the left arrow lowers the trial supply by 0.1 V");
    }

    @Test
    void everyAxisOfThePlotsSaysWhatItMeasures(FxRobot robot) {
        // the plots' tabs are built when first shown or asked for; into the shown window, so on the FX thread
        robot.interact(() -> {
            view.headroomChart();
            view.powerOnChart();
            view.responseChart();
            view.tradeoffChart();
        });
        List<javafx.scene.chart.Axis<?>> axes = new ArrayList<>();
        axes.add(view.headroomChart().getXAxis());
        axes.add(view.headroomChart().getYAxis());
        axes.add(view.powerOnChart().getXAxis());
        axes.add(view.powerOnChart().getYAxis());
        axes.add(view.responseChart().getXAxis());
        axes.add(view.responseChart().getYAxis());
        view.tradeoffChart().lookupAll(".chart").forEach(c -> {
            axes.add(((javafx.scene.chart.XYChart<?, ?>) c).getXAxis());
            axes.add(((javafx.scene.chart.XYChart<?, ?>) c).getYAxis());
        });
        assertEquals(12, axes.size(), "four plots and the three trade-off charts, two axes each");
        for (javafx.scene.chart.Axis<?> a : axes) {
            Object tip = a.getProperties().get("javafx.scene.control.Tooltip");
            assertTrue(tip instanceof Tooltip t && !t.getText().isBlank(), "a tooltip on the axis " + a.getLabel());
        }
        Object headroom = view.headroomChart().getYAxis().getProperties().get("javafx.scene.control.Tooltip");
        assertTrue(((Tooltip) headroom).getText().contains("20·log10"), "headroom explained as the trade defines it");
        assertFalse(view.headroomChart().lookup(".chart-plot-background").getProperties().isEmpty(), "the plot area reads out points");
    }
}
