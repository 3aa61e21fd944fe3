package halfrail.ui;

import javafx.application.Application;
import javafx.scene.Node;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.testfx.api.FxRobot;
import org.testfx.api.FxToolkit;
import org.testfx.util.WaitForAsyncUtils;

import java.util.Set;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The real application class, started as the launcher starts it, with its background executor. */
class AppStartTest {
    private Application app;

    @AfterEach
    void close() throws Exception {
        if (app != null) {
            FxToolkit.cleanupApplication(app);
        }
        FxToolkit.cleanupStages();
    }

    @Test
    void theAppOpensOnTheSampleAlreadyAnalysedAndShowsItsRestPoint() throws Exception {
        FxToolkit.registerPrimaryStage();
        app = FxToolkit.setupApplication(HalfrailApp.class);
        HalfrailApp halfrail = (HalfrailApp) app;
        WaitForAsyncUtils.waitFor(60, TimeUnit.SECONDS, () -> halfrail.model().reportProperty().get() != null);
        WaitForAsyncUtils.waitForFxEvents();
        assertNotNull(halfrail.model().reportProperty().get());
        FxRobot robot = new FxRobot();
        Set<Node> cells = robot.lookup("#readings .table-cell").queryAll();
        // 9 V block, equal divider: rest point at half the nominal rail, 4.5 V (voltage-divider rule)
        assertTrue(cells.stream().anyMatch(c -> c instanceof javafx.scene.control.Labeled l && "4.50 V".equals(l.getText())));
        assertTrue(robot.lookup("#status").queryLabeled().getText().startsWith("Analysed"));
    }
}
