package halfrail.ui;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.OverlappingFileLockException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.Objects;
import java.util.Optional;

/**
 * One running app's claim on a slot of the user's state folder, so that two app windows started
 * side by side never write the same recovery file. Slot k is the file {@code instance-k.lock},
 * held with an exclusive {@link FileChannel#tryLock()} for as long as the app runs; the operating
 * system drops the lock when the process ends, however it ends, so a crash leaves no stale claim.
 * The first app takes slot 0 and the usual recovery file; a second one, started while the first
 * runs, takes slot 1 and keeps its unsaved work in a recovery file of its own. Plain class (no
 * toolkit).
 *
 * <p>Lock files are never deleted (deleting a file another process is about to lock would let two
 * processes hold "the same" slot). Within one process a slot already held counts as taken.
 */
public final class InstanceLock implements AutoCloseable {
    /** Slots tried before giving up (that many app windows at once). */
    public static final int MAX_SLOTS = 16;
    /** Name of slot k's lock file: this prefix, k, {@link #SUFFIX}. */
    public static final String PREFIX = "instance-";
    public static final String SUFFIX = ".lock";

    private final int slot;
    private final FileChannel channel;
    private final FileLock lock;

    private InstanceLock(int slot, FileChannel channel, FileLock lock) {
        this.slot = slot;
        this.channel = channel;
        this.lock = lock;
    }

    /**
     * Claim the lowest free slot in {@code folder} (made when missing).
     *
     * @return the claim, or empty when all {@link #MAX_SLOTS} slots are held
     * @throws IOException when the folder or a lock file cannot be made or opened
     */
    public static Optional<InstanceLock> acquire(Path folder) throws IOException {
        Objects.requireNonNull(folder, "folder");
        Files.createDirectories(folder);
        for (int k = 0; k < MAX_SLOTS; k++) {
            FileChannel ch = FileChannel.open(folder.resolve(PREFIX + k + SUFFIX),
                    StandardOpenOption.CREATE, StandardOpenOption.WRITE);
            FileLock l;
            try {
                l = ch.tryLock();
            } catch (OverlappingFileLockException e) {
                l = null; // held by this process
            } catch (IOException e) {
                ch.close();
                throw e;
            }
            if (l != null) {
                return Optional.of(new InstanceLock(k, ch, l));
            }
            ch.close();
        }
        return Optional.empty();
    }

    /** The slot held: 0 for the first app running, 1 for a second one, and so on. */
    public int slot() {
        return slot;
    }

    /** Whether no other app held slot 0 when this one started (it then owns the usual recovery file). */
    public boolean first() {
        return slot == 0;
    }

    /** Whether the claim is still held. */
    public boolean held() {
        return lock.isValid();
    }

    /** Give the slot up (the app closes). */
    @Override
    public void close() throws IOException {
        try {
            if (lock.isValid()) {
                lock.release();
            }
        } finally {
            channel.close();
        }
    }
}
