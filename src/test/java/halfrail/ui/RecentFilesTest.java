package halfrail.ui;

import org.junit.jupiter.api.Test;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** The recent-files list: newest first, no repeats, bounded (the usual editor behaviour — common practice). */
class RecentFilesTest {
    @Test
    void theNewestFileComesFirstAndAReopenedFileMovesToTheFront() {
        List<List<String>> stored = new ArrayList<>();
        RecentFiles r = new RecentFiles(List.of(), stored::add);
        r.add(Path.of("/d/a.json"));
        r.add(Path.of("/d/b.json"));
        r.add(Path.of("/d/a.json"));
        assertEquals(List.of(Path.of("/d/a.json"), Path.of("/d/b.json")), r.files());
        assertEquals(List.of("/d/a.json", "/d/b.json"), stored.get(stored.size() - 1));
    }

    @Test
    void atMostTheLimitIsRememberedAndTheOldestGoesFirst() {
        RecentFiles r = new RecentFiles(List.of(), l -> { });
        for (int i = 0; i < RecentFiles.LIMIT + 3; i++) {
            r.add(Path.of("/d/f" + i + ".json"));
        }
        assertEquals(RecentFiles.LIMIT, r.files().size());
        assertEquals(Path.of("/d/f" + (RecentFiles.LIMIT + 2) + ".json"), r.files().get(0));
    }

    @Test
    void aStoredListIsReadBackSkippingBlanksAndRepeats() {
        RecentFiles r = new RecentFiles(List.of("/d/a.json", "", "/d/a.json", "/d/b.json"), l -> { });
        assertEquals(List.of(Path.of("/d/a.json"), Path.of("/d/b.json")), r.files());
    }

    @Test
    void twoWindowsSharingOneStoreKeepEachOthersAdditions() {
        List<String> shared = new ArrayList<>(List.of("/d/old.json"));
        java.util.function.Consumer<List<String>> write = l -> {
            shared.clear();
            shared.addAll(l);
        };
        RecentFiles a = new RecentFiles(() -> List.copyOf(shared), write);
        RecentFiles b = new RecentFiles(() -> List.copyOf(shared), write);
        a.add(Path.of("/d/a.json"));
        b.add(Path.of("/d/b.json"));
        assertEquals(List.of("/d/b.json", "/d/a.json", "/d/old.json"), shared, "b's write kept a's addition");
        a.add(Path.of("/d/c.json"));
        assertEquals(List.of("/d/c.json", "/d/b.json", "/d/a.json", "/d/old.json"), shared);
        assertEquals(List.of(Path.of("/d/c.json"), Path.of("/d/b.json"), Path.of("/d/a.json"), Path.of("/d/old.json")),
                a.files());
    }
}
