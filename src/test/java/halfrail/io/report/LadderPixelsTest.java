package halfrail.io.report;

import halfrail.check.Ladder;
import org.junit.jupiter.api.Test;

import java.awt.Color;
import java.awt.image.BufferedImage;
import java.util.List;
import java.util.OptionalDouble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The ladder picture paints each level on the pixel row {@link LadderGeometry} gives it. Rows are
 * checked against the hand-worked linear map of {@link LadderGeometryTest} (common practice).
 */
class LadderPixelsTest {
    /** A 10 V rail: output 0.2–8.5 V, rest 5 V, ±1.5 V of signal; invented values. */
    static final Ladder LADDER = new Ladder("pre", "stages[0]", 10, 7, 0.2, 8.5, 5.5, 0, 8, 5, 5, 3.5, 6.5,
            OptionalDouble.empty(), OptionalDouble.empty(), 0);

    static final double TOP = ReportPictures.LADDER_TOP_PX;
    static final double BOTTOM = ReportPictures.LADDER_HEIGHT_PX - ReportPictures.LADDER_BOTTOM_PX;

    /** Row of {@code v} volts by hand: the scale runs from 0 V at the bottom row to 10 V at the top row. */
    static int row(double v) {
        return (int) Math.round(BOTTOM - v * (BOTTOM - TOP) / 10);
    }

    /** A column of the output bar where the drawn sine is at its lowest (t = 0.5 of 1.5 periods), px. */
    static int quietColumn() {
        return ReportPictures.LADDER_AXIS_PX + 30 + 37;
    }

    @Test
    void theRestPointIsDrawnOnItsRow() {
        BufferedImage img = ReportPictures.ladders(List.of(LADDER), List.of());
        assertEquals(Palette.REST, new Color(img.getRGB(quietColumn(), row(5))), "rest point at 5 V");
        assertTrue(!Palette.REST.equals(new Color(img.getRGB(quietColumn(), row(5) - 6))), "and only there");
    }

    @Test
    void theOutputCannotReachBandIsHatchedAboveTheSwingTopAndWhiteBelowIt() {
        BufferedImage img = ReportPictures.ladders(List.of(LADDER), List.of());
        int x = quietColumn();
        for (int y = row(10) + 3; y <= row(8.5) - 3; y++) {
            Color c = new Color(img.getRGB(x, y));
            assertTrue(c.equals(Palette.FORBIDDEN) || near(c, Palette.HATCH) || between(c),
                    "hatched at row " + y + ": " + c);
        }
        for (int y = row(8.5) + 3; y <= row(6.5) - 3; y++) {
            if (Math.abs(y - row(7)) <= 2) {
                continue; // the end-point rail crosses the window at 7 V
            }
            assertEquals(Color.WHITE, new Color(img.getRGB(x, y)), "usable window at row " + y);
        }
        assertEquals(Color.WHITE, new Color(img.getRGB(x, row(1.5))), "usable window below the signal");
        int y7 = (int) Math.floor(BOTTOM - 7 * (BOTTOM - TOP) / 10);
        assertTrue(!new Color(img.getRGB(x, y7)).equals(Color.WHITE)
                || !new Color(img.getRGB(x, y7 + 1)).equals(Color.WHITE), "the end-point rail is drawn at 7 V");
        assertTrue(!new Color(img.getRGB(x, row(0.1))).equals(Color.WHITE), "hatched below the swing floor");
    }

    @Test
    void theRailsAreDrawnOnTheGroundAndSupplyRows() {
        BufferedImage img = ReportPictures.ladders(List.of(LADDER), List.of());
        assertEquals(Palette.INK, new Color(img.getRGB(quietColumn(), row(0))));
        assertEquals(Palette.INK, new Color(img.getRGB(quietColumn(), row(10))));
    }

    @Test
    void theSignalIsDrawnAtItsLowestExcursionInTheQuietColumn() {
        BufferedImage img = ReportPictures.ladders(List.of(LADDER), List.of());
        boolean found = false;
        for (int dy = -2; dy <= 2; dy++) {
            found |= near(new Color(img.getRGB(quietColumn(), row(3.5) + dy)), Palette.SIGNAL);
        }
        assertTrue(found, "signal trough near 3.5 V");
    }

    private static boolean near(Color a, Color b) {
        return Math.abs(a.getRed() - b.getRed()) + Math.abs(a.getGreen() - b.getGreen())
                + Math.abs(a.getBlue() - b.getBlue()) < 60;
    }

    /** Anti-aliased hatch: a blend of the hatch and band colours. */
    private static boolean between(Color c) {
        return c.getRed() >= Palette.HATCH.getRed() - 4 && c.getRed() <= Palette.FORBIDDEN.getRed() + 4
                && c.getBlue() >= Palette.HATCH.getBlue() - 4 && c.getBlue() <= Palette.FORBIDDEN.getBlue() + 4;
    }
}
