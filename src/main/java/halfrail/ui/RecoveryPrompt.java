package halfrail.ui;

import halfrail.design.Design;

import java.io.IOException;
import java.util.Objects;
import java.util.Optional;

/**
 * The question the app asks at start when the last session left unsaved work in its recovery
 * file, and what each answer does. Accepting opens the kept design as an unsaved design (the
 * recovery file stays until the work is saved or the app closes normally, so a second crash
 * loses nothing); declining removes the recovery file. Plain class (no toolkit): the app shows
 * {@link #header()} and {@link #message()} in a dialog and calls {@link #accept()} or
 * {@link #decline()}.
 */
public final class RecoveryPrompt {
    /** What the status line says after a restore. */
    public static final String RESTORED = "Restored the unsaved work of the last session";

    private final RecoveryStore store;
    private final WorkbenchModel model;
    private final Design design;

    private RecoveryPrompt(RecoveryStore store, WorkbenchModel model, Design design) {
        this.store = store;
        this.model = model;
        this.design = design;
    }

    /**
     * The prompt for {@code store}'s leftover, if there is one. A recovery file that cannot be read
     * is told to the user through {@code model} and left in place (no prompt).
     */
    public static Optional<RecoveryPrompt> atStart(RecoveryStore store, WorkbenchModel model) {
        Objects.requireNonNull(store, "store");
        Objects.requireNonNull(model, "model");
        Optional<Design> left;
        try {
            left = store.pending();
        } catch (IOException e) {
            model.tellUser("A recovery file was found but could not be read (" + e.getMessage() + "); it is left at "
                    + store.file());
            return Optional.empty();
        }
        return left.map(d -> new RecoveryPrompt(store, model, d));
    }

    /** The design the recovery file holds. */
    public Design design() {
        return design;
    }

    public String header() {
        return "Restore unsaved work?";
    }

    public String message() {
        return "Halfrail did not close normally last time. Unsaved work on \"" + design.name()
                + "\" was kept. Restore it as an unsaved design?";
    }

    /** Show the kept design, marked unsaved. */
    public void accept() {
        model.openUnsaved(design, RESTORED);
    }

    /** Forget the kept design: the recovery file is removed. */
    public void decline() {
        try {
            store.clear();
        } catch (IOException e) {
            model.tellUser("The recovery file could not be removed (" + e.getMessage() + "): " + store.file());
        }
    }
}
