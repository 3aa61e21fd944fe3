package halfrail.ui;

import javafx.scene.Node;
import javafx.scene.control.Tab;
import javafx.stage.Stage;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;
import org.testfx.util.WaitForAsyncUtils;

import java.util.List;
import java.util.Map;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The tabs under the ladders other than the readings are built when first shown, not with the
 * window (start-up time), and their plots' studies wait for them: in a real window (TestFX,
 * headless Monocle) on the sample design, analysed synchronously.
 */
@ExtendWith(ApplicationExtension.class)
class LazyTabsTest {
    /** Each hidden tab's id and the id of the content it shows once built. */
    private static final Map<String, String> CONTENT = Map.of(
            "headroom-tab", "#headroom-chart",
            "power-on-tab", "#power-on-chart",
            "response-tab", "#response-chart",
            "tradeoff-tab", "#tradeoff",
            "monte-carlo-tab", "#monte-carlo",
            "circuit-tab", "#schematic");

    private WorkbenchView view;

    @Start
    void start(Stage stage) {
        view = new WorkbenchView(new WorkbenchModel(new SynchronousAnalysisExecutor(), new SynchronousAnalysisExecutor(),
                SampleDesigns.instrumentBoost(), Optional.empty()));
        stage.setScene(HalfrailApp.scene(view));
        stage.show();
    }

    private Tab tab(String id) {
        return view.bottomTabs().getTabs().stream().filter(t -> id.equals(t.getId())).findFirst().orElseThrow();
    }

    @Test
    void theWindowOpensWithOnlyTheReadingsBuiltAndNoHiddenStudyRun(FxRobot robot) {
        assertNotNull(view.model().reportProperty().get(), "the sample is analysed and shown");
        assertEquals("Readings", view.bottomTabs().getSelectionModel().getSelectedItem().getText());
        assertNotNull(view.bottomTabs().getTabs().get(0).getContent(), "the readings are built with the window");
        for (Map.Entry<String, String> e : CONTENT.entrySet()) {
            assertFalse(view.tabBuilt(e.getKey()), e.getKey() + " is not built before it is shown");
            assertNull(tab(e.getKey()).getContent(), e.getKey() + " holds nothing yet");
            assertTrue(robot.lookup(e.getValue()).tryQuery().isEmpty(), e.getValue() + " is not in the window yet");
        }
        assertTrue(robot.lookup(".chart").queryAll().isEmpty(), "no chart is made before its tab is shown");
        assertTrue(view.model().headroom().curves().isEmpty(), "the supply sweep waits for its plot");
        assertNull(view.model().tradeoff().resultProperty().get(), "the trade-off study waits for its plot");
    }

    @Test
    void eachHiddenTabIsBuiltWhenFirstSelectedAndOnlyThatOne(FxRobot robot) {
        List<String> order = List.of("headroom-tab", "power-on-tab", "response-tab", "tradeoff-tab", "monte-carlo-tab", "circuit-tab");
        for (int i = 0; i < order.size(); i++) {
            String id = order.get(i);
            robot.interact(() -> view.bottomTabs().getSelectionModel().select(tab(id)));
            WaitForAsyncUtils.waitForFxEvents();
            assertTrue(view.tabBuilt(id), id + " is built once selected");
            Node shown = robot.lookup(CONTENT.get(id)).query();
            assertNotNull(shown, CONTENT.get(id) + " is in the window");
            assertTrue(shown.isVisible() && shown.getScene() != null, CONTENT.get(id) + " is shown");
            for (String later : order.subList(i + 1, order.size())) {
                assertFalse(view.tabBuilt(later), later + " is still not built while " + id + " is shown");
            }
        }
        assertFalse(view.model().headroom().curves().isEmpty(), "the supply sweep ran once its plot was shown");
        assertNotNull(view.model().tradeoff().resultProperty().get(), "the trade-off study ran once its plot was shown");
    }

    @Test
    void askingForAPlotBuildsItOnceAndKeepsIt(FxRobot robot) {
        assertFalse(view.tabBuilt("power-on-tab"));
        PowerOnChart[] got = new PowerOnChart[1];
        robot.interact(() -> got[0] = view.powerOnChart());
        PowerOnChart first = got[0];
        assertTrue(view.tabBuilt("power-on-tab"), "an export asking for the plot builds it");
        assertEquals(first, tab("power-on-tab").getContent(), "in its tab");
        robot.interact(() -> got[0] = view.powerOnChart());
        assertEquals(first, got[0], "and only once");
        assertFalse(first.getData().isEmpty(), "with the power-on trace already computed by the analysis");
    }
}
