package halfrail.ui;

import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Layout and hit-testing of the chain drawing, without any toolkit. */
class ChainGeometryTest {
    private static ChainPanelModel.Block block(ChainPanelModel.Kind kind, String path) {
        return new ChainPanelModel.Block(kind, path, path, List.of("a line"), Optional.empty());
    }

    private static List<ChainPanelModel.Block> twoStages() {
        return List.of(block(ChainPanelModel.Kind.SOURCE, "source"), block(ChainPanelModel.Kind.REFERENCE, "reference"),
                block(ChainPanelModel.Kind.STAGE, "stages[0]"), block(ChainPanelModel.Kind.STAGE, "stages[1]"),
                block(ChainPanelModel.Kind.LOAD, "load"));
    }

    @Test
    void theSignalRowRunsFromTheSourceToTheLoadInOrderWithoutOverlap() {
        ChainGeometry g = new ChainGeometry(twoStages(), 800, 120);
        List<ChainGeometry.Placed> row = g.row();
        assertEquals(List.of("source", "stages[0]", "stages[1]", "load"),
                row.stream().map(p -> p.block().path()).toList());
        for (int i = 1; i < row.size(); i++) {
            double gap = row.get(i).x() - (row.get(i - 1).x() + row.get(i - 1).width());
            assertEquals(ChainGeometry.GAP, gap, 1e-9);
        }
    }

    @Test
    void theReferenceLaneSitsBelowTheRow() {
        ChainGeometry g = new ChainGeometry(twoStages(), 800, 120);
        ChainGeometry.Placed ref = g.reference().orElseThrow();
        ChainGeometry.Placed first = g.row().get(0);
        assertTrue(ref.y() > first.y() + first.height());
        assertTrue(ref.y() + ref.height() <= 120 - ChainGeometry.MARGIN + 1e-9);
    }

    @Test
    void blocksKeepAReadableWidthOnANarrowCanvas() {
        ChainGeometry g = new ChainGeometry(twoStages(), 200, 120);
        assertTrue(g.row().stream().allMatch(p -> p.width() >= ChainGeometry.MIN_BLOCK_WIDTH));
        assertTrue(g.neededWidth() > 200, "the drawing then needs more room than it has");
    }

    @Test
    void pointingAtABlockFindsItsDesignPath() {
        ChainGeometry g = new ChainGeometry(twoStages(), 800, 120);
        ChainGeometry.Placed second = g.stages().get(1);
        assertEquals("stages[1]", g.hit(second.centreX(), second.y() + 5).orElseThrow().block().path());
        ChainGeometry.Placed ref = g.reference().orElseThrow();
        assertEquals("reference", g.hit(ref.x() + 3, ref.y() + ref.height() / 2).orElseThrow().block().path());
        assertTrue(g.hit(second.x() - ChainGeometry.GAP / 2, second.y() + 5).isEmpty(), "between blocks");
    }
}
