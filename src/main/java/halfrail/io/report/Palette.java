package halfrail.io.report;

import halfrail.check.Severity;

import java.awt.Color;

/** Halfrail's own colours for pictures and documents, shared by every renderer. */
final class Palette {
    static final Color PAPER = new Color(0xFB, 0xFA, 0xF7);
    static final Color INK = new Color(0x22, 0x30, 0x3C);
    static final Color FAINT = new Color(0x8A, 0x96, 0xA3);
    static final Color GRID = new Color(0xE6, 0xE3, 0xDD);
    static final Color FORBIDDEN = new Color(0xDD, 0xD7, 0xCE);
    static final Color HATCH = new Color(0xB4, 0xAB, 0x9E);
    static final Color WINDOW = Color.WHITE;
    static final Color INPUT_RANGE = new Color(0x3C, 0x8D, 0x93);
    static final Color SIGNAL = new Color(0xE0, 0x8A, 0x1E);
    static final Color CLIPPED = new Color(0xC8, 0x32, 0x4B);
    static final Color REST = new Color(0x1F, 0x4E, 0x8C);
    static final Color MID = new Color(0x6B, 0x7A, 0x89);
    static final Color END_POINT = new Color(0x8E, 0x5B, 0xB5);
    static final Color LEAK = new Color(0x7A, 0x5C, 0x2E);
    static final Color BAND = new Color(0xEE, 0xF3, 0xE4);
    static final Color PASS = new Color(0x3C, 0x8D, 0x5A);
    /** Trace colours in drawing order. */
    static final Color[] TRACES = {
        new Color(0xE0, 0x8A, 0x1E), new Color(0x1F, 0x4E, 0x8C), new Color(0x8E, 0x5B, 0xB5),
        new Color(0x3C, 0x8D, 0x93), new Color(0x7A, 0x5C, 0x2E), new Color(0xC8, 0x32, 0x4B)};
    /** The load's trace: wide and pale, under the stages'. */
    static final Color LOAD = new Color(0x9F, 0xAC, 0xB8);

    private Palette() {}

    static Color of(Verdict v) {
        return switch (v) {
            case FAIL -> CLIPPED;
            case WARN -> SIGNAL;
            case PASS -> PASS;
        };
    }

    static Color of(Severity s) {
        return s == Severity.NOTE ? INPUT_RANGE : of(Verdict.of(s));
    }

    static String hex(Color c) {
        return String.format("#%02x%02x%02x", c.getRed(), c.getGreen(), c.getBlue());
    }

    static Color trace(int i) {
        return TRACES[i % TRACES.length];
    }
}
