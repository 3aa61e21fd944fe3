package halfrail.ui;

import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.function.Consumer;

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

    public RecentFiles(List<String> stored, Consumer<List<String>> store) {
        this.store = Objects.requireNonNull(store, "store");
        for (String s : stored) {
            if (files.size() < LIMIT && !s.isBlank()) {
                Path p = Path.of(s);
                if (!files.contains(p)) {
                    files.add(p);
                }
            }
        }
    }

    /** Remember {@code file} as the newest. */
    public void add(Path file) {
        Path p = file.toAbsolutePath().normalize();
        files.remove(p);
        files.add(0, p);
        while (files.size() > LIMIT) {
            files.remove(files.size() - 1);
        }
        List<String> out = new ArrayList<>();
        files.forEach(f -> out.add(f.toString()));
        store.accept(out);
    }

    public ObservableList<Path> files() {
        return filesView;
    }
}
