package halfrail.ui;

import halfrail.design.Design;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * Keeps unsaved work safe from a crash or a kill: a recovery file in the user's cache folder,
 * written every {@link #AUTOSAVE_SECONDS} s while the design has unsaved edits, removed when the
 * design is saved or the app closes normally. A recovery file found at start therefore means the
 * last session ended without closing; the app offers to restore it. Plain class (no toolkit): the
 * writing happens in the caller's thread, which for the app is the analysis worker.
 */
public final class RecoveryStore {
    /** Seconds between two autosaves of unsaved work. */
    public static final int AUTOSAVE_SECONDS = 5;
    /** The recovery file's name without its extension. */
    public static final String FILE_STEM = "unsaved-design";

    private final Path folder;
    private final DesignFileActions files;
    private final int slot;
    private Design lastWritten;

    /**
     * The recovery store of the first app running (slot 0 of {@link InstanceLock}).
     *
     * @param folder where the recovery file lives (made when first needed)
     * @param files  how designs are written and read (the app's design files)
     */
    public RecoveryStore(Path folder, DesignFileActions files) {
        this(folder, files, 0);
    }

    /**
     * The recovery store of the app holding {@link InstanceLock} slot {@code slot}: slot 0 uses
     * {@code unsaved-design.json}, slot k {@code unsaved-design-k.json}, so that two apps running
     * side by side never write the same file.
     */
    public RecoveryStore(Path folder, DesignFileActions files, int slot) {
        this.folder = Objects.requireNonNull(folder, "folder");
        this.files = Objects.requireNonNull(files, "files");
        if (slot < 0) {
            throw new IllegalArgumentException("slot " + slot);
        }
        this.slot = slot;
    }

    /**
     * The user's cache folder for Halfrail: {@code $XDG_CACHE_HOME/halfrail}, else
     * {@code ~/.cache/halfrail} (XDG Base Directory Specification, "cache" directory).
     */
    public static Path defaultFolder(Map<String, String> env, String userHome) {
        String xdg = env.get("XDG_CACHE_HOME");
        Path base = xdg != null && !xdg.isBlank() && Path.of(xdg).isAbsolute() ? Path.of(xdg) : Path.of(userHome, ".cache");
        return base.resolve("halfrail");
    }

    /** The recovery file. */
    public Path file() {
        return folder.resolve(FILE_STEM + (slot == 0 ? "" : "-" + slot) + "." + files.extension());
    }

    /**
     * Write {@code d} to the recovery file unless it is what was written last.
     *
     * @return whether it was written
     * @throws IOException when the folder or the file cannot be written
     */
    public synchronized boolean save(Design d) throws IOException {
        if (d.equals(lastWritten)) {
            return false;
        }
        Files.createDirectories(folder);
        files.write(d, file());
        lastWritten = d;
        return true;
    }

    /** Remove the recovery file (the work was saved, or the app closes normally). */
    public synchronized void clear() throws IOException {
        Files.deleteIfExists(file());
        Path backup = folder.resolve(file().getFileName() + halfrail.io.DesignFiles.BACKUP_SUFFIX);
        Files.deleteIfExists(backup);
        lastWritten = null;
    }

    /**
     * The design left by a session that did not close normally, if any.
     *
     * @throws IOException when a recovery file is there but cannot be read (it is left in place)
     */
    public Optional<Design> pending() throws IOException {
        Path f = file();
        if (!Files.isRegularFile(f)) {
            return Optional.empty();
        }
        return Optional.of(files.read(f));
    }
}
