package halfrail.io;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.PosixFileAttributeView;
import java.nio.file.attribute.PosixFilePermission;
import java.util.Set;

/**
 * Replaces a file's content so that the file is at every moment either its old content or the
 * complete new one: write a temporary file in the same folder, force it to the disk, optionally
 * keep a backup of the old file (made the same way), then move the temporary file over the target
 * (an atomic rename where the file system offers one, else a replacing move). The folder itself is
 * forced afterwards where the platform allows, so the rename survives a power cut. On any failure
 * the temporary files are deleted and the target is untouched.
 *
 * <p>Neutral about errors: it throws the {@link IOException} (or unchecked exception) that
 * stopped it, and each caller turns that into its own exception type ({@link DesignFiles} into a
 * {@link DesignFileException}, the review documents into an {@link java.io.UncheckedIOException}).
 */
public final class AtomicWrite {
    /** Writes bytes to a channel; tests swap in one that fails part-way. */
    @FunctionalInterface
    public interface ChannelWriter {
        void write(FileChannel channel, byte[] bytes) throws IOException;
    }

    /** Writes every byte (a blocking file channel writes at least one byte per call or throws). */
    public static final ChannelWriter WHOLE = (channel, bytes) -> {
        ByteBuffer buffer = ByteBuffer.wrap(bytes);
        while (buffer.hasRemaining()) {
            channel.write(buffer);
        }
    };

    /** Permissions of a new file on a POSIX system: owner read-write, others read. */
    private static final Set<PosixFilePermission> NEW_FILE_PERMISSIONS = Set.of(PosixFilePermission.OWNER_READ,
            PosixFilePermission.OWNER_WRITE, PosixFilePermission.GROUP_READ, PosixFilePermission.OTHERS_READ);

    private AtomicWrite() {}

    /**
     * Replace {@code file} with {@code bytes}, written by {@code writer}. The new file gets the
     * old one's POSIX permissions, or owner read-write and others read when there was none.
     *
     * @param file   the target, whose folder must exist
     * @param backup where the old content is kept first when {@code file} is a regular file, or
     *               null for no backup
     * @throws IOException as the file system reported it; the target is then untouched
     */
    public static void replace(Path file, byte[] bytes, Path backup, ChannelWriter writer) throws IOException {
        Path folder = file.toAbsolutePath().getParent();
        Path temporary = null;
        Path backupTemporary = null;
        try {
            temporary = Files.createTempFile(folder, "." + file.getFileName() + ".", ".tmp");
            try (FileChannel channel = FileChannel.open(temporary, StandardOpenOption.WRITE,
                    StandardOpenOption.TRUNCATE_EXISTING)) {
                writer.write(channel, bytes);
                channel.force(true);
            }
            copyPermissions(file, temporary);
            if (backup != null && Files.isRegularFile(file)) {
                backupTemporary = Files.createTempFile(folder, "." + backup.getFileName() + ".", ".tmp");
                Files.copy(file, backupTemporary, StandardCopyOption.REPLACE_EXISTING);
                try (FileChannel channel = FileChannel.open(backupTemporary, StandardOpenOption.WRITE)) {
                    channel.force(true);
                }
                move(backupTemporary, backup);
                backupTemporary = null;
            }
            move(temporary, file);
            temporary = null;
            forceFolder(folder);
        } finally {
            deleteQuietly(temporary);
            deleteQuietly(backupTemporary);
        }
    }

    private static void move(Path from, Path to) throws IOException {
        try {
            Files.move(from, to, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(from, to, StandardCopyOption.REPLACE_EXISTING);
        }
    }

    /** A new file gets the old one's permissions, or owner read-write and others read; where there are any. */
    private static void copyPermissions(Path from, Path to) throws IOException {
        PosixFileAttributeView view = Files.getFileAttributeView(to, PosixFileAttributeView.class);
        if (view == null) {
            return;
        }
        Set<PosixFilePermission> permissions = Files.isRegularFile(from)
                ? Files.getPosixFilePermissions(from, LinkOption.NOFOLLOW_LINKS) : NEW_FILE_PERMISSIONS;
        view.setPermissions(permissions);
    }

    /** Forces the folder entry of the rename to the disk; not every platform can open a folder, which is fine. */
    private static void forceFolder(Path folder) {
        try (FileChannel channel = FileChannel.open(folder, StandardOpenOption.READ)) {
            channel.force(true);
        } catch (IOException | UnsupportedOperationException e) {
            // The rename is done; forcing the folder is an extra guarantee where available.
        }
    }

    private static void deleteQuietly(Path p) {
        if (p == null) {
            return;
        }
        try {
            Files.deleteIfExists(p);
        } catch (IOException e) {
            // Leaving a stray temporary file beats hiding the error that brought us here.
        }
    }
}
