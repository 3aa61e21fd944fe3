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
}
