package halfrail.io.report;

/**
 * Places text labels beside a vertical scale: each label as near its wanted height as it can be
 * while keeping a minimum gap from its neighbours and staying inside the drawing. Plain geometry.
 */
public final class LabelStack {
    /** Passes of the push-apart sweep; each pass moves labels only towards room, so a few suffice. */
    public static final int MAX_PASSES = 50;

    private LabelStack() {}

    /**
     * Spread labels apart.
     *
     * @param wantedPx wanted pixel heights (y grows downward), in any order
     * @param gapPx    smallest distance between two label centres, px
     * @param topPx    smallest allowed y
     * @param bottomPx largest allowed y
     * @return placed heights, in the order of {@code wantedPx}; labels keep their vertical order
     */
    public static double[] spread(double[] wantedPx, double gapPx, double topPx, double bottomPx) {
        int n = wantedPx.length;
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        java.util.Arrays.sort(order, (a, b) -> Double.compare(wantedPx[a], wantedPx[b]));
        double[] y = new double[n];
        for (int k = 0; k < n; k++) {
            y[k] = Math.min(bottomPx, Math.max(topPx, wantedPx[order[k]]));
        }
        for (int pass = 0; pass < MAX_PASSES; pass++) {
            boolean moved = false;
            for (int k = 1; k < n; k++) {
                if (y[k] - y[k - 1] < gapPx - 1e-9) {
                    double mid = (y[k] + y[k - 1]) / 2;
                    y[k - 1] = mid - gapPx / 2;
                    y[k] = mid + gapPx / 2;
                    moved = true;
                }
            }
            if (n > 0 && y[0] < topPx) {
                double shift = topPx - y[0];
                for (int k = 0; k < n; k++) {
                    y[k] += shift;
                }
            }
            if (n > 0 && y[n - 1] > bottomPx) {
                double shift = y[n - 1] - bottomPx;
                for (int k = 0; k < n; k++) {
                    y[k] -= shift;
                }
            }
            if (!moved) {
                break;
            }
        }
        for (int k = 1; k < n; k++) {
            y[k] = Math.max(y[k], y[k - 1] + gapPx);
        }
        double[] out = new double[n];
        for (int k = 0; k < n; k++) {
            out[order[k]] = y[k];
        }
        return out;
    }
}
