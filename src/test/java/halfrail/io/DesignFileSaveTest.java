package halfrail.io;

import halfrail.design.Design;
import halfrail.io.DesignFileException.Kind;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeFalse;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/** Saving is atomic and keeps a backup; reading and saving where the file system refuses give IO errors naming the path. */
class DesignFileSaveTest {
    @TempDir
    Path folder;

    private static Design boost() {
        return DesignFiles.read(DesignFileTexts.SAMPLES.resolve("instrument-boost-9v.json"));
    }

    private static Design recorder() {
        return DesignFiles.read(DesignFileTexts.SAMPLES.resolve("handheld-recorder-mic-preamp.json"));
    }

    private List<String> names() throws IOException {
        try (Stream<Path> s = Files.list(folder)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    @Test
    void aSavedDesignReadsBackEqualAndLeavesNoTemporaryFile() throws IOException {
        Path file = folder.resolve("boost.json");
        DesignFiles.save(boost(), file);
        assertEquals(boost(), DesignFiles.read(file));
        assertEquals(List.of("boost.json"), names(), "no backup of a file that did not exist, no temporary file");
        assertEquals(DesignFiles.write(boost()), Files.readString(file, StandardCharsets.UTF_8));
    }

    @Test
    void savingOverAFileKeepsThePreviousOneAsTheBackup() throws IOException {
        Path file = folder.resolve("design.json");
        DesignFiles.save(boost(), file);
        DesignFiles.save(recorder(), file);
        assertEquals(recorder(), DesignFiles.read(file));
        assertEquals(boost(), DesignFiles.read(DesignFiles.backupOf(file)));
        assertEquals(folder.resolve("design.json.bak"), DesignFiles.backupOf(file));
        assertEquals(List.of("design.json", "design.json.bak"), names());
    }

    @Test
    void aSaveThatFailsHalfwayLeavesThePreviousFileIntact() throws IOException {
        Path file = folder.resolve("design.json");
        DesignFiles.save(boost(), file);
        byte[] before = Files.readAllBytes(file);
        byte[] next = DesignFiles.write(recorder()).getBytes(StandardCharsets.UTF_8);
        int[] written = {0};
        AtomicWrite.ChannelWriter failsHalfway = (channel, bytes) -> {
            written[0] = channel.write(ByteBuffer.wrap(bytes, 0, bytes.length / 2));
            throw new IOException("simulated: the disk stopped after half the bytes");
        };
        DesignFileException e = assertThrows(DesignFileException.class,
                () -> AtomicFiles.replace(file, next, failsHalfway));
        assertEquals(Kind.IO, e.kind());
        assertTrue(e.getMessage().startsWith(file.toString()), e.getMessage());
        assertEquals(next.length / 2, written[0], "the failure came after half the bytes were out");
        assertArrayEquals(before, Files.readAllBytes(file), "the previous file is untouched");
        assertEquals(boost(), DesignFiles.read(file));
        assertEquals(List.of("design.json"), names(), "no half-written temporary file is left behind");
    }

    @Test
    void aSaveKilledByAnUncheckedErrorAlsoLeavesThePreviousFileIntact() throws IOException {
        Path file = folder.resolve("design.json");
        DesignFiles.save(boost(), file);
        byte[] before = Files.readAllBytes(file);
        AtomicWrite.ChannelWriter dies = (channel, bytes) -> {
            channel.write(ByteBuffer.wrap(bytes, 0, 10));
            throw new IllegalStateException("simulated crash");
        };
        assertThrows(DesignFileException.class, () -> AtomicFiles.replace(file, new byte[100], dies));
        assertArrayEquals(before, Files.readAllBytes(file));
        assertEquals(List.of("design.json"), names());
    }

    @Test
    void savingIntoAVanishedFolderNamesThePath() {
        Path file = folder.resolve("gone").resolve("design.json");
        DesignFileException e = assertThrows(DesignFileException.class, () -> DesignFiles.save(boost(), file));
        assertEquals(Kind.IO, e.kind());
        assertTrue(e.getMessage().startsWith(file.toString() + ": "), e.getMessage());
        assertTrue(e.getMessage().contains("does not exist"), e.getMessage());
    }

    @Test
    void savingBelowAFileThatIsNotAFolderNamesThePath() throws IOException {
        Path notFolder = Files.writeString(folder.resolve("plain.txt"), "x");
        Path file = notFolder.resolve("design.json");
        DesignFileException e = assertThrows(DesignFileException.class, () -> DesignFiles.save(boost(), file));
        assertEquals(Kind.IO, e.kind());
        assertTrue(e.getMessage().startsWith(file.toString()), e.getMessage());
        assertTrue(e.getMessage().endsWith("is not a folder"), e.getMessage());
    }

    @Test
    void savingOverAFolderIsRefused() throws IOException {
        Path file = Files.createDirectory(folder.resolve("design.json"));
        assertEquals(Kind.IO, assertThrows(DesignFileException.class, () -> DesignFiles.save(boost(), file)).kind());
    }

    @Test
    void savingIntoAReadOnlyFolderNamesThePathAndLeavesThePreviousFile() throws IOException {
        assumeTrue(Files.getFileStore(folder).supportsFileAttributeView("posix"), "needs POSIX permissions");
        Path file = folder.resolve("design.json");
        DesignFiles.save(boost(), file);
        Files.setPosixFilePermissions(folder, PosixFilePermissions.fromString("r-xr-xr-x"));
        try {
            assumeFalse(Files.isWritable(folder), "the administrator account may write anywhere");
            DesignFileException e = assertThrows(DesignFileException.class, () -> DesignFiles.save(recorder(), file));
            assertEquals(Kind.IO, e.kind());
            assertTrue(e.getMessage().startsWith(file.toString()), e.getMessage());
            assertEquals(boost(), DesignFiles.read(file));
        } finally {
            Files.setPosixFilePermissions(folder, PosixFilePermissions.fromString("rwxr-xr-x"));
        }
    }

    @Test
    void readingAMissingFileOrAFolderNamesThePath() throws IOException {
        Path missing = folder.resolve("gone").resolve("design.json");
        DesignFileException e = assertThrows(DesignFileException.class, () -> DesignFiles.read(missing));
        assertEquals(Kind.IO, e.kind());
        assertTrue(e.getMessage().startsWith(missing.toString() + ": "), e.getMessage());
        DesignFileException dir = assertThrows(DesignFileException.class, () -> DesignFiles.read(folder));
        assertEquals(Kind.IO, dir.kind());
    }

    @Test
    void aFileAboveTheLimitIsRefusedBeforeParsing() throws IOException {
        Path big = folder.resolve("big.json");
        Files.write(big, new byte[DesignFiles.MAX_FILE_BYTES + 1]);
        DesignFileException e = assertThrows(DesignFileException.class, () -> DesignFiles.read(big));
        assertEquals(Kind.TOO_LARGE, e.kind(), "zero bytes are not JSON: TOO_LARGE shows the size came first");
        Path limit = folder.resolve("limit.json");
        byte[] sample = DesignFileTexts.rich().getBytes(StandardCharsets.UTF_8);
        byte[] padded = new byte[DesignFiles.MAX_FILE_BYTES];
        java.util.Arrays.fill(padded, (byte) ' ');
        System.arraycopy(sample, 0, padded, 0, sample.length);
        Files.write(limit, padded);
        assertEquals(DesignFiles.read(DesignFileTexts.RICH_SAMPLE), DesignFiles.read(limit), "exactly at the limit is read");
    }

    @Test
    void aDamagedFileIsLeftUntouchedByReading() throws IOException {
        Path file = folder.resolve("damaged.json");
        byte[] damaged = DesignFileTexts.rich().substring(0, 300).getBytes(StandardCharsets.UTF_8);
        Files.write(file, damaged);
        assertEquals(Kind.SYNTAX, assertThrows(DesignFileException.class, () -> DesignFiles.read(file)).kind());
        assertArrayEquals(damaged, Files.readAllBytes(file));
        assertFalse(Files.exists(DesignFiles.backupOf(file)));
    }
}
