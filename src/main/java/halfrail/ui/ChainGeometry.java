package halfrail.ui;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Where the blocks of the chain drawing go: the source, each stage and the load in a row joined
 * by signal arrows, and the mid-rail reference in a lane below feeding every stage. Plain
 * arithmetic, unit-tested without a toolkit; {@link ChainCanvas} only paints it.
 */
public final class ChainGeometry {
    /** Margin around the drawing, px. */
    public static final double MARGIN = 8;
    /** Gap between neighbouring blocks (room for an arrow), px. */
    public static final double GAP = 26;
    /** Narrowest a block may become, px. */
    public static final double MIN_BLOCK_WIDTH = 96;
    /** Widest a block may become, px. */
    public static final double MAX_BLOCK_WIDTH = 190;
    /** Share of the height given to the signal row; the rest is the reference lane. */
    static final double ROW_SHARE = 0.64;

    /** One block as placed. */
    public record Placed(ChainPanelModel.Block block, double x, double y, double width, double height) {
        public boolean contains(double px, double py) {
            return px >= x && px <= x + width && py >= y && py <= y + height;
        }

        public double centreX() {
            return x + width / 2;
        }
    }

    private final List<Placed> row = new ArrayList<>();
    private Placed reference;
    private final double width;
    private final double height;

    /**
     * Lay out {@code blocks}: every block but the reference goes in the row, in order; the
     * reference (if any) goes in the lane below, under the stages.
     */
    public ChainGeometry(List<ChainPanelModel.Block> blocks, double width, double height) {
        this.width = width;
        this.height = height;
        List<ChainPanelModel.Block> inRow = blocks.stream()
                .filter(b -> b.kind() != ChainPanelModel.Kind.REFERENCE).toList();
        Optional<ChainPanelModel.Block> ref = blocks.stream()
                .filter(b -> b.kind() == ChainPanelModel.Kind.REFERENCE).findFirst();
        int n = inRow.size();
        double rowHeight = (height - 2 * MARGIN) * (ref.isPresent() ? ROW_SHARE : 1);
        double blockWidth = n == 0 ? 0 : (width - 2 * MARGIN - (n - 1) * GAP) / n;
        blockWidth = Math.max(MIN_BLOCK_WIDTH, Math.min(MAX_BLOCK_WIDTH, blockWidth));
        double x = MARGIN;
        for (ChainPanelModel.Block b : inRow) {
            row.add(new Placed(b, x, MARGIN, blockWidth, rowHeight));
            x += blockWidth + GAP;
        }
        if (ref.isPresent()) {
            // the lane runs under the whole row, so that its text has room; it feeds the stages only
            double left = MARGIN;
            double right = row.isEmpty() ? MARGIN + blockWidth : row.get(row.size() - 1).x() + row.get(row.size() - 1).width();
            double laneTop = MARGIN + rowHeight + GAP * 0.6;
            reference = new Placed(ref.get(), left, laneTop, right - left, Math.max(0, height - MARGIN - laneTop));
        }
    }

    /** The blocks of the signal row, source first. */
    public List<Placed> row() {
        return List.copyOf(row);
    }

    /** The stage blocks of the row. */
    public List<Placed> stages() {
        return row.stream().filter(p -> p.block().kind() == ChainPanelModel.Kind.STAGE).toList();
    }

    /** The reference block in its lane, if the design shows one. */
    public Optional<Placed> reference() {
        return Optional.ofNullable(reference);
    }

    /** Total width the row needs, px (the drawing scrolls beyond its box). */
    public double neededWidth() {
        return row.isEmpty() ? 0 : row.get(row.size() - 1).x() + row.get(row.size() - 1).width() + MARGIN;
    }

    public double width() {
        return width;
    }

    public double height() {
        return height;
    }

    /** The block under the point, if any. */
    public Optional<Placed> hit(double x, double y) {
        for (Placed p : row) {
            if (p.contains(x, y)) {
                return Optional.of(p);
            }
        }
        return reference().filter(r -> r.contains(x, y));
    }
}
