package halfrail.ui;

import javafx.scene.paint.Color;

/**
 * The colours the drawn views (ladders, chain drawing, key) paint with, one set per appearance.
 * Halfrail's own scheme: warm paper, slate ink, one indigo for the signal, vermilion for trouble.
 */
public record Palette(Color paper, Color ink, Color faint, Color window, Color forbidden, Color hatch, Color clip,
                      Color signal, Color leak, Color spread, Color commonMode, Color endPoint, Color mid,
                      Color spotlight, Color fail, Color warn, Color pass, Color block, Color litBlock) {

    /** The light appearance. */
    public static final Palette LIGHT = new Palette(Color.web("#fbfaf7"), Color.web("#2b2d31"), Color.web("#8a8f98"),
            Color.web("#e3f1ec"), Color.web("#e9e4dc"), Color.web("#b9ab98"), Color.web("#d7401f"),
            Color.web("#3b3f9e"), Color.web("#b8860b"), Color.web("#138a7e"), Color.web("#8a4f7d"),
            Color.web("#9c5a2c"), Color.web("#5f7486"), Color.web("#ffd84d", 0.55), Color.web("#c2331a"),
            Color.web("#c98a00"), Color.web("#2f8f5b"), Color.WHITE, Color.web("#fff3c4"));

    /** The dark appearance: the same meanings, lifted to read on a dark ground. */
    public static final Palette DARK = new Palette(Color.web("#1f2126"), Color.web("#e6e3dc"), Color.web("#8d939d"),
            Color.web("#24403a"), Color.web("#3a352f"), Color.web("#7d7062"), Color.web("#ff6a45"),
            Color.web("#9da3ff"), Color.web("#e0b341"), Color.web("#3cc7b6"), Color.web("#d08cc2"),
            Color.web("#e09a62"), Color.web("#9fb3c4"), Color.web("#ffd84d", 0.35), Color.web("#ff6a45"),
            Color.web("#e8b030"), Color.web("#5cc48a"), Color.web("#2a2d33"), Color.web("#4a4320"));

    /** The palette for a dark or light appearance. */
    public static Palette of(boolean dark) {
        return dark ? DARK : LIGHT;
    }
}
