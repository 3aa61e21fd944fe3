package halfrail.ui;

import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.function.Consumer;
import java.util.function.Supplier;

/**
 * The design files opened or saved lately, newest first, at most {@link #LIMIT}. Where they are
 * kept between runs is the caller's business: it passes the stored list in and a sink that
 * stores a changed list.
 */
public final class RecentFiles {
    /** The most files remembered. */
    public static final int LIMIT = 8;

    private final ObservableList<Path> files = FXCollections.observableArrayList();
    /** Read-only view kept as a field: list listeners hold it only weakly. */
    private final ObservableList<Path> filesView = FXCollections.unmodifiableObservableList(files);
    private final Consumer<List<String>> store;
    /** Reads the stored list again before each change; null when this list is the only writer. */
    private final Supplier<List<String>> reload;

    public RecentFiles(List<String> stored, Consumer<List<String>> store) {
        this.store = Objects.requireNonNull(store, "store");
        this.reload = null;
        merge(null, stored);
    }

    /**
     * A list whose store other app windows may write too: {@code stored} is read now and again
     * before every change, and the change is merged into what it holds (the new file first, then
     * the stored ones, then this window's own), so that two windows do not undo each other's
     * additions.
     */
    public RecentFiles(Supplier<List<String>> stored, Consumer<List<String>> store) {
        this.store = Objects.requireNonNull(store, "store");
        this.reload = Objects.requireNonNull(stored, "stored");
        merge(null, stored.get());
    }

    /** Remember {@code file} as the newest. */
    public void add(Path file) {
        Path p = file.toAbsolutePath().normalize();
        merge(p, reload == null ? List.of() : reload.get());
        List<String> out = new ArrayList<>();
        files.forEach(f -> out.add(f.toString()));
        store.accept(out);
    }

    /** The list becomes: {@code newest} (if any), then {@code stored}, then what it held; no repeats, at most LIMIT. */
    private void merge(Path newest, List<String> stored) {
        List<Path> next = new ArrayList<>();
        if (newest != null) {
            next.add(newest);
        }
        for (String s : stored) {
            if (s != null && !s.isBlank()) {
                Path q = Path.of(s);
                if (!next.contains(q)) {
                    next.add(q);
                }
            }
        }
        for (Path q : files) {
            if (!next.contains(q)) {
                next.add(q);
            }
        }
        files.setAll(next.subList(0, Math.min(LIMIT, next.size())));
    }

    public ObservableList<Path> files() {
        return filesView;
    }
}
