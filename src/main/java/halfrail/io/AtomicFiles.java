package halfrail.io;

import java.io.IOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * Saves a design file atomically with a backup ({@link AtomicWrite}), reporting every failure as
 * a {@link DesignFileException} of kind IO that names the path.
 */
final class AtomicFiles {
    private AtomicFiles() {}

    /**
     * Replaces {@code target} with {@code bytes}, keeping the old file as {@link DesignFiles#backupOf}.
     *
     * @throws DesignFileException of kind IO naming the path on any failure; the target is then untouched
     */
    static void replace(Path target, byte[] bytes, AtomicWrite.ChannelWriter writer) {
        Path file = target.toAbsolutePath().normalize();
        String source = target.toString();
        Path folder = file.getParent();
        if (folder == null || !Files.isDirectory(folder)) {
            throw DesignFiles.io(source, "cannot save: " + folder
                    + (folder != null && Files.exists(folder) ? " is not a folder" : " does not exist"), null);
        }
        if (Files.isDirectory(file)) {
            throw DesignFiles.io(source, "cannot save: it is a folder", null);
        }
        try {
            AtomicWrite.replace(file, bytes, DesignFiles.backupOf(file), writer);
        } catch (AccessDeniedException e) {
            throw DesignFiles.io(source, "cannot save: not allowed to write in " + folder, e);
        } catch (NoSuchFileException e) {
            throw DesignFiles.io(source, "cannot save: the folder " + folder + " is gone", e);
        } catch (FileSystemException e) {
            throw DesignFiles.io(source, "cannot save: " + e.getMessage(), e);
        } catch (IOException | RuntimeException e) {
            throw DesignFiles.io(source, "cannot save: " + e, e);
        }
    }
}
