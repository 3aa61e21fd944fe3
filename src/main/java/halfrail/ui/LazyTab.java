package halfrail.ui;

import javafx.scene.Node;
import javafx.scene.control.Tab;

import java.util.Objects;
import java.util.function.Supplier;

/**
 * A tab whose content is made the first time the tab is selected (or the first time
 * {@link #content()} is asked for, by a menu that exports the content), not when the window is
 * built: a hidden tab then costs neither its construction nor its share of the styling and layout
 * before the first frame. Until then the tab holds nothing.
 *
 * @param <N> the content's type
 */
final class LazyTab<N extends Node> {
    private final Tab tab;
    private final Supplier<N> make;
    private N built;

    LazyTab(String text, String id, Supplier<N> make) {
        this.make = Objects.requireNonNull(make, "make");
        this.tab = new Tab(text);
        tab.setId(id);
        tab.selectedProperty().addListener((o, was, now) -> {
            if (now) {
                content();
            }
        });
    }

    /** The tab itself (empty until built). */
    Tab tab() {
        return tab;
    }

    /** The content, made now if it has not been yet. */
    N content() {
        if (built == null) {
            built = Objects.requireNonNull(make.get(), "content");
            tab.setContent(built);
        }
        return built;
    }

    /** Whether the content has been made. */
    boolean isBuilt() {
        return built != null;
    }
}
