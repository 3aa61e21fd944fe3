package halfrail.ui;

import javafx.scene.chart.NumberAxis;
import javafx.util.StringConverter;


/**
 * A logarithmic axis built on {@link NumberAxis}: the values plotted are base-10 logarithms, the
 * ticks fall on whole decades and are labelled with the value itself in engineering notation
 * (1, 10, 100, 1k… followed by the unit).
 */
final class DecadeAxis {
    private DecadeAxis() {}

    /** An axis for log10 values, labelled {@code label}, with ticks printed in {@code unit}. */
    static NumberAxis of(String label, String unit) {
        NumberAxis a = new NumberAxis();
        a.setLabel(label);
        a.setAutoRanging(false);
        a.setTickUnit(1);
        a.setMinorTickCount(0);
        a.setTickLabelFormatter(new StringConverter<>() {
            @Override
            public String toString(Number n) {
                return engineering(Math.pow(10, n.doubleValue()), unit);
            }

            @Override
            public Number fromString(String s) {
                return null;
            }
        });
        return a;
    }

    /** Fit the axis to whole decades around {@code lowLog}..{@code highLog} (log10 values). */
    static void fit(NumberAxis a, double lowLog, double highLog) {
        if (!(highLog >= lowLog) || !Double.isFinite(lowLog) || !Double.isFinite(highLog)) {
            a.setLowerBound(0);
            a.setUpperBound(1);
            return;
        }
        double lo = Math.floor(lowLog + 1e-9);
        double hi = Math.ceil(highLog - 1e-9);
        if (hi <= lo) {
            hi = lo + 1;
        }
        a.setLowerBound(lo);
        a.setUpperBound(hi);
    }

    /** {@code value} in engineering notation with an SI prefix: 4.7e-6 and "A" give "4.7 µA". */
    static String engineering(double value, String unit) {
        if (value == 0 || !Double.isFinite(value)) {
            return (Double.isFinite(value) ? "0" : "—") + (unit.isEmpty() ? "" : " " + unit);
        }
        String[] prefixes = {"p", "n", "µ", "m", "", "k", "M", "G"};
        int exp = (int) Math.floor(Math.log10(Math.abs(value)) / 3 + 1e-9);
        exp = Math.max(-4, Math.min(3, exp));
        double scaled = value / Math.pow(1000, exp);
        String num = new java.math.BigDecimal(scaled).round(new java.math.MathContext(3)).stripTrailingZeros().toPlainString();
        String p = prefixes[exp + 4];
        return num + (unit.isEmpty() && p.isEmpty() ? "" : " " + p + unit);
    }
}
