package halfrail.ui;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The single-instance guard: slots of the state folder claimed with file locks, the first app on
 * slot 0 and a second one on slot 1 with a recovery file of its own; a slot is free again when its
 * holder closes or its process ends. Locks between processes are the operating system's advisory
 * file locks (FileChannel.tryLock, Java SE API documentation: held on behalf of the whole process).
 */
class InstanceLockTest {
    @TempDir
    Path dir;

    private final JsonDesignFiles files = new JsonDesignFiles();

    @Test
    void theFirstAppTakesSlotZeroASecondSlotOneAndAClosedSlotIsTakenAgain() throws IOException {
        try (InstanceLock first = InstanceLock.acquire(dir).orElseThrow();
             InstanceLock second = InstanceLock.acquire(dir).orElseThrow()) {
            assertEquals(0, first.slot());
            assertTrue(first.first());
            assertEquals(1, second.slot());
            assertFalse(second.first());
            first.close();
            assertFalse(first.held());
            try (InstanceLock third = InstanceLock.acquire(dir).orElseThrow()) {
                assertEquals(0, third.slot(), "the freed slot is taken again");
            }
            assertTrue(second.held());
        }
    }

    @Test
    void whenEverySlotIsHeldTheClaimIsRefused() throws IOException {
        List<InstanceLock> held = new ArrayList<>();
        try {
            for (int k = 0; k < InstanceLock.MAX_SLOTS; k++) {
                held.add(InstanceLock.acquire(dir).orElseThrow());
            }
            assertEquals(Optional.empty(), InstanceLock.acquire(dir));
        } finally {
            for (InstanceLock l : held) {
                l.close();
            }
        }
    }

    @Test
    void twoAppsSideBySideKeepTheirUnsavedWorkInDifferentFiles() throws IOException {
        try (InstanceLock a = InstanceLock.acquire(dir).orElseThrow();
             InstanceLock b = InstanceLock.acquire(dir).orElseThrow()) {
            RecoveryStore ra = new RecoveryStore(dir, files, a.slot());
            RecoveryStore rb = new RecoveryStore(dir, files, b.slot());
            assertNotEquals(ra.file(), rb.file());
            assertEquals(new RecoveryStore(dir, files).file(), ra.file(), "slot 0 keeps the usual file name");
            var da = SampleDesigns.instrumentBoost();
            var db = da.withStage(0, da.stages().get(0).withFeedbackOhms(47e3));
            ra.save(da);
            rb.save(db);
            assertEquals(Optional.of(da), ra.pending());
            assertEquals(Optional.of(db), rb.pending());
            rb.clear();
            assertEquals(Optional.of(da), ra.pending(), "closing the second app leaves the first one's work");
        }
    }

    @Test
    void aSlotHeldByAnotherProcessIsSkippedAndFreedWhenThatProcessEnds() throws Exception {
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        Process other = new ProcessBuilder(java, "-cp", System.getProperty("java.class.path"),
                InstanceLockHolder.class.getName(), dir.toString()).redirectErrorStream(true).start();
        try {
            BufferedReader out = new BufferedReader(new InputStreamReader(other.getInputStream(), StandardCharsets.UTF_8));
            assertEquals("slot 0", out.readLine(), "the other process claims slot 0");
            try (InstanceLock mine = InstanceLock.acquire(dir).orElseThrow()) {
                assertEquals(1, mine.slot(), "slot 0 is held by the other process");
            }
            other.getOutputStream().close(); // the holder ends when its input closes
            assertTrue(other.waitFor(30, TimeUnit.SECONDS));
            try (InstanceLock mine = InstanceLock.acquire(dir).orElseThrow()) {
                assertEquals(0, mine.slot(), "the operating system freed the ended process's lock");
            }
        } finally {
            other.destroyForcibly();
        }
    }
}
